#pragma once
// Reads the keys of one JSON object with located diagnostics; finish() reports the keys that
// are not among the known ones, with the closest known key suggested. Values that are missing or wrong give a diagnostic and nullopt; the
// caller carries on, so that one pass reports every problem.

#include <functional>
#include <nlohmann/json.hpp>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "io/diagnostic.hpp"
#include "layout/input_limits.hpp"
#include "layout/layout.hpp"

namespace rv {

enum class Need { Required, Optional };

// A rule a number must obey: returns "" when it does, else what it must be ("must be positive").
// The bounds come from layout/input_limits.hpp, the one place for them.
using NumberRule = std::function<std::string(double)>;
using limits::kSmallestPositive;
using limits::kMinWavelength_nm;
using limits::kMaxWavelength_nm;
NumberRule positive();  // > 0 and at least kSmallestPositive
NumberRule at_least(double minimum);
// unit: a string literal (the rule keeps the pointer, to word its range on a failure only).
NumberRule between(double minimum, double maximum, const char* unit = "");
// Lengths in mm (limits::kMaxLength_mm either way; non-zero ones at least kMinNonZeroLength_mm
// in size, so that a denormal such as 1e-320 is not "non-zero").
NumberRule length_mm();           // any sign, zero allowed
NumberRule non_zero_length_mm();  // any sign
NumberRule positive_length_mm();
NumberRule angle_deg();  // within ±limits::kMaxAngle_deg
// A positive figure within [minimum, maximum], "must be positive" for ≤ 0.
NumberRule positive_within(double minimum, double maximum, const char* unit);

// JSON pointer of a child ("/elements/3" + "focal_length_mm"), with ~ and / escaped.
std::string child_pointer(const std::string& parent, const std::string& key);
std::string child_pointer(const std::string& parent, size_t index);

// Parses JSON, refusing nesting deeper than max_depth while parsing (before any recursive
// walk of the value could overflow the stack): throws JsonTooDeep then; nlohmann's exceptions
// for everything else. A key repeated in one object (which nlohmann would let the last of win)
// is added to `duplicates`, located at the repeat with line and column, and the parse goes on.
struct JsonTooDeep {};
nlohmann::json parse_json_limited(std::string_view text, int max_depth, Diagnostics& duplicates);

// "a string", "an array", … for messages.
std::string describe_json_type(const nlohmann::json& value);

class FieldReader {
public:
    // `what` names the object in messages ("a lens", "a beam", "the table").
    FieldReader(const nlohmann::json& object, std::string pointer, std::string what,
                Diagnostics& out);

    bool has(const std::string& key) const;
    const nlohmann::json& object_at(const std::string& key) const { return object_.at(key); }
    std::string pointer(const std::string& key) const { return child_pointer(pointer_, key); }

    std::optional<double> number(const std::string& key, Need need, const NumberRule& rule = {});
    // A wavelength in nm, within [kMinWavelength_nm, kMaxWavelength_nm]; outside it, the
    // message names the unit the number was likely written in ("0.8 — micrometres?").
    std::optional<double> wavelength_nm(const std::string& key, Need need);
    std::optional<std::string> string(const std::string& key, Need need);
    // A string of printable characters (no control character: ESC, NUL, tab, newline…).
    std::optional<std::string> id(const std::string& key, Need need);
    std::optional<std::string> choice(const std::string& key, Need need,
                                      const std::vector<std::string>& options);
    // [x, y] in mm, each within ±limits::kMaxLength_mm.
    std::optional<Vec2> point(const std::string& key, Need need);
    // A number or a [tangential, sagittal] pair.
    std::optional<PlanePair> plane_pair(const std::string& key, Need need,
                                        const NumberRule& rule = {});
    // [min, max] with min < max.
    std::optional<std::pair<double, double>> interval(const std::string& key, Need need,
                                                      const NumberRule& rule = {});
    std::optional<std::vector<double>> numbers(const std::string& key, Need need,
                                               const NumberRule& rule = {});
    std::optional<std::vector<std::string>> strings(const std::string& key, Need need);
    // A nested object or array, marked used; nullptr when absent or of the wrong type.
    const nlohmann::json* object(const std::string& key, Need need);
    const nlohmann::json* array(const std::string& key, Need need);

    // An error located at a key of this object.
    void error(const std::string& key, const std::string& message);
    // Reports a key that must not stand beside another ("not allowed together with …").
    void forbid_together(const std::string& key, const std::string& other);

    // Unknown keys, each with the closest known key when one is close.
    void finish(const std::vector<std::string>& known_keys);

private:
    const nlohmann::json* get(const std::string& key, Need need, nlohmann::json::value_t want,
                              const char* want_text);
    std::optional<double> check_number(const nlohmann::json& v, const std::string& ptr,
                                       const NumberRule& rule);

    const nlohmann::json& object_;
    std::string pointer_;
    std::string what_;
    Diagnostics& out_;
};

}  // namespace rv
