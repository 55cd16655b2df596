// B-integral (nonlinear/b_integral.hpp) against its closed forms.
#include "nonlinear/b_integral.hpp"

#include <cmath>

#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near;
using rv::test::near_rel;

TEST_CASE("B-integral at constant intensity", "[b-integral]") {
    // B = (2π/λ) n₂ I L (Koechner, Solid-State Laser Engineering, §4.5): 1030 nm, n₂ = 3e-16 cm²/W,
    // 100 GW/cm², 2 mm: 2π/(1.03e-4 cm) · 3e-16 · 1e11 · 0.2 cm = 0.3660 rad (hand computation).
    CHECK_THAT(rv::b_integral_uniform_rad(1030, 3e-16, 1e11, 2), near(0.3660, 0.0001));
}

TEST_CASE("B-integral of a focused round beam", "[b-integral]") {
    // For one round beam, ∫ I0/(1 + ((z − z_w)/z_R)²) dz over [−L/2, L/2] gives
    //   B = (2π/λ) n₂ I0 z_R [atan((L/2 − z_w)/z_R) + atan((L/2 + z_w)/z_R)].
    for (double zr : {0.2, 1.0, 5.0})
        for (double zw : {0.0, 0.4, -1.5}) {
            CAPTURE(zr, zw);
            const rv::SlabPlane p{30, zw, zr};
            const double L = 2, lambda = 800, n2 = 2.9e-16, i0 = 2e11;
            const double expected = 2 * rv::kPi / (lambda * 1e-7) * n2 * i0 * (zr * 0.1) *
                                    (std::atan((L / 2 - zw) / zr) + std::atan((L / 2 + zw) / zr));
            CHECK_THAT(rv::b_integral_rad(lambda, n2, i0, p, p, L), near_rel(expected, 1e-6));
        }
    // A collimated beam (z_R ≫ L) sees the waist intensity all along.
    const rv::SlabPlane wide{500, 0, 1e4};
    CHECK_THAT(rv::b_integral_rad(1030, 3e-16, 1e11, wide, wide, 2), near_rel(rv::b_integral_uniform_rad(1030, 3e-16, 1e11, 2), 1e-7));
}

TEST_CASE("bundled nonlinear indices", "[b-integral]") {
    // Oxide glasses and borates near 1 µm: 1.5–4 × 10⁻¹⁶ cm²/W (common practice).
    for (const char* family : {"fused-silica", "N-BK7", "CaF2", "BBO", "LBO"}) {
        CAPTURE(family);
        const auto k = rv::kerr_index(family);
        REQUIRE(k);
        CHECK(k->n2_cm2_per_w > 1.5e-16);
        CHECK(k->n2_cm2_per_w < 4e-16);
        CHECK_FALSE(k->source.empty());
    }
    CHECK_FALSE(rv::kerr_index("air"));
}
