# Installs the built project into WORK_DIR/prefix, builds tests/consumer against it, runs it;
# when PYTHON is given, also imports the installed Python module from PYTHON_DIR there.
file(REMOVE_RECURSE ${WORK_DIR})
execute_process(COMMAND ${CMAKE_COMMAND} --install ${BINARY_DIR} --prefix ${WORK_DIR}/prefix
                RESULT_VARIABLE status OUTPUT_QUIET)
if(status)
  message(FATAL_ERROR "install failed")
endif()
execute_process(COMMAND ${CMAKE_COMMAND} -S ${SOURCE_DIR}/tests/consumer -B ${WORK_DIR}/build
                        -DCMAKE_PREFIX_PATH=${WORK_DIR}/prefix RESULT_VARIABLE status)
if(status)
  message(FATAL_ERROR "configuring the consumer failed")
endif()
execute_process(COMMAND ${CMAKE_COMMAND} --build ${WORK_DIR}/build RESULT_VARIABLE status)
if(status)
  message(FATAL_ERROR "building the consumer failed")
endif()
execute_process(COMMAND ${WORK_DIR}/build/consumer RESULT_VARIABLE status)
if(status)
  message(FATAL_ERROR "the consumer gave the wrong entropy")
endif()
if(PYTHON)
  execute_process(COMMAND ${CMAKE_COMMAND} -E env PYTHONPATH=${WORK_DIR}/prefix/${PYTHON_DIR}
                          ${PYTHON} -c "import vibtherm; print(vibtherm.__file__, vibtherm.__version__)"
                  RESULT_VARIABLE status)
  if(status)
    message(FATAL_ERROR "the installed Python module does not import")
  endif()
endif()
