#include "analysis/power_budget.hpp"

#include <cmath>
#include <sstream>

#include "layout/visit.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {

bool entering_slab(const TraceHit& h) { return h.interaction == Interaction::Refract && h.index_before == 1.0; }

struct Followed {
    std::string where;
    bool leaves_table = false;
    Vec2 exit_mm{0, 0};  // where it leaves the table
    std::vector<Vec2> points_mm;
};

// Where a beam leaving `from` along `direction` ends: traced as a beam of its own.
Followed follow(const Layout& layout, const MaterialLibrary& library, size_t beam, const Vec2& from,
                const Vec2& direction) {
    Layout l = layout;
    BeamSource b = layout.beams[beam];
    b.start_mm = from;
    b.direction_deg = rad_to_deg(std::atan2(direction.y(), direction.x()));
    l.beams = {b};
    const Path p = trace_layout(l, library).front();
    std::vector<Vec2> points{from};
    for (const TraceSegment& s : p.segments) points.push_back(s.to_mm);
    for (const Finding& f : p.findings)
        if (f.kind == Finding::Kind::LeftTable) {
            std::ostringstream s;
            s.setf(std::ios::fixed);
            s.precision(0);
            s << "leaves the table at (" << f.where_mm.x() << ", " << f.where_mm.y() << ") mm";
            if (!p.hits.empty()) s << " after " << l.elements[p.hits.back().element].id;
            return {s.str(), true, f.where_mm, points};
        }
    if (!p.hits.empty()) {
        const Element& last = l.elements[p.hits.back().element];
        return {std::string(std::holds_alternative<Dump>(last.kind) ? "into " : "stops at ") + last.id +
                    (std::holds_alternative<Dump>(last.kind) ? " (dump)" : ""),
                false, {0, 0}, points};
    }
    return {"goes nowhere traced", false, {0, 0}, points};
}

struct Options {
    std::optional<std::pair<size_t, double>> plate_override;  // element, fast axis (deg)
    bool follow_branches = true;
};

BeamPower run(const Layout& layout, const MaterialLibrary& library, const Path& path, const Caustic& caustic,
              const Options& options) {
    BeamPower out;
    const BeamSource& src = layout.beams[path.beam];
    Stokes s = source_stokes(src.polarization, src.polarized_fraction);
    const double nm = src.wavelength_nm;
    auto lose = [&](const std::string& element, const std::string& what, double fraction) {
        if (fraction > 1e-12) out.losses.push_back({element, what, fraction, "", false, {}});
    };
    for (size_t i = 0; i < path.hits.size(); ++i) {
        const TraceHit& h = path.hits[i];
        const Element& e = layout.elements[h.element];
        if (path.target_hit && *path.target_hit == i) {
            out.reached = true;
            out.at_target = s;
        }
        // A slab acts once per pass, where it is entered (its other face and a crystal's centre
        // plane do nothing); its aperture clips there too, before the element acts.
        const bool slab_face = h.interaction == Interaction::Refract;
        const bool crystal_centre = h.face == Face::Centre;
        const bool acts = (!slab_face || entering_slab(h)) && !crystal_centre;
        if (acts && i < caustic.at_hits.size()) {
            const double clipped = caustic.at_hits[i].clipped_fraction;
            if (clipped > 0) {
                lose(e.id, "clipped at its aperture", s[0] * clipped);
                s *= 1 - clipped;
            }
        }
        if (acts) {
            const double before = s[0];
            // What the element does to the polarization where it acts, one function per kind
            // (a visit: a new kind must say). Reflections carry the coating's s − p phase.
            const auto reflection = [&](double retardance_deg) -> Mueller {
                if (h.interaction != Interaction::Reflect) return Mueller::Identity();
                return mueller_from_jones(mirror_jones(deg_to_rad(retardance_deg)));
            };
            const Mueller m = std::visit(
                overloaded{
                    [&](const Plate& plate) -> Mueller {
                        Mueller effect = Mueller::Identity();
                        double axis_deg = plate.fast_axis_deg;
                        if (options.plate_override && options.plate_override->first == h.element)
                            axis_deg = options.plate_override->second;
                        if (const auto waves = retardance_waves(plate, nm, library)) {
                            effect = mueller_from_jones(retarder_jones(2 * kPi * *waves, deg_to_rad(axis_deg)));
                            out.plates.push_back({h.element, e.id, *waves, axis_deg});
                        } else if (plate.role == Plate::Role::Polarizer) {
                            effect = mueller_from_jones(polarizer_jones(plate.extinction_ratio, deg_to_rad(axis_deg)));
                        } else if (plate.role == Plate::Role::PolarizingCube) {
                            effect = mueller_from_jones(polarizer_jones(plate.extinction_ratio, 0));
                            JonesMatrix r = JonesMatrix::Zero();
                            r(1, 1) = std::sqrt(1 - 1 / plate.extinction_ratio);
                            const Stokes reflected = mueller_from_jones(r) * s;
                            // The reflected beam leaves the cube's diagonal, 90° to the side of travel.
                            const Vec2 side = plate.reflects_left ? perpendicular(h.direction_in) : Vec2(-perpendicular(h.direction_in));
                            const Vec2 centre = i + 1 < path.hits.size() && path.hits[i + 1].element == h.element
                                                    ? Vec2((h.point_mm + path.hits[i + 1].point_mm) / 2)
                                                    : h.point_mm;
                            PowerLoss loss{e.id, "reflected by the cube", reflected[0] * e.transmission, "", false, {}};
                            lose(e.id, "coating loss (reflected port)", reflected[0] * (1 - e.transmission));
                            if (options.follow_branches) {
                                Followed f = follow(layout, library, path.beam, centre + 1e-3 * side, side);
                                loss.goes_to = f.where;
                                loss.leaves_table = f.leaves_table;
                                loss.exit_mm = f.exit_mm;
                                loss.branch_mm = std::move(f.points_mm);
                            }
                            if (loss.fraction > 1e-12) out.losses.push_back(loss);
                        }
                        return effect;
                    },
                    [&](const Mirror& mirror) { return reflection(mirror.retardance_deg); },
                    [&](const Dichroic& dichroic) { return reflection(dichroic.retardance_deg); },
                    // Unchanged in this model: a lens, a crystal (its own waves come from
                    // analysis/crystal_waves.hpp), a corner cube (no coating phase modelled), and
                    // what marks or stops the beam.
                    [](const Lens&) -> Mueller { return Mueller::Identity(); },
                    [](const Retroreflector&) -> Mueller { return Mueller::Identity(); },
                    [](const Crystal&) -> Mueller { return Mueller::Identity(); },
                    [](const Target&) -> Mueller { return Mueller::Identity(); },
                    [](const Dump&) -> Mueller { return Mueller::Identity(); },
                    [](const Stage&) -> Mueller { return Mueller::Identity(); },
                },
                e.kind);
            s = m * s;
            const double after_element = s[0];
            if (const auto* plate = std::get_if<Plate>(&e.kind); plate && plate->role == Plate::Role::Polarizer)
                lose(e.id, "blocked by the polarizer", before - after_element);
            // (a cube's reflected part is its own loss entry above; before − after is that part)
            s *= e.transmission;
            lose(e.id, "coating loss", after_element * (1 - e.transmission));
        }
        if (h.interaction == Interaction::Absorb) {
            lose(e.id, "absorbed in the dump", s[0]);
            s.setZero();
        }
        out.fraction_after_hit.push_back(s[0]);
        out.stokes_after_hit.push_back(s);
    }
    out.end_fraction = s[0];
    return out;
}

}  // namespace

BeamPower trace_power(const Layout& layout, const MaterialLibrary& library, const Path& path, const Caustic& caustic) {
    return run(layout, library, path, caustic, {});
}

Stokes target_stokes(const Layout& layout, const MaterialLibrary& library, const Path& path, const Caustic& caustic) {
    Options o;
    o.follow_branches = false;
    return run(layout, library, path, caustic, o).at_target;
}

Stokes target_stokes_with_plate(const Layout& layout, const MaterialLibrary& library, const Path& path,
                                const Caustic& caustic, size_t plate, double fast_axis_deg) {
    Options o;
    o.plate_override = std::make_pair(plate, fast_axis_deg);
    o.follow_branches = false;
    return run(layout, library, path, caustic, o).at_target;
}

}  // namespace rv
