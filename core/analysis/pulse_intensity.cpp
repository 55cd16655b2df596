#include "analysis/pulse_intensity.hpp"

#include "units/constants.hpp"

namespace rv {

std::optional<PulseFigures> pulse_figures(double power_mw, double rep_khz, double fwhm_fs, double wt_um, double ws_um) {
    if (!(power_mw > 0 && rep_khz > 0 && fwhm_fs > 0 && wt_um > 0 && ws_um > 0)) return std::nullopt;
    PulseFigures f;
    const double energy_j = power_mw * 1e-3 / (rep_khz * 1e3);
    f.energy_uj = energy_j * 1e6;
    f.peak_power_w = kGaussianPeakFactor * energy_j / (fwhm_fs * 1e-15);
    const double area_cm2 = kPi * (wt_um * 1e-4) * (ws_um * 1e-4) / 2;  // π w_t w_s / 2
    f.peak_intensity_w_cm2 = f.peak_power_w / area_cm2;
    f.peak_fluence_j_cm2 = energy_j / area_cm2;
    return f;
}

}  // namespace rv
