#include "trace/propagate.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <tuple>

#include "layout/visit.hpp"
#include "optics/thick_lens.hpp"
#include "units/clamped_int.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {

// The matrix of one hit in one plane (lens matrices are the same in both).
RayMatrix hit_matrix(const Layout& layout, const TraceHit& hit, Plane plane) {
    const Element& e = layout.elements[hit.element];
    switch (hit.interaction) {
        case Interaction::ThinLens: {
            const Lens& lens = std::get<Lens>(e.kind);
            const auto thin = [&](const auto&) { return thin_lens(hit.focal_length_mm); };
            return std::visit(
                overloaded{[&](const IdealLens& l) { return thin(l); }, [&](const ThinChromaticLens& l) { return thin(l); },
                           [&](const ThickLens& t) {
                               // The singlet's own matrix between its vertices, referred to its centre plane.
                               const double n = hit.lens_index;
                               const Vec2 normal = direction_deg(e.normal_deg);
                               ThickSinglet shape{t.front_radius_mm, t.back_radius_mm, t.center_thickness_mm};
                               if (hit.direction_in.dot(normal) < 0)  // met from the back: faces reversed
                                   shape = {-t.back_radius_mm, -t.front_radius_mm, t.center_thickness_mm};
                               const RayMatrix half_back = free_space(-t.center_thickness_mm / 2);
                               return RayMatrix(half_back * thick_singlet_matrix(shape, n) * half_back);
                           }},
                lens.model);
        }
        case Interaction::Reflect:
            if (const auto* m = std::get_if<Mirror>(&e.kind); m && m->radius_of_curvature_mm)
                return spherical_mirror_at_cos(*m->radius_of_curvature_mm, hit.cos_aoi, plane);
            return RayMatrix::Identity();
        case Interaction::Refract:
            return tilted_interface(hit.index_before, hit.index_after, hit.cos_aoi, hit.sin_aoi, plane);
        case Interaction::Retroreflect:  // the apex fold: a plane mirror pair, no power
        case Interaction::TargetPlane:
        case Interaction::Absorb:
            return RayMatrix::Identity();
    }
    return RayMatrix::Identity();
}

double clipped_fraction(const TraceHit& hit, double w_t_um, double w_s_um) {
    if (hit.interaction == Interaction::TargetPlane || hit.interaction == Interaction::Absorb)
        return 0;
    const double a_mm = std::max(0.0, hit.half_aperture_mm - std::abs(hit.height_mm));
    const double at = a_mm * hit.cos_aoi * 1e3 / w_t_um;
    const double as = a_mm * 1e3 / w_s_um;
    return std::exp(-2.0 * std::min(at * at, as * as));
}

bool has_power(const Layout& layout, const TraceHit& hit) {
    if (hit.interaction == Interaction::ThinLens) return true;
    if (hit.interaction != Interaction::Reflect) return false;
    const auto* m = std::get_if<Mirror>(&layout.elements[hit.element].kind);
    return m && m->radius_of_curvature_mm;
}

// Signed path distance from hit k (the target plane, identity matrix) to the real waist.
// `arriving[i]`: the beams (tangential, sagittal) arriving at hit i before its matrix, i < k
// (a waist upstream is looked for in them, as the forward propagation found them).
double locate_waist_mm(const Layout& layout, const Path& path, size_t k, GaussianBeam q, Plane plane,
                       const std::vector<TargetPropagationMemo::Beams>& arriving) {
    const GaussianBeam at_target = q;
    double d = distance_to_waist_mm(q);
    double travelled = 0;
    if (d >= 0) {
        for (size_t i = k; i + 1 < path.hits.size(); ++i) {
            const double gap = path.hits[i + 1].s_mm - path.hits[i].s_mm;
            if (d <= gap || has_power(layout, path.hits[i + 1])) break;
            q = translate(q, gap);
            q = propagate(q, hit_matrix(layout, path.hits[i + 1], plane),
                          path.hits[i + 1].index_after);
            travelled += gap;
            d = distance_to_waist_mm(q);
        }
        return travelled + d;
    }
    q = at_target;
    for (size_t i = k; i > 0; --i) {
        const double gap = path.hits[i].s_mm - path.hits[i - 1].s_mm;
        if (-d <= gap || has_power(layout, path.hits[i - 1])) break;
        q = plane == Plane::Tangential ? arriving[i - 1].first : arriving[i - 1].second;  // before hit i − 1
        travelled += gap;
        d = distance_to_waist_mm(q);
    }
    return d - travelled;
}

// The source's beams in both planes, at the start of the path.
void source_beams(const BeamSource& src, GaussianBeam& t, GaussianBeam& s) {
    t = beam_from_waist({.waist_um = src.waist_um.tangential,
                         .distance_to_waist_mm = src.waist_at_mm.tangential,
                         .wavelength_nm = src.wavelength_nm,
                         .index = 1.0,
                         .m2 = src.m2.tangential});
    s = beam_from_waist({.waist_um = src.waist_um.sagittal,
                         .distance_to_waist_mm = src.waist_at_mm.sagittal,
                         .wavelength_nm = src.wavelength_nm,
                         .index = 1.0,
                         .m2 = src.m2.sagittal});
}

// Both planes through one hit's matrices, into the medium after it.
void cross_hit(const Layout& layout, const TraceHit& hit, GaussianBeam& t, GaussianBeam& s) {
    if (hit.interaction != Interaction::ThinLens && hit.interaction != Interaction::Refract && !has_power(layout, hit)) {
        t.index = s.index = hit.index_after;  // an identity matrix: q unchanged
        return;
    }
    const RayMatrix mt = hit_matrix(layout, hit, Plane::Tangential);
    const RayMatrix ms = hit.interaction == Interaction::ThinLens ? mt : hit_matrix(layout, hit, Plane::Sagittal);
    t = propagate(t, mt, hit.index_after);
    s = propagate(s, ms, hit.index_after);
}

}  // namespace

BeamsAtTargetPlane propagate_to_target(const Layout& layout, const Path& path, TargetPropagationMemo* memo,
                                       size_t unchanged_hits) {
    BeamsAtTargetPlane out;
    TargetPropagationMemo local;
    TargetPropagationMemo& m = memo ? *memo : local;
    if (!memo) unchanged_hits = 0;
    if (!path.target_hit) {
        m.after_hit.clear();  // it must follow this path, whose hits it never saw
        m.arriving.clear();
        return out;
    }
    const size_t k = *path.target_hit;
    GaussianBeam t{}, s{};
    size_t first = 0;  // the segment to start from, with (t, s) at its start
    if (unchanged_hits > 0 && !m.after_hit.empty()) {
        first = std::min({unchanged_hits, m.after_hit.size(), k});
        if (first > 0) std::tie(t, s) = m.after_hit[first - 1];
    }
    if (first == 0) source_beams(layout.beams[path.beam], t, s);
    m.after_hit.resize(first);
    m.arriving.resize(first);
    for (size_t i = first; i <= k && i < path.segments.size(); ++i) {
        const TraceSegment& seg = path.segments[i];
        t.index = seg.index;
        s.index = seg.index;
        t = translate(t, seg.length_mm);
        s = translate(s, seg.length_mm);
        if (i == k) {
            out.reached = true;
            break;
        }
        m.arriving.emplace_back(t, s);
        cross_hit(layout, path.hits[i], t, s);
        m.after_hit.emplace_back(t, s);
    }
    if (!out.reached) return out;
    out.tangential = t;
    out.sagittal = s;
    out.waist_offset_tangential_mm = locate_waist_mm(layout, path, k, t, Plane::Tangential, m.arriving);
    out.waist_offset_sagittal_mm = locate_waist_mm(layout, path, k, s, Plane::Sagittal, m.arriving);
    return out;
}

Caustic propagate_path(const Layout& layout, const Path& path, const PropagationOptions& options) {
    const BeamSource& src = layout.beams[path.beam];
    Caustic out;
    out.beam = path.beam;
    GaussianBeam t{}, s{};
    source_beams(src, t, s);
    double s0 = 0;
    const double target_s = path.target_hit ? path.hits[*path.target_hit].s_mm : -1;

    // A beam whose q (or radius) stops being a finite number — an overflow or a 0/0 from the
    // numbers of one optic, say a focal length of 1e-320 mm — is given no further figure: one
    // finding NotFinite names the element where it happened, and every later radius stays NaN,
    // which every writer prints as "n/a" and never as a number (issue 19 §1).
    bool lost = false;
    auto check_finite = [&](const GaussianBeam& bt, const GaussianBeam& bs, const TraceHit& hit) {
        if (lost) return;
        const bool finite = std::isfinite(bt.q_mm.real()) && std::isfinite(bt.q_mm.imag()) &&
                            std::isfinite(bs.q_mm.real()) && std::isfinite(bs.q_mm.imag()) &&
                            std::isfinite(radius_um(bt)) && std::isfinite(radius_um(bs));
        if (finite) return;
        lost = true;
        Finding& f = out.findings.emplace_back();
        f.kind = Finding::Kind::NotFinite;
        f.element = layout.elements[hit.element].id;
        f.where_mm = hit.point_mm;
    };

    // Samples along one segment starting at s0 with the beams (bt, bs) at its start.
    auto sample_segment = [&](const GaussianBeam& bt, const GaussianBeam& bs, double length) {
        if (lost || !options.sample_envelope || !(length >= 0) || !std::isfinite(length)) return;
        const int n = clamped_int(length / options.envelope_step_mm, 1, 400);
        for (int i = 0; i <= n; ++i) {
            const double z = length * i / n;
            const EnvelopeSample e{s0 + z, radius_um(translate(bt, z)), radius_um(translate(bs, z))};
            if (std::isfinite(e.radius_tangential_um) && std::isfinite(e.radius_sagittal_um)) out.envelope.push_back(e);
        }
    };

    struct SegmentStart {
        double s_mm, length_mm;
        GaussianBeam t, s;
    };
    std::vector<SegmentStart> segment_starts;
    std::vector<TargetPropagationMemo::Beams> arriving;  // at each hit, for the waist search
    for (size_t i = 0; i < path.segments.size(); ++i) {
        const TraceSegment& seg = path.segments[i];
        t.index = seg.index;
        s.index = seg.index;
        sample_segment(t, s, seg.length_mm);
        if (options.sample_envelope && !lost) segment_starts.push_back({s0, seg.length_mm, t, s});
        t = translate(t, seg.length_mm);
        s = translate(s, seg.length_mm);
        s0 += seg.length_mm;
        if (i >= path.hits.size()) break;  // the trailing segment to the table edge
        const TraceHit& hit = path.hits[i];
        check_finite(t, s, hit);  // arriving: a translation that overflowed
        const double nan = std::numeric_limits<double>::quiet_NaN();
        BeamAtHit at{hit.s_mm, lost ? nan : radius_um(t), lost ? nan : radius_um(s), 0};
        if (!lost) at.clipped_fraction = clipped_fraction(hit, at.radius_tangential_um, at.radius_sagittal_um);
        if (at.clipped_fraction > options.clipping_warning_fraction) {
            // One finding per optic (a slab's two faces clip alike): the larger loss.
            const std::string& id = layout.elements[hit.element].id;
            Finding* f = nullptr;
            for (Finding& g : out.findings)
                if (g.kind == Finding::Kind::Clipping && g.element == id) f = &g;
            if (!f) {
                f = &out.findings.emplace_back();
                f->kind = Finding::Kind::Clipping;
                f->element = id;
            }
            if (at.clipped_fraction > f->amount) {
                f->where_mm = hit.point_mm;
                f->amount = at.clipped_fraction;
            }
        }
        out.at_hits.push_back(at);
        arriving.emplace_back(t, s);
        if (path.target_hit && *path.target_hit == i && !lost) {
            out.reaches_target = true;
            out.target_tangential = t;
            out.target_sagittal = s;
        }
        cross_hit(layout, hit, t, s);
        check_finite(t, s, hit);  // leaving: the optic's own numbers
    }

    if (out.reaches_target) {
        const size_t k = *path.target_hit;
        out.target_waist_offset_tangential_mm =
            locate_waist_mm(layout, path, k, out.target_tangential, Plane::Tangential, arriving);
        out.target_waist_offset_sagittal_mm = locate_waist_mm(layout, path, k, out.target_sagittal, Plane::Sagittal, arriving);
    }

    // Denser samples around the target: `samples_near_target` points over ±3 Rayleigh ranges,
    // taken from the state at the start of each segment that overlaps that window (so the
    // samples follow the beam through the crystal's faces and any other element there).
    // Counted first, then stepped: sample k stands at lo + k·step, and each segment takes the
    // indices that fall in it, so there are at most samples_near_target + (segments) of them
    // whatever the Rayleigh range. (Stepping x += step never ended when a Rayleigh range near
    // 1e-13 mm put the step below the spacing of doubles at the target: issue 19.)
    if (out.reaches_target && options.sample_envelope) {
        const double zr = std::min(rayleigh_range_mm(out.target_tangential), rayleigh_range_mm(out.target_sagittal));
        const double lo = target_s - 3 * zr, hi = target_s + 3 * zr;
        const int n = std::max(options.samples_near_target, 2);
        const double step = (hi - lo) / (n - 1);
        if (std::isfinite(lo) && std::isfinite(hi) && step > 0)
            for (const SegmentStart& seg : segment_starts) {
                const double a = std::max(lo, seg.s_mm), b = std::min(hi, seg.s_mm + seg.length_mm);
                if (!(a <= b)) continue;
                const int first = clamped_int(std::ceil((a - lo) / step), 0, n);
                const int last = clamped_int(std::floor((b - lo) / step), -1, n - 1);
                for (int k = first; k <= last; ++k) {
                    const double x = lo + k * step, z = x - seg.s_mm;
                    const EnvelopeSample e{x, radius_um(translate(seg.t, z)), radius_um(translate(seg.s, z))};
                    if (std::isfinite(e.radius_tangential_um) && std::isfinite(e.radius_sagittal_um))
                        out.envelope.push_back(e);
                }
            }
        std::stable_sort(out.envelope.begin(), out.envelope.end(),
                         [](const EnvelopeSample& a, const EnvelopeSample& b) { return a.s_mm < b.s_mm; });
    }
    return out;
}

}  // namespace rv
