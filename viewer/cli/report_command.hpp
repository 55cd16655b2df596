#pragma once
#include <ostream>

namespace rv::cli {

struct ReportOptions {
    bool demo = false;
    bool json = false;
};

// Prints the report for the built-in demo; returns the process exit status.
int run_report(const ReportOptions& options, std::ostream& out, std::ostream& err);

}  // namespace rv::cli
