#pragma once
// The scan plan's words and its map drawn on an ImDrawList (analysis/scan.hpp computes both):
// the command `scan` prints scan_plan_lines and draws the map headless (render/scan_png.hpp),
// the viewer's Scan plan panel shows the same lines and the same drawing.
#include <imgui.h>

#include <string>
#include <vector>

#include "analysis/scan.hpp"

namespace rv::ui {

// Why the layout cannot be scanned, with where (JSON pointer, id) and what is expected.
std::string scan_refusal_text(const ScanRefusal& refusal);

// The plan: centre, ranges, steps, point count, the uncertainty behind the ranges, the present
// and the peak predicted power and where. One line each.
std::vector<std::string> scan_plan_lines(const ScanResult& result);

// The axes' names with their units ("stage S1 position (mm)", "crystal X turn (deg)").
std::string scan_stage_axis_label(const ScanResult& result);
std::string scan_rotation_axis_label(const ScanResult& result);

// The colour of a fraction 0…1 of the colour bar (dark blue → teal → green → yellow).
ImU32 scan_colour(double fraction);

// The map in [origin, origin + size): cells coloured by power, labelled axes with ticks, a
// colour bar in mW, a cross at the present setting and a ring at the predicted peak. A cell
// with no finite value is drawn grey.
void draw_scan_map(ImDrawList* draw, ImVec2 origin, ImVec2 size, const ScanResult& result);

}  // namespace rv::ui
