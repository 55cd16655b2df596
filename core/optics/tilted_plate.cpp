#include "optics/tilted_plate.hpp"

#include <cmath>

namespace rv {

TiltedPlate tilted_plate(double thickness_mm, double index, double aoi_rad) {
    const double sin_in = std::sin(aoi_rad), cos_in = std::cos(aoi_rad);
    const double sin_out = sin_in / index;
    const double cos_out = std::sqrt(1.0 - sin_out * sin_out);
    const double theta_out = std::asin(sin_out);
    const double glass_path = thickness_mm / cos_out;
    TiltedPlate p{};
    p.lateral_shift_mm =
        thickness_mm * sin_in * (1.0 - cos_in / std::sqrt(index * index - sin_in * sin_in));
    p.sagittal_length_mm = thickness_mm / (index * cos_out);
    p.tangential_length_mm = thickness_mm * cos_in * cos_in / (index * cos_out * cos_out * cos_out);
    p.glass_path_mm = glass_path;
    p.replaced_air_path_mm = glass_path * std::cos(aoi_rad - theta_out);
    p.internal_angle_rad = theta_out;
    return p;
}

RayMatrix tilted_plate_matrix(double thickness_mm, double index, double aoi_rad, Plane plane) {
    const double theta_out = std::asin(std::sin(aoi_rad) / index);
    return tilted_interface(index, 1.0, theta_out, plane) *
           free_space(thickness_mm / std::cos(theta_out)) *
           tilted_interface(1.0, index, aoi_rad, plane);
}

}  // namespace rv
