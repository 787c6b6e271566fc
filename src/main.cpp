// cairn — pile group and load-distribution checker. The work is done in the library
// (cli.hpp: run_command_line); main only hands it the command line and the terminal.
#include <iostream>

#include "cairn/app/cli.hpp"

int main(int argc, char** argv) {
  return cairn::run_command_line(argc, argv, std::cout, std::cerr);
}
