#include "analysis/crystal_waves.hpp"

#include "analysis/power_budget.hpp"
#include "polarization/polarization_model.hpp"
#include "trace/crystal_axes.hpp"
#include "trace/propagate.hpp"
#include "trace/trace.hpp"

namespace rv {

std::vector<std::optional<Polarization>> arriving_crystal_polarizations(const Layout& layout,
                                                                        const MaterialLibrary& library,
                                                                        const std::vector<Path>& paths) {
    std::vector<std::optional<Polarization>> out(layout.beams.size());
    const Element* target = layout.find(layout.target);
    const Crystal* crystal = target ? std::get_if<Crystal>(&target->kind) : nullptr;
    const Material* m = crystal ? library.find(crystal->material) : nullptr;
    if (!m || m->symmetry == Symmetry::Isotropic) return out;
    PropagationOptions lean;
    lean.sample_envelope = false;
    for (const Path& p : paths) {
        if (!p.target_hit || p.beam >= out.size()) continue;
        const PolarizationState s = describe(target_stokes(layout, library, p, propagate_path(layout, p, lean)));
        if (!(s.power > 0)) continue;
        const bool a_source = a_wave_fraction(layout.beams[p.beam].polarization, crystal->optic_axis_horizontal) >= 0.5;
        const bool a_arriving = (crystal->optic_axis_horizontal ? s.v : s.h) / s.power >= 0.5;
        if (a_source == a_arriving) continue;
        // A polarization that gives the arriving wave: the A wave is vertical when the optic
        // axis lies in the table plane, horizontal otherwise.
        const bool horizontal = a_arriving != crystal->optic_axis_horizontal;
        out[p.beam] = Polarization{horizontal ? Polarization::Kind::Horizontal : Polarization::Kind::Vertical, 0};
    }
    return out;
}

std::vector<Path> trace_arriving_waves(const Layout& layout, const MaterialLibrary& library) {
    std::vector<Path> paths = trace_layout(layout, library);
    TraceCache cache;
    cache.crystal_polarization = arriving_crystal_polarizations(layout, library, paths);
    for (const std::optional<Polarization>& p : cache.crystal_polarization)
        if (p) return trace_layout(layout, library, &cache);
    return paths;
}

void prepare_crystal_waves(TraceCache& cache, const Layout& layout, const MaterialLibrary& library) {
    if (cache.crystal_polarization_known) return;
    cache.crystal_polarization = arriving_crystal_polarizations(layout, library, trace_layout(layout, library));
    cache.crystal_polarization_known = true;
    cache.retrace.forget();  // traced before with other waves, perhaps
}

}  // namespace rv
