#pragma once
// Peak figures of a pulsed Gaussian beam of average power P at repetition rate f with a Gaussian
// pulse of FWHM τ and radii w_t, w_s (1/e² intensity):
//   energy E = P/f;  peak power P_pk = 2√(ln 2/π) E/τ ≈ 0.9394 E/τ (Gaussian in time);
//   peak intensity I = 2 P_pk/(π w_t w_s);  peak fluence F = 2 E/(π w_t w_s)
// (Siegman, Lasers, 1986, for the Gaussian beam; the 0.94 factor is the trade's rule for a
// Gaussian pulse). Estimates for comparison with a maker's damage threshold only — never an
// exposure limit.

#include <optional>

namespace rv {

struct PulseFigures {
    double energy_uj = 0;
    double peak_power_w = 0;
    double peak_intensity_w_cm2 = 0;
    double peak_fluence_j_cm2 = 0;
};

inline constexpr double kGaussianPeakFactor = 0.9394372786996513;  // 2√(ln 2/π)

struct PulseInputs {
    double power_mw = 0;              // average power
    double repetition_rate_khz = 0;
    double fwhm_fs = 0;               // pulse length
    double radius_tangential_um = 0;  // 1/e² intensity radii
    double radius_sagittal_um = 0;
};

// nullopt unless power, repetition rate, pulse length and both radii are positive.
std::optional<PulseFigures> pulse_figures(const PulseInputs& in);

}  // namespace rv
