// Generated power of SHG and SFG (nonlinear/generated_power.hpp): the plane-wave limit, the
// Boyd–Kleinman focused SHG formula, the scaling laws and the pulse overlap with GVM, each
// against a formula written out here.
#include "nonlinear/generated_power.hpp"

#include <cmath>

#include "nonlinear/boyd_kleinman.hpp"
#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near;
using rv::test::near_rel;

namespace {

constexpr double kEps0 = 8.8541878128e-12;  // F/m, CODATA 2018
constexpr double kC = 299792458.0;          // m/s

// An invented type-I SHG case: 1030 nm in a 2 mm crystal, d_eff = 2.0 pm/V, n = 1.655 / 1.656.
rv::MixingWaves shg_case(double length_mm) {
    rv::MixingWaves w;
    w.d_eff_pm_v = 2.0;
    w.length_mm = length_mm;
    w.lambda3_nm = 515;
    w.n1 = w.n2 = 1.655;
    w.n3 = 1.656;
    w.one_field = true;
    return w;
}

// One round TEM00 beam of waist w0 (µm): the area factor S = 1/(π w0²) of a beam with itself.
double round_area_per_cm2(double w0_um) {
    return rv::overlap_area_factor_per_cm2(w0_um, w0_um, w0_um, w0_um, 1.0);
}

// Boyd & Kleinman, J. Appl. Phys. 39, 3597 (1968), eq. 2.22 in SI units:
//   P2ω = 16π² d² L Pω² h / (ε0 c nω n2ω λω³).
double bk_shg_w(double d_pm_v, double length_mm, double p_w, double h, double n1, double n2, double lambda_nm) {
    const double d = d_pm_v * 1e-12, L = length_mm * 1e-3, lambda = lambda_nm * 1e-9;
    return 16 * rv::kPi * rv::kPi * d * d * L * p_w * p_w * h / (kEps0 * kC * n1 * n2 * lambda * lambda * lambda);
}

// ξ = L/b with b = k w0² = 2π n w0²/λ (Boyd & Kleinman 1968).
double xi_of(double length_mm, double w0_um, double n, double lambda_nm) {
    const double b_mm = 2 * rv::kPi * n * std::pow(w0_um * 1e-3, 2) / (lambda_nm * 1e-6);
    return length_mm / b_mm;
}

}  // namespace

TEST_CASE("plane-wave SHG coupling", "[generated-power]") {
    // Boyd, Nonlinear Optics, 3rd ed. (2008), §2.2 with I = 2nε0c|A|²: the SHG intensity is
    //   I2ω = 8π² d² L² Iω² / (ε0 c nω² n2ω λω²)  (phase-matched),
    // written out here for 1030 nm, L = 2 mm, d = 2 pm/V.
    const rv::MixingWaves w = shg_case(2);
    const double d = 2e-12, L = 2e-3, lambda = 1030e-9;
    const double eta_m2_per_w = 8 * rv::kPi * rv::kPi * d * d * L * L / (kEps0 * kC * 1.655 * 1.655 * 1.656 * lambda * lambda);
    CHECK_THAT(rv::plane_wave_coupling_cm2_per_w(w), near_rel(eta_m2_per_w * 1e4, 1e-12));
    // The SFG coupling of the same waves as distinct fields is four times the SHG one (Boyd §2.2:
    // I3 = 8π² d² L² I1 I2/(ε0 c n1 n2 n3 λ3²), λ3 = λω/2).
    rv::MixingWaves sfg = w;
    sfg.one_field = false;
    CHECK_THAT(rv::plane_wave_coupling_cm2_per_w(sfg), near_rel(4 * eta_m2_per_w * 1e4, 1e-12));
    // At 100 MW/cm² (1e12 W/m²) the efficiency η = κ I is
    // 8π²·4e-24·4e-6·1e12/(8.854e-12·2.998e8·1.655²·1.656·1.0609e-12) = 0.0989 (hand computation).
    CHECK_THAT(rv::plane_wave_coupling_cm2_per_w(w) * 1e8, near(0.0989, 0.0002));
}

TEST_CASE("focused SHG equals the Boyd-Kleinman formula", "[generated-power]") {
    const double lambda = 1030, n = 1.655;
    for (double w0_um : {15.0, 30.0, 80.0}) {
        CAPTURE(w0_um);
        const double xi = xi_of(2, w0_um, n, lambda);
        const double h = rv::boyd_kleinman_optimum(xi).h_m;
        const rv::MixingWaves w = shg_case(2);
        const double p = 0.5;  // W peak
        const double ours = rv::generated_peak_power_w(w, p, p, round_area_per_cm2(w0_um), h / xi);
        CHECK_THAT(ours, near_rel(bk_shg_w(2, 2, p, h, n, 1.656, lambda), 1e-3));
    }
}

TEST_CASE("SHG scaling laws", "[generated-power]") {
    const double lambda = 1030, n = 1.655;
    auto shg = [&](double length_mm, double w0_um, double p_w) {
        const double xi = xi_of(length_mm, w0_um, n, lambda);
        const double h = rv::boyd_kleinman_optimum(xi).h_m;
        return rv::generated_peak_power_w(shg_case(length_mm), p_w, p_w, round_area_per_cm2(w0_um), h / xi);
    };
    // P2ω ∝ Pω² (Boyd & Kleinman 1968, undepleted pump).
    CHECK_THAT(shg(2, 30, 2.0) / shg(2, 30, 1.0), near_rel(4.0, 1e-12));
    // ∝ L at optimal focusing: ξ = 2.84 kept by w0 ∝ √L (b = L/ξ), so P ∝ L h_m(2.84).
    const double b_mm = 2 / 2.84;
    auto w0_for = [&](double b) { return 1e3 * std::sqrt(b * lambda * 1e-6 / (2 * rv::kPi * n)); };
    CHECK_THAT(shg(4, w0_for(2 * b_mm), 1) / shg(2, w0_for(b_mm), 1), near_rel(2.0, 1e-3));
    // ∝ L² loosely focused: w0 = 1 mm (ξ ≈ 2e-4), h → ξ.
    CHECK_THAT(shg(4, 1000, 1) / shg(2, 1000, 1), near_rel(4.0, 1e-3));
}

TEST_CASE("pulse overlap without and with group-velocity mismatch", "[generated-power]") {
    // No GVM: the cross-correlation of two Gaussian pulses exp(−4 ln2 Δt²/(τ1² + τ2²)) (the
    // product of two Gaussians), times √(π/(a1 + a2)), a = 4 ln2/τ².
    const double a1 = 4 * std::log(2.0) / (100.0 * 100.0), a2 = 4 * std::log(2.0) / (150.0 * 150.0);
    CHECK_THAT(rv::pulse_overlap_integral_fs(100, 150, 80, 0, 0, 2),
               near_rel(std::sqrt(rv::kPi / (a1 + a2)) * std::exp(-4 * std::log(2.0) * 80 * 80 / (100.0 * 100 + 150 * 150)),
                        1e-12));
    // The SHG of one pulse with GVM δ along L: (1/L²)∫∫ exp(−(a/2)δ²(z − z')²) dz dz', in closed
    // form G(u) = (√π u erf u − (1 − e^{−u²}))/u², u = √(a/2)|δ|L (integrating over z − z').
    for (double length_mm : {0.5, 2.0, 10.0}) {
        CAPTURE(length_mm);
        const double tau = 300, delta = 60;  // fs, fs/mm (about BBO at 1030 → 515 nm)
        const double a = 4 * std::log(2.0) / (tau * tau);
        const double u = std::sqrt(a / 2) * delta * length_mm;
        const double g = (std::sqrt(rv::kPi) * u * std::erf(u) - (1 - std::exp(-u * u))) / (u * u);
        CHECK_THAT(rv::gvm_overlap_factor(tau, tau, 0, delta, delta, length_mm), near_rel(g, 1e-6));
    }
    // Long crystal: G → √π/u, so the energy grows as L (Boyd, Nonlinear Optics, the quasi-static
    // limit fails beyond the walk-off length τ/δ).
    const double a = 4 * std::log(2.0) / (100.0 * 100.0);
    const double u = std::sqrt(a / 2) * 200 * 20;
    CHECK_THAT(rv::gvm_overlap_factor(100, 100, 0, 200, 200, 20), near_rel(std::sqrt(rv::kPi) / u, 0.05));
    // SFG: two pulses meeting at the centre with opposite walk and a delay the walk cancels at
    // one end are overlapped less than without walk; with equal walk they move together.
    CHECK(rv::gvm_overlap_factor(100, 100, 0, 50, -50, 2) < rv::gvm_overlap_factor(100, 100, 0, 0, 0, 2));
    // Equal walk δ1 = δ2 = δ: s1 − s2 = Δt stays, so G is the cross-correlation at the delay times
    // the closed form above with u = √(A/4)|δ|L, A = a1 + a2.
    const double b1 = 4 * std::log(2.0) / (100.0 * 100.0), b2 = 4 * std::log(2.0) / (120.0 * 120.0);
    const double ue = std::sqrt((b1 + b2) / 4) * 30 * 2;
    const double ge = (std::sqrt(rv::kPi) * ue * std::erf(ue) - (1 - std::exp(-ue * ue))) / (ue * ue);
    CHECK_THAT(rv::gvm_overlap_factor(100, 120, 40, 30, 30, 2),
               near_rel(std::exp(-b1 * b2 * 40 * 40 / (b1 + b2)) * ge, 1e-6));
}
