#pragma once
// Alignment of a built table with its adjusters (goals.tolerance.adjust, layout.hpp
// ToleranceAdjusters), and the verdict of the aligned table, for the tolerance run.
//
// Controls and what each one restores (residuals, each made dimensionless):
//   stage S           position_mm          delay / cross-correlation FWHM (the pulses coincide)
//   walk of beam b    each mirror's turn   the chief ray's distance from the aim point in the
//                     (normal_deg)         target plane / the beam's radius there; with two
//                                          mirrors also the angle to the aim direction / the
//                                          beam's far-field angle (w0/z_R)
//   refocus lens L    along its beam (mm)  each beam through L: the distance of its waist
//                                          (mean of the planes) from the aim / its z_R
//   crystal X         normal_deg (optic    Δk·L/2 of the crystal's process (sinc² peaks at 0)
//                     axis in the table
//                     plane) or tilt_deg
//                     (vertical plane)
// The aim of a walk: the target centre and the beam's direction as designed when every beam
// has a walk; else the crossing point and direction of a beam without one (the walked beam is
// overlapped onto it, as the lab does). The aim of a refocus likewise: the target centre when
// every beam has a refocused lens, else the waist of a beam without one.
// Aim_at mirrors: a sample's mirror keeps the orientation the trace gave it in the nominal
// layout (aim_at is replaced by that normal_deg) plus its angle error; a walk turns it from
// there. So alignment restores what a lab restores by eye on its irises and cameras, and the
// mirrors that are not adjusters keep their errors.
//
// Method: Gauss–Newton. The nominal is aligned with a Jacobian by central differences at each
// step until the residuals are below 1e-4 (at most 12 steps). A sample is aligned with the
// pseudo-inverse of the aligned nominal's Jacobian, `steps` times (default 2): one evaluation as
// built and one after each step, all through the solvers' cached evaluation
// (evaluate_beams_at_target with the edited elements named), judged with the verdict's rules
// (analysis/verdict_rules.hpp) on the last one.

#include <Eigen/Core>
#include <optional>
#include <string>
#include <vector>

#include "analysis/report.hpp"
#include "analysis/target_summary.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"
#include "nonlinear/phase_matching.hpp"
#include "trace/trace_cache.hpp"

namespace rv {

struct Figures {
    bool valid = false;  // both beams (or the one) reached the target
    double waist_offset_mm = 0, waist_ratio = 1, lateral_um = 0, delay_fs = 0, overlap = 0;
};

// The figures of one evaluation (mismatch_at_target and overlap_at_target of the two beams).
Figures figures_of(const Layout& layout, const std::vector<BeamAtTarget>& at);

// The adjusters resolved to element indices.
struct Adjusters {
    std::optional<size_t> stage;
    struct Walk {
        size_t beam = 0;
        std::vector<size_t> mirrors;  // one or two, in path order
    };
    std::vector<Walk> walks;
    std::vector<size_t> refocus;
    std::optional<size_t> crystal;
    bool crystal_tilts = false;  // optic axis in the vertical plane: tilt_deg, else normal_deg
    bool empty() const { return !stage && walks.empty() && refocus.empty() && !crystal; }
    bool operator==(const Adjusters&) const = default;
};

// goals.tolerance.adjust resolved against the traced layout, or the defaults when the key is
// absent (the report's stage; for each beam the aim_at mirrors on its path, the last two).
// error non-empty: an adjuster that cannot work (a walk mirror the beam does not reflect from,
// two walks of one beam, a refocus lens on no path), at error_pointer.
struct AdjusterChoice {
    Adjusters adjusters;
    std::string error_pointer, error;
};
AdjusterChoice resolve_adjusters(const Layout& layout, const MaterialLibrary& library, const RendezvousReport& nominal);

// The adjusters in words, one entry each ("stage S1 re-zeroed", "M1_P + M2_P walk pump onto
// the target", …).
std::vector<std::string> adjuster_texts(const Layout& layout, const Adjusters& a);

// What the verdict needs beyond the beams at the target, from the nominal report: the
// crystal's process (it does not change with build errors, nor do the polarizations).
struct JudgeContext {
    VerdictThresholds thresholds;
    size_t target = 0;  // element index
    bool two_beams = false;
    bool time_judged = false;  // both pulse lengths given
    double cross_correlation_fs = 0;
    bool phase_applies = false;  // the target is a crystal
    bool process = false;        // a process to judge (else phase fails where it applies)
    const Material* material = nullptr;
    double first_nm = 0, second_nm = 0;
    MixingType mixing = MixingType::TypeI;
    size_t first_beam = 0;
    bool phase_matchable = false, polarizations_suit = false;
};
JudgeContext judge_context(const Layout& layout, const MaterialLibrary& library, const RendezvousReport& nominal);

struct Judgement {
    bool space = false, time = false, phase = false;  // each verdict line passes (met or n/a)
    bool pass() const { return figures.valid && space && time && phase; }
    Figures figures;
    double phase_factor = 0;  // sinc², 0 where there is no process
};

// One evaluation's figures and verdict (no alignment).
Judgement judge(const Layout& layout, const JudgeContext& context, const std::vector<BeamAtTarget>& at);

class Aligner {
public:
    Aligner(const Layout& layout, const MaterialLibrary& library, JudgeContext context, Adjusters adjusters,
            int steps = 2);
    // `layout` aligned until its residuals vanish (or stop changing); the pseudo-inverse for the
    // samples is taken there. Call once before align_sample.
    Layout align_nominal(const Layout& layout);
    // A built sample aligned in place and judged. The cache is one thread's, kept from sample
    // to sample (its first retrace of a sample starts afresh; the alignment's retraces name
    // the adjusted elements).
    Judgement align_sample(Layout& l, TraceCache& cache) const;
    // The elements the adjusters change.
    const std::vector<size_t>& adjusted_elements() const { return adjusted_; }
    const Adjusters& adjusters() const { return adjusters_; }
    const JudgeContext& context() const { return context_; }

private:
    struct Control {
        enum class Kind { Stage, Turn, Move, Tilt } kind;
        size_t element;
        Vec2 direction{1, 0};
        double step;
    };
    struct Row {
        enum class Kind { Delay, Lateral, Direction, Focus, Phase } kind;
        size_t beam = 0;
    };
    struct Evaluated {
        std::vector<BeamAtTarget> at;
        double delta_k_l = 0;
    };
    Evaluated evaluate(const Layout& l, TraceCache& cache, const std::vector<size_t>& edited) const;
    bool residuals(const Layout& l, const Evaluated& e, Eigen::VectorXd& r) const;
    void apply(Layout& l, const Eigen::VectorXd& du) const;
    Eigen::MatrixXd jacobian(const Layout& l) const;
    Judgement judge_evaluated(const Layout& l, const Evaluated& e) const;

    const MaterialLibrary& library_;
    JudgeContext context_;
    Adjusters adjusters_;
    int steps_;
    std::vector<Control> controls_;
    std::vector<Row> rows_;
    std::vector<size_t> adjusted_;
    std::vector<bool> walked_, refocused_;  // by beam
    bool all_walked_ = false, all_refocused_ = false;
    std::vector<Vec2> design_direction_;  // by beam, at the target
    std::vector<double> lateral_scale_mm_, angle_scale_rad_, rayleigh_mm_;
    Eigen::MatrixXd step_matrix_;  // −pinv(J) at the aligned nominal
};

}  // namespace rv
