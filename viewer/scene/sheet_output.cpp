// The build sheet's output (scene/sheet_output.hpp): formatting only, every figure comes from
// core (analysis/build_sheet.hpp).
#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <nlohmann/json.hpp>
#include <ostream>
#include <sstream>
#include <stdexcept>

#include "scene/sheet_output.hpp"

#include "analysis/build_sheet.hpp"
#include "analysis/print_tiles.hpp"
#include "io/layout_reader.hpp"
#include "scene/sheet_svg.hpp"
#include "trace/trace.hpp"

namespace rv::scene {

namespace {

// The shortest text that reads back as the same number (values from the file stay as typed).
std::string shortest(double v) {
    char buf[32];
    const auto r = std::to_chars(buf, buf + sizeof buf, v);
    return std::string(buf, r.ptr);
}
std::string fixed(double v, const char* format) {
    if (std::abs(v) < 5e-4) v = 0;  // no "-0.000"
    char buf[48];
    std::snprintf(buf, sizeof buf, format, v);
    return buf;
}

std::string field_text(const SpecField& f) {
    std::string name = f.name;
    for (char& c : name)
        if (c == '_') c = ' ';
    if (!f.number) return name + " " + f.text;
    return name + " " + shortest(*f.number) +
           (f.unit.empty() ? ""
                           : " " + (f.unit == "um"    ? std::string("µm")
                                    : f.unit == "deg" ? std::string("deg")
                                                      : f.unit));
}
std::string spec_text(const PartSpec& s) {
    std::string t = s.part ? *s.part + " (" + s.kind + ")" : s.kind;
    for (size_t i = 0; i < s.fields.size(); ++i) t += (i ? ", " : ": ") + field_text(s.fields[i]);
    return t;
}
std::string ids_text(const Layout& layout, const std::vector<size_t>& elements) {
    std::string t;
    for (size_t e : elements) t += (t.empty() ? "" : " ") + layout.elements[e].id;
    return t;
}

// Every number the sheet prints or draws is finite; else the element it belongs to.
std::string non_finite_element(const Layout& layout, const BuildSheet& sheet,
                               const std::vector<Path>& paths) {
    for (size_t i = 0; i < sheet.places.size(); ++i) {
        const SheetPlace& p = sheet.places[i];
        if ((p.at_mm && !p.at_mm->allFinite()) || !std::isfinite(p.angle_deg) ||
            (p.hole && !p.hole->offset_mm.allFinite()))
            return "element \"" + layout.elements[i].id + "\": its position or angle";
    }
    for (const Path& path : paths)
        for (const TraceSegment& s : path.segments)
            if (!s.from_mm.allFinite() || !s.to_mm.allFinite())
                return "beam \"" + layout.beams[path.beam].id + "\": its trace";
    return "";
}

// The notes of a placed element: where its angle comes from, its stage, whether it is off the
// table or was placed with an earlier beam.
std::string notes(const Layout& layout, const BuildSheet& sheet, size_t i, bool placed_before,
                  const std::vector<std::string>& first_beam) {
    const Element& e = layout.elements[i];
    const SheetPlace& p = sheet.places[i];
    std::string n;
    auto add = [&](const std::string& s) { n += (n.empty() ? "" : "; ") + s; };
    if (placed_before) add("placed before with " + first_beam[i]);
    if (p.aimed_by_trace)
        add("aimed at " + *std::get<Mirror>(e.kind).aim_at + " (angle from the trace)");
    if (p.aim_unresolved)
        add("aim_at " + *std::get<Mirror>(e.kind).aim_at +
            ": no beam reflects from it, file angle");
    if (const auto* s = std::get_if<Stage>(&e.kind)) {
        add("axis; the carriage at reading 0 (travel " + shortest(s->travel_min_mm) + " to " +
            shortest(s->travel_max_mm) + " mm), set to " + shortest(s->position_mm) +
            " mm; carries " + [&] {
                std::string c;
                for (const std::string& id : s->carries) c += (c.empty() ? "" : " ") + id;
                return c;
            }());
    }
    if (p.carried_by) {
        const auto& s = std::get<Stage>(layout.elements[*p.carried_by].kind);
        add("on stage " + layout.elements[*p.carried_by].id + " at " + shortest(s.position_mm) +
            " mm");
    }
    if (p.hole && !p.hole->on_table) add("off the table");
    if (!p.at_mm) add("no place: the stage carries nothing");
    return n;
}

struct Row {
    size_t element;
    bool placed_before;
};

struct Sections {
    std::vector<std::pair<std::string, std::vector<Row>>> lists;  // title, rows
};

Sections sections(const Layout& layout, const BuildSheet& sheet, const std::vector<Path>& paths) {
    Sections s;
    for (size_t b = 0; b < sheet.order.along_beam.size(); ++b) {
        const BeamSource& beam = layout.beams[paths[b].beam];
        std::vector<Row> rows;
        for (const PlacementStep& st : sheet.order.along_beam[b])
            rows.push_back({st.element, st.placed_before});
        s.lists.push_back({"Along " + beam.id + " (" + shortest(beam.wavelength_nm) +
                               " nm), in the order it meets them",
                           rows});
    }
    std::vector<Row> rest;
    for (size_t e : sheet.order.unmet) rest.push_back({e, false});
    if (!rest.empty()) s.lists.push_back({"Not met by any traced beam (file order)", rest});
    return s;
}

std::vector<std::string> first_beam_names(const Layout& layout, const BuildSheet& sheet,
                                          const std::vector<Path>& paths) {
    std::vector<std::string> names(layout.elements.size());
    for (size_t b = 0; b < sheet.order.along_beam.size(); ++b)
        for (const PlacementStep& st : sheet.order.along_beam[b])
            if (names[st.element].empty()) names[st.element] = layout.beams[paths[b].beam].id;
    return names;
}

std::string convention_text(const Layout& layout, const BuildSheet& sheet) {
    const double g = sheet.grid.pitch_mm;
    std::ostringstream o;
    o << "Holes: " << shortest(g) << " mm pitch, " << sheet.grid.columns << " columns x "
      << sheet.grid.rows << " rows on the " << shortest(layout.table.width_mm) << " x "
      << shortest(layout.table.height_mm) << " mm table.\n"
      << "Hole (column, row) counts from (0, 0) at the table's lower-left corner: columns to the "
         "right (+x),\n"
      << "rows up (+y, away from the front edge); hole (c, r) is at x = " << shortest(g / 2)
      << " + " << shortest(g) << "c, y = " << shortest(g / 2) << " + " << shortest(g) << "r mm,\n"
      << "the first hole half a pitch in from each edge, as the viewer draws them. Offset: the "
         "optic's\n"
      << "reference point (at_mm, as set up) minus its hole's centre, mm. Angle: its normal (a "
         "stage: its\n"
      << "axis), degrees counter-clockwise from +x.\n";
    return o.str();
}

std::string hole_text(const SheetPlace& p) {
    return p.hole ? "(" + std::to_string(p.hole->column) + ", " + std::to_string(p.hole->row) + ")"
                  : "-";
}
std::string offset_text(const SheetPlace& p) {
    return p.hole ? fixed(p.hole->offset_mm.x(), "%+.3f") + ", " +
                        fixed(p.hole->offset_mm.y(), "%+.3f")
                  : "-";
}

void print_text(std::ostream& out, const Layout& layout, const BuildSheet& sheet,
                const std::vector<Path>& paths) {
    out << "Build sheet: " << layout.name << "\n" << convention_text(layout, sheet) << "\n";
    const bool any_part = std::any_of(sheet.parts.begin(), sheet.parts.end(), [](const PartGroup& g) { return g.spec.part.has_value(); });
    out << "Parts (" << layout.elements.size() << " elements, " << sheet.parts.size() << " different parts; "
        << (any_part ? "a catalog id where the file names one, and" : "no catalog ids in the file, so")
        << " each part's specification)\n";
    char line[512];
    std::snprintf(line, sizeof line, "  %5s  %s\n", "count", "part  [ids]");
    out << line;
    for (const PartGroup& g : sheet.parts) {
        std::snprintf(line, sizeof line, "  %5zu  ", g.elements.size());
        out << line << spec_text(g.spec) << "  [" << ids_text(layout, g.elements) << "]\n";
    }
    const std::vector<std::string> first = first_beam_names(layout, sheet, paths);
    for (const auto& [title, rows] : sections(layout, sheet, paths).lists) {
        out << "\n" << title << "\n";
        std::snprintf(line, sizeof line, "  %3s  %-10s %-20s %-11s %-21s %9s  %s\n", "#", "id",
                      "part", "hole", "offset x, y mm", "angle", "notes");
        out << line;
        int k = 0;
        for (const Row& r : rows) {
            const SheetPlace& p = sheet.places[r.element];
            std::snprintf(line, sizeof line, "  %3d  %-10s %-20s %-11s %-21s %8s°  ", ++k,
                          layout.elements[r.element].id.c_str(),
                          sheet.parts[p.part_group].spec.kind.c_str(), hole_text(p).c_str(),
                          offset_text(p).c_str(), fixed(p.angle_deg, "%.3f").c_str());
            std::string text = line + notes(layout, sheet, r.element, r.placed_before, first);
            text.erase(text.find_last_not_of(' ') + 1);
            out << text << "\n";
        }
    }
}

void print_markdown(std::ostream& out, const Layout& layout, const BuildSheet& sheet,
                    const std::vector<Path>& paths) {
    out << "# Build sheet: " << layout.name << "\n\n"
        << convention_text(layout, sheet) << "\n## Parts\n\n"
        << "| count | part | ids |\n|---:|---|---|\n";
    for (const PartGroup& g : sheet.parts)
        out << "| " << g.elements.size() << " | " << spec_text(g.spec) << " | "
            << ids_text(layout, g.elements) << " |\n";
    const std::vector<std::string> first = first_beam_names(layout, sheet, paths);
    for (const auto& [title, rows] : sections(layout, sheet, paths).lists) {
        out << "\n## " << title
            << "\n\n| # | id | part | hole (column, row) | offset x, y (mm) | angle (°) | notes |\n"
            << "|---:|---|---|---|---|---:|---|\n";
        int k = 0;
        for (const Row& r : rows) {
            const SheetPlace& p = sheet.places[r.element];
            out << "| " << ++k << " | " << layout.elements[r.element].id << " | "
                << sheet.parts[p.part_group].spec.kind << " | " << hole_text(p) << " | "
                << offset_text(p) << " | " << fixed(p.angle_deg, "%.3f") << " | "
                << notes(layout, sheet, r.element, r.placed_before, first) << " |\n";
        }
    }
}

nlohmann::json spec_json(const PartSpec& s) {
    nlohmann::json j = nlohmann::json::object();
    for (const SpecField& f : s.fields) {
        if (f.number)
            j[f.name + (f.unit.empty() ? "" : "_" + f.unit)] = *f.number;
        else
            j[f.name] = f.text;
    }
    return j;
}

nlohmann::json place_json(const Layout& layout, const BuildSheet& sheet, size_t i,
                          bool placed_before) {
    const SheetPlace& p = sheet.places[i];
    const Element& e = layout.elements[i];
    nlohmann::json j = {{"id", e.id}, {"part", p.part_group}, {"placed_before", placed_before}};
    j["at_mm"] =
        p.at_mm ? nlohmann::json::array({p.at_mm->x(), p.at_mm->y()}) : nlohmann::json(nullptr);
    if (p.hole) {
        j["hole"] = {{"column", p.hole->column},
                     {"row", p.hole->row},
                     {"at_mm", {p.hole->hole_mm.x(), p.hole->hole_mm.y()}}};
        j["offset_mm"] = {p.hole->offset_mm.x(), p.hole->offset_mm.y()};
        j["on_table"] = p.hole->on_table;
    } else {
        j["hole"] = nullptr;
        j["offset_mm"] = nullptr;
        j["on_table"] = nullptr;
    }
    j["angle_deg"] = p.angle_deg;
    j["angle_from"] = std::holds_alternative<Stage>(e.kind) ? "axis_deg"
                      : p.aimed_by_trace                    ? "trace"
                                                            : "normal_deg";
    j["carried_by"] =
        p.carried_by ? nlohmann::json(layout.elements[*p.carried_by].id) : nlohmann::json(nullptr);
    return j;
}

nlohmann::json sheet_json(const Layout& layout, const BuildSheet& sheet,
                          const std::vector<Path>& paths) {
    nlohmann::json doc;
    doc["layout"] = layout.name;
    doc["holes"] = {
        {"pitch_mm", sheet.grid.pitch_mm},
        {"columns", sheet.grid.columns},
        {"rows", sheet.grid.rows},
        {"first_hole_mm", {sheet.grid.pitch_mm / 2, sheet.grid.pitch_mm / 2}},
        {"origin", "the table's lower-left corner; columns along +x, rows along +y, from 0"}};
    nlohmann::json parts = nlohmann::json::array();
    for (const PartGroup& g : sheet.parts) {
        nlohmann::json ids = nlohmann::json::array();
        for (size_t e : g.elements) ids.push_back(layout.elements[e].id);
        parts.push_back({{"kind", g.spec.kind},
                         {"part", g.spec.part ? nlohmann::json(*g.spec.part) : nlohmann::json(nullptr)},
                         {"spec", spec_json(g.spec)},
                         {"count", g.elements.size()},
                         {"ids", ids}});
    }
    doc["parts"] = parts;
    nlohmann::json along = nlohmann::json::array();
    for (size_t b = 0; b < sheet.order.along_beam.size(); ++b) {
        nlohmann::json optics = nlohmann::json::array();
        for (const PlacementStep& st : sheet.order.along_beam[b])
            optics.push_back(place_json(layout, sheet, st.element, st.placed_before));
        along.push_back({{"beam", layout.beams[paths[b].beam].id}, {"optics", optics}});
    }
    doc["placement"] = along;
    nlohmann::json unmet = nlohmann::json::array();
    for (size_t e : sheet.order.unmet) unmet.push_back(place_json(layout, sheet, e, false));
    doc["not_met"] = unmet;
    return doc;
}

// FILE for page 1; NAME-2.svg, NAME-3.svg, … beside it for the others (FILE = NAME.svg).
std::vector<std::string> page_paths(const std::string& file, size_t pages) {
    std::vector<std::string> out{file};
    const std::string stem = file.substr(0, file.size() - 4);
    for (size_t k = 2; k <= pages; ++k) out.push_back(stem + "-" + std::to_string(k) + ".svg");
    return out;
}

}  // namespace

int write_sheet(const Layout& the_layout, const std::string& source, const SheetOutput& o, const SafeWriteRules& rules,
                std::ostream& out, std::ostream& err) {
    if (!o.svg.empty() && (o.svg.size() < 5 || o.svg.compare(o.svg.size() - 4, 4, ".svg") != 0 ||
                           o.svg.back() == '/')) {
        err << "rendezvous: sheet: --svg: expected a file name ending in .svg (page 1; the others "
               "beside it as NAME-2.svg, …), got \""
            << o.svg << "\"\n";
        return 2;
    }
    const Layout* layout = &the_layout;
    const std::vector<Path> paths = trace_layout(*layout, material_library_for(*layout));
    const BuildSheet sheet = build_sheet(*layout, paths);
    if (const std::string bad = non_finite_element(*layout, sheet, paths); !bad.empty()) {
        err << "rendezvous: sheet: " << source << ": " << bad
            << " is not a finite number; nothing written\n";
        return 2;
    }
    Tiling tiling;
    std::vector<std::string> files;
    if (!o.svg.empty()) {
        tiling = tile_table(layout->table.width_mm, layout->table.height_mm);
        if (!tiling.refusal.empty()) {
            err << "rendezvous: sheet: --svg: " << tiling.refusal << " ("
                << shortest(layout->table.width_mm) << " x " << shortest(layout->table.height_mm)
                << " mm table on A4 with a 15 mm margin); nothing written\n";
            return 2;
        }
        const std::vector<std::string> pages =
            write_sheet_pages(*layout, paths, sheet, tiling);
        files = page_paths(o.svg, pages.size());
        try {
            for (size_t k = 0; k < pages.size(); ++k) write_file_safely(files[k], pages[k], rules);
        } catch (const std::runtime_error& e) {
            err << "rendezvous: " << e.what() << "\n";  // "cannot write PATH: REASON"
            return 2;
        }
    }
    if (o.json) {
        nlohmann::json doc = sheet_json(*layout, sheet, paths);
        if (!files.empty())
            doc["svg"] = {{"pages", files},
                          {"columns", tiling.columns},
                          {"rows", tiling.rows},
                          {"paper", tiling.landscape ? "A4 landscape" : "A4 portrait"},
                          {"margin_mm", tiling.margin_mm}};
        out << doc.dump(2) << "\n";
        return 0;
    }
    if (o.markdown)
        print_markdown(out, *layout, sheet, paths);
    else
        print_text(out, *layout, sheet, paths);
    if (!files.empty())
        out << "\nSVG: " << files.size() << " page(s), A4 "
            << (tiling.landscape ? "landscape" : "portrait") << ", " << tiling.columns
            << " columns x " << tiling.rows << " rows of " << shortest(tiling.tile_width_mm)
            << " x " << shortest(tiling.tile_height_mm)
            << " mm from the lower-left corner: " << files.front()
            << (files.size() > 1 ? " … " + files.back() : std::string()) << "\n";
    return 0;
}

}  // namespace rv::scene
