#pragma once
// The Scan plan panel: the plan to find the signal and its map (analysis/scan.hpp), the same
// lines and drawing as `rendezvous scan` (ui/scan_map.hpp). Read-only: it never edits the
// document. The plan is made again when the document changes while the panel is open.
#include <imgui.h>

#include <optional>

#include "analysis/scan.hpp"
#include "edit/document.hpp"

namespace rv::ui {

struct ScanState {
    std::optional<ScanResult> result;
    unsigned revision = 0;  // the document's revision the result belongs to
    bool open = false;      // the header was open in the last frame
    ImVec2 header_min{0, 0}, header_max{0, 0};  // the header's rectangle, for interface tests
};

void draw_scan_panel(const edit::Document& doc, ScanState& state);

}  // namespace rv::ui
