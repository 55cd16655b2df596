// Thick singlets and the thin chromatic lens.
#include "optics/thick_lens.hpp"

#include "materials/dispersion.hpp"
#include "materials/material_library.hpp"
#include "support/tolerance.hpp"

using rv::test::near;
using rv::test::near_rel;

TEST_CASE("thick biconvex singlet: matrix and EFL and back focal distance", "[thick-lens]") {
    // Lensmaker's formula for a thick lens (e.g. Hecht, Optics, §6.2):
    // 1/f = (n−1)[1/R1 − 1/R2 + (n−1)t/(n R1 R2)]; check values computed from docs/physics.md §2 for
    // N-BK7 at 1064 nm (n = 1.506635), R1 = +100, R2 = −100, t = 5 mm.
    const rv::ThickSinglet lens{100.0, -100.0, 5.0};
    const double n = 1.506635;
    const rv::RayMatrix m = rv::thick_singlet_matrix(lens, n);
    CHECK_THAT(m(0, 0), near(0.983187, 1e-6));
    CHECK_THAT(m(0, 1), near(3.318654, 1e-6));
    CHECK_THAT(m(1, 0), near(-0.0100475, 1e-7));
    CHECK_THAT(m(1, 1), near(0.983187, 1e-6));
    CHECK_THAT(m.determinant(), near(1.0, 1e-14));
    const rv::ThickLensProperties p = rv::thick_lens_properties(lens, n);
    CHECK_THAT(p.effective_focal_length_mm, near(99.5271, 1e-4));
    CHECK_THAT(p.effective_focal_length_mm, near_rel(rv::lensmaker_focal_length_mm(lens, n), 1e-12));
    CHECK_THAT(p.back_focal_distance_mm, near(97.8537, 1e-4));
    // Symmetric lens: principal planes symmetric about the centre, EFL − BFD inside each face.
    CHECK_THAT(p.front_principal_plane_mm, near(-p.rear_principal_plane_mm, 1e-12));
    CHECK_THAT(p.rear_principal_plane_mm, near(p.back_focal_distance_mm - p.effective_focal_length_mm, 1e-12));
}

TEST_CASE("plano-convex singlet: flat face and principal planes", "[thick-lens]") {
    // Lensmaker (Hecht §6.2) with R2 → ∞: f = R1/(n − 1) whatever the thickness, and the rear
    // principal plane lies on the curved face, so BFD = f − t/n.
    const rv::ThickSinglet lens{51.5, rv::kFlat, 6.0};
    const double n = 1.5168;
    const rv::ThickLensProperties p = rv::thick_lens_properties(lens, n);
    CHECK_THAT(p.effective_focal_length_mm, near_rel(51.5 / (n - 1.0), 1e-12));
    CHECK_THAT(p.back_focal_distance_mm, near_rel(51.5 / (n - 1.0) - 6.0 / n, 1e-12));
    CHECK_THAT(p.front_principal_plane_mm, near(0.0, 1e-12));
}

TEST_CASE("chromatic focal shift of thin singlets", "[thick-lens][chromatic]") {
    // f(λ) = f(λ0)(n(λ0) − 1)/(n(λ) − 1) from the lensmaker formula; docs/physics.md §3.5
    // (values computed from the Sellmeier sets of §3.1) for f(1064 nm) = 100.000 mm.
    struct Row { const char* glass; double f532, f780, f800, f1030, f1550; };
    const rv::MaterialLibrary& lib = rv::MaterialLibrary::builtin();
    for (const Row& r : {Row{"N-BK7", 97.529, 99.110, 99.189, 99.910, 101.195},
                         Row{"fused-silica", 97.596, 99.109, 99.187, 99.908, 101.263},
                         Row{"CaF2", 98.418, 99.474, 99.523, 99.951, 100.576},
                         Row{"N-SF11", 94.851, 98.441, 98.597, 99.865, 101.412}}) {
        CAPTURE(r.glass);
        const rv::Material* g = lib.find(r.glass);
        REQUIRE(g != nullptr);
        const double n1064 = rv::sample_index(*g, 1064).index;
        auto f_at = [&](double nm) {
            return rv::chromatic_focal_length_mm(100.0, n1064, rv::sample_index(*g, nm).index);
        };
        CHECK_THAT(f_at(532), near(r.f532, 6e-4));
        CHECK_THAT(f_at(780), near(r.f780, 6e-4));
        CHECK_THAT(f_at(800), near(r.f800, 6e-4));
        CHECK_THAT(f_at(1030), near(r.f1030, 6e-4));
        CHECK_THAT(f_at(1550), near(r.f1550, 6e-4));
    }
}
