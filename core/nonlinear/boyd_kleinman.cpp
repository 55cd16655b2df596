#include "nonlinear/boyd_kleinman.hpp"

#include <cmath>
#include <complex>

#include "units/constants.hpp"

namespace rv {

double boyd_kleinman_h(double sigma, double xi) {
    if (!(xi > 0) || !std::isfinite(xi) || !std::isfinite(sigma)) return 0;
    // Strong focusing, ξ > 1000: the integral tends to 2π e^{−σ} for σ > 0 (residue at τ = i),
    // so h → π² e^{−2σ}/ξ (Boyd & Kleinman 1968, the ξ → ∞ limit).
    if (xi > 1000) return sigma > 0 ? kPi * kPi * std::exp(-2 * sigma) / xi : kPi * kPi / xi;
    // Composite Simpson's rule; the integrand is smooth and oscillates at most σξ/π times.
    const double steps = std::min(2e6, std::ceil(200 + 40 * xi * (1 + std::min(std::abs(sigma), 10.0))));
    const int n = 2 * static_cast<int>(steps);
    const double step = 2 * xi / n;
    std::complex<double> sum = 0;
    for (int k = 0; k <= n; ++k) {
        const double tau = -xi + k * step;
        const double weight = (k == 0 || k == n) ? 1 : (k % 2 ? 4 : 2);
        sum += weight * std::exp(std::complex<double>(0, sigma * tau)) / std::complex<double>(1, tau);
    }
    const std::complex<double> integral = sum * step / 3.0;
    return std::norm(integral) / (4 * xi);
}

BoydKleinmanOptimum boyd_kleinman_optimum(double xi) {
    // h is smooth in σ with one maximum on [0, 3] for the ξ of interest: scan, then refine by
    // golden-section search around the best scan point.
    double best = 0, best_sigma = 0;
    for (int i = 0; i <= 60; ++i) {
        const double s = 3.0 * i / 60, h = boyd_kleinman_h(s, xi);
        if (h > best) best = h, best_sigma = s;
    }
    double a = std::max(0.0, best_sigma - 0.05), b = best_sigma + 0.05;
    const double g = (std::sqrt(5.0) - 1) / 2;
    double c = b - g * (b - a), d = a + g * (b - a);
    double hc = boyd_kleinman_h(c, xi), hd = boyd_kleinman_h(d, xi);
    for (int i = 0; i < 60; ++i) {
        if (hc > hd) {
            b = d, d = c, hd = hc;
            c = b - g * (b - a), hc = boyd_kleinman_h(c, xi);
        } else {
            a = c, c = d, hc = hd;
            d = a + g * (b - a), hd = boyd_kleinman_h(d, xi);
        }
    }
    const double sigma = 0.5 * (a + b);
    return {boyd_kleinman_h(sigma, xi), sigma};
}

double walkoff_parameter(double walkoff_rad, double length_mm, double k1_per_mm) {
    return walkoff_rad * std::sqrt(length_mm * k1_per_mm) / 2;
}

}  // namespace rv
