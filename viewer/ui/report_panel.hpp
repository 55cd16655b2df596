#pragma once
#include "analysis/report.hpp"

namespace rv::ui {

// The verdict and the numbers at the target (all from the core report), inside the current
// ImGui window.
void draw_report_panel(const RendezvousReport& report);

}  // namespace rv::ui
