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
inline constexpr double um_to_nm(double length_um) { return length_um * 1e3; }
inline constexpr double pm_to_nm(double length_pm) { return length_pm * 1e-3; }
inline constexpr double um_to_cm(double length_um) { return length_um * 1e-4; }
// A quantity per µm as per mm (× 1000 µm/mm): GVD in fs²/µm → fs²/mm, k in rad/µm → rad/mm.
inline constexpr double per_um_to_per_mm(double per_um) { return per_um * 1e3; }
inline constexpr double per_nm_to_per_mm(double per_nm) { return per_nm * 1e6; }
inline constexpr double mrad_to_rad(double angle_mrad) { return angle_mrad * 1e-3; }
inline constexpr double rad_to_mrad(double angle_rad) { return angle_rad * 1e3; }
inline constexpr double mw_to_w(double power_mw) { return power_mw * 1e-3; }
inline constexpr double khz_to_hz(double rate_khz) { return rate_khz * 1e3; }
inline constexpr double fs_to_s(double time_fs) { return time_fs * 1e-15; }
inline constexpr double j_to_uj(double energy_j) { return energy_j * 1e6; }
inline constexpr double gw_to_w(double power_gw) { return power_gw * 1e9; }
inline constexpr double deg_to_rad(double angle_deg) { return angle_deg * kPi / 180.0; }
inline constexpr double rad_to_deg(double angle_rad) { return angle_rad * 180.0 / kPi; }

}  // namespace rv
