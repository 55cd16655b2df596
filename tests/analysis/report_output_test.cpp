// The report's generated light, B-integral and damage threshold (analysis/report_output.hpp)
// through build_report on the bundled SHG demo and the findings fixture.
#include <cmath>

#include "analysis/report.hpp"
#include "io/layout_reader.hpp"
#include "support/layouts.hpp"
#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near_rel;

namespace {

rv::Layout fixture(const std::string& name) {
    const rv::LayoutReadResult r = rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/tests/layouts/findings/" + name);
    REQUIRE(r.layout.has_value());
    return *r.layout;
}

bool has(const rv::RendezvousReport& r, rv::Finding::Kind k) {
    for (const rv::Finding& f : r.findings)
        if (f.kind == k) return true;
    return false;
}

}  // namespace

TEST_CASE("an unrealistic intensity gets the damage and B-integral findings", "[report-output]") {
    const rv::RendezvousReport r = rv::build_report(fixture("shg-damage-b-integral.json"), rv::MaterialLibrary::builtin());
    // No threshold in the file: the typical femtosecond figure for BBO is used, and said so.
    REQUIRE(r.damage_thresholds.size() == 1);
    CHECK(r.damage_thresholds[0].typical);
    CHECK(r.damage_thresholds[0].regime == rv::PulseRegime::Femtosecond);
    CHECK(has(r, rv::Finding::Kind::DamageFluence));
    for (const rv::Finding& f : r.findings)
        if (f.kind == rv::Finding::Kind::DamageFluence) CHECK(f.typical_threshold);
    CHECK(has(r, rv::Finding::Kind::BIntegralBreakUp));
}

TEST_CASE("the SHG demo is realistic and its figures scale as published", "[report-output]") {
    rv::Layout layout = rv::test::bundled_layout("shg-single.json");
    const rv::RendezvousReport r = rv::build_report(layout, rv::MaterialLibrary::builtin());
    CHECK_FALSE(has(r, rv::Finding::Kind::DamageFluence));
    CHECK_FALSE(has(r, rv::Finding::Kind::DamageIntensity));
    CHECK_FALSE(has(r, rv::Finding::Kind::BIntegral));
    CHECK_FALSE(has(r, rv::Finding::Kind::BIntegralBreakUp));
    REQUIRE(r.generated);
    REQUIRE(!r.phase_matching.empty());
    // d_eff of BBO type I at θ_pm: |d31| sinθ + |d22| cosθ with d31 = 0.08, d22 = 2.2 pm/V
    // (nonlinear/nonlinear_coefficients.hpp, the cut at φ = 90°).
    const double theta = rv::deg_to_rad(r.phase_matching.front().theta_pm_deg);
    CHECK_THAT(r.generated->d_eff_pm_v, near_rel(0.08 * std::sin(theta) + 2.2 * std::cos(theta), 1e-12));
    CHECK(r.generated->h_now <= r.generated->h_best * (1 + 1e-9));
    // Twice the power: four times the SHG (undepleted pump, P2ω ∝ Pω², Boyd & Kleinman 1968),
    // twice the B-integral (B ∝ I).
    double b_crystal = 0;
    for (const rv::BIntegralReport& b : r.b_integral)
        if (b.in_crystal) b_crystal = b.b_rad;
    REQUIRE(b_crystal > 0);
    layout.beams[0].power_mw = 2 * layout.beams[0].power_mw.value();
    const rv::RendezvousReport r2 = rv::build_report(layout, rv::MaterialLibrary::builtin());
    REQUIRE(r2.generated);
    CHECK_THAT(r2.generated->average_mw_best, near_rel(4 * r.generated->average_mw_best, 1e-9));
    CHECK_THAT(r2.generated->energy_nj_now, near_rel(4 * r.generated->energy_nj_now, 1e-9));
    for (const rv::BIntegralReport& b : r2.b_integral)
        if (b.in_crystal) CHECK_THAT(b.b_rad, near_rel(2 * b_crystal, 1e-9));
}
