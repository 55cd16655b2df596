// Tolerance analysis: sensitivities, Monte Carlo, determinism.
#include "solve/tolerance.hpp"

#include <cmath>

#include "support/layouts.hpp"

using rv::test::near;

TEST_CASE("the Monte Carlo spread agrees with the linearized sensitivity for small tolerances", "[tolerance]") {
    // For independent errors uniform on ±t_i, σ² = Σ (∂f/∂x_i)² t_i²/3 to first order
    // (propagation of uncertainty, e.g. JCGM 100:2008 "GUM" §5.1.2): with 1 µm position errors
    // the first-order law holds and the sampled σ must agree within 10 %.
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    l.goals.tolerance = rv::Tolerances{0.001, 0, 0, 0, std::nullopt};
    l.goals.tolerance.adjust = rv::ToleranceAdjusters{};  // unaligned builds: the linear law holds for these
    const rv::ToleranceReport r = rv::analyse_tolerances(l, rv::material_library_for(l), 4000, 7);
    CHECK(r.failed == 0);
    REQUIRE(r.waist_offset_linear_std_mm > 0);
    CHECK_THAT(r.waist_offset_std_mm, rv::test::near_rel(r.waist_offset_linear_std_mm, 0.10));
}

TEST_CASE("a seed gives the same result on any number of threads", "[tolerance]") {
    const rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const rv::ToleranceReport a = rv::analyse_tolerances(l, lib, 300, 42, 1);
    const rv::ToleranceReport b = rv::analyse_tolerances(l, lib, 300, 42, 2);
    CHECK(a.waist_offset_mm.p50 == b.waist_offset_mm.p50);
    CHECK(a.delay_fs.p95 == b.delay_fs.p95);
    CHECK(a.overlap.p5 == b.overlap.p5);
    CHECK(a.waist_offset_std_mm == b.waist_offset_std_mm);
    const rv::ToleranceReport c = rv::analyse_tolerances(l, lib, 300, 43, 2);
    CHECK(a.waist_offset_std_mm != c.waist_offset_std_mm);  // another seed, other samples
}

TEST_CASE("sensitivities of the stage and a lens are what the physics says", "[tolerance]") {
    // A retroreflector stage changes the delay by 2 n_g,air/c per mm (docs/physics.md §7): about
    // −6673 fs per mm here (moving S1 shortens the pump arm). Moving the target crystal along
    // the beam by δ moves both waist offsets by −δ, so their difference does not change.
    const rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    const rv::ToleranceReport r = rv::analyse_tolerances(l, rv::material_library_for(l), 10, 1);
    bool stage = false, crystal = false;
    for (const rv::SensitivityRow& row : r.sensitivity) {
        if (row.label == "S1 stage position") {
            stage = true;
            CHECK_THAT(row.per_unit.delay_fs, near(-6673.1, 1.0));
        }
        if (row.label == "X position") {
            crystal = true;
            CHECK_THAT(row.per_unit.waist_offset_mm, near(0.0, 1e-3));
        }
    }
    CHECK(stage);
    CHECK(crystal);
    CHECK(!r.most_sensitive.empty());
    CHECK(r.most_sensitive_share > 0);
    CHECK(r.most_sensitive_share <= 1);
}
