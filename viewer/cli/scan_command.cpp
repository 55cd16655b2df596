// rendezvous scan: the plan to find the signal (analysis/scan.hpp) as text, its map as CSV
// (RFC 4180, units in the header) and as a PNG drawn by the CPU renderer.
#include <ostream>
#include <sstream>
#include <stdexcept>

#include "analysis/scan.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/atomic_file.hpp"
#include "io/csv.hpp"
#include "io/layout_reader.hpp"
#include "render/png.hpp"
#include "render/scan_png.hpp"
#include "ui/scan_map.hpp"
#include "units/number_text.hpp"

namespace rv::cli {

namespace {

// One row per cell: stage_mm, rotation_deg, delay_fs, power_mw (empty where not finite).
std::string scan_csv(const ScanResult& r) {
    std::ostringstream out;
    const ScanPlan& p = r.plan;
    const std::string rot = p.rotation == CrystalRotation::Turn ? "turn" : "tilt";
    out << csv_field(p.stage_applies ? p.stage + "_position_mm" : "stage_position_mm") << ","
        << csv_field(p.crystal + "_" + rot + "_deg") << ",delay_fs,power_mw\r\n";
    const ScanMap& m = r.map;
    for (size_t j = 0; j < m.rotation_deg.size(); ++j)
        for (size_t i = 0; i < m.stage_mm.size(); ++i) {
            const std::optional<double>& v = m.power_mw[j * m.stage_mm.size() + i];
            const double delay =
                p.stage_applies ? p.delay_per_mm_fs * (m.stage_mm[i] - p.stage_mm.centre) : 0.0;
            out << (p.stage_applies ? format_number("%.6f", m.stage_mm[i]) : std::string()) << ","
                << format_number("%.6f", m.rotation_deg[j]) << ","
                << (p.stage_applies ? format_number("%.3f", delay) : std::string()) << ","
                << (v ? format_number("%.6g", *v) : std::string()) << "\r\n";
        }
    return out.str();
}

}  // namespace

int run_scan(const ScanOptions& o, std::ostream& out, std::ostream& err) {
    if (o.csv == "-" && o.png == "-") {
        err << "rendezvous: scan: --csv - and --png - would both print to standard output; write one to a file\n";
        return 2;
    }
    const std::optional<Layout> layout = load_layout(o.layout, err);
    if (!layout) return 2;
    const ScanResult r = plan_scan(*layout, material_library_for(*layout),
                                   ScanRequest{.stage_points = o.stage_points, .rotation_points = o.rotation_points});
    if (r.refusal) {
        err << o.layout << ": error: " << ui::scan_refusal_text(*r.refusal) << "\n";
        return 2;
    }
    const bool to_stdout = o.csv == "-" || o.png == "-";
    std::ostream& say = to_stdout ? err : out;
    const SafeWriteRules rules = keep_input(o.layout);
    try {
        // Everything is made before anything is written.
        const std::string csv = o.csv.empty() ? std::string() : scan_csv(r);
        std::vector<std::uint8_t> png;
        if (!o.png.empty()) png = render::encode_png(render::render_scan_map(r, o.width, o.height));
        for (const std::string& line : ui::scan_plan_lines(r)) say << line << "\n";
        if (o.csv == "-") out << csv;
        else if (!o.csv.empty()) {
            write_file_safely(o.csv, csv, rules);
            say << "wrote " << o.csv << "\n";
        }
        if (o.png == "-") out.write(reinterpret_cast<const char*>(png.data()), static_cast<std::streamsize>(png.size()));
        else if (!o.png.empty()) {
            write_file_safely(o.png, std::string_view(reinterpret_cast<const char*>(png.data()), png.size()), rules);
            say << "wrote " << o.png << " (" << o.width << "x" << o.height << ")\n";
        }
    } catch (const std::runtime_error& e) {
        err << "rendezvous: " << e.what() << "\n";
        return 2;
    }
    return 0;
}

}  // namespace rv::cli
