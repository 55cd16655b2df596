// rendezvous sheet: the build sheet (analysis/build_sheet.hpp) as text, Markdown or JSON, and
// with --svg the table at 1:1 on A4 pages (scene/sheet_output.hpp does the formatting).
#include <ostream>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "scene/sheet_output.hpp"

namespace rv::cli {

int run_sheet(const SheetOptions& o, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(o.layout, err);
    if (!layout) return 2;
    return scene::write_sheet(*layout, o.layout, {o.svg, o.markdown, o.json}, keep_input(o.layout), out, err);
}

}  // namespace rv::cli
