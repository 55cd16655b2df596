// rendezvous check: read a layout and list every finding of its report — the same list, in the
// same order, that `report` prints and the viewer shows (one evaluation: build_report). Each is
// located by the element's JSON pointer and id; a material's range warning points at the key
// that names the material.
#include <nlohmann/json.hpp>
#include <ostream>

#include "analysis/report.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "findings/finding_json.hpp"
#include "io/layout_reader.hpp"
#include "layout/visit.hpp"

namespace rv::cli {

namespace {

// "/elements/5 (L2_S)", or the key inside it that names the material; "" for no element.
std::string element_location(const Layout& layout, const Finding& f) {
    if (f.element.empty()) return "";
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        if (layout.elements[i].id != f.element) continue;
        std::string pointer = "/elements/" + std::to_string(i);
        if (f.kind == Finding::Kind::MaterialOutOfRange || f.kind == Finding::Kind::NoRealIndex) {
            // The key that names the material, per kind (a new kind must say).
            pointer += std::visit(overloaded{
                                      [](const Lens&) { return "/glass"; },
                                      [](const Dichroic&) { return "/substrate/glass"; },
                                      [](const Plate&) { return "/material"; },
                                      [](const Crystal&) { return "/material"; },
                                      // no material of their own: the element itself
                                      [](const Mirror&) { return ""; },
                                      [](const Retroreflector&) { return ""; },
                                      [](const Stage&) { return ""; },
                                      [](const Target&) { return ""; },
                                      [](const Dump&) { return ""; },
                                  },
                                  layout.elements[i].kind);
        }
        return pointer + " (" + f.element + ")";
    }
    return "";
}

}  // namespace

int run_check(const CheckOptions& options, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(options.layout, err);
    if (!layout) return 2;
    const RendezvousReport report = build_report(*layout, material_library_for(*layout));
    size_t problems = 0, warnings = 0;
    for (const Finding& f : report.findings)
        ++(finding_severity(f.kind) == Finding::Severity::Warning ? warnings : problems);
    if (options.json) {
        nlohmann::json list = nlohmann::json::array();
        for (const Finding& f : report.findings) {
            nlohmann::json j = finding_json(f);
            const std::string where = element_location(*layout, f);
            j["location"] = where.empty() ? nlohmann::json(nullptr) : nlohmann::json(where);
            list.push_back(std::move(j));
        }
        out << nlohmann::json{{"layout", options.layout},
                              {"beams", layout->beams.size()},
                              {"elements", layout->elements.size()},
                              {"problems", problems},
                              {"warnings", warnings},
                              {"findings", list}}
                   .dump(2)
            << "\n";
        return 0;
    }
    for (const Finding& f : report.findings) {
        const std::string where = element_location(*layout, f);
        out << options.layout << ": " << severity_name(finding_severity(f.kind)) << ": "
            << (where.empty() ? "" : where + ": ") << "[" << finding_code(f.kind) << "] "
            << (f.beam.empty() ? "" : f.beam + ": ") << finding_text(f) << "\n";
    }
    out << options.layout << ": " << layout->beams.size() << " beam(s), " << layout->elements.size()
        << " element(s), " << problems << " problem(s), " << warnings << " warning(s)\n";
    return 0;
}

}  // namespace rv::cli
