// The one rule for numbers in text (units/number_text.hpp): zeros, non-finite values, durations.
#include "units/number_text.hpp"

#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

TEST_CASE("a rounding residue or a denormal prints as zero", "[number_text]") {
    // Issue 14 item 7: the figures that showed 6.42653e-313 and -1.421e-13 where they meant 0.
    CHECK(rv::format_number("%.6g", 6.42653e-313) == "0");
    CHECK(rv::format_number("%+.4g", -1.421e-13) == "+0");
    CHECK(rv::format_number("%.6g", 1.3877787807814457e-17) == "0");
    // Above the floor a small value keeps its digits; the floor grows with the column's scale.
    CHECK(rv::format_number("%.6g", 2e-7) == "2e-07");
    CHECK(rv::format_number("%.6g", 2e-7, 1e3) == "0");
    CHECK(rv::format_number("%.6g", 2e-5, 1e3) == "2e-05");
    CHECK(rv::negligible_as_zero(-5e-10) == 0.0);
    CHECK_FALSE(std::signbit(rv::negligible_as_zero(-5e-10)));
}

TEST_CASE("a value that rounds to zero never shows a minus sign", "[number_text]") {
    CHECK(rv::format_number("%.3f", -1e-5) == "0.000");
    CHECK(rv::format_number("%+.3f", -1e-5) == "+0.000");
    CHECK(rv::format_number("%.1f", -0.04) == "0.0");
    CHECK(rv::format_number("waist %+.2f mm", -0.001) == "waist +0.00 mm");
    CHECK(rv::format_number("%.1f", -0.06) == "-0.1");
    CHECK(rv::format_number("%.3f", -0.0) == "0.000");
}

TEST_CASE("NaN and infinity print as n/a", "[number_text]") {
    CHECK(rv::format_number("%.6g", std::nan("")) == "n/a");
    CHECK(rv::format_number("%+.1f", -std::numeric_limits<double>::infinity()) == "n/a");
    CHECK(rv::format_number("delay %+.1f fs", std::nan("")) == "delay n/a fs");
    CHECK(rv::format_number("%.0f %%", 50) == "50 %");
    CHECK(rv::format_number("%.0f %% left", std::nan("")) == "n/a % left");
    CHECK(rv::format_duration_fs(std::nan("")) == "n/a");
    CHECK(rv::column_scale({1.0, -3.0, std::nan(""), std::numeric_limits<double>::infinity()}) ==
          3.0);
}

TEST_CASE("durations above 10 ps print in ps and above 10 ns in ns", "[number_text]") {
    CHECK(rv::format_duration_fs(123.44) == "123.4 fs");
    CHECK(rv::format_duration_fs(10000) == "10000.0 fs");
    CHECK(rv::format_duration_fs(10000.5) == "10.001 ps");
    CHECK(rv::format_duration_fs(-52345.6, true) == "-52.346 ps");
    CHECK(rv::format_duration_fs(52345.6, true) == "+52.346 ps");
    CHECK(rv::format_duration_fs(1e7) == "10000.000 ps");
    CHECK(rv::format_duration_fs(-1.23456e7) == "-12.346 ns");
    CHECK(rv::format_duration_fs(-1.4e-13, true) == "+0.0 fs");
    CHECK(rv::format_duration_fs(-0.02) == "0.0 fs");
}
