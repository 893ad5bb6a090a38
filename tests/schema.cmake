# The published JSON Schemas against the loader (tests/schema_test.py, with Debian's
# python3-jsonschema; /usr/bin/python3 first, so that a personal Python does not stand in).
find_program(SIFTER_PYTHON3 python3 PATHS /usr/bin NO_DEFAULT_PATH)
if(NOT SIFTER_PYTHON3)
  find_program(SIFTER_PYTHON3 python3 REQUIRED)
endif()
add_test(NAME schema_agrees_with_the_loader
         COMMAND ${SIFTER_PYTHON3} ${CMAKE_CURRENT_SOURCE_DIR}/schema_test.py ${PROJECT_SOURCE_DIR} $<TARGET_FILE:sifter>)

# The --xlsx workbook read back with Debian's python3-openpyxl (tests/xlsx_test.py).
add_test(NAME xlsx_workbook_reads_back_as_the_results
         COMMAND ${SIFTER_PYTHON3} ${CMAKE_CURRENT_SOURCE_DIR}/xlsx_test.py ${PROJECT_SOURCE_DIR} $<TARGET_FILE:sifter>)
