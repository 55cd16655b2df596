// rendezvous check: read a layout, trace it, list every problem and finding.
// A wavelength outside the fitted range of a material it crosses is a located warning.
#include <ostream>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/diagnostic.hpp"
#include "io/layout_reader.hpp"
#include "trace/trace.hpp"

namespace rv::cli {

namespace {
// The JSON pointer of the key that names an element's material.
std::string material_pointer(const Layout& layout, const std::string& id) {
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        if (layout.elements[i].id != id) continue;
        const ElementKind& k = layout.elements[i].kind;
        const std::string base = "/elements/" + std::to_string(i);
        if (std::holds_alternative<Dichroic>(k)) return base + "/substrate/glass";
        if (std::holds_alternative<Lens>(k)) return base + "/glass";
        return base + "/material";
    }
    return "";
}
}  // namespace

int run_check(const std::string& path, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(path, err);
    if (!layout) return 2;
    size_t findings = 0, warnings = 0;
    for (const Path& p : trace_layout(*layout, material_library_for(*layout))) {
        for (const Finding& f : p.findings) {
            const std::string& beam = layout->beams[p.beam].id;
            if (f.kind == Finding::Kind::MaterialOutOfRange) {
                out << format_diagnostic({Diagnostic::Severity::Warning,
                                          material_pointer(*layout, f.element), 0, 0,
                                          beam + ": " + f.message},
                                         path)
                    << "\n";
                ++warnings;
            } else {
                out << path << ": finding: " << beam << ": " << f.message << "\n";
                ++findings;
            }
        }
    }
    out << path << ": " << layout->beams.size() << " beam(s), " << layout->elements.size()
        << " element(s), " << warnings << " warning(s), " << findings << " finding(s)\n";
    return 0;
}

}  // namespace rv::cli
