#pragma once
// A count or an index computed from a double (a length over a step, a coordinate over a pitch,
// a screen coordinate), clamped to [lo, hi] before the cast. Casting a double outside the
// integer's range to it is undefined behaviour (C++20 [conv.fpint]), and a NaN compares false
// with everything, so the test is written to send NaN to `lo`.
//
// Every loop whose count comes from input counts first with this, then steps by an integer:
// a loop that steps a double until it passes a bound never ends once the step falls below the
// spacing of doubles there (x + step == x).

#include <concepts>

namespace rv {

template <std::integral Int>
constexpr Int clamped_int(double value, Int lo, Int hi) {
    if (!(value >= static_cast<double>(lo))) return lo;  // below, or NaN
    if (value >= static_cast<double>(hi)) return hi;
    return static_cast<Int>(value);
}

}  // namespace rv
