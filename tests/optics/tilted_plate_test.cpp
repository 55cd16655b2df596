// A plane-parallel plate crossed at an angle.
#include "optics/tilted_plate.hpp"

#include <cmath>

#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near;
using rv::test::near_rel;

TEST_CASE("tilted plate: lateral displacement and effective lengths", "[plate]") {
    // d = t sinθ [1 − cosθ/√(n² − sin²θ)] (standard plate formula, from memory; docs/physics.md §2.1);
    // L_s = t/(n cosθ'), L_t = t cos²θ/(n cos³θ') (derived in docs/physics.md §2.1 from the tilted
    // interface matrices; Kogelnik et al. 1972 for the Brewster case); values computed from them.
    struct Row { double t, aoi_deg, n, d, ls, lt; };
    for (const Row& r : {Row{3, 45, 1.5, 0.98743, 2.26779, 1.45786},
                         Row{3, 45, 1.506635, 0.99383, 2.25497, 1.44599},
                         Row{1, 45, 1.453317, 0.31331, 0.78759, 0.51593}}) {
        CAPTURE(r.t, r.n);
        const double aoi = rv::deg_to_rad(r.aoi_deg);
        const rv::TiltedPlate p = rv::tilted_plate(r.t, r.n, aoi);
        CHECK_THAT(p.lateral_shift_mm, near(r.d, 1e-5));
        CHECK_THAT(p.sagittal_length_mm, near(r.ls, 1e-5));
        CHECK_THAT(p.tangential_length_mm, near(r.lt, 1e-5));
        // The composed interface–glass–interface matrices are free space of those lengths.
        const rv::RayMatrix mt = rv::tilted_plate_matrix(r.t, r.n, aoi, rv::Plane::Tangential);
        const rv::RayMatrix ms = rv::tilted_plate_matrix(r.t, r.n, aoi, rv::Plane::Sagittal);
        CHECK_THAT(mt(0, 1), near_rel(p.tangential_length_mm, 1e-12));
        CHECK_THAT(ms(0, 1), near_rel(p.sagittal_length_mm, 1e-12));
        CHECK_THAT(mt(0, 0), near(1.0, 1e-12));
        CHECK_THAT(mt(1, 1), near(1.0, 1e-12));
        CHECK_THAT(mt(1, 0), near(0.0, 1e-15));
    }
    // docs/physics.md §2.1: the astigmatic waist separation L_s − L_t = 0.80992 mm for the first plate.
    const rv::TiltedPlate p = rv::tilted_plate(3, 1.5, rv::deg_to_rad(45));
    CHECK_THAT(p.sagittal_length_mm - p.tangential_length_mm, near(0.80992, 1e-5));
    // docs/physics.md §7: the 1 mm fused-silica plate at 45° has glass path 1.14462 mm and replaces
    // 1.10090 mm of air along the original direction.
    const rv::TiltedPlate fs = rv::tilted_plate(1, 1.453317, rv::deg_to_rad(45));
    CHECK_THAT(fs.glass_path_mm, near(1.14462, 1e-5));
    CHECK_THAT(fs.replaced_air_path_mm, near(1.10090, 1e-5));
}

TEST_CASE("tilted plate at Brewster's angle and at normal incidence", "[plate]") {
    // Kogelnik et al. 1972 Brewster plate: L_s = t√(n²+1)/n², L_t = t√(n²+1)/n⁴.
    const double n = 1.76, t = 4.0;
    const rv::TiltedPlate b = rv::tilted_plate(t, n, std::atan(n));
    CHECK_THAT(b.sagittal_length_mm, near_rel(t * std::sqrt(n * n + 1) / (n * n), 1e-12));
    CHECK_THAT(b.tangential_length_mm, near_rel(t * std::sqrt(n * n + 1) / (n * n * n * n), 1e-12));
    // At normal incidence: no shift, both lengths t/n, so the focus moves by t(1 − 1/n).
    const rv::TiltedPlate z = rv::tilted_plate(t, n, 0.0);
    CHECK(z.lateral_shift_mm == 0.0);
    CHECK_THAT(z.sagittal_length_mm, near_rel(t / n, 1e-15));
    CHECK_THAT(z.tangential_length_mm, near_rel(t / n, 1e-15));
}
