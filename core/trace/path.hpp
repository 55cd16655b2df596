#pragma once
// What a chief-ray trace returns: the straight segments a beam runs along, the element
// surfaces it meets in order, and the findings (misses, leaving the table, total internal
// reflection, …) as data. Positions in mm in the table plane; directions are unit vectors.

#include <cmath>
#include <optional>
#include <string>
#include <vector>

#include "findings/finding.hpp"
#include "layout/layout.hpp"
#include "materials/material.hpp"

namespace rv {

enum class Interaction {
    ThinLens,      // deflected by −h/f (ideal or chromatic thin lens, or a thick singlet)
    Reflect,       // mirror or dichroic reflection (flat or curved)
    Refract,       // a face of a slab (plate, crystal, dichroic substrate): Snell's law
    Retroreflect,  // returned antiparallel, mirrored across the retroreflector's axis
    TargetPlane,   // crossed a target plane or a crystal's centre plane
    Absorb,        // stopped in a dump
};

// Which surface of an element was met.
enum class Face { Only, Front, Back, Centre };

struct TraceHit {
    size_t element = 0;  // index into Layout::elements
    Interaction interaction = Interaction::TargetPlane;
    Face face = Face::Only;
    Vec2 point_mm{0, 0};
    Vec2 direction_in{1, 0}, direction_out{1, 0};  // the chief ray's (the energy's) directions
    // Arriving inside a crystal as a B wave: the energy's turn from the wave vector in the table
    // plane (RayState::walkoff_rad), so the wave vector is direction_in turned back by it; its
    // slope out of the table plane, and the chief ray's height above the table plane here.
    double walkoff_in_rad = 0;
    double vertical_slope_in = 0;
    double vertical_mm = 0;
    double s_mm = 0;          // geometric path length from the beam's start to this hit
    // Group delay from the beam's start to this hit, fs: every segment through this one at its
    // group index (length × n_g / c), plus the lumped glass of the thick singlets before it
    // (centre thickness × (n_g,glass − n_g,air) / c). Diels & Rudolph (2006) ch. 1.
    double group_delay_fs = 0;
    // The angle between the incoming ray and the surface normal, kept as its cosine and sine
    // (what the matrices need; both from the vectors, so accurate near normal incidence).
    double cos_aoi = 1, sin_aoi = 0;
    double aoi_rad() const { return std::atan2(sin_aoi, cos_aoi); }
    double height_mm = 0;     // signed distance of the hit from the element's centre line
    double half_aperture_mm = 0;
    double index_before = 1, index_after = 1;  // phase index either side (1 in air)
    // A thick singlet is met as one plane; its glass counts for timing here: the centre
    // thickness and the glass's absolute group index (0 and 1 for every other hit).
    double lumped_glass_mm = 0;
    double lumped_group_index = 1;
    // …and for the pulse its GVD and TOD less the air's it replaces (per mm, fs² and fs³).
    double lumped_gvd_fs2_per_mm = 0, lumped_tod_fs3_per_mm = 0;
    // Lenses: the focal length at the beam's wavelength (thick singlets: the EFL) and the
    // glass's index there (1 for an ideal lens), so that propagation need not recompute them.
    double focal_length_mm = 0;
    double lens_index = 1;

    // The wave vector's direction as the hit is met (direction_in unless a walk-off turned it).
    Vec2 wave_direction_in() const {
        if (walkoff_in_rad == 0) return direction_in;
        const double c = std::cos(walkoff_in_rad), s = std::sin(walkoff_in_rad);
        return {c * direction_in.x() + s * direction_in.y(), -s * direction_in.x() + c * direction_in.y()};
    }
};

struct TraceSegment {
    Vec2 from_mm{0, 0}, to_mm{0, 0};
    double length_mm = 0;
    std::optional<size_t> inside;  // the slab element the segment runs in; none = air
    double index = 1.0;            // phase index for the Gaussian beam (air: 1, docs/physics.md §0.3)
    double group_index = 1.0;      // absolute group index for timing (air: Ciddor 1996)
    double gvd_fs2_per_mm = 0, tod_fs3_per_mm = 0;  // for the pulse (RayState's Medium)
};

struct Path {
    size_t beam = 0;  // index into Layout::beams
    std::vector<TraceSegment> segments;  // segment i ends at hits[i]; one more may run to an exit
    std::vector<TraceHit> hits;
    std::vector<Finding> findings;
    std::optional<size_t> target_hit;  // index into hits where the layout's target was crossed
    // The trace stopped at the target (a solver's retrace, trace.hpp): nothing after it is here,
    // neither hits nor findings.
    bool ends_at_target = false;
};

}  // namespace rv
