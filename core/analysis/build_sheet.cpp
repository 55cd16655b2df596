#include "analysis/build_sheet.hpp"

#include <cmath>

#include "trace/poses.hpp"
#include "units/constants.hpp"

namespace rv {

double angle_in_turn_deg(double angle_deg) {
    double a = std::fmod(angle_deg, 360.0);
    if (a < 0) a += 360.0;
    return a >= 360.0 ? 0.0 : a;  // −1e-17 + 360 rounds to 360
}

BuildSheet build_sheet(const Layout& layout, const std::vector<Path>& paths) {
    BuildSheet sheet;
    sheet.grid = hole_grid(layout.table);
    sheet.parts = group_parts(layout);
    sheet.order = placement_order(layout, paths);
    const std::vector<ElementPose> poses = element_poses(layout, paths);
    const size_t n = layout.elements.size();
    sheet.places.resize(n);
    for (size_t g = 0; g < sheet.parts.size(); ++g)
        for (size_t e : sheet.parts[g].elements) sheet.places[e].part_group = g;

    auto index_of = [&](const std::string& id) -> std::optional<size_t> {
        for (size_t j = 0; j < n; ++j)
            if (layout.elements[j].id == id) return j;
        return std::nullopt;
    };
    for (size_t i = 0; i < n; ++i) {
        const Element& e = layout.elements[i];
        SheetPlace& p = sheet.places[i];
        if (const auto* stage = std::get_if<Stage>(&e.kind)) {
            for (const std::string& id : stage->carries)
                if (const std::optional<size_t> j = index_of(id)) {
                    sheet.places[*j].carried_by = i;
                    if (!p.at_mm) p.at_mm = layout.elements[*j].at_mm;
                }
            p.angle_deg = angle_in_turn_deg(stage->axis_deg);
        } else {
            p.at_mm = poses[i].at_mm;
            p.angle_deg =
                angle_in_turn_deg(rad_to_deg(std::atan2(poses[i].normal.y(), poses[i].normal.x())));
            if (const auto* m = std::get_if<Mirror>(&e.kind); m && m->aim_at) {
                bool reflected = false;
                for (const Path& path : paths)
                    for (const TraceHit& h : path.hits)
                        reflected |= h.element == i && h.interaction == Interaction::Reflect;
                p.aimed_by_trace = reflected;
                p.aim_unresolved = !reflected;
            } else {
                p.angle_deg = angle_in_turn_deg(e.normal_deg);  // exactly the file's value
            }
        }
        if (p.at_mm) p.hole = hole_of(layout.table, *p.at_mm);
    }
    return sheet;
}

}  // namespace rv
