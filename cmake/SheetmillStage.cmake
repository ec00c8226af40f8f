# sheetmill_stage(NAME DEPS ...): a static library sheetmill_NAME (alias sheetmill::NAME) built
# from src/NAME/*.cpp, with public headers under include/sheetmill/NAME. Its tests, when present,
# are tests/NAME/*.cpp, linked into test_NAME and registered with ctest under label NAME.
set(SHEETMILL_STAGES "" CACHE INTERNAL "")

function(sheetmill_stage name)
  cmake_parse_arguments(ARG "" "" "DEPS" ${ARGN})
  file(GLOB sources CONFIGURE_DEPENDS ${PROJECT_SOURCE_DIR}/src/${name}/*.cpp)
  if(NOT sources)
    # A stage with no sources yet still exists, so dependants link; it is an interface target.
    add_library(sheetmill_${name} INTERFACE)
    target_include_directories(sheetmill_${name} INTERFACE ${PROJECT_SOURCE_DIR}/include)
    target_link_libraries(sheetmill_${name} INTERFACE ${ARG_DEPS})
  else()
    add_library(sheetmill_${name} STATIC ${sources})
    target_include_directories(sheetmill_${name} PUBLIC ${PROJECT_SOURCE_DIR}/include
                                                 PRIVATE ${PROJECT_SOURCE_DIR}/src)
    target_link_libraries(sheetmill_${name} PUBLIC ${ARG_DEPS} PRIVATE sheetmill_build_flags)
    target_compile_definitions(sheetmill_${name} PRIVATE
      SHEETMILL_VERSION="${PROJECT_VERSION}")
  endif()
  add_library(sheetmill::${name} ALIAS sheetmill_${name})
  set(SHEETMILL_STAGES "${SHEETMILL_STAGES};${name}" CACHE INTERNAL "")
endfunction()

function(sheetmill_add_test_suites)
  find_package(Catch2 REQUIRED)
  include(Catch)
  add_library(sheetmill_catch_main OBJECT ${PROJECT_SOURCE_DIR}/tests/support/catch_main.cpp)
  target_link_libraries(sheetmill_catch_main PUBLIC Catch2::Catch2)
  file(GLOB support CONFIGURE_DEPENDS ${PROJECT_SOURCE_DIR}/tests/support/*.cpp)
  list(REMOVE_ITEM support ${PROJECT_SOURCE_DIR}/tests/support/catch_main.cpp)
  add_library(sheetmill_test_support STATIC ${support} ${PROJECT_SOURCE_DIR}/tests/support/test_env.hpp)
  target_include_directories(sheetmill_test_support PUBLIC ${PROJECT_SOURCE_DIR}/tests)
  target_link_libraries(sheetmill_test_support PUBLIC sheetmill::core Catch2::Catch2 PRIVATE sheetmill_build_flags)
  target_compile_definitions(sheetmill_test_support PUBLIC
    SHEETMILL_SOURCE_DIR="${PROJECT_SOURCE_DIR}"
    SHEETMILL_BINARY_DIR="${PROJECT_BINARY_DIR}"
    SHEETMILL_EXE="$<TARGET_FILE:sheetmill>")
  foreach(name ${SHEETMILL_STAGES})
    file(GLOB tests CONFIGURE_DEPENDS ${PROJECT_SOURCE_DIR}/tests/${name}/*.cpp)
    if(tests)
      add_executable(test_${name} ${tests})
      target_link_libraries(test_${name} PRIVATE sheetmill::${name} sheetmill_catch_main
                                                 sheetmill_test_support sheetmill_build_flags)
      # Tests that shell out to the CLI or to GDAL/poppler tools run one process at a time per
      # suite; the suites themselves run in parallel under ctest -j.
      catch_discover_tests(test_${name} TEST_PREFIX "${name}: " DISCOVERY_TIMEOUT 60
                           PROPERTIES LABELS ${name})
    endif()
  endforeach()
endfunction()
