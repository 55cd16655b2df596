// The plate-angle search: golden-section refinement (Kiefer 1953; Press et al., "Numerical
// Recipes", 3rd ed., §10.2) of a function with period 180°, and the wrap into [0°, 180°).
#include <cmath>

#include "analysis/plate_angle_search.hpp"
#include "support/layouts.hpp"

using rv::test::near;

TEST_CASE("plate angles wrap into 0 to 180 degrees", "[plate-angle]") {
    CHECK_THAT(rv::plate_angle_deg(-10), near(170, 1e-12));
    CHECK_THAT(rv::plate_angle_deg(190), near(10, 1e-12));
    CHECK_THAT(rv::plate_angle_deg(45), near(45, 1e-12));
    CHECK(rv::plate_angle_deg(180) == 0);
}

TEST_CASE("the golden-section refinement finds a minimum inside its bracket", "[plate-angle]") {
    // Malus-like cost, cos²(θ − 37.3°), whose minimum lies at 127.3° (period 180°).
    auto cost = [](double deg) { return std::pow(std::cos((deg - 37.3) * 3.141592653589793 / 180), 2); };
    CHECK_THAT(rv::refine_plate_angle_deg(cost, 127, 1.0), near(127.3, 1e-6));
    // A bracket across 180° returns the wrapped angle: minimum at −2.1° ≡ 177.9°.
    auto across = [](double deg) { return (deg + 2.1) * (deg + 2.1); };
    CHECK_THAT(rv::refine_plate_angle_deg(across, -2, 1.0), near(177.9, 1e-6));
    // Golden-section steps shrink the bracket by 0.618 each: 10 steps from ±1° leave ~0.016°.
    CHECK(std::abs(rv::refine_plate_angle_deg(cost, 127, 1.0, 10) - 127.3) < 0.02);
}
