// Elements the ray crosses or ends at without turning: targets, dumps; and stages, which carry
// optics but have no surface of their own.
#include "trace/interact.hpp"

namespace rv {

HitOutcome interact(const Target&, const HitContext&, RayState&, TraceHit& hit) {
    hit.interaction = Interaction::TargetPlane;
    return HitOutcome::GoOn;
}

HitOutcome interact(const Dump&, const HitContext&, RayState&, TraceHit& hit) {
    hit.interaction = Interaction::Absorb;
    return HitOutcome::Stop;
}

// Never met: placing gives a stage no surface (placed_optics.cpp). Were one met, the ray would
// pass as through a target plane.
HitOutcome interact(const Stage&, const HitContext&, RayState&, TraceHit& hit) {
    hit.interaction = Interaction::TargetPlane;
    return HitOutcome::GoOn;
}

}  // namespace rv
