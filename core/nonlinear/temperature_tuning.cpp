#include "nonlinear/temperature_tuning.hpp"

#include <cmath>

#include "materials/thermo_optic.hpp"

namespace rv {

namespace {

constexpr double kScanStep_c = 5.0;  // sign-change scan (Δk(T) is smooth); a root is then bisected

}  // namespace

std::optional<TemperatureTuning> temperature_tuning(const Material& m, double l1, double l2,
                                                    MixingType type, double angle, double length_mm,
                                                    PrincipalPlane plane) {
    if (!m.thermo_optic) return std::nullopt;
    TemperatureTuning t;
    t.now_c = m.temperature_c.value_or(m.thermo_optic->reference_temperature_c);
    auto dk = [&](double temperature_c) {
        return delta_k_per_mm(at_temperature(m, temperature_c), l1, l2, type, angle, plane);
    };
    const double h_c = 0.01;
    const double slope = (dk(t.now_c + h_c) - dk(t.now_c - h_c)) / (2 * h_c);  // per mm per K
    if (std::isfinite(slope) && slope != 0) t.acceptance_fwhm_c = kSincHalfWidth / (length_mm * std::abs(slope));
    // Every sign change over the span, bisected; the root nearest the temperature now.
    const int steps = static_cast<int>((kMaxCrystalTemperature_c - kMinCrystalTemperature_c) / kScanStep_c);
    double lo = kMinCrystalTemperature_c, f_lo = dk(lo);
    for (int i = 1; i <= steps; ++i) {
        const double hi = kMinCrystalTemperature_c + i * kScanStep_c, f_hi = dk(hi);
        if (std::isfinite(f_lo) && std::isfinite(f_hi) && (f_lo < 0) != (f_hi < 0)) {
            double a = lo, b = hi, f_a = f_lo;
            for (int k = 0; k < 50; ++k) {
                const double mid = 0.5 * (a + b), f_mid = dk(mid);
                if ((f_a < 0) == (f_mid < 0)) a = mid, f_a = f_mid;
                else b = mid;
            }
            const double root = 0.5 * (a + b);
            if (!t.phase_matching_c || std::abs(root - t.now_c) < std::abs(*t.phase_matching_c - t.now_c))
                t.phase_matching_c = root;
        }
        lo = hi;
        f_lo = f_hi;
    }
    return t;
}

}  // namespace rv
