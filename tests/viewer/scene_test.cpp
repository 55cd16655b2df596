// The table scene, its colours, the headless PNG and the SVG.
#include <stb_image.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <stdexcept>
#include <vector>

#include "analysis/report.hpp"
#include "io/layout_reader.hpp"
#include "render/headless.hpp"
#include "render/png.hpp"
#include "scene/clip_segment.hpp"
#include "scene/scene.hpp"
#include "scene/svg_writer.hpp"
#include "scene/wavelength_colour.hpp"
#include "ui/plot_axes.hpp"
#include "ui/plots.hpp"

using Catch::Matchers::WithinAbs;

namespace {
struct Demo {
    rv::Layout layout;
    rv::RendezvousReport report;
    rv::scene::Scene scene;
};
Demo demo(const char* name = "sfg-bbo.json") {
    const rv::LayoutReadResult r = rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/layouts/" + name);
    REQUIRE(r.layout);
    Demo d{*r.layout, rv::build_report(*r.layout, rv::material_library_for(*r.layout)), {}};
    d.scene = rv::scene::build_scene(d.layout, d.report);
    return d;
}
// Pixels within a few levels of a colour.
size_t count_colour(const unsigned char* rgba, int w, int h, rv::scene::Colour c, int tol = 6) {
    size_t n = 0;
    for (int i = 0; i < w * h; ++i) {
        const unsigned char* p = rgba + 4 * i;
        n += std::abs(p[0] - c.r) <= tol && std::abs(p[1] - c.g) <= tol && std::abs(p[2] - c.b) <= tol;
    }
    return n;
}
}  // namespace

TEST_CASE("CIE 1931 colour matching by the analytic fit", "[colour]") {
    // Wyman, Sloan & Shirley, JCGT 2(2), 2013; check values computed from docs/physics.md §8.
    struct Row { double nm, x, y, z; };
    for (const Row& r : {Row{532, 0.1820, 0.8893, 0.0374}, Row{555, 0.5173, 0.9980, 0.0057},
                         Row{633, 0.5951, 0.2350, 0.0000}}) {
        CAPTURE(r.nm);
        const rv::scene::Xyz c = rv::scene::cie1931_xyz(r.nm);
        CHECK_THAT(c.x, WithinAbs(r.x, 5e-4));
        CHECK_THAT(c.y, WithinAbs(r.y, 5e-4));
        CHECK_THAT(c.z, WithinAbs(r.z, 5e-4));
    }
}

TEST_CASE("beam colours: visible from the wavelength, invisible dashed", "[colour]") {
    // 532 nm looks green (its sRGB green channel dominates); 633 nm red. Beams outside
    // 400–700 nm are drawn dashed in false colours (docs/physics.md §8: common practice), two
    // infrared wavelengths in different ones.
    const rv::scene::BeamStyle green = rv::scene::beam_style(532);
    CHECK(green.visible);
    CHECK(green.colour.g > green.colour.r);
    CHECK(green.colour.g > green.colour.b);
    const rv::scene::BeamStyle red = rv::scene::beam_style(633);
    CHECK(red.colour.r > red.colour.g);
    CHECK_FALSE(rv::scene::beam_style(1030).visible);
    CHECK_FALSE(rv::scene::beam_style(355).visible);
    const rv::scene::Colour a = rv::scene::beam_style(780).colour, b = rv::scene::beam_style(1030).colour;
    CHECK(std::abs(a.r - b.r) + std::abs(a.g - b.g) + std::abs(a.b - b.b) > 60);
    // The window test (tests/viewer/window_test.sh) looks for these two on screen.
    CHECK((int(b.r) == 0x99 && int(b.g) == 0x2A && int(b.b) == 0x07));
    CHECK((int(a.r) == 0xBD && int(a.g) == 0x0A && int(a.b) == 0x5D));
}

TEST_CASE("the scene labels every optic and draws every beam", "[scene]") {
    const Demo d = demo();
    for (const rv::Element& e : d.layout.elements) {
        if (std::holds_alternative<rv::Stage>(e.kind)) continue;
        bool labelled = false;
        for (const rv::scene::Label& l : d.scene.labels) labelled = labelled || l.text == e.id;
        CAPTURE(e.id);
        CHECK(labelled);
    }
    for (const rv::BeamSource& b : d.layout.beams) {
        const rv::scene::Colour c = rv::scene::beam_style(b.wavelength_nm).colour;
        size_t rays = 0;
        for (const rv::scene::Polyline& p : d.scene.shapes)
            rays += !p.filled && p.dashed && p.colour.r == c.r && p.colour.g == c.g && p.colour.b == c.b;
        CAPTURE(b.id);
        CHECK(rays >= 1);
    }
    REQUIRE(d.scene.legend.size() == 4);
    CHECK(d.scene.legend[2].text.rfind("polarization:", 0) == 0);
    CHECK(d.scene.legend[3].text == "444 nm generated (SFG of pump + signal)");
    CHECK(d.scene.holes_mm.size() == 36 * 24);  // 900 × 600 mm on a 25 mm grid
}

TEST_CASE("the headless frame is a PNG with the beams in it", "[render]") {
    const Demo d = demo();
    const rv::render::Framebuffer fb = rv::render::render_frame(d.layout, d.report, d.scene, 800, 500);
    const std::vector<std::uint8_t> png = rv::render::encode_png(fb);
    int w = 0, h = 0, channels = 0;
    unsigned char* pixels = stbi_load_from_memory(png.data(), static_cast<int>(png.size()), &w, &h, &channels, 4);
    REQUIRE(pixels != nullptr);
    CHECK(w == 800);
    CHECK(h == 500);
    CHECK(count_colour(pixels, w, h, rv::scene::beam_style(1030).colour) > 10);
    CHECK(count_colour(pixels, w, h, rv::scene::beam_style(780).colour) > 10);
    CHECK(count_colour(pixels, w, h, rv::scene::Colour{255, 255, 255, 255}, 0) < static_cast<size_t>(w * h) / 2);
    stbi_image_free(pixels);
}

TEST_CASE("the SVG opens in a real renderer and shows the beams", "[render][svg]") {
    // Debian's rsvg-convert (librsvg) renders the file; the table is drawn at 1 unit = 1 mm.
    const Demo d = demo();
    const std::string svg = rv::scene::write_svg(d.scene);
    CHECK(svg.find("width=\"940.000mm\" height=\"680.000mm\"") != std::string::npos);
    const std::filesystem::path dir = std::filesystem::temp_directory_path() / "rv-svg-test";
    std::filesystem::create_directories(dir);
    { std::ofstream(dir / "demo.svg") << svg; }
    const std::string cmd = "rsvg-convert -w 1880 -o '" + (dir / "demo.png").string() + "' '" + (dir / "demo.svg").string() + "'";
    REQUIRE(std::system(cmd.c_str()) == 0);
    int w = 0, h = 0, channels = 0;
    unsigned char* pixels = stbi_load((dir / "demo.png").c_str(), &w, &h, &channels, 4);
    REQUIRE(pixels != nullptr);
    CHECK(w == 1880);
    CHECK(h == 1360);  // 2 px per mm: the aspect ratio of the drawing in mm
    CHECK(count_colour(pixels, w, h, rv::scene::beam_style(1030).colour, 12) > 30);
    stbi_image_free(pixels);
    std::filesystem::remove_all(dir);
}

TEST_CASE("the scene marks the polarization and draws the beams a cube reflects", "[scene][polarization]") {
    // The demo's cubes reflect part of each beam into a dump (drawn thinner), and each beam gets
    // a polarization mark after its half-wave plate and its cube; after a cube the light is
    // horizontal: a zigzag across the beam and no dot.
    const Demo d = demo();
    size_t branches = 0, zigzags = 0;
    auto same = [](const rv::scene::Colour& a, const rv::scene::Colour& b) { return a.r == b.r && a.g == b.g && a.b == b.b; };
    auto beam_coloured = [&](const rv::scene::Colour& c) {
        for (const rv::ReportBeam& b : d.report.beams)
            if (same(rv::scene::beam_style(b.wavelength_nm).colour, c)) return true;
        return false;
    };
    for (const rv::scene::Polyline& p : d.scene.shapes) {
        branches += p.dashed && p.width_mm == 0.4 && beam_coloured(p.colour);
        if (!same(p.colour, rv::scene::kPolarizationInk)) continue;
        // A mark is never a straight stroke (which a lens or a mirror is): a zigzag of seven
        // corners, a ring or a dot.
        CHECK(p.points_mm.size() > 2);
        zigzags += !p.closed && p.points_mm.size() == 7;
    }
    CHECK(branches == 2);
    CHECK(zigzags >= 4);  // after each source, plate and cube, and before the target, for two beams
}

TEST_CASE("polarization marks cannot be mistaken for optics: no symbol uses their ink", "[scene][polarization]") {
    for (const char* name : {"sfg-bbo.json", "shg-single.json", "two-beam-microscope.json", "pump-probe.json"}) {
        CAPTURE(name);
        const Demo d = demo(name);
        rv::RendezvousReport no_beams = d.report;
        no_beams.beams.clear();  // the optics' symbols alone
        for (const rv::scene::Polyline& p : rv::scene::build_scene(d.layout, no_beams).shapes)
            CHECK_FALSE((p.colour.r == rv::scene::kPolarizationInk.r && p.colour.g == rv::scene::kPolarizationInk.g &&
                         p.colour.b == rv::scene::kPolarizationInk.b));
    }
}

TEST_CASE("a stage's travel shows its present and zero-delay positions", "[scene][stage]") {
    // The demo's stage S1 carries RR along axis_deg; the report's zero-delay position is where
    // the ring labelled "0 fs" sits, at (zero − position) along the axis from the bar across
    // the travel that marks the present position.
    auto marks = [](const Demo& d) {
        REQUIRE(d.report.stage);
        const rv::scene::Label* zero = nullptr;
        for (const rv::scene::Label& l : d.scene.labels)
            if (l.text == "0 fs") zero = &l;
        REQUIRE(zero != nullptr);
        const rv::scene::Polyline* bar = nullptr;  // the present position: a solid 2-point stroke in the stage's grey
        for (const rv::scene::Polyline& p : d.scene.shapes)
            if (!p.dashed && p.points_mm.size() == 2 && p.width_mm == 0.8 && p.colour.r == 120 && p.colour.b == 130) bar = &p;
        REQUIRE(bar != nullptr);
        return std::make_pair(*zero, 0.5 * (bar->points_mm[0] + bar->points_mm[1]));
    };
    Demo d = demo();
    const auto [zero, present] = marks(d);
    const rv::Stage& s = std::get<rv::Stage>(d.layout.find("S1")->kind);
    const rv::Vec2 axis(std::cos(s.axis_deg * M_PI / 180), std::sin(s.axis_deg * M_PI / 180));
    const rv::Vec2 expected = present + (d.report.stage->zero_delay_mm - s.position_mm) * axis;
    CHECK_THAT(zero.anchor_mm.x(), WithinAbs(expected.x(), 1e-9));
    CHECK_THAT(zero.anchor_mm.y(), WithinAbs(expected.y(), 1e-9));
    CHECK(d.report.stage->zero_in_travel == (zero.colour.r == 120));
    // Moved to its zero-delay position, the ring sits on the bar.
    const double zero_mm = d.report.stage->zero_delay_mm;
    Demo moved = d;
    for (rv::Element& e : moved.layout.elements)
        if (e.id == "S1") std::get<rv::Stage>(e.kind).position_mm = zero_mm;
    moved.report = rv::build_report(moved.layout, rv::material_library_for(moved.layout));
    moved.scene = rv::scene::build_scene(moved.layout, moved.report);
    const auto [zero_moved, present_moved] = marks(moved);
    CHECK((zero_moved.anchor_mm - present_moved).norm() < 1e-6);
}

TEST_CASE("the rendered demo matches its golden image", "[render][golden]") {
    // tests/viewer/golden/sfg-bbo-800x500.png was made by `rendezvous render layouts/sfg-bbo.json
    // --png … --size 800x500`; after an intended change of the drawing, make it again the same
    // way and look at it before committing (DEVELOPERS.md). Small tolerance: under 0.5 % of the
    // pixels may differ by more than 32 in a channel, and the mean difference stays under 1.
    const Demo d = demo();
    const rv::render::Framebuffer fb = rv::render::render_frame(d.layout, d.report, d.scene, 800, 500);
    int w = 0, h = 0, channels = 0;
    unsigned char* golden = stbi_load(RV_SOURCE_DIR "/tests/viewer/golden/sfg-bbo-800x500.png", &w, &h, &channels, 4);
    REQUIRE(golden != nullptr);
    REQUIRE(w == 800);
    REQUIRE(h == 500);
    size_t far = 0;
    double total = 0;
    for (size_t i = 0; i < static_cast<size_t>(w) * h; ++i) {
        int worst = 0;
        for (int c = 0; c < 3; ++c) {
            const int diff = std::abs(int(golden[4 * i + c]) - int(fb.rgba[4 * i + c]));
            worst = std::max(worst, diff);
            total += diff;
        }
        far += worst > 32;
    }
    stbi_image_free(golden);
    CHECK(far < static_cast<size_t>(w) * h / 200);
    CHECK(total / (3.0 * w * h) < 1.0);
}

// Issue 19 §2: drawing has bounds that do not depend on the table's size or on a step of doubles.
namespace {
Demo hostile(void (*edit)(rv::Layout&)) {
    Demo d = demo();
    edit(d.layout);
    d.report = rv::build_report(d.layout, rv::material_library_for(d.layout));
    d.scene = rv::scene::build_scene(d.layout, d.report);
    return d;
}
rv::Stage& stage_s1(rv::Layout& l) {
    for (rv::Element& e : l.elements)
        if (e.id == "S1") return std::get<rv::Stage>(e.kind);
    throw std::logic_error("the demo has a stage S1");
}
}  // namespace

TEST_CASE("a segment is clipped to a box in doubles", "[scene][hardening]") {
    using rv::Vec2;
    const rv::scene::Box box{Vec2(0, 0), Vec2(10, 10)};
    // Hand computation: (−10, 5) → (20, 5) crosses x = 0 at t = 1/3 and x = 10 at t = 2/3.
    const auto across = rv::scene::clip_segment(Vec2(-10, 5), Vec2(20, 5), box);
    REQUIRE(across);
    CHECK(across->first == Vec2(0, 5));
    CHECK(across->second == Vec2(10, 5));
    // From inside to 1e300 mm along the diagonal: cut where it leaves the box at (10, 10).
    const auto far = rv::scene::clip_segment(Vec2(5, 5), Vec2(1e300, 1e300), box);
    REQUIRE(far);
    CHECK(far->first == Vec2(5, 5));
    CHECK_THAT(far->second.x(), WithinAbs(10, 1e-9));
    CHECK_THAT(far->second.y(), WithinAbs(10, 1e-9));
    // Wholly outside, or with an end that is not finite: nothing to draw.
    CHECK_FALSE(rv::scene::clip_segment(Vec2(20, 20), Vec2(30, 40), box));
    CHECK_FALSE(rv::scene::clip_segment(Vec2(5, 5), Vec2(std::nan(""), 5), box));
    CHECK_FALSE(rv::scene::clip_segment(Vec2(-1.7e308, 5), Vec2(1.7e308, 5), box));  // length overflows
}

TEST_CASE("a sweep's x axis takes its unit from the key's suffix", "[scene][plots]") {
    CHECK(rv::ui::unit_of_key("position_mm") == "mm");
    CHECK(rv::ui::unit_of_key("at_mm[1]") == "mm");
    CHECK(rv::ui::unit_of_key("waist_um[0]") == "µm");
    CHECK(rv::ui::unit_of_key("normal_deg") == "°");
    CHECK(rv::ui::unit_of_key("temperature_c") == "°C");
    CHECK(rv::ui::unit_of_key("pulse_fwhm_fs") == "fs");
    CHECK(rv::ui::unit_of_key("m2").empty());
    CHECK(rv::ui::unit_of_key("_mm").empty());  // a suffix alone names no field
    // Drawn in a headless frame, it fills the draw list.
    const rv::render::HeadlessContext context(400, 300);
    ImGui::NewFrame();
    ImGui::Begin("sweep");
    rv::ui::SweepCurves curves{"S1.position_mm", {0, 10, 20}, {0.1, 0.9, 0.2}, {1, 1, 1}};
    ImDrawList* draw = ImGui::GetWindowDrawList();
    const int before = draw->VtxBuffer.Size;
    rv::ui::draw_sweep_plot(draw, ImVec2(10, 10), ImVec2(300, 170), curves);
    CHECK(draw->VtxBuffer.Size > before);
    ImGui::End();
    ImGui::Render();
}

TEST_CASE("plot ticks are counted before they are placed", "[scene][hardening]") {
    // 0 to 1 in steps of 0.2: k = 0 … 5.
    CHECK(rv::ui::tick_indices(0, 1, 0.2) == std::vector<long long>{0, 1, 2, 3, 4, 5});
    // A span of 6e-13 mm at 926 mm (a Rayleigh range of 1e-13 mm): its step 1e-13 is below the
    // spacing of doubles there (1.1e-13); stepping x += step never ended. No ticks instead.
    CHECK(rv::ui::tick_indices(926, 926 + 6e-13, rv::ui::nice_step(6e-13, 6)).empty());
    CHECK(rv::ui::tick_indices(0, 1e300, 1).empty());  // more than kMaxTicks
    CHECK(rv::ui::tick_indices(0, 1, 0).empty());
}

TEST_CASE("a huge table's holes are counted not listed and its SVG stays small", "[scene][svg][hardening]") {
    // 1e5 mm square on a 25 mm grid: 4000 × 4000 = 1.6e7 holes, beyond kMaxDrawnHoles; the SVG
    // was 765 MB before (one circle per hole).
    const Demo d = hostile([](rv::Layout& l) { l.table.width_mm = l.table.height_mm = 1e5; });
    CHECK(d.scene.holes_mm.empty());
    CHECK(d.scene.holes_not_drawn == 4000LL * 4000);
    const std::string svg = rv::scene::write_svg(d.scene);
    CHECK(svg.size() < 1'000'000);
    CHECK(svg.find("mounting holes not drawn: 16000000, more than 250000") != std::string::npos);
    // 1e6 mm: 1.6e9 holes, which ran out of memory while the scene was built.
    const Demo huge = hostile([](rv::Layout& l) { l.table.width_mm = l.table.height_mm = 1e6; });
    CHECK(huge.scene.holes_not_drawn == 40000LL * 40000);
}

TEST_CASE("the SVG writer refuses a drawing beyond its size limit", "[svg][hardening]") {
    rv::scene::Scene s;
    s.width_mm = 900;
    s.height_mm = 600;
    // Each shape writes well over 10 bytes; 8 million of them exceed 64 MiB.
    rv::scene::Polyline p{{rv::Vec2(1, 1), rv::Vec2(2, 2)}, {0, 0, 0, 255}, 0.5, false, false, false, false};
    s.shapes.assign(8'000'000, p);
    CHECK_THROWS_AS(rv::scene::write_svg(s), rv::scene::SvgTooLarge);
    CHECK_THROWS_WITH(rv::scene::write_svg(s), Catch::Contains("would exceed 67108864 bytes (64 MiB) of SVG"));
}

TEST_CASE("a stage at 1e300 mm is drawn clipped in the SVG and the frame", "[scene][svg][render][hardening]") {
    const Demo d = hostile([](rv::Layout& l) {
        rv::Stage& s = stage_s1(l);
        s.travel_max_mm = 1e300;
        s.position_mm = 0;
    });
    const std::string svg = rv::scene::write_svg(d.scene);
    // No coordinate beyond the clip margin: a 1e300 coordinate printed "%.3f" is 304 characters.
    CHECK(svg.find("nan") == std::string::npos);
    CHECK(svg.find("inf") == std::string::npos);
    CHECK(svg.find("0000000000000000") == std::string::npos);
    // The frame used to crash in the draw list (a dash pattern stepped in float over 1e300 mm).
    const rv::render::Framebuffer fb = rv::render::render_frame(d.layout, d.report, d.scene, 400, 250);
    CHECK(fb.width == 400);
    CHECK(fb.rgba.size() == 400u * 250 * 4);
}

TEST_CASE("a table of 1e-9 mm renders without running away", "[render][hardening]") {
    // 1e-9 mm in an 800 px canvas is 7.5e11 px per mm: every optic lies 1e14 px off the canvas,
    // and a float dash loop over such a length never ended.
    const Demo d = hostile([](rv::Layout& l) { l.table.width_mm = l.table.height_mm = 1e-9; });
    const rv::render::Framebuffer fb = rv::render::render_frame(d.layout, d.report, d.scene, 400, 250);
    CHECK(fb.rgba.size() == 400u * 250 * 4);
}
