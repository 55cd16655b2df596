// rendezvous report: the verdict, each beam at the target, mismatch, delay, overlap, phase
// matching, focusing, findings and safety; as text, JSON or Markdown.
#include <nlohmann/json.hpp>
#include <ostream>

#include "analysis/report.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/layout_reader.hpp"
#include "report/report_json.hpp"
#include "report/report_markdown.hpp"
#include "report/report_text.hpp"

namespace rv::cli {

int run_report(const ReportOptions& options, std::ostream& out, std::ostream& err) {
    std::optional<Layout> layout;
    if (options.demo) {
        layout = demo_layout();
    } else {
        layout = load_layout(options.layout, err);
        if (!layout) return 2;
    }
    const RendezvousReport r = build_report(*layout, material_library_for(*layout));
    if (options.json) out << nlohmann::json(r).dump(2) << "\n";
    else if (options.markdown) write_report_markdown(r, out);
    else write_report_text(r, out);
    const Verdict& v = r.verdict;
    if (options.check && !(verdict_passes(v.space) && verdict_passes(v.time) && verdict_passes(v.phase))) return 3;
    return 0;
}

}  // namespace rv::cli
