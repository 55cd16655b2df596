#pragma once
#include <imgui.h>

#include <optional>
#include <utility>
#include <vector>

#include "analysis/report.hpp"

namespace rv::ui {

// The verdict, each figure behind it with a met / near / not-met mark and its definition as a
// tooltip, the numbers at the target, power and polarization, and the findings (all from the
// core report), inside the current ImGui window. With `select`, clicking a finding selects the
// element it names.
// `finding_rects`, when given, receives each finding's row on screen (for interface tests).
void draw_report_panel(const RendezvousReport& report, const Layout& layout,
                       std::optional<size_t>* select = nullptr,
                       std::vector<std::pair<ImVec2, ImVec2>>* finding_rects = nullptr);

}  // namespace rv::ui
