// Delay balancing and sweeps.
#include "analysis/balance.hpp"

#include <cmath>

#include "analysis/sweep.hpp"
#include "materials/dispersion.hpp"
#include "support/layouts.hpp"
#include "units/constants.hpp"

using rv::test::near;

namespace {
rv::Layout demo() { return rv::test::bundled_layout("sfg-bbo.json"); }
rv::Stage& stage(rv::Layout& l) {
    for (rv::Element& e : l.elements)
        if (auto* s = std::get_if<rv::Stage>(&e.kind)) return *s;
    FAIL("no stage");
    return std::get<rv::Stage>(l.elements[0].kind);
}
}  // namespace

TEST_CASE("balancing puts the stage at zero delay", "[balance]") {
    // Solver issue's criterion: |delay| < 1 fs after balancing.
    const rv::Layout l = demo();
    const rv::BalanceResult b = rv::balance_delay(l, rv::material_library_for(l));
    CHECK(b.stage == "S1");
    CHECK(b.zero_in_travel);
    CHECK(std::abs(b.residual_delay_fs) < 1.0);
    CHECK(b.add_path_to.empty());
    rv::Layout check = b.layout;
    CHECK_THAT(stage(check).position_mm, near(b.zero_delay_mm, 1e-12));
}

TEST_CASE("a zero outside the travel asks for fixed path in the early arm", "[balance]") {
    // With the stage at the end of its travel the pump still arrives late, so the signal arm
    // needs Δs = |Δt| c / n_g,air more air path (group delay in air, docs/physics.md §7).
    rv::Layout l = demo();
    stage(l).travel_max_mm = 25;
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const rv::BalanceResult b = rv::balance_delay(l, lib);
    CHECK_FALSE(b.zero_in_travel);
    CHECK_THAT(b.stage_set_mm, near(25, 1e-12));
    CHECK(b.residual_delay_fs > 0);
    CHECK(b.add_path_to == "signal");
    const double ng = rv::sample_index(*lib.find("air"), 780).group_index;
    CHECK_THAT(b.add_path_mm, near(b.residual_delay_fs * rv::kSpeedOfLight_mm_per_fs / ng, 1e-9));
    // (30.33 − 25) mm of stage is about twice that path (double pass): 10.7 mm.
    CHECK_THAT(b.add_path_mm, near(2 * (b.zero_delay_mm - 25), 0.01));
}

TEST_CASE("a sweep reproduces single reports at its points", "[sweep]") {
    rv::Layout l = demo();
    const rv::SweepResult s = rv::sweep_field(l, "S1", "position_mm", 29, 31, 3);
    REQUIRE(s.diagnostics.empty());
    REQUIRE(s.points.size() == 3);
    stage(l).position_mm = 30;
    const rv::RendezvousReport single = rv::build_report(l, rv::material_library_for(l));
    CHECK(s.points[1].value == 30);
    CHECK(s.points[1].report.mismatch->delay_fs == single.mismatch->delay_fs);
    CHECK(s.points[1].report.overlap->combined == single.overlap->combined);
    // Stage travel changes the delay linearly, 2 n_g,air/c per mm (docs/physics.md §7).
    const double d0 = s.points[0].report.mismatch->delay_fs, d2 = s.points[2].report.mismatch->delay_fs;
    CHECK_THAT((d2 - d0) / 2, near(single.stage->delay_per_mm_fs, 1e-6));
}

TEST_CASE("a sweep of a position coordinate and of a per-plane value", "[sweep]") {
    const rv::Layout l = demo();
    const rv::SweepResult s = rv::sweep_field(l, "X", "at_mm[0]", 755, 757, 2);
    REQUIRE(s.diagnostics.empty());
    CHECK(s.points[0].report.beams[0].at_target.path_mm < s.points[1].report.beams[0].at_target.path_mm);
    const rv::SweepResult w = rv::sweep_field(l, "pump", "waist_um", 900, 1100, 2);
    REQUIRE(w.diagnostics.empty());
    // A larger input waist focuses tighter (Self 1983: w0'' ∝ 1/w0 for a collimated input).
    CHECK(w.points[1].report.beams[0].at_target.tangential.waist_um < w.points[0].report.beams[0].at_target.tangential.waist_um);
}

TEST_CASE("a sweep of an unknown id or field is refused with a located message", "[sweep]") {
    const rv::Layout l = demo();
    auto message = [&](const std::string& id, const std::string& field) {
        const rv::SweepResult s = rv::sweep_field(l, id, field, 0, 1, 2);
        REQUIRE(s.diagnostics.size() == 1);
        return rv::format_diagnostic(s.diagnostics[0], "sfg.json");
    };
    CHECK(message("NOSUCH", "at_mm[0]") == "sfg.json: error: no beam or element has id \"NOSUCH\"");
    // A mistyped id or field: the closest existing one (issue 14 item 6).
    CHECK(message("S2", "position_mm") == "sfg.json: error: no beam or element has id \"S2\"; did you mean \"S1\"?");
    CHECK(message("S1", "positon_mm") ==
          "sfg.json: error: /elements/7/positon_mm (S1): \"S1\" has no \"positon_mm\" in the layout; did you mean \"position_mm\"?");
    CHECK(message("pump", "waist_mu") ==
          "sfg.json: error: /beams/0/waist_mu (pump): \"pump\" has no \"waist_mu\" in the layout; did you mean \"waist_um\"?");
    CHECK(message("X", "focal_length_mm") ==
          "sfg.json: error: /elements/17/focal_length_mm (X): \"X\" has no \"focal_length_mm\" in the layout (give it a value first)");
    CHECK(message("X", "material") == "sfg.json: error: /elements/17/material (X): \"material\" is not a number");
    CHECK(message("X", "at_mm[x]") == "sfg.json: error: expected FIELD or FIELD[INDEX] with a whole number INDEX, found \"at_mm[x]\"");
    CHECK(message("X", "at_mm[2]") == "sfg.json: error: /elements/17/at_mm (X): no element [2] in \"at_mm\"");
    // A value the layout refuses stops the sweep with the reader's message.
    const rv::SweepResult bad = rv::sweep_field(l, "X", "length_mm", -1, 1, 2);
    REQUIRE(!bad.diagnostics.empty());
    CHECK(rv::format_diagnostic(bad.diagnostics[0], "sfg.json") ==
          "sfg.json: error: /elements/17/length_mm (X): must be positive (got -1) (at length_mm = -1)");
}

TEST_CASE("a sweep past the stage travel evaluates every point and marks those outside", "[sweep]") {
    // Issue 14 item 6: S1 travels 0–50 mm; 40, 50 lie inside, 60 beyond. The point beyond is the
    // model's figure as if the stage went there: the delay keeps changing linearly.
    rv::Layout l = demo();
    const rv::SweepResult s = rv::sweep_field(l, "S1", "position_mm", 40, 60, 3);
    REQUIRE(s.diagnostics.empty());
    REQUIRE(s.points.size() == 3);
    CHECK_FALSE(s.points[0].outside_travel);
    CHECK_FALSE(s.points[1].outside_travel);
    CHECK(s.points[2].outside_travel);
    const double d0 = s.points[0].report.mismatch->delay_fs, d1 = s.points[1].report.mismatch->delay_fs;
    const double d2 = s.points[2].report.mismatch->delay_fs;
    CHECK_THAT(d2 - d1, near(d1 - d0, 1e-6));
    // The point beyond reports the stage where the sweep put it.
    CHECK(s.points[2].report.stage->position_mm == 60);
    // Other fields are not widened: a value the layout refuses still stops the sweep.
    REQUIRE_FALSE(rv::sweep_field(l, "S1", "travel_mm[1]", 5, 6, 2).diagnostics.empty());
}
