#pragma once
// Optics that sit in one place: two elements whose centres (as placed, stages applied) lie within
// kCoincidentOptics_mm of each other, one of them on a beam's path. The trace meets only one of
// two surfaces in one place, so the other is silently skipped: a `coincident-optics` finding.
// Found through a hash of the centres on a grid of that pitch, so the cost grows with the number
// of elements and hits, not with their product.
#include <vector>

#include "findings/finding.hpp"
#include "layout/layout.hpp"
#include "trace/path.hpp"

namespace rv {

inline constexpr double kCoincidentOptics_mm = 0.1;

// One finding per pair, on the first beam (in `paths` order) that meets either of them:
// element = the optic it meets, other_element = the other, amount = their distance (mm).
std::vector<Finding> coincident_optics(const Layout& layout, const std::vector<const Path*>& paths);

}  // namespace rv
