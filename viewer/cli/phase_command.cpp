// rendezvous phase: set the target crystal for a process (SFG, or the SHG of one beam), turn or
// tilt it to the phase-matching angle, print the angle to dial; write the new layout on request.
#include <nlohmann/json.hpp>
#include <ostream>
#include <stdexcept>

#include "analysis/phase_setting.hpp"
#include "report/verdict_words.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/layout_reader.hpp"
#include "units/number_text.hpp"

namespace rv::cli {

namespace {

nlohmann::json optional_number(const std::optional<double>& v) { return v ? nlohmann::json(*v) : nlohmann::json(nullptr); }

}  // namespace

int run_phase(const PhaseOptions& options, std::ostream& out, std::ostream& err) {
    if (options.json && options.output == "-") {
        err << "rendezvous: --json and --write - would both print to standard output; write the layout to a file\n";
        return 2;
    }
    const std::optional<Layout> layout = load_layout(options.layout, err);
    if (!layout) return 2;
    PhaseSetting s;
    try {
        s = set_crystal_for_process(*layout, material_library_for(*layout), options.process);
    } catch (const std::invalid_argument& e) {
        err << options.layout << ": error: --process " << options.process << ": " << e.what() << "\n";
        return 2;
    }
    const bool turn = s.rotation == CrystalRotation::Turn;
    if (options.json) {
        using nlohmann::json;
        if (!options.output.empty() && !save_layout_or_report(s.layout, options.output, keep_input(options.layout), out, err))
            return 2;
        const json j = {{"layout", options.layout},
                        {"crystal", s.crystal},
                        {"process", process_beams_text(s.process)},
                        {"rotation", turn ? "turn" : "tilt"},
                        {"change_deg", s.change_deg},
                        {"normal_deg", {{"before", s.normal_before_deg}, {"after", s.normal_after_deg}}},
                        {"tilt_deg", {{"before", s.tilt_before_deg}, {"after", s.tilt_after_deg}}},
                        {"by_temperature", s.by_temperature},
                        {"temperature_c", {{"before", optional_number(s.temperature_before_c)},
                                           {"after", optional_number(s.temperature_after_c)}}},
                        {"theta_pm_deg", s.theta_pm_deg},
                        {"theta_after_deg", s.theta_after_deg},
                        {"sinc2", {{"before", s.sinc2_before}, {"after", s.sinc2_after}}},
                        {"wrote", options.output.empty() ? json(nullptr) : json(options.output)}};
        out << j.dump(2) << "\n";
        return 0;
    }
    // With --write -, standard output holds the layout alone: the summary goes to stderr.
    std::ostream& say = options.output == "-" ? err : out;
    say << "crystal " << s.crystal << " set for " << process_beams_text(s.process);
    if (s.by_temperature) say << " by its temperature\n";
    else say << ": θ_pm " << format_number("%.3f", s.theta_pm_deg) << "° (internal)\n";
    if (s.by_temperature) {
        say << "set its oven to " << format_number("%.2f", s.temperature_after_c.value_or(0))
            << " °C (the angle stays): temperature_c " << format_number("%.2f", s.temperature_before_c.value_or(0))
            << " → " << format_number("%.2f", s.temperature_after_c.value_or(0)) << "\n";
    } else if (turn) {
        say << "turn it by " << format_number("%+.3f", s.change_deg)
            << "° (external, + = clockwise seen from above): normal_deg " << format_number("%.3f", s.normal_before_deg)
            << " → " << format_number("%.3f", s.normal_after_deg) << "\n";
    } else {
        say << "tilt it by " << format_number("%+.3f", s.change_deg)
            << "° (external, about the horizontal axis across the beam, + = the face normal rises): tilt_deg "
            << format_number("%.3f", s.tilt_before_deg) << " → " << format_number("%.3f", s.tilt_after_deg) << "\n";
    }
    say << "phase factor sinc² " << format_number("%.4f", s.sinc2_before) << " → " << format_number("%.4f", s.sinc2_after)
        << " (internal angle now " << format_number("%.3f", s.theta_after_deg) << "°)\n";
    if (!options.output.empty()) {
        if (!save_layout_or_report(s.layout, options.output, keep_input(options.layout), out, err)) return 2;
        if (options.output != "-") say << "wrote " << options.output << "\n";
    }
    return 0;
}

}  // namespace rv::cli
