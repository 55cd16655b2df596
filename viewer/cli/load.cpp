#include "cli/load.hpp"

#include <ostream>
#include <stdexcept>

#include "io/layout_reader.hpp"

namespace rv::cli {

std::optional<Layout> load_layout(const std::string& path, std::ostream& err) {
    const LayoutReadResult r = read_layout_file(path);
    for (const Diagnostic& d : r.diagnostics) err << format_diagnostic(d, path) << "\n";
    return r.layout;
}

Layout demo_layout() {
    LayoutReadResult r = read_layout(demo_layout_text());
    if (!r.layout) throw std::logic_error("the built-in demo layout does not read");
    return *r.layout;
}

}  // namespace rv::cli
