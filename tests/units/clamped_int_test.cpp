// clamped_int (units/clamped_int.hpp): a double clamped before it is cast, so that an
// input-derived count or index is never undefined behaviour (C++20 [conv.fpint]: a value
// outside the integer's range is UB to convert).
#include "units/clamped_int.hpp"

#include <catch2/catch.hpp>
#include <cstdint>
#include <limits>

TEST_CASE("clamped_int truncates inside its range and clamps outside it", "[units][hardening]") {
    // Inside: truncation toward zero, as static_cast does.
    CHECK(rv::clamped_int(3.7, 0, 10) == 3);
    CHECK(rv::clamped_int(-2.5, -5, 5) == -2);
    // Outside: the bound, for values far beyond int's range too.
    CHECK(rv::clamped_int(1e300, 0, 400) == 400);
    CHECK(rv::clamped_int(-1e300, -1, 400) == -1);
    CHECK(rv::clamped_int(std::numeric_limits<double>::infinity(), 1, 400) == 400);
    CHECK(rv::clamped_int(-std::numeric_limits<double>::infinity(), 1, 400) == 1);
    // NaN goes to the lower bound (every comparison with NaN is false).
    CHECK(rv::clamped_int(std::numeric_limits<double>::quiet_NaN(), 7, 400) == 7);
    // The full range of a 64-bit count.
    CHECK(rv::clamped_int(1e30, std::int64_t{0}, std::int64_t{1} << 62) == std::int64_t{1} << 62);
}
