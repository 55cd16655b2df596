#include "io/diagnostic.hpp"

#include <algorithm>

namespace rv {

bool has_errors(const Diagnostics& diagnostics) {
    return std::any_of(diagnostics.begin(), diagnostics.end(), [](const Diagnostic& d) {
        return d.severity == Diagnostic::Severity::Error;
    });
}

std::string format_diagnostic(const Diagnostic& d, std::string_view file) {
    std::string out(file);
    if (d.line > 0) out += ":" + std::to_string(d.line) + ":" + std::to_string(d.column);
    out += d.severity == Diagnostic::Severity::Error ? ": error: " : ": warning: ";
    if (!d.pointer.empty()) out += d.pointer + ": ";
    out += d.message;
    return out;
}

}  // namespace rv
