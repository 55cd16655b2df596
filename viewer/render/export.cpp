#include "render/export.hpp"

#include "io/atomic_file.hpp"
#include "render/headless.hpp"
#include "render/png.hpp"
#include "scene/svg_writer.hpp"

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

}  // namespace rv::render
