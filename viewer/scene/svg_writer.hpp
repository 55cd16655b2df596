#pragma once
// The table scene as an SVG drawing at true scale (1 user unit = 1 mm; printed at 100 % the
// breadboard is its real size), with a title block, legend and scale bar.
#include <cstddef>
#include <stdexcept>
#include <string>

#include "scene/scene.hpp"

namespace rv::scene {

// The largest SVG write_svg makes: beyond it, it throws SvgTooLarge before growing further
// (the drawing is built in memory; a layout never comes near it once the holes are bounded by
// kMaxDrawnHoles, but a caller's scene may hold any number of shapes).
inline constexpr std::size_t kMaxSvgBytes = std::size_t{64} << 20;  // 64 MiB

struct SvgTooLarge : std::runtime_error {
    using std::runtime_error::runtime_error;
};

// Shapes are clipped to the drawing's frame grown by kSvgClipMargin_mm (in doubles), so that a
// stage at 1e300 mm neither prints a 300-digit coordinate nor a truncated one; a shape with a
// non-finite point, or an area not wholly inside, is left out.
inline constexpr double kSvgClipMargin_mm = 1e4;

std::string write_svg(const Scene& scene);

// Pieces of SVG text shared by the writers: "#rrggbb", a number with 3 decimals, and text with
// &, <, > and " escaped for an attribute or an element.
std::string svg_rgb(const Colour& c);
std::string svg_number(double v);
std::string svg_escape(const std::string& s);

}  // namespace rv::scene
