// Gaussian beam parameters in free space and in a medium.
#include "optics/gaussian_beam.hpp"

#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near;
using rv::test::near_rel;

TEST_CASE("free-space q against the closed forms", "[gaussian]") {
    // Kogelnik & Li, Appl. Opt. 5, 1550 (1966): w(z) = w0 √(1 + (z/zR)²), R = z (1 + (zR/z)²),
    // ψ = arctan(z/zR); check values computed from them (docs/physics.md §1.1)
    // for w0 = 100 µm at 1064 nm in air.
    const rv::GaussianBeam at_waist = rv::beam_from_waist({.waist_um = 100.0, .distance_to_waist_mm = 0.0, .wavelength_nm = 1064.0});
    CHECK_THAT(rv::rayleigh_range_mm(at_waist), near(29.52625, 1e-5));
    CHECK_THAT(rv::radius_um(at_waist), near(100.0, 1e-9));
    CHECK(std::isinf(rv::wavefront_radius_mm(at_waist)));
    CHECK_THAT(rv::gouy_phase_rad(at_waist), near(0.0, 1e-15));

    struct Row { double z_mm, w_um, r_mm, gouy_deg; };
    const double zr = rv::rayleigh_range_mm(at_waist);
    for (const Row& row : {Row{zr, 141.421, 59.0525, 45.0}, Row{2 * zr, 223.607, 73.8156, 63.4349},
                           Row{100.0, 353.136, 108.718, 73.5501}}) {
        const rv::GaussianBeam b = rv::propagate(at_waist, rv::free_space(row.z_mm));
        CAPTURE(row.z_mm);
        CHECK_THAT(rv::radius_um(b), near(row.w_um, 1e-3));
        CHECK_THAT(rv::wavefront_radius_mm(b), near_rel(row.r_mm, 1e-5));
        CHECK_THAT(rv::rad_to_deg(rv::gouy_phase_rad(b)), near(row.gouy_deg, 1e-4));
        // The waist stays where it was: row.z_mm behind the new plane, same size.
        CHECK_THAT(rv::distance_to_waist_mm(b), near(-row.z_mm, 1e-9));
        CHECK_THAT(rv::waist_radius_um(b), near(100.0, 1e-9));
    }
    // Far-field half-angle θ = λ/(π w0) (Kogelnik & Li 1966).
    CHECK_THAT(rv::divergence_rad(at_waist), near_rel(1064e-6 / (rv::kPi * 0.1), 1e-12));
}

TEST_CASE("M² by the embedded-Gaussian convention", "[gaussian]") {
    // ISO 11146 propagation law (summary by S. Prahl, laserbeamsize docs):
    // W(z)² = W0² + (M² λ z / (π W0))², with z_R = π W0² / (M² λ).
    const double w0_mm = 0.3, m2 = 1.7, lambda_mm = 780e-6, z_mm = 250.0;
    const rv::GaussianBeam b = rv::propagate(rv::beam_from_waist({.waist_um = 300.0, .distance_to_waist_mm = 0.0, .wavelength_nm = 780.0, .m2 = m2}),
                                             rv::free_space(z_mm));
    const double theta = m2 * lambda_mm / (rv::kPi * w0_mm);
    CHECK_THAT(rv::radius_um(b),
               near_rel(1e3 * std::sqrt(w0_mm * w0_mm + theta * theta * z_mm * z_mm), 1e-12));
    CHECK_THAT(rv::rayleigh_range_mm(b), near_rel(rv::kPi * w0_mm * w0_mm / (m2 * lambda_mm), 1e-12));
    CHECK_THAT(rv::divergence_rad(b), near_rel(theta, 1e-12));
}

TEST_CASE("a waist inside a medium", "[gaussian]") {
    // docs/physics.md §1.4 (computed from it): w0 = 30 µm at 1064 nm in BBO with n_o = 1.65452 has
    // z_R = 2.6574 mm in air and 4.3967 mm in the crystal (z_R = π n w0² / λ0).
    CHECK_THAT(rv::rayleigh_range_mm(rv::beam_from_waist({.waist_um = 30.0, .distance_to_waist_mm = 0.0, .wavelength_nm = 1064.0})), near(2.6574, 1e-4));
    CHECK_THAT(rv::rayleigh_range_mm(rv::beam_from_waist({.waist_um = 30.0, .distance_to_waist_mm = 0.0, .wavelength_nm = 1064.0, .index = 1.65452})),
               near(4.3967, 1e-4));
    // Crossing a flat face keeps the radius and multiplies q by n (plane_interface det = 1/n),
    // so a waist that would form d behind the face in air forms n·d inside.
    const rv::GaussianBeam in_air = rv::beam_from_waist({.waist_um = 30.0, .distance_to_waist_mm = 2.0, .wavelength_nm = 1064.0});
    const rv::GaussianBeam inside = rv::propagate(in_air, rv::plane_interface(1.0, 1.65452), 1.65452);
    CHECK_THAT(rv::radius_um(inside), near_rel(rv::radius_um(in_air), 1e-12));
    CHECK_THAT(rv::distance_to_waist_mm(inside), near_rel(2.0 * 1.65452, 1e-12));
    CHECK_THAT(rv::waist_radius_um(inside), near_rel(30.0, 1e-12));
}

TEST_CASE("translate is free space", "[gaussian]") {
    // Kogelnik & Li 1966: free space of length L takes q to q + L; translate() is the shortcut
    // the propagation uses, so it must equal the matrix form exactly.
    const rv::GaussianBeam b = rv::beam_from_waist({.waist_um = 120.0, .distance_to_waist_mm = -35.0, .wavelength_nm = 780.0, .index = 1.0, .m2 = 1.3});
    for (double length_mm : {0.0, 12.5, -40.0, 1e4}) {
        const rv::GaussianBeam m = rv::propagate(b, rv::free_space(length_mm));
        CHECK(rv::translate(b, length_mm).q_mm == m.q_mm);
        CHECK(rv::distance_to_waist_mm(rv::translate(b, length_mm)) == -35.0 - length_mm);
    }
}
