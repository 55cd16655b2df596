#pragma once
// What one trace of a layout keeps so that the next trace of the same layout is fast: the
// solvers and the tolerance analysis trace one layout thousands of times with optics moved,
// turned or given other focal lengths.
//
// Two things are kept per beam:
// * Material samples at the beam's wavelength (slab index and absolute group index, a
//   crystal's principal indices, a lens glass at the beam's and the design wavelength), each
//   tagged with the material it came from, so a changed glass is sampled again.
// * The last trace's steps, each with the elements whose bounding circle comes within
//   kTraceMargin_mm of it (the candidates). A later trace searches only a step's candidates
//   when the new step lies within the margin of the recorded one, after allowing for how far
//   any element has moved since the recording (δ): with ε the larger distance between the new
//   and the recorded step's end points, every point of the new step lies within ε of the
//   recorded step, so an element that is not a candidate keeps at least
//   kTraceMargin_mm − ε − δ > 0 clear of it and cannot be met first (δ also counts how much any
//   bounding circle has grown: a larger aperture or a thicker slab). The result is the same
//   as a full search (a test compares them); when the condition fails the step is searched
//   among all elements and the steps are recorded again.
// A cache belongs to one layout's list of elements and beams; trace_layout checks the element
// kinds and the beams' wavelengths on every use and starts afresh when they differ.
// It also keeps the working storage of a trace (the placed elements, the new steps, the paths
// of evaluate_beams_at_target) so that a repeated trace allocates nothing, and what a retrace
// (trace.hpp, retrace_layout) compares with: the elements as last seen, each beam's step starts.

#include <array>
#include <cstdint>
#include <limits>
#include <optional>
#include <string>
#include <vector>

#include "layout/layout.hpp"
#include "materials/material.hpp"
#include "nonlinear/phase_matching.hpp"
#include "trace/path.hpp"
#include "trace/propagate.hpp"

namespace rv {

inline constexpr double kTraceMargin_mm = 5.0;

struct TraceCache {
    // A surface of an element: a segment through `centre` perpendicular to `normal`.
    struct Surface {
        Face face = Face::Only;
        Vec2 centre{0, 0};
        Vec2 normal{1, 0};
    };
    // Where an element sits once stages have moved it, how it is turned, its surfaces there and
    // its material (set anew on every trace, in a retrace only for the changed elements and the
    // aim_at mirrors; the tracer turns an aim_at mirror when a beam first reaches it).
    struct Placed {
        Vec2 at{0, 0};
        Vec2 normal{1, 0};
        double half_aperture = 0;
        bool traced = true;        // false for stages (no surface)
        bool aim_pending = false;  // an aim_at mirror not reached yet
        std::optional<size_t> aim_target;
        Surface surfaces[3];
        int surface_count = 0;
        double reach = 0;  // radius of a circle about `at` that holds every surface segment
        const Material* material = nullptr;  // slab, substrate or lens glass
    };
    struct Medium {
        double index = 1, group_index = 1;
    };
    struct LensGlass {
        double design_wavelength_nm = 0;
        double index = 1, design_index = 1, group_index = 1;  // absolute group index
        // A thick singlet's effective focal length at `index`, and the radii and centre
        // thickness it was computed for (NaN: none yet).
        std::array<double, 3> efl_shape{std::numeric_limits<double>::quiet_NaN(), 0, 0};
        double efl_mm = 0;
    };
    template <class T>
    struct Tagged {  // a sample and what it was taken of: the material, and for lenses the
                     // model kind, for crystals the principal plane (`variant`)
        const Material* material = nullptr;
        int variant = 0;
        std::optional<T> value;
    };
    struct Step {
        Vec2 from_mm{0, 0}, to_mm{0, 0};
        std::vector<uint32_t> candidates;  // the element met first (if any) comes first
    };
    struct StepTaken {
        Vec2 from_mm{0, 0}, to_mm{0, 0};
        std::optional<uint32_t> met;  // the element met at its end (none: the table edge)
    };
    // The tracer's state at the start of one step of the previous retrace (see retrace_layout).
    struct StepStart {
        Vec2 p_mm{0, 0}, d{1, 0};
        double s_mm = 0;
        Medium medium{};
        std::optional<size_t> inside;
        std::optional<std::pair<size_t, Face>> last_surface;
        std::optional<size_t> expect;
        size_t findings = 0, noted = 0;
        std::optional<std::pair<size_t, Vec2>> aimed;  // an aim_at mirror this step's hit turned
    };
    struct Beam {
        double wavelength_nm = 0;
        double air_group_index = 1;
        std::vector<Tagged<Medium>> slab;              // isotropic slabs, dichroic substrates
        std::vector<Tagged<CrystalIndices>> crystal;   // birefringent crystals
        std::vector<Tagged<LensGlass>> lens;           // chromatic and thick lenses
        std::vector<Step> steps;                       // the recorded trace
        std::vector<StepTaken> new_steps;              // this trace's steps
        std::vector<Vec2> placed_at_mm;                // element positions when it was recorded
        std::vector<double> placed_reach_mm;           // and their bounding-circle radii
        // The largest move (squared) and bounding-circle growth of any element since the
        // recording, as last computed (moved_known: computed since the recording at all).
        double moved2_mm2 = 0, grown_mm = 0;
        bool moved_known = false;
        // retrace_layout: the previous retrace's step starts, its source, the aim_at mirrors'
        // state when it began, and how many of its hits the current path kept.
        std::vector<StepStart> starts;
        std::vector<size_t> noted;  // elements whose out-of-range index was reported
        std::optional<BeamSource> source;
        Polarization wave_polarization;  // the crystal_polarization it was traced with
        std::vector<std::pair<bool, Vec2>> aims;
        size_t kept_hits = 0;
        size_t reference_keep = 0;  // the steps kept when the reference circles were tested
        TargetPropagationMemo propagation;
        uint64_t propagated_at = 0;  // the retrace whose path `propagation` followed
    };
    // Names resolved once per element (checked against the layout's names on every use):
    // the elements a stage carries, an aim_at mirror's target, the material by its name.
    // Also the unit normal of the last normal_deg seen, and the bounding radius of the last
    // aperture and thickness seen (so that an unchanged element costs no trigonometry).
    struct Resolved {
        std::vector<std::pair<std::string, size_t>> carried;
        std::optional<std::pair<std::string, size_t>> aim_target;
        std::string material_name;
        const Material* material = nullptr;
        double normal_deg = std::numeric_limits<double>::quiet_NaN();
        Vec2 normal{1, 0};
        double reach_half_aperture_mm = -1, reach_thickness_mm = -1, reach_mm = 0;
    };
    std::vector<size_t> element_kinds;  // the variant index of each element
    std::vector<Resolved> resolved;
    const void* library = nullptr;  // the material library the pointers point into
    const Material* air = nullptr;
    std::optional<std::pair<std::string, size_t>> target;  // the layout's target element
    std::vector<Beam> beams;
    // The polarization each beam has in birefringent crystals, which picks its wave there (o or
    // e), by beam; none (or a shorter list): the source's. Wave plates and cubes before a
    // crystal can turn one into the other: analysis/crystal_waves.hpp fills this in from the
    // polarization that arrives, so that every evaluation traces the wave the crystal sees.
    std::vector<std::optional<Polarization>> crystal_polarization;
    bool crystal_polarization_known = false;  // filled in for this layout (evaluate_beams_at_target)
    std::vector<Placed> placed;
    std::vector<Path> paths;  // retrace_layout's paths
    TargetPropagationMemo scratch_propagation;  // storage for an evaluation without the retrace
    // retrace_layout: the elements as they were at the previous retrace (and where they were
    // placed), which of them changed since, and whether that retrace is the last trace made.
    bool retrace_valid = false;
    uint64_t retraces = 0;  // how many retraces this cache has made
    std::vector<Element> seen_elements;
    std::vector<Vec2> seen_at_mm;
    std::vector<double> seen_reach_mm;
    Table seen_table;
    std::string seen_target;
    std::vector<uint8_t> changed_flag;  // per element, this retrace
    bool links_changed = false;  // among them a stage, an element's id or a mirror's aim_at
    std::vector<size_t> aim_mirrors;  // the mirrors with a resolved aim_at
    std::vector<size_t> changed;        // their indices
    struct Circle {
        Vec2 centre_mm{0, 0};
        double radius_mm = 0;
    };
    std::vector<Circle> change_circles;  // the bounding circles of those, now and before
    // Steps are tested against the circles widened by this much; while a retrace's circles lie
    // inside the reference circles so widened, the steps kept when those were tested
    // (Beam::reference_keep) stay clear of them and are kept without a test.
    static constexpr double kChangeSlack_mm = 1.0;
    std::optional<std::vector<Circle>> reference_circles;
    bool circles_within_reference = false;
    std::vector<Vec2> stage_offset_mm, stage_offset_before_mm;  // how far stages move each element
    // How the last traces went (for tests and benchmarks).
    size_t replayed_steps = 0, searched_steps = 0;
    size_t traced_past_target = 0;  // paths that ended at the target and were completed
    size_t reference_skips = 0;     // beams whose kept steps needed no test (reference_circles)
};

}  // namespace rv
