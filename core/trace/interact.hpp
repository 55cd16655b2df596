#pragma once
// What each kind of element does to a chief ray that meets one of its surfaces: one function
// per kind (interact_*.cpp), chosen by std::visit over the element's kind in the tracer's step
// (trace.cpp), so that a new kind without its function does not compile.
//
// On entry `ray` is the state at the start of the step (its position the step's start), `hit`
// holds what the tracer knows of the crossing (point, incoming direction, path length, delay,
// incidence, height, aperture, index before); the function sets hit.interaction and what is
// its own (focal length, lumped glass), turns ray.d, changes ray.medium and ray.inside, and
// says how the trace goes on.

#include <vector>

#include "layout/layout.hpp"
#include "trace/beam_samples.hpp"
#include "trace/path.hpp"
#include "trace/placed_optics.hpp"
#include "trace/ray_state.hpp"
#include "trace/step_accelerator.hpp"

namespace rv {

enum class HitOutcome {
    GoOn,      // the ray goes on from the hit point
    GoOnFrom,  // the ray goes on from ray.p_mm, set by the element (a retroreflector's mirrored point)
    Stop,      // the path ends at this hit (absorbed, the back of a mirror, total internal reflection)
    Refused,   // the hit cannot be computed (no real index): taken back, and the path ends
};

// A finding on `path` about element `element` of `layout` (SIZE_MAX: none), at `where`; the
// caller fills in the kind's numbers.
Finding& add_finding(Path& path, const Layout& layout, Finding::Kind kind, size_t element, const Vec2& where,
                     double amount = 0);

// What an element's interaction may read and the findings it may make.
struct HitContext {
    const Layout& layout;
    const std::vector<PlacedOptic>& placed;
    const BeamSource& beam;
    Polarization wave;  // the polarization that picks its wave in a birefringent crystal
    const Material& air;
    const Medium& air_medium;  // the medium outside every slab, at the beam's wavelength
    BeamSamples& samples;
    Path& path;
    std::vector<size_t>& noted;  // elements whose out-of-range material was reported
    size_t element = 0;          // the element met
    const SurfaceCrossing& crossing;

    // A finding about `element` (SIZE_MAX: none); the caller fills in the kind's numbers.
    Finding& finding(Finding::Kind kind, size_t element, const Vec2& where, double amount = 0) const {
        return add_finding(path, layout, kind, element, where, amount);
    }
    // A finding (once per element) when the beam's wavelength lies outside the material's range.
    void note_material(const Material& m) const {
        if (!covers(m, beam.wavelength_nm)) note_out_of_range(m);
    }
    void note_out_of_range(const Material& m) const;
    // The finding for a material with no real index at the beam's wavelength (on a pole).
    void no_real_index(const Vec2& where) const;
};

HitOutcome interact(const Lens& lens, const HitContext& ctx, RayState& ray, TraceHit& hit);
HitOutcome interact(const Mirror& mirror, const HitContext& ctx, RayState& ray, TraceHit& hit);
HitOutcome interact(const Retroreflector& retro, const HitContext& ctx, RayState& ray, TraceHit& hit);
HitOutcome interact(const Dichroic& dichroic, const HitContext& ctx, RayState& ray, TraceHit& hit);
HitOutcome interact(const Plate& plate, const HitContext& ctx, RayState& ray, TraceHit& hit);
HitOutcome interact(const Crystal& crystal, const HitContext& ctx, RayState& ray, TraceHit& hit);
HitOutcome interact(const Target& target, const HitContext& ctx, RayState& ray, TraceHit& hit);
HitOutcome interact(const Dump& dump, const HitContext& ctx, RayState& ray, TraceHit& hit);
HitOutcome interact(const Stage& stage, const HitContext& ctx, RayState& ray, TraceHit& hit);

// Shared by the slabs: a face of a plate, a crystal or a dichroic substrate refracts by Snell's
// law (an extraordinary wave's index following its direction inside), or a crystal's centre
// plane is crossed.
HitOutcome refract_at_slab_face(const HitContext& ctx, RayState& ray, TraceHit& hit);

// Snell's law in vector form; nullopt on total internal reflection.
std::optional<Vec2> refract(const Vec2& d, const Vec2& surface_normal, double n1, double n2);
inline Vec2 reflect(const Vec2& d, const Vec2& n) { return d - 2.0 * d.dot(n) * n; }

}  // namespace rv
