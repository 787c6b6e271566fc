#include <catch2/catch.hpp>

#include "cairn/reactions_csv.hpp"
