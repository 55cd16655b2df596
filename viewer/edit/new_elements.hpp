#pragma once
// What the window's Add menu makes: for every element kind its choices with defaults the reader
// accepts (a thin lens, a flat and a curved mirror, a plate of each role, …), a thick singlet
// from the lens catalog, a stage carrying chosen optics, and a beam. The choices of the kinds
// come from one std::visit over ElementKind (no catch-all): a new kind without its Add entry
// does not compile. No ImGui.
#include <optional>
#include <string>
#include <vector>

#include "io/lens_catalog.hpp"
#include "layout/layout.hpp"

namespace rv::edit {

struct NewElementChoice {
    std::string label;    // the menu's words: "mirror (curved, R 200 mm)"
    std::string type;     // the kind's file name: "mirror"
    Element element;      // defaults; its id is the stem a number is appended to
};

// Every kind's choices, in ElementKind's order. A stage's choice carries nothing yet: it is
// offered through new_stage, once the user has chosen what it carries.
std::vector<NewElementChoice> new_element_choices(const Layout& layout);

// A stage carrying `carries` (element ids), its axis along the first one's beam direction is not
// known here: along +x, at 0 in a 0 to 25 mm travel.
Element new_stage(std::vector<std::string> carries);

// A lens element from a catalog entry (its model, its part id, its clear aperture).
Element new_catalog_lens(const CatalogLens& lens);

// A beam starting at `at_mm` along +x: 1 mm waist radius at its start, at a wavelength none of
// the layout's beams has (800 nm, else 1030, 1064, 1550 nm, else 100 nm above the longest).
BeamSource new_beam(const Layout& layout, const Vec2& at_mm);

// The optics a new stage may carry: every element that is no stage and no stage carries yet.
std::vector<std::string> carriable_ids(const Layout& layout);

// stem + the lowest number ≥ 1 that no element or beam has as its id ("L1", "L2", …).
std::string numbered_id(const Layout& layout, const std::string& stem);
// stem + "_" + the lowest number ≥ 2 free (a duplicate's id: "HWP_P_2").
std::string suffixed_id(const Layout& layout, const std::string& stem);

}  // namespace rv::edit
