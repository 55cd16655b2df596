#include "polarization/polarization_model.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "materials/dispersion.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {
using cd = std::complex<double>;

Eigen::Matrix2d rotation(double t) {
    Eigen::Matrix2d r;
    r << std::cos(t), std::sin(t), -std::sin(t), std::cos(t);
    return r;
}

JonesMatrix about_axis(const JonesMatrix& diagonal, double axis_rad) {
    const JonesMatrix r = rotation(axis_rad).cast<cd>();
    const JonesMatrix r_back = rotation(-axis_rad).cast<cd>();
    return r_back * diagonal * r;
}
}  // namespace

Stokes source_stokes(const Polarization& p, double polarized_fraction) {
    Stokes s(1, 0, 0, 0);
    using K = Polarization::Kind;
    Eigen::Vector3d dir(0, 0, 0);
    switch (p.kind) {
        case K::Horizontal: dir = {1, 0, 0}; break;
        case K::Vertical: dir = {-1, 0, 0}; break;
        case K::Linear: {
            const double t = 2 * deg_to_rad(p.angle_deg);
            dir = {std::cos(t), std::sin(t), 0};
            break;
        }
        case K::CircularRight: dir = {0, 0, 1}; break;
        case K::CircularLeft: dir = {0, 0, -1}; break;
    }
    s.tail<3>() = polarized_fraction * dir;
    return s;
}

Mueller mueller_from_jones(const JonesMatrix& j) {
    Eigen::Matrix4cd a;
    const cd i(0, 1);
    a << 1, 0, 0, 1, 1, 0, 0, -1, 0, 1, 1, 0, 0, -i, i, 0;
    Eigen::Matrix4cd kron;
    for (int r = 0; r < 2; ++r)
        for (int c = 0; c < 2; ++c)
            for (int r2 = 0; r2 < 2; ++r2)
                for (int c2 = 0; c2 < 2; ++c2) kron(2 * r + r2, 2 * c + c2) = j(r, c) * std::conj(j(r2, c2));
    return (a * kron * a.inverse()).real();
}

JonesMatrix retarder_jones(double retardance_rad, double fast_axis_rad) {
    JonesMatrix d = JonesMatrix::Zero();
    d(0, 0) = 1;
    d(1, 1) = std::polar(1.0, retardance_rad);
    return about_axis(d, fast_axis_rad);
}

JonesMatrix polarizer_jones(double extinction_ratio, double axis_rad) {
    JonesMatrix d = JonesMatrix::Zero();
    d(0, 0) = 1;
    d(1, 1) = 1 / std::sqrt(extinction_ratio);
    return about_axis(d, axis_rad);
}

JonesMatrix mirror_jones(double retardance_rad) {
    JonesMatrix d = JonesMatrix::Zero();
    d(0, 0) = -1;
    d(1, 1) = std::polar(1.0, retardance_rad);
    return d;
}

std::optional<double> retardance_waves(const Plate& plate, double nm, const MaterialLibrary& library) {
    const double nominal = plate.role == Plate::Role::HalfWave      ? 0.5
                           : plate.role == Plate::Role::QuarterWave ? 0.25
                                                                    : -1;
    if (nominal < 0) return std::nullopt;
    const double at_design = nominal + plate.order;
    if (!plate.retarder_material) {  // ideal: Γ ∝ 1/λ
        if (!plate.design_nm) return std::nullopt;
        return at_design * *plate.design_nm / nm;
    }
    const Material* m = library.find(*plate.retarder_material);
    if (!m || m->symmetry != Symmetry::Uniaxial) return std::nullopt;
    auto birefringence = [&](double l) {
        return std::abs(sample_index(*m, l, Axis::Extraordinary).index - sample_index(*m, l, Axis::Ordinary).index);
    };
    // Thickness of birefringent material: given, or the one that makes the nominal retardance
    // at the design wavelength.
    if (!plate.retarder_thickness_um && !plate.design_nm) return std::nullopt;
    const double thickness_nm = plate.retarder_thickness_um
                                    ? um_to_nm(*plate.retarder_thickness_um)
                                    : at_design * *plate.design_nm / birefringence(*plate.design_nm);
    const double waves = birefringence(nm) * thickness_nm / nm;
    if (!std::isfinite(waves)) return std::nullopt;
    return waves;
}

PolarizationState describe(const Stokes& s) {
    PolarizationState p;
    p.power = s[0];
    p.h = (s[0] + s[1]) / 2;
    p.v = (s[0] - s[1]) / 2;
    const double polarized = s.tail<3>().norm();
    p.degree = s[0] > 0 ? std::min(1.0, polarized / s[0]) : 0;
    p.ellipticity_deg = polarized > 0 ? rad_to_deg(0.5 * std::asin(std::clamp(s[3] / polarized, -1.0, 1.0))) : 0;
    if (p.degree >= kUnpolarizedDegree && std::abs(p.ellipticity_deg) < kCircularEllipticityDeg) {
        double azimuth = rad_to_deg(0.5 * std::atan2(s[2], s[1]));
        if (azimuth <= -90 + 1e-9) azimuth += 180;
        p.azimuth_deg = azimuth;
    }
    return p;
}

std::string describe_text(const PolarizationState& p) {
    char text[96];
    if (p.degree < kUnpolarizedDegree) return "unpolarized";
    const char* partly = p.degree < 0.95 ? "partly polarized, " : "";
    if (!p.azimuth_deg) {  // |χ| ≥ kCircularEllipticityDeg
        std::snprintf(text, sizeof text, "%scircular (%s)", partly, p.ellipticity_deg > 0 ? "right" : "left");
    } else if (const double azimuth = *p.azimuth_deg; std::abs(p.ellipticity_deg) < 1) {
        if (std::abs(azimuth) < 0.5) std::snprintf(text, sizeof text, "%shorizontal", partly);
        else if (std::abs(std::abs(azimuth) - 90) < 0.5) std::snprintf(text, sizeof text, "%svertical", partly);
        else std::snprintf(text, sizeof text, "%slinear at %.1f°", partly, azimuth);
    } else {
        std::snprintf(text, sizeof text, "%selliptical, axis %.1f°, ellipticity %.1f°", partly, azimuth,
                      p.ellipticity_deg);
    }
    return text;
}

}  // namespace rv
