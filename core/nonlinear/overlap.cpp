#include "nonlinear/overlap.hpp"

#include <cmath>

namespace rv {

double transverse_overlap_1d(double w1, double w2, double d) {
    const double sum2 = w1 * w1 + w2 * w2;
    return std::sqrt(2 * w1 * w2 / sum2) * std::exp(-2 * d * d / sum2);
}

double temporal_overlap(double t1, double t2, double dt) {
    return std::exp(-4 * std::log(2.0) * dt * dt / (t1 * t1 + t2 * t2));
}

}  // namespace rv
