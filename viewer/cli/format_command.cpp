// rendezvous format: rewrite a layout in canonical form (to stdout, a file, or in place).
#include <ostream>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/layout_writer.hpp"

namespace rv::cli {

int run_format(const FormatOptions& options, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(options.layout, err);
    if (!layout) return 2;
    // --in-place is the one way to replace the input (through a link, to its target); --output
    // naming the input by any spelling or link is refused, so a slip cannot overwrite it.
    SafeWriteRules rules;
    if (!options.in_place) {
        rules.must_not_be = options.layout;
        rules.how_to_replace_it = "use --in-place to replace it";
    }
    const std::string target = options.in_place ? options.layout : options.output;
    return save_layout_or_report(*layout, target.empty() ? "-" : target, rules, out, err) ? 0 : 2;
}

}  // namespace rv::cli
