#include "analysis/target_summary.hpp"

#include <cmath>

#include "analysis/crystal_waves.hpp"
#include "analysis/timing.hpp"
#include "nonlinear/overlap.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {
PlaneAtTarget plane(const GaussianBeam& b) {
    return {radius_um(b), waist_radius_um(b), distance_to_waist_mm(b), rayleigh_range_mm(b)};
}
}  // namespace

BeamAtTarget beam_at_target(const Layout& layout, const Path& path, const BeamsAtTargetPlane& beams) {
    BeamAtTarget out;
    if (!path.target_hit || !beams.reached) return out;
    const TraceHit& hit = path.hits[*path.target_hit];
    out.reached = true;
    out.path_mm = hit.s_mm;
    out.arrival_fs = arrival_time_fs(layout, path, *path.target_hit);
    out.tangential = plane(beams.tangential);
    out.sagittal = plane(beams.sagittal);
    out.tangential.waist_offset_mm = beams.waist_offset_tangential_mm;
    out.sagittal.waist_offset_mm = beams.waist_offset_sagittal_mm;
    out.hit_mm = hit.point_mm;
    out.direction = hit.direction_in;
    out.wave_direction = hit.wave_direction_in();
    out.vertical_mm = hit.vertical_mm;
    out.vertical_slope = hit.vertical_slope_in;
    out.pulse = pulse_at_hit(layout.beams[path.beam], path, *path.target_hit);
    out.index = hit.index_before;
    out.q_tangential = beams.tangential;
    out.q_sagittal = beams.sagittal;
    const Element& target = layout.elements[hit.element];
    if (const auto* crystal = std::get_if<Crystal>(&target.kind); crystal && hit.face == Face::Centre)
        out.half_crystal_path_mm = crystal->length_mm / 2 / std::max(hit.cos_aoi, 1e-12);
    return out;
}

BeamAtTarget beam_at_target(const Layout& layout, const Path& path, const Caustic& caustic) {
    return beam_at_target(layout, path,
                          BeamsAtTargetPlane{caustic.reaches_target, caustic.target_tangential, caustic.target_sagittal,
                                             caustic.target_waist_offset_tangential_mm,
                                             caustic.target_waist_offset_sagittal_mm});
}

namespace {
// The retrace's evaluation; `edited` as retrace_layout takes it. Each path ends at the target
// unless the waist search needs what lies beyond it: a waist downstream of the target plane
// (offset >= 0 in either plane) is looked for through the surfaces after it, so such a path is
// completed and the beam propagated again from the target.
std::vector<BeamAtTarget> reevaluate(const Layout& layout, const MaterialLibrary& library, TraceCache& c,
                                     const std::vector<size_t>* edited) {
    prepare_crystal_waves(c, layout, library);
    std::vector<BeamAtTarget> out;
    const std::vector<Path>& paths = retrace_layout(layout, library, c, {.edited = edited, .stop_at_target = true});
    out.reserve(paths.size());
    for (size_t b = 0; b < paths.size(); ++b) {
        // The memo may start after the kept hits only if it followed the previous retrace's path.
        const size_t unchanged = c.retrace.propagation_restart(b);
        TargetPropagationMemo& memo = c.retrace.propagation(b);
        BeamsAtTargetPlane at = propagate_to_target(layout, paths[b], &memo, unchanged);
        if (at.reached && paths[b].ends_at_target &&
            (at.waist_offset_tangential_mm >= 0 || at.waist_offset_sagittal_mm >= 0))
            at = propagate_to_target(layout, trace_past_target(layout, c, b), &memo, *paths[b].target_hit);
        out.push_back(beam_at_target(layout, paths[b], at));
    }
    return out;
}
}  // namespace

std::vector<BeamAtTarget> evaluate_beams_at_target(const Layout& layout, const MaterialLibrary& library,
                                                   TraceCache* cache, bool keep_unchanged) {
    TraceCache local;
    TraceCache& c = cache ? *cache : local;
    if (keep_unchanged) return reevaluate(layout, library, c, nullptr);
    prepare_crystal_waves(c, layout, library);
    std::vector<BeamAtTarget> out;
    trace_layout(layout, library, c, c.paths);
    out.reserve(c.paths.size());
    for (const Path& path : c.paths)
        out.push_back(beam_at_target(layout, path, propagate_to_target(layout, path, &c.scratch_propagation)));
    return out;
}

std::vector<BeamAtTarget> evaluate_beams_at_target(const Layout& layout, const MaterialLibrary& library,
                                                   TraceCache& cache, const std::vector<size_t>& edited) {
    return reevaluate(layout, library, cache, &edited);
}

Mismatch mismatch_at_target(const BeamAtTarget& a, const BeamAtTarget& b) {
    Mismatch m;
    m.waist_offset_tangential_mm = b.tangential.waist_offset_mm - a.tangential.waist_offset_mm;
    m.waist_offset_sagittal_mm = b.sagittal.waist_offset_mm - a.sagittal.waist_offset_mm;
    m.waist_offset_mm = (m.waist_offset_tangential_mm + m.waist_offset_sagittal_mm) / 2;
    m.waist_ratio = (b.tangential.waist_um + b.sagittal.waist_um) /
                    (a.tangential.waist_um + a.sagittal.waist_um);
    m.lateral_tangential_um = mm_to_um((b.hit_mm - a.hit_mm).norm());
    m.lateral_sagittal_um = mm_to_um(std::abs(b.vertical_mm - a.vertical_mm));
    m.lateral_um = std::hypot(m.lateral_tangential_um, m.lateral_sagittal_um);
    const double cross = a.direction.x() * b.direction.y() - a.direction.y() * b.direction.x();
    m.angle_mrad = 1e3 * std::atan2(std::abs(cross), a.direction.dot(b.direction));
    m.delay_fs = a.arrival_fs - b.arrival_fs;
    return m;
}

OverlapFigures overlap_at_target(const BeamAtTarget& x, const BeamAtTarget& y, std::optional<double> t1_fs,
                                 std::optional<double> t2_fs) {
    // Offsets across the bisector of the two chief rays and the crystal's extent averaged over
    // both paths, so that the figure does not depend on which beam is listed first.
    const Vec2 across = perpendicular((x.direction + y.direction).normalized());
    const double d0_um = mm_to_um((y.hit_mm - x.hit_mm).dot(across));
    const double tilt = std::atan2(x.direction.x() * y.direction.y() - x.direction.y() * y.direction.x(),
                                   x.direction.dot(y.direction));
    OverlapFigures o;
    // Out of the table plane: the heights differ by v0 and part by the difference of slopes.
    const double v0_um = mm_to_um(y.vertical_mm - x.vertical_mm);
    const double v_tilt = y.vertical_slope - x.vertical_slope;
    o.spatial = transverse_overlap_1d(x.tangential.radius_um, y.tangential.radius_um, d0_um) *
                transverse_overlap_1d(x.sagittal.radius_um, y.sagittal.radius_um, v0_um);
    // The mean over z in [−h, h] by 8-point Gauss–Legendre quadrature (nodes and weights:
    // Abramowitz & Stegun, Handbook of Mathematical Functions, Table 25.4): the integrand is
    // smooth on the scale of the crystal, and the Monte Carlo evaluates it per sample.
    static constexpr double kNode[4] = {0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363};
    static constexpr double kWeight[4] = {0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763};
    auto at = [&](double z) {
        auto r = [z](const GaussianBeam& q) { return radius_um(propagate(q, free_space(z))); };
        const double d = d0_um + mm_to_um(tilt * z);
        const double v = v0_um + mm_to_um(v_tilt * z);
        return transverse_overlap_1d(r(x.q_tangential), r(y.q_tangential), d) *
               transverse_overlap_1d(r(x.q_sagittal), r(y.q_sagittal), v);
    };
    const double half_mm = (x.half_crystal_path_mm + y.half_crystal_path_mm) / 2;
    if (half_mm > 0) {
        double mean = 0;
        for (int i = 0; i < 4; ++i) mean += kWeight[i] * (at(half_mm * kNode[i]) + at(-half_mm * kNode[i])) / 2;
        o.spatial_along_crystal = mean;
    } else {
        o.spatial_along_crystal = at(0);
    }
    if (t1_fs && t2_fs) o.temporal = temporal_overlap(*t1_fs, *t2_fs, x.arrival_fs - y.arrival_fs);
    o.combined = o.spatial_along_crystal * o.temporal.value_or(1.0);
    return o;
}

OverlapFigures overlap_at_target(const BeamAtTarget& x, const BeamAtTarget& y) {
    return overlap_at_target(x, y, x.pulse.fwhm_fs, y.pulse.fwhm_fs);  // the pulses at the target
}

}  // namespace rv
