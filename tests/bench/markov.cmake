# Exact engine timings (included from tests/bench/CMakeLists.txt).
find_package(benchmark REQUIRED)
add_executable(sifter_bench_markov ${CMAKE_CURRENT_LIST_DIR}/markov_bench.cpp)
target_link_libraries(sifter_bench_markov PRIVATE sifter_core benchmark::benchmark)
sifter_set_warnings(sifter_bench_markov)
