#pragma once
// Ray-transfer (ABCD) matrices in the table's paraxial model.
//
// Convention (used everywhere in core/, never mixed):
// * Ray vector (y, θ): height y in mm and the ACTUAL angle θ in radians to the local axis
//   (not the reduced angle nθ). A matrix that changes medium from index n1 to n2 has
//   det M = n1/n2. The Gaussian beam parameter q that goes with it uses the local wavelength
//   λ0/n (see gaussian_beam.hpp), so q = (A q + B)/(C q + D) holds across interfaces.
// * Light travels towards +z. A radius of curvature R of a refracting surface is positive when
//   its centre of curvature lies after the surface (downstream): a biconvex lens has R1 > 0,
//   R2 < 0. A mirror's R is positive when it is concave towards the incoming light; a mirror
//   is treated as a lens in the unfolded path, [1 0; −2/R 1].
// * A thin lens of focal length f > 0 converges.
// References: Kogelnik & Li, Appl. Opt. 5, 1550 (1966); Siegman, "Lasers" (1986), ch. 15;
// Kogelnik, Ippen, Dienes & Shank, IEEE JQE 8, 373 (1972) for mirrors at an angle.

#include <Eigen/Core>
#include <Eigen/LU>  // determinant()

namespace rv {

using RayMatrix = Eigen::Matrix2d;

// Which transverse plane a matrix acts in. Tangential: the table plane (plane of incidence);
// sagittal: perpendicular to it.
enum class Plane { Tangential, Sagittal };

// Free propagation over length_mm in any uniform medium (actual-angle convention: [1 d; 0 1]).
RayMatrix free_space(double length_mm);

// Ideal thin lens of focal length focal_length_mm (non-zero; > 0 converging).
RayMatrix thin_lens(double focal_length_mm);

// Flat interface at normal incidence from index n1 to index n2.
RayMatrix plane_interface(double n1, double n2);

// Spherical interface from n1 to n2 with radius_mm (> 0: centre of curvature downstream).
RayMatrix curved_interface(double n1, double n2, double radius_mm);

// Flat interface crossed at angle of incidence aoi_rad (in medium n1), in the given plane.
// Tangential: [cosθ'/cosθ 0; 0 n1 cosθ/(n2 cosθ')]; sagittal: the normal-incidence matrix.
RayMatrix tilted_interface(double n1, double n2, double aoi_rad, Plane plane);
// The same from the cosine and sine of the angle of incidence (as the trace keeps them).
RayMatrix tilted_interface(double n1, double n2, double cos_aoi, double sin_aoi, Plane plane);

// Spherical mirror of radius_mm (> 0 concave) hit at angle of incidence aoi_rad, unfolded.
// Effective focal lengths: tangential f = R cos θ / 2, sagittal f = R / (2 cos θ).
double mirror_focal_length_mm(double radius_mm, double aoi_rad, Plane plane);
RayMatrix spherical_mirror(double radius_mm, double aoi_rad, Plane plane);
RayMatrix spherical_mirror_at_cos(double radius_mm, double cos_aoi, Plane plane);

// Focal length of a general system in air: −1/C (infinite for an afocal system).
double effective_focal_length_mm(const RayMatrix& m);

}  // namespace rv
