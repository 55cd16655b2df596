// rendezvous polarize: turn a wave plate for a wanted power at the target, or for the most power
// in the polarization the crystal needs; the result as a new layout on request.
#include <cstdio>
#include <nlohmann/json.hpp>
#include <ostream>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/layout_reader.hpp"
#include "solve/wave_plate.hpp"

namespace rv::cli {

int run_polarize(const PolarizeOptions& o, std::ostream& out, std::ostream& err) {
    if (o.json && o.output == "-") {
        err << "rendezvous: --json and --write - would both print to standard output; write the layout to a file\n";
        return 2;
    }
    const std::optional<Layout> layout = load_layout(o.layout, err);
    if (!layout) return 2;
    WavePlateGoal goal{o.plate, o.beam, std::nullopt};
    if (o.power_mw >= 0) goal.power_mw = o.power_mw;
    const WavePlateResult r = set_wave_plate(*layout, material_library_for(*layout), goal);
    if (!r.error.empty()) {
        err << o.layout << ": error: " << r.error << "\n";
        return 2;
    }
    if (o.json) {
        using nlohmann::json;
        if (!o.output.empty() && !save_layout_or_report(r.layout, o.output, keep_input(o.layout), out, err)) return 2;
        auto useful = [&](double mw) { return r.crystal_needs_known ? json(mw) : json(nullptr); };
        out << json{{"layout", o.layout},
                    {"plate", o.plate},
                    {"beam", r.beam},
                    {"angle_before_deg", r.angle_before_deg},
                    {"angle_deg", r.angle_deg},
                    {"power_before_mw", r.power_before_mw},
                    {"power_mw", r.power_mw},
                    {"useful_before_mw", useful(r.useful_before_mw)},
                    {"useful_mw", useful(r.useful_mw)},
                    {"reached", r.reached},
                    {"wrote", o.output.empty() ? json(nullptr) : json(o.output)}}
                   .dump(2)
            << "\n";
        return 0;
    }
    // With --write -, standard output holds the layout alone: the summary goes to stderr.
    std::ostream& say = o.output == "-" ? err : out;
    char line[320];
    std::snprintf(line, sizeof line, "%s: fast axis %.2f° → %.2f°; %s at the target %.2f → %.2f mW", o.plate.c_str(),
                  r.angle_before_deg, r.angle_deg, r.beam.c_str(), r.power_before_mw, r.power_mw);
    say << line;
    if (r.useful_before_mw > 0 || r.useful_mw > 0) {
        std::snprintf(line, sizeof line, ", in the polarization the crystal needs %.2f → %.2f mW", r.useful_before_mw,
                      r.useful_mw);
        say << line;
    }
    say << "\n";
    if (!r.reached)
        say << "the wanted power cannot be reached with this plate; this is the closest\n";
    if (!o.output.empty()) {
        if (!save_layout_or_report(r.layout, o.output, keep_input(o.layout), out, err)) return 2;
        if (o.output != "-") say << "wrote " << o.output << "\n";
    }
    return 0;
}

}  // namespace rv::cli
