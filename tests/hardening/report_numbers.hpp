#pragma once
// Every number of a rendezvous report with a name, so that a property test can say which one
// broke: the numbers `rendezvous report --json` prints (core/report/report_json.cpp) and the
// per-hit and envelope numbers behind them.

#include <string>
#include <utility>
#include <vector>

#include <nlohmann/json.hpp>

#include "analysis/report.hpp"
#include "report/report_words.hpp"
#include "report/verdict_json.hpp"

namespace rv::hardening {

using NamedNumbers = std::vector<std::pair<std::string, double>>;

inline NamedNumbers report_numbers(const RendezvousReport& r) {
    NamedNumbers out;
    auto add = [&](const std::string& name, double v) { out.emplace_back(name, v); };
    auto add_opt = [&](const std::string& name, const std::optional<double>& v) {
        if (v) add(name, *v);
    };
    auto add_plane = [&](const std::string& name, const PlaneAtTarget& p) {
        add(name + ".radius_um", p.radius_um);
        add(name + ".waist_um", p.waist_um);
        add(name + ".waist_offset_mm", p.waist_offset_mm);
        add(name + ".rayleigh_mm", p.rayleigh_mm);
    };
    add("crystal_length_mm", r.crystal_length_mm);
    for (const ReportBeam& b : r.beams) {
        const std::string n = "beams." + b.id;
        add(n + ".wavelength_nm", b.wavelength_nm);
        for (size_t i = 0; i < b.path.hits.size(); ++i) {
            const TraceHit& h = b.path.hits[i];
            const std::string hn = n + ".hits[" + std::to_string(i) + "]";
            add(hn + ".s_mm", h.s_mm);
            add(hn + ".point_mm.x", h.point_mm.x());
            add(hn + ".point_mm.y", h.point_mm.y());
            add(hn + ".aoi_rad", h.aoi_rad());
            add(hn + ".height_mm", h.height_mm);
            add(hn + ".index_after", h.index_after);
        }
        for (size_t i = 0; i < b.path.segments.size(); ++i)
            add(n + ".segments[" + std::to_string(i) + "].length_mm", b.path.segments[i].length_mm);
        for (size_t i = 0; i < b.caustic.at_hits.size(); ++i) {
            const BeamAtHit& w = b.caustic.at_hits[i];
            const std::string wn = n + ".elements[" + std::to_string(i) + "]";
            add(wn + ".radius_um.tangential", w.radius_tangential_um);
            add(wn + ".radius_um.sagittal", w.radius_sagittal_um);
            add(wn + ".clipping", w.clipped_fraction);
        }
        for (size_t i = 0; i < b.caustic.envelope.size(); ++i) {
            const EnvelopeSample& e = b.caustic.envelope[i];
            const std::string en = n + ".envelope[" + std::to_string(i) + "]";
            add(en + ".s_mm", e.s_mm);
            add(en + ".radius_tangential_um", e.radius_tangential_um);
            add(en + ".radius_sagittal_um", e.radius_sagittal_um);
        }
        if (b.at_target.reached) {
            const BeamAtTarget& t = b.at_target;
            add(n + ".path_mm", t.path_mm);
            add(n + ".arrival_fs", t.arrival_fs);
            add_plane(n + ".target.tangential", t.tangential);
            add_plane(n + ".target.sagittal", t.sagittal);
            add(n + ".target.confocal_mm.tangential", b.confocal_tangential_mm);
            add(n + ".target.confocal_mm.sagittal", b.confocal_sagittal_mm);
            add(n + ".target.hit_mm.x", t.hit_mm.x());
            add(n + ".target.hit_mm.y", t.hit_mm.y());
            add(n + ".target.angle_deg", b.crossing_angle_deg);
            add(n + ".target.index", t.index);
            add(n + ".target.vertical_offset_mm", t.vertical_mm);
            add(n + ".target.pulse.gdd_fs2", t.pulse.gdd_fs2);
            add(n + ".target.pulse.tod_fs3", t.pulse.tod_fs3);
            if (t.pulse.fwhm_fs) add(n + ".target.pulse.fwhm_fs", *t.pulse.fwhm_fs);
        }
    }
    if (r.mismatch) {
        const Mismatch& m = *r.mismatch;
        add("mismatch.waist_offset_mm", m.waist_offset_mm);
        add("mismatch.waist_offset_planes_mm.tangential", m.waist_offset_tangential_mm);
        add("mismatch.waist_offset_planes_mm.sagittal", m.waist_offset_sagittal_mm);
        add("mismatch.waist_ratio", m.waist_ratio);
        add("mismatch.lateral_um", m.lateral_um);
        add("mismatch.lateral_planes_um.tangential", m.lateral_tangential_um);
        add("mismatch.lateral_planes_um.sagittal", m.lateral_sagittal_um);
        add("mismatch.angle_mrad", m.angle_mrad);
        add("mismatch.delay_fs", m.delay_fs);
    }
    add_opt("mismatch.confocal_ratio", r.confocal_ratio);
    if (r.overlap) {
        add("overlap.spatial", r.overlap->spatial);
        add("overlap.spatial_along_crystal", r.overlap->spatial_along_crystal);
        add_opt("overlap.temporal", r.overlap->temporal);
        add("overlap.combined", r.overlap->combined);
    }
    if (r.stage) {
        const StageReport& s = *r.stage;
        add("stage.position_mm", s.position_mm);
        add("stage.delay_per_mm_fs", s.delay_per_mm_fs);
        add("stage.zero_delay_mm", s.zero_delay_mm);
        add("stage.move_mm", s.move_mm);
        add_opt("stage.measured_zero_mm", s.measured_zero_mm);
        add_opt("stage.emission_offset_fs", s.emission_offset_fs);
    }
    for (const PhaseMatchingReport& p : r.phase_matching) {
        const std::string n = "phase_matching[" + p.beams.first_beam + (p.beams.sum_frequency ? "+" + p.beams.second_beam : std::string()) + "]";
        add(n + ".output_nm", p.output_nm);
        add(n + ".theta_pm_deg", p.theta_pm_deg);
        add(n + ".theta_now_deg", p.theta_now_deg);
        add(n + ".incidence_now_deg", p.incidence_now_deg);
        add(n + ".incidence_needed_deg", p.incidence_needed_deg);
        add(n + ".rotate_by_deg", p.rotate_by_deg);
        add(n + ".delta_k_l", p.delta_k_l);
        add(n + ".sinc2_now", p.sinc2_now);
        add(n + ".walkoff_mrad", p.walkoff_mrad);
        add(n + ".angular_acceptance_mrad.internal_fwhm", p.angular_acceptance_internal_mrad);
        add(n + ".angular_acceptance_mrad.external_fwhm", p.angular_acceptance_external_mrad);
        add(n + ".spectral_acceptance_fwhm_nm", p.spectral_acceptance_nm);
        for (const GroupVelocityMismatch& g : p.gvm) {
            add(n + ".gvm[" + gvm_pair_text(p, g) + "].fs_per_mm", g.fs_per_mm);
            add_opt(n + ".gvm[" + gvm_pair_text(p, g) + "].walk_apart_mm", g.walk_apart_mm);
        }
    }
    for (const FocusingReport& f : r.focusing) {
        const std::string n = "focusing[" + f.beam + "]";
        add(n + ".xi", f.xi);
        add(n + ".h_m", f.h_m);
        add(n + ".sigma_m", f.sigma_m);
        add(n + ".walkoff_parameter", f.walkoff_parameter);
        add(n + ".h_m_walkoff", f.h_m_walkoff);
        add(n + ".xi_optimum", f.xi_optimum);
        add(n + ".h_mm", f.h_mm);
        add(n + ".waist_optimum_um", f.waist_optimum_um);
        add(n + ".focal_length_scale", f.focal_length_scale);
    }
    // The verdict's readings and actions as data (report/verdict_json.hpp): each number.
    for (const auto& [name, line] : {std::pair{"space", &r.verdict.space},
                                     std::pair{"time", &r.verdict.time},
                                     std::pair{"phase", &r.verdict.phase}}) {
        const std::string n = std::string("verdict.") + name;
        auto add_json = [&](const std::string& prefix, const nlohmann::json& j) {
            for (const auto& [key, value] : j.items())
                if (value.is_number()) add(prefix + "." + key, value.get<double>());
        };
        add_json(n + ".reading", verdict_reading_json(line->reading));
        for (size_t k = 0; k < line->actions.size(); ++k)
            add_json(n + ".actions[" + std::to_string(k) + "]", verdict_action_json(line->actions[k]));
    }
    return out;
}

}  // namespace rv::hardening
