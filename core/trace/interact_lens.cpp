// A lens: thin (ideal or chromatic) or a thick singlet met as one plane at its centre.
#include <array>
#include <cmath>
#include <variant>

#include "layout/visit.hpp"
#include "materials/dispersion.hpp"
#include "optics/thick_lens.hpp"
#include "trace/interact.hpp"

namespace rv {

namespace {
struct FocalLength {
    double f_mm = 0;
    double glass_index = 1, glass_group_index = 1;  // 1 for an ideal lens
    double glass_gvd_fs2_per_mm = 0, glass_tod_fs3_per_mm = 0;  // thick singlets only
};

// The focal length at the beam's wavelength, from the glass samples kept for this lens.
FocalLength focal_length(const Lens& lens, const HitContext& ctx) {
    const Material* glass = ctx.placed[ctx.element].material;
    const double nm = ctx.beam.wavelength_nm;
    TaggedSample<LensGlass>& slot = ctx.samples.lens[ctx.element];
    return std::visit(
        overloaded{[](const IdealLens& ideal) { return FocalLength{ideal.focal_length_mm}; },
                   [&](const ThinChromaticLens& thin) {
                       // f(λ) = f_design (n_design − 1)/(n(λ) − 1), docs/physics.md §2.
                       if (slot.value && slot.value->design_wavelength_nm != thin.design_wavelength_nm) slot.value.reset();
                       const LensGlass& g = slot.get(glass, 1, [&] {
                           return LensGlass{thin.design_wavelength_nm, sample_index(*glass, nm).index,
                                            sample_index(*glass, thin.design_wavelength_nm).index, 1};
                       });
                       return FocalLength{chromatic_focal_length_mm(thin.focal_length_mm, g.design_index, g.index),
                                          g.index, 1};
                   },
                   [&](const ThickLens& t) {
                       LensGlass& g = slot.get(glass, 2, [&] {
                           const IndexSample a = absolute_index(*glass, ctx.air, nm);
                           LensGlass made{0, sample_index(*glass, nm).index, 1, a.group_index};
                           made.gvd_fs2_per_mm = a.gvd_fs2_per_mm;
                           made.tod_fs3_per_mm = a.tod_fs3_per_mm;
                           return made;
                       });
                       const std::array<double, 3> shape{t.front_radius_mm, t.back_radius_mm, t.center_thickness_mm};
                       if (g.efl_shape != shape) {  // the EFL at this glass index, kept for this shape
                           g.efl_shape = shape;
                           g.efl_mm = thick_lens_properties({shape[0], shape[1], shape[2]}, g.index).effective_focal_length_mm;
                       }
                       return FocalLength{g.efl_mm, g.index, g.group_index, g.gvd_fs2_per_mm, g.tod_fs3_per_mm};
                   }},
        lens.model);
}
}  // namespace

// Deflected paraxially by −h/f at the lens plane (h the signed height of the crossing from the
// lens axis): the slope across the axis changes by −h/f, the ray keeps its side of the plane.
HitOutcome interact(const Lens& lens, const HitContext& ctx, RayState& ray, TraceHit& hit) {
    hit.interaction = Interaction::ThinLens;
    const FocalLength f = focal_length(lens, ctx);
    if (!(std::isfinite(f.f_mm) && f.f_mm != 0)) {
        ctx.no_real_index(hit.point_mm);
        return HitOutcome::Refused;
    }
    hit.focal_length_mm = f.f_mm;
    hit.lens_index = f.glass_index;
    const Vec2& n = ctx.crossing.normal;
    const Vec2 t = perpendicular(n);
    const double along = ray.d.dot(n);
    const double slope = ray.d.dot(t) / std::abs(along) - ctx.crossing.height / f.f_mm;
    ray.d = (std::copysign(1.0, along) * n + slope * t).normalized();
    std::visit(overloaded{[](const IdealLens&) {}, [&](const ThinChromaticLens&) { ctx.note_material(*ctx.placed[ctx.element].material); },
                          [&](const ThickLens& thick) {
                              ctx.note_material(*ctx.placed[ctx.element].material);
                              // Its glass counts for timing at this plane (TraceHit::lumped_glass_mm).
                              hit.lumped_glass_mm = thick.center_thickness_mm;
                              hit.lumped_group_index = f.glass_group_index;
                              hit.lumped_gvd_fs2_per_mm = f.glass_gvd_fs2_per_mm - ctx.air_medium.gvd_fs2_per_mm;
                              hit.lumped_tod_fs3_per_mm = f.glass_tod_fs3_per_mm - ctx.air_medium.tod_fs3_per_mm;
                          }},
               lens.model);
    return HitOutcome::GoOn;
}

}  // namespace rv
