// One wave of a birefringent crystal at a fixed angle: its walk-off against the index-ellipse
// formula, and its GVD and TOD against finite differences of its own index.
#include "nonlinear/wave_dispersion.hpp"

#include <cmath>

#include "materials/material_library.hpp"
#include "support/layouts.hpp"
#include "units/constants.hpp"

using rv::test::near;
using rv::test::near_rel;

TEST_CASE("walk-off of BBO's extraordinary wave from the index ellipse", "[walkoff][bbo]") {
    const rv::Material& bbo = rv::test::material("BBO");
    for (double nm : {780.0, 1030.0, 443.9}) {
        for (double theta_deg : {10.0, 26.0, 30.0, 47.0, 80.0}) {
            CAPTURE(nm, theta_deg);
            const double theta = rv::deg_to_rad(theta_deg);
            const double no = rv::sample_index(bbo, nm, rv::Axis::Ordinary).index;
            const double ne = rv::sample_index(bbo, nm, rv::Axis::Extraordinary).index;
            // Boyd, Nonlinear Optics (3rd ed., 2008) §2.3: 1/n_e(θ)² = cos²θ/n_o² + sin²θ/n_e²,
            // tan ρ = ½ n_e(θ)² (n_e⁻² − n_o⁻²) sin 2θ.
            const double ne_theta2 = 1 / (std::pow(std::cos(theta) / no, 2) + std::pow(std::sin(theta) / ne, 2));
            const double rho_boyd = std::atan(0.5 * ne_theta2 * (1 / (ne * ne) - 1 / (no * no)) * std::sin(2 * theta));
            // The same from the Poynting vector's angle to the axis, tan θ_S = (n_o/n_e)² tan θ
            // (Born & Wolf, Principles of Optics, 7th ed. 1999, §15.2): ρ = θ_S − θ.
            const double rho_born_wolf = std::atan(std::pow(no / ne, 2) * std::tan(theta)) - theta;
            const rv::CrystalIndices x = rv::crystal_indices(bbo, nm);
            const double rho = rv::walkoff_rad(x, rv::Polarity::B, theta);
            CHECK_THAT(rho, near(rho_boyd, 1e-12));
            CHECK_THAT(rho, near(rho_born_wolf, 1e-9));
            CHECK(rho > 0);  // negative uniaxial: the energy runs away from the optic axis
            CHECK(rv::walkoff_rad(x, rv::Polarity::A, theta) == 0);
        }
    }
}

TEST_CASE("GVD and TOD of an extraordinary wave by finite differences of its index", "[walkoff][dispersion]") {
    // GVD = λ³/(2πc²) n'', TOD = −λ⁴/(4π²c³)(3n'' + λn''') (Diels & Rudolph, Ultrashort Laser Pulse
    // Phenomena, 2nd ed. 2006, ch. 1), the derivatives of n_e(θ; λ) at fixed θ taken here by
    // central differences of the index the phase matching uses (λ in µm, c in µm/fs).
    const rv::Material& bbo = rv::test::material("BBO");
    const double theta = rv::deg_to_rad(29.0), l = 0.780, h = 2e-3;
    auto n = [&](double um) {
        return rv::wave_index(rv::crystal_indices(bbo, um * 1e3), rv::Polarity::B, theta).index;
    };
    const double d2 = (n(l + h) - 2 * n(l) + n(l - h)) / (h * h);
    const double d3 = (n(l + 2 * h) - 2 * n(l + h) + 2 * n(l - h) - n(l - 2 * h)) / (2 * h * h * h);
    const double c = rv::kSpeedOfLight_um_per_fs;
    const double gvd = l * l * l / (2 * rv::kPi * c * c) * d2 * 1e3;                                 // fs²/mm
    const double tod = -l * l * l * l / (4 * rv::kPi * rv::kPi * c * c * c) * (3 * d2 + l * d3) * 1e3;  // fs³/mm
    const rv::IndexSample s = rv::wave_sample(rv::crystal_indices(bbo, 780), rv::Polarity::B, theta);
    CHECK_THAT(s.index, near(n(l), 1e-12));
    CHECK_THAT(s.gvd_fs2_per_mm, near_rel(gvd, 1e-4));
    CHECK_THAT(s.tod_fs3_per_mm, near_rel(tod, 1e-3));
    // Between the ordinary and the principal extraordinary values (θ = 0 and 90°).
    const double go = rv::wave_sample(rv::crystal_indices(bbo, 780), rv::Polarity::B, 0).gvd_fs2_per_mm;
    const double ge = rv::wave_sample(rv::crystal_indices(bbo, 780), rv::Polarity::B, rv::kPi / 2).gvd_fs2_per_mm;
    CHECK_THAT(go, near_rel(rv::sample_index(bbo, 780, rv::Axis::Ordinary).gvd_fs2_per_mm, 1e-12));
    CHECK_THAT(ge, near_rel(rv::sample_index(bbo, 780, rv::Axis::Extraordinary).gvd_fs2_per_mm, 1e-12));
    CHECK(s.gvd_fs2_per_mm < std::max(go, ge));
    CHECK(s.gvd_fs2_per_mm > std::min(go, ge));
}
