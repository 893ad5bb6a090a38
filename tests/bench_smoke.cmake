# The register benchmark, at a tiny size and once, as a smoke test: it checks that the script,
# the generator, the numpy peer and sifter run together (no assertion on time).
if(SIFTER_PYTHON3)
  execute_process(COMMAND ${SIFTER_PYTHON3} -c "import numpy" RESULT_VARIABLE SIFTER_NO_NUMPY OUTPUT_QUIET ERROR_QUIET)
  if(SIFTER_NO_NUMPY EQUAL 0)
    add_test(NAME bench.register_vs_peer_smoke
             COMMAND ${SIFTER_PYTHON3} ${CMAKE_CURRENT_SOURCE_DIR}/bench/register_vs_peer.py --sifter $<TARGET_FILE:sifter>
                     --runs 1 --sizes 20 --mc-sifs 5 --mc-samples 50 --templated)
  else()
    message(STATUS "python3-numpy not found: the benchmark smoke test is skipped")
  endif()
endif()
