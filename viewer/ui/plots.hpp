#pragma once
// The caustic near the target and the two pulses on a time axis, drawn from the report, and
// the curves of a sweep.
#include <imgui.h>

#include <string>
#include <vector>

#include "analysis/report.hpp"

namespace rv::ui {

// Both beams' radii against path position relative to the target, tangential solid and
// sagittal dashed, the crystal's extent shaded, waist markers and Rayleigh ranges.
void draw_caustic_plot(ImDrawList* draw, ImVec2 origin, ImVec2 size, const RendezvousReport& report);

// The two pulses' intensity envelopes at the target on a time axis, with the delay.
void draw_timing_plot(ImDrawList* draw, ImVec2 origin, ImVec2 size, const Layout& layout,
                      const RendezvousReport& report);

// The unit a layout key's suffix names ("position_mm" → "mm", "angle_deg" → "°", "at_mm[1]" →
// "mm"), the way the file names every raw number; empty for a key without one (M², a fraction).
std::string unit_of_key(const std::string& key);

// The figures of a sweep of one field: overlap and sinc² (0 to 1, each its own colour) against
// the swept values, with the field and its unit on the x axis.
struct SweepCurves {
    std::string field;  // "S1.position_mm"
    std::vector<double> values, overlap, sinc2;
};
void draw_sweep_plot(ImDrawList* draw, ImVec2 origin, ImVec2 size, const SweepCurves& curves);

}  // namespace rv::ui
