#pragma once
// Tiling the table at 1:1 onto sheets of paper, so that the printed pages laid side by side on
// the breadboard show where each mount goes.
//
// Each page holds one tile: a rectangle of the table of the page's size less its margin on
// every side (A4 210 × 297 mm with a 15 mm margin: 180 × 267 mm portrait). Tiles butt
// against each other without overlap, from the table's lower-left corner (0, 0): tile
// (column c, row r) covers x ∈ [c·w, (c+1)·w], y ∈ [r·h, (r+1)·h], columns counting to the
// right, rows up (the breadboard_holes.hpp corner and directions), so the last column and row
// may reach past the table. The page is portrait or landscape, whichever needs fewer pages
// (portrait on a tie). Pages are numbered from 1 row by row from the bottom row, each row left
// to right. A layout needing more than max_pages pages is refused (a 100 m table would need
// thousands).

#include <string>
#include <vector>

namespace rv {

struct Paper {
    double width_mm = 210.0;  // portrait
    double height_mm = 297.0;
    double margin_mm = 15.0;  // on each side: crop marks and the page label sit in it
};

inline constexpr int kMaxSheetPages = 200;

struct Tile {
    int page = 1;                                       // from 1
    int column = 0, row = 0;                            // from 0 at the table's lower-left corner
    double x0_mm = 0, y0_mm = 0, x1_mm = 0, y1_mm = 0;  // the table rectangle it covers
};

struct Tiling {
    bool landscape = false;
    double page_width_mm = 0, page_height_mm = 0, margin_mm = 0;  // as oriented
    double tile_width_mm = 0, tile_height_mm = 0;
    int columns = 0, rows = 0;
    int pages_needed = 0;     // columns × rows
    std::vector<Tile> tiles;  // empty when refused
    std::string refusal;      // why no tiles: "" when tiled
};

Tiling tile_table(double table_width_mm, double table_height_mm, const Paper& paper = {},
                  int max_pages = kMaxSheetPages);

}  // namespace rv
