#pragma once
// The pulse of each beam where it meets the target: the group-delay dispersion (GDD) and the
// third-order dispersion (TOD) of its path, and the length of a Gaussian pulse there.
//
//   GDD = GDD_source + Σ L_i k''_i,   TOD = Σ L_i k'''_i
// over every segment from the source to the target centre (glass, substrates, crystals at the
// wave's own polarization and angle, air by Ciddor 1996), plus each thick singlet's centre
// thickness at its glass less the air it replaces (thin lenses carry no glass); k'' and k''' from
// the material's published dispersion formula (materials/dispersion.hpp).
// A Gaussian pulse whose transform-limited intensity FWHM is τ0 (the source's pulse_fwhm_fs),
// after a GDD φ2 (the source's own input_gdd_fs2 included), has the FWHM
//   τ = τ0 √(1 + (4 ln 2 · φ2 / τ0²)²)
// (Diels & Rudolph, "Ultrashort Laser Pulse Phenomena", 2nd ed. 2006, §1.2.3). The TOD is
// reported but does not enter τ (its effect, an asymmetric tail, is no longer Gaussian). A
// compressor or chirped mirrors adding −φ2 before the target restore τ0.

#include <optional>

#include "layout/layout.hpp"
#include "trace/path.hpp"

namespace rv {

struct PulseAtTarget {
    double gdd_fs2 = 0;  // the source's input_gdd_fs2 plus the path's, at the target centre
    double tod_fs3 = 0;  // the path's
    std::optional<double> fwhm_fs;  // with the source's pulse_fwhm_fs (Gaussian, above)
    // The GDD to add before the target for the shortest pulse there (−gdd_fs2).
    double compensation_gdd_fs2() const { return -gdd_fs2; }
    bool operator==(const PulseAtTarget&) const = default;
};

// The GDD and TOD of `path` from its start to (and including the segment that ends at) hit
// `hit_index`, and the lumped glass of the hits before it.
struct PathDispersion {
    double gdd_fs2 = 0, tod_fs3 = 0;
};
PathDispersion path_dispersion(const Path& path, size_t hit_index);

// τ of a Gaussian pulse of transform-limited FWHM τ0 after the GDD φ2 (formula above).
double chirped_gaussian_fwhm_fs(double transform_limited_fwhm_fs, double gdd_fs2);

// The pulse of `source` at hit `hit_index` of its path.
PulseAtTarget pulse_at_hit(const BeamSource& source, const Path& path, size_t hit_index);

}  // namespace rv
