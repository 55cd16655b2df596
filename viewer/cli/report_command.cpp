#include "cli/report_command.hpp"

#include <cmath>
#include <cstdio>
#include <nlohmann/json.hpp>
#include <string>

#include "analysis/chromatic_focus.hpp"
#include "cli/safety_notice.hpp"
#include "demo/builtin_demo.hpp"

namespace rv::cli {

namespace {

std::string fixed(double value, int decimals) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.*f", decimals, value);
    return buf;
}

void print_text(const ChromaticFocusCase& c, const ChromaticFocusSummary& s, std::ostream& out) {
    out << "Rendezvous report: " << c.name << "\n\n";
    out << "Shared lens " << c.lens.id << ": " << c.lens.glass << " singlet, R1 = "
        << fixed(c.lens.shape.front_radius_mm, 2) << " mm, R2 = "
        << (std::isinf(c.lens.shape.back_radius_mm) ? std::string("flat")
                                                    : fixed(c.lens.shape.back_radius_mm, 2) + " mm")
        << ", centre thickness " << fixed(c.lens.shape.center_thickness_mm, 2) << " mm\n\n";
    out << "  beam      wavelength  glass n    EFL        back focal  waist      waist at    Rayleigh\n"
        << "            nm                     mm         mm          µm         mm (after)  mm\n";
    for (const BeamFocus& b : s.beams) {
        char line[256];
        std::snprintf(line, sizeof line,
                      "  %-9s %-11.1f %-10.6f %-10.3f %-11.3f %-10.2f %-11.3f %.3f%s\n",
                      b.id.c_str(), b.wavelength_nm, b.glass_index, b.effective_focal_length_mm,
                      b.back_focal_distance_mm, b.waist_um, b.waist_after_lens_mm,
                      b.rayleigh_range_mm, b.glass_in_valid_range ? "" : "  (glass data extrapolated)");
        out << line;
    }
    if (s.beams.size() >= 2) {
        out << "\nChromatic focal shift (" << s.beams[1].id << " waist minus " << s.beams[0].id
            << " waist): " << fixed(s.focal_shift_mm, 3) << " mm = "
            << fixed(s.shift_over_rayleigh, 2) << " of the shorter Rayleigh range\n";
        out << "Waist ratio " << s.beams[1].id << "/" << s.beams[0].id << ": "
            << fixed(s.waist_ratio, 3) << "\n";
    }
    out << "\nWaist positions are measured from the lens's back vertex, + downstream; radii are\n"
           "second-moment (1/e² for M² = 1) radii.\n\n"
        << safety_notice_text();
}

nlohmann::json to_json(const ChromaticFocusCase& c, const ChromaticFocusSummary& s) {
    nlohmann::json beams = nlohmann::json::object();
    for (const BeamFocus& b : s.beams) {
        beams[b.id] = {{"wavelength_nm", b.wavelength_nm},
                       {"lens_index", b.glass_index},
                       {"lens_index_in_valid_range", b.glass_in_valid_range},
                       {"effective_focal_length_mm", b.effective_focal_length_mm},
                       {"back_focal_distance_mm", b.back_focal_distance_mm},
                       {"waist_um", b.waist_um},
                       {"waist_after_lens_mm", b.waist_after_lens_mm},
                       {"rayleigh_mm", b.rayleigh_range_mm}};
    }
    return {{"name", c.name},
            {"lens", {{"id", c.lens.id}, {"glass", c.lens.glass}}},
            {"beams", beams},
            {"chromatic_focal_shift_mm", s.focal_shift_mm},
            {"shift_over_rayleigh", s.shift_over_rayleigh},
            {"waist_ratio", s.waist_ratio}};
}

}  // namespace

int run_report(const ReportOptions& options, std::ostream& out, std::ostream& err) {
    if (!options.demo) {
        err << "rendezvous: error: reading layout files is not implemented yet; use --demo\n";
        return 2;
    }
    const ChromaticFocusCase demo = builtin_demo_focus_case();
    const ChromaticFocusSummary summary =
        summarize_chromatic_focus(demo, MaterialLibrary::builtin());
    if (options.json)
        out << to_json(demo, summary).dump(2) << "\n";
    else
        print_text(demo, summary, out);
    return 0;
}

}  // namespace rv::cli
