#include "analysis/placement_order.hpp"

#include <optional>

namespace rv {

namespace {

// The stage that carries element `index`, if any (a layout lets at most one stage carry it).
std::optional<size_t> carrier_of(const Layout& layout, size_t index) {
    for (size_t s = 0; s < layout.elements.size(); ++s)
        if (const auto* stage = std::get_if<Stage>(&layout.elements[s].kind))
            for (const std::string& id : stage->carries)
                if (id == layout.elements[index].id) return s;
    return std::nullopt;
}

}  // namespace

PlacementOrder placement_order(const Layout& layout, const std::vector<Path>& paths) {
    const size_t n = layout.elements.size();
    std::vector<std::optional<size_t>> carrier(n);
    for (size_t i = 0; i < n; ++i) carrier[i] = carrier_of(layout, i);

    PlacementOrder order;
    std::vector<bool> listed(n, false);  // by any beam so far
    for (const Path& path : paths) {
        std::vector<PlacementStep> steps;
        std::vector<bool> in_this_beam(n, false);
        auto add = [&](size_t e) {
            if (in_this_beam[e]) return;
            in_this_beam[e] = true;
            steps.push_back({e, listed[e]});
        };
        for (const TraceHit& hit : path.hits) {
            if (hit.element >= n) continue;
            if (carrier[hit.element]) add(*carrier[hit.element]);
            add(hit.element);
        }
        for (const PlacementStep& s : steps) listed[s.element] = true;
        order.along_beam.push_back(std::move(steps));
    }
    for (size_t i = 0; i < n; ++i)
        if (!listed[i]) order.unmet.push_back(i);
    return order;
}

}  // namespace rv
