#pragma once
// Breadboard holes: which hole an optic's mount goes on, and how far from it.
//
// Convention (the same grid the table view draws, viewer/scene/scene.cpp): the table's
// lower-left corner is (0, 0) in the layout's table-plane coordinates, x to the right, y up
// (top view), in mm. Holes sit at the table's grid pitch g (Table::grid_mm, 25 or 25.4), the
// first half a pitch in from each edge: hole (column c, row r) has its centre at
// ((c + ½)·g, (r + ½)·g). Columns count from 0 along +x (left to right), rows from 0 along +y
// (front to back, i.e. bottom to top of the drawing). A hole exists while its centre lies
// inside the table (x < width, y < height).
//
// The hole of a point is the one of the g × g square the point lies in (each square has its
// hole at the centre, so it is the nearest hole); a point on the line between two squares
// counts to the square to its right or above. A point beyond the outermost holes gets the
// outermost hole and a larger offset. offset_mm = point − hole centre, so hole + offset is the
// point again.

#include <optional>

#include "layout/layout.hpp"

namespace rv {

// The most holes counted along one side (a 25 km table): a count beyond it is this. Layouts
// stay far below; the bound keeps the count an int whatever the table's size.
inline constexpr int kMaxHolesAlong = 1'000'000;

struct HoleGrid {
    double pitch_mm = 25.0;
    int columns = 0;  // holes along x
    int rows = 0;     // holes along y
};

HoleGrid hole_grid(const Table& table);

// The centre of hole (column, row), mm from the table's lower-left corner.
Vec2 hole_centre_mm(const HoleGrid& grid, int column, int row);

struct HoleLocation {
    int column = 0;
    int row = 0;
    Vec2 hole_mm{0, 0};    // the hole's centre
    Vec2 offset_mm{0, 0};  // the point minus the hole's centre
    bool on_table = true;  // the point lies on the table (0 ≤ x ≤ width, 0 ≤ y ≤ height)
};

// The hole of a point as described above; none when the table has no hole (smaller than half a
// pitch in either direction).
std::optional<HoleLocation> hole_of(const Table& table, const Vec2& point_mm);

}  // namespace rv
