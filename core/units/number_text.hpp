#pragma once
// Numbers as text, one rule for every table and sentence the program prints.
//
// Zero: arithmetic leaves residues where a figure is zero (a difference of two equal paths gives
// -1.4e-13 mm, a finite difference 6.4e-313). A value whose magnitude is below
// kNegligibleFraction of max(1, scale) in its own unit prints as 0, where scale is the largest
// magnitude in its column (column_scale) or 1 for a lone number; and a value that rounds to zero
// at the printed precision never shows a minus sign ("-0.000" → "0.000", "%+" keeps "+0.000").
// 1e-9 lies far above double rounding (1e-16 relative, even amplified by a finite difference)
// and far below any figure the program prints in its units (mm, µm, fs, fractions).
//
// Not a number: NaN or infinity never prints as a number: "n/a" in its place.
//
// Durations (format_duration_fs): up to 10 ps in fs, above 10 ps in ps, above 10 ns in ns, with
// the unit; columns whose header names fs keep fs.

#include <string>
#include <vector>

namespace rv {

inline constexpr double kNegligibleFraction = 1e-9;

// value, or 0 when |value| < kNegligibleFraction × max(1, scale); NaN and infinity unchanged.
double negligible_as_zero(double value, double scale = 1);

// The largest finite magnitude among values (0 when there is none): a column's scale.
double column_scale(const std::vector<double>& values);

// printf_format holds one floating-point conversion ("%.3f", "waist %+.2f mm"); the value after
// negligible_as_zero, never "-0", and "n/a" in place of the conversion for NaN or infinity.
std::string format_number(const char* printf_format, double value, double scale = 1);

// "-12.3 fs", "+45.678 ps", "12.345 ns" (see above); plus_sign: "+" before positive values.
std::string format_duration_fs(double fs, bool plus_sign = false);

}  // namespace rv
