# Writes a C++ file holding the SFG demo layout as a raw string, so `report --demo` works
# from any folder.
file(READ "${INPUT}" content)
file(WRITE "${OUTPUT}" "// Generated from layouts/sfg-bbo.json by viewer/cli/embed_demo.cmake.\n"
  "#include \"cli/load.hpp\"\n"
  "const char* rv::cli::demo_layout_text() {\n    return R\"rvjson(${content})rvjson\";\n}\n")
