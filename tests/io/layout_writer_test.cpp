// Writing layouts: canonical text, round trips, atomic saving.
#include "io/atomic_file.hpp"
#include "io/layout_writer.hpp"

#include <chrono>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "io/layout_reader.hpp"
#include "support/tolerance.hpp"

namespace {
const std::filesystem::path kLayouts = std::filesystem::path(RV_SOURCE_DIR) / "layouts";

std::string slurp(const std::filesystem::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::ostringstream s;
    s << in.rdbuf();
    return s.str();
}

std::vector<std::filesystem::path> bundled_layouts() {
    std::vector<std::filesystem::path> out;
    for (const auto& e : std::filesystem::directory_iterator(kLayouts)) {
        const std::string name = e.path().filename().string();
        if (e.path().extension() == ".json" && name != "schema.json" && name != "lenses.json")
            out.push_back(e.path());
    }
    std::sort(out.begin(), out.end());
    return out;
}
}  // namespace

TEST_CASE("bundled layouts are canonical and round-trip", "[writer]") {
    const auto files = bundled_layouts();
    REQUIRE(!files.empty());
    for (const auto& path : files) {
        CAPTURE(path.filename().string());
        const rv::LayoutReadResult first = rv::read_layout_file(path);
        REQUIRE(first.layout);
        CHECK(first.diagnostics.empty());
        const std::string text = rv::write_layout(*first.layout);
        // Saving a loaded bundled file reproduces it byte for byte.
        CHECK(text == slurp(path));
        // load → save → load gives an equal layout.
        const rv::LayoutReadResult second = rv::read_layout(text);
        REQUIRE(second.layout);
        CHECK(*second.layout == *first.layout);
    }
}

TEST_CASE("non-default values survive a round trip", "[writer]") {
    const rv::LayoutReadResult r = rv::read_layout(R"({"format": "rendezvous-layout", "version": 1, "name": "all keys",
      "table": {"size_mm": [600, 450], "grid_mm": 25.4},
      "materials": [{"id": "my-glass", "sellmeier": {"b": [1.03961212, 0.231792344], "c_um2": [0.00600069867, 0.0200179144]}, "range_nm": [400, 1600], "source": "invented for a test"}],
      "beams": [{"id": "a", "wavelength_nm": 532.1, "start_mm": [0, 10], "direction_deg": 0.5, "waist_um": [400, 420], "waist_at_mm": [-10, -12], "m2": [1.1, 1.3], "pulse_fwhm_fs": 80, "emit_time_fs": -15, "polarization": "linear", "polarization_angle_deg": 30, "polarized_fraction": 0.9, "power_mw": 12.5, "repetition_rate_khz": 80000}],
      "elements": [{"id": "W", "type": "plate", "at_mm": [50, 10], "normal_deg": 10, "aperture_mm": 12.7, "role": "quarter-wave", "material": "my-glass", "thickness_mm": 2, "fast_axis_deg": 45, "design_nm": 800, "retarder_material": "quartz", "order": 3, "transmission": 0.98},
                   {"id": "C", "type": "plate", "at_mm": [70, 10], "role": "polarizing-cube", "material": "N-BK7", "thickness_mm": 10, "extinction_ratio": 500, "reflects": "right"},
                   {"id": "Z", "type": "plate", "at_mm": [80, 10], "role": "polarizer", "material": "N-BK7", "thickness_mm": 2, "fast_axis_deg": 30},
                   {"id": "L", "type": "lens", "at_mm": [100, 10], "front_radius_mm": 51.5, "back_radius_mm": -200, "center_thickness_mm": 5, "glass": "N-SF11"},
                   {"id": "M", "type": "mirror", "at_mm": [150, 10], "radius_of_curvature_mm": 400, "aim_at": "X", "retardance_deg": 12},
                   {"id": "S", "type": "stage", "carries": ["M"], "axis_deg": 180, "position_mm": 2.5, "travel_mm": [-5, 5]},
                   {"id": "X", "type": "crystal", "at_mm": [150, 100], "normal_deg": 90, "material": "BBO:Eimerl1987", "length_mm": 2, "cut_deg": 29.2, "phase_matching": "type-II", "optic_axis": "horizontal", "damage_fluence_j_cm2": 0.5, "damage_intensity_gw_cm2": 40}],
      "target": "X", "goals": {"waist_um": {"a": 30}}})");
    REQUIRE(r.diagnostics.empty());
    REQUIRE(r.layout);
    const std::string text = rv::write_layout(*r.layout);
    const rv::LayoutReadResult back = rv::read_layout(text);
    REQUIRE(back.layout);
    CHECK(*back.layout == *r.layout);
    CHECK(rv::write_layout(*back.layout) == text);
}

TEST_CASE("saving is atomic and leaves no temporary file", "[writer]") {
    const std::filesystem::path dir = std::filesystem::temp_directory_path() / "rv-writer-test";
    std::filesystem::remove_all(dir);
    std::filesystem::create_directories(dir);
    const rv::LayoutReadResult r = rv::read_layout_file(kLayouts / "sfg-bbo.json");
    REQUIRE(r.layout);
    const std::filesystem::path out = dir / "copy.json";
    { std::ofstream old(out); old << "old content"; }
    rv::save_layout(*r.layout, out);
    CHECK(slurp(out) == rv::write_layout(*r.layout));
    size_t files = 0;
    for (auto it = std::filesystem::directory_iterator(dir); it != std::filesystem::directory_iterator(); ++it) ++files;
    CHECK(files == 1);
    // A folder that does not exist: a clear error naming the path, nothing written.
    CHECK_THROWS_WITH(
        rv::save_layout(*r.layout, dir / "missing" / "x.json"),
        Catch::Matchers::StartsWith("cannot write " + (dir / "missing" / "x.json").string() +
                                    ": creating a temporary file"));
    std::filesystem::remove_all(dir);
}

TEST_CASE("a save removes the stale temporary files of killed saves", "[writer]") {
    // A save killed before its rename leaves ".NAME.tmp-XXXXXX"; the next save of NAME removes
    // those older than kStaleTemporary and leaves a young one (another save may be writing it)
    // and those of other files alone.
    const std::filesystem::path dir = std::filesystem::temp_directory_path() / "rv-stale-test";
    std::filesystem::remove_all(dir);
    std::filesystem::create_directories(dir);
    auto touch = [&](const char* name, std::chrono::minutes age) {
        const std::filesystem::path p = dir / name;
        { std::ofstream f(p); f << "partial"; }
        std::filesystem::last_write_time(p, std::filesystem::file_time_type::clock::now() - age);
        return p;
    };
    const auto stale = touch(".copy.json.tmp-abc123", rv::kStaleTemporary + std::chrono::minutes(1));
    const auto young = touch(".copy.json.tmp-def456", std::chrono::minutes(1));
    const auto other = touch(".other.json.tmp-ghi789", rv::kStaleTemporary + std::chrono::minutes(1));
    rv::write_file_safely(dir / "copy.json", "new");
    CHECK_FALSE(std::filesystem::exists(stale));
    CHECK(std::filesystem::exists(young));
    CHECK(std::filesystem::exists(other));
    CHECK(slurp(dir / "copy.json") == "new");
    std::filesystem::remove_all(dir);
}
