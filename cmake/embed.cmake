# Writes a C++ source that holds the text of INPUT as the char array SYMBOL (build-time data
# embedding: the library reads no data file at run time).
# Usage: cmake -DINPUT=file -DOUTPUT=out.cpp -DSYMBOL=name -P embed.cmake
file(READ "${INPUT}" content)
string(FIND "${content}" ")rxnheat_embed\"" clash)
if(NOT clash EQUAL -1)
  message(FATAL_ERROR "${INPUT} contains the raw-string delimiter")
endif()
get_filename_component(name "${INPUT}" NAME)
file(WRITE "${OUTPUT}.tmp"
  "// Generated at build time from data/.../${name} by cmake/embed.cmake. Do not edit.\n"
  "namespace rxnheat::detail {\n"
  "extern const char ${SYMBOL}[];\n"
  "const char ${SYMBOL}[] = R\"rxnheat_embed(${content})rxnheat_embed\";\n"
  "extern const unsigned long ${SYMBOL}_size;\n"
  "const unsigned long ${SYMBOL}_size = sizeof(${SYMBOL}) - 1;\n"
  "}\n")
file(RENAME "${OUTPUT}.tmp" "${OUTPUT}")
