// rendezvous: the command line (the interactive window arrives with the viewer issue).
// Exit status: 0 success, 2 bad input or bad command line, 3 report --check found the verdict
// not met.
#include <CLI/CLI.hpp>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <iostream>

#include "analysis/scan.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "cli/number_option.hpp"
#include "window/window.hpp"

// The help of every command that writes a file: what the one writer does (io/atomic_file.hpp).
constexpr const char* kWriting =
    "Writing a file: it is replaced atomically (a temporary file beside it, flushed,\n"
    "read back, then renamed over it) and keeps its permissions; a symbolic link is\n"
    "written through to its target and stays a link. Refused with exit status 2,\n"
    "nothing written: a device, FIFO, socket or directory; a file with other hard\n"
    "links (the rename would part it from them); the input layout itself, by any path\n"
    "or link (write elsewhere, then move the file over it; format replaces its input\n"
    "only with --in-place); a layout holding NaN or infinity. A layout file must read\n"
    "back as a layout before it replaces anything. \"-\" writes a layout to stdout.\n"
    "Exit status: 0 success, 2 bad input.";

// Every numeric option: finite and within its range (cli/number_option.hpp, the bounds of
// layout/input_limits.hpp); counts keep CLI::Range for their own range.
const CLI::Validator kFinite = rv::cli::finite_number();

int main(int argc, char** argv) {
    CLI::App app{"Rendezvous: plan two-colour beam combining (focus, size, timing, phase matching).",
                 "rendezvous"};
    app.set_version_flag("--version", std::string("rendezvous ") + RENDEZVOUS_VERSION);
    app.require_subcommand(0, 1);
    app.footer("Exit status: 0 success, 2 bad input, 3 the verdict is not met (report --check).\n"
               "Examples:\n  rendezvous report --demo\n  rendezvous report layouts/sfg-bbo.json --json\n"
               "  rendezvous check my-table.json");

    rv::cli::ReportOptions report;
    CLI::App* report_cmd = app.add_subcommand(
        "report", "Report each beam at the target and how far apart the two are.\n"
                  "Example: rendezvous report layouts/sfg-bbo.json --json");
    report_cmd->add_option("layout", report.layout, "layout file (JSON)");
    report_cmd->add_flag("--demo", report.demo, "use the SFG demo built into the program");
    report_cmd->add_flag("--json", report.json, "print one JSON object instead of text");
    report_cmd->add_flag("--markdown", report.markdown, "print Markdown for a lab notebook");
    report_cmd->add_flag("--check", report.check, "exit with status 3 when the verdict is not met");

    rv::cli::CheckOptions check;
    CLI::App* check_cmd = app.add_subcommand(
        "check", "Read and trace a layout; list every error and finding (exit 2 on errors).\n"
                 "Example: rendezvous check layouts/pump-probe.json");
    check_cmd->add_option("layout", check.layout, "layout file (JSON)")->required();
    check_cmd->add_flag("--json", check.json, "one JSON object: the findings as report --json lists them");

    rv::cli::FormatOptions format;
    CLI::App* format_cmd = app.add_subcommand(
        "format", "Rewrite a layout in canonical form.\n"
                  "Example: rendezvous format mine.json --in-place");
    format_cmd->add_option("layout", format.layout, "layout file (JSON)")->required();
    format_cmd->add_option("-o,--output", format.output,
                           "write here instead of stdout (- is stdout; not the input)");
    format_cmd->add_flag("--in-place", format.in_place,
                         "replace the layout file itself (through a link, its target)");
    format_cmd->footer(kWriting);

    rv::cli::TraceOptions trace;
    CLI::App* trace_cmd = app.add_subcommand(
        "trace", "List every hit of every beam with the beam radius there.\n"
                 "Example: rendezvous trace layouts/sfg-bbo.json");
    trace_cmd->add_option("layout", trace.layout, "layout file (JSON)")->required();
    trace_cmd->add_flag("--json", trace.json, "print one JSON object instead of text");

    std::string caustic_layout;
    bool caustic_csv = false;
    CLI::App* caustic_cmd = app.add_subcommand(
        "caustic", "Print the sampled beam radius along each path (both planes).\n"
                   "Example: rendezvous caustic layouts/sfg-bbo.json --csv > caustic.csv");
    caustic_cmd->add_option("layout", caustic_layout, "layout file (JSON)")->required();
    caustic_cmd->add_flag("--csv", caustic_csv, "CSV output (the only format so far)")->required();

    rv::cli::CalibrateOptions calibrate;
    CLI::App* calibrate_cmd = app.add_subcommand(
        "calibrate", "Record the stage reading where the pulses were found to overlap; write a new layout\n"
                     "whose model agrees with it, so later changes predict the new zero.\n"
                     "Example: rendezvous calibrate sfg.json --zero 29.84 --write sfg-calibrated.json");
    calibrate_cmd->add_option("layout", calibrate.layout, "layout file (JSON)")->required();
    calibrate_cmd->add_option("--zero", calibrate.zero_mm, "measured zero-delay stage reading, mm")->check(rv::cli::length_option_mm())->required();
    calibrate_cmd
        ->add_option("--write", calibrate.output,
                     "the new layout file (- is stdout, the summary then on stderr)")
        ->required();
    calibrate_cmd->footer(kWriting);

    rv::cli::SolveCommandOptions solve;
    CLI::App* solve_cmd = app.add_subcommand(
        "solve", "Choose stock lenses and positions for the layout's goals.solve; rank the solutions.\n"
                 "Example: rendezvous solve mine.json --write mine-solved.json");
    solve_cmd->add_option("layout", solve.layout, "layout file (JSON)")->required();
    solve_cmd->add_option("--catalog", solve.catalog, "lens catalog (default: the built-in generic one)");
    solve_cmd->add_option("--top", solve.top, "how many solutions to list")->check(kFinite)->check(CLI::Range(1, 100));
    solve_cmd->add_flag("--json", solve.json, "one JSON object (docs/schemas/solve.schema.json) instead of the ranking");
    solve_cmd->add_option("--write", solve.output,
                          "write the best solution here (- is stdout, the ranking then on stderr)");
    solve_cmd->footer(kWriting);

    rv::cli::ToleranceOptions tolerance;
    CLI::App* tolerance_cmd = app.add_subcommand(
        "tolerance", "Sensitivities and a Monte Carlo run of the build tolerances (goals.tolerance).\n"
                     "Example: rendezvous tolerance layouts/sfg-bbo.json --samples 100000 --seed 7");
    tolerance_cmd->add_option("layout", tolerance.layout, "layout file (JSON)")->required();
    tolerance_cmd->add_option("--samples", tolerance.samples, "Monte Carlo samples")->check(kFinite)->check(CLI::Range(1, 10000000));
    tolerance_cmd->add_flag("--json", tolerance.json, "one JSON object (docs/schemas/tolerance.schema.json) instead of the tables");
    tolerance_cmd->add_option("--seed", tolerance.seed, "random seed (the result depends on it only)")->check(kFinite);

    rv::cli::PolarizeOptions polarize;
    CLI::App* polarize_cmd = app.add_subcommand(
        "polarize", "Turn a wave plate: a wanted power at the target (--power-mw), or the most power in the\n"
                    "polarization the crystal needs (the default).\n"
                    "Example: rendezvous polarize layouts/sfg-bbo.json --plate HWP_P --power-mw 1500 --write sfg-1500.json");
    polarize_cmd->add_option("layout", polarize.layout, "layout file (JSON)")->required();
    polarize_cmd->add_option("--plate", polarize.plate, "id of the half- or quarter-wave plate to turn")->required();
    polarize_cmd->add_option("--beam", polarize.beam, "the beam, when both pass the plate");
    polarize_cmd->add_option("--power-mw", polarize.power_mw, "wanted power at the target (mW)")->check(rv::cli::power_option_mw());
    polarize_cmd->add_flag("--json", polarize.json, "one JSON object (docs/schemas/polarize.schema.json) instead of the text");
    polarize_cmd->add_option("--write", polarize.output,
                             "write the layout with the plate turned here (- is stdout)");
    polarize_cmd->footer(kWriting);
    rv::cli::BalanceOptions balance;
    CLI::App* balance_cmd = app.add_subcommand(
        "balance", "Put the stage where the delay is zero; say what fixed path to add when it cannot.\n"
                   "Example: rendezvous balance layouts/sfg-bbo.json --write sfg-balanced.json");
    balance_cmd->add_option("layout", balance.layout, "layout file (JSON)")->required();
    balance_cmd->add_flag("--json", balance.json, "one JSON object (docs/schemas/balance.schema.json) instead of the text");
    balance_cmd->add_option(
        "--write", balance.output,
        "write the balanced layout here (- is stdout, the summary then on stderr)");
    balance_cmd->footer(kWriting);

    rv::cli::PhaseOptions phase;
    CLI::App* phase_cmd = app.add_subcommand(
        "phase", "Set the crystal for a process and turn or tilt it to phase-match; print the angle to dial.\n"
                 "Example: rendezvous phase layouts/sfg-bbo.json --process sfg --write sfg-phased.json");
    phase_cmd->add_option("layout", phase.layout, "layout file (JSON)")->required();
    phase_cmd->add_option("--process", phase.process, "sfg, or shg:BEAM (the SHG of the beam with that id)")->required();
    phase_cmd->add_flag("--json", phase.json, "one JSON object (docs/schemas/phase.schema.json) instead of the text");
    phase_cmd->add_option("--write", phase.output,
                          "write the layout with the crystal set here (- is stdout, the summary then on stderr)");
    phase_cmd->footer(kWriting);

    rv::cli::SweepOptions sweep;
    CLI::App* sweep_cmd = app.add_subcommand(
        "sweep", "Vary one numeric field and print the report's figures at each value.\n"
                 "Example: rendezvous sweep layouts/sfg-bbo.json --vary S1.position_mm --from 28 --to 32 --steps 9 --csv");
    sweep_cmd->add_option("layout", sweep.layout, "layout file (JSON)")->required();
    sweep_cmd->add_option("--vary", sweep.vary, "ID.FIELD, e.g. L_F.at_mm[0] or pump.waist_um")->required();
    sweep_cmd->add_option("--from", sweep.from, "first value")->check(rv::cli::sweep_end_option())->required();
    sweep_cmd->add_option("--to", sweep.to, "last value")->check(rv::cli::sweep_end_option())->required();
    sweep_cmd->add_option("--steps", sweep.steps, "number of values (≥ 2)")->check(kFinite)->check(CLI::Range(2, 100000));
    sweep_cmd->add_flag("--json", sweep.json, "one JSON object (docs/schemas/sweep.schema.json) instead of the table");
    sweep_cmd->add_flag("--csv", sweep.csv, "comma-separated output");

    rv::cli::ScanOptions scan;
    std::string scan_size = "1000x700", scan_points;
    CLI::App* scan_cmd = app.add_subcommand(
        "scan", "A plan to find the signal: the predicted generated power against the delay stage's\n"
                "position and the crystal's turn or tilt, the steps and ranges to scan, as text, CSV and PNG.\n"
                "Example: rendezvous scan layouts/sfg-bbo.json --png scan.png --csv scan.csv");
    scan_cmd->add_option("layout", scan.layout, "layout file (JSON)")->required();
    scan_cmd->add_option("--csv", scan.csv, "write the map here as CSV (- is stdout, the plan then on stderr)");
    scan_cmd->add_option("--png", scan.png, "write the map here as PNG (- is stdout, the plan then on stderr)");
    scan_cmd->add_option("--size", scan_size, "PNG size WxH in pixels (default 1000x700)");
    scan_cmd->add_option("--points", scan_points, "grid NxM: stage positions x crystal settings (each 1 to 1000)");
    scan_cmd->footer(kWriting);
    rv::cli::RenderOptions render;
    std::string render_size = "1600x1000";
    CLI::App* render_cmd = app.add_subcommand(
        "render", "Render the viewer frame to PNG with no display, or the table to SVG at true scale.\n"
                  "Example: rendezvous render layouts/sfg-bbo.json --png sfg.png --svg sfg.svg");
    render_cmd->add_option("layout", render.layout, "layout file (JSON)");
    render_cmd->add_flag("--demo", render.demo, "use the SFG demo built into the program");
    render_cmd->add_option("--png", render.png, "write the frame here as PNG (- is stdout, the summary then on stderr)");
    render_cmd->add_option("--svg", render.svg, "write the table here as SVG (- is stdout)");
    render_cmd->footer(kWriting);
    render_cmd->add_option("--size", render_size, "frame size WxH in pixels (default 1600x1000)");
    render_cmd->add_option("--threads", render.threads, "rasterizer threads (the image is the same)")->check(kFinite)->check(CLI::Range(1, 16));

    rv::cli::SheetOptions sheet;
    CLI::App* sheet_cmd = app.add_subcommand(
        "sheet", "The build sheet: the parts list (each part's specification and count), then every optic's\n"
                 "breadboard hole (column, row from the table's lower-left corner, the first hole half a pitch\n"
                 "in), its offset from that hole in mm and its angle, beam by beam in the order the light meets\n"
                 "them, then the optics no beam meets.\n"
                 "Example: rendezvous sheet layouts/sfg-bbo.json --svg sfg-sheet.svg");
    sheet_cmd->add_option("layout", sheet.layout, "layout file (JSON)")->required();
    sheet_cmd->add_option("--svg", sheet.svg,
                          "draw the table at 1:1 on A4 pages: page 1 is FILE (NAME.svg), the others\n"
                          "NAME-2.svg, NAME-3.svg, ... beside it");
    sheet_cmd->add_flag("--markdown", sheet.markdown, "print Markdown for a lab notebook");
    sheet_cmd->add_flag("--json", sheet.json, "print one JSON object instead of text");
    sheet_cmd->footer(std::string(
        "Pages: one SVG file per A4 page (210 x 297 mm, portrait or landscape, whichever needs\n"
        "fewer pages), each sized in mm so that printing it at 100 % (actual size, no fit to page)\n"
        "gives the table at its real size. A 15 mm margin holds the crop marks at the tile's\n"
        "corners, the page's place (column from the left, row from the front, the table area it\n"
        "covers), the neighbouring pages' numbers and a 100 mm bar to check the scale. Pages are\n"
        "numbered row by row from the front-left corner; trim at the crop marks and butt the\n"
        "pages edge to edge. At most 200 pages: a larger table is refused (exit 2).\n") + kWriting);

    std::string view_layout;
    rv::window::WindowOptions window_options;
    CLI::App* view_cmd = app.add_subcommand(
        "view", "Open the interactive window on a layout (the SFG demo without one).\n"
                "Drag to pan, wheel to zoom about the cursor, F or a double click to fit.\n"
                "Example: rendezvous view layouts/pump-probe.json   (or simply: rendezvous LAYOUT.json)");
    view_cmd->add_option("layout", view_layout, "layout file (JSON)");
    view_cmd->add_option("--quit-after-frames", window_options.quit_after_frames, "close after N frames (for tests)")->check(kFinite);
    std::string bare_layout;
    app.add_option("file", bare_layout, "a layout file to open in the window (the same as `view FILE`)");

    try {
        app.parse(argc, argv);
        if (*render_cmd) {
            if (render.demo == !render.layout.empty())
                throw CLI::ValidationError("render", "give either a layout file or --demo");
            if (render.png.empty() && render.svg.empty())
                throw CLI::ValidationError("render", "give --png FILE, --svg FILE or both");
            int w = 0, h = 0;
            char x = 0;
            if (std::sscanf(render_size.c_str(), "%d%c%d", &w, &x, &h) != 3 || x != 'x' || w < 64 || h < 64 ||
                w > 8192 || h > 8192)
                throw CLI::ValidationError("--size", "expected WxH between 64x64 and 8192x8192, got \"" + render_size + "\"");
            render.width = w;
            render.height = h;
        }
        if (*scan_cmd) {
            int w = 0, h = 0;
            char x = 0, extra = 0;
            if (std::sscanf(scan_size.c_str(), "%d%c%d%c", &w, &x, &h, &extra) != 3 || x != 'x' || w < 200 || h < 150 ||
                w > 8192 || h > 8192)
                throw CLI::ValidationError("--size", "expected WxH between 200x150 and 8192x8192, got \"" + scan_size + "\"");
            scan.width = w;
            scan.height = h;
            if (!scan_points.empty()) {
                int n = 0, m = 0;
                if (std::sscanf(scan_points.c_str(), "%d%c%d%c", &n, &x, &m, &extra) != 3 || x != 'x' || n < 1 || m < 1 ||
                    n > rv::kMaxScanPoints || m > rv::kMaxScanPoints)
                    throw CLI::ValidationError("--points", "expected NxM, each from 1 to 1000, got \"" + scan_points + "\"");
                scan.stage_points = n;
                scan.rotation_points = m;
            }
        }
        if (*report_cmd && report.json && report.markdown)
            throw CLI::ValidationError("report", "--json and --markdown exclude each other");
        if (*report_cmd && report.demo == !report.layout.empty())
            throw CLI::ValidationError("report", "give either a layout file or --demo");
        if (*format_cmd && format.in_place && !format.output.empty())
            throw CLI::ValidationError("format", "--in-place and --output exclude each other");
        if (*sheet_cmd && sheet.json && sheet.markdown)
            throw CLI::ValidationError("sheet", "--json and --markdown exclude each other");
    } catch (const CLI::CallForHelp& e) {
        return app.exit(e);
    } catch (const CLI::CallForAllHelp& e) {
        return app.exit(e);
    } catch (const CLI::CallForVersion& e) {
        return app.exit(e);
    } catch (const CLI::ParseError& e) {
        std::cerr << "rendezvous: error: " << e.what() << " (see rendezvous --help)\n";
        return 2;
    }
    if (*report_cmd) return rv::cli::run_report(report, std::cout, std::cerr);
    if (*check_cmd) return rv::cli::run_check(check, std::cout, std::cerr);
    if (*format_cmd) return rv::cli::run_format(format, std::cout, std::cerr);
    if (*trace_cmd) return rv::cli::run_trace(trace, std::cout, std::cerr);
    if (*render_cmd) return rv::cli::run_render(render, std::cout, std::cerr);
    if (*view_cmd || !bare_layout.empty()) {
        const std::string path = *view_cmd ? view_layout : bare_layout;
        std::optional<rv::Layout> layout = path.empty() ? std::optional<rv::Layout>(rv::cli::demo_layout())
                                                        : rv::cli::load_layout(path, std::cerr);
        if (!layout) return 2;
        return rv::window::run_window(*layout, path.empty() ? std::nullopt : std::optional<std::filesystem::path>(path),
                                      window_options, std::cerr);
    }
    if (*solve_cmd) return rv::cli::run_solve(solve, std::cout, std::cerr);
    if (*tolerance_cmd) return rv::cli::run_tolerance(tolerance, std::cout, std::cerr);
    if (*balance_cmd) return rv::cli::run_balance(balance, std::cout, std::cerr);
    if (*phase_cmd) return rv::cli::run_phase(phase, std::cout, std::cerr);
    if (*polarize_cmd) return rv::cli::run_polarize(polarize, std::cout, std::cerr);
    if (*sweep_cmd) return rv::cli::run_sweep(sweep, std::cout, std::cerr);
    if (*scan_cmd) return rv::cli::run_scan(scan, std::cout, std::cerr);
    if (*calibrate_cmd) return rv::cli::run_calibrate(calibrate, std::cout, std::cerr);
    if (*caustic_cmd) return rv::cli::run_caustic(caustic_layout, std::cout, std::cerr);
    if (*sheet_cmd) return rv::cli::run_sheet(sheet, std::cout, std::cerr);
    std::cout << app.help();
    return 0;
}
