#pragma once
// Uniaxial crystals: the extraordinary index for a wave whose vector k makes the angle θ with
// the optic axis (the index ellipsoid):
//   1/n_e(θ)² = cos²θ/n_o² + sin²θ/n_e²
// and its group index at fixed θ, n_g = n − λ dn/dλ with
//   dn/dλ = n³ (cos²θ n_o'/n_o³ + sin²θ n_e'/n_e³).
// Reference: Dmitriev, Gurzadyan & Nikogosyan, "Handbook of Nonlinear Optical Crystals",
// 3rd ed. (1999); Boyd, "Nonlinear Optics" (2008), §2.3.

#include "materials/dispersion.hpp"

namespace rv {

// Index, group index and range flag of the extraordinary wave at angle_to_axis_rad
// (GVD and TOD are left 0: not needed at an angle so far).
IndexSample extraordinary_index(const Material& uniaxial, double wavelength_nm,
                                double angle_to_axis_rad);

}  // namespace rv
