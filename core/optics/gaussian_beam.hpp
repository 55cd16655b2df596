#pragma once
// Gaussian beams by the complex beam parameter q, one transverse plane at a time.
//
// Model: the embedded-Gaussian convention for real beams (Siegman, SPIE 1224, 1990; ISO 11146):
// a beam of second-moment waist radius W0 and beam-quality factor M² propagates like a
// fundamental Gaussian with the wavelength replaced by M²·λ0. Every radius reported here is the
// ISO 11146 second-moment radius W (for M² = 1 it is the 1/e² intensity radius).
//
// Conventions (see abcd.hpp for the ray convention, which is the actual-angle one):
// * q is in mm and uses the LOCAL wavelength λ0/n: q = z + i z_R, where z is the distance past
//   the waist (z < 0 before the waist, so the waist lies −Re q downstream) and
//   z_R = π n W0² / (M² λ0) is the Rayleigh range in the medium of index n.
// * 1/q = 1/R − i M² λ0 / (π n W²). R > 0: diverging wavefront (centre of curvature upstream).
// * Across an interface from n1 to n2 the ABCD law with det M = n1/n2 carries q; the beam's
//   index must be updated to n2 by the caller (propagate() takes the new index).
// Reference: Kogelnik & Li, "Laser Beams and Resonators", Appl. Opt. 5, 1550 (1966).

#include <complex>

#include "optics/abcd.hpp"

namespace rv {

struct GaussianBeam {
    std::complex<double> q_mm;  // complex beam parameter, local-wavelength convention
    double wavelength_nm;       // vacuum wavelength
    double index;               // refractive index of the medium the beam is in now
    double m2;                  // beam-quality factor M² ≥ 1 in this plane
};

// A beam given by its waist, named at the call: beam_from_waist({.waist_um = 40,
// .distance_to_waist_mm = 120, .wavelength_nm = 1064}).
struct Waist {
    double waist_um = 0.0;              // second-moment waist radius
    double distance_to_waist_mm = 0.0;  // where the waist lies downstream of the point described
                                        // (negative: behind, upstream)
    double wavelength_nm = 0.0;         // vacuum wavelength
    double index = 1.0;                 // of the medium the beam is in
    double m2 = 1.0;                    // beam-quality factor in this plane
};
GaussianBeam beam_from_waist(const Waist& waist);

// ABCD law; index_after is the index of the medium after the matrix (the same as before for
// free space, lenses and mirrors).
GaussianBeam propagate(const GaussianBeam& beam, const RayMatrix& m, double index_after);
GaussianBeam propagate(const GaussianBeam& beam, const RayMatrix& m);
// Free space of length L in the beam's medium: q + L, the same as propagate(beam, free_space(L)).
inline GaussianBeam translate(GaussianBeam beam, double length_mm) {
    beam.q_mm += length_mm;
    return beam;
}

// Second-moment beam radius W at the current plane, µm.
double radius_um(const GaussianBeam& beam);
// Second-moment waist radius W0, µm.
double waist_radius_um(const GaussianBeam& beam);
// Distance from the current plane to the waist, + = downstream, mm.
double distance_to_waist_mm(const GaussianBeam& beam);
// Rayleigh range in the current medium, mm; the confocal parameter is twice it.
double rayleigh_range_mm(const GaussianBeam& beam);
// Wavefront radius of curvature, mm (+ diverging, − converging, infinite at the waist).
double wavefront_radius_mm(const GaussianBeam& beam);
// Gouy phase relative to the waist, arctan(z / z_R), radians.
double gouy_phase_rad(const GaussianBeam& beam);
// Far-field divergence half-angle in the current medium, M² λ0 / (π n W0), radians.
double divergence_rad(const GaussianBeam& beam);

}  // namespace rv
