// Tolerancing after alignment: the adjusters in the file, the pass rate of aligned builds, the
// error that limits them and the change that helps most.
#include <cmath>

#include "analysis/balance.hpp"
#include "io/layout_writer.hpp"
#include "solve/tolerance.hpp"
#include "support/layouts.hpp"

using rv::test::near;

namespace {

// The bundled SFG demo with the stage at zero delay (analysis/balance.hpp) and the crystal
// replaced by a plain target (no phase line), so that only the errors given decide.
rv::Layout balanced_demo_without_crystal(const rv::Tolerances& tolerances) {
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    l = rv::balance_delay(l, rv::material_library_for(l)).layout;
    for (rv::Element& e : l.elements)
        if (e.id == "X") e.kind = rv::Target{};
    l.goals.tolerance = tolerances;
    return l;
}

}  // namespace

TEST_CASE("a stage error alone passes every build with the stage re-zeroed and the analytic fraction without", "[tolerance][alignment]") {
    // Only the stage's repeatability, uniform on ±t = 0.02 mm. The retroreflector doubles the
    // pump path: the delay changes by k = 2 n_g,air / c per mm of stage, n_g,air(1030 nm) ≈
    // 1.00028 (Ciddor 1996 standard air, from memory; it enters k to 3e-4 only), c =
    // 2.99792458e-4 mm/fs: k = 2 × 1.00028 / 2.99792458e-4 = 6673.2 fs/mm.
    // The time line is met when |delay| ≤ 0.2 × √(250² + 120²) fs = 0.2 × 277.31 = 55.46 fs
    // (README verdict: max_delay_xcorr 0.2 of the cross-correlation FWHM), i.e. |δ| ≤
    // 55.46 / 6673.2 = 0.008311 mm. For δ uniform on ±0.02 mm that is a fraction
    // 0.008311 / 0.02 = 0.4155 of the builds (space is met by the balanced demo; phase does
    // not apply to a plain target).
    rv::Tolerances t{0, 0, 0, 0.02, std::nullopt};
    t.adjust = rv::ToleranceAdjusters{};  // no adjuster
    rv::Layout l = balanced_demo_without_crystal(t);
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const rv::ToleranceReport without = rv::analyse_tolerances(l, lib, 4000, 11);
    REQUIRE(without.error.empty());
    CHECK(without.aligned_passes);
    CHECK(without.space_rate == 1.0);
    CHECK(without.phase_rate == 1.0);
    // Binomial spread of 4000 builds: √(0.4155 × 0.5845 / 4000) = 0.0078; 4 of them allowed.
    CHECK_THAT(without.pass_rate, near(0.4155, 0.031));
    CHECK_THAT(without.time_rate, near(0.4155, 0.031));
    // The stage is then what limits, and re-zeroing it is the change that helps most.
    CHECK(without.limiting_error == "S1 stage position");
    CHECK(without.limiting_share == 1.0);
    REQUIRE(without.recommendation);
    CHECK(without.recommendation->kind == rv::ToleranceChange::Kind::Stage);
    CHECK(without.recommendation->pass_rate == 1.0);

    l.goals.tolerance.adjust->stage = "S1";
    const rv::ToleranceReport with = rv::analyse_tolerances(l, lib, 500, 11);
    REQUIRE(with.error.empty());
    CHECK(with.pass_rate == 1.0);
    CHECK(with.adjusters.size() == 1);
    CHECK(!with.recommendation);
}

TEST_CASE("the lens whose focal-length error dominates is named as the limiting error", "[tolerance][alignment]") {
    // Beam B is expanded 4× by LB1 (f = −25 mm) and LB2 (f = +100 mm), then both beams are
    // focused by LF (f = 100 mm) onto T. Its input waist (190 µm, z_R = π w²/λ = 145.4 mm at
    // 780 nm) sits at LB1; after LB1 the waist is virtual at s' = f/(1 + (f/z_R)²) = −24.28 mm
    // (Self, Appl. Opt. 22, 658 (1983), input waist at the lens), so LB2 stands 100 − 24.28 =
    // 75.72 mm after LB1 to collimate. Beam A: 1 mm waist at LF. Both focus to ≈ 33 µm with
    // z_R ≈ 3.3 mm (1030 nm) and 4.3 mm (780 nm): the space line allows 0.3 × 3.3 = 0.98 mm
    // between the waists.
    // A fractional error ε of a lens's focal length changes its power by ε/|f|. After the 4×
    // telescope LB1's change is divided by M² = 16: the vergence changes by ε/400 mm⁻¹ (LB1)
    // and ε/100 mm⁻¹ (LB2), and LF turns a vergence V into a focus shift f_F² V: 25 ε mm and
    // 100 ε mm. With ε up to 3 %: LB1 alone shifts B's waist by ≤ 0.75 mm (within 0.98), LB2 by
    // up to 3 mm. LF's error shifts both waists alike (ideal lens, one focal length for both).
    // So the failing builds fail by LB2, and without its error they pass.
    rv::Layout l = rv::test::layout_from(rv::test::layout_json(
        R"({"id": "A", "wavelength_nm": 1030, "start_mm": [150, 300], "direction_deg": 0, "waist_um": 1000, "waist_at_mm": 250, "pulse_fwhm_fs": 200},
           {"id": "B", "wavelength_nm": 780, "start_mm": [300, 450], "direction_deg": -90, "waist_um": 190, "waist_at_mm": 20, "pulse_fwhm_fs": 200})",
        R"({"id": "LB1", "type": "lens", "at_mm": [300, 430], "normal_deg": 90, "focal_length_mm": -25},
           {"id": "LB2", "type": "lens", "at_mm": [300, 354.28], "normal_deg": 90, "focal_length_mm": 100},
           {"id": "DM", "type": "dichroic", "at_mm": [300, 300], "normal_deg": 45, "edge_nm": 900, "reflects": "shorter", "substrate": {"glass": "fused-silica", "thickness_mm": 0.01}},
           {"id": "LF", "type": "lens", "at_mm": [400, 300], "focal_length_mm": 100},
           {"id": "T", "type": "target", "at_mm": [500, 300]})",
        "T"));
    rv::Tolerances t{0, 0, 0.03, 0, std::nullopt};
    t.adjust = rv::ToleranceAdjusters{};
    l.goals.tolerance = t;
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const rv::ToleranceReport r = rv::analyse_tolerances(l, lib, 400, 5);
    REQUIRE(r.error.empty());
    CHECK(r.nominal_passes);
    // Failures: |100 ε| beyond ≈ 0.98 mm, about two thirds of the builds.
    CHECK(r.pass_rate > 0.15);
    CHECK(r.pass_rate < 0.6);
    CHECK(r.limiting_error == "LB2 focal length");
    CHECK(r.limiting_share > 0.9);
    // Refocusing LB2 (or any lens of B's arm) or a tighter LB2 raises the pass rate; it is
    // computed on the same builds, so it must beat the pass rate of those builds as they are.
    REQUIRE(r.recommendation);
    CHECK(r.recommendation->pass_rate > r.checked_pass_rate);
}

TEST_CASE("the demo after balancing keeps its overlap once each build is aligned", "[tolerance][alignment]") {
    // Unaligned, the demo's builds miss each other at the crystal (the mirrors' angle errors put
    // the chief rays ≈ 100 µm apart against 25 µm waists: overlap 0 at every percentile). With
    // the default adjusters (the stage re-zeroed, M3_S, an aim_at mirror, walking the signal
    // onto the pump) the median combined overlap after alignment must be well above 0.
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    l = rv::balance_delay(l, lib).layout;
    const rv::ToleranceReport r = rv::analyse_tolerances(l, lib, 200, 3);
    REQUIRE(r.error.empty());
    REQUIRE(r.adjusters.size() == 2);
    CHECK(r.adjusters[0] == "stage S1 re-zeroed");
    CHECK(r.adjusters[1] == "M3_S walk signal onto the target");
    CHECK(r.overlap.p50 > 0.5);
    CHECK(r.lateral_um.p95 < 5);
    CHECK(r.time_rate == 1.0);
    // The crystal as the demo sets it does not phase-match (sinc² ≈ 0.09): told, and no build passes.
    CHECK(!r.aligned_passes);
    // The run judges the aligned nominal as the report does (one evaluation).
    const rv::RendezvousReport report = rv::build_report(r.aligned, lib);
    const rv::JudgeContext ctx = rv::judge_context(r.aligned, lib, report);
    const rv::Judgement j = rv::judge(r.aligned, ctx, rv::evaluate_beams_at_target(r.aligned, lib));
    REQUIRE(!report.phase_matching.empty());
    CHECK_THAT(j.phase_factor, near(report.phase_matching.front().sinc2_now, 1e-12));
    CHECK(j.space == report.verdict.space.met);
    CHECK(j.time == report.verdict.time.met);
    CHECK(j.phase == report.verdict.phase.met);
    CHECK(r.phase_rate == 0.0);
    CHECK(r.pass_rate == 0.0);
}

TEST_CASE("the adjusters key round-trips through the writer and empty differs from absent", "[tolerance][writer]") {
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    rv::ToleranceAdjusters a;
    a.stage = "S1";
    a.walk = {{"M1_P", "M2_P"}, {"M3_S"}};
    a.refocus = {"L2_S"};
    a.crystal = "X";
    l.goals.tolerance.adjust = a;
    const rv::LayoutReadResult back = rv::read_layout(rv::write_layout(l));
    REQUIRE(back.layout);
    CHECK(back.layout->goals.tolerance.adjust == a);
    l.goals.tolerance.adjust = rv::ToleranceAdjusters{};
    const rv::LayoutReadResult empty = rv::read_layout(rv::write_layout(l));
    REQUIRE(empty.layout);
    REQUIRE(empty.layout->goals.tolerance.adjust);
    CHECK(empty.layout->goals.tolerance.adjust->walk.empty());
}

TEST_CASE("a walk mirror that reflects no beam is an error at its entry", "[tolerance][alignment]") {
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    rv::ToleranceAdjusters a;
    a.walk = {{"M1_P", "L2_P"}};  // a lens: the reader refuses it; built here, the analysis must too
    l.goals.tolerance.adjust = a;
    const rv::ToleranceReport r = rv::analyse_tolerances(l, rv::material_library_for(l), 10, 1);
    CHECK(r.error_pointer == "/goals/tolerance/adjust/walk/0/1");
    CHECK(r.error.find("L2_P") != std::string::npos);
}
