#include "analysis/print_tiles.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace rv {

namespace {

// The fewest tiles of `tile_mm` that reach `side_mm` (n·tile ≥ side, as the tiles are placed),
// whatever the rounding of the quotient.
double tiles_along(double side_mm, double tile_mm) {
    double n = std::max(1.0, std::ceil(side_mm / tile_mm));
    if (n > 1e15) return n;  // far beyond any page limit; n + 1 would not change n
    while (n * tile_mm < side_mm) ++n;
    while (n > 1 && (n - 1) * tile_mm >= side_mm) --n;
    return n;
}

}  // namespace

Tiling tile_table(double table_width_mm, double table_height_mm, const Paper& paper,
                  int max_pages) {
    Tiling t;
    const double usable_w = paper.width_mm - 2 * paper.margin_mm,
                 usable_h = paper.height_mm - 2 * paper.margin_mm;
    if (!(table_width_mm > 0) || !(table_height_mm > 0) || !std::isfinite(table_width_mm) ||
        !std::isfinite(table_height_mm)) {
        t.refusal = "the table has no finite positive size";
        return t;
    }
    if (!(usable_w > 0) || !(usable_h > 0)) {
        t.refusal = "the margin leaves no room on the page";
        return t;
    }
    const double portrait =
        tiles_along(table_width_mm, usable_w) * tiles_along(table_height_mm, usable_h);
    const double landscape =
        tiles_along(table_width_mm, usable_h) * tiles_along(table_height_mm, usable_w);
    t.landscape = landscape < portrait;
    t.page_width_mm = t.landscape ? paper.height_mm : paper.width_mm;
    t.page_height_mm = t.landscape ? paper.width_mm : paper.height_mm;
    t.margin_mm = paper.margin_mm;
    t.tile_width_mm = t.page_width_mm - 2 * paper.margin_mm;
    t.tile_height_mm = t.page_height_mm - 2 * paper.margin_mm;
    const double columns = tiles_along(table_width_mm, t.tile_width_mm);
    const double rows = tiles_along(table_height_mm, t.tile_height_mm);
    const double pages = columns * rows;
    if (pages > max_pages) {
        t.pages_needed = pages < 2e9 ? static_cast<int>(pages) : 2000000000;
        char why[160];
        std::snprintf(why, sizeof why,
                      "the table needs %.0f pages at 1:1 (%.0f × %.0f); at most %d are written",
                      pages, columns, rows, max_pages);
        t.refusal = why;
        return t;
    }
    t.columns = static_cast<int>(columns);
    t.rows = static_cast<int>(rows);
    t.pages_needed = t.columns * t.rows;
    for (int r = 0; r < t.rows; ++r)
        for (int c = 0; c < t.columns; ++c)
            t.tiles.push_back({static_cast<int>(t.tiles.size()) + 1, c, r, c * t.tile_width_mm,
                               r * t.tile_height_mm, (c + 1) * t.tile_width_mm,
                               (r + 1) * t.tile_height_mm});
    return t;
}

}  // namespace rv
