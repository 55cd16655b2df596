#pragma once
// Where each label of a scene goes so that its box overlaps no symbol, no beam's centre line,
// no other drawn mark and no other label (issue 17 §6). The envelopes (light bands) and the
// holes may lie under a label.
//
// Method (greedy, in the scene's label order): candidate boxes on rings around the label's
// anchor (the symbol's centre), the first ring just clear of the symbol (Label::clear_mm), each
// next ring one label height farther out, 16 directions on each ring starting from the label's
// preferred side (Label::at_mm − anchor_mm) and alternating either way from it. The first
// candidate that meets nothing is taken (candidates inside the table first, then any); a box
// beyond the second ring gets a leader line from the symbol's edge to the box's nearest
// point. A placed box is an obstacle for the labels after it. "Meets" is exact: a segment of a
// mark's outline crossing the box (Liang–Barsky clipping, clip_segment.hpp), or the box's centre
// inside a closed mark.
//
// Sizes are the caller's, in table mm (the raster view measures its font at its zoom, the SVG
// uses its font size), so the same pass serves both.

#include <functional>
#include <optional>
#include <utility>
#include <vector>

#include "scene/clip_segment.hpp"
#include "scene/scene.hpp"

namespace rv::scene {

struct PlacedLabel {
    Box box_mm;                                   // the text's box on the table (y up)
    std::optional<std::pair<Vec2, Vec2>> leader;  // from the symbol's edge to the box
    bool clear = true;  // false: no candidate met nothing; the least-bad one (fewest marks met)
};

struct LabelSizeMm {
    double width_mm = 0, height_mm = 0;
};

// One PlacedLabel per scene.labels entry, in order. gap_mm: the clearance kept around each box.
// keep_out_mm: areas drawn over the table that no label may meet (the window's legend in the
// canvas's corner), treated as placed boxes.
std::vector<PlacedLabel> place_labels(const Scene& scene, const std::function<LabelSizeMm(const Label&)>& size_of,
                                      double gap_mm, const std::vector<Box>& keep_out_mm = {});

// Whether a box meets a mark of the scene (its outline, or the box's centre inside a closed
// one); envelopes are ignored. The placement's own test, exposed for the tests' independent
// check of every box.
bool box_meets_mark(const Box& box, const Polyline& mark);
bool boxes_overlap(const Box& a, const Box& b);

}  // namespace rv::scene
