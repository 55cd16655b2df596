#pragma once
// File ▸ Export of the window: the whole frame as a PNG (rendered headless at 1600 × 1000) or the
// table as a true-scale SVG, written atomically. Returns "" or what went wrong.
#include <filesystem>
#include <string>

#include "edit/document.hpp"

namespace rv::render {

std::string export_document(const edit::Document& doc, const std::filesystem::path& path, bool svg, int threads = 1);

// File ▸ Build sheet: the sheet of the layout as it is in the window (scene/sheet_output.hpp),
// the table at 1:1 on A4 pages from `svg` (NAME.svg, NAME-2.svg, …) and the parts list and
// placements as Markdown beside it (NAME.md). Returns "" or what went wrong; `wrote` lists the
// files written.
std::string export_build_sheet(const edit::Document& doc, const std::filesystem::path& svg,
                               std::string* wrote = nullptr);

}  // namespace rv::render
