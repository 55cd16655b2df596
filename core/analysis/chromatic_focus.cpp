#include "analysis/chromatic_focus.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

#include "materials/dispersion.hpp"
#include "optics/gaussian_beam.hpp"

namespace rv {

ChromaticFocusSummary summarize_chromatic_focus(const ChromaticFocusCase& c,
                                                const MaterialLibrary& library) {
    const Material* glass = library.find(c.lens.glass);
    if (glass == nullptr) throw std::invalid_argument("unknown glass '" + c.lens.glass + "'");
    ChromaticFocusSummary summary;
    for (const FocusBeam& b : c.beams) {
        const IndexSample n = sample_index(*glass, b.wavelength_nm);
        const ThickLensProperties props = thick_lens_properties(c.lens.shape, n.index);
        const GaussianBeam at_lens =
            beam_from_waist(b.waist_um, -b.waist_before_lens_mm, b.wavelength_nm, 1.0, b.m2);
        const GaussianBeam after =
            propagate(at_lens, thick_singlet_matrix(c.lens.shape, n.index));
        summary.beams.push_back({b.id, b.wavelength_nm, n.index, n.in_valid_range,
                                 props.effective_focal_length_mm, props.back_focal_distance_mm,
                                 waist_radius_um(after), distance_to_waist_mm(after),
                                 rayleigh_range_mm(after), radius_um(at_lens)});
    }
    if (summary.beams.size() >= 2) {
        const BeamFocus& a = summary.beams[0];
        const BeamFocus& b = summary.beams[1];
        summary.focal_shift_mm = b.waist_after_lens_mm - a.waist_after_lens_mm;
        summary.shift_over_rayleigh =
            std::abs(summary.focal_shift_mm) / std::min(a.rayleigh_range_mm, b.rayleigh_range_mm);
        summary.waist_ratio = b.waist_um / a.waist_um;
    }
    return summary;
}

}  // namespace rv
