#include "analysis/plate_angle_search.hpp"

#include <cmath>

namespace rv {

double plate_angle_deg(double angle_deg) {
    const double a = std::remainder(angle_deg, 180.0);
    return a < 0 ? a + 180 : a;
}

double refine_plate_angle_deg(const std::function<double(double)>& cost, double centre_deg, double half_width_deg,
                              int iterations) {
    double lo = centre_deg - half_width_deg, hi = centre_deg + half_width_deg;
    const double g = (std::sqrt(5.0) - 1) / 2;
    for (int it = 0; it < iterations; ++it) {
        const double x1 = hi - g * (hi - lo), x2 = lo + g * (hi - lo);
        if (cost(x1) < cost(x2)) hi = x2;
        else lo = x1;
    }
    return plate_angle_deg((lo + hi) / 2);
}

}  // namespace rv
