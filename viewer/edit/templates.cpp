#include "edit/templates.hpp"

namespace rv::edit {

namespace {

// The centre of breadboard hole (column, row): holes sit in the middle of the grid squares
// (analysis/breadboard_holes.hpp), (k + 1/2) × grid.
Vec2 hole(const Table& t, int column, int row) {
    return {(column + 0.5) * t.grid_mm, (row + 0.5) * t.grid_mm};
}

BeamSource beam(const std::string& id, double wavelength_nm, Vec2 start_mm, double direction_deg) {
    BeamSource b;
    b.id = id;
    b.wavelength_nm = wavelength_nm;
    b.start_mm = start_mm;
    b.direction_deg = direction_deg;
    b.waist_um = {1000, 1000};  // a collimated 2 mm diameter beam, its waist at the start
    b.waist_at_mm = {0, 0};
    return b;
}

Element element(const std::string& id, Vec2 at_mm, double normal_deg, ElementKind kind) {
    Element e;
    e.id = id;
    e.at_mm = at_mm;
    e.normal_deg = normal_deg;
    e.kind = std::move(kind);
    return e;
}

}  // namespace

const std::vector<LayoutTemplate>& layout_templates() {
    static const std::vector<LayoutTemplate> list{
        {"One beam, metric breadboard (25 mm)", false, false},
        {"Two beams, metric breadboard (25 mm)", true, false},
        {"One beam, imperial breadboard (1 inch)", false, true},
        {"Two beams, imperial breadboard (1 inch)", true, true},
    };
    return list;
}

Layout layout_of(const LayoutTemplate& t) {
    Layout l;
    l.name = t.name;
    l.table.grid_mm = t.imperial ? 25.4 : 25.0;
    // 24 × 12 squares: 600 × 300 mm metric, 24 × 12 inch imperial.
    l.table.width_mm = 24 * l.table.grid_mm;
    l.table.height_mm = 12 * l.table.grid_mm;
    const int row = 5;                  // the beam line, on a row of holes
    const int lens = t.two_beams ? 14 : 8;
    const int focus = lens + 6;         // the lens's focal length is six squares
    const double f_mm = 6 * l.table.grid_mm;
    l.beams.push_back(beam("beam_1", 1030, hole(l.table, 0, row), 0));
    if (t.two_beams) {
        // The second colour comes down from the top edge onto the dichroic, which reflects it
        // (shorter than its 900 nm edge) along the first beam's line; the first passes through.
        const int dichroic = 8;
        l.beams.push_back(beam("beam_2", 780, hole(l.table, dichroic, 11), -90));
        Dichroic d;
        d.edge_nm = 900;
        d.reflects_shorter = true;
        d.substrate = Slab{"fused-silica", 3.0};
        // Normal at 45°: the coated face looks up and along +x, towards the arriving 780 nm.
        l.elements.push_back(element("DM", hole(l.table, dichroic, row), 45, d));
    }
    l.elements.push_back(element("L1", hole(l.table, lens, row), 0, Lens{IdealLens{f_mm}}));
    l.elements.push_back(element("T", hole(l.table, focus, row), 0, Target{}));
    l.elements.push_back(element("D1", hole(l.table, focus + 3, row), 180, Dump{}));
    l.target = "T";
    return l;
}

}  // namespace rv::edit
