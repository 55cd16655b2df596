#pragma once
// The scan map (ui/scan_map.hpp) drawn with no display: an ImGui context of its own, one
// full-frame drawing, the CPU rasterizer (render/cpu_rasterizer.hpp).
#include "analysis/scan.hpp"
#include "render/cpu_rasterizer.hpp"

namespace rv::render {

Framebuffer render_scan_map(const ScanResult& result, int width, int height);

}  // namespace rv::render
