#pragma once
// Which wave (o or e) each beam travels as in the birefringent crystals of its path. The trace
// picks it from a polarization; the light that arrives at the target crystal is what decides,
// and wave plates or cubes on the way can turn a beam's source polarization into the other
// wave. Every evaluation (the report, check, the solvers, the tolerance run, the viewer) takes
// the wave from here, so they all judge the same light.

#include <optional>
#include <vector>

#include "layout/layout.hpp"
#include "materials/material_library.hpp"
#include "trace/path.hpp"
#include "trace/trace_cache.hpp"

namespace rv {

// For each beam (index into layout.beams), the polarization to trace it with in the crystals
// when the light arriving at the target crystal is mostly the other wave than its source's;
// none when the source's polarization already gives that wave, the beam does not reach the
// target, or the target is not a birefringent crystal. `paths`: the layout traced with the
// sources' polarizations.
std::vector<std::optional<Polarization>> arriving_crystal_polarizations(const Layout& layout,
                                                                        const MaterialLibrary& library,
                                                                        const std::vector<Path>& paths);

// The layout's paths with every beam in the wave that arrives at the target crystal (one
// trace, two where a beam's wave differs from its source's).
std::vector<Path> trace_arriving_waves(const Layout& layout, const MaterialLibrary& library);

// Fills the cache's crystal_polarization for `layout` unless it is known already: the solvers
// call it once with the layout they start from (their moves of lenses and mirrors do not change
// the polarization; DEVELOPERS.md, "One evaluation").
void prepare_crystal_waves(TraceCache& cache, const Layout& layout, const MaterialLibrary& library);

}  // namespace rv
