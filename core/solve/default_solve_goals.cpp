#include "solve/default_solve_goals.hpp"

#include <algorithm>

#include "layout/visit.hpp"
#include "trace/trace.hpp"

namespace rv {

namespace {
// Whether the kind changes a beam's focus (what the default goals may move); one function per
// kind, a new kind must say.
bool focusing(const ElementKind& kind) {
    return std::visit(overloaded{
                          [](const Lens&) { return true; },
                          [](const Mirror& m) { return m.radius_of_curvature_mm.has_value(); },
                          // flat faces and slabs shift a focus but are not moved to set it
                          [](const Dichroic&) { return false; },
                          [](const Plate&) { return false; },
                          [](const Retroreflector&) { return false; },
                          [](const Stage&) { return false; },
                          [](const Crystal&) { return false; },
                          [](const Target&) { return false; },
                          [](const Dump&) { return false; },
                      },
                      kind);
}
}  // namespace

SolveGoals default_solve_goals(const Layout& layout, const MaterialLibrary& library) {
    SolveGoals goals;
    goals.aim = SolveGoals::Aim::Focus;
    const std::vector<Path> paths = trace_layout(layout, library);
    // How many beams meet each element before the target.
    std::vector<int> beams_at(layout.elements.size(), 0);
    for (const Path& p : paths) {
        std::vector<bool> seen(layout.elements.size(), false);
        const size_t end = p.target_hit.value_or(p.hits.size());
        for (size_t k = 0; k < end; ++k) seen[p.hits[k].element] = true;
        for (size_t i = 0; i < seen.size(); ++i) beams_at[i] += seen[i];
    }
    for (size_t i = 0; i < layout.elements.size(); ++i)
        if (focusing(layout.elements[i].kind) && beams_at[i] == 1)
            goals.move.push_back({layout.elements[i].id, {-kDefaultMoveRange_mm, kDefaultMoveRange_mm}});
    return goals;
}

}  // namespace rv
