#pragma once
// The retrace's differential check, shared by the unit tests (bundled and random layouts) and
// the pipeline fuzzer: random sparse edits of a layout (the solvers' pattern: one or two optics
// moved, turned or given another focal length, a stage moved, a link cut, sometimes a beam or
// the table changed, sometimes another kind of trace in between), and after each the retrace's
// paths and the lean evaluation built on them compared with a fresh trace and the full pipeline.
// Exact equality: both take the same arithmetic on the same values. Free of Catch2 so that a
// fuzzer can use it: a difference comes back as text.
#include <cstdint>
#include <numeric>
#include <optional>
#include <random>
#include <sstream>
#include <string>
#include <vector>

#include "analysis/target_summary.hpp"
#include "findings/finding_json.hpp"
#include "trace/propagate.hpp"
#include "trace/trace.hpp"

namespace rv::test {

// Where the paths `a` (a retrace's, which may end at the target) and `b` (complete) differ: a
// path of a that ended at the target must be b's path up to its target crossing, with the
// findings made up to there; one of b may end there only where a's does. None: they agree.
inline std::optional<std::string> path_difference(const std::vector<Path>& a, const std::vector<Path>& b) {
    std::ostringstream why;
    auto differ = [&](size_t p, const char* what, size_t k = SIZE_MAX) {
        why << "path " << p << ": " << what;
        if (k != SIZE_MAX) why << " at " << k;
        return std::optional<std::string>(why.str());
    };
    if (a.size() != b.size()) return differ(0, "number of paths");
    for (size_t p = 0; p < a.size(); ++p) {
        if (a[p].target_hit != b[p].target_hit) return differ(p, "target hit");
        if (b[p].ends_at_target && (!a[p].ends_at_target || a[p].findings.size() != b[p].findings.size()))
            return differ(p, "ends at target");
        if (a[p].ends_at_target) {
            if (!a[p].target_hit || a[p].hits.size() != *a[p].target_hit + 1 ||
                a[p].segments.size() != a[p].hits.size() || a[p].findings.size() > b[p].findings.size())
                return differ(p, "shortened path");
            if (a[p].hits.size() > b[p].hits.size()) return differ(p, "shortened path longer");
        } else if (a[p].hits.size() != b[p].hits.size() || a[p].segments.size() != b[p].segments.size() ||
                   a[p].findings.size() != b[p].findings.size()) {
            return differ(p, "number of hits, segments or findings");
        }
        for (size_t k = 0; k < a[p].hits.size(); ++k) {
            const TraceHit &x = a[p].hits[k], &y = b[p].hits[k];
            if (x.element != y.element || x.face != y.face || x.interaction != y.interaction) return differ(p, "element met", k);
            if (x.point_mm != y.point_mm || x.direction_in != y.direction_in || x.direction_out != y.direction_out)
                return differ(p, "geometry", k);
            if (x.cos_aoi != y.cos_aoi || x.sin_aoi != y.sin_aoi || x.height_mm != y.height_mm) return differ(p, "incidence", k);
            if (x.index_before != y.index_before || x.index_after != y.index_after || x.lens_index != y.lens_index)
                return differ(p, "index", k);
            if (x.s_mm != y.s_mm || x.group_delay_fs != y.group_delay_fs) return differ(p, "path length or delay", k);
            if (x.focal_length_mm != y.focal_length_mm || x.lumped_group_index != y.lumped_group_index ||
                x.lumped_glass_mm != y.lumped_glass_mm || x.half_aperture_mm != y.half_aperture_mm)
                return differ(p, "lens or aperture", k);
            if (x.walkoff_in_rad != y.walkoff_in_rad || x.vertical_slope_in != y.vertical_slope_in ||
                x.vertical_mm != y.vertical_mm)
                return differ(p, "walk-off", k);
            if (x.lumped_gvd_fs2_per_mm != y.lumped_gvd_fs2_per_mm || x.lumped_tod_fs3_per_mm != y.lumped_tod_fs3_per_mm)
                return differ(p, "lumped dispersion", k);
        }
        for (size_t k = 0; k < a[p].segments.size(); ++k) {
            const TraceSegment &x = a[p].segments[k], &y = b[p].segments[k];
            if (x.from_mm != y.from_mm || x.to_mm != y.to_mm || x.length_mm != y.length_mm || x.inside != y.inside ||
                x.index != y.index || x.group_index != y.group_index || x.gvd_fs2_per_mm != y.gvd_fs2_per_mm ||
                x.tod_fs3_per_mm != y.tod_fs3_per_mm)
                return differ(p, "segment", k);
        }
        for (size_t k = 0; k < a[p].findings.size(); ++k)
            if (finding_json(a[p].findings[k]) != finding_json(b[p].findings[k])) return differ(p, "finding", k);
    }
    return std::nullopt;
}

// Where two lean evaluations at the target differ.
inline std::optional<std::string> at_target_difference(const std::vector<BeamAtTarget>& a,
                                                       const std::vector<BeamAtTarget>& b, const char* what) {
    if (a.size() != b.size()) return std::string(what) + ": number of beams";
    for (size_t i = 0; i < a.size(); ++i) {
        const BeamAtTarget &x = a[i], &y = b[i];
        if (x.reached != y.reached || x.arrival_fs != y.arrival_fs || x.path_mm != y.path_mm || x.hit_mm != y.hit_mm ||
            x.direction != y.direction || x.tangential.waist_offset_mm != y.tangential.waist_offset_mm ||
            x.sagittal.waist_offset_mm != y.sagittal.waist_offset_mm || x.tangential.waist_um != y.tangential.waist_um ||
            x.sagittal.waist_um != y.sagittal.waist_um || x.tangential.radius_um != y.tangential.radius_um ||
            x.sagittal.radius_um != y.sagittal.radius_um || x.wave_direction != y.wave_direction ||
            x.vertical_mm != y.vertical_mm || x.vertical_slope != y.vertical_slope || !(x.pulse == y.pulse))
            return std::string(what) + ": beam " + std::to_string(i);
    }
    return std::nullopt;
}

inline std::optional<std::string> labelled(const char* what, std::optional<std::string> why) {
    if (why) *why = std::string(what) + ": " + *why;
    return why;
}

// What a run of check_retraces saw, so that a test can require that every way of the
// retrace was taken.
struct RetraceRun {
    std::optional<std::string> difference;  // the first, with the trial
    size_t kept_hits = 0, ended_at_target = 0, traced_past_target = 0, reference_skips = 0;
};

// One random sparse edit of `l` (whose unedited form is `base`), naming in `edited` what a
// solver would name (it may name more than it changed).
inline void random_sparse_edit(Layout& l, const Layout& base, std::mt19937& rng, std::vector<size_t>& edited) {
    std::uniform_real_distribution<double> small(-0.6, 0.6), large(-10, 10), unit(0, 1);
    if (l.elements.empty()) return;
    // Now and then a solver's pattern: the same optics moved a little again; else new edits.
    const bool again = !edited.empty() && unit(rng) < 0.3;
    if (again)
        for (size_t i : edited) l.elements[i].at_mm += 0.5 * Vec2(small(rng), small(rng));
    const int edits = again ? 0 : 1 + static_cast<int>(rng() % 2);
    if (!again) edited.clear();
    if (!again && unit(rng) < 0.2) edited.push_back(rng() % l.elements.size());
    for (int k = 0; k < edits; ++k) {
        edited.push_back(rng() % l.elements.size());
        Element& e = l.elements[edited.back()];
        switch (rng() % 8) {
            case 0: e.at_mm += Vec2(small(rng), small(rng)); break;
            case 5: e.at_mm += small(rng) * direction_deg(e.normal_deg); break;  // along its axis
            case 1: e.at_mm += Vec2(large(rng), large(rng)); break;
            case 2: e.normal_deg += small(rng); break;
            case 3: e.aperture_mm = std::max(1.0, e.aperture_mm + small(rng)); break;
            case 4:
                if (auto* lens = std::get_if<Lens>(&e.kind)) {
                    if (auto* i = std::get_if<IdealLens>(&lens->model)) i->focal_length_mm *= 1 + 0.05 * small(rng);
                    if (auto* c = std::get_if<ThinChromaticLens>(&lens->model)) c->focal_length_mm *= 1 + 0.05 * small(rng);
                    if (auto* t = std::get_if<ThickLens>(&lens->model)) {
                        const double scale = 1 + 0.05 * small(rng);  // both radii (one may be flat)
                        t->front_radius_mm *= scale;
                        t->back_radius_mm *= scale;
                    }
                }
                if (auto* stage = std::get_if<Stage>(&e.kind)) stage->position_mm += 5 * small(rng);
                break;
            case 6:  // what links elements: a mirror's aim_at, an element's name
                if (auto* m = std::get_if<Mirror>(&e.kind)) {
                    const auto* was = std::get_if<Mirror>(&base.elements[edited.back()].kind);
                    m->aim_at = m->aim_at || !was ? std::nullopt : was->aim_at;
                } else if (unit(rng) < 0.3) {
                    e.id += "'";
                }
                break;
            default: break;  // nothing changed
        }
    }
}

// `trials` random sparse edits of `base` from `seed`; after each, the retrace (with and without
// the edited list), the Monte Carlo's evaluation and a fresh trace with the full pipeline must
// agree exactly. Stops at the first difference.
inline RetraceRun check_retraces(const Layout& base, const MaterialLibrary& library, std::uint32_t seed, int trials) {
    RetraceRun run;
    TraceCache cache, plain_cache, named_cache;
    Layout l = base;
    std::mt19937 rng(seed);
    std::uniform_real_distribution<double> unit(0, 1);
    std::vector<size_t> edited;
    for (int trial = 0; trial < trials && !run.difference; ++trial) {
        auto fail = [&](std::optional<std::string> why) {
            if (why) run.difference = "trial " + std::to_string(trial) + ": " + *why;
            return why.has_value();
        };
        random_sparse_edit(l, base, rng, edited);
        const double what = unit(rng);
        if (what < 0.03 && !l.beams.empty()) l.beams[0].waist_um.tangential *= 1.01;
        else if (what < 0.06 && !l.beams.empty()) l.beams.back().direction_deg += 0.01;
        else if (what < 0.08) l.table.width_mm += 1;
        else if (what < 0.12) {  // another kind of trace between
            trace_layout(l, library, &cache);
            trace_layout(l, library, &named_cache);
        }
        if (unit(rng) < 0.02) {  // back to the start: everything changes at once
            l = base;
            edited.resize(l.elements.size());
            std::iota(edited.begin(), edited.end(), size_t{0});
        }
        const std::vector<BeamAtTarget> lean = evaluate_beams_at_target(l, library, &cache);
        // The Monte Carlo's way, without the retrace's comparison, gives the same numbers.
        if (fail(at_target_difference(evaluate_beams_at_target(l, library, &plain_cache, false), lean, "plain")))
            break;
        // Told which elements were edited, the retrace compares only those: the same numbers.
        if (fail(at_target_difference(evaluate_beams_at_target(l, library, named_cache, edited), lean, "named")))
            break;
        if (fail(labelled("named against unnamed retrace", path_difference(named_cache.paths, cache.paths)))) break;
        for (size_t b = 0; b < cache.beams.size(); ++b) run.kept_hits += cache.kept_hits(b);
        for (const Path& p : cache.paths) run.ended_at_target += p.ends_at_target;
        // A fresh trace with the waves the evaluation chose in birefringent crystals (from the
        // polarization arriving there, analysis/crystal_waves.hpp).
        TraceCache fresh_cache;
        fresh_cache.crystal_polarization = cache.crystal_polarization;
        const std::vector<Path> fresh = trace_layout(l, library, &fresh_cache);
        if (fail(labelled("retrace against fresh trace", path_difference(cache.paths, fresh)))) break;
        std::vector<BeamAtTarget> full;
        for (const Path& p : fresh) full.push_back(beam_at_target(l, p, propagate_path(l, p)));
        if (fail(at_target_difference(lean, full, "full pipeline"))) break;
    }
    run.traced_past_target = cache.counters.traced_past_target;
    run.reference_skips = cache.counters.reference_skips;
    return run;
}

}  // namespace rv::test
