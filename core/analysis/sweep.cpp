#include "analysis/sweep.hpp"

#include <charconv>
#include <nlohmann/json.hpp>

#include "io/layout_reader.hpp"
#include "io/layout_writer.hpp"

namespace rv {

namespace {

using nlohmann::json;

// The JSON value the field names, or nullptr with a diagnostic.
json* locate(json& doc, const std::string& id, const std::string& field, Diagnostics& out) {
    std::string key = field;
    std::optional<size_t> index;
    if (const size_t open = field.find('['); open != std::string::npos) {
        key = field.substr(0, open);
        size_t i = 0;
        const char* first = field.data() + open + 1;
        const char* last = field.data() + field.size() - 1;
        const auto [end, ec] = std::from_chars(first, last, i);
        if (field.back() != ']' || ec != std::errc() || end != last) {
            out.push_back({Diagnostic::Severity::Error, "", 0, 0,
                           "expected FIELD or FIELD[INDEX] with a whole number INDEX, found \"" + field + "\""});
            return nullptr;
        }
        index = i;
    }
    for (const char* list : {"beams", "elements"}) {
        for (size_t i = 0; i < doc[list].size(); ++i) {
            json& item = doc[list][i];
            if (item["id"] != id) continue;
            const std::string ptr = "/" + std::string(list) + "/" + std::to_string(i) + "/" + key;
            if (!item.contains(key)) {
                out.push_back({Diagnostic::Severity::Error, ptr, 0, 0,
                               "\"" + id + "\" has no \"" + key + "\" in the layout (give it a value first)"});
                return nullptr;
            }
            json* v = &item[key];
            if (index) {
                if (!v->is_array() || *index >= v->size()) {
                    out.push_back({Diagnostic::Severity::Error, ptr, 0, 0, "no element [" + std::to_string(*index) + "] in \"" + key + "\""});
                    return nullptr;
                }
                v = &(*v)[*index];
            } else if (v->is_array()) {
                // A per-plane pair may be swept as one (both planes take the value); a
                // position needs its coordinate.
                if (key == "waist_um" || key == "waist_at_mm" || key == "m2") return v;
                out.push_back({Diagnostic::Severity::Error, ptr, 0, 0,
                               "\"" + key + "\" is an array; name one entry, as in " + key + "[0]"});
                return nullptr;
            }
            if (!v->is_number()) {
                out.push_back({Diagnostic::Severity::Error, ptr, 0, 0, "\"" + field + "\" is not a number"});
                return nullptr;
            }
            return v;
        }
    }
    out.push_back({Diagnostic::Severity::Error, "", 0, 0, "no beam or element has id \"" + id + "\""});
    return nullptr;
}

}  // namespace

SweepResult sweep_field(const Layout& layout, const std::string& id, const std::string& field,
                        double from, double to, int steps) {
    SweepResult result;
    if (steps < 2) {
        result.diagnostics.push_back({Diagnostic::Severity::Error, "", 0, 0, "a sweep needs at least 2 steps"});
        return result;
    }
    const json base = json::parse(write_layout(layout));
    {
        json probe = base;
        if (!locate(probe, id, field, result.diagnostics)) return result;
    }
    for (int i = 0; i < steps; ++i) {
        const double value = from + (to - from) * i / (steps - 1);
        json doc = base;
        json* v = locate(doc, id, field, result.diagnostics);
        *v = v->is_array() ? json::array({value, value}) : json(value);
        LayoutReadResult r = read_layout(doc.dump());
        if (!r.layout) {
            for (Diagnostic& d : r.diagnostics) {
                d.message += " (at " + field + " = " + std::to_string(value) + ")";
                result.diagnostics.push_back(d);
            }
            return result;
        }
        result.points.push_back({value, build_report(*r.layout, material_library_for(*r.layout))});
    }
    return result;
}

}  // namespace rv
