#pragma once
// A plan to find the signal (issue 16 §6): the generated average power the report predicts
// (GeneratedLightReport, analysis/report_output.hpp) on a grid of delay-stage position (mm) ×
// crystal rotation (deg), the steps to scan with and the ranges to cover.
//
// Axes.
//   Stage: the report's delay stage (StageReport) at its absolute position in mm. The delay at
//   a position s is delay_now + delay_per_mm_fs · (s − position_mm): the report's slope, from a
//   second trace with the stage moved, so a retroreflector's double pass is in it.
//   Rotation: the crystal's turn (optic axis in the table plane, + = clockwise seen from above)
//   or tilt (optic axis vertical, + = the face normal rises) from its present setting, in deg,
//   the report's rotate_by_deg convention (analysis/crystal_angle.hpp). ψ after a rotation c is
//   the angle to the reference axis of the first input's wave refracted at the rotated face
//   from its outside direction (trace/crystal_axes.hpp); Δk at ψ by the report's formula.
// Value of a cell: the report's own generated_light called with Δk(c) and with the delay at s
// (never a copy of it). Its average power is C · h(σ(Δk)) · G(delay) with C independent of
// both (nonlinear/generated_power.hpp: the peak power is linear in h, the energy in G), so the
// grid is filled from one call per rotation (at zero delay) and one per stage position:
//   P(c, s) = P(c, delay 0) · G(s) / G(0).
// tests/analysis/scan_test.cpp checks cells against generated_light called at the cell.
// Held fixed: the beams as traced (the rotation's sideways shift of the beams inside the
// crystal, about L·Δθ·(1 − 1/n), and its change of the crystal path's delay are not retraced),
// hence the spatial overlap, ξ and B.
//
// Plan.
//   Steps: half the cross-correlation FWHM of the pulses generated_light uses,
//   sqrt(τ1² + τ2²), in stage mm (÷ |delay_per_mm_fs|); half the internal angular acceptance
//   FWHM in rotation degrees (÷ |dψ/dc| at the present setting).
//   Centre: the stage at the report's zero delay, the rotation at the report's rotate_by_deg.
//   Ranges: ±3σ of the model's uncertainty, σ from the tolerance run's perturbations and
//   tolerances (solve/tolerance.hpp): each perturbation applied at ±its tolerance, the layout
//   evaluated by evaluate_beams_at_target, the change of the delay and of ψ (phase_now) taken
//   as linear, each error uniform in ±its tolerance (variance Δ²/3), summed in quadrature
//   (unaligned builds, no alignment). Never narrower than ±1 FWHM, so the peak itself is in.
//   Points: 2·ceil(half range / step) + 1 per axis.
// SHG of one beam: the delay does not apply; the stage axis is absent (one column).

#include <optional>
#include <string>
#include <vector>

#include "analysis/crystal_angle.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

// The largest grid along either axis (the map is width × height cells).
inline constexpr int kMaxScanPoints = 1000;
// The range to cover, in standard deviations of the model's uncertainty.
inline constexpr double kScanCoverageSigmas = 3.0;

// Why a layout cannot be scanned (words at output: viewer/cli/scan_command.cpp).
struct ScanRefusal {
    enum class Kind {
        NoCrystalTarget,     // the target is not an anisotropic crystal
        NoProcess,           // its process is missing, not phase-matchable or outside the index data
        NoGeneratedLight,    // the report has no generated light (power, pulse or rate missing)
        NoStage,             // SFG with no delay stage carrying an optic of a beam
        NoRotation,          // no crystal setting in range reaches θ_pm
        TooManyPoints,       // a requested grid above kMaxScanPoints along an axis
    };
    Kind kind = Kind::NoCrystalTarget;
    std::string pointer;   // JSON pointer into the layout ("/target", "/elements/7")
    std::string element;   // the element's or beam's id, when one is concerned
    int points = 0;        // TooManyPoints: the count asked for
};

struct ScanAxisPlan {
    double present = 0;     // the setting now (stage mm; rotation 0)
    double centre = 0;      // where the report predicts the peak
    double fwhm = 0;        // the signal's width along the axis (cross-correlation, acceptance)
    double step = 0;        // fwhm / 2
    double sigma = 0;       // the model's uncertainty of the centre (see above)
    double half_range = 0;  // max(3σ, fwhm)
    int points = 1;         // 2·ceil(half_range / step) + 1
};

struct ScanPlan {
    bool stage_applies = false;        // SFG with a stage (else one column at the present delay)
    std::string stage;                 // the stage's id
    ScanAxisPlan stage_mm;             // mm
    double delay_per_mm_fs = 0;        // the report's
    double cross_correlation_fs = 0;   // sqrt(τ1² + τ2²) of generated_light's pulses
    double delay_sigma_fs = 0;
    std::string crystal;               // the crystal's id
    CrystalRotation rotation = CrystalRotation::Turn;
    ScanAxisPlan rotation_deg;         // deg from the present setting
    double acceptance_internal_mrad = 0;  // the report's, in ψ
    double dpsi_per_deg_mrad = 0;      // |dψ/dc| at the present setting
    double psi_sigma_mrad = 0;
    size_t perturbations = 0;          // tolerance perturbations behind the σ
    long long plan_points = 0;         // stage points × rotation points
};

struct ScanMap {
    std::vector<double> stage_mm;      // column positions (one: the present, without stage)
    std::vector<double> rotation_deg;  // row settings
    // Average generated power, mW, row-major: power_mw[row * stage_mm.size() + column]. A cell
    // whose value is not finite holds nullopt (counted in non_finite, never a number).
    std::vector<std::optional<double>> power_mw;
    size_t non_finite = 0;
    double present_mw = 0;             // the report's average_mw_now
    double peak_mw = 0;                // the largest cell
    double peak_stage_mm = 0, peak_rotation_deg = 0;
    double best_mw = 0;                // the report's average_mw_best
    double output_nm = 0;              // the generated wavelength
};

struct ScanRequest {
    // The grid: 0 = the plan's point counts (each clamped to [3, kDefaultMapPoints]).
    int stage_points = 0, rotation_points = 0;
};
inline constexpr int kDefaultMapPoints = 201;

struct ScanResult {
    std::optional<ScanRefusal> refusal;
    ScanPlan plan;
    ScanMap map;
};

ScanResult plan_scan(const Layout& layout, const MaterialLibrary& library, const ScanRequest& request = {});

}  // namespace rv
