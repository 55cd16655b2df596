#pragma once
// The table scene as an SVG drawing at true scale (1 user unit = 1 mm; printed at 100 % the
// breadboard is its real size), with a title block, legend and scale bar.
#include <string>

#include "scene/scene.hpp"

namespace rv::scene {

std::string write_svg(const Scene& scene);

// Pieces of SVG text shared by the writers: "#rrggbb", a number with 3 decimals, and text with
// &, <, > and " escaped for an attribute or an element.
std::string svg_rgb(const Colour& c);
std::string svg_number(double v);
std::string svg_escape(const std::string& s);

}  // namespace rv::scene
