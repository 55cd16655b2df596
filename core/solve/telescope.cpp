#include "solve/telescope.hpp"

#include <unsupported/Eigen/NonLinearOptimization>
#include <unsupported/Eigen/NumericalDiff>

#include <algorithm>
#include <atomic>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <thread>

#include "analysis/crystal_waves.hpp"
#include "units/number_text.hpp"
#include "analysis/target_summary.hpp"
#include "solve/diameter_choice.hpp"
#include "trace/trace.hpp"

namespace rv {

namespace {

struct Problem {
    const Layout& base;
    const MaterialLibrary& library;
    std::vector<size_t> move_index;
    std::vector<Vec2> move_direction;
    std::vector<std::pair<double, double>> move_range;
    std::vector<size_t> swap_index;
    std::vector<double> goal_um;  // per beam, 0 = none
    SolveGoals::Aim aim;
    std::optional<size_t> only_beam;  // residuals of this beam only (one arm searched alone)
    // The wave each beam travels as in the crystal, from the layout as given (analysis/
    // crystal_waves.hpp): lens swaps and moves do not change the polarization.
    std::vector<std::optional<Polarization>> crystal_polarization = {};
};

double move_of(const Problem& p, size_t k, double u) {
    // Halved before they are combined: (hi - lo) / 2 overflows to infinity over ±1e308 and the
    // moves became NaN (issue 19 §1); hi/2 - lo/2 is finite for any finite range.
    const double mid = p.move_range[k].first / 2 + p.move_range[k].second / 2;
    const double half = p.move_range[k].second / 2 - p.move_range[k].first / 2;
    return mid + half * std::sin(u);
}

// The moved elements of a layout that already holds the catalog choice put where u says.
void place_moves(const Problem& p, const Eigen::VectorXd& u, Layout& l) {
    for (size_t k = 0; k < p.move_index.size(); ++k)
        l.elements[p.move_index[k]].at_mm = p.base.elements[p.move_index[k]].at_mm +
                                             move_of(p, k, u[static_cast<Eigen::Index>(k)]) * p.move_direction[k];
}

Layout apply(const Problem& p, const std::vector<const CatalogLens*>& choice, const Eigen::VectorXd& u) {
    Layout l = p.base;
    for (size_t k = 0; k < p.swap_index.size(); ++k) {
        Element& e = l.elements[p.swap_index[k]];
        Lens lens = choice[k]->lens;
        lens.part = choice[k]->id;  // the written layout names the stock lens it holds
        e.kind = lens;
        e.aperture_mm = choice[k]->diameter_mm;
    }
    place_moves(p, u, l);
    return l;
}

// One evaluation of a layout that differs from the previous one with this cache (one catalog
// choice's) in the moved elements' positions only: the retrace compares just those.
std::vector<BeamAtTarget> evaluate(const Problem& p, const Layout& l, TraceCache& cache) {
    return evaluate_beams_at_target(l, p.library, cache, p.move_index);
}

constexpr double kMissed = 1e3;  // residual of a beam that misses the target

// A penalty leaves the optimum a little inside a constraint it presses against; less than this
// is not reported as broken.
constexpr double kReportedViolation_mm = 0.05;

// How far (mm) a moved element breaks the spacing and table-edge constraints (0: it keeps them),
// with a sentence for each broken one.
// `placed`: placed_positions_mm(l).
double violation_mm(const Problem& p, const Layout& l, const std::vector<Vec2>& placed, size_t k,
                    std::vector<std::string>* why) {
    const SolveGoals& g = *p.base.goals.solve;
    const size_t i = p.move_index[k];
    const Vec2 at = placed[i];
    double v = 0;
    for (size_t j = 0; j < l.elements.size(); ++j) {
        if (j == i || std::holds_alternative<Stage>(l.elements[j].kind)) continue;
        const double d = (placed[j] - at).norm();
        if (d < g.min_spacing_mm) {
            v += g.min_spacing_mm - d;
            if (why && g.min_spacing_mm - d > kReportedViolation_mm)
                why->push_back(l.elements[i].id + " is " + format_number("%.0f", d) +
                                    " mm from " + l.elements[j].id + " (less than min_spacing_mm)");
        }
    }
    const double inset = l.elements[i].aperture_mm / 2 + g.table_margin_mm;
    const double outside = std::max({inset - at.x(), at.x() - (l.table.width_mm - inset), inset - at.y(),
                                     at.y() - (l.table.height_mm - inset), 0.0});
    if (outside > 0) {
        v += outside;
        if (why && outside > kReportedViolation_mm) why->push_back(l.elements[i].id + " is too close to the table's edge");
    }
    return v;
}

Eigen::VectorXd residuals(const Problem& p, const Layout& l, const std::vector<BeamAtTarget>& at, Eigen::Index size) {
    Eigen::VectorXd r = Eigen::VectorXd::Zero(size);
    Eigen::Index i = 0;
    auto push = [&](double v) {
        if (i < size) r[i++] = v;
    };
    // Constraints as penalties, 1 per mm of violation (the other residuals are of order 1).
    const std::vector<Vec2> placed = placed_positions_mm(l);
    for (size_t k = 0; k < p.move_index.size(); ++k) push(violation_mm(p, l, placed, k, nullptr));
    if (const auto& max = p.base.goals.solve->max_path_mm)
        for (size_t b = 0; b < at.size(); ++b)
            if (!p.only_beam || *p.only_beam == b) push(at[b].reached ? std::max(0.0, at[b].path_mm - *max) : 0.0);
    for (size_t b = 0; b < at.size(); ++b) {
        if (p.only_beam && *p.only_beam != b) continue;
        const BeamAtTarget& t = at[b];
        for (const PlaneAtTarget* pl : {&t.tangential, &t.sagittal})
            push(t.reached ? pl->waist_offset_mm / pl->rayleigh_mm : kMissed);
        if (p.aim == SolveGoals::Aim::Waist && p.goal_um[b] > 0)
            for (const PlaneAtTarget* pl : {&t.tangential, &t.sagittal})
                push(t.reached ? (pl->waist_um - p.goal_um[b]) / p.goal_um[b] : kMissed);
    }
    if (p.aim == SolveGoals::Aim::EqualConfocal && at.size() >= 2) {
        const bool ok = at[0].reached && at[1].reached;
        push(ok ? (at[0].tangential.rayleigh_mm - at[1].tangential.rayleigh_mm) /
                      (at[0].tangential.rayleigh_mm + at[1].tangential.rayleigh_mm) : kMissed);
        push(ok ? (at[0].sagittal.rayleigh_mm - at[1].sagittal.rayleigh_mm) /
                      (at[0].sagittal.rayleigh_mm + at[1].sagittal.rayleigh_mm) : kMissed);
    }
    return r;
}

Eigen::Index residual_count_without_constraints(const Problem& p, size_t beams) {
    Eigen::Index n = 2 * static_cast<Eigen::Index>(p.only_beam ? 1 : beams);
    if (p.aim == SolveGoals::Aim::Waist)
        for (size_t b = 0; b < p.goal_um.size(); ++b)
            if (!p.only_beam || *p.only_beam == b) n += p.goal_um[b] > 0 ? 2 : 0;
    if (p.aim == SolveGoals::Aim::EqualConfocal) n += 2;
    return n;
}

Eigen::Index residual_count(const Problem& p, size_t beams) {
    Eigen::Index n = 2 * static_cast<Eigen::Index>(p.only_beam ? 1 : beams);
    n += static_cast<Eigen::Index>(p.move_index.size());
    if (p.base.goals.solve->max_path_mm) n += static_cast<Eigen::Index>(p.only_beam ? 1 : beams);
    if (p.aim == SolveGoals::Aim::Waist)
        for (size_t b = 0; b < p.goal_um.size(); ++b)
            if (!p.only_beam || *p.only_beam == b) n += p.goal_um[b] > 0 ? 2 : 0;
    if (p.aim == SolveGoals::Aim::EqualConfocal) n += 2;
    return n;
}

struct Functor {
    using Scalar = double;
    using InputType = Eigen::VectorXd;
    using ValueType = Eigen::VectorXd;
    using JacobianType = Eigen::MatrixXd;
    enum { InputsAtCompileTime = Eigen::Dynamic, ValuesAtCompileTime = Eigen::Dynamic };
    const Problem* p;
    Layout* work;       // the layout with this catalog choice; only the moved positions change
    TraceCache* cache;  // kept across the evaluations of one choice
    Eigen::Index n_inputs, n_values;
    int inputs() const { return static_cast<int>(n_inputs); }
    int values() const { return static_cast<int>(n_values); }
    int operator()(const Eigen::VectorXd& u, Eigen::VectorXd& f) const {
        place_moves(*p, u, *work);
        f = residuals(*p, *work, evaluate(*p, *work, *cache), n_values);
        return 0;
    }
};

TelescopeSolution solve_one(const Problem& p, const std::vector<const CatalogLens*>& choice) {
    const size_t beams = p.base.beams.size();
    const Eigen::Index n = static_cast<Eigen::Index>(p.move_index.size());
    const Eigen::Index m = std::max(residual_count(p, beams), n);
    Eigen::VectorXd u = Eigen::VectorXd::Zero(n);
    for (Eigen::Index k = 0; k < n; ++k) {  // start from no move when the range allows it
        const auto [lo, hi] = p.move_range[static_cast<size_t>(k)];
        const double half = hi / 2 - lo / 2;
        u[k] = lo <= 0 && 0 <= hi && half > 0 ? std::asin(std::clamp(-(lo / 2 + hi / 2) / half, -1.0, 1.0)) : 0;
    }
    Layout work = apply(p, choice, u);
    TraceCache cache;
    cache.crystal_polarization = p.crystal_polarization;
    cache.crystal_polarization_known = true;
    if (n > 0) {
        Functor f{&p, &work, &cache, n, m};
        Eigen::NumericalDiff<Functor> diff(f);
        Eigen::LevenbergMarquardt<Eigen::NumericalDiff<Functor>> lm(diff);
        lm.parameters.maxfev = 60 * static_cast<int>(n + 1);
        lm.parameters.xtol = 1e-12;
        lm.parameters.ftol = 1e-14;
        lm.minimize(u);
    }
    TelescopeSolution s;
    s.layout = apply(p, choice, u);
    // The positions as the file will hold them (0.001 mm), judged as such.
    for (size_t i : p.move_index)
        for (int c = 0; c < 2; ++c) s.layout.elements[i].at_mm[c] = std::round(s.layout.elements[i].at_mm[c] * 1e3) / 1e3;
    const std::vector<BeamAtTarget> at = evaluate(p, s.layout, cache);
    // The figure ranked on is the aim's residual alone; constraints are reported beside it.
    const Eigen::VectorXd all = residuals(p, s.layout, at, m);
    const Eigen::Index constraints = residual_count(p, beams) - residual_count_without_constraints(p, beams);
    s.residual = all.tail(all.size() - constraints).norm();
    const std::vector<Vec2> placed = placed_positions_mm(s.layout);
    for (size_t k = 0; k < p.move_index.size(); ++k) violation_mm(p, s.layout, placed, k, &s.violations);
    if (const auto& max = p.base.goals.solve->max_path_mm)
        for (size_t b = 0; b < at.size(); ++b)
            if ((!p.only_beam || *p.only_beam == b) && at[b].reached && at[b].path_mm > *max + 0.01)
                s.violations.push_back(p.base.beams[b].id + "'s path is " + std::to_string(static_cast<int>(at[b].path_mm)) +
                                       " mm, more than max_path_mm");
    for (size_t k = 0; k < p.swap_index.size(); ++k) s.swaps.emplace_back(p.base.elements[p.swap_index[k]].id, choice[k]->id);
    for (Eigen::Index k = 0; k < n; ++k) {
        const size_t e = p.move_index[static_cast<size_t>(k)];
        const double move = (s.layout.elements[e].at_mm - p.base.elements[e].at_mm).dot(p.move_direction[static_cast<size_t>(k)]);
        s.moves_mm.emplace_back(p.base.elements[p.move_index[static_cast<size_t>(k)]].id, move);
        s.total_move_mm += std::abs(move);
        // Sensitivity: waist-offset change per mm of this move.
        Layout nudged = s.layout;
        nudged.elements[p.move_index[static_cast<size_t>(k)]].at_mm += 0.1 * p.move_direction[static_cast<size_t>(k)];
        const std::vector<BeamAtTarget> after = evaluate(p, nudged, cache);
        for (size_t b = 0; b < at.size(); ++b)
            if (at[b].reached && after[b].reached)
                s.sensitivity_mm_per_mm = std::max(s.sensitivity_mm_per_mm,
                    std::abs(after[b].tangential.waist_offset_mm - at[b].tangential.waist_offset_mm) / 0.1);
    }
    return s;
}

// A catalog choice for each swapped lens, and its solution.
using Candidate = SolvedChoice;

// The ranking: solutions that break no constraint first, then by residual, sensitivity and the
// total move.
bool ranks_before(const TelescopeSolution& a, const TelescopeSolution& b) {
    if (a.violations.empty() != b.violations.empty()) return a.violations.empty();  // feasible first
    if (a.residual != b.residual) return a.residual < b.residual;
    if (a.sensitivity_mm_per_mm != b.sensitivity_mm_per_mm) return a.sensitivity_mm_per_mm < b.sensitivity_mm_per_mm;
    return a.total_move_mm < b.total_move_mm;
}

// The element ids of a problem's swapped lenses, in its choices' order.
std::vector<std::string> swapped_ids(const Problem& p) {
    std::vector<std::string> ids;
    for (size_t i : p.swap_index) ids.push_back(p.base.elements[i].id);
    return ids;
}

// Every combination of catalog lenses for `swaps` swapped lenses (one empty choice for none).
std::vector<std::vector<const CatalogLens*>> all_combinations(size_t swaps, const std::vector<CatalogLens>& catalog,
                                                              const SolveOptions& options, std::string& error) {
    // Counted before any is built: building first held the whole product in memory (3.7 GB
    // for 20 000 lenses and two swaps) before the maximum was ever checked.
    size_t count = 1;
    bool overflows = false;
    for (size_t k = 0; k < swaps && !overflows; ++k) {
        if (!catalog.empty() && count > SIZE_MAX / catalog.size()) overflows = true;
        count *= catalog.size();
    }
    if (overflows || count > options.max_combinations) {
        error = std::to_string(catalog.size()) + " catalog lenses for " + std::to_string(swaps) +
                " swapped lenses make " + (overflows ? "more than " + std::to_string(SIZE_MAX) : std::to_string(count)) +
                " combinations, more than the maximum of " + std::to_string(options.max_combinations) +
                "; swap fewer lenses or use a smaller catalog";
        return {};
    }
    std::vector<std::vector<const CatalogLens*>> combos{{}};
    for (size_t k = 0; k < swaps; ++k) {
        std::vector<std::vector<const CatalogLens*>> next;
        next.reserve(count);
        for (const auto& c : combos)
            for (const CatalogLens& lens : catalog) {
                next.push_back(c);
                next.back().push_back(&lens);
            }
        combos = std::move(next);
    }
    return combos;
}

// Solve every combination, best first. Combinations split over threads in fixed stripes; the
// ranking is by value (stable), so the result does not depend on the thread count.
std::vector<Candidate> search(const Problem& p, const std::vector<std::vector<const CatalogLens*>>& combos,
                              const SolveOptions& options) {
    std::vector<Candidate> all(combos.size());
    const int threads = std::max(1, std::min<int>(options.threads, static_cast<int>(combos.size())));
    std::vector<std::thread> pool;
    std::atomic<size_t> done{0};
    for (int t = 0; t < threads; ++t)
        pool.emplace_back([&, t] {
            for (size_t c = static_cast<size_t>(t); c < combos.size(); c += static_cast<size_t>(threads)) {
                all[c] = Candidate{combos[c], solve_one(p, combos[c])};
                const size_t n = ++done;
                if (t == 0 && options.progress) options.progress(n, combos.size());
            }
        });
    for (std::thread& th : pool) th.join();
    std::stable_sort(all.begin(), all.end(),
                     [](const Candidate& x, const Candidate& y) { return ranks_before(x.solution, y.solution); });
    return all;
}

}  // namespace

SolveResult solve_telescopes(const Layout& layout, const MaterialLibrary& library,
                             const std::vector<CatalogLens>& catalog, const SolveOptions& options) {
    SolveResult result;
    if (!layout.goals.solve) {
        result.error = "the layout has no goals.solve: name what may move or be swapped";
        return result;
    }
    const SolveGoals& goals = *layout.goals.solve;
    Problem p{layout, library, {}, {}, {}, {}, {}, goals.aim, std::nullopt,
              arriving_crystal_polarizations(layout, library, trace_layout(layout, library))};
    auto index_of = [&](const std::string& id) {
        for (size_t i = 0; i < layout.elements.size(); ++i)
            if (layout.elements[i].id == id) return i;
        return layout.elements.size();
    };
    const std::vector<Path> paths = trace_layout(layout, library);
    for (const auto& [id, range] : goals.move) {
        const size_t i = index_of(id);
        std::optional<Vec2> dir;
        for (const Path& path : paths)
            for (const TraceHit& h : path.hits)
                if (h.element == i && !dir) dir = h.direction_in;
        if (!dir) {
            result.error = id + " is on no beam's path, so it cannot move along one";
            return result;
        }
        p.move_index.push_back(i);
        p.move_direction.push_back(*dir);
        p.move_range.push_back(range);
    }
    for (const std::string& id : goals.swap) p.swap_index.push_back(index_of(id));
    for (const BeamSource& b : layout.beams) {
        double goal = 0;
        for (const auto& [id, w] : layout.goals.waist_um)
            if (id == b.id) goal = w;
        p.goal_um.push_back(goal);
    }
    if (goals.aim == SolveGoals::Aim::Waist && std::all_of(p.goal_um.begin(), p.goal_um.end(), [](double g) { return g == 0; })) {
        result.error = "aim \"waist\" needs goals.waist_um for at least one beam";
        return result;
    }
    // Goals the verdict could never call met: two waist goals further apart than the verdict's
    // waist ratio allows (a solution meeting them fails space by construction).
    if (p.goal_um.size() >= 2 && p.goal_um[0] > 0 && p.goal_um[1] > 0) {
        const double ratio = std::max(p.goal_um[0] / p.goal_um[1], p.goal_um[1] / p.goal_um[0]);
        const double limit = layout.goals.verdict.max_waist_ratio;
        if (ratio > limit) {
            char text[320];
            std::snprintf(text, sizeof text,
                          "goals.waist_um asks for %.4g and %.4g µm, a ratio of %.3f, above goals.verdict.max_waist_ratio "
                          "%.3g: a solution meeting them could never meet the space verdict; bring the goals within "
                          "that ratio or raise the threshold",
                          p.goal_um[0], p.goal_um[1], ratio, limit);
            result.error = text;
            return result;
        }
    }
    if (!p.swap_index.empty() && catalog.empty()) {
        result.error = "the catalog holds no lens";
        return result;
    }
    // Which beams meet each swapped and each moved element.
    auto beams_at = [&](size_t element) {
        std::vector<size_t> beams;
        for (const Path& path : paths)
            for (const TraceHit& h : path.hits)
                if (h.element == element) {
                    beams.push_back(path.beam);
                    break;
                }
        return beams;
    };
    // Separable: the aim is per beam (waist or focus) and every swapped or moved element is on
    // one beam's path only. Then each beam's residuals depend on its own arm alone, the joint
    // residual² is the sum of the arms', and the best `keep` joint solutions are among the
    // combinations of each arm's best `keep`: each arm is searched alone (60 + 60 catalog
    // choices instead of 60 × 60), then those combinations are solved together.
    bool separable = options.separate_arms && p.aim != SolveGoals::Aim::EqualConfocal && p.base.beams.size() > 1;
    std::vector<size_t> swap_beam, move_beam;
    for (size_t i : p.swap_index) {
        const std::vector<size_t> b = beams_at(i);
        separable = separable && b.size() == 1;
        swap_beam.push_back(b.empty() ? 0 : b[0]);
    }
    for (size_t i : p.move_index) {
        const std::vector<size_t> b = beams_at(i);
        separable = separable && b.size() == 1;
        move_beam.push_back(b.empty() ? 0 : b[0]);
    }
    // Movers on different arms that could come within min_spacing_mm of each other couple the
    // arms through the spacing constraint: then the arms are not searched apart.
    const double spacing = layout.goals.solve->min_spacing_mm;
    const std::vector<Vec2> placed = placed_positions_mm(layout);
    for (size_t a = 0; separable && a < p.move_index.size(); ++a)
        for (size_t b = a + 1; separable && b < p.move_index.size(); ++b) {
            if (move_beam[a] == move_beam[b]) continue;
            auto travel = [&](size_t k) { return std::max(std::abs(p.move_range[k].first), std::abs(p.move_range[k].second)); };
            const double d = (placed[p.move_index[a]] - placed[p.move_index[b]]).norm();
            if (d - travel(a) - travel(b) < spacing) separable = false;
        }
    std::vector<Candidate> ranked;
    if (separable) {
        std::vector<std::vector<Candidate>> per_beam;
        std::vector<std::vector<size_t>> swap_slots;  // which of p.swap_index each arm's choices fill
        for (size_t beam = 0; beam < p.base.beams.size(); ++beam) {
            Problem arm = p;
            arm.only_beam = beam;
            arm.swap_index.clear(), arm.move_index.clear(), arm.move_direction.clear(), arm.move_range.clear();
            std::vector<size_t> slots;
            for (size_t k = 0; k < p.swap_index.size(); ++k)
                if (swap_beam[k] == beam) arm.swap_index.push_back(p.swap_index[k]), slots.push_back(k);
            for (size_t k = 0; k < p.move_index.size(); ++k)
                if (move_beam[k] == beam)
                    arm.move_index.push_back(p.move_index[k]), arm.move_direction.push_back(p.move_direction[k]),
                        arm.move_range.push_back(p.move_range[k]);
            std::string error;
            per_beam.push_back(search(arm, all_combinations(arm.swap_index.size(), catalog, options, error), options));
            if (!error.empty()) {
                result.error = error;
                return result;
            }
            result.combinations += per_beam.back().size();
            // Each arm's best `keep` lens families, each in its smallest diameter that does not
            // clip: a swapped lens lies on this arm's path only, so whether it clips does not
            // depend on the other arm.
            per_beam.back() = collapse_diameters(std::move(per_beam.back()), options.keep, swapped_ids(arm), library, ranks_before);
            swap_slots.push_back(std::move(slots));
        }
        // Every combination of the arms' best choices, solved together.
        std::vector<std::vector<const CatalogLens*>> joint{std::vector<const CatalogLens*>(p.swap_index.size())};
        for (size_t beam = 0; beam < per_beam.size(); ++beam) {
            std::vector<std::vector<const CatalogLens*>> next;
            for (const auto& partial : joint)
                for (const Candidate& c : per_beam[beam]) {
                    next.push_back(partial);
                    for (size_t j = 0; j < swap_slots[beam].size(); ++j) next.back()[swap_slots[beam][j]] = c.choice[j];
                }
            joint = std::move(next);
        }
        ranked = search(p, joint, options);
        // Each joint solution keeps its arms' diameter choices: their alternatives and clipping.
        for (Candidate& c : ranked) {
            for (size_t beam = 0; beam < per_beam.size(); ++beam)
                for (const Candidate& a : per_beam[beam]) {
                    bool same = true;
                    for (size_t j = 0; j < swap_slots[beam].size(); ++j) same = same && c.choice[swap_slots[beam][j]] == a.choice[j];
                    if (!same || swap_slots[beam].empty()) continue;
                    c.solution.also.insert(c.solution.also.end(), a.solution.also.begin(), a.solution.also.end());
                    if (a.solution.clipped_fraction)
                        c.solution.clipped_fraction = std::max(c.solution.clipped_fraction.value_or(0.0), *a.solution.clipped_fraction);
                    break;
                }
        }
        if (ranked.size() > options.keep) ranked.resize(options.keep);
    } else {
        std::string error;
        std::vector<std::vector<const CatalogLens*>> combos = all_combinations(p.swap_index.size(), catalog, options, error);
        if (!error.empty()) {
            result.error = error;
            return result;
        }
        result.combinations = combos.size();
        ranked = collapse_diameters(search(p, combos, options), options.keep, swapped_ids(p), library, ranks_before);
    }
    std::vector<TelescopeSolution> all;
    for (Candidate& c : ranked) all.push_back(std::move(c.solution));
    result.solutions = std::move(all);
    return result;
}

}  // namespace rv
