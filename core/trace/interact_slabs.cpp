// Slabs: plates, crystals and dichroic substrates, refracted at both faces by Snell's law; an
// extraordinary wave's energy walks off inside a crystal (its wave vector refracts).
#include <cmath>

#include "materials/dispersion.hpp"
#include "nonlinear/phase_matching.hpp"
#include "nonlinear/wave_dispersion.hpp"
#include "trace/crystal_axes.hpp"
#include "trace/interact.hpp"

namespace rv {

namespace {

const Crystal* birefringent(const HitContext& ctx) {
    const auto* c = std::get_if<Crystal>(&ctx.layout.elements[ctx.element].kind);
    return c && ctx.placed[ctx.element].material->symmetry != Symmetry::Isotropic ? c : nullptr;
}

bool a_wave(const HitContext& ctx, const Crystal& c) { return a_wave_fraction(ctx.wave, c.optic_axis_horizontal) >= 0.5; }

// Phase and group index, GVD and TOD of the beam inside the slab for a ray running along `dir`
// there, refracted at the face with index `refracted_with` (1: the outside direction, the first
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
        const Polarity polarity = a ? Polarity::A : Polarity::B;
        const double psi = a ? 0.0 : angle_to_reference_axis_rad(crystal_pose(pl.normal, *c), dir, refracted_with);
        const WaveIndex w = wave_index(x, polarity, psi);
        const IndexSample d = wave_sample(x, polarity, psi);
        return Medium{w.index, w.group_index, d.gvd_fs2_per_mm, d.tod_fs3_per_mm};
    }
    return ctx.samples.slab[ctx.element].get(&m, 0, [&] {
        const IndexSample g = absolute_index(m, ctx.air, nm, Axis::X);
        return Medium{sample_index(m, nm, Axis::X).index, g.group_index, g.gvd_fs2_per_mm, g.tod_fs3_per_mm};
    });
}

// The walk-off of the B wave whose wave vector runs along `k` inside the crystal with `index`
// (none for the A wave and other slabs).
WalkoffTurn walkoff_inside(const HitContext& ctx, const Vec2& k, double index) {
    const Crystal* c = birefringent(ctx);
    if (!c || a_wave(ctx, *c)) return {};
    const PlacedOptic& pl = ctx.placed[ctx.element];
    const CrystalPose pose = crystal_pose(pl.normal, *c);
    const CrystalIndices& x = ctx.samples.crystal[ctx.element].get(
        pl.material, static_cast<int>(c->principal_plane),
        [&] { return crystal_indices(*pl.material, ctx.beam.wavelength_nm, c->principal_plane); });
    const double rho = walkoff_rad(x, Polarity::B, angle_to_reference_axis_rad(pose, k, index));
    return walkoff_turn(pose, k, index, rho);
}

Vec2 turned(const Vec2& d, double angle_rad) {
    const double c = std::cos(angle_rad), s = std::sin(angle_rad);
    return {c * d.x() - s * d.y(), s * d.x() + c * d.y()};
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
    Medium next = ctx.air_medium;
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
        // The wave vector refracts by Snell's law, not the energy's direction: a walked-off ray
        // turns back to its wave vector, whose incidence the face's matrices take too.
        const Vec2 k = hit.wave_direction_in();
        if (ray.walkoff_rad != 0) {
            hit.cos_aoi = std::min(1.0, std::abs(k.dot(n)));
            hit.sin_aoi = std::min(1.0, std::abs(k.x() * n.y() - k.y() * n.x()));
        }
        out = refract(k, n, ray.medium.index, 1.0);
    }
    if (!out) {
        ctx.finding(Finding::Kind::TotalInternalReflection, ctx.element, hit.point_mm);
        return HitOutcome::Stop;
    }
    ray.d = *out;
    ray.medium = next;
    ray.walkoff_rad = 0;
    ray.vertical_slope = 0;
    if (entering) {
        ray.inside = ctx.element;
        ctx.note_material(*ctx.placed[ctx.element].material);
        // An extraordinary wave's energy walks off its wave vector (nonlinear/wave_dispersion.hpp):
        // drawn turned in the table plane, carried as a slope out of it.
        const WalkoffTurn w = walkoff_inside(ctx, *out, next.index);
        if (w.table_rad != 0) {
            const double along_k = std::cos(w.table_rad);  // RayState's Medium: per mm of the ray
            ray.d = turned(*out, w.table_rad);
            ray.walkoff_rad = w.table_rad;
            ray.medium.group_index *= along_k;
            ray.medium.gvd_fs2_per_mm *= along_k;
            ray.medium.tod_fs3_per_mm *= along_k;
        }
        ray.vertical_slope = w.vertical_slope;
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
