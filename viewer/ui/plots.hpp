#pragma once
// The caustic near the target and the two pulses on a time axis, drawn from the report.
#include <imgui.h>

#include "analysis/report.hpp"

namespace rv::ui {

// Both beams' radii against path position relative to the target, tangential solid and
// sagittal dashed, the crystal's extent shaded, waist markers and Rayleigh ranges.
void draw_caustic_plot(ImDrawList* draw, ImVec2 origin, ImVec2 size, const RendezvousReport& report);

// The two pulses' intensity envelopes at the target on a time axis, with the delay.
void draw_timing_plot(ImDrawList* draw, ImVec2 origin, ImVec2 size, const Layout& layout,
                      const RendezvousReport& report);

}  // namespace rv::ui
