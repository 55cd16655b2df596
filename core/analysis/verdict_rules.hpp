#pragma once
// The verdict's tests on its figures (README, "Verdict"): one definition of "met" for
// build_report, which words the verdict, and the tolerance run, which judges every aligned
// build with it (solve/tolerance.hpp). Thresholds: goals.verdict (VerdictThresholds).
//   space (two beams): |waist separation| / shorter Rayleigh range ≤ max_waist_offset_rayleigh,
//          larger/smaller mean waist ≤ max_waist_ratio, chief-ray distance in the target plane
//          over √(w1² + w2²), per plane and added in quadrature (√((d_t/√Σw_t²)² + (d_s/√Σw_s²)²),
//          the sagittal part a walk-off out of the table plane) ≤ max_lateral_offset_radius, and each goal waist
//          (goals.waist_um, mean of the planes) within max_goal_waist_error of its goal;
//   space (one beam): |mean waist offset| / its shorter Rayleigh range, and its goal waist;
//   time: |delay| / √(τ1² + τ2²) ≤ max_delay_xcorr;
//   phase: phase-matchable, sinc²(Δk·L/2) ≥ min_phase_factor, and the polarizations suit.

#include "analysis/target_summary.hpp"
#include "layout/layout.hpp"

namespace rv {

struct SpaceFigures {
    double waist_offset_rayleigh = 0;  // |waist separation| / shorter Rayleigh range
    double waist_ratio = 1;            // larger over smaller (≥ 1)
    double lateral_radius = 0;         // chief-ray distance / √(w1² + w2²), both planes
};
// Both beams must have reached the target; m = mismatch_at_target(a, b).
SpaceFigures space_figures(const BeamAtTarget& a, const BeamAtTarget& b, const Mismatch& m);
bool space_figures_met(const SpaceFigures& f, const VerdictThresholds& t);

// One beam: its mean waist offset over its shorter Rayleigh range (unsigned).
double single_beam_offset_rayleigh(const BeamAtTarget& a);
bool single_beam_offset_met(double offset_rayleigh, const VerdictThresholds& t);

// The mean of the two planes' waist radii, and whether it is within the goal's tolerance.
double mean_waist_um(const BeamAtTarget& a);
bool waist_goal_met(double waist_um, double goal_um, const VerdictThresholds& t);
// Every goals.waist_um goal of a beam that reached the target (`at` by beam, as
// evaluate_beams_at_target gives them).
bool waist_goals_met(const Layout& layout, const std::vector<BeamAtTarget>& at);

// The FWHM of the cross-correlation of two pulses (Gaussian: √(τ1² + τ2²)).
double cross_correlation_fwhm_fs(double first_fwhm_fs, double second_fwhm_fs);
bool delay_met(double delay_fs, double cross_correlation_fs, const VerdictThresholds& t);

// sinc²(Δk·L/2).
double phase_factor(double delta_k_l);
bool phase_met(bool phase_matchable, double sinc2, bool polarizations_suit, const VerdictThresholds& t);

}  // namespace rv
