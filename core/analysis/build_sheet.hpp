#pragma once
// The build sheet of a layout: the parts list (parts_list.hpp), and every element's place on
// the breadboard (breadboard_holes.hpp: the hole from the table's lower-left corner and the
// offset from it) and its angle, in the order a lab places them (placement_order.hpp).
//
// Where an element is: its reference point (at_mm) as set up, i.e. moved by the stage that
// carries it at the stage's present position_mm (placed_positions_mm). A stage has no position
// of its own in the file: its place is where its carriage puts the first optic it carries at
// reading 0 (that optic's at_mm), its angle the stage's axis; a stage that carries nothing has
// no place. Angles are in degrees counter-clockwise from +x, in [0, 360): an element's
// normal_deg, a stage's axis_deg, and for an aim_at mirror the normal the trace turned it to
// (trace/poses.hpp); an aim_at mirror no beam reflects from keeps its normal_deg, marked so.

#include <optional>
#include <vector>

#include "analysis/breadboard_holes.hpp"
#include "analysis/parts_list.hpp"
#include "analysis/placement_order.hpp"
#include "layout/layout.hpp"
#include "trace/path.hpp"

namespace rv {

struct SheetPlace {
    std::optional<Vec2> at_mm;         // none: a stage carrying nothing
    std::optional<HoleLocation> hole;  // none without a place, or on a table with no hole
    double angle_deg = 0;              // [0, 360)
    bool aimed_by_trace = false;       // an aim_at mirror turned by the trace
    bool aim_unresolved = false;       // an aim_at mirror no beam reflects from
    std::optional<size_t> carried_by;  // the stage that carries it
    size_t part_group = 0;             // index into BuildSheet::parts
};

struct BuildSheet {
    HoleGrid grid;
    std::vector<PartGroup> parts;
    std::vector<SheetPlace> places;  // one per element, in the layout's order
    PlacementOrder order;
};

// `paths` as trace_layout returns them for `layout`.
BuildSheet build_sheet(const Layout& layout, const std::vector<Path>& paths);

// An angle in degrees brought into [0, 360).
double angle_in_turn_deg(double angle_deg);

}  // namespace rv
