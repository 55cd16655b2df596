#include "analysis/pulse_at_target.hpp"

#include <cmath>

namespace rv {

PathDispersion path_dispersion(const Path& path, size_t hit_index) {
    PathDispersion d;
    for (size_t i = 0; i <= hit_index && i < path.segments.size(); ++i) {
        const TraceSegment& s = path.segments[i];
        d.gdd_fs2 += s.length_mm * s.gvd_fs2_per_mm;
        d.tod_fs3 += s.length_mm * s.tod_fs3_per_mm;
    }
    // A hit's lumped glass counts once the pulse is past it (as for the delay, trace.cpp).
    for (size_t i = 0; i < hit_index && i < path.hits.size(); ++i) {
        const TraceHit& h = path.hits[i];
        d.gdd_fs2 += h.lumped_glass_mm * h.lumped_gvd_fs2_per_mm;
        d.tod_fs3 += h.lumped_glass_mm * h.lumped_tod_fs3_per_mm;
    }
    return d;
}

double chirped_gaussian_fwhm_fs(double tau0_fs, double gdd_fs2) {
    const double stretch = 4 * std::log(2.0) * gdd_fs2 / (tau0_fs * tau0_fs);
    return tau0_fs * std::sqrt(1 + stretch * stretch);
}

PulseAtTarget pulse_at_hit(const BeamSource& source, const Path& path, size_t hit_index) {
    const PathDispersion d = path_dispersion(path, hit_index);
    PulseAtTarget p;
    p.gdd_fs2 = source.input_gdd_fs2.value_or(0.0) + d.gdd_fs2;
    p.tod_fs3 = d.tod_fs3;
    if (const std::optional<double> tau0_fs = source.pulse_fwhm_fs)
        p.fwhm_fs = chirped_gaussian_fwhm_fs(*tau0_fs, p.gdd_fs2);
    return p;
}

}  // namespace rv
