#pragma once
// The 2-D chief-ray trace: each beam from its start through whatever element plane it meets
// first within that element's aperture, in any order, until it is absorbed, leaves the table
// or something stops it. A pure function of the layout.
//
// Model (table plane, mm; see layout/layout.hpp for the geometry of each element):
// * Thin lenses and thick singlets deflect the ray paraxially by −h/f at their plane, h the
//   signed height of the crossing from the lens axis, f the focal length at the beam's
//   wavelength (a thick singlet's EFL).
// * Mirrors reflect about the local normal; a curved mirror's local normal is tilted by −h/R.
//   Dichroics reflect one side of their edge at the coated face; the other colour is refracted
//   through the substrate (Snell's law at both faces), which gives its lateral shift and glass
//   path. Plates and crystals are slabs refracted at both faces; in a uniaxial crystal the
//   extraordinary index follows the ray's angle to the optic axis.
// * A retroreflector returns the ray antiparallel, mirrored across its axis (apex plane fold).
// * Elements carried by a stage are moved by its position along its axis.
// * A mirror with aim_at is oriented when the first beam (in file order) reaches it, so that
//   a ray arriving at its centre would be sent to the aimed-at element's centre.
// Refractive indices of glasses are the catalogue values relative to air (air is n = 1 for
// geometry, docs/physics.md §0.3); group indices are absolute (air by Ciddor 1996).
//
// How it is built: the ray's state is one value (ray_state.hpp); one step finds the next
// surface through the step accelerator (step_accelerator.hpp) and lets the element act on the
// ray through interact() (interact.hpp; one function per kind in interact_*.cpp, chosen by
// std::visit); placing the elements is placed_optics.hpp; what a retrace keeps between calls is
// retrace_memo.hpp; trace_cache.hpp holds them together.

#include <vector>

#include "layout/layout.hpp"
#include "materials/material_library.hpp"
#include "trace/path.hpp"
#include "trace/trace_cache.hpp"

namespace rv {

inline constexpr size_t kMaxHitsPerBeam = 64;

// One path per beam, in the layout's order. A cache (trace_cache.hpp) kept by the caller
// between traces of one layout makes later traces faster and gives the same paths.
std::vector<Path> trace_layout(const Layout& layout, const MaterialLibrary& library,
                               TraceCache* cache = nullptr);

// The same into `paths` (resized to one per beam), reusing the storage they already hold: the
// solvers' loop, which then allocates nothing.
void trace_layout(const Layout& layout, const MaterialLibrary& library, TraceCache& cache,
                  std::vector<Path>& paths);

// The same into the cache's own paths, keeping from the previous retrace with this cache each
// path's leading steps that no element changed since then comes near (an element compared
// whole, and where a stage puts it): a solver that moves one arm's lenses re-traces only that
// arm from its first moved lens on. cache.beams[b].kept_hits says how many hits were kept.
// Any other trace with the cache in between, or a changed table, target or beam source, makes
// it start from the sources. The paths equal a fresh trace's (a test compares them).
struct RetraceOptions {
    // A caller that knows which elements it may have changed since the previous retrace with
    // this cache (a solver moving a fixed set of optics) lists them, and only those are
    // compared; every other element must be as it was then (the table, target and beams are
    // compared still). Null: every element is compared.
    const std::vector<size_t>* edited = nullptr;
    // End a path where it crosses the target (Path::ends_at_target), for a caller that needs
    // only what happens up to there; trace_past_target completes it. A beam goes on when its
    // further steps could turn an aim_at mirror a later beam meets, so that no beam's path
    // depends on where another stopped.
    bool stop_at_target = false;
};
const std::vector<Path>& retrace_layout(const Layout& layout, const MaterialLibrary& library, TraceCache& cache,
                                       const RetraceOptions& options = {});

// The rest of a path of the last retrace that ended at the target (cache.paths[beam]), traced
// on from there as a full retrace would have traced it; a complete path is returned as it is.
// The layout must be the one of that retrace.
const Path& trace_past_target(const Layout& layout, TraceCache& cache, size_t beam);

}  // namespace rv
