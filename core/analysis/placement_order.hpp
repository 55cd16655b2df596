#pragma once
// The order in which a lab places the optics: beam by beam (in the layout's order of beams),
// each optic where the beam's chief ray first meets it (the trace's hits, trace/trace.hpp); a
// stage just before the first optic it carries. An optic a beam meets that an earlier beam
// met already is listed again under the later beam, marked as placed before. Then every
// element no traced beam meets (a dump for a cube's rejected light, a stage carrying nothing
// the light meets, …), in file order.

#include <vector>

#include "layout/layout.hpp"
#include "trace/path.hpp"

namespace rv {

struct PlacementStep {
    size_t element = 0;          // index into Layout::elements
    bool placed_before = false;  // an earlier beam's list has it already
};

struct PlacementOrder {
    std::vector<std::vector<PlacementStep>> along_beam;  // one list per path, in the paths' order
    std::vector<size_t> unmet;                           // elements no path meets, file order
};

// `paths` as trace_layout returns them for `layout` (complete paths).
PlacementOrder placement_order(const Layout& layout, const std::vector<Path>& paths);

}  // namespace rv
