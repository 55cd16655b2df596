// Ray-transfer matrices of single elements.
#include "optics/abcd.hpp"

#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near;

TEST_CASE("spherical mirror at an angle of incidence", "[abcd][mirror]") {
    // Kogelnik, Ippen, Dienes & Shank, IEEE JQE 8, 373 (1972): f_t = R cos θ / 2,
    // f_s = R / (2 cos θ); check values for R = 200 mm computed from docs/physics.md §2.
    struct Row { double aoi_deg, f_t, f_s; };
    for (const Row& r : {Row{10, 98.4808, 101.5427}, Row{22.5, 92.3880, 108.2392},
                         Row{45, 70.7107, 141.4214}}) {
        CAPTURE(r.aoi_deg);
        const double aoi = rv::deg_to_rad(r.aoi_deg);
        CHECK_THAT(rv::mirror_focal_length_mm(200, aoi, rv::Plane::Tangential), near(r.f_t, 1e-4));
        CHECK_THAT(rv::mirror_focal_length_mm(200, aoi, rv::Plane::Sagittal), near(r.f_s, 1e-4));
        CHECK_THAT(rv::effective_focal_length_mm(rv::spherical_mirror(200, aoi, rv::Plane::Tangential)),
                   near(r.f_t, 1e-4));
    }
    // docs/physics.md §2 sign check: a concave mirror with R = 200 mm at normal incidence has
    // f = +100 mm (converging) in both planes.
    CHECK_THAT(rv::effective_focal_length_mm(rv::spherical_mirror(200, 0, rv::Plane::Sagittal)),
               near(100.0, 1e-12));
    CHECK_THAT(rv::effective_focal_length_mm(rv::spherical_mirror(200, 0, rv::Plane::Tangential)),
               near(100.0, 1e-12));
}

TEST_CASE("interfaces in the actual-angle convention have det = n1/n2", "[abcd]") {
    // Siegman, "Lasers" (1986) §15.1 (from memory): with the actual angle, det M = n1/n2.
    CHECK_THAT(rv::plane_interface(1.0, 1.5).determinant(), near(1.0 / 1.5, 1e-15));
    CHECK_THAT(rv::curved_interface(1.0, 1.5, 50).determinant(), near(1.0 / 1.5, 1e-15));
    CHECK_THAT(rv::tilted_interface(1.0, 1.5, 0.7, rv::Plane::Tangential).determinant(),
               near(1.0 / 1.5, 1e-15));
    // Paraxial refraction at a sphere: C = (n1 − n2)/(n2 R) (docs/physics.md §2 table).
    CHECK_THAT(rv::curved_interface(1.0, 1.5, 50)(1, 0), near((1.0 - 1.5) / (1.5 * 50), 1e-15));
    CHECK(rv::free_space(12.5)(0, 1) == 12.5);
    CHECK_THAT(rv::effective_focal_length_mm(rv::thin_lens(-75)), near(-75, 1e-12));
}
