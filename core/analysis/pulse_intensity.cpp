#include "analysis/pulse_intensity.hpp"

#include "units/constants.hpp"

namespace rv {

std::optional<PulseFigures> pulse_figures(const PulseInputs& in) {
    if (!(in.power_mw > 0 && in.repetition_rate_khz > 0 && in.fwhm_fs > 0 && in.radius_tangential_um > 0 &&
          in.radius_sagittal_um > 0))
        return std::nullopt;
    PulseFigures f;
    const double energy_j = mw_to_w(in.power_mw) / khz_to_hz(in.repetition_rate_khz);
    f.energy_uj = j_to_uj(energy_j);
    f.peak_power_w = kGaussianPeakFactor * energy_j / fs_to_s(in.fwhm_fs);
    const double area_cm2 = kPi * um_to_cm(in.radius_tangential_um) * um_to_cm(in.radius_sagittal_um) / 2;  // π w_t w_s / 2
    f.peak_intensity_w_cm2 = f.peak_power_w / area_cm2;
    f.peak_fluence_j_cm2 = energy_j / area_cm2;
    return f;
}

}  // namespace rv
