// rendezvous report: the verdict, each beam at the target, mismatch, delay, overlap, phase
// matching, focusing, findings and safety; as text, JSON or Markdown.
#include <cmath>
#include <cstdio>
#include <nlohmann/json.hpp>
#include <ostream>

#include "analysis/report.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "cli/safety_notice.hpp"
#include "findings/finding_json.hpp"
#include "io/layout_reader.hpp"
#include "units/number_text.hpp"

namespace rv::cli {

namespace {

using nlohmann::json;

// Every number of the text and Markdown by the shared rule (units/number_text.hpp).
std::string fmt(const char* format, double v) { return format_number(format, v); }

json planes(double t, double s) { return {{"tangential", t}, {"sagittal", s}}; }
json optional_number(const std::optional<double>& v) { return v ? json(*v) : json(nullptr); }
// Absent text is null, never "".
json optional_text(const std::string& s) { return s.empty() ? json(nullptr) : json(s); }
// `met` is null when the line does not apply (`applies` false: phase without a crystal).
json verdict_json(const VerdictLine& l) {
    return {{"applies", l.applies}, {"met", l.applies ? json(l.met) : json(nullptr)}, {"summary", l.summary},
            {"action", optional_text(l.action)}};
}

json phase_json(const PhaseMatchingReport& p) {
    json gvm = json::array();
    for (const GroupVelocityMismatch& g : p.gvm)
        gvm.push_back({{"between", g.between}, {"fs_per_mm", g.fs_per_mm}, {"walk_apart_mm", optional_number(g.walk_apart_mm)}});
    // Outside the index data nothing but the geometry is computed; without phase matching, no
    // figure of the phase-matching angle (PhaseMatchingReport): those are null, not 0.
    const bool indexed = p.outside_index_data.empty();
    auto if_indexed = [&](double v) { return indexed ? json(v) : json(nullptr); };
    auto if_matchable = [&](double v) { return p.phase_matchable ? json(v) : json(nullptr); };
    auto found = [&](double v) { return p.phase_matchable && p.rotation_found ? json(v) : json(nullptr); };
    return {{"process", p.process}, {"type", p.type}, {"output_nm", p.output_nm},
            {"phase_matchable", p.phase_matchable}, {"theta_pm_deg", if_matchable(p.theta_pm_deg)},
            {"theta_now_deg", p.theta_now_deg}, {"incidence_now_deg", if_indexed(p.incidence_now_deg)},
            {"rotation", p.rotation == CrystalRotation::Turn ? "turn" : "tilt"},
            {"incidence_needed_deg", found(p.incidence_needed_deg)},
            {"rotate_by_deg", found(p.rotate_by_deg)}, {"rotation_axis", optional_text(p.rotation_axis)},
            {"delta_k_l", if_indexed(p.delta_k_l)}, {"sinc2_now", if_indexed(p.sinc2_now)},
            {"outside_index_data", optional_text(p.outside_index_data)},
            {"walkoff_mrad", if_matchable(p.walkoff_mrad)},
            {"angular_acceptance_mrad", {{"internal_fwhm", if_matchable(p.angular_acceptance_internal_mrad)},
                                         {"external_fwhm", if_matchable(p.angular_acceptance_external_mrad)}}},
            {"spectral_acceptance_fwhm_nm", if_matchable(p.spectral_acceptance_nm)}, {"gvm", gvm},
            {"polarizations_suit", p.polarizations_suit}, {"polarization_note", p.polarization_note}};
}

// Null when the power trace did not reach the target; azimuth_deg null for circular or
// unpolarized light (describe in polarization_model.hpp).
json polarization_json(const ReportBeam& b) {
    if (!b.power.reached) return nullptr;
    const PolarizationState& s = b.at_target_polarization;
    return {{"state", describe_text(s)}, {"horizontal_fraction", s.h}, {"vertical_fraction", s.v},
            {"degree", s.degree}, {"azimuth_deg", optional_number(s.azimuth_deg)}, {"ellipticity_deg", s.ellipticity_deg}};
}

json power_json(const Layout& layout, const ReportBeam& b) {
    json losses = json::array();
    for (const PowerLoss& l : b.power.losses)
        losses.push_back({{"element", l.element}, {"what", l.what}, {"fraction", l.fraction}, {"goes_to", optional_text(l.goes_to)}});
    json plates = json::array();
    for (const WavePlatePass& p : b.power.plates)
        plates.push_back({{"id", p.id}, {"retardance_waves", p.retardance_waves},
                          {"fast_axis_deg", p.fast_axis_deg}});
    const double source_mw = layout.beams[b.path.beam].power_mw;
    return {{"source_mw", source_mw > 0 ? json(source_mw) : json(nullptr)}, {"losses", losses},
            {"left_at_end_fraction", b.power.end_fraction}, {"wave_plates", plates}};
}

json plate_settings_json(const PolarizationAdvice& a) {
    json plates = json::array();
    for (const PolarizationAdvice::PlateSetting& p : a.plates)
        plates.push_back({{"id", p.plate}, {"now_deg", p.now_deg}, {"best_deg", p.best_deg},
                          {"useful_now_fraction", p.useful_now}, {"useful_best_fraction", p.useful_best}});
    return plates;
}

json to_json(const Layout& layout, const RendezvousReport& r) {
    json beams = json::object();
    for (const ReportBeam& b : r.beams) {
        json elements = json::array();
        for (size_t i = 0; i < b.path.hits.size(); ++i) {
            const TraceHit& h = b.path.hits[i];
            const BeamAtHit& w = b.caustic.at_hits[i];
            elements.push_back({{"id", layout.elements[h.element].id}, {"s_mm", h.s_mm},
                                {"radius_um", planes(w.radius_tangential_um, w.radius_sagittal_um)},
                                {"clipping", w.clipped_fraction}});
        }
        json beam = {{"wavelength_nm", b.wavelength_nm}, {"reaches_target", b.at_target.reached},
                     {"elements", elements}, {"unconverted_light", after_target_text(b)}};
        if (b.at_target.reached) {
            const BeamAtTarget& t = b.at_target;
            beam["path_mm"] = t.path_mm;
            beam["arrival_fs"] = t.arrival_fs;
            beam["target"] = {
                {"radius_um", planes(t.tangential.radius_um, t.sagittal.radius_um)},
                {"waist_um", planes(t.tangential.waist_um, t.sagittal.waist_um)},
                {"waist_offset_mm", planes(t.tangential.waist_offset_mm, t.sagittal.waist_offset_mm)},
                {"rayleigh_mm", planes(t.tangential.rayleigh_mm, t.sagittal.rayleigh_mm)},
                {"confocal_mm", planes(b.confocal_tangential_mm, b.confocal_sagittal_mm)},
                {"hit_mm", {t.hit_mm.x(), t.hit_mm.y()}},
                {"angle_deg", b.crossing_angle_deg},
                {"index", t.index},
                {"power_fraction", b.power.reached ? json(b.power.at_target[0]) : json(nullptr)},
                {"power_mw", optional_number(b.target_power_mw)},
                {"peak_intensity_w_cm2", b.pulse_at_target ? json(b.pulse_at_target->peak_intensity_w_cm2) : json(nullptr)},
                {"peak_fluence_j_cm2", b.pulse_at_target ? json(b.pulse_at_target->peak_fluence_j_cm2) : json(nullptr)},
                {"peak_intensity_at_waist_w_cm2", b.pulse_at_waist ? json(b.pulse_at_waist->peak_intensity_w_cm2) : json(nullptr)},
                {"polarization", polarization_json(b)}};
        }
        beam["power"] = power_json(layout, b);
        beams[b.id] = beam;
    }
    json out = {{"layout", r.layout_name}, {"target", r.target},
                {"verdict", {{"space", verdict_json(r.verdict.space)}, {"time", verdict_json(r.verdict.time)},
                             {"phase", verdict_json(r.verdict.phase)}}},
                {"beams", beams}};
    if (r.mismatch) {
        const Mismatch& m = *r.mismatch;
        out["mismatch"] = {{"waist_offset_mm", m.waist_offset_mm},
                           {"waist_offset_planes_mm", planes(m.waist_offset_tangential_mm, m.waist_offset_sagittal_mm)},
                           {"waist_ratio", m.waist_ratio}, {"confocal_ratio", optional_number(r.confocal_ratio)},
                           {"lateral_um", m.lateral_um}, {"angle_mrad", m.angle_mrad}, {"delay_fs", m.delay_fs}};
    }
    if (r.overlap)  // along a crystal only when the target is one
        out["overlap"] = {{"spatial", r.overlap->spatial},
                          {"spatial_along_crystal", r.target_is_crystal ? json(r.overlap->spatial_along_crystal) : json(nullptr)},
                          {"temporal", optional_number(r.overlap->temporal)}, {"combined", r.overlap->combined}};
    if (r.stage) {
        const StageReport& s = *r.stage;
        out["stage"] = {{"id", s.id}, {"beam", s.beam}, {"position_mm", s.position_mm},
                        {"zero_delay_mm", s.zero_delay_mm}, {"zero_in_travel", s.zero_in_travel},
                        {"move_mm", s.move_mm}, {"delay_per_mm_fs", s.delay_per_mm_fs},
                        {"measured_zero_mm", optional_number(s.measured_zero_mm)},
                        {"emission_offset_fs", optional_number(s.emission_offset_fs)}};
    }
    json advice = json::array();
    for (const PolarizationAdvice& a : r.polarization)
        advice.push_back({{"beam", a.beam}, {"needs", needed_polarization_text(a)},
                          {"useful_fraction", a.useful_fraction}, {"useful_mw", optional_number(a.useful_mw)},
                          {"plate", a.plate ? json(*a.plate) : json(nullptr)},
                          {"plate_now_deg", optional_number(a.plate_now_deg)},
                          {"plate_best_deg", optional_number(a.plate_best_deg)},
                          {"useful_fraction_best", optional_number(a.useful_fraction_best)},
                          {"useful_mw_best", optional_number(a.useful_mw_best)},
                          {"action", optional_text(polarization_advice_text(a))}, {"wave_plates", plate_settings_json(a)}});
    out["polarization"] = advice;
    if (!r.phase_matching.empty()) {
        out["phase_matching"] = phase_json(r.phase_matching.front());
        json all = json::array();
        for (const PhaseMatchingReport& p : r.phase_matching) all.push_back(phase_json(p));
        out["phase_matching"]["processes"] = all;
    }
    json focusing = json::array();
    for (const FocusingReport& f : r.focusing)
        focusing.push_back({{"beam", f.beam}, {"xi", f.xi}, {"h_m", f.h_m}, {"sigma_m", f.sigma_m},
                            {"walkoff_parameter", f.walkoff_parameter}});
    out["focusing"] = focusing;
    json warnings = json::array();
    for (const Finding& f : r.findings) warnings.push_back(finding_json(f));
    out["warnings"] = warnings;
    json unconverted = json::array();
    for (const ReportBeam& b : r.beams) unconverted.push_back(b.id + ": " + after_target_text(b));
    out["safety"] = {{"invisible", r.invisible}, {"unconverted", unconverted},
                     {"cautions", safety_cautions()}};
    return out;
}

std::string percent(double fraction) { return fmt("%.1f", 100 * fraction) + " %"; }

void print_power(const RendezvousReport& r, std::ostream& out) {
    out << "\nPower and polarization at the target (estimates for alignment and damage, not exposure limits)\n";
    for (const ReportBeam& b : r.beams) {
        if (!b.power.reached) continue;
        out << "  " << b.id << ": " << percent(b.power.at_target[0]) << " of the source";
        if (b.target_power_mw) out << " = " << fmt("%.1f", *b.target_power_mw) << " mW";
        out << ", " << describe_text(b.at_target_polarization);
        if (b.pulse_at_target)
            out << "; " << fmt("%.3g", b.pulse_at_target->energy_uj) << " µJ, peak "
                << fmt("%.3g", b.pulse_at_target->peak_intensity_w_cm2 * 1e-9) << " GW/cm² and "
                << fmt("%.3g", b.pulse_at_target->peak_fluence_j_cm2 * 1e3) << " mJ/cm² at the target plane"
                << (b.pulse_at_waist ? ", " + fmt("%.3g", b.pulse_at_waist->peak_intensity_w_cm2 * 1e-9) + " GW/cm² at its waist" : "");
        out << "\n";
        for (const WavePlatePass& p : b.power.plates)
            out << "    " << p.id << ": retardance " << fmt("%.4f", p.retardance_waves) << " waves at "
                << fmt("%.0f", b.wavelength_nm) << " nm, fast axis " << fmt("%.1f", p.fast_axis_deg) << "°\n";
        for (const PowerLoss& l : b.power.losses)
            if (l.fraction >= 5e-4)  // the JSON lists every loss; the text those of 0.05 % or more
            out << "    " << l.element << ": " << percent(l.fraction) << " " << l.what
                << (l.goes_to.empty() ? "" : ", " + l.goes_to) << "\n";
    }
    for (const PolarizationAdvice& a : r.polarization) {
        const std::string needs = needed_polarization_text(a), action = polarization_advice_text(a);
        out << "  " << a.beam << " needs " << needs << ": " << percent(a.useful_fraction) << " of it is";
        if (a.useful_mw) out << " (" << fmt("%.1f", *a.useful_mw) << " mW)";
        out << (action.empty() ? "" : "; " + action) << "\n";
        for (const PolarizationAdvice::PlateSetting& p : a.plates) {
            out << "    " << p.plate << " at " << fmt("%.1f", p.now_deg) << "°: " << percent(p.useful_now)
                << " of the source in " << needs << "; the most, " << percent(p.useful_best) << ", at "
                << fmt("%.1f", p.best_deg) << "°\n";
        }
    }
}

void print_text(const RendezvousReport& r, std::ostream& out) {
    out << "Rendezvous report: " << r.layout_name << "\nTarget: " << r.target << "\n\n";
    out << "Verdict\n";
    for (const auto& [name, line] : {std::pair{"space", &r.verdict.space}, std::pair{"time", &r.verdict.time},
                                     std::pair{"phase", &r.verdict.phase}}) {
        out << "  " << name << (std::string(7 - std::string(name).size(), ' ')) << verdict_line_text(*line) << "\n";
        if (!line->action.empty()) out << "         -> " << line->action << "\n";
    }
    out << "\nAt the target (t = tangential, in the table plane; s = sagittal)\n"
        << "  beam       λ nm     path mm   arrival ps   radius µm t/s   waist µm t/s    waist offset mm t/s  Rayleigh mm t/s\n";
    for (const ReportBeam& b : r.beams) {
        const BeamAtTarget& t = b.at_target;
        char line[320];
        if (!t.reached)
            std::snprintf(line, sizeof line, "  %-10s %-8.1f does not reach the target\n", b.id.c_str(), b.wavelength_nm);
        else
            std::snprintf(line, sizeof line,
                          "  %-10s %-8.1f %-9.2f %-12.4f %6.1f/%-8.1f %6.2f/%-8.2f %7s/%-12s %6.3f/%.3f\n",
                          b.id.c_str(), b.wavelength_nm, t.path_mm, t.arrival_fs * 1e-3, t.tangential.radius_um,
                          t.sagittal.radius_um, t.tangential.waist_um, t.sagittal.waist_um,
                          fmt("%+.3f", t.tangential.waist_offset_mm).c_str(),  // signed: never "-0.000"
                          fmt("%+.3f", t.sagittal.waist_offset_mm).c_str(), t.tangential.rayleigh_mm,
                          t.sagittal.rayleigh_mm);
        out << line;
    }
    print_power(r, out);
    if (r.mismatch) {
        const Mismatch& m = *r.mismatch;
        out << "\nMismatch (" << r.beams[1].id << " relative to " << r.beams[0].id << ")\n"
            << "  waist offset " << fmt("%+.3f", m.waist_offset_mm) << " mm, waist ratio " << fmt("%.3f", m.waist_ratio)
            << ", confocal ratio " << fmt("%.3f", r.confocal_ratio.value_or(0)) << ", lateral "
            << fmt("%.1f", m.lateral_um) << " µm, angle " << fmt("%.3f", m.angle_mrad) << " mrad\n"
            << "  delay (" << r.beams[0].id << " − " << r.beams[1].id << ") " << format_duration_fs(m.delay_fs, true) << "\n";
    }
    if (r.overlap) {
        out << "\nOverlap  spatial "
            << (r.target_is_crystal ? fmt("%.3f", r.overlap->spatial) + "  along the crystal " +
                                          fmt("%.3f", r.overlap->spatial_along_crystal)
                                    : fmt("%.3f", r.overlap->spatial) + " at the target plane")
            << "  temporal "
            << (r.overlap->temporal ? fmt("%.3f", *r.overlap->temporal) : std::string("n/a")) << "  combined "
            << fmt("%.3f", r.overlap->combined) << "\n";
    }
    if (r.stage) {
        const StageReport& s = *r.stage;
        out << "\nStage " << s.id << " (in the " << s.beam << " arm): at " << fmt("%.3f", s.position_mm)
            << " mm; zero delay at " << fmt("%.3f", s.zero_delay_mm) << " mm (" << (s.zero_in_travel ? "inside" : "OUTSIDE")
            << " its travel), move " << fmt("%+.3f", s.move_mm) << " mm; " << fmt("%.2f", s.delay_per_mm_fs)
            << " fs per mm\n";
        if (s.measured_zero_mm)
            out << "  measured zero at " << fmt("%.3f", *s.measured_zero_mm) << " mm: the model puts "
                << format_duration_fs(*s.emission_offset_fs, true) << " of delay there (an emission offset it does not know)\n";
    }
    for (const PhaseMatchingReport& p : r.phase_matching) {
        out << "\nPhase matching: " << p.process << " → " << fmt("%.2f", p.output_nm) << " nm, " << p.type << "\n";
        if (!p.outside_index_data.empty()) {
            out << "  " << p.outside_index_data << "\n";
            continue;
        }
        if (!p.phase_matchable) {
            out << "  no phase matching; Δk·L now " << fmt("%.1f", p.delta_k_l) << " rad\n";
            continue;
        }
        out << "  θ_pm " << fmt("%.3f", p.theta_pm_deg) << "° (internal), now " << fmt("%.3f", p.theta_now_deg)
            << "°; Δk·L " << fmt("%.2f", p.delta_k_l) << " rad, sinc² " << fmt("%.3f", p.sinc2_now) << "\n"
            << "  " << (p.rotation == CrystalRotation::Turn ? "external angle" : "tilt") << " now "
            << fmt("%+.3f", p.incidence_now_deg) << "°, "
            << (p.rotation_found ? "needed " + fmt("%+.3f", p.incidence_needed_deg) + "°: " +
                                       (p.rotation == CrystalRotation::Turn ? "turn" : "tilt") + " by " +
                                       fmt("%+.3f", p.rotate_by_deg) + "° about the " + p.rotation_axis
                                 : std::string("no setting within the mount's range reaches θ_pm"))
            << "\n"
            << "  walk-off " << fmt("%.1f", p.walkoff_mrad) << " mrad; acceptance (FWHM) "
            << fmt("%.2f", p.angular_acceptance_internal_mrad) << " mrad internal, " << fmt("%.2f", p.angular_acceptance_external_mrad)
            << " mrad external, " << fmt("%.2f", p.spectral_acceptance_nm) << " nm\n";
        for (const GroupVelocityMismatch& g : p.gvm)
            out << "  GVM " << g.between << " " << fmt("%+.1f", g.fs_per_mm) << " fs/mm"
                << (g.walk_apart_mm ? ", pulses walk apart in " + fmt("%.2f", *g.walk_apart_mm) + " mm" : std::string()) << "\n";
        out << "  polarization: " << (p.polarizations_suit ? "suits" : "DOES NOT SUIT") << " — " << p.polarization_note << "\n";
    }
    if (!r.focusing.empty()) {
        out << "\nFocusing (Boyd–Kleinman, no walk-off; optimum ξ = 2.84)\n";
        for (const FocusingReport& f : r.focusing)
            out << "  " << f.beam << ": ξ = L/b = " << fmt("%.3f", f.xi) << ", h_m = " << fmt("%.3f", f.h_m)
                << ", walk-off parameter B = " << fmt("%.2f", f.walkoff_parameter) << "\n";
        if (r.confocal_ratio) out << "  confocal parameters b1/b2 = " << fmt("%.3f", *r.confocal_ratio) << " (1 = matched)\n";
    }
    if (!r.findings.empty()) {
        out << "\nFindings\n";
        for (const Finding& f : r.findings) out << "  [" << finding_code(f.kind) << "] " << finding_line(f) << "\n";
    }
    out << "\nSafety\n";
    for (const std::string& s : r.invisible) out << "  invisible: " << s << "\n";
    for (const ReportBeam& b : r.beams) out << "  after the target, " << b.id << ": " << after_target_text(b) << "\n";
    out << "\n" << safety_notice_text();
}

void print_markdown(const RendezvousReport& r, std::ostream& out) {
    out << "# Rendezvous report: " << r.layout_name << "\n\nTarget: `" << r.target << "`\n\n## Verdict\n\n"
        << "| | state | numbers | action |\n|---|---|---|---|\n";
    for (const auto& [name, line] : {std::pair{"space", &r.verdict.space}, std::pair{"time", &r.verdict.time},
                                     std::pair{"phase", &r.verdict.phase}})
        out << "| " << name << " | " << verdict_state_text(*line) << " | " << line->summary << " | " << line->action << " |\n";
    out << "\n## At the target\n\n| beam | λ (nm) | path (mm) | arrival (ps) | waist t/s (µm) | waist offset t/s (mm) | Rayleigh t/s (mm) |\n"
        << "|---|---|---|---|---|---|---|\n";
    for (const ReportBeam& b : r.beams) {
        const BeamAtTarget& t = b.at_target;
        if (!t.reached) {
            out << "| " << b.id << " | " << fmt("%.1f", b.wavelength_nm) << " | does not reach the target | | | | |\n";
            continue;
        }
        out << "| " << b.id << " | " << fmt("%.1f", b.wavelength_nm) << " | " << fmt("%.2f", t.path_mm) << " | "
            << fmt("%.4f", t.arrival_fs * 1e-3) << " | " << fmt("%.2f", t.tangential.waist_um) << " / "
            << fmt("%.2f", t.sagittal.waist_um) << " | " << fmt("%+.3f", t.tangential.waist_offset_mm) << " / "
            << fmt("%+.3f", t.sagittal.waist_offset_mm) << " | " << fmt("%.3f", t.tangential.rayleigh_mm) << " / "
            << fmt("%.3f", t.sagittal.rayleigh_mm) << " |\n";
    }
    if (r.mismatch)
        out << "\nDelay (" << r.beams[0].id << " − " << r.beams[1].id << "): " << format_duration_fs(r.mismatch->delay_fs, true)
            << ". Lateral offset " << fmt("%.1f", r.mismatch->lateral_um) << " µm, angle "
            << fmt("%.3f", r.mismatch->angle_mrad) << " mrad.\n";
    if (r.overlap)
        out << "\nOverlap: spatial " << fmt("%.3f", r.overlap->spatial)
            << (r.target_is_crystal ? ", along the crystal " + fmt("%.3f", r.overlap->spatial_along_crystal)
                                    : std::string(" at the target plane"))
            << ", temporal "
            << (r.overlap->temporal ? fmt("%.3f", *r.overlap->temporal) : std::string("n/a")) << ", combined "
            << fmt("%.3f", r.overlap->combined) << ".\n";
    if (r.stage)
        out << "\nStage `" << r.stage->id << "`: zero delay at " << fmt("%.3f", r.stage->zero_delay_mm) << " mm (now "
            << fmt("%.3f", r.stage->position_mm) << " mm, " << (r.stage->zero_in_travel ? "inside" : "outside") << " the travel).\n";
    if (!r.phase_matching.empty()) {
        out << "\n## Phase matching\n\n| process | output (nm) | type | θ_pm (°) | θ now (°) | rotate by (°, external) | sinc² now | walk-off (mrad) |\n"
            << "|---|---|---|---|---|---|---|---|\n";
        for (const PhaseMatchingReport& p : r.phase_matching)
            out << "| " << p.process << " | " << fmt("%.2f", p.output_nm) << " | " << p.type << " | "
                << (p.phase_matchable ? fmt("%.3f", p.theta_pm_deg) : std::string("none")) << " | "
                << fmt("%.3f", p.theta_now_deg) << " | "
                << (p.phase_matchable && p.rotation_found ? (p.rotation == CrystalRotation::Turn ? "turn " : "tilt ") +
                                                                fmt("%+.3f", p.rotate_by_deg)
                                                          : std::string("—"))
                << " | "
                << fmt("%.3f", p.sinc2_now) << " | " << fmt("%.1f", p.walkoff_mrad) << " |\n";
    }
    if (!r.findings.empty()) {
        out << "\n## Findings\n\n";
        for (const Finding& f : r.findings) out << "- `" << finding_code(f.kind) << "` " << finding_line(f) << "\n";
    }
    out << "\n## Safety\n\n";
    for (const std::string& s : r.invisible) out << "- Invisible: " << s << "\n";
    for (const ReportBeam& b : r.beams) out << "- After the target, " << b.id << ": " << after_target_text(b) << "\n";
    for (const std::string& c : safety_cautions()) out << "- " << c << "\n";
}

}  // namespace

int run_report(const ReportOptions& options, std::ostream& out, std::ostream& err) {
    std::optional<Layout> layout;
    if (options.demo) {
        layout = demo_layout();
    } else {
        layout = load_layout(options.layout, err);
        if (!layout) return 2;
    }
    const RendezvousReport r = build_report(*layout, material_library_for(*layout));
    if (options.json) out << to_json(*layout, r).dump(2) << "\n";
    else if (options.markdown) print_markdown(r, out);
    else print_text(r, out);
    const Verdict& v = r.verdict;
    if (options.check && !(verdict_passes(v.space) && verdict_passes(v.time) && verdict_passes(v.phase))) return 3;
    return 0;
}

}  // namespace rv::cli
