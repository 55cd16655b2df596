// Boyd–Kleinman focusing function.
#include "nonlinear/boyd_kleinman.hpp"

#include <cmath>
#include <complex>
#include <vector>

#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::kPi;
using rv::test::near;

TEST_CASE("h_m at the optimum focusing", "[boyd-kleinman]") {
    // Boyd & Kleinman, J. Appl. Phys. 39, 3597 (1968): ξ = 2.84 gives h_m = 1.068 (from memory;
    // reproduced numerically from docs/physics.md §5: 1.06772 at σ_m = 0.5736).
    const rv::BoydKleinmanOptimum o = rv::boyd_kleinman_optimum(2.84);
    CHECK_THAT(o.h_m, near(1.068, 0.0005));
    CHECK_THAT(o.sigma_m, near(0.5736, 0.002));
}

TEST_CASE("the table of h_m", "[boyd-kleinman]") {
    // docs/physics.md §5 (computed with scipy quad and bounded optimisation).
    struct Row { double xi, h_m, sigma_m; };
    for (const Row& r : {Row{0.5, 0.4631, 0.955}, Row{1, 0.7761, 0.861}, Row{2, 1.0304, 0.682},
                         Row{5, 0.9790, 0.406}, Row{10, 0.7198, 0.243}, Row{20, 0.4512, 0.136}}) {
        CAPTURE(r.xi);
        const rv::BoydKleinmanOptimum o = rv::boyd_kleinman_optimum(r.xi);
        CHECK_THAT(o.h_m, near(r.h_m, 1e-4));
        CHECK_THAT(o.sigma_m, near(r.sigma_m, 2e-3));
    }
    // Weak focusing limit h → ξ for ξ ≪ 1 at σ = 0 (Boyd & Kleinman 1968).
    CHECK_THAT(rv::boyd_kleinman_h(0, 0, 0.01), near(0.01, 1e-5));
    // σ = 0, computed from docs/physics.md §5: h(0, 2.84) = 0.5347.
    CHECK_THAT(rv::boyd_kleinman_h(0, 0, 2.84), near(0.5347, 1e-4));
}

TEST_CASE("walk-off parameter", "[boyd-kleinman]") {
    // docs/physics.md §5: ρ = 0.05562 rad, k1 = 9770 /mm: B = 2.75 (L = 1 mm), 3.89 (2), 6.15 (5), 8.69 (10).
    CHECK_THAT(rv::walkoff_parameter(0.05562, 1, 9770), near(2.75, 0.005));
    CHECK_THAT(rv::walkoff_parameter(0.05562, 2, 9770), near(3.89, 0.005));
    CHECK_THAT(rv::walkoff_parameter(0.05562, 5, 9770), near(6.15, 0.005));
    CHECK_THAT(rv::walkoff_parameter(0.05562, 10, 9770), near(8.69, 0.005));
}

TEST_CASE("h in the strong-focusing limit", "[boyd-kleinman]") {
    // Derived here from BK's h(σ, 0, ξ) = |I|²/(4ξ), I = ∫_{−ξ}^{ξ} e^{iστ}/(1 + iτ) dτ (real by
    // symmetry): I = ∫ cos(στ)/(1 + τ²) + ∫ τ sin(στ)/(1 + τ²). For ξ → ∞ with u = σξ fixed the
    // first term → π and the second → 2 Si(u), largest at u = π. So h_m ξ → (π + 2 Si(π))²/4 =
    // 11.7151 at σ_m = π/ξ (Si(π) = 1.8519370520, Abramowitz & Stegun table 5.1). BK's own
    // π²/ξ is the limit at fixed σ > 0 (residue at τ = i), not the maximum over σ.
    const double limit = std::pow(kPi + 2 * 1.8519370520, 2) / 4;
    const rv::BoydKleinmanOptimum o = rv::boyd_kleinman_optimum(1e4);
    CHECK_THAT(o.h_m * 1e4, near(limit, 0.01 * limit));
    CHECK_THAT(o.sigma_m * 1e4, near(kPi, 0.05 * kPi));
    // A huge ξ from a sub-micron focus neither overflows nor stalls.
    const rv::BoydKleinmanOptimum huge = rv::boyd_kleinman_optimum(1.3e15);
    CHECK(std::isfinite(huge.h_m));
    CHECK(huge.h_m > 0);
    CHECK(huge.h_m < 1e-13);
}

namespace {

// An independent h(σ, B, ξ): the double integral of Boyd & Kleinman 1968 as written,
//   (1/(4ξ)) ∫∫ dτ dτ' e^{iσ(τ−τ')} e^{−(B²/ξ)(τ−τ')²} / ((1 + iτ)(1 − iτ')),
// by the tensor composite Simpson rule on an n × n grid (no change of variables, no closed form).
double h_by_double_integral(double sigma, double b, double xi, int n) {
    using C = std::complex<double>;
    const double step = 2 * xi / n, a = b * b / xi;
    std::vector<C> f(n + 1), g(n + 1);
    std::vector<double> weight(n + 1), gauss(n + 1);
    for (int i = 0; i <= n; ++i) {
        const double tau = -xi + i * step;
        f[i] = std::exp(C(0, sigma * tau)) / C(1, tau);
        g[i] = std::exp(C(0, -sigma * tau)) / C(1, -tau);
        weight[i] = (i == 0 || i == n) ? 1 : (i % 2 ? 4 : 2);
        gauss[i] = std::exp(-a * (i * step) * (i * step));
    }
    C sum = 0;
    for (int i = 0; i <= n; ++i) {
        C row = 0;
        for (int j = 0; j <= n; ++j) row += weight[j] * g[j] * gauss[std::abs(i - j)];
        sum += weight[i] * f[i] * row;
    }
    return (sum * (step / 3) * (step / 3)).real() / (4 * xi);
}

}  // namespace

TEST_CASE("h with walk-off against an independent double integral", "[boyd-kleinman]") {
    // The definition (Boyd & Kleinman 1968, h(σ, B, ξ) with μ = 0, no absorption) integrated
    // directly in two dimensions; B = 3 and B = 9 are the demo and 10 mm BBO regimes.
    struct Case { double sigma, b, xi; };
    for (const Case& c : {Case{0.57, 0, 2.84}, Case{0.8, 3, 1.4}, Case{0.3, 9, 1.4},
                          Case{0.6, 3, 10}, Case{0.2, 0.5, 0.1}, Case{0.1, 9, 0.5},
                          Case{1.5, 1, 3}, Case{0, 3, 0.16}}) {
        CAPTURE(c.sigma, c.b, c.xi);
        const double reference = h_by_double_integral(c.sigma, c.b, c.xi, 1600);
        const double ours = rv::boyd_kleinman_h(c.sigma, c.b, c.xi);
        CHECK_THAT(ours, near(reference, 1e-5 * reference + 1e-9));
    }
    // Walk-off only lowers h at the optimum σ: h_m(ξ, B) < h_m(ξ, 0).
    CHECK(rv::boyd_kleinman_optimum(1.4, 3).h_m < rv::boyd_kleinman_optimum(1.4, 0).h_m);
}

TEST_CASE("h_m in the loose-focusing limit with and without walk-off", "[boyd-kleinman]") {
    // Boyd & Kleinman 1968: h → ξ for ξ ≪ 1 (B = 0). With walk-off, derived here: for ξ ≪ 1
    // the factor 1/((1 + iτ)(1 − iτ')) → 1 and σ_m → 0, so with s = τ − τ' and a = B²/ξ
    //   h → (1/(2ξ)) ∫_0^{2ξ} (2ξ − s) e^{−a s²} ds
    //     = (1/(2ξ)) [2ξ (√π/(2√a)) erf(2ξ√a) − (1 − e^{−4aξ²})/(2a)].
    const double xi = 0.01;
    CHECK_THAT(rv::boyd_kleinman_optimum(xi).h_m, near(xi, 0.01 * xi));
    for (double b : {3.0, 9.0}) {
        CAPTURE(b);
        const double a = b * b / xi, r = std::sqrt(a);
        const double limit = (2 * xi * std::sqrt(kPi) / (2 * r) * std::erf(2 * xi * r) -
                              (1 - std::exp(-4 * a * xi * xi)) / (2 * a)) /
                             (2 * xi);
        CHECK(limit < 0.95 * xi);  // walk-off matters here (4B²ξ = 0.36 and 3.24)
        CHECK_THAT(rv::boyd_kleinman_optimum(xi, b).h_m, near(limit, 0.01 * limit));
    }
}

TEST_CASE("the optimum focusing against the walk-off parameter", "[boyd-kleinman]") {
    // Boyd & Kleinman 1968: B = 0 gives ξ_m = 2.84 and h_mm = 1.068 (from memory; reproduced
    // above). As B grows h_mm falls monotonically and ξ_m moves towards 1.39 (BK's Fig. of h_mm
    // and ξ_m against B, from memory). The large-B limit, derived here: when the walk-off
    // Gaussian e^{−(B²/ξ)s²} is narrow (√ξ/B ≪ 1), G(s) → G(0) = 2 atan ξ and e^{iσs} → 1, so
    //   h → (1/(4ξ)) 2 atan ξ √(πξ)/B = (√π/(2B)) atan(ξ)/√ξ,
    // largest where 2ξ/(1 + ξ²) = atan ξ, i.e. ξ_m → 1.3917 and h_mm → 0.7116/B.
    const rv::BoydKleinmanBest zero = rv::boyd_kleinman_best_focus(0);
    CHECK_THAT(zero.xi_m, near(2.84, 0.01));
    CHECK_THAT(zero.h_mm, near(1.068, 0.0005));
    double previous_h = zero.h_mm, previous_xi = zero.xi_m;
    for (double b : {0.25, 0.5, 1.0, 2.0, 4.0, 8.0, 16.0, 30.0}) {
        CAPTURE(b);
        const rv::BoydKleinmanBest best = rv::boyd_kleinman_best_focus(b);
        CHECK(best.h_mm < previous_h);
        CHECK(best.xi_m <= previous_xi + 1e-3);
        CHECK(best.xi_m > 1.3);
        // The optimum is a maximum of the same function the report evaluates.
        CHECK_THAT(rv::boyd_kleinman_optimum(best.xi_m, b).h_m, near(best.h_mm, 1e-6));
        CHECK(rv::boyd_kleinman_optimum(best.xi_m * 1.1, b).h_m < best.h_mm);
        CHECK(rv::boyd_kleinman_optimum(best.xi_m / 1.1, b).h_m < best.h_mm);
        previous_h = best.h_mm, previous_xi = best.xi_m;
    }
    // Solve 2ξ/(1 + ξ²) = atan ξ by bisection for the derived limit.
    double lo = 1, hi = 2;
    for (int i = 0; i < 60; ++i) {
        const double m = (lo + hi) / 2;
        (2 * m / (1 + m * m) > std::atan(m) ? lo : hi) = m;
    }
    const double xi_limit = lo, h_limit_times_b = std::sqrt(kPi) / 2 * std::atan(lo) / std::sqrt(lo);
    const rv::BoydKleinmanBest large = rv::boyd_kleinman_best_focus(30);
    CHECK_THAT(large.xi_m, near(xi_limit, 0.02 * xi_limit));
    CHECK_THAT(large.h_mm * 30, near(h_limit_times_b, 0.02 * h_limit_times_b));
}
