// Two colours through one singlet.
#include "analysis/chromatic_focus.hpp"

#include "demo/builtin_demo.hpp"
#include "support/tolerance.hpp"

using rv::test::near;

TEST_CASE("two colours through one N-BK7 lens: focal shift with the Gaussian correction",
          "[chromatic]") {
    // physics.md §1.5 (computed there): a thin N-BK7 plano-convex lens with f(1064) = 100 mm,
    // i.e. R = f(n − 1) = 50.6635 mm; collimated beams, w0 = 1.000 mm at the lens.
    rv::ChromaticFocusCase c;
    c.lens = {"L", "N-BK7", {50.6635, rv::kFlat, 0.0}};
    c.beams = {{"ir", 1064, 1000, 0.0, 1.0}, {"green", 532, 1000, 0.0, 1.0}};
    const rv::ChromaticFocusSummary s = rv::summarize_chromatic_focus(c, rv::MaterialLibrary::builtin());
    REQUIRE(s.beams.size() == 2);
    const rv::BeamFocus& ir = s.beams[0];
    const rv::BeamFocus& green = s.beams[1];
    CHECK_THAT(ir.glass_index, near(1.506635, 1e-6));
    CHECK_THAT(ir.effective_focal_length_mm, near(100.000, 1e-3));
    CHECK_THAT(ir.waist_after_lens_mm, near(99.8854, 1e-4));
    CHECK_THAT(ir.waist_um, near(33.8488, 1e-4));
    CHECK_THAT(ir.rayleigh_range_mm, near(3.3829, 1e-4));
    CHECK_THAT(green.glass_index, near(1.519473, 1e-6));
    CHECK_THAT(green.effective_focal_length_mm, near(97.5287, 1e-4));
    CHECK_THAT(green.waist_after_lens_mm, near(97.5021, 1e-4));
    CHECK_THAT(green.waist_um, near(16.5133, 1e-4));
    CHECK_THAT(green.rayleigh_range_mm, near(1.6103, 1e-4));
    CHECK_THAT(s.focal_shift_mm, near(97.5021 - 99.8854, 2e-4));
    CHECK_THAT(s.shift_over_rayleigh, near((99.8854 - 97.5021) / 1.6103, 1e-3));
}

TEST_CASE("the built-in demo is computable and in range", "[chromatic][demo]") {
    // No published oracle: the demo is our own scenario. Checked for consistency only: every
    // wavelength inside N-BK7's range, foci within a few mm of the back focal distance.
    const rv::ChromaticFocusSummary s =
        rv::summarize_chromatic_focus(rv::builtin_demo_focus_case(), rv::MaterialLibrary::builtin());
    REQUIRE(s.beams.size() == 2);
    for (const rv::BeamFocus& b : s.beams) {
        CHECK(b.glass_in_valid_range);
        CHECK(std::abs(b.waist_after_lens_mm - b.back_focal_distance_mm) < 5.0);
    }
    CHECK_THROWS_AS(rv::summarize_chromatic_focus({"x", {"L", "no-such-glass", {50, rv::kFlat, 2}}, {}},
                                                  rv::MaterialLibrary::builtin()),
                    std::invalid_argument);
}
