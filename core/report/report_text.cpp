#include "report/report_text.hpp"

#include <cstdio>
#include <sstream>

#include "polarization/polarization_model.hpp"
#include "report/report_output_format.hpp"
#include "report/report_words.hpp"
#include "report/safety_cautions.hpp"
#include "report/verdict_words.hpp"
#include "units/number_text.hpp"

namespace rv {

namespace {

// Every number by the shared rule (units/number_text.hpp): no "-0", "n/a" for NaN.
std::string fmt(const char* format, double v) {
    return format_number(format, v);
}

std::string percent(double fraction) {
    return fmt("%.1f", 100 * fraction) + " %";
}

void write_power(const RendezvousReport& r, std::ostream& out) {
    out << "\nPower and polarization at the target (estimates for alignment and damage, not "
           "exposure limits)\n";
    for (const ReportBeam& b : r.beams) {
        if (!b.power.reached) continue;
        out << "  " << b.id << ": " << percent(b.power.at_target[0]) << " of the source";
        if (b.target_power_mw) out << " = " << fmt("%.1f", *b.target_power_mw) << " mW";
        out << ", " << describe_text(b.at_target_polarization);
        if (b.pulse_at_target)
            out << "; " << fmt("%.3g", b.pulse_at_target->energy_uj) << " µJ, peak "
                << fmt("%.3g", b.pulse_at_target->peak_intensity_w_cm2 * 1e-9) << " GW/cm² and "
                << fmt("%.3g", b.pulse_at_target->peak_fluence_j_cm2 * 1e3)
                << " mJ/cm² at the target plane"
                << (b.pulse_at_waist
                        ? ", " + fmt("%.3g", b.pulse_at_waist->peak_intensity_w_cm2 * 1e-9) +
                              " GW/cm² at its waist"
                        : "");
        out << "\n";
        for (const WavePlatePass& p : b.power.plates)
            out << "    " << p.id << ": retardance " << fmt("%.4f", p.retardance_waves)
                << " waves at " << fmt("%.0f", b.wavelength_nm) << " nm, fast axis "
                << fmt("%.1f", p.fast_axis_deg) << "°\n";
        for (const PowerLoss& l : b.power.losses)
            if (l.fraction >= 5e-4)  // the JSON lists every loss; the text those of 0.05 % or more
                out << "    " << l.element << ": " << percent(l.fraction) << " " << l.what
                    << (l.goes_to.empty() ? "" : ", " + l.goes_to) << "\n";
    }
    for (const PolarizationAdvice& a : r.polarization) {
        const std::string needs = needed_polarization_text(a), action = polarization_advice_text(a);
        out << "  " << a.beam << " needs " << needs << ": " << percent(a.useful_fraction)
            << " of it is";
        if (a.useful_mw) out << " (" << fmt("%.1f", *a.useful_mw) << " mW)";
        out << (action.empty() ? "" : "; " + action) << "\n";
        for (const PolarizationAdvice::PlateSetting& p : a.plates) {
            out << "    " << p.plate << " at " << fmt("%.1f", p.now_deg)
                << "°: " << percent(p.useful_now) << " of the source in " << needs << "; the most, "
                << percent(p.useful_best) << ", at " << fmt("%.1f", p.best_deg) << "°\n";
        }
    }
}

// Each arm's dispersion to the target centre and the pulse length there.
void write_pulses(const RendezvousReport& r, std::ostream& out) {
    bool any = false;
    for (const ReportBeam& b : r.beams) {
        if (!b.at_target.reached) continue;
        if (!any) out << "\nPulses at the target (Gaussian; GDD and TOD of the path, the source's chirp included)\n";
        any = true;
        const PulseAtTarget& p = b.at_target.pulse;
        out << "  " << b.id << ": GDD " << fmt("%+.0f", p.gdd_fs2) << " fs², TOD " << fmt("%+.0f", p.tod_fs3)
            << " fs³";
        if (p.fwhm_fs) out << ", pulse " << fmt("%.1f", *p.fwhm_fs) << " fs FWHM";
        out << "; " << fmt("%+.0f", p.compensation_gdd_fs2()) << " fs² before the target gives the shortest pulse\n";
    }
}

}  // namespace

void write_report_text(const RendezvousReport& r, std::ostream& out) {
    out << "Rendezvous report: " << r.layout_name << "\nTarget: " << r.target << "\n\n";
    out << "Verdict\n" << verdict_text(r.verdict, true);
    out << "\nAt the target (t = tangential, in the table plane; s = sagittal)\n"
        << "  beam       λ nm     path mm   arrival ps   radius µm t/s   waist µm t/s    waist "
           "offset mm t/s  Rayleigh mm t/s\n";
    for (const ReportBeam& b : r.beams) {
        const BeamAtTarget& t = b.at_target;
        char line[320];
        if (!t.reached)
            std::snprintf(line, sizeof line, "  %-10s %-8.1f does not reach the target\n",
                          b.id.c_str(), b.wavelength_nm);
        else
            std::snprintf(
                line, sizeof line,
                "  %-10s %-8.1f %-9.2f %-12.4f %6.1f/%-8.1f %6.2f/%-8.2f %7s/%-12s %6.3f/%.3f\n",
                b.id.c_str(), b.wavelength_nm, t.path_mm, t.arrival_fs * 1e-3,
                t.tangential.radius_um, t.sagittal.radius_um, t.tangential.waist_um,
                t.sagittal.waist_um,
                fmt("%+.3f", t.tangential.waist_offset_mm).c_str(),  // signed: never "-0.000"
                fmt("%+.3f", t.sagittal.waist_offset_mm).c_str(), t.tangential.rayleigh_mm,
                t.sagittal.rayleigh_mm);
        out << line;
    }
    write_power(r, out);
    write_pulses(r, out);
    if (r.mismatch) {
        const Mismatch& m = *r.mismatch;
        out << "\nMismatch (" << r.beams[1].id << " relative to " << r.beams[0].id << ")\n"
            << "  waist offset " << fmt("%+.3f", m.waist_offset_mm) << " mm, waist ratio "
            << fmt("%.3f", m.waist_ratio) << ", confocal ratio "
            << fmt("%.3f", r.confocal_ratio.value_or(0)) << ", lateral "
            << fmt("%.1f", m.lateral_um) << " µm (t " << fmt("%.1f", m.lateral_tangential_um) << ", s "
            << fmt("%.1f", m.lateral_sagittal_um) << "), angle " << fmt("%.3f", m.angle_mrad) << " mrad\n"
            << "  delay (" << r.beams[0].id << " − " << r.beams[1].id << ") "
            << format_duration_fs(m.delay_fs, true) << "\n";
    }
    if (r.overlap) {
        out << "\nOverlap  spatial "
            << (r.target_is_crystal ? fmt("%.3f", r.overlap->spatial) + "  along the crystal " +
                                          fmt("%.3f", r.overlap->spatial_along_crystal)
                                    : fmt("%.3f", r.overlap->spatial) + " at the target plane")
            << "  temporal "
            << (r.overlap->temporal ? fmt("%.3f", *r.overlap->temporal) : std::string("n/a"))
            << "  combined " << fmt("%.3f", r.overlap->combined) << "\n";
    }
    if (r.stage) {
        const StageReport& s = *r.stage;
        out << "\nStage " << s.id << " (in the " << s.beam << " arm): at "
            << fmt("%.3f", s.position_mm) << " mm; zero delay at " << fmt("%.3f", s.zero_delay_mm)
            << " mm (" << (s.zero_in_travel ? "inside" : "OUTSIDE") << " its travel), move "
            << fmt("%+.3f", s.move_mm) << " mm; " << fmt("%.2f", s.delay_per_mm_fs)
            << " fs per mm\n";
        if (s.measured_zero_mm)
            out << "  measured zero at " << fmt("%.3f", *s.measured_zero_mm)
                << " mm: the model puts " << format_duration_fs(*s.emission_offset_fs, true)
                << " of delay there (an emission offset it does not know)\n";
    }
    for (const PhaseMatchingReport& p : r.phase_matching) {
        out << "\nPhase matching: " << process_beams_text(p.beams) << " → " << fmt("%.2f", p.output_nm) << " nm, "
            << mixing_type_label(p.mixing) << "\n";
        if (p.outside_index_data) {
            out << "  " << index_gap_text(*p.outside_index_data) << "\n";
            continue;
        }
        if (p.temperature) out << "  temperature " << temperature_tuning_text(*p.temperature) << "\n";
        if (!p.phase_matchable) {
            out << "  no phase matching; Δk·L now " << fmt("%.1f", p.delta_k_l) << " rad\n";
            continue;
        }
        out << "  θ_pm " << fmt("%.3f", p.theta_pm_deg) << "° (internal), now "
            << fmt("%.3f", p.theta_now_deg) << "°; Δk·L " << fmt("%.2f", p.delta_k_l)
            << " rad, sinc² " << fmt("%.3f", p.sinc2_now) << "\n"
            << "  " << (p.rotation == CrystalRotation::Turn ? "external angle" : "tilt") << " now "
            << fmt("%+.3f", p.incidence_now_deg) << "°, "
            << (p.rotation_found
                    ? "needed " + fmt("%+.3f", p.incidence_needed_deg) +
                          "°: " + (p.rotation == CrystalRotation::Turn ? "turn" : "tilt") + " by " +
                          fmt("%+.3f", p.rotate_by_deg) + "° about the " + crystal_rotation_axis_text(p.rotation)
                    : std::string("no setting within the mount's range reaches θ_pm"))
            << "\n"
            << "  walk-off " << fmt("%.1f", p.walkoff_mrad) << " mrad; acceptance (FWHM) "
            << fmt("%.2f", p.angular_acceptance_internal_mrad) << " mrad internal, "
            << fmt("%.2f", p.angular_acceptance_external_mrad) << " mrad external, "
            << fmt("%.2f", p.spectral_acceptance_nm) << " nm tuning " << p.spectral_tuned_beam
            << (p.spectral_held_beam ? " with " + *p.spectral_held_beam + " held" : std::string(" (the harmonic follows)"))
            << "\n";
        for (const GroupVelocityMismatch& g : p.gvm)
            out << "  GVM " << gvm_pair_text(p, g) << " " << fmt("%+.1f", g.fs_per_mm) << " fs/mm"
                << (g.walk_apart_mm
                        ? ", pulses walk apart in " + fmt("%.2f", *g.walk_apart_mm) + " mm"
                        : std::string())
                << "\n";
        out << "  polarization: " << (p.polarizations_suit ? "suits" : "DOES NOT SUIT") << " — "
            << verdict_action_text(p.polarization_need) << "\n";
    }
    if (!r.focusing.empty()) {
        out << "\nFocusing (Boyd–Kleinman, focus at the centre)\n";
        for (const FocusingReport& f : r.focusing)
            out << "  " << f.beam << ": ξ = L/b = " << fmt("%.3f", f.xi)
                << ", walk-off parameter B = " << fmt("%.2f", f.walkoff_parameter)
                << ", h_m = " << fmt("%.3f", f.h_m_walkoff) << " with walk-off ("
                << fmt("%.3f", f.h_m) << " without)\n"
                << "    optimum for this B: ξ = " << fmt("%.2f", f.xi_optimum)
                << ", h = " << fmt("%.3f", f.h_mm) << " — waist radius "
                << fmt("%.1f", f.waist_optimum_um) << " µm in the crystal (now "
                << fmt("%.1f", f.waist_now_um) << " µm): focusing lens f × "
                << fmt("%.2f", f.focal_length_scale) << " for a collimated input\n";
        if (r.confocal_ratio)
            out << "  confocal parameters b1/b2 = " << fmt("%.3f", *r.confocal_ratio)
                << " (1 = matched)\n";
    }
    if (!r.materials.empty()) {
        out << "\nData sets (dispersion)\n";
        for (const MaterialDataReport& m : r.materials) {
            out << "  " << m.name << ", " << fmt("%.3g", m.min_wavelength_nm * 1e-3) << "–"
                << fmt("%.3g", m.max_wavelength_nm * 1e-3) << " µm (" << m.source << "): ";
            for (size_t i = 0; i < m.used_by.size(); ++i) out << (i ? ", " : "") << m.used_by[i];
            out << "\n";
        }
    }
    if (!r.findings.empty()) {
        out << "\nFindings\n";
        for (const Finding& f : r.findings)
            out << "  [" << finding_code(f.kind) << "] " << finding_line(f) << "\n";
    }
    write_generated_light_text(r, out);
    out << "\nSafety\n";
    write_nonlinear_safety_text(r, out);
    for (const InvisibleLight& s : r.invisible) out << "  invisible: " << invisible_light_text(s) << "\n";
    for (const ReportBeam& b : r.beams)
        out << "  after the target, " << b.id << ": " << after_target_text(b) << "\n";
    out << "\nLaser safety\n";
    for (const std::string& c : safety_cautions()) out << "  - " << c << "\n";
}

std::string verdict_text(const Verdict& v, bool with_actions) {
    std::string text;
    for (const auto& [name, line] :
         {std::pair{"space", &v.space}, std::pair{"time", &v.time}, std::pair{"phase", &v.phase}}) {
        text += "  " + std::string(name) + std::string(7 - std::string(name).size(), ' ') +
                verdict_line_text(*line) + "\n";
        const std::string action = verdict_actions_text(*line);
        if (with_actions && !action.empty()) text += "         -> " + action + "\n";
    }
    return text;
}

std::string report_text(const RendezvousReport& r) {
    std::ostringstream out;
    write_report_text(r, out);
    return out.str();
}

}  // namespace rv
