#include "analysis/parts_list.hpp"

#include <cmath>

#include "layout/visit.hpp"

namespace rv {

namespace {

SpecField number(const char* name, double value, const char* unit) {
    return {name, value, unit, ""};
}
SpecField word(const char* name, std::string text) {
    return {name, std::nullopt, "", std::move(text)};
}
// A surface radius: a number, or the word "flat" for an infinite one (never infinity itself).
SpecField radius(const char* name, double r_mm) {
    return std::isfinite(r_mm) ? number(name, r_mm, "mm") : word(name, "flat");
}

struct SpecOf {
    PartSpec& spec;
    void add(SpecField f) const { spec.fields.push_back(std::move(f)); }

    void operator()(const Lens& lens) const {
        spec.part = lens.part;
        std::visit(overloaded{
                       [&](const IdealLens& i) {
                           spec.kind = "ideal thin lens";
                           add(number("focal_length", i.focal_length_mm, "mm"));
                       },
                       [&](const ThinChromaticLens& c) {
                           spec.kind = "thin lens";
                           add(number("focal_length", c.focal_length_mm, "mm"));
                           add(word("glass", c.glass));
                           add(number("design_wavelength", c.design_wavelength_nm, "nm"));
                       },
                       [&](const ThickLens& t) {
                           spec.kind = "singlet lens";
                           if (t.shape) {
                               add(word("shape", *t.shape));
                               add(number("focal_length", t.focal_length_mm, "mm"));
                               add(number("design_wavelength", t.design_wavelength_nm, "nm"));
                           } else {
                               add(radius("front_radius", t.front_radius_mm));
                               add(radius("back_radius", t.back_radius_mm));
                           }
                           add(number("center_thickness", t.center_thickness_mm, "mm"));
                           add(word("glass", t.glass));
                       },
                   },
                   lens.model);
    }
    void operator()(const Mirror& m) const {
        spec.kind = m.radius_of_curvature_mm ? "curved mirror" : "flat mirror";
        if (m.radius_of_curvature_mm) add(radius("radius_of_curvature", *m.radius_of_curvature_mm));
        if (m.retardance_deg != 0) add(number("coating_retardance", m.retardance_deg, "deg"));
    }
    void operator()(const Dichroic& d) const {
        spec.kind = "dichroic mirror";
        add(number("edge", d.edge_nm, "nm"));
        add(word("reflects", d.reflects_shorter ? "shorter" : "longer"));
        add(word("substrate", d.substrate.material));
        add(number("thickness", d.substrate.thickness_mm, "mm"));
        if (d.retardance_deg != 0) add(number("coating_retardance", d.retardance_deg, "deg"));
    }
    void operator()(const Plate& p) const {
        switch (p.role) {
            case Plate::Role::Window:
                spec.kind = "window";
                break;
            case Plate::Role::HalfWave:
                spec.kind = "half-wave plate";
                break;
            case Plate::Role::QuarterWave:
                spec.kind = "quarter-wave plate";
                break;
            case Plate::Role::PolarizingCube:
                spec.kind = "polarizing cube";
                break;
            case Plate::Role::Polarizer:
                spec.kind = "polarizer";
                break;
        }
        add(word("material", p.slab.material));
        add(number("thickness", p.slab.thickness_mm, "mm"));
        const bool wave = p.role == Plate::Role::HalfWave || p.role == Plate::Role::QuarterWave;
        if (wave) {
            if (p.design_nm) add(number("design_wavelength", *p.design_nm, "nm"));
            if (p.retarder_material) add(word("retarder", *p.retarder_material));
            if (p.order != 0) add(number("order", p.order, ""));
            if (p.retarder_thickness_um) add(number("retarder_thickness", *p.retarder_thickness_um, "um"));
        }
        if (p.role == Plate::Role::PolarizingCube || p.role == Plate::Role::Polarizer)
            add(number("extinction_ratio", p.extinction_ratio, ""));
    }
    void operator()(const Retroreflector&) const { spec.kind = "retroreflector"; }
    void operator()(const Stage& s) const {
        spec.kind = "translation stage";
        add(number("travel", s.travel_max_mm - s.travel_min_mm, "mm"));
    }
    void operator()(const Crystal& c) const {
        spec.kind = "nonlinear crystal";
        add(word("material", c.material));
        add(number("length", c.length_mm, "mm"));
        add(number("cut", c.cut_deg, "deg"));
        add(word("phase_matching",
                 c.phase_matching == Crystal::PhaseMatching::TypeI ? "type I" : "type II"));
    }
    void operator()(const Target&) const { spec.kind = "target mount"; }
    void operator()(const Dump&) const { spec.kind = "beam dump"; }
};

}  // namespace

PartSpec part_spec(const Element& element) {
    PartSpec spec;
    std::visit(SpecOf{spec}, element.kind);
    // A stage has no optical aperture; every other part is given by its aperture (a lens's
    // diameter, a cube's side).
    if (!std::holds_alternative<Stage>(element.kind))
        spec.fields.push_back(number("aperture", element.aperture_mm, "mm"));
    if (element.transmission != 1.0)
        spec.fields.push_back(number("transmission", element.transmission, ""));
    return spec;
}

std::vector<PartGroup> group_parts(const Layout& layout) {
    std::vector<PartGroup> groups;
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        PartSpec spec = part_spec(layout.elements[i]);
        bool placed = false;
        for (PartGroup& g : groups)
            if (g.spec == spec) {
                g.elements.push_back(i);
                placed = true;
                break;
            }
        if (!placed) groups.push_back({std::move(spec), {i}});
    }
    return groups;
}

}  // namespace rv
