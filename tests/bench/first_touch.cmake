# The cost of fresh memory on the machine at hand (included from tests/bench/CMakeLists.txt).
add_executable(sifter_first_touch ${CMAKE_CURRENT_LIST_DIR}/first_touch.cpp)
sifter_set_warnings(sifter_first_touch)
