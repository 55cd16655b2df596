// Slabs: plates, crystals and dichroic substrates, refracted at both faces by Snell's law.
#include <cmath>

#include "materials/dispersion.hpp"
#include "nonlinear/phase_matching.hpp"
#include "trace/crystal_axes.hpp"
#include "trace/interact.hpp"

namespace rv {

namespace {

const Crystal* birefringent(const HitContext& ctx) {
    const auto* c = std::get_if<Crystal>(&ctx.layout.elements[ctx.element].kind);
    return c && ctx.placed[ctx.element].material->symmetry != Symmetry::Isotropic ? c : nullptr;
}

bool a_wave(const HitContext& ctx, const Crystal& c) { return a_wave_fraction(ctx.wave, c.optic_axis_horizontal) >= 0.5; }

// Phase and group index of the beam inside the slab for a ray running along `dir` there,
// refracted at the face with index `refracted_with` (1: the outside direction, the first
// guess). Birefringent: the A (ordinary) wave when most of the beam's power is in it, else the
// B wave at its angle ψ to the reference axis (trace/crystal_axes.hpp).
Medium slab_medium(const HitContext& ctx, const Vec2& dir, double refracted_with) {
    const PlacedOptic& pl = ctx.placed[ctx.element];
    const Material& m = *pl.material;
    const double nm = ctx.beam.wavelength_nm;
    if (const Crystal* c = birefringent(ctx)) {
        const CrystalIndices& x = ctx.samples.crystal[ctx.element].get(
            &m, static_cast<int>(c->principal_plane), [&] { return crystal_indices(m, nm, c->principal_plane); });
        const bool a = a_wave(ctx, *c);
        const double psi = a ? 0.0 : angle_to_reference_axis_rad(crystal_pose(pl.normal, *c), dir, refracted_with);
        const WaveIndex w = wave_index(x, a ? Polarity::A : Polarity::B, psi);
        return Medium{w.index, w.group_index};
    }
    return ctx.samples.slab[ctx.element].get(&m, 0, [&] {
        return Medium{sample_index(m, nm, Axis::X).index, absolute_index(m, ctx.air, nm, Axis::X).group_index};
    });
}

// Whether the beam's index in the slab depends on its direction there: the B wave of a
// birefringent crystal (slab_medium's choice); the A wave's index does not.
bool index_follows_direction(const HitContext& ctx) {
    const Crystal* c = birefringent(ctx);
    return c && !a_wave(ctx, *c);
}

}  // namespace

HitOutcome refract_at_slab_face(const HitContext& ctx, RayState& ray, TraceHit& hit) {
    hit.interaction = Interaction::Refract;
    const Vec2& n = ctx.crossing.normal;
    const bool entering = !ray.inside.has_value();
    Medium next{1.0, ctx.air_group_index};
    std::optional<Vec2> out;
    if (entering) {
        // Guess the medium from the straight-on index, refine the direction for an index that
        // depends on it (extraordinary wave): a few fixed-point steps.
        next = slab_medium(ctx, ray.d, 1.0);
        if (!(std::isfinite(next.index) && next.index > 0)) {
            ctx.no_real_index(hit.point_mm);
            return HitOutcome::Refused;
        }
        const int refinements = index_follows_direction(ctx) ? 4 : 0;
        for (int it = 0; it < refinements; ++it) {
            out = refract(ray.d, n, 1.0, next.index);
            if (!out) break;
            next = slab_medium(ctx, *out, next.index);
        }
        out = refract(ray.d, n, 1.0, next.index);
    } else {
        out = refract(ray.d, n, ray.medium.index, 1.0);
    }
    if (!out) {
        ctx.finding(Finding::Kind::TotalInternalReflection, ctx.element, hit.point_mm);
        return HitOutcome::Stop;
    }
    ray.d = *out;
    ray.medium = next;
    if (entering) {
        ray.inside = ctx.element;
        ctx.note_material(*ctx.placed[ctx.element].material);
    } else {
        ray.inside.reset();
    }
    return HitOutcome::GoOn;
}

HitOutcome interact(const Plate&, const HitContext& ctx, RayState& ray, TraceHit& hit) {
    return refract_at_slab_face(ctx, ray, hit);
}

// A crystal's centre plane is crossed (the target plane of a crystal target); its faces refract.
HitOutcome interact(const Crystal&, const HitContext& ctx, RayState& ray, TraceHit& hit) {
    if (ctx.crossing.face == Face::Centre) {
        hit.interaction = Interaction::TargetPlane;
        return HitOutcome::GoOn;
    }
    return refract_at_slab_face(ctx, ray, hit);
}

// The coated (front) face reflects the colours on one side of the edge, from outside or from
// inside the substrate; the other colour is refracted through the substrate, whose faces give
// its lateral shift and glass path.
HitOutcome interact(const Dichroic& dichroic, const HitContext& ctx, RayState& ray, TraceHit& hit) {
    const double nm = ctx.beam.wavelength_nm;
    const bool reflects_here = ctx.crossing.face == Face::Front &&
                               (dichroic.reflects_shorter ? nm < dichroic.edge_nm : nm > dichroic.edge_nm);
    const bool coming_from_front = ray.d.dot(ctx.crossing.normal) < 0;
    if (reflects_here && (ray.inside.has_value() != coming_from_front)) {
        hit.interaction = Interaction::Reflect;
        ray.d = reflect(ray.d, ctx.crossing.normal);
        return HitOutcome::GoOn;
    }
    return refract_at_slab_face(ctx, ray, hit);
}

}  // namespace rv
