// Turning a wave plate for a wanted power, or for the polarization the crystal needs.
#include "solve/wave_plate.hpp"

#include <cmath>

#include "analysis/report.hpp"
#include "support/layouts.hpp"
#include "units/constants.hpp"

using rv::test::layout_from;
using rv::test::layout_json;
using rv::test::near;

namespace {

std::string attenuator(double hwp_deg) {
    return layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 800, "power_mw": 1000})",
        R"({"id": "HWP", "type": "plate", "at_mm": [100, 500], "role": "half-wave", "material": "fused-silica",
            "thickness_mm": 1, "fast_axis_deg": )" + std::to_string(hwp_deg) + R"(, "design_nm": 1064},
           {"id": "PBS", "type": "plate", "at_mm": [200, 500], "role": "polarizing-cube", "material": "N-BK7",
            "thickness_mm": 12.7, "extinction_ratio": 1e9},
           {"id": "DP", "type": "dump", "at_mm": [200, 600], "normal_deg": 270},
           {"id": "T", "type": "target", "at_mm": [500, 500]})",
        "T");
}

}  // namespace

TEST_CASE("a half-wave plate before a cube is set for a wanted power", "[solve][polarization]") {
    // Malus's law (Hecht, Optics, §8.2) through a half-wave plate at θ: P = P0 cos²(2θ); a
    // quarter of the power wants 2θ = 60°, θ = 30° (the setting nearest the plate's 0°).
    const rv::Layout l = layout_from(attenuator(0));
    const rv::WavePlateResult r = rv::set_wave_plate(l, rv::material_library_for(l), {"HWP", "", 250.0});
    REQUIRE(r.error.empty());
    CHECK(r.beam == "b");
    CHECK_THAT(r.angle_deg, near(30.0, 0.01));
    CHECK_THAT(r.power_mw, near(250.0, 0.01));
    CHECK(r.reached);
    // The new layout reports that power; the input is unchanged.
    const rv::RendezvousReport after = rv::build_report(r.layout, rv::material_library_for(r.layout));
    CHECK_THAT(*after.beams[0].target_power_mw, near(250.0, 0.01));
    CHECK(std::get<rv::Plate>(l.find("HWP")->kind).fast_axis_deg == 0);
    // More than the source cannot be had: the closest is all of it, said so.
    const rv::WavePlateResult too_much = rv::set_wave_plate(l, rv::material_library_for(l), {"HWP", "", 1500.0});
    CHECK_FALSE(too_much.reached);
    CHECK_THAT(too_much.power_mw, near(1000.0, 1e-4));
}

TEST_CASE("a wave plate that is not one is refused", "[solve][polarization]") {
    const rv::Layout l = layout_from(attenuator(0));
    CHECK(rv::set_wave_plate(l, rv::material_library_for(l), {"PBS", "", 250.0}).error ==
          "\"PBS\" is not a half- or quarter-wave plate of the layout");
    CHECK(rv::set_wave_plate(l, rv::material_library_for(l), {"HWP", "nobody", 250.0}).error == "nobody does not pass HWP");
}

TEST_CASE("the signal's plate is turned for the crystal's ordinary polarization", "[solve][polarization]") {
    // The SFG demo (type-I ooe in BBO, axis plane vertical: o is horizontal). The signal's
    // half-wave plate sits before its cube, which passes horizontal light: the most o power is
    // the most through the cube, all 300 mW, with the plate's axis along H (0° or 90°).
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    const rv::WavePlateResult r = rv::set_wave_plate(l, rv::material_library_for(l), {"HWP_S", "", std::nullopt});
    REQUIRE(r.error.empty());
    CHECK_THAT(std::remainder(r.angle_deg, 90.0), near(0.0, 0.02));
    CHECK_THAT(r.useful_mw, near(300.0, 0.05));
    CHECK(r.useful_mw > r.useful_before_mw);
}
