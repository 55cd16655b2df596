#pragma once
// What one trace of a layout keeps so that the next trace of the same layout is fast: the
// solvers and the tolerance analysis trace one layout thousands of times with optics moved,
// turned or given other focal lengths. Every part keeps its own state behind a small interface:
// * placement (placed_optics.hpp): where each element sits once stages have moved it, with
//   the names and trigonometry resolved once;
// * per beam, material samples at its wavelength (beam_samples.hpp), the search accelerator
//   with the last recorded steps and their candidates (step_accelerator.hpp), this trace's
//   steps;
// * the retrace memo (retrace_memo.hpp): what a retrace compares with and keeps.
// The paths of the last retrace are kept here too, with the working storage of a trace, so that
// a repeated trace allocates nothing.
//
// A cache belongs to one layout's list of elements and beams and to one material library: the
// tracer checks the element kinds, the beams' wavelengths and the library on every use and
// starts afresh when they differ. It holds a share of the library's storage, so the material
// pointers it keeps stay valid however long it outlives the library it was used with.

#include <cstdint>
#include <memory>
#include <optional>
#include <vector>

#include "layout/layout.hpp"
#include "trace/beam_samples.hpp"
#include "trace/path.hpp"
#include "trace/placed_optics.hpp"
#include "trace/propagate.hpp"
#include "trace/retrace_memo.hpp"
#include "trace/step_accelerator.hpp"

namespace rv {

struct TraceCache {
    struct Beam {
        double wavelength_nm = 0;
        Medium air_medium;  // index 1 (docs/physics.md §0.3), Ciddor's group index, GVD, TOD
        BeamSamples samples;
        StepAccelerator accelerator;
        std::vector<StepTaken> taken;  // this trace's steps (a retrace tests them for changes)
        std::vector<size_t> noted;     // elements whose out-of-range material was reported
    };

    // The polarization each beam has in birefringent crystals, which picks its wave there (o or
    // e), by beam; none (or a shorter list): the source's. Wave plates and cubes before a
    // crystal can turn one into the other: analysis/crystal_waves.hpp fills this in from the
    // polarization that arrives, so that every evaluation traces the wave the crystal sees.
    std::vector<std::optional<Polarization>> crystal_polarization;
    bool crystal_polarization_known = false;  // filled in for this layout (evaluate_beams_at_target)

    std::vector<Path> paths;                    // retrace_layout's paths
    TargetPropagationMemo scratch_propagation;  // storage for an evaluation without the retrace
    RetraceMemo retrace;
    TraceCounters counters;  // how the traces went (for tests and benchmarks)

    // How many leading hits the last retrace kept of beam b's previous path.
    size_t kept_hits(size_t b) const { return retrace.kept_hits(b); }

    // --- the tracer's (trace.cpp) ---
    std::shared_ptr<const void> library;  // the storage of the library the pointers point into
    const Material* air = nullptr;
    std::vector<size_t> element_kinds;  // the variant index of each element
    std::optional<std::pair<std::string, size_t>> target;  // the layout's target element
    PlacementMemo placement;
    std::vector<PlacedOptic> placed;
    std::vector<Beam> beams;
};

}  // namespace rv
