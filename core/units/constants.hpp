#pragma once
// Physical constants and unit factors used across core/.
//
// Internal units of core/: lengths in millimetres, vacuum wavelengths in nanometres at the
// API (converted where a formula needs µm or mm), times in femtoseconds, angles in radians.
// Names of raw numbers carry their unit as a suffix.

#include <numbers>

namespace rv {

// Speed of light in vacuum, exact by the SI definition of the metre (BIPM, 17th CGPM 1983).
inline constexpr double kSpeedOfLight_mm_per_fs = 299792458.0 * 1e3 * 1e-15;  // 2.99792458e-4
inline constexpr double kSpeedOfLight_um_per_fs = 299792458.0 * 1e6 * 1e-15;  // 0.299792458

inline constexpr double kPi = std::numbers::pi;

inline constexpr double nm_to_mm(double length_nm) { return length_nm * 1e-6; }
inline constexpr double nm_to_um(double length_nm) { return length_nm * 1e-3; }
inline constexpr double mm_to_um(double length_mm) { return length_mm * 1e3; }
inline constexpr double um_to_mm(double length_um) { return length_um * 1e-3; }
inline constexpr double deg_to_rad(double angle_deg) { return angle_deg * kPi / 180.0; }
inline constexpr double rad_to_deg(double angle_rad) { return angle_rad * 180.0 / kPi; }

}  // namespace rv
