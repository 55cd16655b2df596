// rendezvous calibrate: record a measured time-zero stage reading in a new layout.
#include <ostream>
#include <stdexcept>

#include "analysis/calibrate.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/layout_reader.hpp"
#include "units/number_text.hpp"

namespace rv::cli {

int run_calibrate(const CalibrateOptions& options, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(options.layout, err);
    if (!layout) return 2;
    std::optional<CalibrationResult> c;
    try {
        c = calibrate_time_zero(*layout, material_library_for(*layout), options.zero_mm);
    } catch (const std::invalid_argument& e) {
        err << options.layout << ": error: " << e.what() << "\n";
        return 2;
    }
    if (!save_layout_or_report(c->layout, options.output, keep_input(options.layout), out, err))
        return 2;
    // With --write -, standard output holds the layout alone.
    (options.output == "-" ? err : out)
        << "stage " << c->stage << ": zero measured at " << format_number("%.4f", options.zero_mm)
        << " mm; the model put " << format_duration_fs(c->emission_offset_fs) << " of delay there, now written into "
        << c->layout.beams[0].id << "'s emit_time_fs (" << format_number("%.3f", c->layout.beams[0].emit_time_fs)
        << " fs) in "
        << (options.output == "-" ? "standard output" : options.output) << "\n";
    return 0;
}

}  // namespace rv::cli
