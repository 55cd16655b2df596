// Mirrors (flat or curved) and retroreflectors.
#include "trace/interact.hpp"

namespace rv {

// Reflected about the local normal; a curved mirror's local normal is tilted by −h/R (h the
// signed height of the hit, R the radius of curvature). An aim_at mirror sends the ray to its
// target, which the next hit judges (RayState::expect). Met from behind: the path ends there.
HitOutcome interact(const Mirror& mirror, const HitContext& ctx, RayState& ray, TraceHit& hit) {
    const Vec2& n = ctx.crossing.normal;
    if (ray.d.dot(n) >= 0) {
        ctx.finding(Finding::Kind::HitBackOfOptic, ctx.element, hit.point_mm).element_type = type_name(ctx.layout.elements[ctx.element].kind);
        return HitOutcome::Stop;
    }
    hit.interaction = Interaction::Reflect;
    Vec2 local = n;
    if (mirror.radius_of_curvature_mm)
        local = (n - (ctx.crossing.height / *mirror.radius_of_curvature_mm) * perpendicular(n)).normalized();
    ray.d = reflect(ray.d, local);
    if (mirror.aim_at) ray.expect = ctx.placed[ctx.element].aim_target;
    return HitOutcome::GoOn;
}

// Returned antiparallel, mirrored across the retroreflector's axis (the apex plane fold): it
// leaves from the point opposite the hit.
HitOutcome interact(const Retroreflector&, const HitContext& ctx, RayState& ray, TraceHit& hit) {
    const Vec2& n = ctx.crossing.normal;
    if (ray.d.dot(n) >= 0) {
        ctx.finding(Finding::Kind::HitBackOfOptic, ctx.element, hit.point_mm).element_type = type_name(ctx.layout.elements[ctx.element].kind);
        return HitOutcome::Stop;
    }
    hit.interaction = Interaction::Retroreflect;
    ray.d = -ray.d;
    ray.p_mm = ctx.placed[ctx.element].at - ctx.crossing.height * perpendicular(n);
    return HitOutcome::GoOnFrom;
}

}  // namespace rv
