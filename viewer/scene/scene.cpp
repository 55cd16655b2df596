#include "scene/scene.hpp"

#include "scene/beam_palette.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "report/verdict_words.hpp"
#include "analysis/breadboard_holes.hpp"
#include "polarization/polarization_model.hpp"
#include "layout/visit.hpp"
#include "trace/poses.hpp"
#include "units/constants.hpp"

namespace rv::scene {

namespace {


const Colour kOptic{70, 95, 140, 255};
const Colour kMirror{80, 80, 92, 255};
const Colour kText{30, 30, 40, 255};
const Colour kMarker{210, 30, 30, 255};
const Colour kTarget{230, 120, 0, 255};
const Colour kStage{120, 120, 130, 255};

Polyline line(std::vector<Vec2> pts, Colour c, double width, bool dashed = false) {
    return {std::move(pts), c, width, dashed, false, false, false};
}
Polyline box(const Vec2& centre, const Vec2& n, double depth, double half_width, Colour fill) {
    const Vec2 t = perpendicular(n);
    return {{centre + depth / 2 * n + half_width * t, centre + depth / 2 * n - half_width * t,
             centre - depth / 2 * n - half_width * t, centre - depth / 2 * n + half_width * t},
            fill, 0.3, false, true, true, false};
}
Polyline circle(const Vec2& c, double r, Colour col, double width) {
    Polyline p{{}, col, width, false, true, false, false};
    for (int i = 0; i < 32; ++i) {
        const double a = 2 * kPi * i / 32;
        p.points_mm.push_back(c + r * Vec2(std::cos(a), std::sin(a)));
    }
    return p;
}

void add_element(Scene& s, const Element& e, const ElementPose& pose) {
    const Vec2 at = pose.at_mm, n = pose.normal, t = perpendicular(n);
    const double a = e.aperture_mm / 2;
    struct Symbol {
        Scene& s;
        const Element& e;
        Vec2 at, n, t;
        double a;
        void operator()(const Lens& l) const {
            const double f = std::visit(overloaded{
                                            [](const IdealLens& i) { return i.focal_length_mm; },
                                            [](const ThinChromaticLens& c) { return c.focal_length_mm; },
                                            // the sign of the lensmaker's 1/R1 − 1/R2
                                            [](const ThickLens& k) { return 1 / k.front_radius_mm - 1 / k.back_radius_mm; },
                                        },
                                        l.model);
            s.shapes.push_back(line({at + a * t, at - a * t}, kOptic, 0.8));
            // Arrowheads: outward for a converging lens, inward for a diverging one.
            const double h = f > 0 ? 2.5 : -2.5;
            for (double side : {1.0, -1.0}) {
                const Vec2 tip = at + side * a * t;
                s.shapes.push_back(line({tip - side * h * t + 2.5 * n, tip, tip - side * h * t - 2.5 * n}, kOptic, 0.6));
            }
        }
        void operator()(const Mirror& m) const {
            s.shapes.push_back(line({at + a * t, at - a * t}, kMirror, m.radius_of_curvature_mm ? 1.6 : 1.2));
            s.shapes.push_back(line({at + a * t - 1.5 * n, at - a * t - 1.5 * n}, kMirror, 0.4, true));
        }
        void operator()(const Dichroic& d) const {
            s.shapes.push_back(box(at - d.substrate.thickness_mm / 2 * n, n, d.substrate.thickness_mm, a, {160, 205, 225, 255}));
            s.shapes.push_back(line({at + a * t, at - a * t}, {40, 120, 160, 255}, 0.6));
        }
        void operator()(const Plate& p) const {
            const Colour fill = p.role == Plate::Role::Window ? Colour{200, 220, 240, 255} : Colour{215, 200, 240, 255};
            s.shapes.push_back(box(at, n, std::max(p.slab.thickness_mm, 1.0), a, fill));
        }
        void operator()(const Retroreflector&) const {
            s.shapes.push_back(line({at + a * n + a * t, at, at + a * n - a * t}, kMirror, 1.0));
        }
        void operator()(const Stage&) const {}
        void operator()(const Crystal& c) const {
            s.shapes.push_back(box(at, n, c.length_mm, a, {250, 215, 150, 255}));
        }
        void operator()(const Target&) const {
            s.shapes.push_back(line({at + a * t, at - a * t}, kTarget, 0.5, true));
        }
        void operator()(const Dump&) const {
            s.shapes.push_back(box(at - 5 * n, n, 10, a, {45, 45, 50, 255}));
        }
    };
    const size_t first_shape = s.shapes.size();
    std::visit(Symbol{s, e, at, n, t, a}, e.kind);
    // The label keeps clear of the whole symbol: its farthest point from the centre.
    double reach_mm = 0;
    for (size_t k = first_shape; k < s.shapes.size(); ++k)
        for (const Vec2& p : s.shapes[k].points_mm) reach_mm = std::max(reach_mm, (p - at).norm());
    if (!std::holds_alternative<Stage>(e.kind)) s.labels.push_back({at + (a + 5) * t, e.id, kText, 5, at, reach_mm});
}

// The envelope of one beam: a strip ±w(s)·exaggeration about each straight segment.
void add_envelope(Scene& s, const ReportBeam& b, Colour colour, double exaggeration) {
    const std::vector<EnvelopeSample>& env = b.caustic.envelope;
    double s0 = 0;
    size_t k = 0;
    colour.a = 70;
    for (const TraceSegment& seg : b.path.segments) {
        const double s1 = s0 + seg.length_mm;
        if (seg.length_mm <= 0) continue;
        const Vec2 d = (seg.to_mm - seg.from_mm) / seg.length_mm, across = perpendicular(d);
        Polyline strip{{}, colour, 0, false, false, true, false};
        std::vector<Vec2> upper, lower;
        while (k < env.size() && env[k].s_mm < s0 - 1e-9) ++k;
        for (size_t j = k; j < env.size() && env[j].s_mm <= s1 + 1e-9; ++j) {
            const Vec2 c = seg.from_mm + (env[j].s_mm - s0) * d;
            const double half = um_to_mm(env[j].radius_tangential_um) * exaggeration;
            upper.push_back(c + half * across);
            lower.push_back(c - half * across);
        }
        if (upper.size() >= 2) {
            strip.points_mm = upper;
            strip.points_mm.insert(strip.points_mm.end(), lower.rbegin(), lower.rend());
            strip.closed = true;
            strip.band = true;
            s.shapes.push_back(std::move(strip));
        }
        s0 = s1;
    }
}

// A small mark of the polarization at a point of a beam seen from above, in its own ink
// (kPolarizationInk, used by no optic) and never a straight stroke, so it cannot be taken for a
// lens or a mirror: a zigzag across the beam for the part in the table plane (the field swinging
// side to side), a dot for the vertical part, a ring for circular light.
void add_glyph(Scene& s, const Vec2& at, const Vec2& direction, const Stokes& stokes) {
    const PolarizationState p = describe(stokes);
    if (!(p.power > 1e-6)) return;
    const Colour c = kPolarizationInk;
    if (!p.azimuth_deg || std::abs(p.ellipticity_deg) > 20) {  // unpolarized, circular or nearly
        s.shapes.push_back(circle(at, 4.0, c, 0.6));
        return;
    }
    const double psi = deg_to_rad(*p.azimuth_deg);
    const Vec2 across = perpendicular(direction);
    if (std::abs(std::cos(psi)) > 0.15) {
        const double h = 7.0 * std::abs(std::cos(psi));
        constexpr int kTeeth = 6;  // zigzag corners alternate ±1.2 mm along the beam
        Polyline zigzag = line({}, c, 0.6);
        for (int k = 0; k <= kTeeth; ++k)
            zigzag.points_mm.push_back(at + (-h + 2 * h * k / kTeeth) * across + (k % 2 ? 1.2 : -1.2) * direction);
        s.shapes.push_back(std::move(zigzag));
    }
    if (std::abs(std::sin(psi)) > 0.15) {
        Polyline dot = circle(at, 2.5 * std::abs(std::sin(psi)), c, 0.4);
        dot.filled = true;
        s.shapes.push_back(dot);
    }
}

// Glyphs after the start, after every wave plate, polarizer or cube, and before the target.
void add_polarization_glyphs(Scene& s, const Layout& layout, const ReportBeam& b) {
    const Path& path = b.path;
    if (path.segments.empty() || b.power.stokes_after_hit.size() != path.hits.size()) return;
    const BeamSource& src = layout.beams[path.beam];
    const Vec2 d0 = direction_deg(src.direction_deg);
    add_glyph(s, src.start_mm + 15.0 * d0, d0, source_stokes(src.polarization, src.polarized_fraction));
    for (size_t k = 0; k < path.hits.size(); ++k) {
        const auto* plate = std::get_if<Plate>(&layout.elements[path.hits[k].element].kind);
        const bool last_face = k + 1 >= path.hits.size() || path.hits[k + 1].element != path.hits[k].element;
        if (!plate || plate->role == Plate::Role::Window || !last_face) continue;
        add_glyph(s, path.hits[k].point_mm + 12.0 * path.hits[k].direction_out, path.hits[k].direction_out,
                  b.power.stokes_after_hit[k]);
    }
    if (path.target_hit && *path.target_hit > 0 && b.power.reached) {
        const TraceHit& t = path.hits[*path.target_hit];
        add_glyph(s, t.point_mm - 14.0 * t.direction_in, t.direction_in, b.power.at_target);
    }
}

// A stage's travel beside an optic it carries: a dashed line over the whole travel, a bar
// across it at the present position and, for the delay stage, a ring at the zero-delay position
// (in the marker's red when that lies outside the travel), labelled "0 fs".
void add_stage_travel(Scene& s, const Stage& st, const std::string& id, const Element& carried, const ElementPose& pose,
                      const StageReport* delay) {
    const Vec2 axis = direction_deg(st.axis_deg), side = perpendicular(axis);
    const Vec2 at = pose.at_mm + side * (carried.aperture_mm / 2 + 8);  // the present position
    auto along = [&](double position_mm) { return at + (position_mm - st.position_mm) * axis; };
    s.shapes.push_back(line({along(st.travel_min_mm), along(st.travel_max_mm)}, kStage, 0.6, true));
    s.shapes.push_back(line({at - 2.5 * side, at + 2.5 * side}, kStage, 0.8));
    const Vec2 middle = along((st.travel_min_mm + st.travel_max_mm) / 2);
    s.labels.push_back({middle + 3 * side, id, kStage, 4, middle, 1});
    if (!delay || !std::isfinite(delay->zero_delay_mm)) return;
    const Vec2 zero = along(delay->zero_delay_mm);
    const Colour ink = delay->zero_in_travel ? kStage : kMarker;
    s.shapes.push_back(circle(zero, 1.8, ink, 0.5));
    s.labels.push_back({zero - 4 * side, "0 fs", ink, 4, zero, 2.3});
}

std::string nm_text(double nm) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.0f nm", nm);
    return buf;
}

}  // namespace

Scene build_scene(const Layout& layout, const RendezvousReport& report, const SceneOptions& options) {
    Scene s;
    s.width_mm = layout.table.width_mm;
    s.height_mm = layout.table.height_mm;
    s.grid_mm = layout.table.grid_mm;
    s.title = layout.name;
    s.envelope_exaggeration = options.envelope_exaggeration;
    if (s.envelope_exaggeration <= 0) {
        double widest_mm = 1e-3;
        for (const ReportBeam& b : report.beams)
            for (const EnvelopeSample& e : b.caustic.envelope) widest_mm = std::max(widest_mm, e.radius_tangential_um * 1e-3);
        const double want = 0.04 * std::min(s.width_mm, s.height_mm) / widest_mm;
        s.envelope_exaggeration = 1;
        for (double f : {1.0, 2.0, 5.0, 10.0, 20.0, 50.0, 100.0, 200.0, 500.0})
            if (f <= want) s.envelope_exaggeration = f;
    }
    if (options.holes) {  // the first hole half a pitch from the edge (common practice)
        // Counted first (analysis/breadboard_holes, the build sheet's grid), then listed.
        const HoleGrid grid = hole_grid(layout.table);
        const long long count = static_cast<long long>(grid.columns) * grid.rows;
        if (count > kMaxDrawnHoles) {
            s.holes_not_drawn = count;
        } else {
            s.holes_mm.reserve(static_cast<size_t>(count));
            for (int c = 0; c < grid.columns; ++c)
                for (int r = 0; r < grid.rows; ++r) s.holes_mm.push_back(hole_centre_mm(grid, c, r));
        }
    }

    std::vector<Path> paths;
    for (const ReportBeam& b : report.beams) paths.push_back(b.path);
    const std::vector<ElementPose> poses = element_poses(layout, paths);
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        const Element& e = layout.elements[i];
        if (const auto* st = std::get_if<Stage>(&e.kind)) {
            const StageReport* delay = report.stage && report.stage->id == e.id ? &*report.stage : nullptr;
            for (const std::string& id : st->carries)
                if (const Element* carried = layout.find(id))
                    add_stage_travel(s, *st, e.id, *carried, poses[static_cast<size_t>(carried - layout.elements.data())], delay);
            continue;
        }
        add_element(s, e, poses[i]);
    }
    if (const Element* t = layout.find(layout.target))
        for (size_t i = 0; i < layout.elements.size(); ++i)
            if (&layout.elements[i] == t) s.shapes.push_back(circle(poses[i].at_mm, t->aperture_mm / 2 + 4, kTarget, 0.6));

    // Colours at least kMinBeamDeltaE76 apart (beam_palette.hpp), the plots' too.
    const std::vector<BeamStyle> styles = report_beam_styles(report);
    for (size_t k = 0; k < report.beams.size(); ++k)
        add_envelope(s, report.beams[k], styles[k].colour, s.envelope_exaggeration);
    for (size_t k = 0; k < report.beams.size(); ++k) {
        const ReportBeam& b = report.beams[k];
        const BeamStyle style = styles[k];
        Polyline ray{{}, style.colour, 0.7, !style.visible, false, false, false};
        for (const TraceSegment& seg : b.path.segments) {
            if (ray.points_mm.empty() || (ray.points_mm.back() - seg.from_mm).norm() > 1e-9) {
                if (ray.points_mm.size() >= 2) s.shapes.push_back(ray);
                ray.points_mm = {seg.from_mm};
            }
            ray.points_mm.push_back(seg.to_mm);
        }
        if (ray.points_mm.size() >= 2) s.shapes.push_back(ray);
        // Beams a polarizing cube reflects, thinner, to where they end.
        for (const PowerLoss& loss : b.power.losses)
            if (loss.branch_mm.size() >= 2 && loss.fraction > 1e-3)
                s.shapes.push_back(Polyline{loss.branch_mm, style.colour, 0.4, true, false, false, false});
        add_polarization_glyphs(s, layout, b);
        s.legend.push_back({nm_text(b.wavelength_nm) + " " + b.id + (style.visible ? "" : " (invisible, dashed)"),
                            style.colour, !style.visible});
        for (const Finding& f : b.path.findings)
            if (f.kind == Finding::Kind::LeftTable || f.kind == Finding::Kind::MissedOptic ||
                f.kind == Finding::Kind::HitBackOfOptic || f.kind == Finding::Kind::TotalInternalReflection) {
                s.shapes.push_back(circle(f.where_mm, 6, kMarker, 0.8));
                s.labels.push_back({f.where_mm + Vec2(7, 7), "!", kMarker, 6, f.where_mm, 6.5});
            }
    }
    if (!report.beams.empty())
        s.legend.push_back({"polarization: zigzag = in the table plane, dot = vertical, ring = circular", kPolarizationInk, false});
    size_t generated = report.beams.size();
    for (const PhaseMatchingReport& p : report.phase_matching)
        if (legend_lists_generated(report, p)) {
            const BeamStyle& style = styles[generated++];
            s.legend.push_back({nm_text(p.output_nm) + " generated (" + process_beams_text(p.beams) + ")", style.colour, !style.visible});
        }
    return s;
}

}  // namespace rv::scene
