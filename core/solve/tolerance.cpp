#include "solve/tolerance.hpp"

#include <algorithm>
#include <cmath>
#include <thread>

#include "analysis/crystal_waves.hpp"
#include "analysis/target_summary.hpp"
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

Spread spread(std::vector<double> v) {
    if (v.empty()) return {};
    std::sort(v.begin(), v.end());
    auto at = [&](double q) { return v[static_cast<size_t>(std::lround(q * static_cast<double>(v.size() - 1)))]; };
    return {at(0.05), at(0.5), at(0.95)};
}

}  // namespace

Figures evaluate_figures(const Layout& layout, const MaterialLibrary& library, TraceCache* cache, bool keep_unchanged) {
    const std::vector<BeamAtTarget> at = evaluate_beams_at_target(layout, library, cache, keep_unchanged);
    Figures f;
    if (at.size() == 1) {
        f.valid = at[0].reached;
        f.waist_offset_mm = (at[0].tangential.waist_offset_mm + at[0].sagittal.waist_offset_mm) / 2;
        f.overlap = 1;
        return f;
    }
    if (at.size() < 2 || !at[0].reached || !at[1].reached) return f;
    const Mismatch m = mismatch_at_target(at[0], at[1]);
    f.valid = true;
    f.waist_offset_mm = m.waist_offset_mm;
    f.waist_ratio = m.waist_ratio;
    f.lateral_um = m.lateral_um;
    f.delay_fs = m.delay_fs;
    f.overlap = overlap_at_target(at[0], at[1], layout.beams[0].pulse_fwhm_fs, layout.beams[1].pulse_fwhm_fs).combined;
    return f;
}

std::vector<Perturbation> perturbations(const Layout& layout, const MaterialLibrary& library) {
    const Tolerances& t = layout.goals.tolerance;
    const std::vector<Path> paths = trace_layout(layout, library);
    std::vector<Perturbation> out;
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        const Element& e = layout.elements[i];
        if (std::holds_alternative<Stage>(e.kind)) {
            if (t.stage_mm > 0) out.push_back({i, Perturbation::Kind::Stage, {1, 0}, t.stage_mm, e.id + " stage position"});
            continue;
        }
        std::optional<Vec2> dir;
        for (const Path& p : paths)
            for (const TraceHit& h : p.hits)
                if (h.element == i && !dir) dir = h.direction_in;
        if (!dir) continue;  // no beam meets it: its errors change nothing
        if (t.position_mm > 0) out.push_back({i, Perturbation::Kind::Position, *dir, t.position_mm, e.id + " position"});
        if (t.angle_mrad > 0 && !std::holds_alternative<Target>(e.kind))
            out.push_back({i, Perturbation::Kind::Angle, *dir, t.angle_mrad, e.id + " angle"});
        if (t.focal_length_fraction > 0 && std::holds_alternative<Lens>(e.kind))
            out.push_back({i, Perturbation::Kind::FocalLength, *dir, t.focal_length_fraction, e.id + " focal length"});
    }
    return out;
}

namespace {
void apply_perturbation(Layout& l, const Perturbation& p, double amount) {
    Element& e = l.elements[p.element];
    switch (p.kind) {
        case Perturbation::Kind::Position: e.at_mm += amount * p.direction; break;
        case Perturbation::Kind::Angle: e.normal_deg += rad_to_deg(amount * 1e-3); break;
        case Perturbation::Kind::Stage: std::get<Stage>(e.kind).position_mm += amount; break;
        case Perturbation::Kind::FocalLength: {
            Lens& lens = std::get<Lens>(e.kind);
            if (auto* i = std::get_if<IdealLens>(&lens.model)) i->focal_length_mm *= 1 + amount;
            else if (auto* c = std::get_if<ThinChromaticLens>(&lens.model)) c->focal_length_mm *= 1 + amount;
            else {
                ThickLens& k = std::get<ThickLens>(lens.model);
                k.front_radius_mm *= 1 + amount;
                k.back_radius_mm *= 1 + amount;
            }
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

ToleranceReport analyse_tolerances(const Layout& layout, const MaterialLibrary& library, size_t samples,
                                   std::uint64_t seed, int threads) {
    // Aim_at mirrors get the orientation the trace gave them, so that an angle error can turn
    // them (with aim_at kept, the trace would re-aim them).
    Layout base = layout;
    {
        const std::vector<ElementPose> poses = element_poses(layout, trace_layout(layout, library));
        for (size_t i = 0; i < base.elements.size(); ++i)
            if (auto* m = std::get_if<Mirror>(&base.elements[i].kind); m && m->aim_at) {
                m->aim_at.reset();
                base.elements[i].normal_deg = rad_to_deg(std::atan2(poses[i].normal.y(), poses[i].normal.x()));
            }
    }
    ToleranceReport r;
    r.nominal = evaluate_figures(base, library);
    const std::vector<Perturbation> perts = perturbations(base, library);
    // Sensitivities by central differences at a tenth of each tolerance.
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
    // Monte Carlo.
    r.samples = samples;
    std::vector<Figures> results(samples);
    const int n_threads = std::max(1, threads);
    std::vector<std::thread> pool;
    std::vector<size_t> touched;  // each perturbed element once
    for (const Perturbation& p : perts)
        if (std::find(touched.begin(), touched.end(), p.element) == touched.end()) touched.push_back(p.element);
    for (int t = 0; t < n_threads; ++t)
        pool.emplace_back([&, t] {
            // One working copy and one trace cache per thread; each sample starts from the
            // nominal values of the elements it perturbs (the result depends on the seed and
            // the sample number only, not on the thread that draws it).
            Layout l = base;
            TraceCache cache;
            prepare_crystal_waves(cache, base, library);  // the nominal layout's waves for every sample
            for (size_t k = static_cast<size_t>(t); k < samples; k += static_cast<size_t>(n_threads)) {
                SplitMix64 rng{seed ^ (0x5851f42d4c957f2dULL * (k + 1))};
                for (size_t i : touched) {
                    Element& e = l.elements[i];
                    e.at_mm = base.elements[i].at_mm;
                    e.normal_deg = base.elements[i].normal_deg;
                    if (!std::holds_alternative<Mirror>(e.kind) && !std::holds_alternative<Plate>(e.kind))
                        e.kind = base.elements[i].kind;  // focal lengths and stage positions
                }
                for (const Perturbation& p : perts) apply_perturbation(l, p, p.tolerance * rng.uniform_symmetric());
                results[k] = evaluate_figures(l, library, &cache, false);  // every optic moved: nothing to keep
            }
        });
    for (std::thread& th : pool) th.join();
    std::vector<double> wo, wr, la, de, ov;
    for (const Figures& f : results) {
        if (!f.valid) {
            ++r.failed;
            ov.push_back(0);  // a miss is no overlap
            continue;
        }
        wo.push_back(f.waist_offset_mm), wr.push_back(f.waist_ratio), la.push_back(f.lateral_um),
            de.push_back(f.delay_fs), ov.push_back(f.overlap);
    }
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
    return r;
}

}  // namespace rv
