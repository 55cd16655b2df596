// Focusing in the crystal (nonlinear/boyd_kleinman.hpp): ξ = L/b with b the beam's confocal
// parameter (mean of the planes); h_m without walk-off (B = 0) and with the crystal's walk-off
// parameter B = ρ √(L k1)/2; the optimum ξ_m and h_mm for that B, and the waist that gives it.
//
// Which ρ: Boyd & Kleinman 1968 treat one wave walking off from the others, B built from its
// double-refraction angle and the fundamental's k. Type II: the e input walks off from the o
// input (the generated e wave travels with it), so ρ is the e input's. Type I ooe: the generated
// e wave walks off from the o inputs, so ρ is the generated wave's. Type I eeo: the e inputs'
// (PhaseMatchingReport::focusing_walkoff_mrad, report_phase.cpp). k1 is each beam's own
// k = 2π n/λ in the crystal.
//
// The advice: the optimum confocal parameter b = L/ξ_m in the crystal, i.e. the waist radius
// w0 = √(b λ / (2π n)); a collimated beam focused by a lens has w0 = λ f/(π W), so the lens that
// gives it has the focal length scaled by w0(optimum)/w0(now).
#include <cmath>
#include <map>

#include "analysis/report_sections.hpp"
#include "nonlinear/boyd_kleinman.hpp"
#include "units/constants.hpp"

namespace rv::report_sections {

std::vector<FocusingReport> focusing(const Crystal& crystal, const RendezvousReport& r) {
    std::vector<FocusingReport> out;
    const double rho_rad =
        r.phase_matching.empty() ? 0 : mrad_to_rad(r.phase_matching.front().focusing_walkoff_mrad);
    for (const ReportBeam& b : r.beams) {
        if (!b.at_target.reached) continue;
        const double confocal_mm = (b.confocal_tangential_mm + b.confocal_sagittal_mm) / 2;
        const double length_mm = crystal.length_mm;
        const double xi = length_mm / confocal_mm;
        const double wavelength_mm = nm_to_mm(b.wavelength_nm);
        const double n = b.at_target.index;
        const double k1_per_mm = 2 * kPi * n / wavelength_mm;
        FocusingReport f;
        f.beam = b.id;
        f.xi = xi;
        const BoydKleinmanOptimum plain = boyd_kleinman_optimum(xi);
        f.h_m = plain.h_m;
        f.sigma_m = plain.sigma_m;
        f.walkoff_parameter = walkoff_parameter(rho_rad, length_mm, k1_per_mm);
        const BoydKleinmanOptimum with = boyd_kleinman_optimum(xi, f.walkoff_parameter);
        f.h_m_walkoff = with.h_m;
        f.sigma_m_walkoff = with.sigma_m;
        const BoydKleinmanBest best = boyd_kleinman_best_focus(f.walkoff_parameter);
        f.xi_optimum = best.xi_m;
        f.h_mm = best.h_mm;
        f.confocal_optimum_mm = length_mm / best.xi_m;
        auto waist_um = [&](double confocal) {
            return mm_to_um(std::sqrt(confocal * wavelength_mm / (2 * kPi * n)));
        };
        f.waist_now_um = waist_um(confocal_mm);
        f.waist_optimum_um = waist_um(f.confocal_optimum_mm);
        f.focal_length_scale = f.waist_optimum_um / f.waist_now_um;
        out.push_back(f);
    }
    return out;
}

}  // namespace rv::report_sections
