#include "report/report_markdown.hpp"

#include <sstream>

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

}  // namespace

void write_report_markdown(const RendezvousReport& r, std::ostream& out) {
    out << "# Rendezvous report: " << r.layout_name << "\n\nTarget: `" << r.target
        << "`\n\n## Verdict\n\n"
        << "| | state | numbers | action |\n|---|---|---|---|\n";
    for (const auto& [name, line] :
         {std::pair{"space", &r.verdict.space}, std::pair{"time", &r.verdict.time},
          std::pair{"phase", &r.verdict.phase}})
        out << "| " << name << " | " << verdict_state_text(*line) << " | " << verdict_reading_text(line->reading)
            << " | " << verdict_actions_text(*line) << " |\n";
    out << "\n## At the target\n\n| beam | λ (nm) | path (mm) | arrival (ps) | waist t/s (µm) | "
           "waist offset t/s (mm) | Rayleigh t/s (mm) |\n"
        << "|---|---|---|---|---|---|---|\n";
    for (const ReportBeam& b : r.beams) {
        const BeamAtTarget& t = b.at_target;
        if (!t.reached) {
            out << "| " << b.id << " | " << fmt("%.1f", b.wavelength_nm)
                << " | does not reach the target | | | | |\n";
            continue;
        }
        out << "| " << b.id << " | " << fmt("%.1f", b.wavelength_nm) << " | "
            << fmt("%.2f", t.path_mm) << " | " << fmt("%.4f", t.arrival_fs * 1e-3) << " | "
            << fmt("%.2f", t.tangential.waist_um) << " / " << fmt("%.2f", t.sagittal.waist_um)
            << " | " << fmt("%+.3f", t.tangential.waist_offset_mm) << " / "
            << fmt("%+.3f", t.sagittal.waist_offset_mm) << " | "
            << fmt("%.3f", t.tangential.rayleigh_mm) << " / " << fmt("%.3f", t.sagittal.rayleigh_mm)
            << " |\n";
    }
    if (r.mismatch)
        out << "\nDelay (" << r.beams[0].id << " − " << r.beams[1].id
            << "): " << format_duration_fs(r.mismatch->delay_fs, true) << ". Lateral offset "
            << fmt("%.1f", r.mismatch->lateral_um) << " µm, angle "
            << fmt("%.3f", r.mismatch->angle_mrad) << " mrad.\n";
    if (r.overlap)
        out << "\nOverlap: spatial " << fmt("%.3f", r.overlap->spatial)
            << (r.target_is_crystal
                    ? ", along the crystal " + fmt("%.3f", r.overlap->spatial_along_crystal)
                    : std::string(" at the target plane"))
            << ", temporal "
            << (r.overlap->temporal ? fmt("%.3f", *r.overlap->temporal) : std::string("n/a"))
            << ", combined " << fmt("%.3f", r.overlap->combined) << ".\n";
    if (r.stage)
        out << "\nStage `" << r.stage->id << "`: zero delay at "
            << fmt("%.3f", r.stage->zero_delay_mm) << " mm (now "
            << fmt("%.3f", r.stage->position_mm) << " mm, "
            << (r.stage->zero_in_travel ? "inside" : "outside") << " the travel).\n";
    if (!r.phase_matching.empty()) {
        out << "\n## Phase matching\n\n| process | output (nm) | type | θ_pm (°) | θ now (°) | "
               "rotate by (°, external) | sinc² now | walk-off (mrad) |\n"
            << "|---|---|---|---|---|---|---|---|\n";
        for (const PhaseMatchingReport& p : r.phase_matching)
            out << "| " << process_beams_text(p.beams) << " | " << fmt("%.2f", p.output_nm) << " | " << mixing_type_label(p.mixing)
                << " | " << (p.phase_matchable ? fmt("%.3f", p.theta_pm_deg) : std::string("none"))
                << " | " << fmt("%.3f", p.theta_now_deg) << " | "
                << (p.phase_matchable && p.rotation_found
                        ? (p.rotation == CrystalRotation::Turn ? "turn " : "tilt ") +
                              fmt("%+.3f", p.rotate_by_deg)
                        : std::string("—"))
                << " | " << fmt("%.3f", p.sinc2_now) << " | " << fmt("%.1f", p.walkoff_mrad)
                << " |\n";
        // The process the crystal is set for: its acceptances and every pair's GVM.
        const PhaseMatchingReport& p = r.phase_matching.front();
        if (p.temperature)
            out << "\nTemperature of " << process_beams_text(p.beams) << ": " << temperature_tuning_text(*p.temperature)
                << ".\n";
        if (p.phase_matchable) {
            out << "\nAcceptance of " << process_beams_text(p.beams) << " (FWHM): "
                << fmt("%.2f", p.angular_acceptance_internal_mrad) << " mrad internal, "
                << fmt("%.2f", p.spectral_acceptance_nm) << " nm tuning " << p.spectral_tuned_beam
                << (p.spectral_held_beam ? " with " + *p.spectral_held_beam + " held" : std::string(" (the harmonic follows)"))
                << ".\n\n| GVM between | fs/mm | walk-apart (mm) |\n|---|---|---|\n";
            for (const GroupVelocityMismatch& g : p.gvm)
                out << "| " << gvm_pair_text(p, g) << " | " << fmt("%+.1f", g.fs_per_mm) << " | "
                    << (g.walk_apart_mm ? fmt("%.2f", *g.walk_apart_mm) : std::string("—")) << " |\n";
        }
    }
    if (!r.focusing.empty()) {
        out << "\n## Focusing (Boyd–Kleinman)\n\n| beam | ξ = L/b | B | h_m with walk-off | "
               "h_m without | optimum ξ | h at the optimum | waist now (µm) | optimum waist (µm) | "
               "lens f × |\n"
            << "|---|---|---|---|---|---|---|---|---|---|\n";
        for (const FocusingReport& f : r.focusing)
            out << "| " << f.beam << " | " << fmt("%.3f", f.xi) << " | "
                << fmt("%.2f", f.walkoff_parameter) << " | " << fmt("%.3f", f.h_m_walkoff) << " | "
                << fmt("%.3f", f.h_m) << " | " << fmt("%.2f", f.xi_optimum) << " | "
                << fmt("%.3f", f.h_mm) << " | " << fmt("%.1f", f.waist_now_um) << " | "
                << fmt("%.1f", f.waist_optimum_um) << " | " << fmt("%.2f", f.focal_length_scale)
                << " |\n";
    }
    write_generated_light_markdown(r, out);
    if (!r.materials.empty()) {
        out << "\n## Data sets (dispersion)\n\n| set | range (µm) | source | used by |\n"
            << "|---|---|---|---|\n";
        for (const MaterialDataReport& m : r.materials) {
            out << "| " << m.name << " | " << fmt("%.3g", m.min_wavelength_nm * 1e-3) << "–"
                << fmt("%.3g", m.max_wavelength_nm * 1e-3) << " | " << m.source << " | ";
            for (size_t i = 0; i < m.used_by.size(); ++i)
                out << (i ? ", " : "") << "`" << m.used_by[i] << "`";
            out << " |\n";
        }
    }
    if (!r.findings.empty()) {
        out << "\n## Findings\n\n";
        for (const Finding& f : r.findings)
            out << "- `" << finding_code(f.kind) << "` " << finding_line(f) << "\n";
    }
    out << "\n## Safety\n\n";
    for (const InvisibleLight& s : r.invisible) out << "- Invisible: " << invisible_light_text(s) << "\n";
    for (const ReportBeam& b : r.beams)
        out << "- After the target, " << b.id << ": " << after_target_text(b) << "\n";
    for (const std::string& c : safety_cautions()) out << "- " << c << "\n";
}

std::string report_markdown(const RendezvousReport& r) {
    std::ostringstream out;
    write_report_markdown(r, out);
    return out.str();
}

}  // namespace rv
