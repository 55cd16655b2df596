#include "nonlinear/wave_dispersion.hpp"

#include <cmath>

namespace rv {

namespace {

// p⁻² and its three λ-derivatives (see the header).
struct InverseSquare {
    double f, d1, d2, d3;
};
InverseSquare inverse_square(const IndexDerivatives& p) {
    const double n = p.n, a = p.dn, b = p.d2n, c = p.d3n;
    const double i2 = 1 / (n * n), i3 = i2 / n, i4 = i2 * i2, i5 = i4 / n;
    return {i2, -2 * i3 * a, 6 * i4 * a * a - 2 * i3 * b, -24 * i5 * a * a * a + 18 * i4 * a * b - 2 * i3 * c};
}

}  // namespace

IndexDerivatives wave_derivatives(const CrystalIndices& x, Polarity polarity, double angle) {
    if (polarity == Polarity::A) return x.a;
    const double c2 = std::cos(angle) * std::cos(angle), s2 = 1 - c2;
    const InverseSquare p = inverse_square(x.p), q = inverse_square(x.q);
    const double u = c2 * p.f + s2 * q.f, u1 = c2 * p.d1 + s2 * q.d1, u2 = c2 * p.d2 + s2 * q.d2,
                 u3 = c2 * p.d3 + s2 * q.d3;
    const double r = 1 / std::sqrt(u);  // u^(−1/2) = n
    const double r3 = r / u, r5 = r3 / u, r7 = r5 / u;
    return {r, -0.5 * r3 * u1, 0.75 * r5 * u1 * u1 - 0.5 * r3 * u2,
            -15.0 / 8.0 * r7 * u1 * u1 * u1 + 9.0 / 4.0 * r5 * u1 * u2 - 0.5 * r3 * u3};
}

IndexSample wave_sample(const CrystalIndices& x, Polarity polarity, double angle) {
    return sample_from_derivatives(wave_derivatives(x, polarity, angle), x.wavelength_um, x.in_range);
}

double walkoff_rad(const CrystalIndices& x, Polarity polarity, double angle) {
    if (polarity == Polarity::A) return 0;
    const double c2 = std::cos(angle) * std::cos(angle), s2 = 1 - c2;
    const double n2 = 1 / (c2 / (x.p.n * x.p.n) + s2 / (x.q.n * x.q.n));
    return std::atan(0.5 * n2 * (1 / (x.q.n * x.q.n) - 1 / (x.p.n * x.p.n)) * std::sin(2 * angle));
}

}  // namespace rv
