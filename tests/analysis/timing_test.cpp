// Arrival times: glass in the path and a retroreflector stage.
#include "analysis/timing.hpp"

#include <cmath>

#include "materials/dispersion.hpp"
#include "optics/tilted_plate.hpp"
#include "support/layouts.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"

using rv::test::layout_from;
using rv::test::layout_json;
using rv::test::near;

namespace {
double arrival(const std::string& elements, double nm) {
    const rv::Layout l = layout_from(layout_json(
        R"({"id": "b", "wavelength_nm": )" + std::to_string(nm) +
            R"(, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 500})",
        elements, "T"));
    const rv::Path p = rv::trace_layout(l, rv::material_library_for(l))[0];
    REQUIRE(p.target_hit);
    return rv::arrival_time_fs(l, p, *p.target_hit);
}
}  // namespace

TEST_CASE("a tilted plate delays the pulse by L[n_g − n_g,air cos(θ − θ')]/c", "[timing]") {
    // docs/physics.md §7 (dichroic substrate in transmission, derived there): 1 mm fused silica at
    // 45°, 800 nm: 1.92837 ps with the catalogue (air-relative) group index; this tool uses the
    // absolute index n_rel·n_air (§3.1 note), about 1.5 fs more.
    const std::string target = R"({"id": "T", "type": "target", "at_mm": [200, 500], "aperture_mm": 50})";
    const double with_plate = arrival(
        R"({"id": "P", "type": "plate", "at_mm": [100, 500], "normal_deg": 135, "material": "fused-silica", "thickness_mm": 1}, )" + target, 800);
    const double without = arrival(target, 800);
    const rv::MaterialLibrary& lib = rv::MaterialLibrary::builtin();
    const double ng = rv::absolute_index(*lib.find("fused-silica"), *lib.find("air"), 800).group_index;
    const double ng_air = rv::sample_index(*lib.find("air"), 800).group_index;
    const double n = rv::sample_index(*lib.find("fused-silica"), 800).index;
    const rv::TiltedPlate p = rv::tilted_plate(1, n, rv::kPi / 4);
    const double expected =
        p.glass_path_mm * (ng - ng_air * std::cos(rv::kPi / 4 - p.internal_angle_rad)) / rv::kSpeedOfLight_mm_per_fs;
    CHECK_THAT(with_plate - without, near(expected, 1e-6));
    CHECK_THAT(with_plate - without, near(1928.37, 3.0));
}

TEST_CASE("one mm of retroreflector stage travel is 6.673150 ps at 800 nm", "[timing][stage]") {
    // docs/physics.md §7: Δt = 2 n_g,air d / c; 6.673 150 ps per mm in standard air at 800 nm
    // (Ciddor 1996, n_g = 1.000 27997).
    auto with_stage = [](double position) {
        return arrival(R"({"id": "M1", "type": "mirror", "at_mm": [100, 500], "normal_deg": 135},
               {"id": "RR", "type": "retroreflector", "at_mm": [110, 700], "normal_deg": -90, "aperture_mm": 50.8},
               {"id": "S", "type": "stage", "carries": ["RR"], "axis_deg": 90, "position_mm": )" +
                           std::to_string(position) + R"(, "travel_mm": [-25, 25]},
               {"id": "T", "type": "target", "at_mm": [120, 550], "normal_deg": 90})", 800);
    };
    CHECK_THAT(with_stage(1.0) - with_stage(0.0), near(6673.150, 0.01));
}
