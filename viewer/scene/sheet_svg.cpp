#include "scene/sheet_svg.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <sstream>

#include "layout/visit.hpp"
#include "scene/svg_writer.hpp"
#include "scene/wavelength_colour.hpp"

namespace rv::scene {

namespace {

constexpr double kHoleRadius_mm = 3.0;  // an M6 or 1/4-20 tapped hole is about Ø6 mm
const char* const kInk = "#1e1e28";
const char* const kOpticInk = "#2c4a7a";

// Table mm (y up) to page mm (y down) for one tile.
struct PageFrame {
    const Tile& tile;
    double margin_mm;
    double x(double table_x_mm) const { return margin_mm + table_x_mm - tile.x0_mm; }
    double y(double table_y_mm) const { return margin_mm + tile.y1_mm - table_y_mm; }
    std::string point(const Vec2& p) const {
        return svg_number(x(p.x())) + "," + svg_number(y(p.y()));
    }
};

std::string polygon(const PageFrame& f, const std::vector<Vec2>& pts, const std::string& style,
                    bool closed) {
    std::string s = closed ? "<polygon points=\"" : "<polyline points=\"";
    for (const Vec2& p : pts) {
        if (!p.allFinite()) return "";  // never write a non-finite number
        s += f.point(p) + " ";
    }
    return s + "\" " + style + "/>\n";
}

// A rectangle in the table plane: `across_mm` wide perpendicular to n, from `back_mm` to
// `front_mm` along n (signed distances from c).
std::vector<Vec2> slab(const Vec2& c, const Vec2& n, double across_mm, double back_mm,
                       double front_mm) {
    const Vec2 t = perpendicular(n) * (across_mm / 2);
    return {c + back_mm * n + t, c + front_mm * n + t, c + front_mm * n - t, c + back_mm * n - t};
}

// The outline a part takes on the table: its aperture across, and a depth along its normal
// (its own thickness where the file gives one; else a typical mount's: drawing choices).
std::vector<Vec2> footprint(const Element& e, const Vec2& at, const Vec2& n) {
    const double a = e.aperture_mm;
    struct Depth {
        const Element& e;
        Vec2 at, n;
        double a;
        std::vector<Vec2> operator()(const Lens& l) const {
            const double d = std::visit(overloaded{
                                            [](const IdealLens&) { return 4.0; },
                                            [](const ThinChromaticLens&) { return 4.0; },
                                            [](const ThickLens& t) { return std::max(t.center_thickness_mm, 2.0); },
                                        },
                                        l.model);
            return slab(at, n, a, -d / 2, d / 2);
        }
        std::vector<Vec2> operator()(const Mirror&) const {
            return slab(at, n, a, -6.0, 0.0);
        }  // substrate behind
        std::vector<Vec2> operator()(const Dichroic& d) const {
            return slab(at, n, a, -std::max(d.substrate.thickness_mm, 1.0), 0.0);
        }
        std::vector<Vec2> operator()(const Plate& p) const {
            const double d = std::max(p.slab.thickness_mm, 1.0);
            return slab(at, n, a, -d / 2, d / 2);
        }
        std::vector<Vec2> operator()(const Crystal& c) const {
            const double d = std::max(c.length_mm, 1.0);
            return slab(at, n, a, -d / 2, d / 2);
        }
        std::vector<Vec2> operator()(const Retroreflector&) const {
            return slab(at, n, a, 0.0, a / 2);
        }  // apex at at_mm
        std::vector<Vec2> operator()(const Dump&) const { return slab(at, n, a, -10.0, 0.0); }
        std::vector<Vec2> operator()(const Target&) const { return slab(at, n, a, -1.0, 1.0); }
        std::vector<Vec2> operator()(const Stage&) const { return {}; }
    };
    return std::visit(Depth{e, at, n, a}, e.kind);
}

std::string text(double x, double y, double size_mm, const std::string& s,
                 const char* anchor = "start", double rotate_deg = 0) {
    std::string t = "<text x=\"" + svg_number(x) + "\" y=\"" + svg_number(y) + "\" font-size=\"" +
                    svg_number(size_mm) + "\" fill=\"" + kInk + "\" text-anchor=\"" + anchor + "\"";
    if (rotate_deg != 0)
        t += " transform=\"rotate(" + svg_number(rotate_deg) + " " + svg_number(x) + " " +
             svg_number(y) + ")\"";
    return t + ">" + svg_escape(s) + "</text>\n";
}

std::string line(double x0, double y0, double x1, double y1, double width_mm,
                 const char* colour = kInk) {
    return "<line x1=\"" + svg_number(x0) + "\" y1=\"" + svg_number(y0) + "\" x2=\"" +
           svg_number(x1) + "\" y2=\"" + svg_number(y1) + "\" stroke=\"" + colour +
           "\" stroke-width=\"" + svg_number(width_mm) + "\"/>\n";
}

// The page at (column, row) in the tiling, or 0 when there is none.
int page_at(const Tiling& t, int column, int row) {
    if (column < 0 || row < 0 || column >= t.columns || row >= t.rows) return 0;
    return row * t.columns + column + 1;
}

void crop_marks(std::ostringstream& o, const Tiling& t) {
    const double m = t.margin_mm, x0 = m, y0 = m, x1 = t.page_width_mm - m,
                 y1 = t.page_height_mm - m;
    const double gap = 3.0,
                 reach = m - 3.0;  // from 3 mm off the corner to 3 mm from the paper's edge
    for (const double cx : {x0, x1})
        for (const double cy : {y0, y1}) {
            const double sx = cx == x0 ? -1 : 1, sy = cy == y0 ? -1 : 1;  // outwards
            o << line(cx + sx * gap, cy, cx + sx * reach, cy, 0.2)
              << line(cx, cy + sy * gap, cx, cy + sy * reach, 0.2);
        }
}

void labels(std::ostringstream& o, const Layout& layout, const Tiling& t, const Tile& tile) {
    const double m = t.margin_mm, w = t.page_width_mm, h = t.page_height_mm;
    char buf[320];
    std::snprintf(
        buf, sizeof buf,
        "page %d of %zu · column %d of %d (from the left) · row %d of %d (from the front)",
        tile.page, t.tiles.size(), tile.column + 1, t.columns, tile.row + 1, t.rows);
    o << text(m, 6.5, 3.2, buf);
    std::string name = layout.name.empty() ? std::string("build sheet") : layout.name;
    if (name.size() > 60) name = name.substr(0, 57) + "...";
    std::snprintf(
        buf, sizeof buf,
        " · covers x %.1f to %.1f mm, y %.1f to %.1f mm of the table (its lower-left corner 0, 0)",
        tile.x0_mm, tile.x1_mm, tile.y0_mm, tile.y1_mm);
    o << text(m, 10.5, 2.4, name + buf);
    auto next = [&](int c, int r, const char* where) {
        const int p = page_at(t, c, r);
        return p ? std::string(where) + " page " + std::to_string(p) : std::string();
    };
    const std::string left = next(tile.column - 1, tile.row, "left:"),
                      right = next(tile.column + 1, tile.row, "right:");
    const std::string above = next(tile.column, tile.row + 1, "behind:"),
                      below = next(tile.column, tile.row - 1, "front:");
    if (!above.empty()) o << text(w / 2, m - 1.2, 2.2, above, "middle");
    if (!below.empty()) o << text(w / 2, h - m + 3.6, 2.2, below, "middle");
    if (!left.empty()) o << text(m - 2, h / 2, 2.2, left, "middle", -90);
    if (!right.empty()) o << text(w - m + 2, h / 2, 2.2, right, "middle", 90);
    // The scale check: 100 mm on the paper when printed at actual size.
    const double bar_y = h - m + 8.5;
    std::snprintf(buf, sizeof buf,
                  "100 mm at 100 %% (actual size). Holes every %g mm, the first %g mm in.",
                  layout.table.grid_mm, layout.table.grid_mm / 2);
    o << line(m, bar_y, m + 100, bar_y, 0.4) << line(m, bar_y - 1.5, m, bar_y + 1.5, 0.3)
      << line(m + 100, bar_y - 1.5, m + 100, bar_y + 1.5, 0.3)
      << text(m + 102, bar_y + 0.8, 2.2, buf);
}

void table_content(std::ostringstream& o, const Layout& layout, const std::vector<Path>& paths,
                   const BuildSheet& sheet, const PageFrame& f) {
    const Tile& tile = f.tile;
    const Table& table = layout.table;
    o << "<rect x=\"" << svg_number(f.x(0)) << "\" y=\"" << svg_number(f.y(table.height_mm))
      << "\" width=\"" << svg_number(table.width_mm) << "\" height=\""
      << svg_number(table.height_mm)
      << "\" fill=\"#f4f5f6\" stroke=\"#6a7280\" stroke-width=\"0.5\"/>\n";
    // Holes of this tile only (a ring at the tapped hole's size and a centre dot).
    const HoleGrid& g = sheet.grid;
    const int c0 = std::max(0, static_cast<int>(std::floor(tile.x0_mm / g.pitch_mm)) - 1);
    const int c1 = std::min(g.columns - 1, static_cast<int>(std::ceil(tile.x1_mm / g.pitch_mm)));
    const int r0 = std::max(0, static_cast<int>(std::floor(tile.y0_mm / g.pitch_mm)) - 1);
    const int r1 = std::min(g.rows - 1, static_cast<int>(std::ceil(tile.y1_mm / g.pitch_mm)));
    o << "<g fill=\"none\" stroke=\"#9aa2ac\" stroke-width=\"0.25\">\n";
    for (int c = c0; c <= c1; ++c)
        for (int r = r0; r <= r1; ++r) {
            const Vec2 h = hole_centre_mm(g, c, r);
            o << "<circle cx=\"" << svg_number(f.x(h.x())) << "\" cy=\"" << svg_number(f.y(h.y()))
              << "\" r=\"" << svg_number(kHoleRadius_mm) << "\"/>\n";
        }
    o << "</g>\n";
    // Beams under the optics: the traced chief rays.
    for (const Path& p : paths) {
        const BeamStyle style = beam_style(layout.beams[p.beam].wavelength_nm);
        const std::string stroke = "fill=\"none\" stroke=\"" + svg_rgb(style.colour) +
                                   "\" stroke-width=\"0.6\"" +
                                   (style.visible ? "" : " stroke-dasharray=\"4 2.5\"");
        for (const TraceSegment& s : p.segments)
            o << polygon(f, {s.from_mm, s.to_mm}, stroke, false);
    }
    // Each optic: footprint, a cross at its reference point, its hole ringed, id and hole.
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        const Element& e = layout.elements[i];
        const SheetPlace& place = sheet.places[i];
        if (!place.at_mm) continue;
        const Vec2 at = *place.at_mm, n = direction_deg(place.angle_deg);
        if (const auto* stage = std::get_if<Stage>(&e.kind)) {
            // The carriage's travel beside the optic it carries, from reading min to max.
            o << polygon(
                f, slab(at, n, 30.0, stage->travel_min_mm - 15.0, stage->travel_max_mm + 15.0),
                "fill=\"none\" stroke=\"#787882\" stroke-width=\"0.4\" stroke-dasharray=\"3 2\"",
                true);
        } else {
            o << polygon(f, footprint(e, at, n),
                         "fill=\"#dde6f2\" fill-opacity=\"0.8\" stroke=\"" +
                             std::string(kOpticInk) + "\" stroke-width=\"0.35\"",
                         true);
        }
        if (place.hole) {
            const Vec2 h = place.hole->hole_mm;
            o << "<circle cx=\"" << svg_number(f.x(h.x())) << "\" cy=\"" << svg_number(f.y(h.y()))
              << "\" r=\"" << svg_number(kHoleRadius_mm + 0.8) << "\" fill=\"none\" stroke=\""
              << kOpticInk << "\" stroke-width=\"0.5\"/>\n";
            if (place.hole->offset_mm.norm() > 1e-6)
                o << polygon(
                    f, {h, at},
                    "fill=\"none\" stroke=\"" + std::string(kOpticInk) + "\" stroke-width=\"0.2\"",
                    false);
        }
        const double x = f.x(at.x()), y = f.y(at.y());
        o << line(x - 2.5, y, x + 2.5, y, 0.25, kOpticInk)
          << line(x, y - 2.5, x, y + 2.5, 0.25, kOpticInk);
        std::string label = e.id;
        if (place.hole)
            label += " (" + std::to_string(place.hole->column) + ", " +
                     std::to_string(place.hole->row) + ")";
        // Beside the optic, on the side and with the alignment that keep the label on this page.
        const double size_mm = 3.0, width_mm = 0.62 * size_mm * label.size();
        Vec2 beside = at + perpendicular(n) * (e.aperture_mm / 2 + 3.0);
        if (beside.y() > tile.y1_mm - size_mm || beside.y() < tile.y0_mm + 1.0)
            beside = at - perpendicular(n) * (e.aperture_mm / 2 + 3.0);
        const bool flush_right = beside.x() + width_mm > tile.x1_mm;
        o << text(f.x(beside.x()), f.y(beside.y()), size_mm, label, flush_right ? "end" : "start");
    }
}

}  // namespace

std::vector<std::string> write_sheet_pages(const Layout& layout, const std::vector<Path>& paths,
                                           const BuildSheet& sheet, const Tiling& tiling) {
    std::vector<std::string> pages;
    for (const Tile& tile : tiling.tiles) {
        const PageFrame f{tile, tiling.margin_mm};
        std::ostringstream o;
        const std::string w = svg_number(tiling.page_width_mm),
                          h = svg_number(tiling.page_height_mm);
        o << "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
          << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << w << "mm\" height=\"" << h
          << "mm\" viewBox=\"0 0 " << w << " " << h
          << "\" font-family=\"DejaVu Sans, sans-serif\">\n"
          << "<title>" << svg_escape(layout.name) << " — build sheet page " << tile.page
          << "</title>\n"
          << "<rect x=\"0\" y=\"0\" width=\"" << w << "\" height=\"" << h
          << "\" fill=\"#ffffff\"/>\n"
          << "<clipPath id=\"tile\"><rect x=\"" << svg_number(tiling.margin_mm) << "\" y=\""
          << svg_number(tiling.margin_mm) << "\" width=\"" << svg_number(tiling.tile_width_mm)
          << "\" height=\"" << svg_number(tiling.tile_height_mm)
          << "\"/></clipPath>\n<g clip-path=\"url(#tile)\">\n";
        table_content(o, layout, paths, sheet, f);
        o << "</g>\n<rect x=\"" << svg_number(tiling.margin_mm) << "\" y=\""
          << svg_number(tiling.margin_mm) << "\" width=\"" << svg_number(tiling.tile_width_mm)
          << "\" height=\"" << svg_number(tiling.tile_height_mm)
          << "\" fill=\"none\" stroke=\"#b0b4ba\" stroke-width=\"0.15\" stroke-dasharray=\"1 "
             "1\"/>\n";
        crop_marks(o, tiling);
        labels(o, layout, tiling, tile);
        o << "</svg>\n";
        pages.push_back(o.str());
    }
    return pages;
}

}  // namespace rv::scene
