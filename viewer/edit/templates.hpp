#pragma once
// File ▸ New: starting layouts built in code (our own scenarios), one or two beams on a metric
// (25 mm, M6 holes at 12.5 + 25n mm) or imperial (1 inch, 1/4-20 holes at 12.7 + 25.4n mm)
// breadboard. Every optic stands on a hole. No ImGui.
#include <string>
#include <vector>

#include "layout/layout.hpp"

namespace rv::edit {

struct LayoutTemplate {
    std::string name;  // what File ▸ New lists
    bool two_beams = false;
    bool imperial = false;
};

// The four templates: one beam / two beams, metric / imperial.
const std::vector<LayoutTemplate>& layout_templates();

// The layout of a template: one beam through a lens onto a target plane at its focus, or two
// beams of different colours combined on a dichroic and focused by one lens onto the target;
// a dump behind the target.
Layout layout_of(const LayoutTemplate& t);

}  // namespace rv::edit
