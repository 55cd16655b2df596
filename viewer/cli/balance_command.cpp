// rendezvous balance: the stage position for zero delay, written to a new layout on request.
#include <cstdio>
#include <ostream>

#include "analysis/balance.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/layout_reader.hpp"

namespace rv::cli {

int run_balance(const BalanceOptions& options, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(options.layout, err);
    if (!layout) return 2;
    BalanceResult b;
    try {
        b = balance_delay(*layout, material_library_for(*layout));
    } catch (const std::invalid_argument& e) {
        err << options.layout << ": error: " << e.what() << "\n";
        return 2;
    }
    // With --write -, standard output holds the layout alone: the summary goes to stderr.
    std::ostream& say = options.output == "-" ? err : out;
    char line[256];
    std::snprintf(line, sizeof line, "delay now %+.1f fs (%s − %s)\n", b.delay_before_fs,
                  layout->beams[0].id.c_str(), layout->beams[1].id.c_str());
    say << line;
    if (!b.stage.empty()) {
        std::snprintf(line, sizeof line, "stage %s: zero delay at %.4f mm (%s its travel); set to %.4f mm\n",
                      b.stage.c_str(), b.zero_delay_mm, b.zero_in_travel ? "inside" : "outside", b.stage_set_mm);
        say << line;
    } else {
        say << "no stage changes the delay\n";
    }
    if (!b.add_path_to.empty()) {
        std::snprintf(line, sizeof line, "residual %+.1f fs: add %.3f mm of air path to the %s arm (or take it from the other)\n",
                      b.residual_delay_fs, b.add_path_mm, b.add_path_to.c_str());
        say << line;
    } else {
        std::snprintf(line, sizeof line, "residual %+.3f fs\n", b.residual_delay_fs);
        say << line;
    }
    if (!options.output.empty()) {
        if (!save_layout_or_report(b.layout, options.output, keep_input(options.layout), out, err))
            return 2;
        if (options.output != "-") say << "wrote " << options.output << "\n";
    }
    return 0;
}

}  // namespace rv::cli
