// rendezvous: command-line front end (the interactive window arrives with the viewer issue).
// Exit status: 0 success, 2 bad input or bad command line.
#include <CLI/CLI.hpp>
#include <iostream>

#include "cli/report_command.hpp"

int main(int argc, char** argv) {
    CLI::App app{"Rendezvous: plan two-colour beam combining (focus, size, timing, phase matching).",
                 "rendezvous"};
    app.set_version_flag("--version", std::string("rendezvous ") + RENDEZVOUS_VERSION);
    app.require_subcommand(0, 1);
    app.footer("Example:\n  rendezvous report --demo");

    rv::cli::ReportOptions report;
    CLI::App* report_cmd = app.add_subcommand(
        "report", "Report where and how the two colours focus.\n"
                  "Example: rendezvous report --demo --json");
    report_cmd->add_flag("--demo", report.demo, "use the demo built into the program");
    report_cmd->add_flag("--json", report.json, "print one JSON object instead of text");

    try {
        app.parse(argc, argv);
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
    std::cout << app.help();
    return 0;
}
