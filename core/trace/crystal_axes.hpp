#pragma once
// How a crystal on the table meets a beam: the angle ψ between the wave vector and the
// crystal's reference axis (the optic axis of a uniaxial crystal; X in a biaxial crystal's XY
// plane, Z in its YZ and XZ planes), and which of the two polarizations a beam has.
//
// Frame: x, y in the table plane, z up. The crystal as placed has the face normal n (from its
// normal_deg, in the table plane) and t = n turned +90° in the table plane. Before its tilt the
// reference axis makes the angle cut with n: towards t when optic_axis is "horizontal",
// towards z when it is "vertical":
//   horizontal: c = cos(cut) n + sin(cut) t          vertical: c = cos(cut) n + sin(cut) z.
// The tilt τ turns the crystal about t so that + raises the face normal towards z:
//   n' = cos τ n + sin τ z,   z' = −sin τ n + cos τ z,   t unchanged,
// and carries the axis with it (vertical: c' = cos(cut+τ) n + sin(cut+τ) z).
// The beams travel in the table plane; the wave vector inside is the exact 3-D refraction of the
// outside direction at the tilted face (Snell's law in vector form: the part along the face
// divided by the index). ψ is the angle between lines, in [0, π/2]: cos ψ = |k·c'|.
// Without tilt this is the table-plane case: for k at angle α from n (α = atan2(k·t, k·n)),
//   horizontal: cos ψ = |cos(α − cut)|               vertical: cos ψ = |cos α| · cos(cut).
// The trace itself stays in the table plane (it refracts at the untilted face); the tilt's
// vertical beam offset, about L·τ·(1 − 1/n), is not drawn.
// The angle-independent ("A", ordinary) wave is polarized perpendicular to the plane of the
// axis and k: horizontally when that plane is vertical, vertically when it is horizontal (exact
// without tilt; for a tilt of a few degrees the plane turns by less than the tilt).

#include <Eigen/Core>

#include "layout/layout.hpp"

namespace rv {

using Vec3 = Eigen::Vector3d;

// A crystal as placed on the table, for the angle to its reference axis.
struct CrystalPose {
    Vec2 face_normal{1, 0};  // n, in the table plane (from normal_deg)
    double cut_rad = 0;
    bool axis_in_table_plane = false;
    double tilt_rad = 0;
};
CrystalPose crystal_pose(const Vec2& face_normal, const Crystal& crystal);

// The unit wave vector inside the crystal for a wave arriving along `outside` (table plane)
// with `index` inside: exact 3-D refraction at the tilted face.
Vec3 wave_vector_from_outside(const CrystalPose& pose, const Vec2& outside, double index);

// The unit wave vector inside the crystal for a wave whose table-plane direction inside,
// k_inside, is the refraction of its outside direction at the untilted face with `index` (the
// trace's direction; index 1: k_inside is the outside direction). From k_inside and the index
// the outside direction is recovered (Snell: sin α = index · k·t) and refracted in 3-D at the
// tilted face.
Vec3 wave_vector_inside(const CrystalPose& pose, const Vec2& k_inside, double index);

// ψ for that wave (see above).
double angle_to_reference_axis_rad(const CrystalPose& pose, const Vec2& k_inside, double index);
// ψ for a wave vector inside.
double angle_to_reference_axis_rad(const CrystalPose& pose, const Vec3& k);

// The crystal's reference axis as placed (cut and tilt applied), a unit vector of either sign.
Vec3 reference_axis(const CrystalPose& pose);

// The unit vector perpendicular to the wave vector k, in the plane of k and the reference axis,
// pointing away from the axis: the energy of a B wave runs along cos ρ k + sin ρ u
// (nonlinear/wave_dispersion.hpp; ρ < 0 turns it towards the axis). Zero when k lies along the
// axis or across it (no walk-off there).
Vec3 away_from_axis(const CrystalPose& pose, const Vec3& k);

// How the trace carries a B wave's walk-off ρ for a wave vector k (table-plane direction
// k_inside, as wave_vector_inside takes it): the energy's turn from k_inside in the table plane
// (counter-clockwise +, drawn) and its slope out of the table plane (+ up, carried as a height).
// Small tilts: the vertical part is taken along z, as the trace's plane is the table's.
struct WalkoffTurn {
    double table_rad = 0;       // the turn of the drawn ray in the table plane
    double vertical_slope = 0;  // rise per mm of table-plane travel
};
WalkoffTurn walkoff_turn(const CrystalPose& pose, const Vec2& k_inside, double index, double walkoff_rad);

// The fraction of a beam's power in the A wave (Malus: cos² of the angle between the
// polarization and the A direction; circular light splits evenly).
double a_wave_fraction(const Polarization& polarization, bool axis_in_table_plane);

}  // namespace rv
