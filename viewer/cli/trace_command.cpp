// rendezvous trace: every hit of every beam, with the beam radius there.
#include <cmath>
#include <cstdio>
#include <nlohmann/json.hpp>
#include <ostream>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "findings/finding_json.hpp"
#include "io/layout_reader.hpp"
#include "trace/propagate.hpp"
#include "trace/trace.hpp"
#include "units/number_text.hpp"

namespace rv::cli {

namespace {
const char* interaction_name(Interaction i) {
    switch (i) {
        case Interaction::ThinLens: return "lens";
        case Interaction::Reflect: return "reflect";
        case Interaction::Refract: return "refract";
        case Interaction::Retroreflect: return "retroreflect";
        case Interaction::TargetPlane: return "target-plane";
        case Interaction::Absorb: return "absorb";
    }
    return "?";
}
}  // namespace

int run_trace(const TraceOptions& options, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(options.layout, err);
    if (!layout) return 2;
    const MaterialLibrary library = material_library_for(*layout);
    nlohmann::json doc = nlohmann::json::object();
    for (const Path& p : trace_layout(*layout, library)) {
        const Caustic c = propagate_path(*layout, p);
        const std::string& id = layout->beams[p.beam].id;
        nlohmann::json hits = nlohmann::json::array();
        if (!options.json) out << id << " (" << layout->beams[p.beam].wavelength_nm << " nm):\n";
        for (size_t i = 0; i < p.hits.size(); ++i) {
            const TraceHit& h = p.hits[i];
            const char* what = interaction_name(h.interaction);
            if (options.json) {
                hits.push_back({{"id", layout->elements[h.element].id},
                                {"interaction", what},
                                {"s_mm", h.s_mm},
                                {"at_mm", {h.point_mm.x(), h.point_mm.y()}},
                                {"aoi_deg", h.aoi_rad() * 180 / 3.14159265358979323846},
                                // null after a not-finite finding: never a NaN written as null inside
                                {"radius_um", std::isfinite(c.at_hits[i].radius_tangential_um) &&
                                                      std::isfinite(c.at_hits[i].radius_sagittal_um)
                                                  ? nlohmann::json{{"tangential", c.at_hits[i].radius_tangential_um},
                                                                   {"sagittal", c.at_hits[i].radius_sagittal_um}}
                                                  : nlohmann::json(nullptr)}});
                continue;
            }
            char line[256];
            std::snprintf(line, sizeof line,
                          "  %8.2f mm  %-8s %-13s at (%8.3f, %8.3f)  aoi %5.1f°  w %8s / %-8s µm\n",
                          h.s_mm, layout->elements[h.element].id.c_str(), what, h.point_mm.x(),
                          h.point_mm.y(), h.aoi_rad() * 180 / 3.14159265358979323846,
                          // n/a after a not-finite finding (trace/propagate.cpp), never "nan"
                          format_number("%.1f", c.at_hits[i].radius_tangential_um).c_str(),
                          format_number("%.1f", c.at_hits[i].radius_sagittal_um).c_str());
            out << line;
        }
        nlohmann::json findings = nlohmann::json::array();
        for (const std::vector<Finding>* list : {&p.findings, &c.findings})
            for (Finding f : *list) {
                f.beam = id;
                if (options.json) findings.push_back(finding_json(f));
                else out << "  finding: [" << finding_code(f.kind) << "] " << finding_text(f) << "\n";
            }
        doc[id] = {{"hits", hits}, {"findings", findings}};
    }
    if (options.json) out << doc.dump(2) << "\n";
    return 0;
}

}  // namespace rv::cli
