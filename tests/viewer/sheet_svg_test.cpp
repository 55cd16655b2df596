// The build sheet's pages against the table view: the same holes, every optic drawn on the
// page that holds it, pages sized in mm as the paper.
#include <catch2/catch.hpp>
#include <cmath>

#include "analysis/build_sheet.hpp"
#include "analysis/print_tiles.hpp"
#include "analysis/report.hpp"
#include "io/layout_reader.hpp"
#include "scene/scene.hpp"
#include "scene/sheet_svg.hpp"
#include "trace/trace.hpp"

namespace {
rv::Layout read(const char* name) {
    const rv::LayoutReadResult r =
        rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/layouts/" + name);
    REQUIRE(r.layout);
    return *r.layout;
}
}  // namespace

TEST_CASE("the build sheet's holes are the holes the table view draws", "[sheet_svg]") {
    for (const char* name :
         {"sfg-bbo.json", "pump-probe.json", "two-beam-microscope.json", "shg-single.json"}) {
        INFO(name);
        const rv::Layout layout = read(name);
        const rv::scene::Scene scene = rv::scene::build_scene(
            layout, rv::build_report(layout, rv::material_library_for(layout)));
        const rv::HoleGrid g = rv::hole_grid(layout.table);
        REQUIRE(scene.holes_mm.size() == static_cast<size_t>(g.columns) * g.rows);
        for (const rv::Vec2& drawn : scene.holes_mm) {
            const auto h = rv::hole_of(layout.table, drawn);
            REQUIRE(h);
            CHECK(h->offset_mm.norm() < 1e-9);  // a drawn hole is a sheet hole exactly
        }
    }
}

TEST_CASE("every optic is drawn on the page whose tile holds it", "[sheet_svg]") {
    const rv::Layout layout = read("sfg-bbo.json");
    const std::vector<rv::Path> paths = rv::trace_layout(layout, rv::material_library_for(layout));
    const rv::BuildSheet sheet = rv::build_sheet(layout, paths);
    const rv::Tiling tiling = rv::tile_table(layout.table.width_mm, layout.table.height_mm);
    const std::vector<std::string> pages =
        rv::scene::write_sheet_pages(layout, paths, sheet, tiling);
    REQUIRE(pages.size() == tiling.tiles.size());
    for (const std::string& page : pages) {
        CHECK(
            page.find("width=\"210.000mm\" height=\"297.000mm\" viewBox=\"0 0 210.000 297.000\"") !=
            std::string::npos);
        CHECK(page.find("nan") == std::string::npos);
        CHECK(page.find("inf") == std::string::npos);
    }
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        const rv::SheetPlace& p = sheet.places[i];
        if (!p.at_mm) continue;
        INFO(layout.elements[i].id);
        bool drawn = false;
        for (const rv::Tile& t : tiling.tiles)
            if (p.at_mm->x() >= t.x0_mm && p.at_mm->x() <= t.x1_mm && p.at_mm->y() >= t.y0_mm &&
                p.at_mm->y() <= t.y1_mm)
                drawn |=
                    pages[t.page - 1].find(">" + layout.elements[i].id + " (") != std::string::npos;
        CHECK(drawn);
    }
}
