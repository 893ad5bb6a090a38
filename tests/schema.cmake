# The published JSON Schemas against the loader (tests/schema_test.py, with Debian's
# python3-jsonschema; /usr/bin/python3 first, so that a personal Python does not stand in).
find_program(SIFTER_PYTHON3 python3 PATHS /usr/bin NO_DEFAULT_PATH)
if(NOT SIFTER_PYTHON3)
  find_program(SIFTER_PYTHON3 python3 REQUIRED)
endif()
add_test(NAME schema_agrees_with_the_loader
         COMMAND ${SIFTER_PYTHON3} ${CMAKE_CURRENT_SOURCE_DIR}/schema_test.py ${PROJECT_SOURCE_DIR} $<TARGET_FILE:sifter>)

# `sifter init`: its files pass check and the schemas, and the README shows them word for word.
add_test(NAME init_writes_what_check_schema_and_readme_agree_on
         COMMAND ${SIFTER_PYTHON3} ${CMAKE_CURRENT_SOURCE_DIR}/init_test.py ${PROJECT_SOURCE_DIR} $<TARGET_FILE:sifter>)

# The --xlsx workbook read back with Debian's python3-openpyxl (tests/xlsx_test.py).
add_test(NAME xlsx_workbook_reads_back_as_the_results
         COMMAND ${SIFTER_PYTHON3} ${CMAKE_CURRENT_SOURCE_DIR}/xlsx_test.py ${PROJECT_SOURCE_DIR} $<TARGET_FILE:sifter>)

# The contributor guide's map matches the tree, results are a leaf, and each "Where to start"
# answer names the file where that change is made.
add_test(NAME guide_map_matches_the_tree
         COMMAND ${SIFTER_PYTHON3} ${CMAKE_CURRENT_SOURCE_DIR}/guide_test.py ${PROJECT_SOURCE_DIR})

# Printed in a real browser and read back page by page (tests/print_test.py, chromium and Debian's
# poppler-utils): a 40-SIF register in --compact mode fits 2 A4 pages per SIF (+ 4 pages of cover,
# summary and closing notes), and every printed page carries the document number and revision.
# Skipped (77) only where chromium or poppler-utils is absent outside CI.
add_test(NAME printed_register_fits_two_pages_per_sif_with_the_document_footer_on_every_page
         COMMAND ${SIFTER_PYTHON3} ${CMAKE_CURRENT_SOURCE_DIR}/print_test.py $<TARGET_FILE:sifter>
                 ${PROJECT_SOURCE_DIR} ${CMAKE_CURRENT_BINARY_DIR}/print)
set_tests_properties(printed_register_fits_two_pages_per_sif_with_the_document_footer_on_every_page
                     PROPERTIES LABELS browser SKIP_RETURN_CODE 77 TIMEOUT 600)
