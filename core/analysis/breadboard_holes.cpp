#include "analysis/breadboard_holes.hpp"

#include <algorithm>
#include <cmath>

#include "units/clamped_int.hpp"

namespace rv {

namespace {

// How many holes fit along a side: the count of k ≥ 0 with (k + ½)·pitch < side, at most
// kMaxHolesAlong (the quotient is clamped before it is cast: a huge double cast to int is
// undefined behaviour).
int holes_along(double side_mm, double pitch_mm) {
    if (!(pitch_mm > 0) || !(side_mm > 0) || !std::isfinite(side_mm / pitch_mm)) return 0;
    if (side_mm / pitch_mm > kMaxHolesAlong) return kMaxHolesAlong;
    int n = clamped_int(std::ceil(side_mm / pitch_mm - 0.5), 0, kMaxHolesAlong);
    while ((n + 0.5) * pitch_mm < side_mm) ++n;
    while (n > 0 && (n - 0.5) * pitch_mm >= side_mm) --n;
    return n;
}

// The square a coordinate lies in, kept to the holes that exist.
int square_of(double coordinate_mm, double pitch_mm, int count) {
    return clamped_int(std::floor(coordinate_mm / pitch_mm), 0, count - 1);
}

}  // namespace

HoleGrid hole_grid(const Table& table) {
    return {table.grid_mm, holes_along(table.width_mm, table.grid_mm),
            holes_along(table.height_mm, table.grid_mm)};
}

Vec2 hole_centre_mm(const HoleGrid& grid, int column, int row) {
    return {(column + 0.5) * grid.pitch_mm, (row + 0.5) * grid.pitch_mm};
}

std::optional<HoleLocation> hole_of(const Table& table, const Vec2& point_mm) {
    const HoleGrid grid = hole_grid(table);
    if (grid.columns == 0 || grid.rows == 0 || !point_mm.allFinite()) return std::nullopt;
    HoleLocation h;
    h.column = square_of(point_mm.x(), grid.pitch_mm, grid.columns);
    h.row = square_of(point_mm.y(), grid.pitch_mm, grid.rows);
    h.hole_mm = hole_centre_mm(grid, h.column, h.row);
    h.offset_mm = point_mm - h.hole_mm;
    h.on_table = point_mm.x() >= 0 && point_mm.y() >= 0 && point_mm.x() <= table.width_mm &&
                 point_mm.y() <= table.height_mm;
    return h;
}

}  // namespace rv
