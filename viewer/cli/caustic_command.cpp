// rendezvous caustic --csv: the sampled beam radius along each path, for the user's plots.
#include <cstdio>
#include <ostream>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/csv.hpp"
#include "io/layout_reader.hpp"
#include "trace/propagate.hpp"
#include "trace/trace.hpp"

namespace rv::cli {

int run_caustic(const std::string& path, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(path, err);
    if (!layout) return 2;
    const MaterialLibrary library = material_library_for(*layout);
    out << "beam,s_mm,radius_tangential_um,radius_sagittal_um\n";
    for (const Path& p : trace_layout(*layout, library)) {
        const Caustic c = propagate_path(*layout, p);
        for (const EnvelopeSample& e : c.envelope) {
            // The id apart from the buffer: it may be long, and holds a comma or a quote quoted.
            char numbers[160];
            std::snprintf(numbers, sizeof numbers, ",%.6f,%.4f,%.4f\n", e.s_mm, e.radius_tangential_um,
                          e.radius_sagittal_um);
            out << csv_field(layout->beams[p.beam].id) << numbers;
        }
    }
    return 0;
}

}  // namespace rv::cli
