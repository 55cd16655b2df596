#include "scene/svg_writer.hpp"

#include <cstdio>
#include <sstream>

namespace rv::scene {

namespace {

std::string rgb(const Colour& c) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "#%02x%02x%02x", c.r, c.g, c.b);
    return buf;
}
std::string num(double v) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.3f", v);
    return buf;
}
std::string escape(const std::string& s) {
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

}  // namespace

std::string write_svg(const Scene& s) {
    const double margin = 20, block = 40;  // mm: a frame around the table, a title block below
    const double w = s.width_mm + 2 * margin, h = s.height_mm + 2 * margin + block;
    // Table coordinates (y up) to SVG (y down): X = x + margin, Y = margin + H − y.
    auto X = [&](double x) { return num(x + margin); };
    auto Y = [&](double y) { return num(margin + s.height_mm - y); };
    std::ostringstream o;
    o << "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
      << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << num(w) << "mm\" height=\"" << num(h)
      << "mm\" viewBox=\"0 0 " << num(w) << " " << num(h) << "\" font-family=\"DejaVu Sans, sans-serif\">\n"
      << "<title>" << escape(s.title) << "</title>\n"
      << "<rect x=\"0\" y=\"0\" width=\"" << num(w) << "\" height=\"" << num(h) << "\" fill=\"#ffffff\"/>\n"
      << "<rect x=\"" << X(0) << "\" y=\"" << Y(s.height_mm) << "\" width=\"" << num(s.width_mm) << "\" height=\""
      << num(s.height_mm) << "\" fill=\"" << rgb(s.table_colour) << "\" stroke=\"#9098a0\" stroke-width=\"0.5\"/>\n";
    o << "<g fill=\"#b8bec6\">\n";
    for (const Vec2& p : s.holes_mm) o << "<circle cx=\"" << X(p.x()) << "\" cy=\"" << Y(p.y()) << "\" r=\"1.5\"/>\n";
    o << "</g>\n";
    for (const Polyline& p : s.shapes) {
        std::string pts;
        for (const Vec2& q : p.points_mm) pts += X(q.x()) + "," + Y(q.y()) + " ";
        const bool area = p.filled;
        o << "<" << (p.closed || area ? "polygon" : "polyline") << " points=\"" << pts << "\"";
        if (area) {
            o << " fill=\"" << rgb(p.colour) << "\"";
            if (p.colour.a < 255) o << " fill-opacity=\"" << num(p.colour.a / 255.0) << "\"";
            o << (p.width_mm > 0 ? " stroke=\"#505a66\" stroke-width=\"" + num(p.width_mm) + "\"" : std::string(" stroke=\"none\""));
        } else {
            o << " fill=\"none\" stroke=\"" << rgb(p.colour) << "\" stroke-width=\"" << num(p.width_mm) << "\"";
            if (p.dashed) o << " stroke-dasharray=\"4 2.5\"";
        }
        o << "/>\n";
    }
    for (const Label& l : s.labels)
        o << "<text x=\"" << X(l.at_mm.x()) << "\" y=\"" << Y(l.at_mm.y()) << "\" font-size=\"" << num(l.height_mm)
          << "\" fill=\"" << rgb(l.colour) << "\">" << escape(l.text) << "</text>\n";
    // Title block: name, legend, scale bar (100 mm), exaggeration of the envelopes.
    const double top = margin * 2 + s.height_mm;
    o << "<text x=\"" << num(margin) << "\" y=\"" << num(top + 6) << "\" font-size=\"7\" fill=\"#1e1e28\">"
      << escape(s.title) << "</text>\n";
    double lx = margin;
    for (const LegendEntry& e : s.legend) {
        o << "<line x1=\"" << num(lx) << "\" y1=\"" << num(top + 16) << "\" x2=\"" << num(lx + 14) << "\" y2=\""
          << num(top + 16) << "\" stroke=\"" << rgb(e.colour) << "\" stroke-width=\"1.2\""
          << (e.dashed ? " stroke-dasharray=\"4 2.5\"" : "") << "/>\n"
          << "<text x=\"" << num(lx + 17) << "\" y=\"" << num(top + 18) << "\" font-size=\"5\" fill=\"#1e1e28\">"
          << escape(e.text) << "</text>\n";
        lx += 22 + 2.6 * e.text.size();
    }
    o << "<line x1=\"" << num(margin) << "\" y1=\"" << num(top + 28) << "\" x2=\"" << num(margin + 100) << "\" y2=\""
      << num(top + 28) << "\" stroke=\"#1e1e28\" stroke-width=\"1\"/>\n"
      << "<text x=\"" << num(margin + 104) << "\" y=\"" << num(top + 30) << "\" font-size=\"5\" fill=\"#1e1e28\">100 mm"
      << " (true scale when printed at 100 %); beam envelopes × " << num(s.envelope_exaggeration) << "</text>\n";
    o << "</svg>\n";
    return o.str();
}

}  // namespace rv::scene
