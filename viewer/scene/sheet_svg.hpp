#pragma once
// The build sheet's drawing: the table at 1:1 on A4 pages (analysis/print_tiles.hpp), one
// SVG document per page whose width and height are the paper's in mm (1 user unit = 1 mm), so
// a page printed at 100 % (actual size, no "fit to page") is the table's real size.
//
// Each page: its tile of the table clipped to the tile, with the hole grid (rings of the
// Ø6 mm tapped holes at their true place), each optic's footprint and reference point, its id
// and hole, the traced chief rays; crop marks at the tile's corners in the margin; in the top
// margin the page's number and place (column from the left, row from the bottom, counted from
// 1, and the table rectangle it covers); at each edge the number of the page that continues
// it; in the bottom margin a 100 mm bar to check the print scale.
#include <string>
#include <vector>

#include "analysis/build_sheet.hpp"
#include "analysis/print_tiles.hpp"
#include "layout/layout.hpp"
#include "trace/path.hpp"

namespace rv::scene {

// One SVG text per tile of `tiling`, in page order.
std::vector<std::string> write_sheet_pages(const Layout& layout, const std::vector<Path>& paths,
                                           const BuildSheet& sheet, const Tiling& tiling);

}  // namespace rv::scene
