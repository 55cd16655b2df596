#pragma once
// Tolerance analysis: how the rendezvous figures respond to build errors, as a sensitivity
// table (central differences, one perturbation at a time) and a Monte Carlo run (every
// perturbation at once, each uniform in ±its tolerance, goals.tolerance).
//
// Figures: waist offset (mm, beam 2 − beam 1), waist ratio, lateral offset (µm), delay (fs) and
// the combined overlap (analysis/target_summary.hpp overlap_at_target, the report's). With one beam
// only its waist offset from the target centre is used.
// Perturbations: every optic's position along the beam at it, its rotation in the table plane
// (an aim_at mirror is turned from the orientation the trace gave it), every lens's focal
// length (a thick lens: both radii scaled), every stage's position (repeatability).
// The Monte Carlo result for a seed does not depend on the thread count: sample k draws from a
// generator seeded by (seed, k) alone, and percentiles are taken over the sorted samples.

#include <cstdint>
#include <string>
#include <vector>

#include "layout/layout.hpp"
#include "materials/material_library.hpp"
#include "trace/trace_cache.hpp"

namespace rv {

struct Figures {
    bool valid = false;  // both beams (or the one) reached the target
    double waist_offset_mm = 0, waist_ratio = 1, lateral_um = 0, delay_fs = 0, overlap = 0;
};

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

struct ToleranceReport {
    Figures nominal;
    std::vector<SensitivityRow> sensitivity;
    size_t samples = 0, failed = 0;  // failed: a beam missed the target in that sample
    Spread waist_offset_mm, waist_ratio, lateral_um, delay_fs, overlap;
    double waist_offset_std_mm = 0, delay_std_fs = 0;  // standard deviations of the samples
    double waist_offset_linear_std_mm = 0;             // the same predicted by the sensitivities
    std::string most_sensitive;      // the position error that contributes most (linearized)
    double most_sensitive_share = 0; // its share of the waist-offset and lateral variance
};

ToleranceReport analyse_tolerances(const Layout& layout, const MaterialLibrary& library, size_t samples,
                                   std::uint64_t seed, int threads = 2);

}  // namespace rv
