// rendezvous balance: the stage position for zero delay, written to a new layout on request.
#include <cstdio>
#include <nlohmann/json.hpp>
#include <ostream>

#include "analysis/balance.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/layout_reader.hpp"
#include "units/number_text.hpp"

namespace rv::cli {

int run_balance(const BalanceOptions& options, std::ostream& out, std::ostream& err) {
    if (options.json && options.output == "-") {
        err << "rendezvous: --json and --write - would both print to standard output; write the layout to a file\n";
        return 2;
    }
    const std::optional<Layout> layout = load_layout(options.layout, err);
    if (!layout) return 2;
    BalanceResult b;
    try {
        b = balance_delay(*layout, material_library_for(*layout));
    } catch (const std::invalid_argument& e) {
        err << options.layout << ": error: " << e.what() << "\n";
        return 2;
    }
    if (options.json) {
        using nlohmann::json;
        if (!options.output.empty() && !save_layout_or_report(b.layout, options.output, keep_input(options.layout), out, err))
            return 2;
        json j = {{"layout", options.layout},
                  {"delay_before_fs", b.delay_before_fs},
                  {"stage", nullptr},
                  {"residual_delay_fs", b.residual_delay_fs},
                  {"add_path", nullptr},
                  {"wrote", options.output.empty() ? json(nullptr) : json(options.output)}};
        if (!b.stage.empty())
            j["stage"] = {{"id", b.stage}, {"zero_delay_mm", b.zero_delay_mm}, {"zero_in_travel", b.zero_in_travel},
                          {"set_mm", b.stage_set_mm}};
        if (!b.add_path_to.empty()) j["add_path"] = {{"beam", b.add_path_to}, {"air_mm", b.add_path_mm}};
        out << j.dump(2) << "\n";
        return 0;
    }
    // With --write -, standard output holds the layout alone: the summary goes to stderr.
    std::ostream& say = options.output == "-" ? err : out;
    char line[256];
    say << "delay now " << format_duration_fs(b.delay_before_fs, true) << " (" << layout->beams[0].id << " − "
        << layout->beams[1].id << ")\n";
    if (!b.stage.empty()) {
        std::snprintf(line, sizeof line, "stage %s: zero delay at %.4f mm (%s its travel); set to %.4f mm\n",
                      b.stage.c_str(), b.zero_delay_mm, b.zero_in_travel ? "inside" : "outside", b.stage_set_mm);
        say << line;
    } else {
        say << "no stage changes the delay\n";
    }
    if (!b.add_path_to.empty()) {
        say << "residual " << format_duration_fs(b.residual_delay_fs, true) << ": add "
            << format_number("%.3f", b.add_path_mm) << " mm of air path to the " << b.add_path_to
            << " arm (or take it from the other)\n";
    } else {
        say << "residual " << format_duration_fs(b.residual_delay_fs, true) << "\n";
    }
    if (!options.output.empty()) {
        if (!save_layout_or_report(b.layout, options.output, keep_input(options.layout), out, err))
            return 2;
        if (options.output != "-") say << "wrote " << options.output << "\n";
    }
    return 0;
}

}  // namespace rv::cli
