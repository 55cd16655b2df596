#include "trace/poses.hpp"

#include <cmath>

#include "units/constants.hpp"

namespace rv {

std::vector<ElementPose> element_poses(const Layout& layout, const std::vector<Path>& paths) {
    std::vector<ElementPose> poses(layout.elements.size());
    const std::vector<Vec2> at = placed_positions_mm(layout);
    for (size_t i = 0; i < layout.elements.size(); ++i) poses[i] = {at[i], direction_deg(layout.elements[i].normal_deg)};
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        const auto* m = std::get_if<Mirror>(&layout.elements[i].kind);
        if (!m || !m->aim_at) continue;
        for (const Path& p : paths) {
            bool found = false;
            for (const TraceHit& h : p.hits) {
                if (h.element != i || h.interaction != Interaction::Reflect) continue;
                const Vec2 n = h.direction_out - h.direction_in;
                if (n.norm() > 1e-12) poses[i].normal = n.normalized();
                found = true;
                break;
            }
            if (found) break;
        }
    }
    return poses;
}

}  // namespace rv
