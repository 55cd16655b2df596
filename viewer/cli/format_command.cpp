// rendezvous format: rewrite a layout in canonical form (to stdout, a file, or in place).
#include <ostream>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/layout_writer.hpp"

namespace rv::cli {

int run_format(const FormatOptions& options, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(options.layout, err);
    if (!layout) return 2;
    const std::string target = options.in_place ? options.layout : options.output;
    if (target.empty()) {
        out << write_layout(*layout);
        return 0;
    }
    return save_layout_or_report(*layout, target, err) ? 0 : 2;
}

}  // namespace rv::cli
