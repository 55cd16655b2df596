#include "analysis/coincident_optics.hpp"

#include <cmath>
#include <cstdint>
#include <set>
#include <unordered_map>

namespace rv {

namespace {

// A grid cell of the pitch kCoincidentOptics_mm; two centres that close lie in the same or
// neighbouring cells.
struct Cell {
    std::int64_t x, y;
    bool operator==(const Cell&) const = default;
};
struct CellHash {
    size_t operator()(const Cell& c) const {
        return std::hash<std::int64_t>{}(c.x * 0x9E3779B97F4A7C15LL ^ c.y);
    }
};
std::optional<Cell> cell_of(const Vec2& p) {
    const double x = std::floor(p.x() / kCoincidentOptics_mm), y = std::floor(p.y() / kCoincidentOptics_mm);
    if (!std::isfinite(x) || !std::isfinite(y) || std::abs(x) > 1e15 || std::abs(y) > 1e15) return std::nullopt;
    return Cell{static_cast<std::int64_t>(x), static_cast<std::int64_t>(y)};
}

}  // namespace

std::vector<Finding> coincident_optics(const Layout& layout, const std::vector<const Path*>& paths) {
    const std::vector<Vec2> at = placed_positions_mm(layout);
    auto has_place = [&](size_t i) { return !std::holds_alternative<Stage>(layout.elements[i].kind); };
    std::unordered_map<Cell, std::vector<size_t>, CellHash> grid;
    for (size_t i = 0; i < layout.elements.size(); ++i)
        if (has_place(i))
            if (const auto c = cell_of(at[i])) grid[*c].push_back(i);
    std::vector<Finding> out;
    std::set<std::pair<size_t, size_t>> said;
    std::vector<char> looked(layout.elements.size(), 0);
    for (const Path* path : paths) {
        for (const TraceHit& hit : path->hits) {
            const size_t e = hit.element;
            if (e >= layout.elements.size() || looked[e] || !has_place(e)) continue;
            looked[e] = 1;
            const auto c = cell_of(at[e]);
            if (!c) continue;
            for (std::int64_t dx = -1; dx <= 1; ++dx)
                for (std::int64_t dy = -1; dy <= 1; ++dy) {
                    const auto near = grid.find(Cell{c->x + dx, c->y + dy});
                    if (near == grid.end()) continue;
                    for (size_t other : near->second) {
                        const double d = (at[other] - at[e]).norm();
                        if (other == e || d > kCoincidentOptics_mm) continue;
                        if (!said.insert({std::min(e, other), std::max(e, other)}).second) continue;
                        Finding f;
                        f.kind = Finding::Kind::CoincidentOptics;
                        f.element = layout.elements[e].id;
                        f.other_element = layout.elements[other].id;
                        f.where_mm = at[e];
                        f.amount = d;
                        f.beam = layout.beams[path->beam].id;
                        out.push_back(std::move(f));
                    }
                }
        }
    }
    return out;
}

}  // namespace rv
