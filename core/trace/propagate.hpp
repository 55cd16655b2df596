#pragma once
// Gaussian beams carried along a traced path, tangential and sagittal planes separately.
//
// Model: the beam starts from its source's waist (per plane, M² per plane) and runs through
// free space of each segment's length, then through the matrix of each hit:
//   thin lens [1 0; −1/f 1] at the beam's wavelength; thick singlet S2·T(t)·S1 at the glass's
//   index, taken about its plane as T(−t/2)·M·T(−t/2) because the trace meets it as one plane
//   (faces reversed for light travelling against its normal); curved mirror with
//   f_t = R cos θ/2, f_s = R/(2 cos θ) at the traced angle of incidence; each slab face the
//   tilted-interface matrix at the traced angle (so a tilted plate comes out of its two faces);
//   flat mirrors, dichroic reflections, retroreflectors and target planes the identity.
// Actual-angle convention (optics/abcd.hpp); inside a medium q carries its index, so the
// Rayleigh range in a crystal is the one in the crystal.
// Waist location: see Caustic::target_waist_offset_*.
// Clipping: at each hit the aperture seen by the beam is a circle of radius a = aperture/2,
// shrunk by the chief ray's offset h from the centre and projected by cos θ in the tangential
// plane; the power outside it is estimated as exp(−2 a_eff²/w²) for the plane where that is
// largest (the circular-aperture formula, an upper bound for the offset beam).

#include <vector>

#include "layout/layout.hpp"
#include "optics/gaussian_beam.hpp"
#include "trace/path.hpp"

namespace rv {

struct BeamAtHit {
    double s_mm = 0;
    double radius_tangential_um = 0, radius_sagittal_um = 0;  // arriving at the hit
    double clipped_fraction = 0;                              // 0 where not applicable
};

struct EnvelopeSample {
    double s_mm, radius_tangential_um, radius_sagittal_um;
};

struct Caustic {
    size_t beam = 0;
    std::vector<BeamAtHit> at_hits;  // one per Path::hits entry
    bool reaches_target = false;
    GaussianBeam target_tangential{}, target_sagittal{};  // at the target plane
    // Where the waist really forms, as a signed path length from the target plane (+ =
    // downstream), following the beam through plane interfaces (a waist beyond a crystal's exit
    // face forms in the air after it). The search stops at an element with optical power; then
    // the waist of the medium at the target is given (virtual).
    double target_waist_offset_tangential_mm = 0, target_waist_offset_sagittal_mm = 0;
    std::vector<EnvelopeSample> envelope;                // sorted by s, denser near the target
    std::vector<Finding> findings;                       // clipping above the threshold
};

struct PropagationOptions {
    double clipping_warning_fraction = 0.01;  // warn when more than 1 % is cut off
    double envelope_step_mm = 5.0;            // sample spacing away from the target
    int samples_near_target = 201;            // over ±3 Rayleigh ranges around the target
    bool sample_envelope = true;              // off for solvers: only the numbers at hits
};

// Uses the focal lengths and indices the trace stored in each hit.
Caustic propagate_path(const Layout& layout, const Path& path, const PropagationOptions& options = {});

// Only the beam at the target plane and where its waists form (the same numbers as
// propagate_path's target_* fields), without the radii and clipping at every hit: what the
// solvers need.
struct BeamsAtTargetPlane {
    bool reached = false;
    GaussianBeam tangential{}, sagittal{};
    double waist_offset_tangential_mm = 0, waist_offset_sagittal_mm = 0;
};
// With a memo, the beams after each hit are kept, and a path whose first `unchanged_hits` hits
// (and the segments before them) are those of the previous call with this memo, for the same
// beam source, restarts after them (retrace_layout says how many are unchanged).
struct TargetPropagationMemo {
    using Beams = std::pair<GaussianBeam, GaussianBeam>;  // tangential, sagittal
    std::vector<Beams> after_hit;  // after each hit before the target, past its matrix
    std::vector<Beams> arriving;   // arriving at each of those hits, before its matrix
};
BeamsAtTargetPlane propagate_to_target(const Layout& layout, const Path& path,
                                       TargetPropagationMemo* memo = nullptr, size_t unchanged_hits = 0);

}  // namespace rv
