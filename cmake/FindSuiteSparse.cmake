# FindSuiteSparse: Debian 12's libsuitesparse-dev (5.12) ships neither a CMake config nor a
# pkg-config file. This module finds CHOLMOD and UMFPACK with their ordering and config libraries
# and defines the imported targets SuiteSparse::CHOLMOD and SuiteSparse::UMFPACK.
find_path(SuiteSparse_INCLUDE_DIR cholmod.h PATH_SUFFIXES suitesparse)
foreach(lib cholmod umfpack amd camd colamd ccolamd suitesparseconfig)
  string(TOUPPER ${lib} LIB)
  find_library(SuiteSparse_${LIB}_LIBRARY NAMES ${lib})
  list(APPEND SuiteSparse_REQUIRED_VARS SuiteSparse_${LIB}_LIBRARY)
endforeach()
include(FindPackageHandleStandardArgs)
find_package_handle_standard_args(SuiteSparse REQUIRED_VARS SuiteSparse_INCLUDE_DIR ${SuiteSparse_REQUIRED_VARS})
if(SuiteSparse_FOUND AND NOT TARGET SuiteSparse::CHOLMOD)
  add_library(SuiteSparse::config UNKNOWN IMPORTED)
  set_target_properties(SuiteSparse::config PROPERTIES IMPORTED_LOCATION ${SuiteSparse_SUITESPARSECONFIG_LIBRARY}
    INTERFACE_INCLUDE_DIRECTORIES ${SuiteSparse_INCLUDE_DIR})
  foreach(lib amd camd colamd ccolamd)
    string(TOUPPER ${lib} LIB)
    add_library(SuiteSparse::${LIB} UNKNOWN IMPORTED)
    set_target_properties(SuiteSparse::${LIB} PROPERTIES IMPORTED_LOCATION ${SuiteSparse_${LIB}_LIBRARY}
      INTERFACE_LINK_LIBRARIES SuiteSparse::config)
  endforeach()
  add_library(SuiteSparse::CHOLMOD UNKNOWN IMPORTED)
  set_target_properties(SuiteSparse::CHOLMOD PROPERTIES IMPORTED_LOCATION ${SuiteSparse_CHOLMOD_LIBRARY}
    INTERFACE_LINK_LIBRARIES "SuiteSparse::AMD;SuiteSparse::CAMD;SuiteSparse::COLAMD;SuiteSparse::CCOLAMD;SuiteSparse::config")
  add_library(SuiteSparse::UMFPACK UNKNOWN IMPORTED)
  set_target_properties(SuiteSparse::UMFPACK PROPERTIES IMPORTED_LOCATION ${SuiteSparse_UMFPACK_LIBRARY}
    INTERFACE_LINK_LIBRARIES "SuiteSparse::CHOLMOD;SuiteSparse::AMD;SuiteSparse::config")
endif()
mark_as_advanced(SuiteSparse_INCLUDE_DIR ${SuiteSparse_REQUIRED_VARS})
