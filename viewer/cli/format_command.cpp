// rendezvous format: rewrite a layout in canonical form (to stdout, a file, or in place).
#include <ostream>
#include <stdexcept>

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
    try {
        save_layout(*layout, target);
    } catch (const std::runtime_error& e) {
        err << "rendezvous: error: " << e.what() << "\n";
        return 2;
    }
    return 0;
}

}  // namespace rv::cli
