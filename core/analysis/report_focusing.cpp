// Focusing in the crystal (nonlinear/boyd_kleinman.hpp): ξ = L/b with b the beam's confocal
// parameter (mean of the planes), the optimum h_m without walk-off, and the walk-off parameter
// B = ρ √(L k1)/2 with ρ the first process's walk-off.
#include "analysis/report_sections.hpp"
#include "nonlinear/boyd_kleinman.hpp"
#include "units/constants.hpp"

namespace rv::report_sections {

std::vector<FocusingReport> focusing(const Crystal& crystal, const RendezvousReport& r) {
    std::vector<FocusingReport> out;
    const double rho_rad =
        r.phase_matching.empty() ? 0 : r.phase_matching.front().walkoff_mrad * 1e-3;
    for (const ReportBeam& b : r.beams) {
        if (!b.at_target.reached) continue;
        const double confocal_mm = (b.confocal_tangential_mm + b.confocal_sagittal_mm) / 2;
        const double xi = crystal.length_mm / confocal_mm;
        const BoydKleinmanOptimum o = boyd_kleinman_optimum(xi);
        const double k1_per_mm = 2 * kPi * b.at_target.index / nm_to_mm(b.wavelength_nm);
        out.push_back(
            {b.id, xi, o.h_m, o.sigma_m, walkoff_parameter(rho_rad, crystal.length_mm, k1_per_mm)});
    }
    return out;
}

}  // namespace rv::report_sections
