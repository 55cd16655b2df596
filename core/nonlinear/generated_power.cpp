#include "nonlinear/generated_power.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <vector>

#include "units/clamped_int.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {

// 8-point Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz & Stegun, Table 25.4).
constexpr std::array<double, 8> kNodes{-0.9602898564975363, -0.7966664774136267, -0.5255324099163290,
                                       -0.1834346424956498, 0.1834346424956498,  0.5255324099163290,
                                       0.7966664774136267,  0.9602898564975363};
constexpr std::array<double, 8> kWeights{0.1012285362903763, 0.2223810344533745, 0.3137066458778873,
                                         0.3626837833783620, 0.3626837833783620, 0.3137066458778873,
                                         0.2223810344533745, 0.1012285362903763};

double a_of(double tau_fs) { return 4 * std::log(2.0) / (tau_fs * tau_fs); }

}  // namespace

double plane_wave_coupling_cm2_per_w(const MixingWaves& w) {
    const double d_m_v = w.d_eff_pm_v * 1e-12;
    const double length_m = w.length_mm * 1e-3;
    const double lambda3_m = w.lambda3_nm * 1e-9;
    const double kappa_m2_per_w = 8 * kPi * kPi * d_m_v * d_m_v * length_m * length_m /
                                  (kEpsilon0_f_per_m * kSpeedOfLight_m_per_s * w.n1 * w.n2 * w.n3 *
                                   lambda3_m * lambda3_m);
    return (w.one_field ? 0.25 : 1.0) * kappa_m2_per_w * 1e4;  // m² → cm²
}

double overlap_area_factor_per_cm2(double w1t_um, double w1s_um, double w2t_um, double w2s_um,
                                   double overlap) {
    const double product_cm4 = um_to_cm(w1t_um) * um_to_cm(w1s_um) * um_to_cm(w2t_um) * um_to_cm(w2s_um);
    if (!(product_cm4 > 0)) return 0;
    return overlap / (kPi * std::sqrt(product_cm4));
}

double generated_peak_power_w(const MixingWaves& w, double p1_w, double p2_w, double area_per_cm2,
                              double focusing_factor) {
    return plane_wave_coupling_cm2_per_w(w) * p1_w * p2_w * area_per_cm2 * focusing_factor;
}

double gvm_overlap_factor(double tau1_fs, double tau2_fs, double delay_fs, double g1, double g2,
                          double length_mm) {
    if (!(tau1_fs > 0 && tau2_fs > 0)) return 0;
    const double a1 = a_of(tau1_fs), a2 = a_of(tau2_fs), A = a1 + a2;
    const double t1 = delay_fs, t2 = 0;  // only the difference matters
    const double walk_fs = std::max(std::abs(g1), std::abs(g2)) * length_mm;
    if (!(length_mm > 0) || walk_fs * std::sqrt(A) < 1e-6) {
        // No walk-through: the cross-correlation of the two pulses at the delay.
        return std::exp(-a1 * a2 * delay_fs * delay_fs / A);
    }
    // Panels over which the pulses walk a third of 1/√A (the product pulse's time scale), 8 nodes
    // each; at most 48 panels (384 nodes).
    const int panels = clamped_int(std::ceil(3 * walk_fs * std::sqrt(A)), 1, 48);  // no UB cast of a huge walk
    std::vector<double> z, weight, c, m;
    const double panel = length_mm / panels;
    for (int p = 0; p < panels; ++p) {
        const double mid = -length_mm / 2 + (p + 0.5) * panel;
        for (size_t k = 0; k < kNodes.size(); ++k) {
            const double zk = mid + kNodes[k] * panel / 2;
            const double s1 = t1 - g1 * zk, s2 = t2 - g2 * zk;
            z.push_back(zk);
            weight.push_back(kWeights[k] * panel / 2);
            c.push_back(a1 * a2 / (2 * A) * (s1 - s2) * (s1 - s2));
            m.push_back((a1 * s1 + a2 * s2) / A);
        }
    }
    double sum = 0;
    for (size_t i = 0; i < z.size(); ++i) {
        const double wi = weight[i] * std::exp(-c[i]);
        sum += wi * wi;  // the diagonal, m(z) − m(z) = 0
        for (size_t j = i + 1; j < z.size(); ++j) {
            const double dm = m[i] - m[j];
            sum += 2 * wi * weight[j] * std::exp(-c[j] - A / 4 * dm * dm);
        }
    }
    return sum / (length_mm * length_mm);
}

double pulse_overlap_integral_fs(double tau1_fs, double tau2_fs, double delay_fs, double g1, double g2,
                                 double length_mm) {
    if (!(tau1_fs > 0 && tau2_fs > 0)) return 0;
    const double A = a_of(tau1_fs) + a_of(tau2_fs);
    return std::sqrt(kPi / A) * gvm_overlap_factor(tau1_fs, tau2_fs, delay_fs, g1, g2, length_mm);
}

}  // namespace rv
