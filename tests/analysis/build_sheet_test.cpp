// The build sheet: breadboard holes, page tiles, placement order and the parts list.
#include "analysis/build_sheet.hpp"

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <set>

#include "analysis/print_tiles.hpp"
#include "support/layouts.hpp"
#include "trace/trace.hpp"

using rv::test::bundled_layout;
using rv::test::near;

namespace {

// Every bundled layout file (layouts/*.json that is a layout, not the catalog or schema).
std::vector<std::string> bundled_layout_files() {
    std::vector<std::string> files;
    for (const auto& entry :
         std::filesystem::directory_iterator(std::string(RV_SOURCE_DIR) + "/layouts")) {
        if (entry.path().extension() != ".json") continue;
        std::ifstream in(entry.path());
        const nlohmann::json doc = nlohmann::json::parse(in, nullptr, false);
        if (doc.is_object() && doc.value("format", "") == "rendezvous-layout")
            files.push_back(entry.path().filename().string());
    }
    std::sort(files.begin(), files.end());
    return files;
}

struct Traced {
    rv::Layout layout;
    std::vector<rv::Path> paths;
    rv::BuildSheet sheet;
};
Traced traced(const std::string& file) {
    Traced t{bundled_layout(file), {}, {}};
    t.paths = rv::trace_layout(t.layout, rv::material_library_for(t.layout));
    t.sheet = rv::build_sheet(t.layout, t.paths);
    return t;
}

size_t index_of(const rv::Layout& l, const std::string& id) {
    for (size_t i = 0; i < l.elements.size(); ++i)
        if (l.elements[i].id == id) return i;
    FAIL("no element " << id);
    return 0;
}

// Every point of the table lies in some tile: the tiles' edges cut the table into cells, and a
// union of closed rectangles covers the table exactly when it covers each cell's centre.
void require_tiles_cover(double width_mm, double height_mm, const rv::Tiling& t) {
    std::set<double> xs{0, width_mm}, ys{0, height_mm};
    for (const rv::Tile& tile : t.tiles) {
        for (double x : {tile.x0_mm, tile.x1_mm})
            if (x > 0 && x < width_mm) xs.insert(x);
        for (double y : {tile.y0_mm, tile.y1_mm})
            if (y > 0 && y < height_mm) ys.insert(y);
    }
    const std::vector<double> vx(xs.begin(), xs.end()), vy(ys.begin(), ys.end());
    for (size_t i = 0; i + 1 < vx.size(); ++i)
        for (size_t j = 0; j + 1 < vy.size(); ++j) {
            const double cx = (vx[i] + vx[i + 1]) / 2, cy = (vy[j] + vy[j + 1]) / 2;
            const bool covered =
                std::any_of(t.tiles.begin(), t.tiles.end(), [&](const rv::Tile& tile) {
                    return cx >= tile.x0_mm && cx <= tile.x1_mm && cy >= tile.y0_mm &&
                           cy <= tile.y1_mm;
                });
            INFO("cell centre (" << cx << ", " << cy << ") of a " << width_mm << " x " << height_mm
                                 << " mm table");
            REQUIRE(covered);
        }
}

}  // namespace

TEST_CASE("holes sit half a pitch in from the lower-left corner", "[build_sheet]") {
    rv::Table table;  // 900 x 600 mm, 25 mm grid
    const rv::HoleGrid g = rv::hole_grid(table);
    CHECK(g.columns == 36);  // 12.5 … 887.5 mm
    CHECK(g.rows == 24);     // 12.5 … 587.5 mm
    const auto corner = rv::hole_of(table, {12.5, 12.5});
    REQUIRE(corner);
    CHECK(corner->column == 0);
    CHECK(corner->row == 0);
    CHECK(corner->offset_mm.norm() == 0);
    // On the line between two holes' squares the point counts to the square to the right/above.
    const auto edge = rv::hole_of(table, {25, 50});
    REQUIRE(edge);
    CHECK(edge->column == 1);
    CHECK(edge->row == 2);
    CHECK_THAT(edge->offset_mm.x(), near(-12.5, 1e-12));
    // The far corner takes the outermost hole.
    const auto far = rv::hole_of(table, {900, 600});
    REQUIRE(far);
    CHECK(far->column == 35);
    CHECK(far->row == 23);
    CHECK(far->on_table);
    const auto off = rv::hole_of(table, {-40, 300});
    REQUIRE(off);
    CHECK(off->column == 0);
    CHECK_FALSE(off->on_table);
    // Imperial: 600 mm holds holes up to 12.7 + 23 × 25.4 = 596.9 mm (24), 450 mm up to 444.5 mm
    // (18).
    const rv::Table imperial{600, 450, 25.4};
    CHECK(rv::hole_grid(imperial).columns == 24);
    CHECK(rv::hole_grid(imperial).rows == 18);
}

TEST_CASE("hole plus offset gives back every optic's position on every bundled layout",
          "[build_sheet]") {
    const std::vector<std::string> files = bundled_layout_files();
    REQUIRE(files.size() >= 4);
    for (const std::string& file : files) {
        INFO(file);
        const Traced t = traced(file);
        const std::vector<rv::Vec2> placed = rv::placed_positions_mm(t.layout);
        size_t checked = 0;
        for (size_t i = 0; i < t.layout.elements.size(); ++i) {
            const rv::Element& e = t.layout.elements[i];
            const rv::SheetPlace& p = t.sheet.places[i];
            INFO(e.id);
            rv::Vec2 expected = placed[i];
            if (const auto* stage = std::get_if<rv::Stage>(&e.kind)) {
                if (stage->carries.empty()) continue;
                expected = t.layout.elements[index_of(t.layout, stage->carries.front())]
                               .at_mm;  // carriage at reading 0
            }
            REQUIRE(p.at_mm);
            REQUIRE(p.hole);
            const rv::Vec2 back = p.hole->hole_mm + p.hole->offset_mm;
            CHECK_THAT(back.x(), near(expected.x(), 1e-9));
            CHECK_THAT(back.y(), near(expected.y(), 1e-9));
            // The hole is a drawn hole, and the nearest one for a point among the holes.
            const double g = t.layout.table.grid_mm;
            CHECK_THAT(p.hole->hole_mm.x(), near((p.hole->column + 0.5) * g, 1e-9));
            CHECK_THAT(p.hole->hole_mm.y(), near((p.hole->row + 0.5) * g, 1e-9));
            CHECK(p.hole->column >= 0);
            CHECK(p.hole->column < t.sheet.grid.columns);
            CHECK(p.hole->row < t.sheet.grid.rows);
            if (expected.x() > g / 2 && expected.x() < (t.sheet.grid.columns - 0.5) * g)
                CHECK(std::abs(p.hole->offset_mm.x()) <= g / 2 + 1e-9);
            if (expected.y() > g / 2 && expected.y() < (t.sheet.grid.rows - 0.5) * g)
                CHECK(std::abs(p.hole->offset_mm.y()) <= g / 2 + 1e-9);
            ++checked;
        }
        CHECK(checked >= t.layout.elements.size() - 1);
    }
}

TEST_CASE("the placement order follows each beam's hits with a stage before what it carries",
          "[build_sheet]") {
    for (const std::string& file : bundled_layout_files()) {
        INFO(file);
        const Traced t = traced(file);
        REQUIRE(t.sheet.order.along_beam.size() == t.paths.size());
        std::vector<int> listings(t.layout.elements.size(), 0);
        for (size_t b = 0; b < t.paths.size(); ++b) {
            // The elements of the hits, each at its first hit.
            std::vector<size_t> hit_order;
            for (const rv::TraceHit& h : t.paths[b].hits)
                if (std::find(hit_order.begin(), hit_order.end(), h.element) == hit_order.end())
                    hit_order.push_back(h.element);
            std::vector<size_t> listed_optics;
            const auto& steps = t.sheet.order.along_beam[b];
            for (size_t k = 0; k < steps.size(); ++k) {
                const size_t e = steps[k].element;
                ++listings[e];
                if (std::holds_alternative<rv::Stage>(t.layout.elements[e].kind)) {
                    REQUIRE(k + 1 < steps.size());
                    const rv::SheetPlace& next = t.sheet.places[steps[k + 1].element];
                    CHECK(next.carried_by == e);
                } else {
                    listed_optics.push_back(e);
                }
            }
            CHECK(listed_optics == hit_order);
        }
        for (size_t e : t.sheet.order.unmet) CHECK(listings[e] == 0);
        for (size_t e = 0; e < listings.size(); ++e)
            CHECK((listings[e] > 0) !=
                  (std::find(t.sheet.order.unmet.begin(), t.sheet.order.unmet.end(), e) !=
                   t.sheet.order.unmet.end()));
    }
    // The demo (layouts/sfg-bbo.json, read from its geometry): the pump meets the half-wave
    // plate, the cube, both telescope lenses, then the fold mirror and the stage's retroreflector;
    // the signal meets the dichroic after the pump did.
    const Traced demo = traced("sfg-bbo.json");
    std::vector<std::string> pump_start;
    for (size_t k = 0; k < 7; ++k)
        pump_start.push_back(demo.layout.elements[demo.sheet.order.along_beam[0][k].element].id);
    CHECK(pump_start ==
          std::vector<std::string>{"HWP_P", "PBS_P", "L1_P", "L2_P", "M1_P", "S1", "RR"});
    bool dichroic_placed_before = false;
    for (const rv::PlacementStep& s : demo.sheet.order.along_beam[1])
        if (demo.layout.elements[s.element].id == "DM") dichroic_placed_before = s.placed_before;
    CHECK(dichroic_placed_before);
    // The cubes' rejected light is not traced: their dumps come last.
    std::vector<std::string> unmet;
    for (size_t e : demo.sheet.order.unmet) unmet.push_back(demo.layout.elements[e].id);
    CHECK(unmet == std::vector<std::string>{"D_P", "D_S"});
}

TEST_CASE("an aim_at mirror's angle is the one the trace turned it to", "[build_sheet]") {
    const Traced demo = traced("sfg-bbo.json");
    const size_t m = index_of(demo.layout, "M3_S");
    const rv::SheetPlace& p = demo.sheet.places[m];
    CHECK(p.aimed_by_trace);
    // M3_S at (520, 500) sends the signal travelling +x down to DM at (520, 300): its normal
    // bisects −x and −y, 225°.
    CHECK_THAT(p.angle_deg, near(225.0, 1e-6));
    CHECK(demo.sheet.places[index_of(demo.layout, "M1_P")].angle_deg ==
          225.0);  // the file's normal_deg
    CHECK(demo.sheet.places[index_of(demo.layout, "M2_P")].angle_deg ==
          315.0);  // −45 brought into [0, 360)
}

TEST_CASE("parts group by what they are and not by how they are set", "[build_sheet]") {
    const Traced demo = traced("sfg-bbo.json");
    auto group_ids = [&](const std::string& id) {
        std::vector<std::string> ids;
        for (size_t e :
             demo.sheet.parts[demo.sheet.places[index_of(demo.layout, id)].part_group].elements)
            ids.push_back(demo.layout.elements[e].id);
        return ids;
    };
    // Cubes differing only in which way they are turned, lenses differing only in position.
    CHECK(group_ids("PBS_P") == std::vector<std::string>{"PBS_P", "PBS_S"});
    CHECK(group_ids("L2_P") == std::vector<std::string>{"L2_P", "L2_S"});
    CHECK(group_ids("M1_P") == std::vector<std::string>{"M1_P", "M2_P", "M3_S"});
    // Wave plates for different wavelengths are different parts.
    CHECK(group_ids("HWP_P") == std::vector<std::string>{"HWP_P"});
    size_t total = 0;
    for (const rv::PartGroup& g : demo.sheet.parts) total += g.elements.size();
    CHECK(total == demo.layout.elements.size());

    rv::Layout changed = demo.layout;
    changed.elements[index_of(changed, "L2_S")].normal_deg = 3;
    CHECK(rv::part_spec(changed.elements[index_of(changed, "L2_S")]) ==
          rv::part_spec(changed.elements[index_of(changed, "L2_P")]));
    std::get<rv::ThinChromaticLens>(
        std::get<rv::Lens>(changed.elements[index_of(changed, "L2_S")].kind).model)
        .focal_length_mm = 75;
    CHECK_FALSE(rv::part_spec(changed.elements[index_of(changed, "L2_S")]) ==
                rv::part_spec(changed.elements[index_of(changed, "L2_P")]));
}

TEST_CASE("the page tiles cover the whole table", "[build_sheet]") {
    const rv::Paper a4;
    const std::vector<std::pair<double, double>> tables = {
        {900, 600},         {600, 450}, {750, 450},   {180, 267},
        {180.0000001, 267}, {10, 10},   {1500, 3600}, {35 * 25.4, 23 * 25.4},
        {2400, 1200},       {267, 180}};
    for (const auto& [w, h] : tables) {
        const rv::Tiling t = rv::tile_table(w, h, a4);
        INFO(w << " x " << h << " mm");
        REQUIRE(t.refusal.empty());
        REQUIRE(static_cast<int>(t.tiles.size()) == t.pages_needed);
        require_tiles_cover(w, h, t);
        for (size_t k = 0; k < t.tiles.size(); ++k) {
            const rv::Tile& tile = t.tiles[k];
            CHECK(tile.page == static_cast<int>(k) + 1);
            // A tile fits on the page inside the margins.
            CHECK(tile.x1_mm - tile.x0_mm <= t.page_width_mm - 2 * a4.margin_mm + 1e-9);
            CHECK(tile.y1_mm - tile.y0_mm <= t.page_height_mm - 2 * a4.margin_mm + 1e-9);
            CHECK(std::min(t.page_width_mm, t.page_height_mm) == a4.width_mm);
        }
    }
    // A table exactly one tile in size takes one page; a hair more in width takes two; a side far
    // beyond any page limit is refused rather than counted.
    CHECK(rv::tile_table(180, 267, a4).tiles.size() == 1);
    CHECK(rv::tile_table(181, 267, a4).tiles.size() == 2);
    CHECK(rv::tile_table(180.0000001, 267, a4).tiles.size() == 2);
    CHECK_FALSE(rv::tile_table(1e300, 1e300, a4).refusal.empty());
    // Landscape when that needs fewer pages.
    CHECK(rv::tile_table(267, 180, a4).landscape);
}

TEST_CASE("a table needing too many pages is refused", "[build_sheet]") {
    const rv::Tiling t = rv::tile_table(100000, 100000);
    CHECK(t.tiles.empty());
    CHECK(t.pages_needed > rv::kMaxSheetPages);
    CHECK(t.refusal.find("pages") != std::string::npos);
    CHECK_FALSE(rv::tile_table(900, 600, {}, 14).refusal.empty());  // the demo table needs 15
    CHECK(rv::tile_table(900, 600, {}, 15).refusal.empty());
}
