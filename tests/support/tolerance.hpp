#pragma once
// The one tolerance vocabulary of the test suite: absolute and relative closeness.
#include <catch2/catch.hpp>

namespace rv::test {

// |actual − expected| ≤ margin
inline Catch::Matchers::Floating::WithinAbsMatcher near(double expected, double margin) {
    return Catch::Matchers::WithinAbs(expected, margin);
}

// |actual − expected| ≤ relative · max(|actual|, |expected|)
inline Catch::Matchers::Floating::WithinRelMatcher near_rel(double expected, double relative) {
    return Catch::Matchers::WithinRel(expected, relative);
}

}  // namespace rv::test
