#pragma once
// How a crystal on the table meets a beam: the angle ψ between the wave vector and the
// crystal's reference axis (the optic axis of a uniaxial crystal; X in a biaxial crystal's XY
// plane, Z in its YZ and XZ planes), and which of the two polarizations a beam has.
//
// Convention: the reference axis makes the angle cut_deg with the face normal n (as placed),
// in the table plane towards t = n rotated +90° when optic_axis is "horizontal", or out of the
// table plane when it is "vertical". For a wave vector k at angle α from n in the table plane
// (α = atan2(k·t, k·n)):
//   horizontal: cos ψ = |cos(α − cut)|         vertical: cos ψ = |cos α| · cos(cut)
// (ψ is the angle between lines, in [0, π/2]; the index depends on it through cos²ψ).
// The angle-independent ("A", ordinary) wave is polarized perpendicular to the plane of the
// axis and k: horizontally when that plane is vertical, vertically when it is horizontal.

#include "layout/layout.hpp"

namespace rv {

double angle_to_reference_axis_rad(const Vec2& face_normal, double cut_rad, bool axis_in_table_plane,
                                   const Vec2& k);

// The fraction of a beam's power in the A wave (Malus: cos² of the angle between the
// polarization and the A direction; circular light splits evenly).
double a_wave_fraction(const Polarization& polarization, bool axis_in_table_plane);

}  // namespace rv
