#include "trace/crystal_axes.hpp"

#include <algorithm>
#include <cmath>

#include "units/constants.hpp"

namespace rv {

double angle_to_reference_axis_rad(const Vec2& n, double cut, bool horizontal, const Vec2& k) {
    const Vec2 t = perpendicular(n);
    const double alpha = std::atan2(k.dot(t), k.dot(n));
    const double c = horizontal ? std::abs(std::cos(alpha - cut)) : std::abs(std::cos(alpha)) * std::cos(cut);
    return std::acos(std::clamp(c, 0.0, 1.0));
}

double a_wave_fraction(const Polarization& p, bool horizontal_axis) {
    using K = Polarization::Kind;
    double horizontal = 0.5;  // circular
    if (p.kind == K::Horizontal) horizontal = 1;
    if (p.kind == K::Vertical) horizontal = 0;
    if (p.kind == K::Linear) horizontal = std::pow(std::cos(deg_to_rad(p.angle_deg)), 2);
    return horizontal_axis ? 1 - horizontal : horizontal;
}

}  // namespace rv
