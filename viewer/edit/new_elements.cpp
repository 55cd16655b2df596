#include "edit/new_elements.hpp"

#include <algorithm>
#include <set>

#include "layout/element_kinds.hpp"
#include "layout/visit.hpp"

namespace rv::edit {

namespace {

bool id_taken(const Layout& l, const std::string& id) {
    return std::any_of(l.elements.begin(), l.elements.end(), [&](const Element& e) { return e.id == id; }) ||
           std::any_of(l.beams.begin(), l.beams.end(), [&](const BeamSource& b) { return b.id == id; });
}

Element with(ElementKind kind, const std::string& stem, double normal_deg, double aperture_mm = kDefaultAperture_mm) {
    Element e;
    e.id = stem;
    e.kind = std::move(kind);
    e.normal_deg = normal_deg;
    e.aperture_mm = aperture_mm;
    return e;
}

// A wavelength the layout uses, for a wave plate's design and a dichroic's edge.
double first_wavelength_nm(const Layout& l) { return l.beams.empty() ? 800.0 : l.beams.front().wavelength_nm; }

Plate plate_of(Plate::Role role, const Layout& l) {
    Plate p;
    p.role = role;
    switch (role) {
        case Plate::Role::Window: p.slab = Slab{"fused-silica", 3.0}; break;
        case Plate::Role::HalfWave:
        case Plate::Role::QuarterWave:
            // An ideal (zero-order) plate for the first beam's colour on a 1 mm silica carrier.
            p.slab = Slab{"fused-silica", 1.0};
            p.design_nm = first_wavelength_nm(l);
            break;
        case Plate::Role::PolarizingCube: p.slab = Slab{"N-BK7", 12.7}; break;
        case Plate::Role::Polarizer: p.slab = Slab{"N-BK7", 2.0}; break;
    }
    return p;
}

// One function per kind: a kind added to ElementKind must say what the Add menu makes of it.
struct ChoicesOf {
    const Layout& l;
    std::vector<NewElementChoice> operator()(const Lens&) const {
        return {{"lens (thin, f 100 mm)", "lens", with(Lens{IdealLens{100.0}}, "L", 0)}};
    }
    std::vector<NewElementChoice> operator()(const Mirror&) const {
        Mirror curved;
        curved.radius_of_curvature_mm = 200.0;  // concave, f = R/2 = 100 mm
        return {{"mirror (flat)", "mirror", with(Mirror{}, "M", 135)},
                {"mirror (curved, R 200 mm)", "mirror", with(curved, "CM", 135)}};
    }
    std::vector<NewElementChoice> operator()(const Dichroic&) const {
        Dichroic d;
        // The edge between the first two colours when there are two, else above the first.
        const double a = first_wavelength_nm(l);
        const double b = l.beams.size() > 1 ? l.beams[1].wavelength_nm : a + 200;
        d.edge_nm = a == b ? a + 100 : (a + b) / 2;
        d.reflects_shorter = true;
        d.substrate = Slab{"fused-silica", 3.0};
        return {{"dichroic (reflects shorter)", "dichroic", with(d, "DM", 45)}};
    }
    std::vector<NewElementChoice> operator()(const Plate&) const {
        return {{"plate: window", "plate", with(plate_of(Plate::Role::Window, l), "W", 0)},
                {"plate: half-wave", "plate", with(plate_of(Plate::Role::HalfWave, l), "HWP", 0)},
                {"plate: quarter-wave", "plate", with(plate_of(Plate::Role::QuarterWave, l), "QWP", 0)},
                {"plate: polarizing cube", "plate", with(plate_of(Plate::Role::PolarizingCube, l), "PBS", 0, 12.7)},
                {"plate: polarizer", "plate", with(plate_of(Plate::Role::Polarizer, l), "POL", 0)}};
    }
    std::vector<NewElementChoice> operator()(const Retroreflector&) const {
        return {{"retroreflector", "retroreflector", with(Retroreflector{}, "RR", 180, 25.4)}};
    }
    std::vector<NewElementChoice> operator()(const Stage&) const { return {}; }  // new_stage
    std::vector<NewElementChoice> operator()(const Crystal&) const {
        Crystal c;
        c.material = "BBO";
        c.length_mm = 1.0;
        // Type I SHG of 800 nm in BBO phase-matches near 29.2° (from memory); the Inspector's
        // process buttons tune it for the layout's beams.
        c.cut_deg = 29.2;
        c.phase_matching = Crystal::PhaseMatching::TypeI;
        return {{"crystal (BBO, 1 mm)", "crystal", with(c, "X", 0, 10.0)}};
    }
    std::vector<NewElementChoice> operator()(const Target&) const {
        return {{"target plane", "target", with(Target{}, "T", 0)}};
    }
    std::vector<NewElementChoice> operator()(const Dump&) const {
        return {{"beam dump", "dump", with(Dump{}, "D", 180)}};
    }
};

}  // namespace

std::vector<NewElementChoice> new_element_choices(const Layout& layout) {
    std::vector<NewElementChoice> out;
    for (const std::string& type : element_type_names())
        for (NewElementChoice& c : std::visit(ChoicesOf{layout}, *element_kind_named(type))) out.push_back(std::move(c));
    return out;
}

Element new_stage(std::vector<std::string> carries) {
    Stage s;
    s.carries = std::move(carries);
    s.axis_deg = 0;
    s.position_mm = 0;
    s.travel_min_mm = 0;
    s.travel_max_mm = 25;
    return with(s, "S", 0);
}

Element new_catalog_lens(const CatalogLens& c) {
    Element e = with(c.lens, "L", 0, c.diameter_mm);
    std::get<Lens>(e.kind).part = c.id;
    return e;
}

BeamSource new_beam(const Layout& layout, const Vec2& at_mm) {
    std::set<double> used;
    for (const BeamSource& b : layout.beams) used.insert(b.wavelength_nm);
    double wavelength_nm = used.empty() ? 800.0 : *used.rbegin() + 100;
    for (double w : {800.0, 1030.0, 1064.0, 1550.0})
        if (!used.count(w)) {
            wavelength_nm = w;
            break;
        }
    BeamSource b;
    b.id = numbered_id(layout, "beam_");
    b.wavelength_nm = wavelength_nm;
    b.start_mm = at_mm;
    b.direction_deg = 0;
    b.waist_um = {1000, 1000};
    b.waist_at_mm = {0, 0};
    return b;
}

std::vector<std::string> carriable_ids(const Layout& layout) {
    std::set<std::string> carried;
    for (const Element& e : layout.elements)
        if (const auto* s = std::get_if<Stage>(&e.kind)) carried.insert(s->carries.begin(), s->carries.end());
    std::vector<std::string> out;
    for (const Element& e : layout.elements)
        if (!std::holds_alternative<Stage>(e.kind) && !carried.count(e.id)) out.push_back(e.id);
    return out;
}

std::string numbered_id(const Layout& layout, const std::string& stem) {
    for (int k = 1;; ++k)
        if (const std::string id = stem + std::to_string(k); !id_taken(layout, id)) return id;
}

std::string suffixed_id(const Layout& layout, const std::string& stem) {
    for (int k = 2;; ++k)
        if (const std::string id = stem + "_" + std::to_string(k); !id_taken(layout, id)) return id;
}

}  // namespace rv::edit
