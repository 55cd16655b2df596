# Writes a C++ file holding a bundled JSON file as a raw string (the SFG demo, the lens
# catalog), so the program works from any folder. INPUT, OUTPUT and FUNCTION are given.
file(READ "${INPUT}" content)
file(WRITE "${OUTPUT}" "// Generated from ${INPUT} by viewer/cli/embed_demo.cmake.\n"
  "#include \"cli/load.hpp\"\n"
  "const char* rv::cli::${FUNCTION}() {\n    return R\"rvjson(${content})rvjson\";\n}\n")
