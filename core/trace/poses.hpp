#pragma once
// Where each element sits and how it faces once the layout is set up: stage offsets applied,
// and an aim_at mirror turned as the trace turned it (its normal read back from the first
// reflection on it, n ∝ d_out − d_in). For drawing and for reports that need the geometry.

#include <vector>

#include "layout/layout.hpp"
#include "trace/path.hpp"

namespace rv {

struct ElementPose {
    Vec2 at_mm{0, 0};
    Vec2 normal{1, 0};  // unit
};

std::vector<ElementPose> element_poses(const Layout& layout, const std::vector<Path>& paths);

}  // namespace rv
