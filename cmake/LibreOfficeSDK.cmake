# The LibreOffice SDK for the Calc add-ins (addin/ and the benchmark's tests/bench/noop_addin/):
# where its tools, headers, libraries and the office's type libraries are, and three functions
#   rxnheat_uno_types(...)      our IDL -> .rdb, plus the C++ headers of its types and the office's
#   rxnheat_uno_component(...)  a UNO component module (.uno.so) built against the SDK
#   rxnheat_oxt(...)            stage files and zip them into an .oxt package
# Including it stops the configuration with a message when any part of the SDK is missing: a
# folder that includes it builds an add-in, and an add-in that was asked for is never skipped.
include_guard(DIRECTORY)

set(LIBREOFFICE_PROGRAM_DIR /usr/lib/libreoffice/program CACHE PATH
    "LibreOffice program folder (types.rdb, types/offapi.rdb)")
set(LIBREOFFICE_SDK_DIR /usr/lib/libreoffice/sdk CACHE PATH "LibreOffice SDK folder")

find_program(RXNHEAT_UNOIDL_WRITE unoidl-write HINTS ${LIBREOFFICE_SDK_DIR}/bin)
find_program(RXNHEAT_CPPUMAKER cppumaker HINTS ${LIBREOFFICE_SDK_DIR}/bin)
find_path(RXNHEAT_LO_INCLUDE_DIR sal/types.h
          HINTS ${LIBREOFFICE_SDK_DIR}/include /usr/include/libreoffice)
find_library(RXNHEAT_UNO_CPPU uno_cppu HINTS ${LIBREOFFICE_SDK_DIR}/lib NO_DEFAULT_PATH)
find_library(RXNHEAT_UNO_CPPUHELPER uno_cppuhelpergcc3 HINTS ${LIBREOFFICE_SDK_DIR}/lib NO_DEFAULT_PATH)
find_library(RXNHEAT_UNO_SAL uno_sal HINTS ${LIBREOFFICE_SDK_DIR}/lib NO_DEFAULT_PATH)
find_program(RXNHEAT_ZIP zip)
set(RXNHEAT_LO_TYPES_RDB ${LIBREOFFICE_PROGRAM_DIR}/types.rdb)
set(RXNHEAT_LO_OFFAPI_RDB ${LIBREOFFICE_PROGRAM_DIR}/types/offapi.rdb)

# What is missing, in words (the variable names mean nothing to someone who just wants to build).
set(RXNHEAT_LO_MISSING)
foreach(pair "RXNHEAT_UNOIDL_WRITE:the unoidl-write tool"
             "RXNHEAT_CPPUMAKER:the cppumaker tool"
             "RXNHEAT_LO_INCLUDE_DIR:the SDK headers (sal/types.h)"
             "RXNHEAT_UNO_CPPU:the library uno_cppu"
             "RXNHEAT_UNO_CPPUHELPER:the library uno_cppuhelpergcc3"
             "RXNHEAT_UNO_SAL:the library uno_sal")
  string(REPLACE ":" ";" parts "${pair}")
  list(GET parts 0 v)
  list(GET parts 1 what)
  if(NOT ${v})
    list(APPEND RXNHEAT_LO_MISSING "${what}")
  endif()
endforeach()
foreach(f ${RXNHEAT_LO_TYPES_RDB} ${RXNHEAT_LO_OFFAPI_RDB})
  if(NOT EXISTS ${f})
    list(APPEND RXNHEAT_LO_MISSING "the office's type library ${f}")
  endif()
endforeach()
if(RXNHEAT_LO_MISSING)
  list(JOIN RXNHEAT_LO_MISSING ", " missing_text)
  message(FATAL_ERROR
    "The Calc add-in (option RXNHEAT_ADDIN, ON by default) needs the LibreOffice SDK and the "
    "office's type libraries, and these were not found: ${missing_text}.\n"
    "Install the Debian packages libreoffice-dev and libreoffice-calc-nogui "
    "(scripts/setup installs everything in scripts/packages.txt), or point "
    "LIBREOFFICE_SDK_DIR / LIBREOFFICE_PROGRAM_DIR at another LibreOffice, "
    "or configure with -DRXNHEAT_ADDIN=OFF to build without the add-in.")
endif()

# The platform name of an .oxt built here (description.xml, manifest.xml).
if(CMAKE_SYSTEM_PROCESSOR MATCHES "^(x86_64|amd64|AMD64)$")
  set(RXNHEAT_OXT_PLATFORM linux_x86_64)
elseif(CMAKE_SYSTEM_PROCESSOR MATCHES "^(aarch64|arm64)$")
  set(RXNHEAT_OXT_PLATFORM linux_aarch64)
else()
  set(RXNHEAT_OXT_PLATFORM linux_${CMAKE_SYSTEM_PROCESSOR})
endif()

# rxnheat_uno_types(TARGET <name> IDL <file.idl> RDB <out.rdb> TYPES <module.XInterface>...)
# Compiles the IDL into RDB (against the office's types) and generates C++ headers: those of the
# office's UNO types once per build tree (target rxnheat_lo_office_headers), those of TYPES in
# <binary dir>/uno-headers/own. The custom target <name> depends on both; the include folders
# for a component are left in <name>_INCLUDE_DIRS.
function(rxnheat_uno_types)
  cmake_parse_arguments(PARSE_ARGV 0 arg "" "TARGET;IDL;RDB" "TYPES")
  if(NOT TARGET rxnheat_lo_office_headers)
    set(office ${CMAKE_BINARY_DIR}/uno-office-headers)
    add_custom_command(OUTPUT ${office}/office.stamp
      COMMAND ${CMAKE_COMMAND} -E rm -rf ${office}/include
      COMMAND ${CMAKE_COMMAND} -E make_directory ${office}/include
      COMMAND ${RXNHEAT_CPPUMAKER} -O${office}/include ${RXNHEAT_LO_TYPES_RDB} ${RXNHEAT_LO_OFFAPI_RDB}
      COMMAND ${CMAKE_COMMAND} -E touch ${office}/office.stamp
      COMMENT "cppumaker: C++ headers of the office's UNO types")
    add_custom_target(rxnheat_lo_office_headers DEPENDS ${office}/office.stamp)
    set_property(GLOBAL PROPERTY RXNHEAT_LO_OFFICE_INCLUDE_DIR ${office}/include)
  endif()
  get_property(office_include GLOBAL PROPERTY RXNHEAT_LO_OFFICE_INCLUDE_DIR)

  get_filename_component(rdb_name ${arg_RDB} NAME)
  add_custom_command(OUTPUT ${arg_RDB}
    COMMAND ${RXNHEAT_UNOIDL_WRITE} ${RXNHEAT_LO_TYPES_RDB} ${RXNHEAT_LO_OFFAPI_RDB} ${arg_IDL} ${arg_RDB}
    DEPENDS ${arg_IDL}
    COMMENT "unoidl-write: ${rdb_name}")
  set(own ${CMAKE_CURRENT_BINARY_DIR}/uno-headers/own)
  set(headers)
  set(type_options)
  foreach(type ${arg_TYPES})
    string(REPLACE "." "/" header ${type})
    list(APPEND headers ${own}/${header}.hpp)
    list(APPEND type_options -T${type})
  endforeach()
  add_custom_command(OUTPUT ${headers}
    COMMAND ${CMAKE_COMMAND} -E rm -rf ${own}
    COMMAND ${CMAKE_COMMAND} -E make_directory ${own}
    COMMAND ${RXNHEAT_CPPUMAKER} -O${own} ${type_options} ${arg_RDB}
            -X${RXNHEAT_LO_TYPES_RDB} -X${RXNHEAT_LO_OFFAPI_RDB}
    DEPENDS ${arg_RDB}
    COMMENT "cppumaker: C++ headers of ${arg_TYPES}")
  add_custom_target(${arg_TARGET} DEPENDS ${headers})
  add_dependencies(${arg_TARGET} rxnheat_lo_office_headers)
  set(${arg_TARGET}_INCLUDE_DIRS ${RXNHEAT_LO_INCLUDE_DIR} ${office_include} ${own} PARENT_SCOPE)
endfunction()

# rxnheat_uno_component(<target> OUTPUT_NAME <name.uno> TYPES_TARGET <rxnheat_uno_types target>
#                       SOURCES <files>... [EXCLUDE_FROM_ALL])
# A MODULE library that UNO loads: the SDK's headers and libraries, no "lib" prefix, no
# undefined symbols. Further sources, libraries and definitions are the caller's to add.
function(rxnheat_uno_component target)
  cmake_parse_arguments(PARSE_ARGV 1 arg "EXCLUDE_FROM_ALL" "OUTPUT_NAME;TYPES_TARGET" "SOURCES")
  set(exclude)
  if(arg_EXCLUDE_FROM_ALL)
    set(exclude EXCLUDE_FROM_ALL)
  endif()
  add_library(${target} MODULE ${exclude} ${arg_SOURCES})
  add_dependencies(${target} ${arg_TYPES_TARGET})
  target_include_directories(${target} SYSTEM PRIVATE ${${arg_TYPES_TARGET}_INCLUDE_DIRS})
  target_compile_definitions(${target} PRIVATE LINUX UNX CPPU_ENV=gcc3)
  target_link_libraries(${target} PRIVATE
    ${RXNHEAT_UNO_CPPUHELPER} ${RXNHEAT_UNO_CPPU} ${RXNHEAT_UNO_SAL})
  set_target_properties(${target} PROPERTIES
    PREFIX "" OUTPUT_NAME ${arg_OUTPUT_NAME}
    LINK_FLAGS "-Wl,--no-undefined -Wl,-z,defs")
endfunction()

# rxnheat_oxt(OUTPUT <file.oxt> STAGE <folder> FILES <path in package> <source> ...
#             [STRIP <path in package>...] [DEPENDS <targets or files>...] [COMMENT <text>])
# Copies each source to its path in the package (sources may be generator expressions such as
# $<TARGET_FILE:tgt>), strips the debug information of the STRIP files, and zips the stage
# folder into OUTPUT (zip if found, else cmake's own zip writer).
function(rxnheat_oxt)
  cmake_parse_arguments(PARSE_ARGV 0 arg "" "OUTPUT;STAGE;COMMENT" "FILES;STRIP;DEPENDS")
  list(LENGTH arg_FILES n)
  math(EXPR odd "${n} % 2")
  if(n EQUAL 0 OR odd)
    message(FATAL_ERROR "rxnheat_oxt: FILES takes pairs of <path in package> <source>")
  endif()
  set(stage ${arg_STAGE})
  set(dirs ${stage})
  set(copies)
  set(entries)
  set(sources)
  math(EXPR last "${n} - 1")
  foreach(i RANGE 0 ${last} 2)
    math(EXPR j "${i} + 1")
    list(GET arg_FILES ${i} entry)
    list(GET arg_FILES ${j} source)
    get_filename_component(dir ${stage}/${entry} DIRECTORY)
    list(APPEND dirs ${dir})
    list(APPEND copies COMMAND ${CMAKE_COMMAND} -E copy ${source} ${stage}/${entry})
    list(APPEND entries ${entry})
    list(APPEND sources ${source})
  endforeach()
  list(REMOVE_DUPLICATES dirs)
  set(strip)
  if(arg_STRIP AND CMAKE_STRIP)
    set(strip COMMAND ${CMAKE_STRIP} --strip-debug)
    foreach(entry ${arg_STRIP})
      list(APPEND strip ${stage}/${entry})
    endforeach()
  endif()
  if(RXNHEAT_ZIP)
    set(zip COMMAND ${CMAKE_COMMAND} -E chdir ${stage} ${RXNHEAT_ZIP} -X -q ${arg_OUTPUT} ${entries})
  else()
    set(zip COMMAND ${CMAKE_COMMAND} -E chdir ${stage}
        ${CMAKE_COMMAND} -E tar cf ${arg_OUTPUT} --format=zip ${entries})
  endif()
  add_custom_command(OUTPUT ${arg_OUTPUT}
    COMMAND ${CMAKE_COMMAND} -E rm -rf ${stage} ${arg_OUTPUT}
    COMMAND ${CMAKE_COMMAND} -E make_directory ${dirs}
    ${copies}
    ${strip}
    ${zip}
    DEPENDS ${sources} ${arg_DEPENDS}
    COMMENT "${arg_COMMENT}")
endfunction()
