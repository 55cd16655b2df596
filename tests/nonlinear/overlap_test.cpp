// Overlap factors of two colours.
#include "nonlinear/overlap.hpp"

#include "support/tolerance.hpp"

using rv::test::near;

TEST_CASE("transverse overlap of two colours", "[overlap]") {
    // docs/physics.md §6.2 (computed from it): O = 2w1w2/(w1² + w2²) for round beams, and the lateral
    // offset factor exp(−2d²/(w1² + w2²)): 30/30 µm → 1 and 0.89484 at 10 µm; 30/40 µm → 0.96 and
    // 0.92312 at 10 µm. Both planes together = the product of the two 1-D factors.
    auto round = [](double w1, double w2, double d) {
        return rv::transverse_overlap_1d(w1, w2, d) * rv::transverse_overlap_1d(w1, w2, 0);
    };
    CHECK_THAT(round(30, 30, 0), near(1.0, 1e-12));
    CHECK_THAT(round(30, 30, 10), near(0.89484, 1e-5));
    CHECK_THAT(round(30, 40, 0), near(0.96, 1e-12));
    CHECK_THAT(round(30, 40, 10) / round(30, 40, 0), near(0.92312, 1e-5));
}

TEST_CASE("temporal overlap of two Gaussian pulses", "[overlap]") {
    // docs/physics.md §6.2: 100 and 150 fs delayed by 50 fs → 0.80793; 35 and 50 fs by 20 fs → 0.74250.
    CHECK_THAT(rv::temporal_overlap(100, 150, 50), near(0.80793, 1e-5));
    CHECK_THAT(rv::temporal_overlap(35, 50, 20), near(0.74250, 1e-5));
    CHECK_THAT(rv::temporal_overlap(100, 150, 0), near(1.0, 1e-15));
}
