#pragma once
// Each beam at the layout's target, and how the two beams differ there.
//
// Per plane: the beam radius at the target plane, the waist radius, the waist position minus
// the target centre (+ = downstream, a path length to where the waist really forms, see
// Caustic), and the Rayleigh range in the medium at the target.
// Mismatch (second beam relative to the first): waist offsets subtracted per plane (reported:
// the mean of the two planes), waist ratio (mean radius of beam 2 / beam 1), lateral offset of
// the chief-ray crossings in the target plane (tangential: in the table plane; sagittal: out of
// it, where an extraordinary wave walks off in a crystal whose optic axis lies in the vertical
// plane, trace/ray_state.hpp), angle between the chief rays, and the delay (arrival of the
// first beam minus the second). The chief ray is the energy's: an extraordinary input's walk-off
// in the target crystal is in the crossing, the direction and the overlap along the crystal.

#include <optional>
#include <vector>

#include "analysis/pulse_at_target.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"
#include "trace/path.hpp"
#include "trace/propagate.hpp"
#include "trace/trace_cache.hpp"

namespace rv {

struct PlaneAtTarget {
    double radius_um = 0, waist_um = 0, waist_offset_mm = 0, rayleigh_mm = 0;
};

struct BeamAtTarget {
    bool reached = false;
    double path_mm = 0;       // geometric path from the start to the target plane
    double arrival_fs = 0;    // emission time + group delay to the target centre
    PlaneAtTarget tangential, sagittal;
    Vec2 hit_mm{0, 0};        // chief-ray crossing of the target plane
    Vec2 direction{1, 0};     // the chief ray's (the energy's) direction there
    Vec2 wave_direction{1, 0};  // the wave vector's (differs inside a crystal by the walk-off)
    // Out of the table plane (walk-off in a crystal whose optic axis is in the vertical plane):
    // the chief ray's height at the crossing and its slope there (+ up).
    double vertical_mm = 0, vertical_slope = 0;
    PulseAtTarget pulse;      // GDD, TOD and pulse length at the target centre
    double index = 1;         // phase index of the medium at the target
    GaussianBeam q_tangential{}, q_sagittal{};  // at the target plane
    // Half the chief ray's path inside the target crystal (its centre plane lies midway between
    // its parallel faces): (L/2)/cos θ_inside; 0 when the target is not a crystal.
    double half_crystal_path_mm = 0;
};

BeamAtTarget beam_at_target(const Layout& layout, const Path& path, const Caustic& caustic);
BeamAtTarget beam_at_target(const Layout& layout, const Path& path, const BeamsAtTargetPlane& beams);

// Trace every beam, propagate it without the drawing envelope, and take it at the target: the
// lean evaluation the solvers repeat (with a TraceCache kept between calls on one layout, which
// re-traces and re-propagates each beam only from the first step a change can have altered).
// keep_unchanged = false skips that comparison, for a caller that changes every optic each time
// (the Monte Carlo), where it could keep nothing.
std::vector<BeamAtTarget> evaluate_beams_at_target(const Layout& layout, const MaterialLibrary& library,
                                                   TraceCache* cache = nullptr, bool keep_unchanged = true);
// The solvers' form: only the elements listed in `edited` can differ from the layout of the
// previous call with this cache (they alone are compared; see retrace_layout).
std::vector<BeamAtTarget> evaluate_beams_at_target(const Layout& layout, const MaterialLibrary& library,
                                                   TraceCache& cache, const std::vector<size_t>& edited);

struct Mismatch {
    double waist_offset_tangential_mm = 0, waist_offset_sagittal_mm = 0;
    double waist_offset_mm = 0;  // mean of the two planes
    double waist_ratio = 1;      // mean waist of beam 2 over beam 1
    double lateral_um = 0;       // distance between the chief-ray crossings (both planes)
    double lateral_tangential_um = 0, lateral_sagittal_um = 0;  // in and out of the table plane
    double angle_mrad = 0;       // angle between the chief rays
    double delay_fs = 0;         // arrival of beam 1 minus beam 2
};

// Both beams must have reached the target.
Mismatch mismatch_at_target(const BeamAtTarget& first, const BeamAtTarget& second);

// The overlap of the two beams at the target, defined once for the report, the solvers and the
// tolerance run (docs/user-guide.md, The report, "Overlap"):
//   spatial: the transverse intensity overlap of the two Gaussians at the target plane, per
//            plane (nonlinear/overlap.hpp), the tangential one offset by the distance between the
//            chief-ray crossings across the bisector of the two chief rays, the sagittal one by
//            the difference of their heights out of the table plane;
//   spatial_along_crystal: the same averaged along the crystal from its entrance to its exit
//            (each beam propagated there in the crystal, the offset growing with the angle
//            between the chief rays in each plane — a walk-off included; the extent is the
//            mean of the two beams' paths inside), by
//            8-point Gauss–Legendre quadrature; at the target plane alone for a target that is
//            not a crystal;
//   temporal: the cross-correlation factor of the two pulses at the delay (both lengths given:
//            the lengths at the target, BeamAtTarget::pulse);
//   combined: spatial_along_crystal × temporal (or × 1).
struct OverlapFigures {
    double spatial = 0;
    double spatial_along_crystal = 0;
    std::optional<double> temporal;
    double combined = 0;
};
OverlapFigures overlap_at_target(const BeamAtTarget& first, const BeamAtTarget& second,
                                 std::optional<double> first_pulse_fwhm_fs,
                                 std::optional<double> second_pulse_fwhm_fs);

// The same with each beam's pulse length at the target (BeamAtTarget::pulse, analysis/
// pulse_at_target.hpp): the one the report, the solvers and the tolerance run use.
OverlapFigures overlap_at_target(const BeamAtTarget& first, const BeamAtTarget& second);

}  // namespace rv
