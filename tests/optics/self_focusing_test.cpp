// Focusing a Gaussian beam with a thin lens: ABCD propagation against Self's equation.
#include <cmath>

#include "optics/gaussian_beam.hpp"
#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near;
using rv::test::near_rel;

namespace {

struct SelfResult {
    double image_distance_mm, waist_mm, rayleigh_mm;
};

// S. A. Self, "Focusing of spherical Gaussian beams", Appl. Opt. 22, 658 (1983), with the
// embedded-Gaussian z_R = π w0²/(M² λ):  s''/f = 1 + (s/f − 1)/[(s/f − 1)² + (z_R/f)²],
// m = 1/√[(1 − s/f)² + (z_R/f)²], w0'' = m w0.  Written out here as the independent oracle.
SelfResult self_equation(double w0_mm, double s_mm, double f_mm, double lambda_mm, double m2) {
    const double zr = rv::kPi * w0_mm * w0_mm / (m2 * lambda_mm);
    const double a = s_mm / f_mm - 1.0;
    const double den = a * a + (zr / f_mm) * (zr / f_mm);
    const double m = 1.0 / std::sqrt(den);
    return {f_mm * (1.0 + a / den), m * w0_mm, m * m * zr};
}

struct Case {
    const char* name;
    double lambda_nm, w0_mm, s_mm, f_mm, m2;
    double image_mm, waist_um, rayleigh_mm;  // values computed from docs/physics.md §1.3
    double image_tol_mm, waist_tol_um, rayleigh_tol_mm;
};

}  // namespace

TEST_CASE("thin-lens focusing agrees with Self's equation", "[gaussian][self]") {
    // Worked examples A–E of Self's equation, docs/physics.md §1.3 (Self 1983; values computed from it
    // and cross-checked by matrices), each given to the precision printed.
    const Case cases[] = {
        {"A", 1064, 1.0, 500, 100, 1.0, 100.45, 33.562, 3.3258, 0.005, 0.0005, 0.00005},
        {"B", 800, 2.0, 0, 200, 1.0, 199.97, 25.463, 2.5461, 0.005, 0.0005, 0.00005},
        {"C", 532, 0.5, 1000, 250, 1.0, 267.10, 75.488, 33.650, 0.005, 0.0005, 0.0005},
        {"D", 532, 0.5, 1000, 250, 1.3, 275.31, 91.849, 38.321, 0.005, 0.0005, 0.0005},
        {"E", 1064, 0.05, 150, 100, 1.0, 295.73, 98.928, -1, 0.005, 0.0005, 0},
    };
    for (const Case& c : cases) {
        CAPTURE(c.name);
        const rv::GaussianBeam in =
            rv::beam_from_waist({.waist_um = rv::mm_to_um(c.w0_mm), .distance_to_waist_mm = -c.s_mm, .wavelength_nm = c.lambda_nm, .m2 = c.m2});
        const rv::GaussianBeam out = rv::propagate(in, rv::thin_lens(c.f_mm));
        const SelfResult oracle = self_equation(c.w0_mm, c.s_mm, c.f_mm, c.lambda_nm * 1e-6, c.m2);
        // Relative error ≤ 1e-9 against the closed form.
        CHECK_THAT(rv::distance_to_waist_mm(out), near_rel(oracle.image_distance_mm, 1e-9));
        CHECK_THAT(rv::waist_radius_um(out) * 1e-3, near_rel(oracle.waist_mm, 1e-9));
        CHECK_THAT(rv::rayleigh_range_mm(out), near_rel(oracle.rayleigh_mm, 1e-9));
        // And the printed worked-example values.
        CHECK_THAT(rv::distance_to_waist_mm(out), near(c.image_mm, c.image_tol_mm));
        CHECK_THAT(rv::waist_radius_um(out), near(c.waist_um, c.waist_tol_um));
        if (c.rayleigh_mm > 0)
            CHECK_THAT(rv::rayleigh_range_mm(out), near(c.rayleigh_mm, c.rayleigh_tol_mm));
    }
}

TEST_CASE("the Gaussian image never lies beyond f + f²/(2 z_R)", "[gaussian][self]") {
    // Self 1983: the maximum image distance f + f²/(2 z_R) is reached at s = f + z_R.
    const double f = 100.0, w0_mm = 0.2, lambda_mm = 1030e-6;
    const double zr = rv::kPi * w0_mm * w0_mm / lambda_mm;
    double best = 0.0;
    for (double s = 0.0; s < 600.0; s += 0.25) {
        const rv::GaussianBeam out =
            rv::propagate(rv::beam_from_waist({.waist_um = 200.0, .distance_to_waist_mm = -s, .wavelength_nm = 1030.0}), rv::thin_lens(f));
        best = std::max(best, rv::distance_to_waist_mm(out));
    }
    const double at_peak = rv::distance_to_waist_mm(
        rv::propagate(rv::beam_from_waist({.waist_um = 200.0, .distance_to_waist_mm = -(f + zr), .wavelength_nm = 1030.0}), rv::thin_lens(f)));
    CHECK_THAT(at_peak, near_rel(f + f * f / (2 * zr), 1e-12));
    CHECK(best <= at_peak + 1e-9);
}
