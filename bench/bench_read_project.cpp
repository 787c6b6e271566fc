// bench_read_project — the time to read one project file (read_project only: YAML, checks,
// generated combinations), for measuring the input stage on big generated files
// (bench/gen_project.py). Peak memory: run it under /usr/bin/time -v.
//
//   build/bench_read_project big.yaml
#include <chrono>
#include <cstdio>
#include <exception>

#include "cairn/input/input.hpp"

int main(int argc, char** argv) {
  if (argc != 2) {
    std::fprintf(stderr, "usage: bench_read_project FILE\n");
    return 2;
  }
  const auto start = std::chrono::steady_clock::now();
  try {
    const cairn::Project project = cairn::read_project(argv[1]);
    const std::chrono::duration<double> took = std::chrono::steady_clock::now() - start;
    std::printf("%zu piles, %zu combinations read in %.3f s\n", project.piles.size(),
                project.combinations.size(), took.count());
  } catch (const std::exception& e) {
    std::fprintf(stderr, "%s\n", e.what());
    return 2;
  }
  return 0;
}
