#include "trace/poses.hpp"

#include <cmath>

#include "units/constants.hpp"

namespace rv {

std::vector<ElementPose> element_poses(const Layout& layout, const std::vector<Path>& paths) {
    std::vector<ElementPose> poses(layout.elements.size());
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        const Element& e = layout.elements[i];
        poses[i] = {e.at_mm, direction_deg(e.normal_deg)};
    }
    for (const Element& e : layout.elements) {
        const auto* s = std::get_if<Stage>(&e.kind);
        if (!s) continue;
        const Vec2 axis = direction_deg(s->axis_deg);
        for (const std::string& id : s->carries)
            for (size_t i = 0; i < layout.elements.size(); ++i)
                if (layout.elements[i].id == id) poses[i].at_mm += s->position_mm * axis;
    }
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
