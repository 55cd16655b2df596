#pragma once
// What the table view shows, as plain geometry in table millimetres (x right, y up): the
// breadboard and its holes, each element's symbol and id, each beam's chief ray and its
// Gaussian envelope, finding markers, the target, a legend and a scale bar. Built from core
// values only; drawn by the ImGui table view (on the CPU rasterizer) and written as SVG by the
// same description, so the raster and the vector figure agree.

#include <string>
#include <vector>

#include "analysis/report.hpp"
#include "layout/layout.hpp"
#include "scene/wavelength_colour.hpp"

namespace rv::scene {

struct Polyline {
    std::vector<Vec2> points_mm;
    Colour colour;
    double width_mm = 0.5;   // stroke width on the table (scaled with the view)
    bool dashed = false;
    bool closed = false;
    bool filled = false;     // a closed outline filled with `colour`
    // A band: the first half of the points runs along one edge, the second half back along the
    // other (an envelope); it may be concave, so it is drawn as quads between the two edges.
    bool band = false;
};

// A label names a mark; where its box goes is decided at drawing time by the placement pass
// (scene/label_placement.hpp) for the drawing's text size: anchor_mm is the mark's centre,
// clear_mm how far its symbol reaches from there, at_mm a point on the preferred side.
struct Label {
    Vec2 at_mm;
    std::string text;
    Colour colour;
    double height_mm = 6;  // the SVG's font size
    Vec2 anchor_mm{0, 0};
    double clear_mm = 0;
};

struct LegendEntry {
    std::string text;
    Colour colour;
    bool dashed = false;
};

struct Scene {
    double width_mm = 0, height_mm = 0, grid_mm = 25;
    std::string title;
    Colour table_colour{236, 238, 240, 255};
    std::vector<Vec2> holes_mm;
    // A grid of more than kMaxDrawnHoles holes is not drawn (holes_mm empty): its count, which
    // the SVG's title block states. 0 when the holes are drawn.
    long long holes_not_drawn = 0;
    std::vector<Polyline> shapes;   // in drawing order: elements, envelopes, beams, markers
    std::vector<Label> labels;
    std::vector<LegendEntry> legend;
    double envelope_exaggeration = 20;  // the drawn half-width is w(s) × this factor
};

// The ink of the polarization marks, which no optic's symbol uses.
inline constexpr Colour kPolarizationInk{150, 50, 170, 255};

// The most holes a scene lists (a 12.5 m square table on a 25 mm grid): beyond it the grid
// is not drawn, so that neither the scene nor its SVG grows with the table's area unbounded.
inline constexpr long long kMaxDrawnHoles = 250'000;

struct SceneOptions {
    // The drawn half-width is w(s) × this factor; 0 picks a round factor (1, 2, 5, 10, …) that
    // makes the widest beam about 4 % of the table's smaller side.
    double envelope_exaggeration = 0;
    bool holes = true;
};

Scene build_scene(const Layout& layout, const RendezvousReport& report, const SceneOptions& options = {});

}  // namespace rv::scene
