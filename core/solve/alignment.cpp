#include "solve/alignment.hpp"

#include <Eigen/QR>
#include <algorithm>
#include <cmath>

#include "analysis/phase_now.hpp"
#include "analysis/verdict_rules.hpp"
#include "io/field_reader.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {

size_t index_of(const Layout& layout, const std::string& id) {
    for (size_t i = 0; i < layout.elements.size(); ++i)
        if (layout.elements[i].id == id) return i;
    return layout.elements.size();
}

// The hits of beam b's path on element i before the target (none: it does not meet it there).
std::vector<const TraceHit*> hits_before_target(const Path& p, size_t i) {
    std::vector<const TraceHit*> out;
    const size_t end = p.target_hit ? *p.target_hit : p.hits.size();
    for (size_t k = 0; k < end; ++k)
        if (p.hits[k].element == i) out.push_back(&p.hits[k]);
    return out;
}

bool reflects(const Path& p, size_t i) {
    for (const TraceHit* h : hits_before_target(p, i))
        if (h->interaction == Interaction::Reflect) return true;
    return false;
}

}  // namespace

AdjusterChoice resolve_adjusters(const Layout& layout, const MaterialLibrary& library, const RendezvousReport& nominal) {
    AdjusterChoice out;
    Adjusters& a = out.adjusters;
    const std::vector<Path> paths = trace_layout(layout, library);
    const size_t target = index_of(layout, layout.target);
    const Crystal* crystal =
        target < layout.elements.size() ? std::get_if<Crystal>(&layout.elements[target].kind) : nullptr;
    auto fail = [&](std::string pointer, std::string message) {
        if (out.error.empty()) out.error_pointer = std::move(pointer), out.error = std::move(message);
    };
    if (!layout.goals.tolerance.adjust) {
        // Defaults: the report's stage, and each beam's aim_at mirrors (the last two).
        if (nominal.stage) a.stage = index_of(layout, nominal.stage->id);
        for (const Path& p : paths) {
            std::vector<size_t> aimed;
            const size_t end = p.target_hit ? *p.target_hit : p.hits.size();
            for (size_t k = 0; k < end; ++k) {
                const size_t i = p.hits[k].element;
                const auto* m = std::get_if<Mirror>(&layout.elements[i].kind);
                if (m && m->aim_at && p.hits[k].interaction == Interaction::Reflect &&
                    std::find(aimed.begin(), aimed.end(), i) == aimed.end())
                    aimed.push_back(i);
            }
            if (aimed.size() > 2) aimed.erase(aimed.begin(), aimed.end() - 2);
            if (!aimed.empty() && p.target_hit) a.walks.push_back({p.beam, aimed});
        }
        return out;
    }
    const ToleranceAdjusters& given = *layout.goals.tolerance.adjust;
    const std::string base = "/goals/tolerance/adjust";
    if (given.stage) a.stage = index_of(layout, *given.stage);
    if (given.crystal && crystal) {
        a.crystal = target;
        a.crystal_tilts = !crystal->optic_axis_horizontal;
    }
    for (size_t w = 0; w < given.walk.size(); ++w) {
        Adjusters::Walk walk;
        std::optional<size_t> beam;
        for (size_t k = 0; k < given.walk[w].size(); ++k) {
            const std::string& id = given.walk[w][k];
            const size_t i = index_of(layout, id);
            const std::string ptr = child_pointer(child_pointer(base + "/walk", w), k);
            std::optional<size_t> here;
            for (const Path& p : paths)
                if (p.target_hit && reflects(p, i)) here = here ? here : std::optional<size_t>(p.beam);
            if (!here) {
                fail(ptr, "\"" + id + "\" reflects no beam on its way to the target, so turning it walks none");
                continue;
            }
            if (beam && *beam != *here) {
                // A mirror both beams reflect from: the walk's beam is the one its partner has.
                bool shared = false;
                for (const Path& p : paths)
                    if (p.beam == *beam && reflects(p, i)) shared = true;
                if (!shared) {
                    fail(ptr, "\"" + id + "\" reflects " + layout.beams[*here].id + ", \"" + given.walk[w][0] +
                                  "\" reflects " + layout.beams[*beam].id + ": a walk turns two mirrors of one beam");
                    continue;
                }
            } else if (!beam) {
                beam = here;
            }
            walk.mirrors.push_back(i);
        }
        if (!beam) continue;
        walk.beam = *beam;
        for (const Adjusters::Walk& other : a.walks)
            if (other.beam == walk.beam)
                fail(child_pointer(base + "/walk", w), "a second walk of " + layout.beams[walk.beam].id +
                                                           "; one walk (one or two mirrors) aligns a beam");
        // In path order.
        const Path& p = paths[walk.beam];
        std::stable_sort(walk.mirrors.begin(), walk.mirrors.end(), [&](size_t x, size_t y) {
            return hits_before_target(p, x).front() < hits_before_target(p, y).front();
        });
        a.walks.push_back(walk);
    }
    for (size_t k = 0; k < given.refocus.size(); ++k) {
        const size_t i = index_of(layout, given.refocus[k]);
        bool met = false;
        for (const Path& p : paths) met = met || (p.target_hit && !hits_before_target(p, i).empty());
        if (!met) fail(child_pointer(base + "/refocus", k), "\"" + given.refocus[k] + "\" is on no beam's way to the target");
        else a.refocus.push_back(i);
    }
    return out;
}

std::vector<std::string> adjuster_texts(const Layout& layout, const Adjusters& a) {
    std::vector<std::string> out;
    if (a.stage) out.push_back("stage " + layout.elements[*a.stage].id + " re-zeroed");
    for (const Adjusters::Walk& w : a.walks) {
        std::string ids;
        for (size_t i : w.mirrors) ids += (ids.empty() ? "" : " + ") + layout.elements[i].id;
        out.push_back(ids + " walk " + layout.beams[w.beam].id + " onto the target");
    }
    for (size_t i : a.refocus) out.push_back(layout.elements[i].id + " refocused");
    if (a.crystal)
        out.push_back("crystal " + layout.elements[*a.crystal].id + (a.crystal_tilts ? " re-tilted" : " re-turned") +
                      " for the peak of sinc²");
    return out;
}

JudgeContext judge_context(const Layout& layout, const MaterialLibrary& library, const RendezvousReport& nominal) {
    JudgeContext c;
    c.thresholds = layout.goals.verdict;
    c.target = index_of(layout, layout.target);
    c.two_beams = layout.beams.size() >= 2;
    // The pulse lengths at the target, as the report's (analysis/pulse_at_target.hpp).
    if (c.two_beams && nominal.beams.size() >= 2 && nominal.beams[0].at_target.pulse.fwhm_fs &&
        nominal.beams[1].at_target.pulse.fwhm_fs) {
        c.time_judged = true;
        c.cross_correlation_fs = cross_correlation_fwhm_fs(*nominal.beams[0].at_target.pulse.fwhm_fs,
                                                           *nominal.beams[1].at_target.pulse.fwhm_fs);
    }
    c.phase_applies = nominal.target_is_crystal;
    if (c.phase_applies && !nominal.chosen_process_missing && !nominal.phase_matching.empty()) {
        const PhaseMatchingReport& p = nominal.phase_matching.front();
        const auto* crystal = std::get_if<Crystal>(&layout.elements[c.target].kind);
        c.material = crystal ? library.find(crystal->material) : nullptr;
        c.process = c.material != nullptr && !p.outside_index_data;
        c.first_nm = layout.beams[p.first_beam].wavelength_nm;
        c.second_nm = layout.beams[p.second_beam].wavelength_nm;
        c.mixing = p.mixing;
        c.first_beam = p.first_beam;
        c.phase_matchable = p.phase_matchable;
        c.polarizations_suit = p.polarizations_suit;
    }
    return c;
}

Figures figures_of(const Layout&, const std::vector<BeamAtTarget>& at) {
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
    f.overlap = overlap_at_target(at[0], at[1]).combined;
    return f;
}

namespace {

double delta_k_l_of(const Layout& l, const JudgeContext& c, const std::vector<BeamAtTarget>& at) {
    if (!c.process || c.first_beam >= at.size() || !at[c.first_beam].reached) return 0;
    const Element& xe = l.elements[c.target];
    const Crystal& xc = std::get<Crystal>(xe.kind);
    const PhaseNow p = phase_now(*c.material, c.first_nm, c.second_nm, c.mixing, xe, xc, at[c.first_beam].wave_direction,
                                 at[c.first_beam].index);
    return p.delta_k_per_mm * xc.length_mm;
}

Judgement judge_with(const Layout& l, const JudgeContext& c, const std::vector<BeamAtTarget>& at, double delta_k_l) {
    Judgement j;
    j.figures = figures_of(l, at);
    if (!j.figures.valid) return j;
    const VerdictThresholds& t = c.thresholds;
    if (c.two_beams) {
        const Mismatch m = mismatch_at_target(at[0], at[1]);
        j.space = space_figures_met(space_figures(at[0], at[1], m), t) && waist_goals_met(l, at);
        j.time = c.time_judged && delay_met(m.delay_fs, c.cross_correlation_fs, t);
    } else {
        j.space = single_beam_offset_met(single_beam_offset_rayleigh(at[0]), t) && waist_goals_met(l, at);
        j.time = true;  // one beam: not applicable
    }
    if (c.process && std::isfinite(delta_k_l)) j.phase_factor = phase_factor(delta_k_l);
    j.phase = !c.phase_applies || (c.process && std::isfinite(delta_k_l) &&
                                   phase_met(c.phase_matchable, j.phase_factor, c.polarizations_suit, t));
    return j;
}

}  // namespace

Judgement judge(const Layout& layout, const JudgeContext& context, const std::vector<BeamAtTarget>& at) {
    return judge_with(layout, context, at, delta_k_l_of(layout, context, at));
}

Aligner::Aligner(const Layout& layout, const MaterialLibrary& library, JudgeContext context, Adjusters adjusters,
                 int steps)
    : library_(library), context_(std::move(context)), adjusters_(std::move(adjusters)), steps_(steps) {
    const std::vector<Path> paths = trace_layout(layout, library);
    const size_t beams = layout.beams.size();
    walked_.assign(beams, false);
    // Controls.
    if (adjusters_.stage) controls_.push_back({Control::Kind::Stage, *adjusters_.stage, {1, 0}, 0.002});
    for (const Adjusters::Walk& w : adjusters_.walks) {
        walked_[w.beam] = true;
        for (size_t i : w.mirrors) controls_.push_back({Control::Kind::Turn, i, {1, 0}, rad_to_deg(0.05e-3)});
    }
    for (size_t i : adjusters_.refocus) {
        Vec2 dir{1, 0};
        for (const Path& p : paths)
            if (const std::vector<const TraceHit*> h = hits_before_target(p, i); !h.empty()) {
                dir = h.front()->direction_in;
                break;
            }
        controls_.push_back({Control::Kind::Move, i, dir, 0.02});
    }
    if (adjusters_.crystal && context_.process)
        controls_.push_back({adjusters_.crystal_tilts ? Control::Kind::Tilt : Control::Kind::Turn, *adjusters_.crystal,
                             {1, 0}, 0.002});
    for (const Control& c : controls_)
        if (std::find(adjusted_.begin(), adjusted_.end(), c.element) == adjusted_.end()) adjusted_.push_back(c.element);
    std::sort(adjusted_.begin(), adjusted_.end());
    // Rows.
    auto add_row = [&](Row r) {
        for (const Row& x : rows_)
            if (x.kind == r.kind && x.beam == r.beam) return;
        rows_.push_back(r);
    };
    if (adjusters_.stage && context_.two_beams) add_row({Row::Kind::Delay, 0});
    for (const Adjusters::Walk& w : adjusters_.walks) {
        add_row({Row::Kind::Lateral, w.beam});
        if (w.mirrors.size() == 2) add_row({Row::Kind::Direction, w.beam});
    }
    refocused_.assign(beams, false);
    for (size_t i : adjusters_.refocus)
        for (const Path& p : paths)
            if (p.target_hit && !hits_before_target(p, i).empty()) {
                add_row({Row::Kind::Focus, p.beam});
                refocused_[p.beam] = true;
            }
    all_refocused_ = std::all_of(refocused_.begin(), refocused_.end(), [](bool f) { return f; });
    if (adjusters_.crystal && context_.process) add_row({Row::Kind::Phase, 0});
    all_walked_ = std::all_of(walked_.begin(), walked_.end(), [](bool w) { return w; });
    // Scales from the layout as given.
    const std::vector<BeamAtTarget> at = evaluate_beams_at_target(layout, library);
    design_direction_.assign(beams, {1, 0});
    lateral_scale_mm_.assign(beams, 1);
    angle_scale_rad_.assign(beams, mrad_to_rad(1.0));
    rayleigh_mm_.assign(beams, 1);
    for (size_t b = 0; b < at.size() && b < beams; ++b) {
        if (!at[b].reached) continue;
        design_direction_[b] = at[b].direction;
        lateral_scale_mm_[b] = std::max(um_to_mm(at[b].tangential.radius_um), 1e-6);
        rayleigh_mm_[b] = std::max(std::min(at[b].tangential.rayleigh_mm, at[b].sagittal.rayleigh_mm), 1e-9);
        angle_scale_rad_[b] = std::max(um_to_mm(at[b].tangential.waist_um) / at[b].tangential.rayleigh_mm, 1e-9);
    }
}

Aligner::Evaluated Aligner::evaluate(const Layout& l, TraceCache& cache, const std::vector<size_t>& edited) const {
    Evaluated e;
    e.at = evaluate_beams_at_target(l, library_, cache, edited);
    e.delta_k_l = delta_k_l_of(l, context_, e.at);
    return e;
}

bool Aligner::residuals(const Layout& l, const Evaluated& e, Eigen::VectorXd& r) const {
    r.resize(static_cast<Eigen::Index>(rows_.size()));
    for (size_t k = 0; k < rows_.size(); ++k) {
        const Row& row = rows_[k];
        double v = 0;
        switch (row.kind) {
            case Row::Kind::Delay: {
                if (e.at.size() < 2 || !e.at[0].reached || !e.at[1].reached) return false;
                const double scale = context_.time_judged ? context_.cross_correlation_fs : 100.0;
                v = (e.at[0].arrival_fs - e.at[1].arrival_fs) / scale;
                break;
            }
            case Row::Kind::Lateral:
            case Row::Kind::Direction: {
                const BeamAtTarget& me = e.at[row.beam];
                if (!me.reached) return false;
                Vec2 point = l.elements[context_.target].at_mm, dir = design_direction_[row.beam];
                if (!all_walked_)
                    for (size_t b = 0; b < e.at.size(); ++b)
                        if (!walked_[b]) {
                            if (!e.at[b].reached) return false;
                            point = e.at[b].hit_mm, dir = e.at[b].direction;
                            break;
                        }
                if (row.kind == Row::Kind::Lateral)
                    v = (me.hit_mm - point).dot(perpendicular(dir)) / lateral_scale_mm_[row.beam];
                else
                    v = (dir.x() * me.direction.y() - dir.y() * me.direction.x()) / angle_scale_rad_[row.beam];
                break;
            }
            case Row::Kind::Focus: {
                const BeamAtTarget& me = e.at[row.beam];
                if (!me.reached) return false;
                auto offset = [](const BeamAtTarget& b) { return (b.tangential.waist_offset_mm + b.sagittal.waist_offset_mm) / 2; };
                double aim = 0;  // the target centre, or the waist of a beam no lens refocuses
                if (!all_refocused_)
                    for (size_t b = 0; b < e.at.size(); ++b)
                        if (!refocused_[b]) {
                            if (!e.at[b].reached) return false;
                            aim = offset(e.at[b]);
                            break;
                        }
                v = (offset(me) - aim) / rayleigh_mm_[row.beam];
                break;
            }
            case Row::Kind::Phase:
                if (!std::isfinite(e.delta_k_l)) return false;
                v = e.delta_k_l / 2;
                break;
        }
        r[static_cast<Eigen::Index>(k)] = v;
    }
    return true;
}

void Aligner::apply(Layout& l, const Eigen::VectorXd& du) const {
    for (size_t k = 0; k < controls_.size(); ++k) {
        const Control& c = controls_[k];
        const double d = du[static_cast<Eigen::Index>(k)];
        Element& e = l.elements[c.element];
        switch (c.kind) {
            case Control::Kind::Stage: {
                Stage& s = std::get<Stage>(e.kind);
                s.position_mm = std::clamp(s.position_mm + d, s.travel_min_mm, s.travel_max_mm);
                break;
            }
            case Control::Kind::Turn: e.normal_deg += d; break;
            case Control::Kind::Move: e.at_mm += d * c.direction; break;
            case Control::Kind::Tilt: {
                Crystal& x = std::get<Crystal>(e.kind);
                x.tilt_deg = std::clamp(x.tilt_deg + d, -45.0, 45.0);
                break;
            }
        }
    }
}

Eigen::MatrixXd Aligner::jacobian(const Layout& l) const {
    const auto n = static_cast<Eigen::Index>(controls_.size());
    const auto m = static_cast<Eigen::Index>(rows_.size());
    Eigen::MatrixXd j = Eigen::MatrixXd::Zero(m, n);
    Layout work = l;
    for (Eigen::Index k = 0; k < n; ++k) {
        const Control& c = controls_[static_cast<size_t>(k)];
        Eigen::VectorXd du = Eigen::VectorXd::Zero(n), plus, minus;
        du[k] = c.step;
        Layout a = work;
        apply(a, du);
        Layout b = work;
        apply(b, -du);
        TraceCache cache;
        const bool ok = residuals(a, evaluate(a, cache, adjusted_), plus) &&
                        residuals(b, evaluate(b, cache, adjusted_), minus);
        // A stage at an end of its travel moves one way only: the difference is over what it moved.
        double h = 2 * c.step;
        if (c.kind == Control::Kind::Stage)
            h = std::get<Stage>(a.elements[c.element].kind).position_mm - std::get<Stage>(b.elements[c.element].kind).position_mm;
        if (ok && h != 0) j.col(k) = (plus - minus) / h;
    }
    return j;
}

Layout Aligner::align_nominal(const Layout& layout) {
    Layout l = layout;
    const auto n = static_cast<Eigen::Index>(controls_.size());
    step_matrix_ = Eigen::MatrixXd::Zero(n, static_cast<Eigen::Index>(rows_.size()));
    if (controls_.empty() || rows_.empty()) return l;
    Eigen::VectorXd r;
    for (int iteration = 0; iteration < 12; ++iteration) {
        TraceCache cache;
        if (!residuals(l, evaluate(l, cache, adjusted_), r)) break;
        if (r.cwiseAbs().maxCoeff() < 1e-4) break;
        const Eigen::MatrixXd j = jacobian(l);
        const Eigen::VectorXd du = -j.completeOrthogonalDecomposition().solve(r);
        if (!du.allFinite()) break;
        // Halve the step while it makes the residuals worse (far from the aligned state).
        double scale = 1;
        Eigen::VectorXd after;
        for (int k = 0; k < 8; ++k, scale /= 2) {
            Layout trial = l;
            apply(trial, scale * du);
            TraceCache c2;
            if (residuals(trial, evaluate(trial, c2, adjusted_), after) && after.norm() < r.norm()) {
                l = std::move(trial);
                break;
            }
        }
        if (after.size() == 0 || !(after.norm() < r.norm())) break;
    }
    const Eigen::MatrixXd j = jacobian(l);
    if (j.allFinite()) step_matrix_ = -j.completeOrthogonalDecomposition().pseudoInverse();
    return l;
}

Judgement Aligner::align_sample(Layout& l, TraceCache& cache) const {
    // The build differs from the previous sample almost everywhere: the first retrace starts
    // afresh (a retrace marked as not the last trace compares nothing and keeps nothing, without
    // testing every changed element against every other), and records what the alignment's
    // retraces, which name the adjusted elements only, keep.
    cache.retrace.forget();
    Evaluated e = evaluate(l, cache, adjusted_);
    if (!controls_.empty() && !rows_.empty()) {
        Eigen::VectorXd r;
        for (int s = 0; s < steps_; ++s) {
            if (!residuals(l, e, r)) break;
            apply(l, step_matrix_ * r);
            e = evaluate(l, cache, adjusted_);
        }
    }
    return judge_with(l, context_, e.at, e.delta_k_l);
}

}  // namespace rv
