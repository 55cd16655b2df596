#include "render/export.hpp"

#include "io/atomic_file.hpp"
#include "render/headless.hpp"
#include "render/png.hpp"
#include "scene/sheet_output.hpp"
#include "scene/svg_writer.hpp"

#include <sstream>

namespace rv::render {

std::string export_document(const edit::Document& doc, const std::filesystem::path& path, bool svg, int threads) {
    try {
        if (svg)
            write_file_safely(path, scene::write_svg(doc.scene()));
        else save_png(render_frame(doc.layout(), doc.report(), doc.scene(), 1600, 1000, threads), path);
    } catch (const std::exception& e) {
        return std::string("cannot export: ") + e.what();
    }
    return "";
}

std::string export_build_sheet(const edit::Document& doc, const std::filesystem::path& svg, std::string* wrote) {
    const std::string source = doc.path() ? doc.path()->string() : std::string("the layout in the window");
    std::ostringstream markdown, summary, error;
    // Markdown first into memory, the SVG pages written by write_sheet; the Markdown file last.
    if (scene::write_sheet(doc.layout(), source, {svg.string(), true, false}, {}, markdown, error) != 0) {
        std::string e = error.str();
        while (!e.empty() && e.back() == '\n') e.pop_back();
        return e;
    }
    std::filesystem::path md = svg;
    md.replace_extension(".md");
    try {
        write_file_safely(md, markdown.str());
    } catch (const std::exception& e) {
        return std::string("cannot write the sheet: ") + e.what();
    }
    if (wrote) *wrote = svg.string() + " (and any further pages beside it) and " + md.string();
    return "";
}

}  // namespace rv::render
