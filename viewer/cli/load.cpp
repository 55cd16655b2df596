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

bool save_layout_or_report(const Layout& layout, const std::string& path,
                           const SafeWriteRules& rules, std::ostream& out, std::ostream& err) {
    if (path == "-") {
        // The same checks as a file's, so that what is printed reads back too.
        const std::string text = write_layout(layout);
        std::string why = unwritable_reason(layout);
        if (why.empty()) why = unreadable_reason(text);
        if (!why.empty()) {
            err << "rendezvous: cannot write standard output: " << why << "\n";
            return false;
        }
        out << text << std::flush;
        return true;
    }
    try {
        save_layout(layout, path, rules);
        return true;
    } catch (const std::runtime_error& e) {
        err << "rendezvous: " << e.what() << "\n";
        return false;
    }
}

bool destination_writable_or_report(const std::string& path, const SafeWriteRules& rules, std::ostream& err) {
    if (path == "-") return true;
    try {
        check_file_writable(path, rules);
        return true;
    } catch (const std::runtime_error& e) {
        err << "rendezvous: " << e.what() << "\n";
        return false;
    }
}

SafeWriteRules keep_input(const std::string& input) {
    SafeWriteRules rules;
    rules.must_not_be = input;
    rules.how_to_replace_it =
        "to replace it on purpose, write elsewhere and then move that file over it";
    return rules;
}

Layout demo_layout() {
    LayoutReadResult r = read_layout(demo_layout_text());
    if (!r.layout) throw std::logic_error("the built-in demo layout does not read");
    return *r.layout;
}

}  // namespace rv::cli
