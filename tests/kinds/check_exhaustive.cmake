# Exhaustive element kinds (issue 18 §2): compiles one translation unit (syntax only) with
# RV_TEST_EXTRA_ELEMENT_KIND, which appends a kind nothing handles (TestOnlyKind) to ElementKind
# and a model (TestOnlyLensModel) to Lens::model (core/layout/layout.hpp).
#   EXPECT=fail:    the compile must fail at a visit in FILE itself ("FILE:LINE:COL:   required
#                   from here") with errors naming each of NAMES ("|"-separated: the extra kind,
#                   the extra lens model or both).
#   EXPECT=compile: the compile must succeed (the control: the headers alone do not fail, so a
#                   failure above is the file's own visit).
# Arguments: CXX, FILE, EXPECT, NAMES, INCLUDES and DEFINES ("|"-separated).
string(REPLACE "|" ";" includes "${INCLUDES}")
string(REPLACE "|" ";" defines "${DEFINES}")
set(args -std=c++20 -fsyntax-only -DRV_TEST_EXTRA_ELEMENT_KIND)
foreach(dir IN LISTS includes)
  if(dir)
    list(APPEND args "-I${dir}")
  endif()
endforeach()
foreach(def IN LISTS defines)
  if(def)
    list(APPEND args "-D${def}")
  endif()
endforeach()
execute_process(COMMAND ${CXX} ${args} ${FILE} RESULT_VARIABLE status OUTPUT_VARIABLE out
                ERROR_VARIABLE out)
get_filename_component(name ${FILE} NAME)
if(EXPECT STREQUAL "compile")
  if(NOT status EQUAL 0)
    message(FATAL_ERROR "${name} should compile with the test-only kind (it handles no kinds):\n${out}")
  endif()
  message(STATUS "${name} compiles with the test-only kind, as it should")
  return()
endif()
if(status EQUAL 0)
  message(FATAL_ERROR "${name} compiled with a kind it does not handle (${NAMES}): a get_if "
                      "chain with a default is left, or its visit takes any kind")
endif()
string(REGEX MATCHALL "${name}:[0-9]+:[0-9]+:   required from here" sites "${out}")
list(REMOVE_DUPLICATES sites)
if(NOT sites)
  message(FATAL_ERROR "${name} failed to compile, but not at a visit of its own:\n${out}")
endif()
string(REPLACE "|" ";" names "${NAMES}")
foreach(extra IN LISTS names)
  if(NOT out MATCHES "${extra}")
    message(FATAL_ERROR "${name} failed to compile, but no error names ${extra}: it does not "
                        "handle it by a visit\n${out}")
  endif()
endforeach()
string(REPLACE ";" "\n  " listed "${sites}")
message(STATUS "${name} refuses ${names} at:\n  ${listed}")
