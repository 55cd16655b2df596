#pragma once
// The command line's numbers (issue 19 §1): one validator for every numeric option. "nan",
// "inf" and overflowing numbers such as 1e999 parse as doubles and slip through range checks
// (NaN fails none), and 1e308 is finite but no stage reading: each option is refused outside
// its range, the bounds taken from layout/input_limits.hpp like the reader's, with the range
// and the unit in the message (exit status 2 through CLI11's ValidationError).
#include <CLI/CLI.hpp>
#include <cmath>
#include <cstdlib>
#include <limits>
#include <sstream>
#include <string>

#include "layout/input_limits.hpp"

namespace rv::cli {

inline std::string option_number_text(double v) {
    std::ostringstream s;
    s.precision(15);
    s << v;
    return s.str();
}

// A number within [minimum, maximum] (unit for the message, "" for a count).
inline CLI::Validator number_within(double minimum, double maximum, const std::string& unit) {
    const std::string range = option_number_text(minimum) + " and " + option_number_text(maximum) +
                              (unit.empty() ? std::string() : " " + unit);
    return CLI::Validator(
        [minimum, maximum, range](std::string& text) -> std::string {
            char* end = nullptr;
            const double value = std::strtod(text.c_str(), &end);
            if (end == text.c_str()) return {};  // not a number: CLI11's own conversion says so
            if (!std::isfinite(value)) return "expected a finite number, got \"" + text + "\"";
            if (value < minimum || value > maximum)
                return "expected a number between " + range + ", got \"" + text + "\"";
            return {};
        },
        "NUMBER in [" + range + "]", "within");
}

// Any finite number (counts and seeds, whose own range CLI::Range gives).
inline CLI::Validator finite_number() {
    constexpr double big = std::numeric_limits<double>::max();
    return number_within(-big, big, "");
}

// A stage reading or any length in mm: within ±limits::kMaxLength_mm.
inline CLI::Validator length_option_mm() {
    return number_within(-limits::kMaxLength_mm, limits::kMaxLength_mm, "mm");
}

// A power in mW (0 allowed: no light wanted).
inline CLI::Validator power_option_mw() { return number_within(0, limits::kMaxPower_mw, "mW"); }

// The end of a sweep of any field: the reader judges each value by the field's own range; this
// bound keeps (to − from) and every step finite (1e308 − (−1e308) is infinite).
inline constexpr double kMaxSweepMagnitude = 1e12;
inline CLI::Validator sweep_end_option() {
    return number_within(-kMaxSweepMagnitude, kMaxSweepMagnitude, "(in the field's unit)");
}

}  // namespace rv::cli
