#include "optics/thick_lens.hpp"

namespace rv {

double chromatic_focal_length_mm(double focal_length_design_mm, double index_design,
                                 double index_now) {
    return focal_length_design_mm * (index_design - 1.0) / (index_now - 1.0);
}

RayMatrix thick_singlet_matrix(const ThickSinglet& lens, double index) {
    // 1/R of an infinite radius is 0, so a flat face gives the plane-interface matrix.
    return curved_interface(index, 1.0, lens.back_radius_mm) *
           free_space(lens.center_thickness_mm) * curved_interface(1.0, index, lens.front_radius_mm);
}

ThickLensProperties thick_lens_properties(const ThickSinglet& lens, double index) {
    const RayMatrix m = thick_singlet_matrix(lens, index);
    const double a = m(0, 0), c = m(1, 0), d = m(1, 1);
    return {-1.0 / c, -a / c, -d / c, (d - 1.0) / c, (1.0 - a) / c};
}

double lensmaker_focal_length_mm(const ThickSinglet& lens, double index) {
    const double inv_r1 = 1.0 / lens.front_radius_mm;
    const double inv_r2 = 1.0 / lens.back_radius_mm;
    const double power = (index - 1.0) * (inv_r1 - inv_r2 + (index - 1.0) *
                                          lens.center_thickness_mm * inv_r1 * inv_r2 / index);
    return 1.0 / power;
}

}  // namespace rv
