#include "scene/svg_writer.hpp"

#include <algorithm>
#include <cstdio>
#include <sstream>
#include <vector>

#include "scene/clip_segment.hpp"
#include "scene/label_placement.hpp"

namespace rv::scene {

std::string svg_rgb(const Colour& c) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "#%02x%02x%02x", c.r, c.g, c.b);
    return buf;
}
std::string svg_number(double v) {  // 3 decimals: µm on paper
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.3f", v);
    return buf;
}
std::string svg_escape(const std::string& s) {
    std::string out;
    for (char c : s) {
        if (c == '&') out += "&amp;";
        else if (c == '<') out += "&lt;";
        else if (c == '>') out += "&gt;";
        else if (c == '"') out += "&quot;";
        else out += c;
    }
    return out;
}

namespace {

bool inside(const Box& box, const Vec2& p) {
    return p.x() >= box.min.x() && p.x() <= box.max.x() && p.y() >= box.min.y() && p.y() <= box.max.y();
}

// The point lists a shape is drawn as: itself when it lies inside `box`; otherwise, for an
// outline, each of its segments clipped to the box; an area not wholly inside, nothing.
std::vector<std::vector<Vec2>> drawn_parts(const Polyline& p, const Box& box) {
    if (std::all_of(p.points_mm.begin(), p.points_mm.end(), [&](const Vec2& q) { return inside(box, q); }))
        return {p.points_mm};
    std::vector<std::vector<Vec2>> parts;
    if (p.filled || p.band || p.points_mm.size() < 2) return parts;
    const size_t n = p.points_mm.size();
    for (size_t i = 0; i + 1 < n + (p.closed ? 1 : 0); ++i)
        if (const auto part = clip_segment(p.points_mm[i], p.points_mm[(i + 1) % n], box))
            parts.push_back({part->first, part->second});
    return parts;
}

// Characters, not bytes (an id may hold µ or Greek letters).
double utf8_length(const std::string& text) {
    return static_cast<double>(std::count_if(text.begin(), text.end(), [](char c) { return (c & 0xC0) != 0x80; }));
}

void check_size(std::ostringstream& o) {
    if (static_cast<std::size_t>(o.tellp()) > kMaxSvgBytes)
        throw SvgTooLarge("the drawing would exceed " + std::to_string(kMaxSvgBytes) + " bytes (" +
                          std::to_string(kMaxSvgBytes >> 20) + " MiB) of SVG; nothing was written");
}

}  // namespace

std::string write_svg(const Scene& s) {
    const double margin = 20, block = 40;  // mm: a frame around the table, a title block below
    const double w = s.width_mm + 2 * margin, h = s.height_mm + 2 * margin + block;
    // Table coordinates (y up) to SVG (y down): X = x + margin, Y = margin + H − y.
    auto X = [&](double x) { return svg_number(x + margin); };
    auto Y = [&](double y) { return svg_number(margin + s.height_mm - y); };
    std::ostringstream o;
    o << "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
      << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << svg_number(w) << "mm\" height=\"" << svg_number(h)
      << "mm\" viewBox=\"0 0 " << svg_number(w) << " " << svg_number(h) << "\" font-family=\"DejaVu Sans, sans-serif\">\n"
      << "<title>" << svg_escape(s.title) << "</title>\n"
      << "<rect x=\"0\" y=\"0\" width=\"" << svg_number(w) << "\" height=\"" << svg_number(h) << "\" fill=\"#ffffff\"/>\n"
      << "<rect x=\"" << X(0) << "\" y=\"" << Y(s.height_mm) << "\" width=\"" << svg_number(s.width_mm) << "\" height=\""
      << svg_number(s.height_mm) << "\" fill=\"" << svg_rgb(s.table_colour) << "\" stroke=\"#9098a0\" stroke-width=\"0.5\"/>\n";
    o << "<g fill=\"#b8bec6\">\n";
    for (const Vec2& p : s.holes_mm) o << "<circle cx=\"" << X(p.x()) << "\" cy=\"" << Y(p.y()) << "\" r=\"1.5\"/>\n";
    o << "</g>\n";
    check_size(o);
    const Box frame = grown({Vec2(0, 0), Vec2(s.width_mm, s.height_mm)}, kSvgClipMargin_mm);
    for (const Polyline& shape : s.shapes) {
        for (const std::vector<Vec2>& points : drawn_parts(shape, frame)) {
            Polyline p = shape;
            if (points.size() != shape.points_mm.size()) p.closed = false;  // a clipped piece
            std::string pts;
            for (const Vec2& q : points) pts += X(q.x()) + "," + Y(q.y()) + " ";
            const bool area = p.filled;
            o << "<" << (p.closed || area ? "polygon" : "polyline") << " points=\"" << pts << "\"";
            if (area) {
                o << " fill=\"" << svg_rgb(p.colour) << "\"";
                if (p.colour.a < 255) o << " fill-opacity=\"" << svg_number(p.colour.a / 255.0) << "\"";
                o << (p.width_mm > 0 ? " stroke=\"#505a66\" stroke-width=\"" + svg_number(p.width_mm) + "\"" : std::string(" stroke=\"none\""));
            } else {
                o << " fill=\"none\" stroke=\"" << svg_rgb(p.colour) << "\" stroke-width=\"" << svg_number(p.width_mm) << "\"";
                if (p.dashed) o << " stroke-dasharray=\"4 2.5\"";
            }
            o << "/>\n";
            check_size(o);
        }
    }
    // Labels placed for their font size (an average advance of 0.6 em, common practice for
    // sans-serif text), the baseline a fifth of the size above the box's bottom.
    const std::vector<PlacedLabel> placed = place_labels(
        s, [](const Label& l) { return LabelSizeMm{0.6 * l.height_mm * utf8_length(l.text), l.height_mm}; }, 0.8);
    for (size_t i = 0; i < placed.size(); ++i) {
        const Label& l = s.labels[i];
        const Box& b = placed[i].box_mm;
        if (!inside(frame, b.min) || !inside(frame, b.max)) continue;
        if (placed[i].leader)
            o << "<line x1=\"" << X(placed[i].leader->first.x()) << "\" y1=\"" << Y(placed[i].leader->first.y())
              << "\" x2=\"" << X(placed[i].leader->second.x()) << "\" y2=\"" << Y(placed[i].leader->second.y())
              << "\" stroke=\"#787c84\" stroke-width=\"0.25\"/>\n";
        o << "<text x=\"" << X(b.min.x()) << "\" y=\"" << Y(b.min.y() + 0.2 * l.height_mm) << "\" font-size=\""
          << svg_number(l.height_mm) << "\" fill=\"" << svg_rgb(l.colour) << "\">" << svg_escape(l.text) << "</text>\n";
    }
    // Title block: name, legend, scale bar (100 mm), exaggeration of the envelopes.
    const double top = margin * 2 + s.height_mm;
    o << "<text x=\"" << svg_number(margin) << "\" y=\"" << svg_number(top + 6) << "\" font-size=\"7\" fill=\"#1e1e28\">"
      << svg_escape(s.title) << "</text>\n";
    double lx = margin;
    for (const LegendEntry& e : s.legend) {
        o << "<line x1=\"" << svg_number(lx) << "\" y1=\"" << svg_number(top + 16) << "\" x2=\"" << svg_number(lx + 14) << "\" y2=\""
          << svg_number(top + 16) << "\" stroke=\"" << svg_rgb(e.colour) << "\" stroke-width=\"1.2\""
          << (e.dashed ? " stroke-dasharray=\"4 2.5\"" : "") << "/>\n"
          << "<text x=\"" << svg_number(lx + 17) << "\" y=\"" << svg_number(top + 18) << "\" font-size=\"5\" fill=\"#1e1e28\">"
          << svg_escape(e.text) << "</text>\n";
        lx += 22 + 2.6 * e.text.size();
    }
    o << "<line x1=\"" << svg_number(margin) << "\" y1=\"" << svg_number(top + 28) << "\" x2=\"" << svg_number(margin + 100) << "\" y2=\""
      << svg_number(top + 28) << "\" stroke=\"#1e1e28\" stroke-width=\"1\"/>\n"
      << "<text x=\"" << svg_number(margin + 104) << "\" y=\"" << svg_number(top + 30) << "\" font-size=\"5\" fill=\"#1e1e28\">100 mm"
      << " (true scale when printed at 100 %); beam envelopes × " << svg_number(s.envelope_exaggeration) << "</text>\n";
    if (s.holes_not_drawn > 0)
        o << "<text x=\"" << svg_number(margin) << "\" y=\"" << svg_number(top + 37) << "\" font-size=\"4\" fill=\"#1e1e28\">"
          << "mounting holes not drawn: " << s.holes_not_drawn << ", more than " << kMaxDrawnHoles << "</text>\n";
    o << "</svg>\n";
    check_size(o);
    return o.str();
}

}  // namespace rv::scene
