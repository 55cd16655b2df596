#include "analysis/phase_now.hpp"

#include "trace/crystal_axes.hpp"

namespace rv {

PhaseNow phase_now(const Material& material, double first_nm, double second_nm, MixingType type,
                   const Element& crystal_element, const Crystal& crystal, const Vec2& direction_inside,
                   double index_inside) {
    const CrystalPose pose = crystal_pose(direction_deg(crystal_element.normal_deg), crystal);
    PhaseNow p;
    p.theta_now_rad = angle_to_reference_axis_rad(pose, direction_inside, index_inside);
    p.delta_k_per_mm = delta_k_per_mm(material, first_nm, second_nm, type, p.theta_now_rad, crystal.principal_plane);
    return p;
}

}  // namespace rv
