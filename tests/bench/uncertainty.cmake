# Monte Carlo throughput of the uncertainty engine (included from tests/bench/CMakeLists.txt).
find_package(benchmark REQUIRED)
add_executable(sifter_bench_uncertainty ${CMAKE_CURRENT_LIST_DIR}/uncertainty_bench.cpp)
target_link_libraries(sifter_bench_uncertainty PRIVATE sifter_core benchmark::benchmark)
sifter_set_warnings(sifter_bench_uncertainty)
