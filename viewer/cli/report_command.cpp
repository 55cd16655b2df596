// rendezvous report: each beam at the target and how far apart the two are.
#include <cmath>
#include <cstdio>
#include <nlohmann/json.hpp>
#include <ostream>

#include "analysis/target_summary.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "cli/safety_notice.hpp"
#include "io/layout_reader.hpp"
#include "trace/propagate.hpp"
#include "trace/trace.hpp"

namespace rv::cli {

namespace {

struct Computed {
    std::vector<Path> paths;
    std::vector<Caustic> caustics;
    std::vector<BeamAtTarget> at_target;
};

Computed compute(const Layout& layout) {
    const MaterialLibrary library = material_library_for(layout);
    Computed c;
    c.paths = trace_layout(layout, library);
    for (const Path& p : c.paths) {
        c.caustics.push_back(propagate_path(layout, library, p));
        c.at_target.push_back(beam_at_target(layout, p, c.caustics.back()));
    }
    return c;
}

std::string fmt(const char* format, double v) {
    char buf[64];
    std::snprintf(buf, sizeof buf, format, v);
    return buf;
}

nlohmann::json planes(double t, double s) { return {{"tangential", t}, {"sagittal", s}}; }

nlohmann::json to_json(const Layout& layout, const Computed& c) {
    nlohmann::json beams = nlohmann::json::object();
    nlohmann::json warnings = nlohmann::json::array();
    for (size_t b = 0; b < layout.beams.size(); ++b) {
        const BeamSource& src = layout.beams[b];
        const BeamAtTarget& t = c.at_target[b];
        nlohmann::json elements = nlohmann::json::array();
        for (size_t i = 0; i < c.paths[b].hits.size(); ++i) {
            const TraceHit& h = c.paths[b].hits[i];
            const BeamAtHit& w = c.caustics[b].at_hits[i];
            elements.push_back({{"id", layout.elements[h.element].id},
                                {"s_mm", h.s_mm},
                                {"radius_um", planes(w.radius_tangential_um, w.radius_sagittal_um)},
                                {"clipping", w.clipped_fraction}});
        }
        nlohmann::json beam = {{"wavelength_nm", src.wavelength_nm},
                               {"reaches_target", t.reached},
                               {"elements", elements}};
        if (t.reached) {
            beam["path_mm"] = t.path_mm;
            beam["arrival_fs"] = t.arrival_fs;
            beam["target"] = {
                {"radius_um", planes(t.tangential.radius_um, t.sagittal.radius_um)},
                {"waist_um", planes(t.tangential.waist_um, t.sagittal.waist_um)},
                {"waist_offset_mm", planes(t.tangential.waist_offset_mm, t.sagittal.waist_offset_mm)},
                {"rayleigh_mm", planes(t.tangential.rayleigh_mm, t.sagittal.rayleigh_mm)},
                {"hit_mm", {t.hit_mm.x(), t.hit_mm.y()}},
                {"index", t.index}};
        }
        beams[src.id] = beam;
        auto add = [&](const Finding& f) {
            warnings.push_back({{"code", f.kind == Finding::Kind::Clipping ? "clipping" : "trace"},
                                {"message", src.id + ": " + f.message},
                                {"element", f.element}});
        };
        for (const Finding& f : c.paths[b].findings) add(f);
        for (const Finding& f : c.caustics[b].findings) add(f);
    }
    nlohmann::json out = {{"layout", layout.name}, {"target", layout.target}, {"beams", beams}};
    if (c.at_target.size() >= 2 && c.at_target[0].reached && c.at_target[1].reached) {
        const Mismatch m = mismatch_at_target(c.at_target[0], c.at_target[1]);
        out["mismatch"] = {{"waist_offset_mm", m.waist_offset_mm},
                           {"waist_offset_planes_mm", planes(m.waist_offset_tangential_mm,
                                                             m.waist_offset_sagittal_mm)},
                           {"waist_ratio", m.waist_ratio},
                           {"lateral_um", m.lateral_um},
                           {"angle_mrad", m.angle_mrad},
                           {"delay_fs", m.delay_fs}};
    }
    out["warnings"] = warnings;
    return out;
}

void print_text(const Layout& layout, const Computed& c, std::ostream& out) {
    out << "Rendezvous report: " << layout.name << "\n";
    out << "Target: " << layout.target << "\n\n";
    out << "  beam      wavelength  path      arrival      radius     waist      waist offset  Rayleigh\n"
        << "            nm          mm        ps           µm (t/s)   µm (t/s)   mm (t/s)      mm (t/s)\n";
    for (size_t b = 0; b < layout.beams.size(); ++b) {
        const BeamAtTarget& t = c.at_target[b];
        char line[320];
        if (!t.reached) {
            std::snprintf(line, sizeof line, "  %-9s %-11.1f does not reach the target\n",
                          layout.beams[b].id.c_str(), layout.beams[b].wavelength_nm);
        } else {
            std::snprintf(line, sizeof line,
                          "  %-9s %-11.1f %-9.2f %-12.4f %5.1f/%-5.1f %5.2f/%-5.2f %6.3f/%-6.3f %6.3f/%.3f\n",
                          layout.beams[b].id.c_str(), layout.beams[b].wavelength_nm, t.path_mm,
                          t.arrival_fs * 1e-3, t.tangential.radius_um, t.sagittal.radius_um,
                          t.tangential.waist_um, t.sagittal.waist_um, t.tangential.waist_offset_mm,
                          t.sagittal.waist_offset_mm, t.tangential.rayleigh_mm, t.sagittal.rayleigh_mm);
        }
        out << line;
    }
    if (c.at_target.size() >= 2 && c.at_target[0].reached && c.at_target[1].reached) {
        const Mismatch m = mismatch_at_target(c.at_target[0], c.at_target[1]);
        const std::string& a = layout.beams[0].id;
        const std::string& b = layout.beams[1].id;
        const double shorter = std::min({c.at_target[0].tangential.rayleigh_mm,
                                         c.at_target[0].sagittal.rayleigh_mm,
                                         c.at_target[1].tangential.rayleigh_mm,
                                         c.at_target[1].sagittal.rayleigh_mm});
        out << "\nMismatch (" << b << " relative to " << a << "):\n"
            << "  waist offset      " << fmt("%+.3f", m.waist_offset_mm) << " mm = "
            << fmt("%.2f", std::abs(m.waist_offset_mm) / shorter) << " of the shorter Rayleigh range\n"
            << "  waist ratio       " << fmt("%.3f", m.waist_ratio) << "\n"
            << "  lateral offset    " << fmt("%.1f", m.lateral_um) << " µm\n"
            << "  angle             " << fmt("%.3f", m.angle_mrad) << " mrad\n"
            << "  delay (" << a << " − " << b << ")  " << fmt("%+.1f", m.delay_fs) << " fs\n";
    }
    bool any = false;
    for (size_t b = 0; b < layout.beams.size(); ++b) {
        auto print = [&](const Finding& f) {
            if (!any) out << "\nFindings:\n";
            any = true;
            out << "  " << layout.beams[b].id << ": " << f.message << "\n";
        };
        for (const Finding& f : c.paths[b].findings) print(f);
        for (const Finding& f : c.caustics[b].findings) print(f);
    }
    out << "\nRadii are second-moment (1/e² for M² = 1) radii; t = tangential (table plane),\n"
           "s = sagittal. Waist offset: waist position minus the target centre, + downstream.\n\n"
        << safety_notice_text();
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
    const Computed c = compute(*layout);
    if (options.json)
        out << to_json(*layout, c).dump(2) << "\n";
    else
        print_text(*layout, c, out);
    return 0;
}

}  // namespace rv::cli
