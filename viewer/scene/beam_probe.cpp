#include "scene/beam_probe.hpp"

#include <algorithm>
#include <cmath>

#include "analysis/timing.hpp"
#include "trace/poses.hpp"
#include "units/constants.hpp"
#include "units/number_text.hpp"

namespace rv::scene {

namespace {

// The radius in one plane at s, linear between the envelope samples either side of it.
std::optional<double> envelope_at(const std::vector<EnvelopeSample>& env, double s_mm, bool sagittal) {
    if (env.empty() || s_mm < env.front().s_mm - 1e-9 || s_mm > env.back().s_mm + 1e-9) return std::nullopt;
    const auto after = std::lower_bound(env.begin(), env.end(), s_mm,
                                        [](const EnvelopeSample& e, double s) { return e.s_mm < s; });
    auto value = [sagittal](const EnvelopeSample& e) { return sagittal ? e.radius_sagittal_um : e.radius_tangential_um; };
    if (after == env.end()) return value(env.back());
    if (after == env.begin() || after->s_mm <= s_mm) return value(*after);
    const EnvelopeSample& before = *(after - 1);
    const double span = after->s_mm - before.s_mm;
    if (!(span > 0)) return value(*after);
    const double f = (s_mm - before.s_mm) / span;
    return value(before) + f * (value(*after) - value(before));
}

std::string mm_text(double v_mm) { return format_number("%.1f", v_mm); }

}  // namespace

std::optional<BeamPoint> nearest_beam_point(const RendezvousReport& report, const Vec2& p_mm, double within_mm,
                                            std::optional<size_t> only_beam) {
    std::optional<BeamPoint> best;
    if (!p_mm.allFinite() || !(within_mm >= 0)) return best;
    for (size_t b = 0; b < report.beams.size(); ++b) {
        if (only_beam && *only_beam != b) continue;
        double s0 = 0;
        const std::vector<TraceSegment>& segs = report.beams[b].path.segments;
        for (size_t k = 0; k < segs.size(); ++k) {
            const TraceSegment& seg = segs[k];
            const Vec2 d = seg.to_mm - seg.from_mm;
            const double len2 = d.squaredNorm();
            const double u = len2 > 0 ? std::clamp((p_mm - seg.from_mm).dot(d) / len2, 0.0, 1.0) : 0.0;
            const Vec2 at = seg.from_mm + u * d;
            const double dist = (p_mm - at).norm();
            if (dist <= within_mm && (!best || dist < best->distance_mm))
                best = BeamPoint{b, k, u * seg.length_mm, s0 + u * seg.length_mm, at, dist};
            s0 += seg.length_mm;
        }
    }
    return best;
}

BeamReadout read_beam_at(const Layout& layout, const RendezvousReport& report, const BeamPoint& p) {
    const ReportBeam& b = report.beams[p.beam];
    BeamReadout r;
    r.beam_id = b.id;
    r.wavelength_nm = b.wavelength_nm;
    r.s_mm = p.s_mm;
    r.radius_tangential_um = envelope_at(b.caustic.envelope, p.s_mm, false);
    r.radius_sagittal_um = envelope_at(b.caustic.envelope, p.s_mm, true);
    r.arrival_fs = arrival_time_along_fs(layout, b.path, p.segment, p.into_mm);
    return r;
}

std::string beam_readout_text(const BeamReadout& r) {
    std::string text = r.beam_id + " (" + format_number("%.0f", r.wavelength_nm) + " nm): " + mm_text(r.s_mm) +
                       " mm from its start";
    if (r.radius_tangential_um && r.radius_sagittal_um)
        text += " · w " + format_number("%.1f", *r.radius_tangential_um) + " / " +
                format_number("%.1f", *r.radius_sagittal_um) + " µm (t / s)";
    return text + " · arrives " + format_duration_fs(r.arrival_fs);
}

std::optional<double> path_length_between_mm(const BeamPoint& a, const BeamPoint& b) {
    if (a.beam != b.beam) return std::nullopt;
    return std::abs(a.s_mm - b.s_mm);
}

std::string optic_summary_text(const Layout& layout, const RendezvousReport& report, size_t element) {
    const Element& e = layout.elements[element];
    std::vector<Path> paths;
    for (const ReportBeam& b : report.beams) paths.push_back(b.path);
    const ElementPose pose = element_poses(layout, paths)[element];
    const double normal_deg = std::atan2(pose.normal.y(), pose.normal.x()) * 180 / kPi;
    std::string text = e.id + " (" + type_name(e.kind) + ") at x " + mm_text(pose.at_mm.x()) + ", y " +
                       mm_text(pose.at_mm.y()) + " mm, normal " + format_number("%.1f", normal_deg) + "°, aperture " +
                       mm_text(e.aperture_mm) + " mm";
    for (const ReportBeam& b : report.beams)
        for (size_t k = 0; k < b.path.hits.size(); ++k) {
            if (b.path.hits[k].element != element) continue;
            text += "\n" + b.id + ": " + mm_text(b.path.hits[k].s_mm) + " mm from its start";
            if (k < b.caustic.at_hits.size())
                text += " · w " + format_number("%.1f", b.caustic.at_hits[k].radius_tangential_um) + " / " +
                        format_number("%.1f", b.caustic.at_hits[k].radius_sagittal_um) + " µm (t / s)";
            text += " · arrives " + format_duration_fs(arrival_time_fs(layout, b.path, k));
        }
    return text;
}

}  // namespace rv::scene
