#include "nonlinear/b_integral.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <utility>

#include "units/clamped_int.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {

// n₂ for linear polarization near 1 µm. None of these could be confirmed through a source
// found this session: each value and its attribution is from memory (the order of magnitude,
// 2–4 × 10⁻¹⁶ cm²/W for oxide glasses and borates, is common practice).
constexpr std::array<std::pair<std::string_view, KerrIndex>, 5> kKerr{{
    {"fused-silica", {2.74e-16, "Milam, Appl. Opt. 37, 546 (1998), 1053 nm (from memory)"}},
    {"N-BK7", {3.43e-16, "Weber, Milam & Smith, Opt. Eng. 17, 463 (1978), BK-7 at 1064 nm (from memory)"}},
    {"CaF2", {1.9e-16, "Weber, Milam & Smith, Opt. Eng. 17, 463 (1978), 1064 nm (from memory)"}},
    {"BBO", {2.9e-16, "DeSalvo et al., IEEE J. Quantum Electron. 32, 1324 (1996), 1064 nm (from memory)"}},
    {"LBO", {1.9e-16, "typical published value near 1 µm (from memory; source not confirmed)"}},
}};

// 16-point Gauss–Legendre on [−1, 1] (Abramowitz & Stegun, Table 25.4), half the nodes.
constexpr std::array<double, 8> kNodes{0.0950125098376374, 0.2816035507792589, 0.4580167776572274,
                                       0.6178762444026438, 0.7554044083550030, 0.8656312023878318,
                                       0.9445750230732326, 0.9894009349916499};
constexpr std::array<double, 8> kWeights{0.1894506104550685, 0.1826034150449236, 0.1691565193950025,
                                         0.1495959888165767, 0.1246289712555339, 0.0951585116824928,
                                         0.0622535239386479, 0.0271524594117541};

double radius_ratio(const SlabPlane& p, double z_mm) {
    if (!(p.rayleigh_mm > 0)) return 1;
    const double u = (z_mm - p.waist_from_centre_mm) / p.rayleigh_mm;
    return std::sqrt(1 + u * u);  // w(z)/w0
}

}  // namespace

std::optional<KerrIndex> kerr_index(std::string_view family) {
    for (const auto& [name, k] : kKerr)
        if (name == family) return k;
    return std::nullopt;
}

double b_integral_uniform_rad(double wavelength_nm, double n2, double intensity_w_cm2, double length_mm) {
    const double lambda_cm = wavelength_nm * 1e-7, length_cm = length_mm * 0.1;
    return 2 * kPi / lambda_cm * n2 * intensity_w_cm2 * length_cm;
}

double b_integral_rad(double wavelength_nm, double n2, double i0_w_cm2, const SlabPlane& t,
                      const SlabPlane& s, double length_mm) {
    if (!(length_mm > 0)) return 0;
    // ∫ I0/(rt rs) dz over [−L/2, L/2]: panels of at most one Rayleigh range, so the Lorentzian
    // near a waist inside the slab is resolved.
    const double zr = std::min(t.rayleigh_mm > 0 ? t.rayleigh_mm : length_mm,
                               s.rayleigh_mm > 0 ? s.rayleigh_mm : length_mm);
    // Clamped before the cast (units/clamped_int.hpp): L/z_R may be far beyond any int (a thick
    // lens of ±1 µm radii; found by the pipeline fuzzer under UBSan).
    const int panels = clamped_int(std::ceil(length_mm / zr), 1, 256);
    const double panel = length_mm / panels;
    double mean = 0;  // mean of 1/(rt rs) over the slab
    for (int p = 0; p < panels; ++p) {
        const double mid = -length_mm / 2 + (p + 0.5) * panel;
        for (size_t k = 0; k < kNodes.size(); ++k)
            for (double sign : {-1.0, 1.0}) {
                const double z = mid + sign * kNodes[k] * panel / 2;
                mean += kWeights[k] / 2 / (radius_ratio(t, z) * radius_ratio(s, z));
            }
    }
    mean /= panels;
    return b_integral_uniform_rad(wavelength_nm, n2, i0_w_cm2 * mean, length_mm);
}

}  // namespace rv
