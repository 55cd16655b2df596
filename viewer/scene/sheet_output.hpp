#pragma once
// The build sheet as a person reads it: text, Markdown or JSON on a stream, and the table at 1:1
// on A4 pages as SVG files (scene/sheet_svg.hpp). Shared by `rendezvous sheet` and the window's
// File ▸ Build sheet; formatting only, every figure from core (analysis/build_sheet.hpp).
#include <iosfwd>
#include <string>

#include "io/atomic_file.hpp"
#include "layout/layout.hpp"

namespace rv::scene {

struct SheetOutput {
    std::string svg;  // "" = no drawing; else page 1 here (NAME.svg), the others as NAME-2.svg, …
    bool markdown = false;
    bool json = false;
};

// Writes the sheet of `layout` (read from `source`, named in messages) to `out` and the SVG
// pages through write_file_safely with `rules`. Returns the exit status: 0, or 2 with the reason
// on `err` and nothing written (a bad SVG name, a table too large to tile, a number that is
// not finite, a file that cannot be written).
int write_sheet(const Layout& layout, const std::string& source, const SheetOutput& output, const SafeWriteRules& rules,
                std::ostream& out, std::ostream& err);

}  // namespace rv::scene
