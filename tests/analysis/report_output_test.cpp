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

TEST_CASE("glass GDD in one arm lowers the generated power by the Gaussian pulse law", "[report-output][pulse]") {
    // The SFG demo with a crystal short enough that GVM does not matter (G within 1e-3 of 1),
    // then the signal chirped by 25 mm of N-SF11 before the layout (input_gdd_fs2).
    rv::Layout layout = rv::test::bundled_layout("sfg-bbo.json");
    for (rv::Element& e : layout.elements)
        if (auto* x = std::get_if<rv::Crystal>(&e.kind)) x->length_mm = 0.02;
    const rv::RendezvousReport r = rv::build_report(layout, rv::material_library_for(layout));
    REQUIRE(r.generated);
    REQUIRE(r.phase_matching.front().sum_frequency);
    CHECK(r.generated->pulse_factor_best > 0.999);
    // The generated power takes each pulse at the target (BeamAtTarget::pulse).
    const rv::ReportBeam& pump = r.beams[r.phase_matching.front().first_beam];
    const size_t signal_index = r.phase_matching.front().second_beam;
    const rv::ReportBeam& signal = r.beams[signal_index];
    REQUIRE(pump.at_target.pulse.fwhm_fs);
    REQUIRE(signal.at_target.pulse.fwhm_fs);
    CHECK(r.generated->pulse1_fwhm_fs == *pump.at_target.pulse.fwhm_fs);
    CHECK(r.generated->pulse2_fwhm_fs == *signal.at_target.pulse.fwhm_fs);

    // GDD of 25 mm of N-SF11 at the signal's wavelength: L λ³/(2π c²) d²n/dλ² (Diels & Rudolph
    // 2006, ch. 1), n from the SCHOTT Sellmeier formula of N-SF11 (data sheet coefficients),
    // d²n/dλ² by a central difference of 1e-3 µm.
    auto n_sf11 = [](double um) {
        const double l2 = um * um;
        return std::sqrt(1 + 1.73759695 * l2 / (l2 - 0.013188707) + 0.313747346 * l2 / (l2 - 0.0623068142) +
                         1.89878101 * l2 / (l2 - 155.23629));
    };
    const double um = signal.wavelength_nm / 1000, d = 1e-3, c_um_per_fs = 0.299792458;
    const double d2n = (n_sf11(um + d) - 2 * n_sf11(um) + n_sf11(um - d)) / (d * d);
    const double glass_gdd_fs2 = 25 * 1000 * um * um * um / (2 * rv::kPi * c_um_per_fs * c_um_per_fs) * d2n;
    CHECK(glass_gdd_fs2 > 3000);  // a flint glass in the visible: of the order of 190 fs²/mm
    layout.beams[signal_index].input_gdd_fs2 = layout.beams[signal_index].input_gdd_fs2.value_or(0) + glass_gdd_fs2;
    const rv::RendezvousReport chirped = rv::build_report(layout, rv::material_library_for(layout));
    REQUIRE(chirped.generated);
    CHECK(chirped.generated->pulse_factor_best > 0.999);
    // τ = τ0 √(1 + (4 ln2 φ2/τ0²)²) (Diels & Rudolph 2006, §1.2.3) with the signal's whole GDD
    // at the target (the path's plus the new glass), τ0 the source's length.
    const double tau0 = layout.beams[signal_index].pulse_fwhm_fs.value();
    const double phi2 = signal.at_target.pulse.gdd_fs2 + glass_gdd_fs2;
    const double x = 4 * std::log(2.0) * phi2 / (tau0 * tau0);
    const double tau_signal = tau0 * std::sqrt(1 + x * x);
    CHECK_THAT(chirped.generated->pulse2_fwhm_fs, near_rel(tau_signal, 1e-9));
    // Quasi-static SFG of Gaussian pulses of energies E1, E2: the generated energy ∝ ∫P1P2 dt =
    // E1 E2 √(4 ln2/π) / √(τ1² + τ2²) (Gaussian integral, written out here), the rest unchanged.
    const double tau_pump = r.generated->pulse1_fwhm_fs, tau_signal_before = r.generated->pulse2_fwhm_fs;
    const double expected_ratio = std::sqrt(tau_pump * tau_pump + tau_signal_before * tau_signal_before) /
                                  std::sqrt(tau_pump * tau_pump + tau_signal * tau_signal);
    CHECK(expected_ratio < 0.95);
    CHECK_THAT(chirped.generated->energy_nj_best / r.generated->energy_nj_best, near_rel(expected_ratio, 2e-3));
    CHECK_THAT(chirped.generated->average_mw_best / r.generated->average_mw_best, near_rel(expected_ratio, 2e-3));
}
