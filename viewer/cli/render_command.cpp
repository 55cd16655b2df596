// rendezvous render: the viewer frame to PNG (CPU raster, no display) or the table to SVG.
#include <ostream>
#include <stdexcept>
#include <string>
#include <vector>

#include "analysis/report.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/atomic_file.hpp"
#include "io/layout_reader.hpp"
#include "render/headless.hpp"
#include "render/png.hpp"
#include "scene/svg_writer.hpp"

namespace rv::cli {

int run_render(const RenderOptions& o, std::ostream& out, std::ostream& err) {
    if (o.png == "-" && o.svg == "-") {
        err << "rendezvous: render: --png - and --svg - would both print to standard output; write one to a file\n";
        return 2;
    }
    std::optional<Layout> layout = o.demo ? std::optional<Layout>(demo_layout()) : load_layout(o.layout, err);
    if (!layout) return 2;
    const RendezvousReport report = build_report(*layout, material_library_for(*layout));
    const scene::Scene scene = scene::build_scene(*layout, report);
    // An image never replaces the layout it was drawn from.
    const SafeWriteRules rules = o.demo ? SafeWriteRules{} : keep_input(o.layout);
    // The SVG is made before anything is written: a refused one leaves no PNG behind either.
    std::string svg;
    if (!o.svg.empty()) {
        try {
            svg = scene::write_svg(scene);
        } catch (const scene::SvgTooLarge& e) {
            err << "rendezvous: cannot write " << (o.svg == "-" ? std::string("the SVG") : o.svg) << ": " << e.what()
                << "\n";
            return 2;
        }
    }
    try {
        // "-": the image on standard output, the summary on standard error.
        const bool to_stdout = o.png == "-" || o.svg == "-";
        std::ostream& say = to_stdout ? err : out;
        if (o.png == "-") {
            const std::vector<std::uint8_t> bytes =
                render::encode_png(render::render_frame(*layout, report, scene, o.width, o.height, o.threads));
            out.write(reinterpret_cast<const char*>(bytes.data()), static_cast<std::streamsize>(bytes.size()));
            say << "wrote the PNG to standard output (" << o.width << "x" << o.height << ")\n";
        } else if (!o.png.empty()) {
            render::save_png(
                render::render_frame(*layout, report, scene, o.width, o.height, o.threads), o.png,
                rules);
            say << "wrote " << o.png << " (" << o.width << "x" << o.height << ")\n";
        }
        if (!o.svg.empty()) {
            if (o.svg == "-") {
                out << svg;
                say << "wrote the SVG to standard output\n";
            } else {
                write_file_safely(o.svg, svg, rules);
                say << "wrote " << o.svg << "\n";
            }
            if (scene.holes_not_drawn > 0)
                say << "the mounting holes are not drawn: " << scene.holes_not_drawn << " of them, more than "
                    << scene::kMaxDrawnHoles << "\n";
        }
    } catch (const std::runtime_error& e) {
        err << "rendezvous: " << e.what() << "\n";  // "cannot write PATH: REASON"
        return 2;
    }
    return 0;
}

}  // namespace rv::cli
