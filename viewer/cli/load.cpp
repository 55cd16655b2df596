#include "cli/load.hpp"

#include <ostream>
#include <stdexcept>

#include "io/layout_reader.hpp"
#include "io/layout_writer.hpp"

namespace rv::cli {

std::optional<Layout> load_layout(const std::string& path, std::ostream& err) {
    const LayoutReadResult r = read_layout_file(path);
    for (const Diagnostic& d : r.diagnostics) err << format_diagnostic(d, path) << "\n";
    return r.layout;
}

bool save_layout_or_report(const Layout& layout, const std::string& path, std::ostream& err) {
    try {
        save_layout(layout, path);
        return true;
    } catch (const std::runtime_error& e) {
        err << "rendezvous: error: " << e.what() << "\n";
        return false;
    }
}

Layout demo_layout() {
    LayoutReadResult r = read_layout(demo_layout_text());
    if (!r.layout) throw std::logic_error("the built-in demo layout does not read");
    return *r.layout;
}

}  // namespace rv::cli
