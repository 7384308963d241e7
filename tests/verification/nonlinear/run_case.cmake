# One end-to-end run for ctest: `rotcap run CASE -o OUT --overwrite --threads 1 --quiet`, its exit
# code compared with EXPECT_EXIT, then nonlinear_run_check on the results folder.
# Variables (-D): ROTCAP, CHECK (the two executables), CASE, OUT, EXPECT_EXIT, CHECK_ARGS (the
# checker's options separated by '|', as ';' would split the add_test argument).
foreach(v ROTCAP CHECK CASE OUT EXPECT_EXIT)
  if(NOT DEFINED ${v})
    message(FATAL_ERROR "run_case.cmake: -D${v}=... missing")
  endif()
endforeach()
file(REMOVE_RECURSE ${OUT})
execute_process(COMMAND ${ROTCAP} run ${CASE} -o ${OUT} --overwrite --threads 1 --quiet
                RESULT_VARIABLE code OUTPUT_VARIABLE out ERROR_VARIABLE err)
message(STATUS "rotcap run ${CASE}: exit code ${code}\n${out}${err}")
if(NOT code EQUAL EXPECT_EXIT)
  message(FATAL_ERROR "rotcap run ${CASE}: exit code ${code}, expected ${EXPECT_EXIT}")
endif()
string(REPLACE "|" ";" args "${CHECK_ARGS}")
execute_process(COMMAND ${CHECK} ${OUT} ${CASE} ${args} RESULT_VARIABLE check_code)
if(NOT check_code EQUAL 0)
  message(FATAL_ERROR "nonlinear_run_check ${OUT}: failed (exit code ${check_code})")
endif()
