#pragma once
// A lens's `part` (its catalog id, Lens::part) against a lens catalog, where one is known (solve
// reads one; the layout reader does not, so it only checks that the id is printable).
//
// Errors, located at the lens's "part" (JSON pointer /elements/N/part, subject the lens's id):
// - the catalog holds no lens with that id ("did you mean …?" when one is close);
// - the catalog lens of that id differs from the lens in the file: its model (thin or thick,
//   focal length, glass, shape, centre thickness, design wavelength) or its diameter (the
//   element's aperture_mm). A part id is what a user buys, and the file's numbers are what every
//   figure is computed with: when they disagree one of them is wrong, and nothing here can tell
//   which, so it is an error, not a warning. The message says both values and how to resolve it.
// Numbers agree within a relative 1e-9 (the catalog's and the reader's lensmaker solutions are
// the same computation; only printing may round them).

#include <string>
#include <vector>

#include "io/diagnostic.hpp"
#include "io/lens_catalog.hpp"
#include "layout/layout.hpp"

namespace rv {

// `skip`: ids of lenses not to check (solve's swapped lenses, whose part it replaces).
Diagnostics check_lens_parts(const Layout& layout, const std::vector<CatalogLens>& catalog,
                             const std::vector<std::string>& skip = {});

// What differs between a catalog lens and an element holding a lens, one phrase each
// ("focal length 100 mm in the catalog, 120 mm here"); empty when they agree.
std::vector<std::string> part_differences(const CatalogLens& part, const Element& lens_element);

}  // namespace rv
