# The shipped examples run as tests, so the README never shows a command that fails.
add_test(NAME example_unit40_meets_targets
         COMMAND sifter check ${PROJECT_SOURCE_DIR}/examples/unit40.json)
add_test(NAME example_unit50_falls_short
         COMMAND sifter check ${PROJECT_SOURCE_DIR}/examples/unit50_shortfall.json)
set_tests_properties(example_unit50_falls_short PROPERTIES WILL_FAIL TRUE)
