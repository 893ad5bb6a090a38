# The shipped examples run as tests, so the README never shows a command that fails.
add_test(NAME example_unit40_meets_targets
         COMMAND sifter check ${PROJECT_SOURCE_DIR}/examples/unit40.json)
add_test(NAME example_unit50_falls_short
         COMMAND sifter check ${PROJECT_SOURCE_DIR}/examples/unit50_shortfall.json)
set_tests_properties(example_unit50_falls_short PROPERTIES WILL_FAIL TRUE)

# The what-if commands as the README shows them.
add_test(NAME example_unit40_interval
         COMMAND sifter interval ${PROJECT_SOURCE_DIR}/examples/unit40.json --sif SIF-401 --subsystem "outlet isolation")
add_test(NAME example_unit40_sweep
         COMMAND sifter sweep ${PROJECT_SOURCE_DIR}/examples/unit40.json --sif SIF-401 --subsystem "outlet isolation"
                 --vary proof_test_interval --from "3 mo" --to "2 yr" --steps 8)
add_test(NAME example_unit40_compare
         COMMAND sifter compare ${PROJECT_SOURCE_DIR}/examples/unit40.json --sif SIF-401 --subsystem "level sensing"
                 --votes 1oo1,1oo2,2oo3,2oo4)
add_test(NAME example_unit40_sensitivity
         COMMAND sifter sensitivity ${PROJECT_SOURCE_DIR}/examples/unit40.json --sif SIF-401)
add_test(NAME example_unit40_diff_worsens
         COMMAND sifter diff ${PROJECT_SOURCE_DIR}/examples/unit40.json ${PROJECT_SOURCE_DIR}/tests/data/unit40_rev_b.json)
set_tests_properties(example_unit40_diff_worsens PROPERTIES WILL_FAIL TRUE)
add_test(NAME example_unit40_report
         COMMAND sifter report ${PROJECT_SOURCE_DIR}/examples/unit40.json -o ${CMAKE_CURRENT_BINARY_DIR}/unit40.html)

# The example's report with its in-service records rendered in a real browser (headless
# chromium): a screenshot that shows a page and an A4 print of 8 to 30 pages, the tables of the
# summary and of the service section within their column. Skipped (77) only where chromium is
# absent outside CI.
add_test(NAME browser_renders_the_example_report
         COMMAND sh ${CMAKE_CURRENT_SOURCE_DIR}/browser_test.sh $<TARGET_FILE:sifter>
                 ${PROJECT_SOURCE_DIR}/examples/unit40.json ${CMAKE_CURRENT_BINARY_DIR}/browser 8 30 report
                 ${PROJECT_SOURCE_DIR}/examples/records/unit40.json)
set_tests_properties(browser_renders_the_example_report PROPERTIES LABELS browser SKIP_RETURN_CODE 77 TIMEOUT 300)

# The deliverables example: requirements, prior-use devices, data sources and document control.
add_test(NAME example_unit70_requirements_meets_targets
         COMMAND sifter check ${PROJECT_SOURCE_DIR}/examples/unit70_requirements.json)
add_test(NAME example_unit70_srs
         COMMAND sifter srs ${PROJECT_SOURCE_DIR}/examples/unit70_requirements.json
                 -o ${CMAKE_CURRENT_BINARY_DIR}/unit70-srs.html)
add_test(NAME example_unit70_srs_markdown_one_sif
         COMMAND sifter srs ${PROJECT_SOURCE_DIR}/examples/unit70_requirements.json --sif SIF-702
                 -o ${CMAKE_CURRENT_BINARY_DIR}/unit70-srs-702.md)
add_test(NAME example_unit70_report
         COMMAND sifter report ${PROJECT_SOURCE_DIR}/examples/unit70_requirements.json
                 -o ${CMAKE_CURRENT_BINARY_DIR}/unit70.html)
add_test(NAME browser_renders_the_example_srs
         COMMAND sh ${CMAKE_CURRENT_SOURCE_DIR}/browser_test.sh $<TARGET_FILE:sifter>
                 ${PROJECT_SOURCE_DIR}/examples/unit70_requirements.json ${CMAKE_CURRENT_BINARY_DIR}/browser-srs 2 12 srs)
set_tests_properties(browser_renders_the_example_srs PROPERTIES LABELS browser SKIP_RETURN_CODE 77 TIMEOUT 300)
add_test(NAME browser_renders_the_requirements_report
         COMMAND sh ${CMAKE_CURRENT_SOURCE_DIR}/browser_test.sh $<TARGET_FILE:sifter>
                 ${PROJECT_SOURCE_DIR}/examples/unit70_requirements.json ${CMAKE_CURRENT_BINARY_DIR}/browser-70 4 20)
set_tests_properties(browser_renders_the_requirements_report PROPERTIES LABELS browser SKIP_RETURN_CODE 77 TIMEOUT 300)

# In-service records of the example (invented): the failing solenoid model, the overdue test and
# the changed verdict of SIF-401 (exit 1: a SIF falls short with the service rates).
add_test(NAME example_unit40_service
         COMMAND sifter service ${PROJECT_SOURCE_DIR}/examples/unit40.json ${PROJECT_SOURCE_DIR}/examples/records/unit40.json
                 --as-of 2025-06-30)
set_tests_properties(example_unit40_service PROPERTIES WILL_FAIL TRUE)
add_test(NAME example_unit40_service_report
         COMMAND sifter report ${PROJECT_SOURCE_DIR}/examples/unit40.json -o ${CMAKE_CURRENT_BINARY_DIR}/unit40_service.html
                 --records ${PROJECT_SOURCE_DIR}/examples/records/unit40.json --as-of 2025-06-30)
find_program(SIFTER_PYTHON3 python3 PATHS /usr/bin NO_DEFAULT_PATH)  # as schema.cmake finds it
add_test(NAME service_icalendar_parses
         COMMAND ${SIFTER_PYTHON3} ${CMAKE_CURRENT_SOURCE_DIR}/service_ics_test.py $<TARGET_FILE:sifter>
                 ${PROJECT_SOURCE_DIR}/examples/unit40.json ${PROJECT_SOURCE_DIR}/examples/records/unit40.json
                 ${CMAKE_CURRENT_BINARY_DIR}/service_ics)

# The overpressure example: estimate (revision A) and vendor curve (revision B).
add_test(NAME example_unit70_estimate_check
         COMMAND sifter check ${PROJECT_SOURCE_DIR}/examples/unit70_booster_estimate.json)
add_test(NAME example_unit70_estimate_is_not_final
         COMMAND sifter check --final ${PROJECT_SOURCE_DIR}/examples/unit70_booster_estimate.json)
set_tests_properties(example_unit70_estimate_is_not_final PROPERTIES WILL_FAIL TRUE)
add_test(NAME example_unit70_vendor_curve_falls_short
         COMMAND sifter check ${PROJECT_SOURCE_DIR}/examples/unit70_booster.json)
set_tests_properties(example_unit70_vendor_curve_falls_short PROPERTIES WILL_FAIL TRUE)
add_test(NAME example_unit70_options
         COMMAND sifter options ${PROJECT_SOURCE_DIR}/examples/unit70_booster.json --scenario OP-M-702-by-P-701)
add_test(NAME example_unit70_diff_moves_the_skid
         COMMAND sifter diff ${PROJECT_SOURCE_DIR}/examples/unit70_booster_estimate.json
                 ${PROJECT_SOURCE_DIR}/examples/unit70_booster.json)
set_tests_properties(example_unit70_diff_moves_the_skid PROPERTIES
                     PASS_REGULAR_EXPRESSION "M-702 MOVED: none at 19.00 barg \\(preliminary\\) -> leak_possible at 22.11 barg")
add_test(NAME example_unit70_booster_report
         COMMAND sifter report ${PROJECT_SOURCE_DIR}/examples/unit70_booster.json -o ${CMAKE_CURRENT_BINARY_DIR}/unit70-booster.html)
set_tests_properties(example_unit70_booster_report PROPERTIES WILL_FAIL TRUE)
