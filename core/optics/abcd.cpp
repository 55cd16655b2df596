#include "optics/abcd.hpp"

#include <cmath>
#include <limits>

namespace rv {

RayMatrix free_space(double length_mm) {
    RayMatrix m;
    m << 1.0, length_mm, 0.0, 1.0;
    return m;
}

RayMatrix thin_lens(double focal_length_mm) {
    RayMatrix m;
    m << 1.0, 0.0, -1.0 / focal_length_mm, 1.0;
    return m;
}

RayMatrix plane_interface(double n1, double n2) {
    RayMatrix m;
    m << 1.0, 0.0, 0.0, n1 / n2;
    return m;
}

RayMatrix curved_interface(double n1, double n2, double radius_mm) {
    RayMatrix m;
    m << 1.0, 0.0, (n1 - n2) / (n2 * radius_mm), n1 / n2;
    return m;
}

RayMatrix tilted_interface(double n1, double n2, double aoi_rad, Plane plane) {
    return tilted_interface(n1, n2, std::cos(aoi_rad), std::sin(aoi_rad), plane);
}

RayMatrix tilted_interface(double n1, double n2, double cos_in, double sin_in, Plane plane) {
    if (plane == Plane::Sagittal || sin_in == 0.0) return plane_interface(n1, n2);  // the same at normal incidence
    // Snell: n1 sin θ = n2 sin θ'. The beam's tangential width scales by cosθ'/cosθ.
    const double sin_out = n1 * sin_in / n2;
    const double cos_out = std::sqrt(1.0 - sin_out * sin_out);
    RayMatrix m;
    m << cos_out / cos_in, 0.0, 0.0, n1 * cos_in / (n2 * cos_out);
    return m;
}

double mirror_focal_length_mm(double radius_mm, double aoi_rad, Plane plane) {
    const double c = std::cos(aoi_rad);
    return plane == Plane::Tangential ? radius_mm * c / 2.0 : radius_mm / (2.0 * c);
}

RayMatrix spherical_mirror(double radius_mm, double aoi_rad, Plane plane) {
    return spherical_mirror_at_cos(radius_mm, std::cos(aoi_rad), plane);
}

RayMatrix spherical_mirror_at_cos(double radius_mm, double c, Plane plane) {
    return thin_lens(plane == Plane::Tangential ? radius_mm * c / 2.0 : radius_mm / (2.0 * c));
}

double effective_focal_length_mm(const RayMatrix& m) {
    if (m(1, 0) == 0.0) return std::numeric_limits<double>::infinity();
    return -1.0 / m(1, 0);
}

}  // namespace rv
