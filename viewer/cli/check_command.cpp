// rendezvous check: read a layout, trace it, list every problem and finding.
#include <ostream>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/layout_reader.hpp"
#include "trace/trace.hpp"

namespace rv::cli {

int run_check(const std::string& path, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(path, err);
    if (!layout) return 2;
    size_t findings = 0;
    for (const Path& p : trace_layout(*layout, material_library_for(*layout))) {
        for (const Finding& f : p.findings) {
            out << path << ": finding: " << layout->beams[p.beam].id << ": " << f.message << "\n";
            ++findings;
        }
    }
    out << path << ": " << layout->beams.size() << " beam(s), " << layout->elements.size()
        << " element(s), " << findings << " finding(s)\n";
    return 0;
}

}  // namespace rv::cli
