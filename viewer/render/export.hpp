#pragma once
// File ▸ Export of the window: the whole frame as a PNG (rendered headless at 1600 × 1000) or the
// table as a true-scale SVG, written atomically. Returns "" or what went wrong.
#include <filesystem>
#include <string>

#include "edit/document.hpp"

namespace rv::render {

std::string export_document(const edit::Document& doc, const std::filesystem::path& path, bool svg, int threads = 1);

}  // namespace rv::render
