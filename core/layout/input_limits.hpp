#pragma once
// The values no real table has (issue 19 §1): every number that enters the program — a layout
// file, a command-line option, a field of the inspector (which goes through the reader) — is
// refused outside these ranges, with the range in the message. One place for all of them; the
// reader's rules (io/field_reader.hpp) and the command line's validators (viewer/main.cpp) take
// their bounds from here.
//
// The bounds are generous on purpose (common practice: an optical table is at most a few metres;
// a lab with 100 m of beam path is not a table). They are not physics limits: they keep doubles
// far from overflow and underflow, so that no figure computed from them is NaN or infinite, and
// a unit slip (metres typed as mm, 1e300 by accident) is caught where it is written.
//
// Laser safety: none of these is an exposure limit, and nothing here computes one.

namespace rv::limits {

// Lengths in mm: positions, distances, radii, focal lengths, thicknesses, stage readings.
inline constexpr double kMaxLength_mm = 1e5;          // ±100 m
inline constexpr double kMinNonZeroLength_mm = 1e-6;  // 1 nm: below it, a "non-zero" length is 0
// Sizes that are not lengths in mm still need a floor above the denormals (1e-320 passes "> 0").
inline constexpr double kSmallestPositive = 1e-9;  // in the unit of the field

// The table's width and height.
inline constexpr double kMinTable_mm = 10, kMaxTable_mm = 1e5;  // [1 cm, 100 m]

// A source's waist radius and beam quality.
inline constexpr double kMinWaist_um = 0.1, kMaxWaist_um = 1e6;  // [0.1 µm, 1 m]
inline constexpr double kMaxM2 = 1000;

// The wavelengths a layout may use: vacuum ultraviolet to the mid infrared, wider than any
// bundled material's data (common practice: tabletop sources and their harmonics). Outside,
// the reader names the unit the number was likely written in.
inline constexpr double kMinWavelength_nm = 150, kMaxWavelength_nm = 20000;

// Angles: a turn either way (1e300 degrees is no direction).
inline constexpr double kMaxAngle_deg = 360;

// A source's power, repetition rate, pulse length and emission time.
inline constexpr double kMinPower_mw = 1e-9, kMaxPower_mw = 1e8;                     // [1 pW, 100 kW]
inline constexpr double kMinRepetitionRate_khz = 1e-6, kMaxRepetitionRate_khz = 1e8;  // [1 mHz, 100 GHz]
inline constexpr double kMinPulse_fs = 0.1, kMaxPulse_fs = 1e9;                       // [0.1 fs, 1 µs]
inline constexpr double kMaxTime_fs = 1e9;                                            // ±1 µs

// A damage threshold (the user's figure; never an exposure limit).
inline constexpr double kMaxFluence_j_cm2 = 1e6;
inline constexpr double kMaxIntensity_gw_cm2 = 1e9;

// A user material's Sellmeier terms: n² = 1 + Σ B λ²/(λ² − C), λ in µm.
inline constexpr double kMaxSellmeierB = 1e3;
inline constexpr double kMaxSellmeierC_um2 = 1e6;

}  // namespace rv::limits
