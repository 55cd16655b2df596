#include "analysis/sweep.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <nlohmann/json.hpp>

#include "io/closest_name.hpp"
#include "io/layout_reader.hpp"
#include "io/layout_writer.hpp"
#include "units/number_text.hpp"

namespace rv {

namespace {

using nlohmann::json;

// subject: the id of the beam or element the pointer lies in, shown beside it.
Diagnostic error(std::string pointer, std::string message, std::string subject = "") {
    Diagnostic d;
    d.pointer = std::move(pointer);
    d.message = std::move(message);
    d.subject = std::move(subject);
    return d;
}

std::string did_you_mean(const std::string& name, const std::vector<std::string>& candidates) {
    const std::optional<std::string> near = closest_name(name, candidates);
    return near ? "; did you mean \"" + *near + "\"?" : "";
}

// What the field names: the beam or element holding it, its key, and its value.
struct Located {
    json* item = nullptr;
    std::string key;
    json* value = nullptr;
};

// The JSON value the field names, or nothing with a diagnostic.
std::optional<Located> locate(json& doc, const std::string& id, const std::string& field, Diagnostics& out) {
    std::string key = field;
    std::optional<size_t> index;
    if (const size_t open = field.find('['); open != std::string::npos) {
        key = field.substr(0, open);
        size_t i = 0;
        const char* first = field.data() + open + 1;
        const char* last = field.data() + field.size() - 1;
        const auto [end, ec] = std::from_chars(first, last, i);
        if (field.back() != ']' || ec != std::errc() || end != last) {
            out.push_back(error("", "expected FIELD or FIELD[INDEX] with a whole number INDEX, found \"" + field + "\""));
            return std::nullopt;
        }
        index = i;
    }
    std::vector<std::string> ids;
    for (const char* list : {"beams", "elements"}) {
        for (size_t i = 0; i < doc[list].size(); ++i) {
            json& item = doc[list][i];
            if (item["id"].is_string()) ids.push_back(item["id"]);
            if (item["id"] != id) continue;
            const std::string ptr = "/" + std::string(list) + "/" + std::to_string(i) + "/" + key;
            if (!item.contains(key)) {
                // A typo is told by the keys it has that hold numbers (the only ones a sweep can
                // vary); a key it lacks altogether may only be missing its value.
                std::vector<std::string> numeric;
                for (const auto& [k, v] : item.items())
                    if (v.is_number() || (v.is_array() && !v.empty() && v[0].is_number())) numeric.push_back(k);
                const std::string hint = did_you_mean(key, numeric);
                out.push_back(error(ptr, "\"" + id + "\" has no \"" + key + "\" in the layout" +
                                             (hint.empty() ? " (give it a value first)" : hint), id));
                return std::nullopt;
            }
            json* v = &item[key];
            if (index) {
                if (!v->is_array() || *index >= v->size()) {
                    out.push_back(error(ptr, "no element [" + std::to_string(*index) + "] in \"" + key + "\"", id));
                    return std::nullopt;
                }
                v = &(*v)[*index];
            } else if (v->is_array()) {
                // A per-plane pair may be swept as one (both planes take the value); a
                // position needs its coordinate.
                if (key == "waist_um" || key == "waist_at_mm" || key == "m2") return Located{&item, key, v};
                out.push_back(error(ptr, "\"" + key + "\" is an array; name one entry, as in " + key + "[0]", id));
                return std::nullopt;
            }
            if (!v->is_number()) {
                out.push_back(error(ptr, "\"" + field + "\" is not a number", id));
                return std::nullopt;
            }
            return Located{&item, key, v};
        }
    }
    out.push_back(error("", "no beam or element has id \"" + id + "\"" + did_you_mean(id, ids)));
    return std::nullopt;
}

// A stage position outside its travel is still evaluated (the model knows no end stop): the
// travel is widened to hold it for this point only, and the point is marked.
bool widen_travel_to(Located& at, double position_mm) {
    const auto type = at.item->find("type"), travel_it = at.item->find("travel_mm");
    if (at.key != "position_mm" || type == at.item->end() || *type != "stage" || travel_it == at.item->end())
        return false;
    json& travel = *travel_it;
    if (!travel.is_array() || travel.size() != 2 || !travel[0].is_number() || !travel[1].is_number()) return false;
    const double lo = travel[0], hi = travel[1];
    if (position_mm >= lo && position_mm <= hi) return false;
    travel = json::array({std::min(lo, position_mm), std::max(hi, position_mm)});
    return true;
}

}  // namespace

SweepResult sweep_field(const Layout& layout, const std::string& id, const std::string& field,
                        double from, double to, int steps) {
    SweepResult result;
    if (steps < 2) {
        result.diagnostics.push_back(error("", "a sweep needs at least 2 steps"));
        return result;
    }
    const json base = json::parse(write_layout(layout));
    {
        json probe = base;
        if (!locate(probe, id, field, result.diagnostics)) return result;
    }
    for (int i = 0; i < steps; ++i) {
        // A residue of the arithmetic where the range crosses zero (0.1 + (-0.2 - 0.1)/3 =
        // -1.4e-17) is taken as the zero it stands for (units/number_text.hpp), so that the
        // point is not outside a travel that ends at 0.
        // std::lerp, not from + (to - from) t: over ±1e308 the difference overflows to infinity
        // and the first point became NaN (issue 19 §1); lerp stays between finite ends.
        const double t = static_cast<double>(i) / (steps - 1);
        const double value = negligible_as_zero(std::lerp(from, to, t), std::max(std::abs(from), std::abs(to)));
        if (!std::isfinite(value)) {  // never written into the layout as null
            result.diagnostics.push_back(error("", "the sweep's value at step " + std::to_string(i + 1) + " of " + field +
                                                       " is not a finite number (from " + format_number("%g", from) + " to " +
                                                       format_number("%g", to) + ")"));
            return result;
        }
        json doc = base;
        Located at = *locate(doc, id, field, result.diagnostics);
        *at.value = at.value->is_array() ? json::array({value, value}) : json(value);
        const bool outside_travel = widen_travel_to(at, value);
        LayoutReadResult r = read_layout(doc.dump());
        if (!r.layout) {
            for (Diagnostic& d : r.diagnostics) {
                d.message += " (at " + field + " = " + format_number("%g", value) + ")";
                result.diagnostics.push_back(d);
            }
            return result;
        }
        result.points.push_back({value, build_report(*r.layout, material_library_for(*r.layout)), outside_travel});
    }
    return result;
}

}  // namespace rv
