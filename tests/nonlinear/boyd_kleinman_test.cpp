// Boyd–Kleinman focusing function.
#include "nonlinear/boyd_kleinman.hpp"

#include <cmath>

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
