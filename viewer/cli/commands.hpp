#pragma once
// The sub-commands of `rendezvous`. Each returns the process exit status:
// 0 success, 2 bad input (a message on stderr, nothing written), 3 a --check verdict failed.
#include <cstddef>
#include <cstdint>
#include <iosfwd>
#include <string>

namespace rv::cli {

struct ReportOptions {
    std::string layout;  // a path, or empty with demo
    bool demo = false;
    bool json = false;
    bool markdown = false;
    bool check = false;  // exit 3 when the verdict is not met in space, time and phase
};
int run_report(const ReportOptions& options, std::ostream& out, std::ostream& err);

struct CheckOptions {
    std::string layout;
    bool json = false;
};
// Every finding of the layout's report, located; exit 0 even with findings (2 on bad input).
int run_check(const CheckOptions& options, std::ostream& out, std::ostream& err);

struct FormatOptions {
    std::string layout;
    std::string output;  // "" = standard output
    bool in_place = false;
};
int run_format(const FormatOptions& options, std::ostream& out, std::ostream& err);

struct TraceOptions {
    std::string layout;
    bool json = false;
};
int run_trace(const TraceOptions& options, std::ostream& out, std::ostream& err);

struct CalibrateOptions {
    std::string layout;
    double zero_mm = 0;
    std::string output;
};
// Records a measured zero-delay stage reading: writes a new layout (see analysis/calibrate.hpp).
int run_calibrate(const CalibrateOptions& options, std::ostream& out, std::ostream& err);

struct SolveCommandOptions {
    std::string layout;
    std::string catalog;  // "" = the built-in generic catalog
    std::string output;   // write the best solution here
    int top = 5;
    bool json = false;    // one JSON object (docs/schemas/solve.schema.json) instead of the ranking
};
int run_solve(const SolveCommandOptions& options, std::ostream& out, std::ostream& err);

struct ToleranceOptions {
    std::string layout;
    size_t samples = 10000;
    std::uint64_t seed = 1;
    bool json = false;  // one JSON object (docs/schemas/tolerance.schema.json) instead of the tables
};
int run_tolerance(const ToleranceOptions& options, std::ostream& out, std::ostream& err);

struct BalanceOptions {
    std::string layout;
    std::string output;  // "" = print only
    bool json = false;   // one JSON object (docs/schemas/balance.schema.json) instead of the text
};
int run_balance(const BalanceOptions& options, std::ostream& out, std::ostream& err);

struct PhaseOptions {
    std::string layout;
    std::string process;  // "sfg" or "shg:BEAM"
    std::string output;   // "" = print only
    bool json = false;    // one JSON object (docs/schemas/phase.schema.json) instead of the text
};
// Sets the target crystal for a process and turns or tilts it to phase-match
// (analysis/phase_setting.hpp), written to a new layout on request.
int run_phase(const PhaseOptions& options, std::ostream& out, std::ostream& err);

struct PolarizeOptions {
    std::string layout, plate, beam, output;
    double power_mw = -1;  // < 0: the most power in the polarization the crystal needs
    bool json = false;     // one JSON object (docs/schemas/polarize.schema.json) instead of the text
};
int run_polarize(const PolarizeOptions& options, std::ostream& out, std::ostream& err);

struct SweepOptions {
    std::string layout;
    std::string vary;  // ID.FIELD
    double from = 0, to = 0;
    int steps = 11;
    bool csv = false;
    bool json = false;  // one JSON object (docs/schemas/sweep.schema.json) instead of the table
};
// A value the sweep cannot compute is printed as nan (a beam that misses the target).
int run_sweep(const SweepOptions& options, std::ostream& out, std::ostream& err);

struct ScanOptions {
    std::string layout;
    std::string csv, png;            // "" = none, "-" = standard output (then the plan on stderr)
    int width = 1000, height = 700;  // the PNG's size
    int stage_points = 0, rotation_points = 0;  // the grid (0: the plan's, analysis/scan.hpp)
};
// The plan to find the signal: text, the map as CSV and as PNG (exit 2 when it cannot be made).
int run_scan(const ScanOptions& options, std::ostream& out, std::ostream& err);

struct RenderOptions {
    std::string layout;
    bool demo = false;
    std::string png, svg;  // at least one
    int width = 1600, height = 1000;
    int threads = 1;
};
int run_render(const RenderOptions& options, std::ostream& out, std::ostream& err);

// The sampled beam radius along each path, as CSV: beam,s_mm,radius_tangential_um,radius_sagittal_um
int run_caustic(const std::string& layout, std::ostream& out, std::ostream& err);

struct SheetOptions {
    std::string layout;
    std::string svg;  // "" = no drawing; else page 1 here, the others beside it as NAME-2.svg, …
    bool markdown = false;
    bool json = false;
};
// The build sheet: parts list, each optic's hole, offset and angle in placement order.
int run_sheet(const SheetOptions& options, std::ostream& out, std::ostream& err);

}  // namespace rv::cli
