#pragma once
// Tolerance analysis: how the rendezvous figures respond to build errors, as a sensitivity
// table (central differences, one perturbation at a time, no alignment) and a Monte Carlo run
// of aligned builds: every perturbation at once, each uniform in ±its tolerance
// (goals.tolerance), then the table aligned with its adjusters (goals.tolerance.adjust,
// solve/alignment.hpp) and judged with the report's verdict rules (space, time, phase).
//
// Figures: waist offset (mm, beam 2 − beam 1), waist ratio, lateral offset (µm), delay (fs) and
// the combined overlap (analysis/target_summary.hpp overlap_at_target, the report's). With one beam
// only its waist offset from the target centre is used.
// Perturbations: every optic's position along the beam at it, its rotation in the table plane
// (an aim_at mirror is turned from the orientation the trace gave it), every lens's focal
// length (a thick lens: both radii scaled), every stage's position (repeatability).
// Before the samples the nominal layout is aligned with the same adjusters (a layout that
// fails its verdict as given is analysed around its aligned state).
// What limits the failing builds: for each perturbation, the share of the failing builds
// (the first tenth of the samples' failures, at least 50 and at most kLimitingFailures) that
// pass when only that error is removed (drawn as 0, the others as they were), aligned and
// judged again; not looked for when the aligned nominal fails (then no build passes).
// What would help most: each adjuster the layout lacks (the stage, the crystal, a refocus of
// each lens, a walk of each beam without one over the last two mirrors it reflects from) and
// each part at half its tolerance, run with the same draws on the first tenth of the samples
// (at least 100, at most kWhatIfSamples);
// the best of them is run again on the first kRecommendationSamples samples (all, when fewer)
// for the pass rate it gives, beside the pass rate of those builds as the layout is.
// The Monte Carlo result for a seed does not depend on the thread count: sample k draws from a
// generator seeded by (seed, k) alone, and percentiles are taken over the sorted samples.

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "analysis/report.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"
#include "solve/alignment.hpp"
#include "trace/trace_cache.hpp"

namespace rv {

Figures evaluate_figures(const Layout& layout, const MaterialLibrary& library, TraceCache* cache = nullptr,
                         bool keep_unchanged = true);

struct Perturbation {
    enum class Kind { Position, Angle, FocalLength, Stage };
    size_t element = 0;
    Kind kind = Kind::Position;
    Vec2 direction{1, 0};  // Position: the beam's direction at the element
    double tolerance = 0;  // mm, mrad, fraction or mm
    std::string label;     // "L2_P position" …
};

std::vector<Perturbation> perturbations(const Layout& layout, const MaterialLibrary& library);

// The layout with one perturbation of `amount` (in its unit) applied.
Layout perturbed(const Layout& base, const Perturbation& p, double amount);

struct SensitivityRow {
    std::string label;
    double tolerance = 0;
    Figures per_unit;  // ∂figure/∂(perturbation), per mm, mrad or unit fraction
};

struct Spread {
    double p5 = 0, p50 = 0, p95 = 0;
};

inline constexpr size_t kLimitingFailures = 200;
inline constexpr size_t kWhatIfSamples = 1000;
inline constexpr size_t kRecommendationSamples = 20000;

// A change that would raise the pass rate: an adjuster to add or a part with half its tolerance.
struct ToleranceChange {
    enum class Kind { Stage, Walk, Refocus, Crystal, Tighter };
    Kind kind = Kind::Tighter;
    std::vector<std::string> elements;  // the adjuster's elements, or the part's
    std::string perturbation;           // Tighter: the perturbation's label
    double tolerance = 0;               // Tighter: the halved tolerance (its unit)
    double pass_rate = 0;               // on the first `checked` samples, with the change
    double subset_pass_rate = 0;        // on the first `subset` samples, with the change
};
// "walk pump with M1_P + M2_P", "L2_S focal length ±0.5 %" …
std::string change_text(const ToleranceChange& c, const Layout& layout);

struct ToleranceReport {
    // A goals.tolerance.adjust entry that cannot work (nothing else is computed).
    std::string error, error_pointer;
    Verdict nominal_verdict;        // the report's verdict of the layout as given
    bool nominal_passes = false;
    std::vector<std::string> adjusters;  // adjuster_texts
    Adjusters adjuster_set;
    Layout aligned;                 // the nominal aligned with the adjusters
    Verdict aligned_verdict;        // the report's verdict of it
    bool aligned_passes = false;
    std::vector<std::pair<std::string, double>> alignment_moves;  // "S1 position_mm" → change
    Figures nominal;                // of the aligned nominal
    std::vector<SensitivityRow> sensitivity;
    size_t samples = 0, failed = 0;  // failed: a beam missed the target in that sample
    // After alignment: the fraction of builds that meet space, time and phase, and each line.
    double pass_rate = 0, space_rate = 0, time_rate = 0, phase_rate = 0;
    Spread waist_offset_mm, waist_ratio, lateral_um, delay_fs, overlap;  // after alignment
    double waist_offset_std_mm = 0, delay_std_fs = 0;  // standard deviations of the samples
    double waist_offset_linear_std_mm = 0;             // predicted by the sensitivities (unaligned)
    std::string most_sensitive;      // the position error that contributes most (linearized)
    double most_sensitive_share = 0; // its share of the waist-offset and lateral variance
    // The error with the largest share of the failing builds (empty when none fails or no
    // single removal passes any): the share of the examined failures that pass without it.
    std::string limiting_error;
    double limiting_share = 0;
    size_t limiting_examined = 0;
    // The change that raises the pass rate most (none when no candidate raises it).
    std::optional<ToleranceChange> recommendation;
    size_t subset = 0;               // samples the candidates were compared on
    double subset_pass_rate = 0;     // the pass rate on those as the layout is
    size_t checked = 0;              // samples the recommendation was run on
    double checked_pass_rate = 0;    // the pass rate on those as the layout is
};

ToleranceReport analyse_tolerances(const Layout& layout, const MaterialLibrary& library, size_t samples,
                                   std::uint64_t seed, int threads = 2);

}  // namespace rv
