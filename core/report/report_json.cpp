#include "report/report_json.hpp"

#include <cmath>

#include "findings/finding_json.hpp"
#include "polarization/polarization_model.hpp"
#include "report/report_output_format.hpp"
#include "report/report_words.hpp"
#include "report/safety_cautions.hpp"
#include "report/verdict_json.hpp"
#include "report/verdict_words.hpp"

namespace rv {

namespace {

using nlohmann::json;

std::vector<std::string> invisible_texts(const RendezvousReport& r) {
    std::vector<std::string> out;
    for (const InvisibleLight& l : r.invisible) out.push_back(invisible_light_text(l));
    return out;
}

json planes(double t, double s) {
    return {{"tangential", t}, {"sagittal", s}};
}
json optional_number(const std::optional<double>& v) {
    return v ? json(*v) : json(nullptr);
}
json optional_text(const std::optional<std::string>& s) {
    return s ? json(*s) : json(nullptr);
}
// Absent text is null, never "".
json optional_text(const std::string& s) {
    return s.empty() ? json(nullptr) : json(s);
}

// Null when the power trace did not reach the target; azimuth_deg null for circular or
// unpolarized light (describe in polarization_model.hpp).
json polarization_json(const ReportBeam& b) {
    if (!b.power.reached) return nullptr;
    const PolarizationState& s = b.at_target_polarization;
    return {{"state", describe_text(s)},
            {"horizontal_fraction", s.h},
            {"vertical_fraction", s.v},
            {"degree", s.degree},
            {"azimuth_deg", optional_number(s.azimuth_deg)},
            {"ellipticity_deg", s.ellipticity_deg}};
}

json power_json(const ReportBeam& b) {
    json losses = json::array();
    for (const PowerLoss& l : b.power.losses)
        losses.push_back({{"element", l.element},
                          {"what", l.what},
                          {"fraction", l.fraction},
                          {"goes_to", optional_text(l.goes_to)}});
    json plates = json::array();
    for (const WavePlatePass& p : b.power.plates)
        plates.push_back({{"id", p.id},
                          {"retardance_waves", p.retardance_waves},
                          {"fast_axis_deg", p.fast_axis_deg}});
    return {{"source_mw", optional_number(b.source_power_mw)},
            {"losses", losses},
            {"left_at_end_fraction", b.power.end_fraction},
            {"wave_plates", plates}};
}

json target_json(const ReportBeam& b) {
    const BeamAtTarget& t = b.at_target;
    auto pulse = [](const std::optional<PulseFigures>& p, double PulseFigures::*figure) {
        return p ? json((*p).*figure) : json(nullptr);
    };
    return {{"radius_um", planes(t.tangential.radius_um, t.sagittal.radius_um)},
            {"waist_um", planes(t.tangential.waist_um, t.sagittal.waist_um)},
            {"waist_offset_mm", planes(t.tangential.waist_offset_mm, t.sagittal.waist_offset_mm)},
            {"rayleigh_mm", planes(t.tangential.rayleigh_mm, t.sagittal.rayleigh_mm)},
            {"confocal_mm", planes(b.confocal_tangential_mm, b.confocal_sagittal_mm)},
            {"hit_mm", {t.hit_mm.x(), t.hit_mm.y()}},
            {"angle_deg", b.crossing_angle_deg},
            {"index", t.index},
            {"power_fraction", b.power.reached ? json(b.power.at_target[0]) : json(nullptr)},
            {"power_mw", optional_number(b.target_power_mw)},
            {"peak_intensity_w_cm2", pulse(b.pulse_at_target, &PulseFigures::peak_intensity_w_cm2)},
            {"peak_fluence_j_cm2", pulse(b.pulse_at_target, &PulseFigures::peak_fluence_j_cm2)},
            {"peak_intensity_at_waist_w_cm2",
             pulse(b.pulse_at_waist, &PulseFigures::peak_intensity_w_cm2)},
            {"polarization", polarization_json(b)},
            {"vertical_offset_mm", t.vertical_mm},
            {"pulse",
             {{"gdd_fs2", t.pulse.gdd_fs2},
              {"tod_fs3", t.pulse.tod_fs3},
              {"fwhm_fs", optional_number(t.pulse.fwhm_fs)},
              {"compensation_gdd_fs2", t.pulse.compensation_gdd_fs2()}}}};
}

json mismatch_json(const Mismatch& m, const std::optional<double>& confocal_ratio) {
    return {{"waist_offset_mm", m.waist_offset_mm},
            {"waist_offset_planes_mm",
             planes(m.waist_offset_tangential_mm, m.waist_offset_sagittal_mm)},
            {"waist_ratio", m.waist_ratio},
            {"confocal_ratio", optional_number(confocal_ratio)},
            {"lateral_um", m.lateral_um},
            {"lateral_planes_um", planes(m.lateral_tangential_um, m.lateral_sagittal_um)},
            {"angle_mrad", m.angle_mrad},
            {"delay_fs", m.delay_fs}};
}

// Along a crystal only when the target is one.
json overlap_json(const OverlapReport& o, bool target_is_crystal) {
    return {{"spatial", o.spatial},
            {"spatial_along_crystal",
             target_is_crystal ? json(o.spatial_along_crystal) : json(nullptr)},
            {"temporal", optional_number(o.temporal)},
            {"combined", o.combined}};
}

}  // namespace

// `met` is null when the line does not apply (`applies` false: phase without a crystal).
// `summary` and `action` are the line's words (report/verdict_words.hpp); `reading` and
// `actions` the same as data (report/verdict_json.hpp).
void to_json(json& j, const VerdictLine& l) {
    json actions = json::array();
    for (const VerdictAction& a : l.actions) actions.push_back(verdict_action_json(a));
    j = {{"applies", l.applies},
         {"met", l.applies ? json(l.met) : json(nullptr)},
         {"summary", verdict_reading_text(l.reading)},
         {"action", optional_text(verdict_actions_text(l))},
         {"reading", verdict_reading_json(l.reading)},
         {"actions", actions}};
}

void to_json(json& j, const Verdict& v) {
    j = {{"space", v.space}, {"time", v.time}, {"phase", v.phase}};
}

json verdict_states_json(const Verdict& v) {
    auto state = [](const VerdictLine& l) { return json(verdict_state_text(l)); };
    return {{"space", state(v.space)}, {"time", state(v.time)}, {"phase", state(v.phase)}};
}

json verdict_met_json(const Verdict& v) {
    auto met = [](const VerdictLine& l) { return l.applies ? json(l.met) : json(nullptr); };
    return {{"space", met(v.space)}, {"time", met(v.time)}, {"phase", met(v.phase)}};
}

void to_json(json& j, const GroupVelocityMismatch& g) {
    auto pol = [](Polarity p) { return p == Polarity::A ? "o" : "e"; };
    j = {         {"waves", {g.first_wave, g.second_wave}},
         {"polarities", {pol(g.first_polarity), pol(g.second_polarity)}},
         {"fs_per_mm", g.fs_per_mm},
         {"walk_apart_mm", optional_number(g.walk_apart_mm)}};
}

// Each pair as data with its words ("between").
json gvm_json(const PhaseMatchingReport& p) {
    json out = json::array();
    for (const GroupVelocityMismatch& g : p.gvm) {
        json e = g;
        e["between"] = gvm_pair_text(p, g);
        out.push_back(std::move(e));
    }
    return out;
}

void to_json(json& j, const PhaseMatchingReport& p) {
    // Outside the index data nothing but the geometry is computed; without phase matching, no
    // figure of the phase-matching angle (PhaseMatchingReport): those are null, not 0.
    const bool indexed = !p.outside_index_data;
    auto if_indexed = [&](double v) { return indexed ? json(v) : json(nullptr); };
    auto if_matchable = [&](double v) { return p.phase_matchable ? json(v) : json(nullptr); };
    auto found = [&](double v) {
        return p.phase_matchable && p.rotation_found ? json(v) : json(nullptr);
    };
    j = {{"process", process_beams_text(p.beams)},
         {"type", mixing_type_label(p.mixing)},
         {"output_nm", p.output_nm},
         {"phase_matchable", p.phase_matchable},
         {"theta_pm_deg", if_matchable(p.theta_pm_deg)},
         {"theta_now_deg", p.theta_now_deg},
         {"incidence_now_deg", if_indexed(p.incidence_now_deg)},
         {"rotation", p.rotation == CrystalRotation::Turn ? "turn" : "tilt"},
         {"incidence_needed_deg", found(p.incidence_needed_deg)},
         {"rotate_by_deg", found(p.rotate_by_deg)},
         {"rotation_axis", p.phase_matchable ? json(crystal_rotation_axis_text(p.rotation)) : json(nullptr)},
         {"delta_k_l", if_indexed(p.delta_k_l)},
         {"sinc2_now", if_indexed(p.sinc2_now)},
         {"outside_index_data", p.outside_index_data ? json(index_gap_text(*p.outside_index_data)) : json(nullptr)},
         {"walkoff_mrad", if_matchable(p.walkoff_mrad)},
         {"angular_acceptance_mrad",
          {{"internal_fwhm", if_matchable(p.angular_acceptance_internal_mrad)},
           {"external_fwhm", if_matchable(p.angular_acceptance_external_mrad)}}},
         {"spectral_acceptance_fwhm_nm", if_matchable(p.spectral_acceptance_nm)},
         {"gvm", gvm_json(p)},
         {"spectral_acceptance_tunes", p.spectral_tuned_beam},
         {"spectral_acceptance_holds", p.spectral_held_beam ? json(*p.spectral_held_beam) : json(nullptr)},
         {"temperature", p.temperature ? json{{"now_c", p.temperature->now_c},
                                              {"phase_matching_c", optional_number(p.temperature->phase_matching_c)},
                                              {"acceptance_fwhm_c", optional_number(p.temperature->acceptance_fwhm_c)}}
                                        : json(nullptr)},
         {"polarizations_suit", p.polarizations_suit},
         {"polarization_note", verdict_action_text(p.polarization_need)}};
}

void to_json(json& j, const StageReport& s) {
    j = {{"id", s.id},
         {"beam", s.beam},
         {"position_mm", s.position_mm},
         {"zero_delay_mm", s.zero_delay_mm},
         {"zero_in_travel", s.zero_in_travel},
         {"move_mm", s.move_mm},
         {"delay_per_mm_fs", s.delay_per_mm_fs},
         {"measured_zero_mm", optional_number(s.measured_zero_mm)},
         {"emission_offset_fs", optional_number(s.emission_offset_fs)}};
}

void to_json(json& j, const PolarizationAdvice& a) {
    json plates = json::array();
    for (const PolarizationAdvice::PlateSetting& p : a.plates)
        plates.push_back({{"id", p.plate},
                          {"now_deg", p.now_deg},
                          {"best_deg", p.best_deg},
                          {"useful_now_fraction", p.useful_now},
                          {"useful_best_fraction", p.useful_best}});
    j = {{"beam", a.beam},
         {"needs", needed_polarization_text(a)},
         {"useful_fraction", a.useful_fraction},
         {"useful_mw", optional_number(a.useful_mw)},
         {"plate", optional_text(a.plate)},
         {"plate_now_deg", optional_number(a.plate_now_deg)},
         {"plate_best_deg", optional_number(a.plate_best_deg)},
         {"useful_fraction_best", optional_number(a.useful_fraction_best)},
         {"useful_mw_best", optional_number(a.useful_mw_best)},
         {"action", optional_text(polarization_advice_text(a))},
         {"wave_plates", plates}};
}

void to_json(json& j, const FocusingReport& f) {
    j = {{"beam", f.beam},
         {"xi", f.xi},
         {"h_m", f.h_m},
         {"sigma_m", f.sigma_m},
         {"walkoff_parameter", f.walkoff_parameter},
         {"h_m_walkoff", f.h_m_walkoff},
         {"sigma_m_walkoff", f.sigma_m_walkoff},
         {"xi_optimum", f.xi_optimum},
         {"h_mm", f.h_mm},
         {"confocal_optimum_mm", f.confocal_optimum_mm},
         {"waist_now_um", f.waist_now_um},
         {"waist_optimum_um", f.waist_optimum_um},
         {"focal_length_scale", f.focal_length_scale}};
}

void to_json(json& j, const ReportBeam& b) {
    // The hits the beam's figures reach: a beam whose Gaussian parameter stopped being finite
    // (the not-finite finding names where) is listed up to the hit before, never with a NaN.
    json elements = json::array();
    for (size_t i = 0; i < b.path.hits.size() && i < b.caustic.at_hits.size(); ++i) {
        const TraceHit& h = b.path.hits[i];
        const BeamAtHit& w = b.caustic.at_hits[i];
        if (!std::isfinite(w.radius_tangential_um) || !std::isfinite(w.radius_sagittal_um) ||
            !std::isfinite(w.clipped_fraction) || !std::isfinite(h.s_mm))
            break;
        elements.push_back({{"id", b.element_ids[i]},
                            {"s_mm", h.s_mm},
                            {"radius_um", planes(w.radius_tangential_um, w.radius_sagittal_um)},
                            {"clipping", w.clipped_fraction}});
    }
    j = {{"wavelength_nm", b.wavelength_nm},
         {"reaches_target", b.at_target.reached},
         {"elements", elements},
         {"unconverted_light", after_target_text(b)}};
    if (b.at_target.reached) {
        j["path_mm"] = b.at_target.path_mm;
        j["arrival_fs"] = b.at_target.arrival_fs;
        j["target"] = target_json(b);
    }
    j["power"] = power_json(b);
}

void to_json(json& j, const MaterialDataReport& m) {
    j = {{"name", m.name},
         {"source", m.source},
         {"min_wavelength_nm", m.min_wavelength_nm},
         {"max_wavelength_nm", m.max_wavelength_nm},
         {"used_by", m.used_by}};
}

void to_json(json& j, const RendezvousReport& r) {
    json beams = json::object();
    for (const ReportBeam& b : r.beams) beams[b.id] = b;
    j = {{"layout", r.layout_name}, {"target", r.target}, {"verdict", r.verdict}, {"beams", beams}};
    if (r.mismatch) j["mismatch"] = mismatch_json(*r.mismatch, r.confocal_ratio);
    if (r.overlap) j["overlap"] = overlap_json(*r.overlap, r.target_is_crystal);
    if (r.stage) j["stage"] = *r.stage;
    j["polarization"] = r.polarization;
    if (!r.phase_matching.empty()) {
        // The process the crystal is set for, with every process (itself first) inside it.
        j["phase_matching"] = r.phase_matching.front();
        j["phase_matching"]["processes"] = r.phase_matching;
    }
    j["focusing"] = r.focusing;
    j["materials"] = r.materials;
    j["generated"] = r.generated ? json(*r.generated) : json(nullptr);
    j["b_integral"] = r.b_integral;
    j["damage_thresholds"] = r.damage_thresholds;
    json warnings = json::array();
    for (const Finding& f : r.findings) warnings.push_back(finding_json(f));
    j["warnings"] = warnings;
    json unconverted = json::array();
    for (const ReportBeam& b : r.beams) unconverted.push_back(b.id + ": " + after_target_text(b));
    j["safety"] = {
        {"invisible", invisible_texts(r)}, {"unconverted", unconverted}, {"cautions", safety_cautions()}};
}

}  // namespace rv
