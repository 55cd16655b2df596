#include "solve/tolerance.hpp"

#include <algorithm>
#include <cmath>
#include <thread>

#include "analysis/crystal_waves.hpp"
#include "analysis/verdict_rules.hpp"
#include "analysis/target_summary.hpp"
#include "layout/visit.hpp"
#include "trace/poses.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {

// splitmix64 (Steele, Lea & Flood, OOPSLA 2014): a small, well-mixed generator whose stream
// depends on its seed only.
struct SplitMix64 {
    std::uint64_t state;
    std::uint64_t next() {
        std::uint64_t z = (state += 0x9e3779b97f4a7c15ULL);
        z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
        z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
        return z ^ (z >> 31);
    }
    double uniform_symmetric() { return 2.0 * static_cast<double>(next() >> 11) * 0x1.0p-53 - 1.0; }  // [−1, 1)
};

// The build errors of each kind, and whether a sample changes the kind's own fields (a lens's
// focal length, a stage's position, a crystal's tilt: reset from the base before each sample).
// One function per kind: a new kind must say.
struct KindErrors {
    bool stage = false;         // a stage: its repeatability, instead of a place and an angle
    bool angle = true;          // turned in the table plane
    bool focal_length = false;  // a lens: its focal length
    bool fields_change = true;
};
KindErrors kind_errors(const ElementKind& kind) {
    return std::visit(overloaded{
                          [](const Lens&) { return KindErrors{.focal_length = true}; },
                          [](const Mirror&) { return KindErrors{.fields_change = false}; },
                          [](const Dichroic&) { return KindErrors{.fields_change = false}; },
                          [](const Plate&) { return KindErrors{.fields_change = false}; },
                          [](const Retroreflector&) { return KindErrors{}; },
                          [](const Stage&) { return KindErrors{.stage = true}; },
                          [](const Crystal&) { return KindErrors{}; },
                          // A target is a plane across the beam: its angle does not move the foci.
                          [](const Target&) { return KindErrors{.angle = false}; },
                          [](const Dump&) { return KindErrors{}; },
                      },
                      kind);
}

Spread spread(std::vector<double> v) {
    if (v.empty()) return {};
    std::sort(v.begin(), v.end());
    auto at = [&](double q) { return v[static_cast<size_t>(std::lround(q * static_cast<double>(v.size() - 1)))]; };
    return {at(0.05), at(0.5), at(0.95)};
}

}  // namespace

Figures evaluate_figures(const Layout& layout, const MaterialLibrary& library, TraceCache* cache, bool keep_unchanged) {
    return figures_of(layout, evaluate_beams_at_target(layout, library, cache, keep_unchanged));
}

std::vector<Perturbation> perturbations(const Layout& layout, const MaterialLibrary& library) {
    const Tolerances& t = layout.goals.tolerance;
    const std::vector<Path> paths = trace_layout(layout, library);
    std::vector<Perturbation> out;
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        const Element& e = layout.elements[i];
        const KindErrors errors = kind_errors(e.kind);
        if (errors.stage) {
            if (t.stage_mm > 0) out.push_back({i, Perturbation::Kind::Stage, {1, 0}, t.stage_mm, e.id + " stage position"});
            continue;
        }
        std::optional<Vec2> dir;
        for (const Path& p : paths)
            for (const TraceHit& h : p.hits)
                if (h.element == i && !dir) dir = h.direction_in;
        if (!dir) continue;  // no beam meets it: its errors change nothing
        if (t.position_mm > 0) out.push_back({i, Perturbation::Kind::Position, *dir, t.position_mm, e.id + " position"});
        if (t.angle_mrad > 0 && errors.angle)
            out.push_back({i, Perturbation::Kind::Angle, *dir, t.angle_mrad, e.id + " angle"});
        if (t.focal_length_fraction > 0 && errors.focal_length)
            out.push_back({i, Perturbation::Kind::FocalLength, *dir, t.focal_length_fraction, e.id + " focal length"});
    }
    return out;
}

namespace {
void apply_perturbation(Layout& l, const Perturbation& p, double amount) {
    Element& e = l.elements[p.element];
    switch (p.kind) {
        case Perturbation::Kind::Position: e.at_mm += amount * p.direction; break;
        case Perturbation::Kind::Angle: e.normal_deg += rad_to_deg(mrad_to_rad(amount)); break;
        case Perturbation::Kind::Stage: std::get<Stage>(e.kind).position_mm += amount; break;
        case Perturbation::Kind::FocalLength: {
            Lens& lens = std::get<Lens>(e.kind);
            const double scale = 1 + amount;
            std::visit(overloaded{
                           [&](IdealLens& i) { i.focal_length_mm *= scale; },
                           [&](ThinChromaticLens& c) { c.focal_length_mm *= scale; },
                           // Both radii scaled: the lensmaker's focal length scales with them
                           // (thickness aside).
                           [&](ThickLens& k) {
                               k.front_radius_mm *= scale;
                               k.back_radius_mm *= scale;
                           },
                       },
                       lens.model);
            break;
        }
    }
}
}  // namespace

Layout perturbed(const Layout& base, const Perturbation& p, double amount) {
    Layout l = base;
    apply_perturbation(l, p, amount);
    return l;
}

namespace {

// Every sample's builds from one base: perturbation p drawn as tolerance × scale[p] × u with u
// uniform on [−1, 1) (the draws do not depend on the scales: the same builds with one error
// tightened or removed), aligned and judged.
struct SampleRun {
    const Layout& base;
    const MaterialLibrary& library;
    const Aligner& aligner;
    const std::vector<Perturbation>& perts;
    std::vector<double> scale;
};

std::vector<Judgement> run_samples(const SampleRun& run, const std::vector<size_t>& ids, std::uint64_t seed,
                                   int threads) {
    std::vector<Judgement> out(ids.size());
    std::vector<size_t> reset;  // each perturbed or adjusted element once
    for (const Perturbation& p : run.perts) reset.push_back(p.element);
    for (size_t i : run.aligner.adjusted_elements()) reset.push_back(i);
    std::sort(reset.begin(), reset.end());
    reset.erase(std::unique(reset.begin(), reset.end()), reset.end());
    const int n_threads = std::max(1, std::min<int>(threads, static_cast<int>(ids.size())));
    std::vector<std::thread> pool;
    for (int t = 0; t < n_threads; ++t)
        pool.emplace_back([&, t] {
            // One working copy and one trace cache per thread; each sample starts from the
            // base values of the elements it changes (the result depends on the seed and the
            // sample number only, not on the thread that draws it).
            Layout l = run.base;
            TraceCache cache;
            prepare_crystal_waves(cache, run.base, run.library);  // the nominal layout's waves for every sample
            for (size_t s = static_cast<size_t>(t); s < ids.size(); s += static_cast<size_t>(n_threads)) {
                SplitMix64 rng{seed ^ (0x5851f42d4c957f2dULL * (ids[s] + 1))};
                for (size_t i : reset) {
                    Element& e = l.elements[i];
                    const Element& b = run.base.elements[i];
                    e.at_mm = b.at_mm;
                    e.normal_deg = b.normal_deg;
                    if (kind_errors(e.kind).fields_change) e.kind = b.kind;  // focal lengths, stage positions, crystal tilts
                }
                for (size_t k = 0; k < run.perts.size(); ++k) {
                    const double u = rng.uniform_symmetric();
                    if (run.scale[k] != 0) apply_perturbation(l, run.perts[k], run.perts[k].tolerance * run.scale[k] * u);
                }
                out[s] = run.aligner.align_sample(l, cache);
            }
        });
    for (std::thread& th : pool) th.join();
    return out;
}

double pass_fraction(const std::vector<Judgement>& j) {
    if (j.empty()) return 0;
    size_t n = 0;
    for (const Judgement& x : j) n += x.pass() ? 1 : 0;
    return static_cast<double>(n) / static_cast<double>(j.size());
}

std::vector<size_t> first_ids(size_t n) {
    std::vector<size_t> ids(n);
    for (size_t k = 0; k < n; ++k) ids[k] = k;
    return ids;
}

// The aim_at mirrors get the orientation the trace gave them, so that an angle error can turn
// them (with aim_at kept, the trace would re-aim them) and a walk turns them from there.
Layout frozen_aims(const Layout& layout, const MaterialLibrary& library) {
    Layout base = layout;
    const std::vector<ElementPose> poses = element_poses(layout, trace_layout(layout, library));
    for (size_t i = 0; i < base.elements.size(); ++i)
        if (auto* m = std::get_if<Mirror>(&base.elements[i].kind); m && m->aim_at) {
            m->aim_at.reset();
            base.elements[i].normal_deg = rad_to_deg(std::atan2(poses[i].normal.y(), poses[i].normal.x()));
        }
    return base;
}

bool verdict_passes_all(const Verdict& v) {
    return verdict_passes(v.space) && verdict_passes(v.time) && verdict_passes(v.phase);
}

// The adjusters a layout could add, each with the set it gives.
std::vector<std::pair<ToleranceChange, Adjusters>> adjuster_candidates(const Layout& base, const MaterialLibrary& library,
                                                                       const Adjusters& now, const JudgeContext& ctx,
                                                                       const RendezvousReport& nominal) {
    std::vector<std::pair<ToleranceChange, Adjusters>> out;
    const std::vector<Path> paths = trace_layout(base, library);
    auto used = [&](size_t i) {
        if (now.stage == i || now.crystal == i) return true;
        if (std::find(now.refocus.begin(), now.refocus.end(), i) != now.refocus.end()) return true;
        for (const Adjusters::Walk& w : now.walks)
            if (std::find(w.mirrors.begin(), w.mirrors.end(), i) != w.mirrors.end()) return true;
        return false;
    };
    if (!now.stage && nominal.stage)
        for (size_t i = 0; i < base.elements.size(); ++i)
            if (base.elements[i].id == nominal.stage->id) {
                Adjusters a = now;
                a.stage = i;
                ToleranceChange c;
                c.kind = ToleranceChange::Kind::Stage;
                c.elements = {base.elements[i].id};
                out.emplace_back(c, a);
            }
    if (!now.crystal && ctx.process)
        if (const auto* x = std::get_if<Crystal>(&base.elements[ctx.target].kind)) {
            Adjusters a = now;
            a.crystal = ctx.target;
            a.crystal_tilts = !x->optic_axis_horizontal;
            ToleranceChange c;
            c.kind = ToleranceChange::Kind::Crystal;
            c.elements = {base.elements[ctx.target].id};
            out.emplace_back(c, a);
        }
    for (const Path& p : paths) {
        if (!p.target_hit) continue;
        bool walked = false;
        for (const Adjusters::Walk& w : now.walks) walked = walked || w.beam == p.beam;
        std::vector<size_t> mirrors;
        for (size_t k = 0; k < *p.target_hit; ++k) {
            const TraceHit& h = p.hits[k];
            const ElementKind& kind = base.elements[h.element].kind;
            if (h.interaction == Interaction::ThinLens && !used(h.element)) {
                bool listed = false;
                for (const auto& [c, a] : out)
                    listed = listed || (c.kind == ToleranceChange::Kind::Refocus && a.refocus.back() == h.element);
                if (!listed) {
                    Adjusters a = now;
                    a.refocus.push_back(h.element);
                    ToleranceChange c;
                    c.kind = ToleranceChange::Kind::Refocus;
                    c.elements = {base.elements[h.element].id};
                    out.emplace_back(c, a);
                }
            }
            if (h.interaction == Interaction::Reflect && !used(h.element) &&
                walks_reflected_beam(kind) &&
                std::find(mirrors.begin(), mirrors.end(), h.element) == mirrors.end())
                mirrors.push_back(h.element);
        }
        if (walked || mirrors.empty()) continue;
        if (mirrors.size() > 2) mirrors.erase(mirrors.begin(), mirrors.end() - 2);
        Adjusters a = now;
        a.walks.push_back({p.beam, mirrors});
        ToleranceChange c;
        c.kind = ToleranceChange::Kind::Walk;
        for (size_t i : mirrors) c.elements.push_back(base.elements[i].id);
        c.perturbation = base.beams[p.beam].id;  // the beam walked
        out.emplace_back(c, a);
    }
    return out;
}

}  // namespace

std::string change_text(const ToleranceChange& c, const Layout& layout) {
    (void)layout;
    auto joined = [&] {
        std::string s;
        for (const std::string& e : c.elements) s += (s.empty() ? "" : " + ") + e;
        return s;
    };
    char number[64];
    switch (c.kind) {
        case ToleranceChange::Kind::Stage: return "re-zero stage " + joined() + " after building";
        case ToleranceChange::Kind::Walk: return "walk " + c.perturbation + " onto the target with " + joined();
        case ToleranceChange::Kind::Refocus: return "refocus " + joined() + " on a translation mount";
        case ToleranceChange::Kind::Crystal: return "re-peak the angle of crystal " + joined();
        case ToleranceChange::Kind::Tighter:
            if (c.perturbation.find("focal length") != std::string::npos)
                std::snprintf(number, sizeof number, "±%.3g %%", 100 * c.tolerance);
            else if (c.perturbation.find("angle") != std::string::npos)
                std::snprintf(number, sizeof number, "±%.3g mrad", c.tolerance);
            else
                std::snprintf(number, sizeof number, "±%.3g mm", c.tolerance);
            return "hold " + c.perturbation + " to " + number;
    }
    return "";
}

ToleranceReport analyse_tolerances(const Layout& layout, const MaterialLibrary& library, size_t samples,
                                   std::uint64_t seed, int threads) {
    ToleranceReport r;
    const RendezvousReport nominal_report = build_report(layout, library);
    r.nominal_verdict = nominal_report.verdict;
    r.nominal_passes = verdict_passes_all(r.nominal_verdict);
    const AdjusterChoice choice = resolve_adjusters(layout, library, nominal_report);
    if (!choice.error.empty()) {
        r.error = choice.error, r.error_pointer = choice.error_pointer;
        return r;
    }
    r.adjuster_set = choice.adjusters;
    r.adjusters = adjuster_texts(layout, choice.adjusters);
    const Layout frozen = frozen_aims(layout, library);
    const JudgeContext ctx = judge_context(layout, library, nominal_report);
    Aligner aligner(frozen, library, ctx, choice.adjusters);
    const Layout base = aligner.align_nominal(frozen);
    r.aligned = base;
    r.aligned_verdict = build_report(base, library).verdict;
    r.aligned_passes = verdict_passes_all(r.aligned_verdict);
    for (size_t i : aligner.adjusted_elements()) {
        const Element &a = frozen.elements[i], &b = base.elements[i];
        const std::string& id = a.id;
        if (const auto* s = std::get_if<Stage>(&a.kind))
            r.alignment_moves.emplace_back(id + " position_mm", std::get<Stage>(b.kind).position_mm - s->position_mm);
        if (const auto* x = std::get_if<Crystal>(&a.kind); x && std::get<Crystal>(b.kind).tilt_deg != x->tilt_deg)
            r.alignment_moves.emplace_back(id + " tilt_deg", std::get<Crystal>(b.kind).tilt_deg - x->tilt_deg);
        if (b.normal_deg != a.normal_deg) r.alignment_moves.emplace_back(id + " normal_deg", b.normal_deg - a.normal_deg);
        if (b.at_mm != a.at_mm) r.alignment_moves.emplace_back(id + " moved mm", (b.at_mm - a.at_mm).norm());
    }
    r.nominal = evaluate_figures(base, library);
    const std::vector<Perturbation> perts = perturbations(base, library);
    // Sensitivities by central differences at a tenth of each tolerance (unaligned).
    std::vector<double> var_offset, var_lateral;
    for (const Perturbation& p : perts) {
        const double h = p.tolerance * 0.1;
        const Figures plus = evaluate_figures(perturbed(base, p, h), library);
        const Figures minus = evaluate_figures(perturbed(base, p, -h), library);
        SensitivityRow row{p.label, p.tolerance, {}};
        row.per_unit.valid = plus.valid && minus.valid;
        if (row.per_unit.valid) {
            row.per_unit.waist_offset_mm = (plus.waist_offset_mm - minus.waist_offset_mm) / (2 * h);
            row.per_unit.waist_ratio = (plus.waist_ratio - minus.waist_ratio) / (2 * h);
            row.per_unit.lateral_um = (plus.lateral_um - minus.lateral_um) / (2 * h);
            row.per_unit.delay_fs = (plus.delay_fs - minus.delay_fs) / (2 * h);
            row.per_unit.overlap = (plus.overlap - minus.overlap) / (2 * h);
        }
        // Variance of a uniform error on ±t is t²/3.
        var_offset.push_back(std::pow(row.per_unit.waist_offset_mm * p.tolerance, 2) / 3);
        var_lateral.push_back(std::pow(row.per_unit.lateral_um * p.tolerance, 2) / 3);
        r.sensitivity.push_back(row);
    }
    // The most deserving of a fine adjustment (a translation mount): of the position errors, the
    // one with the largest share of the two variances, each normalised by its total.
    double tot_o = 0, tot_l = 0;
    for (size_t i = 0; i < perts.size(); ++i) tot_o += var_offset[i], tot_l += var_lateral[i];
    double best = -1;
    for (size_t i = 0; i < perts.size(); ++i) {
        if (perts[i].kind != Perturbation::Kind::Position) continue;
        const double share = 0.5 * ((tot_o > 0 ? var_offset[i] / tot_o : 0) + (tot_l > 0 ? var_lateral[i] / tot_l : 0));
        if (share > best) best = share, r.most_sensitive = perts[i].label, r.most_sensitive_share = share;
    }
    // Monte Carlo of aligned builds.
    r.samples = samples;
    const SampleRun run{base, library, aligner, perts, std::vector<double>(perts.size(), 1.0)};
    const std::vector<size_t> all = first_ids(samples);
    const std::vector<Judgement> results = run_samples(run, all, seed, threads);
    std::vector<double> wo, wr, la, de, ov;
    size_t space = 0, time = 0, phase = 0;
    for (const Judgement& j : results) {
        const Figures& f = j.figures;
        if (!f.valid) {
            ++r.failed;
            ov.push_back(0);  // a miss is no overlap
            continue;
        }
        space += j.space, time += j.time, phase += j.phase;
        wo.push_back(f.waist_offset_mm), wr.push_back(f.waist_ratio), la.push_back(f.lateral_um),
            de.push_back(f.delay_fs), ov.push_back(f.overlap);
    }
    const double n = samples > 0 ? static_cast<double>(samples) : 1.0;
    r.pass_rate = pass_fraction(results);
    r.space_rate = static_cast<double>(space) / n, r.time_rate = static_cast<double>(time) / n,
    r.phase_rate = static_cast<double>(phase) / n;
    auto stddev = [](const std::vector<double>& v) {
        if (v.size() < 2) return 0.0;
        double mean = 0, sq = 0;
        for (double x : v) mean += x;
        mean /= static_cast<double>(v.size());
        for (double x : v) sq += (x - mean) * (x - mean);
        return std::sqrt(sq / static_cast<double>(v.size() - 1));
    };
    r.waist_offset_std_mm = stddev(wo);
    r.delay_std_fs = stddev(de);
    double lin = 0;
    for (double v : var_offset) lin += v;
    r.waist_offset_linear_std_mm = std::sqrt(lin);
    r.waist_offset_mm = spread(wo), r.waist_ratio = spread(wr), r.lateral_um = spread(la), r.delay_fs = spread(de);
    r.overlap = spread(ov);
    // What limits the failing builds: each error removed from the first failures.
    std::vector<size_t> failing;
    // (None when the aligned nominal itself fails: then no error is what limits.)
    const size_t examine = std::min(kLimitingFailures, std::max<size_t>(50, samples / 10));
    for (size_t k = 0; r.aligned_passes && k < results.size() && failing.size() < examine; ++k)
        if (!results[k].pass()) failing.push_back(k);
    r.limiting_examined = failing.size();
    if (!failing.empty()) {
        size_t best_count = 0;
        for (size_t p = 0; p < perts.size(); ++p) {
            SampleRun without = run;
            without.scale[p] = 0;
            const std::vector<Judgement> again = run_samples(without, failing, seed, threads);
            size_t count = 0;
            for (const Judgement& j : again) count += j.pass() ? 1 : 0;
            if (count > best_count) best_count = count, r.limiting_error = perts[p].label;
        }
        r.limiting_share = static_cast<double>(best_count) / static_cast<double>(failing.size());
    }
    // What would raise the pass rate most: each change on the first samples, the best on all.
    if (r.pass_rate < 1 && samples > 0) {
        r.subset = std::min(samples, std::clamp<size_t>(samples / 10, 100, kWhatIfSamples));
        const std::vector<size_t> subset = first_ids(r.subset);
        r.subset_pass_rate = pass_fraction(std::vector<Judgement>(results.begin(), results.begin() + static_cast<long>(r.subset)));
        struct Option {
            ToleranceChange change;
            std::optional<Adjusters> adjusters;  // an adjuster added
            size_t pert = 0;                     // else the part halved
        };
        std::vector<Option> options;
        for (auto& [c, a] : adjuster_candidates(base, library, choice.adjusters, ctx, nominal_report))
            options.push_back({c, a, 0});
        for (size_t p = 0; p < perts.size(); ++p) {
            ToleranceChange c;
            c.kind = ToleranceChange::Kind::Tighter;
            c.elements = {base.elements[perts[p].element].id};
            c.perturbation = perts[p].label;
            c.tolerance = perts[p].tolerance / 2;
            options.push_back({c, std::nullopt, p});
        }
        std::optional<Option> winner;
        std::optional<Aligner> winner_aligner;
        std::optional<Layout> winner_base;
        double best_rate = r.subset_pass_rate;
        for (Option& o : options) {
            if (o.adjusters) {
                Aligner a(frozen, library, ctx, *o.adjusters);
                const Layout b = a.align_nominal(base);
                const std::vector<Perturbation> pb = perturbations(b, library);
                if (pb.size() != perts.size()) continue;
                const SampleRun with{b, library, a, pb, std::vector<double>(pb.size(), 1.0)};
                o.change.subset_pass_rate = pass_fraction(run_samples(with, subset, seed, threads));
                if (o.change.subset_pass_rate > best_rate)
                    best_rate = o.change.subset_pass_rate, winner = o, winner_aligner.emplace(a), winner_base = b;
            } else {
                SampleRun tighter = run;
                tighter.scale[o.pert] = 0.5;
                o.change.subset_pass_rate = pass_fraction(run_samples(tighter, subset, seed, threads));
                if (o.change.subset_pass_rate > best_rate)
                    best_rate = o.change.subset_pass_rate, winner = o, winner_aligner.reset(), winner_base.reset();
            }
        }
        if (winner) {
            r.checked = std::min(samples, kRecommendationSamples);
            const std::vector<size_t> checked = first_ids(r.checked);
            r.checked_pass_rate = pass_fraction(std::vector<Judgement>(results.begin(), results.begin() + static_cast<long>(r.checked)));
            if (winner->adjusters) {
                const std::vector<Perturbation> pb = perturbations(*winner_base, library);
                const SampleRun with{*winner_base, library, *winner_aligner, pb, std::vector<double>(pb.size(), 1.0)};
                winner->change.pass_rate = pass_fraction(run_samples(with, checked, seed, threads));
            } else {
                SampleRun tighter = run;
                tighter.scale[winner->pert] = 0.5;
                winner->change.pass_rate = pass_fraction(run_samples(tighter, checked, seed, threads));
            }
            r.recommendation = winner->change;
        }
    }
    return r;
}

}  // namespace rv
