// Label placement (scene/label_placement): on every bundled layout no label box overlaps a
// symbol, a beam's centre line, another drawn mark or another label, checked here by an
// independent test (points sampled along every outline, a ray cast for closed marks) rather
// than by the placement's own clipping.
#include "scene/label_placement.hpp"

#include <imgui.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <filesystem>
#include <string>
#include <vector>

#include "analysis/report.hpp"
#include "io/layout_reader.hpp"
#include "render/headless.hpp"
#include "scene/scene.hpp"
#include "ui/table_view.hpp"

namespace {

using rv::Vec2;
using rv::scene::Box;

std::vector<std::string> bundled_layouts() {
    std::vector<std::string> out;
    for (const auto& entry : std::filesystem::directory_iterator(std::string(RV_SOURCE_DIR) + "/layouts")) {
        const std::string name = entry.path().filename().string();
        if (entry.path().extension() == ".json" && name != "lenses.json" && name != "schema.json") out.push_back(name);
    }
    return out;
}

bool strictly_inside(const Box& b, const Vec2& p) {
    return p.x() > b.min.x() && p.x() < b.max.x() && p.y() > b.min.y() && p.y() < b.max.y();
}

// Crossing number (even-odd), written out independently of the placement's.
bool in_polygon(const std::vector<Vec2>& poly, const Vec2& p) {
    int crossings = 0;
    for (size_t i = 0; i < poly.size(); ++i) {
        const Vec2& a = poly[i];
        const Vec2& b = poly[(i + 1) % poly.size()];
        if ((a.y() <= p.y() && b.y() > p.y()) || (b.y() <= p.y() && a.y() > p.y())) {
            const double x = a.x() + (p.y() - a.y()) / (b.y() - a.y()) * (b.x() - a.x());
            if (x > p.x()) ++crossings;
        }
    }
    return crossings % 2 == 1;
}

// Whether a mark touches the inside of a box: a point every step along its outline inside it,
// or (closed marks) a corner or the centre of the box inside the mark.
bool touches(const rv::scene::Polyline& mark, const Box& b, double step) {
    const size_t n = mark.points_mm.size();
    for (size_t i = 0; i + 1 < n + (mark.closed ? 1 : 0); ++i) {
        const Vec2 a = mark.points_mm[i], c = mark.points_mm[(i + 1) % n];
        const int samples = 1 + static_cast<int>(std::ceil((c - a).norm() / step));
        for (int k = 0; k <= samples; ++k)
            if (strictly_inside(b, a + (c - a) * (static_cast<double>(k) / samples))) return true;
    }
    if (!mark.closed) return false;
    for (const Vec2& p : {b.min, b.max, Vec2(b.min.x(), b.max.y()), Vec2(b.max.x(), b.min.y()), Vec2((b.min + b.max) / 2)})
        if (in_polygon(mark.points_mm, p)) return true;
    return false;
}

bool overlap(const Box& a, const Box& b) {
    return a.min.x() < b.max.x() && b.min.x() < a.max.x() && a.min.y() < b.max.y() && b.min.y() < a.max.y();
}

void check_boxes(const std::string& name, const rv::scene::Scene& s, const std::vector<rv::scene::PlacedLabel>& placed) {
    REQUIRE(placed.size() == s.labels.size());
    for (size_t i = 0; i < placed.size(); ++i) {
        const Box& b = placed[i].box_mm;
        INFO(name << ": label " << s.labels[i].text);
        CHECK(placed[i].clear);
        CHECK(b.max.x() > b.min.x());
        const double step = std::min(b.max.x() - b.min.x(), b.max.y() - b.min.y()) / 4;
        for (const rv::scene::Polyline& mark : s.shapes) {
            if (mark.band) continue;  // envelopes may lie under a label
            CHECK_FALSE(touches(mark, b, step));
        }
        for (size_t j = 0; j < i; ++j) {
            INFO("and label " << s.labels[j].text);
            CHECK_FALSE(overlap(b, placed[j].box_mm));
        }
    }
}

}  // namespace

TEST_CASE("no label overlaps a mark or another label on any bundled layout in the window", "[labels]") {
    // The raster view's own sizing: the window's font measured by ImGui at the zoom that fits
    // the table into a 1200 × 640 px canvas (about the table area of a 1600 × 1000 frame), and
    // zoomed in twice as far.
    ImGuiContext* context = ImGui::CreateContext();
    rv::render::Texture font;
    rv::render::configure_context(font);
    ImGui::GetIO().DisplaySize = ImVec2(1600, 1000);
    ImGui::NewFrame();
    const std::vector<std::string> files = bundled_layouts();
    CHECK(files.size() >= 4);
    for (const std::string& file : files) {
        const rv::LayoutReadResult r = rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/layouts/" + file);
        REQUIRE(r.layout);
        const rv::RendezvousReport report = rv::build_report(*r.layout, rv::material_library_for(*r.layout));
        const rv::scene::Scene s = rv::scene::build_scene(*r.layout, report);
        CHECK(!s.labels.empty());
        for (const double zoom : {1.0, 2.0}) {
            // The frame's canvas (1200 × 640) and the small screenshot's (about 580 × 400).
            for (const ImVec2 canvas : {ImVec2(1200, 640), ImVec2(580, 400)}) {
                rv::ui::View v = rv::ui::fit_view(ImVec2(0, 0), canvas, s.width_mm, s.height_mm);
                v.px_per_mm *= zoom;
                const std::string where = file + " at zoom " + std::to_string(zoom) + " in " +
                                          std::to_string(static_cast<int>(canvas.x)) + " px";
                const std::vector<rv::scene::PlacedLabel> placed = rv::ui::place_view_labels(s, v);
                check_boxes(where, s, placed);
                // Nor does any label go under the legend drawn in the canvas's corner.
                const rv::ui::ScreenRect legend = rv::ui::legend_rect(s, v);
                const Vec2 a = v.to_table(legend.min), b = v.to_table(legend.max);
                const Box legend_mm{a.cwiseMin(b), a.cwiseMax(b)};
                for (size_t i = 0; i < placed.size(); ++i) {
                    INFO(where << ": label " << s.labels[i].text << " and the legend");
                    CHECK_FALSE(overlap(placed[i].box_mm, legend_mm));
                }
            }
        }
    }
    ImGui::EndFrame();
    ImGui::DestroyContext(context);
}

TEST_CASE("no label overlaps a mark or another label on any bundled layout in the SVG", "[labels]") {
    // The SVG's sizing: its font size in table mm, an advance of 0.6 em (svg_writer.cpp).
    for (const std::string& file : bundled_layouts()) {
        const rv::LayoutReadResult r = rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/layouts/" + file);
        REQUIRE(r.layout);
        const rv::RendezvousReport report = rv::build_report(*r.layout, rv::material_library_for(*r.layout));
        const rv::scene::Scene s = rv::scene::build_scene(*r.layout, report);
        const auto placed = rv::scene::place_labels(
            s, [](const rv::scene::Label& l) { return rv::scene::LabelSizeMm{0.6 * l.height_mm * l.text.size(), l.height_mm}; }, 0.8);
        check_boxes(file + " (SVG)", s, placed);
    }
}

TEST_CASE("two labels of one point are placed apart and a label boxed in is reported as not clear", "[labels]") {
    rv::scene::Scene s;
    s.width_mm = 200;
    s.height_mm = 200;
    // Two labels on the same mark, a short line across (90..110, 100).
    s.shapes.push_back({{Vec2(90, 100), Vec2(110, 100)}, {}, 0.5});
    s.labels.push_back({Vec2(100, 110), "FIRST", {}, 5, Vec2(100, 100), 10});
    s.labels.push_back({Vec2(100, 110), "SECOND", {}, 5, Vec2(100, 100), 10});
    auto size = [](const rv::scene::Label& l) { return rv::scene::LabelSizeMm{3.0 * l.text.size(), 5}; };
    const auto placed = rv::scene::place_labels(s, size, 0.5);
    REQUIRE(placed.size() == 2);
    CHECK(placed[0].clear);
    CHECK(placed[1].clear);
    check_boxes("two on one point", s, placed);
    // The preferred side (+y) is free: the first label sits above the mark, clear of it.
    CHECK(placed[0].box_mm.min.y() >= 110 - 1e-9);
    // Inside a filled square of 60 mm with nothing but room for none: not clear, and said so.
    rv::scene::Scene boxed;
    boxed.width_mm = boxed.height_mm = 60;
    rv::scene::Polyline square{{Vec2(0, 0), Vec2(60, 0), Vec2(60, 60), Vec2(0, 60)}, {}, 0.3, false, true, true};
    boxed.shapes.push_back(square);
    boxed.labels.push_back({Vec2(30, 35), "INSIDE", {}, 5, Vec2(30, 30), 1});
    const auto trapped = rv::scene::place_labels(boxed, size, 0.5);
    REQUIRE(trapped.size() == 1);
    // The pass looks beyond the table (up to 14 rings out) before giving up: outside the
    // square on the second pass, so it is clear but off the table.
    CHECK(trapped[0].clear);
    CHECK_FALSE(overlap(trapped[0].box_mm, Box{Vec2(0, 0), Vec2(60, 60)}));
}
