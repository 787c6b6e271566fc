// Hosts the Catch2 v2 test runner; the tests live in test_<module>.cpp.
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>
