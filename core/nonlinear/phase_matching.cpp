#include "nonlinear/phase_matching.hpp"

#include <cmath>

#include "materials/dispersion.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {


// n_B(ψ) and dn_B/dλ at fixed ψ: from 1/n² = c²/p² + s²/q²,
// dn/dλ = n³ (c² p'/p³ + s² q'/q³).
std::pair<double, double> b_index(const CrystalIndices& x, double angle) {
    const double c2 = std::cos(angle) * std::cos(angle), s2 = 1 - c2;
    const double inv2 = c2 / (x.p.n * x.p.n) + s2 / (x.q.n * x.q.n);
    const double n = 1 / std::sqrt(inv2);
    const double dn = n * n * n * (c2 * x.p.dn / (x.p.n * x.p.n * x.p.n) + s2 * x.q.dn / (x.q.n * x.q.n * x.q.n));
    return {n, dn};
}

double n_of(const Material& m, double nm, Polarity pol, double angle, PrincipalPlane plane) {
    const CrystalIndices x = crystal_indices(m, nm, plane);
    return pol == Polarity::A ? x.a.n : b_index(x, angle).first;
}

}  // namespace

CrystalIndices crystal_indices(const Material& m, double wavelength_nm, PrincipalPlane plane) {
    const double l = nm_to_um(wavelength_nm);
    const bool in_range = covers(m, wavelength_nm);
    if (m.symmetry == Symmetry::Biaxial) {
        const IndexDerivatives x = evaluate(m.axes[0], l), y = evaluate(m.axes[1], l), z = evaluate(m.axes[2], l);
        switch (plane) {
            case PrincipalPlane::XY: return {z, y, x, l, in_range};
            case PrincipalPlane::YZ: return {x, y, z, l, in_range};
            case PrincipalPlane::XZ: return {y, x, z, l, in_range};
        }
    }
    const IndexDerivatives o = evaluate(m.axes[0], l);  // uniaxial: A = p = n_o, q = n_e
    return {o, o, evaluate(m.axes[1], l), l, in_range};
}

WaveIndex wave_index(const CrystalIndices& x, Polarity pol, double angle) {
    const double l = x.wavelength_um;
    if (pol == Polarity::A) return {x.a.n, x.a.n - l * x.a.dn, x.in_range};
    const auto [n, dn] = b_index(x, angle);
    return {n, n - l * dn, x.in_range};
}

WavePolarities polarities(MixingType type) {
    using P = Polarity;
    switch (type) {
        case MixingType::TypeI: return {P::A, P::A, P::B};
        case MixingType::TypeI_BBA: return {P::B, P::B, P::A};
        case MixingType::TypeII_ABB: return {P::A, P::B, P::B};
        case MixingType::TypeII_BAB: return {P::B, P::A, P::B};
        case MixingType::TypeII_ABA: return {P::A, P::B, P::A};
        case MixingType::TypeII_BAA: return {P::B, P::A, P::A};
    }
    return {P::A, P::A, P::B};
}

const char* mixing_type_label(MixingType t) {
    switch (t) {
        case MixingType::TypeI:
            return "type-I (ooe)";
        case MixingType::TypeI_BBA:
            return "type-I (eeo)";
        case MixingType::TypeII_ABB:
            return "type-II (oee)";
        case MixingType::TypeII_BAB:
            return "type-II (eoe)";
        case MixingType::TypeII_ABA:
            return "type-II (oeo)";
        case MixingType::TypeII_BAA:
            return "type-II (eoo)";
    }
    return "";
}

double sum_frequency_nm(double l1, double l2) { return 1.0 / (1.0 / l1 + 1.0 / l2); }

WaveIndex wave_index(const Material& m, double nm, Polarity pol, double angle, PrincipalPlane plane) {
    return wave_index(crystal_indices(m, nm, plane), pol, angle);
}

double delta_k_per_mm(const Material& m, double l1, double l2, MixingType type, double angle,
                      PrincipalPlane plane) {
    const WavePolarities w = polarities(type);
    const double l3 = sum_frequency_nm(l1, l2);
    // k = 2π n / λ; with λ in nm, per nm, given per mm.
    return per_nm_to_per_mm(2 * kPi *
                            (n_of(m, l3, w.wave3, angle, plane) / l3 - n_of(m, l1, w.wave1, angle, plane) / l1 -
                             n_of(m, l2, w.wave2, angle, plane) / l2));
}

std::optional<double> phase_matching_angle_rad(const Material& m, double l1, double l2,
                                               MixingType type, PrincipalPlane plane) {
    if (m.symmetry == Symmetry::Isotropic) return std::nullopt;
    if (type == MixingType::TypeI) {
        const double l3 = sum_frequency_nm(l1, l2);
        const CrystalIndices x1 = crystal_indices(m, l1, plane), x2 = crystal_indices(m, l2, plane),
                           x3 = crystal_indices(m, l3, plane);
        const double big_n = l3 * (x1.a.n / l1 + x2.a.n / l2);
        const double s2 = (1 / (big_n * big_n) - 1 / (x3.p.n * x3.p.n)) /
                          (1 / (x3.q.n * x3.q.n) - 1 / (x3.p.n * x3.p.n));
        if (!(s2 >= 0 && s2 <= 1)) return std::nullopt;
        return std::asin(std::sqrt(s2));
    }
    // Other types: bisection on Δk(ψ) over (0, π/2) after a scan for a sign change.
    auto f = [&](double a) { return delta_k_per_mm(m, l1, l2, type, a, plane); };
    const int steps = 180;
    double lo = 1e-6, flo = f(lo);
    for (int i = 1; i <= steps; ++i) {
        const double hi = (kPi / 2 - 1e-6) * i / steps, fhi = f(hi);
        if ((flo < 0) != (fhi < 0)) {
            double a = lo, b = hi, fa = flo;
            for (int k = 0; k < 100; ++k) {
                const double mid = 0.5 * (a + b), fm = f(mid);
                if ((fa < 0) == (fm < 0)) a = mid, fa = fm;
                else b = mid;
            }
            return 0.5 * (a + b);
        }
        lo = hi;
        flo = fhi;
    }
    return std::nullopt;
}

double walkoff_rad(const Material& m, double nm, double angle, PrincipalPlane plane) {
    const CrystalIndices x = crystal_indices(m, nm, plane);
    const double n = b_index(x, angle).first;
    return std::atan(0.5 * n * n * (1 / (x.q.n * x.q.n) - 1 / (x.p.n * x.p.n)) * std::sin(2 * angle));
}

Acceptance acceptance(const Material& m, double l1, double l2, MixingType type, double angle,
                      double length_mm, PrincipalPlane plane) {
    const double h = 1e-6;  // rad
    const double dk_dangle = (delta_k_per_mm(m, l1, l2, type, angle + h, plane) -
                              delta_k_per_mm(m, l1, l2, type, angle - h, plane)) / (2 * h);
    const bool shg = l1 == l2;
    const double dl = 1e-3;  // nm
    auto dk_at = [&](double x) { return delta_k_per_mm(m, x, shg ? x : l2, type, angle, plane); };
    const double dk_dlambda = (dk_at(l1 + dl) - dk_at(l1 - dl)) / (2 * dl);
    return {rad_to_mrad(kSincHalfWidth / (length_mm * std::abs(dk_dangle))),
            kSincHalfWidth / (length_mm * std::abs(dk_dlambda))};
}

double group_velocity_mismatch_fs_per_mm(const Material& m, double l1, double l2, MixingType type,
                                         double angle, int i, int j, PrincipalPlane plane) {
    const WavePolarities w = polarities(type);
    const double lambdas[3] = {l1, l2, sum_frequency_nm(l1, l2)};
    const Polarity pols[3] = {w.wave1, w.wave2, w.wave3};
    const double ng_i = wave_index(m, lambdas[i - 1], pols[i - 1], angle, plane).group_index;
    const double ng_j = wave_index(m, lambdas[j - 1], pols[j - 1], angle, plane).group_index;
    return (ng_i - ng_j) / kSpeedOfLight_mm_per_fs;
}

}  // namespace rv
