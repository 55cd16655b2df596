#include "io/field_reader.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <iterator>
#include <sstream>
#include <unordered_map>

#include "io/closest_name.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {

std::string number_text(double v) {
    std::ostringstream s;
    s.precision(15);
    s << v;
    return s.str();
}

std::string quoted_list(const std::vector<std::string>& options) {
    std::string out;
    for (size_t i = 0; i < options.size(); ++i) {
        if (i) out += i + 1 == options.size() ? " or " : ", ";
        out += "\"" + options[i] + "\"";
    }
    return out;
}

// A short rendering of a found value for messages: strings quoted, long ones cut.
std::string found_text(const nlohmann::json& v) {
    std::string s = v.dump();
    if (s.size() > 40) s = s.substr(0, 37) + "...";
    return describe_json_type(v) + " (" + s + ")";
}

}  // namespace

NumberRule positive() {
    // A positive size below 1e-9 of its unit is no real size (a denormal such as 1e-320 would
    // pass "> 0" and turn into infinities downstream).
    return [](double v) {
        return v <= 0 ? std::string("must be positive")
               : v < kSmallestPositive ? "must be at least " + number_text(kSmallestPositive) : std::string();
    };
}
NumberRule at_least(double minimum) {
    return [minimum](double v) {
        return v >= minimum ? std::string() : "must be at least " + number_text(minimum);
    };
}
// The words of a range, made only when a value falls outside it (a rule is built per field
// read, and formatting its numbers every time was a fifth of reading a large layout).
std::string range_text(double minimum, double maximum, const char* unit) {
    return "must be between " + number_text(minimum) + " and " + number_text(maximum) +
           (*unit ? std::string(" ") + unit : std::string());
}
NumberRule between(double minimum, double maximum, const char* unit) {
    return [minimum, maximum, unit](double v) {
        return v >= minimum && v <= maximum ? std::string() : range_text(minimum, maximum, unit);
    };
}
NumberRule positive_within(double minimum, double maximum, const char* unit) {
    return [minimum, maximum, unit](double v) {
        return v <= 0                           ? std::string("must be positive")
               : v >= minimum && v <= maximum ? std::string()
                                              : range_text(minimum, maximum, unit);
    };
}
NumberRule length_mm() {
    return [](double v) {
        return std::abs(v) <= limits::kMaxLength_mm
                   ? std::string()
                   : "must lie within ±" + number_text(limits::kMaxLength_mm) + " mm (100 m)";
    };
}
NumberRule non_zero_length_mm() {
    return [](double v) {
        if (v == 0) return std::string("must be non-zero");
        const double size = std::abs(v);
        return size >= limits::kMinNonZeroLength_mm && size <= limits::kMaxLength_mm
                   ? std::string()
                   : "must be non-zero, between " + number_text(limits::kMinNonZeroLength_mm) + " and " +
                         number_text(limits::kMaxLength_mm) + " mm either way";
    };
}
NumberRule positive_length_mm() {
    return positive_within(limits::kMinNonZeroLength_mm, limits::kMaxLength_mm, "mm");
}
NumberRule angle_deg() {
    return [](double v) {
        return std::abs(v) <= limits::kMaxAngle_deg
                   ? std::string()
                   : "must be an angle within ±" + number_text(limits::kMaxAngle_deg) + " degrees";
    };
}

std::string child_pointer(const std::string& parent, const std::string& key) {
    std::string escaped;
    for (char c : key) {
        if (c == '~') escaped += "~0";
        else if (c == '/') escaped += "~1";
        else escaped += c;
    }
    return parent + "/" + escaped;
}

std::string child_pointer(const std::string& parent, size_t index) {
    return parent + "/" + std::to_string(index);
}

namespace {

// nlohmann's parse callback is told no position; this iterator leaves in *read how many bytes
// the parser has taken, so that a key event knows where its key ends.
struct CountingChars {
    using iterator_category = std::input_iterator_tag;
    using value_type = char;
    using difference_type = std::ptrdiff_t;
    using pointer = const char*;
    using reference = const char&;
    const char* at;
    const char* begin;
    size_t* read;
    char operator*() const { return *at; }
    CountingChars& operator++() {
        ++at;
        *read = static_cast<size_t>(at - begin);
        return *this;
    }
    bool operator==(const CountingChars& other) const { return at == other.at; }
};

// The opening quote of the string whose closing quote is at text[end - 1]: the nearest quote
// before it that is not escaped (preceded by an even number of backslashes).
size_t string_start(std::string_view text, size_t end) {
    size_t i = end > 0 ? end - 1 : 0;
    while (i > 0) {
        --i;
        if (text[i] != '"') continue;
        size_t slashes = 0;
        while (slashes < i && text[i - 1 - slashes] == '\\') ++slashes;
        if (slashes % 2 == 0) return i;
    }
    return i;
}

void line_and_column_of(std::string_view text, size_t byte, int& line, int& column) {
    line = 1;
    column = 1;
    for (size_t i = 0; i < byte && i < text.size(); ++i) {
        if (text[i] == '\n') {
            ++line;
            column = 1;
        } else {
            ++column;
        }
    }
}

// One open object or array while parsing: where its current child is, and (for an object)
// where each of its keys first stood.
struct OpenValue {
    bool is_array = false;
    size_t children = 0;  // an array's children so far
    std::string key;      // an object's current key
    std::unordered_map<std::string, size_t> first_key_at;
};

// The fast first pass: nlohmann's SAX interface over the contiguous text, building the value
// here. nlohmann's own DOM parser with a callback (below) costs a std::function call per event
// and, for the key positions, a counting iterator: 60 % of reading a 100 000-element layout. A
// repeated key is only noted; the slow pass then locates each one.
class DomBuilder {
public:
    using json = nlohmann::json;
    DomBuilder(json& root, int max_depth) : root_(root), max_depth_(max_depth) {}
    bool repeated_key() const { return repeated_key_; }

    bool null() { return put(nullptr) != nullptr; }
    bool boolean(bool v) { return put(v) != nullptr; }
    bool number_integer(json::number_integer_t v) { return put(v) != nullptr; }
    bool number_unsigned(json::number_unsigned_t v) { return put(v) != nullptr; }
    bool number_float(json::number_float_t v, const json::string_t&) { return put(v) != nullptr; }
    bool string(json::string_t& v) { return put(std::move(v)) != nullptr; }
    bool binary(json::binary_t& v) { return put(json::binary(std::move(v))) != nullptr; }
    bool start_object(std::size_t) { return open(json::object()); }
    bool start_array(std::size_t) { return open(json::array()); }
    bool end_object() { return close(); }
    bool end_array() { return close(); }
    bool key(json::string_t& k) {
        deeper_than_allowed(stack_.size());
        json& object = *stack_.back();
        repeated_key_ = repeated_key_ || object.contains(k);
        slot_ = &object[k];
        return true;
    }
    // As nlohmann's DOM parser does: the error as its own type, with its byte position.
    bool parse_error(std::size_t, const std::string&, const nlohmann::detail::exception& e) {
        switch ((e.id / 100) % 100) {
            case 1: throw *static_cast<const json::parse_error*>(&e);
            case 4: throw *static_cast<const json::out_of_range*>(&e);
            case 2: throw *static_cast<const json::invalid_iterator*>(&e);
            case 3: throw *static_cast<const json::type_error*>(&e);
            default: throw *static_cast<const json::other_error*>(&e);
        }
    }

private:
    // The callback parser's depth: the number of open containers around an event.
    void deeper_than_allowed(size_t depth) const {
        if (static_cast<long long>(depth) > max_depth_) throw JsonTooDeep{};
    }
    json* put(json&& v) {
        deeper_than_allowed(stack_.size());
        if (stack_.empty()) {
            root_ = std::move(v);
            return &root_;
        }
        json& parent = *stack_.back();
        if (parent.is_array()) {
            parent.push_back(std::move(v));
            return &parent.back();
        }
        *slot_ = std::move(v);
        return slot_;
    }
    bool open(json&& container) {
        json* at = put(std::move(container));
        stack_.push_back(at);
        return true;
    }
    bool close() {
        stack_.pop_back();
        return true;
    }

    json& root_;
    long long max_depth_;
    std::vector<json*> stack_;
    json* slot_ = nullptr;  // the current key's value in the innermost object
    bool repeated_key_ = false;
};

}  // namespace

nlohmann::json parse_json_limited(std::string_view text, int max_depth, Diagnostics& duplicates) {
    {
        nlohmann::json fast;
        DomBuilder builder(fast, max_depth);
        nlohmann::json::sax_parse(text.data(), text.data() + text.size(), &builder);
        if (!builder.repeated_key()) return fast;
    }
    using Event = nlohmann::json::parse_event_t;
    size_t read = 0;
    std::vector<OpenValue> open;
    auto pointer_of_current = [&open] {
        std::string p;
        for (const OpenValue& v : open) p = v.is_array ? child_pointer(p, v.children - 1) : child_pointer(p, v.key);
        return p;
    };
    auto count_child = [&open] {
        if (!open.empty() && open.back().is_array) ++open.back().children;
    };
    const nlohmann::json::parser_callback_t guard = [&](int depth, Event event, nlohmann::json& parsed) {
        if (depth > max_depth) throw JsonTooDeep{};
        switch (event) {
            case Event::object_start:
            case Event::array_start:
                count_child();
                open.emplace_back().is_array = event == Event::array_start;
                break;
            case Event::object_end:
            case Event::array_end: open.pop_back(); break;
            case Event::value: count_child(); break;
            case Event::key: {
                // nlohmann keeps the last of duplicate keys without a word: a bad value could
                // hide behind a good one, so each repeat is an error at the repeated key.
                OpenValue& object = open.back();
                object.key = parsed.get_ref<const std::string&>();
                const size_t start = string_start(text, read);
                const auto [first, is_new] = object.first_key_at.try_emplace(object.key, start);
                if (!is_new) {
                    Diagnostic d{Diagnostic::Severity::Error, pointer_of_current(), 0, 0, ""};
                    line_and_column_of(text, start, d.line, d.column);
                    int first_line = 0, first_column = 0;
                    line_and_column_of(text, first->second, first_line, first_column);
                    d.message = "duplicate key " + nlohmann::json(object.key).dump() +
                                " (the first stands at line " + std::to_string(first_line) +
                                ", column " + std::to_string(first_column) + ")";
                    duplicates.push_back(std::move(d));
                }
                break;
            }
        }
        return true;
    };
    const CountingChars begin{text.data(), text.data(), &read};
    const CountingChars end{text.data() + text.size(), text.data(), &read};
    return nlohmann::json::parse(begin, end, guard, true, false);
}

std::string describe_json_type(const nlohmann::json& value) {
    switch (value.type()) {
        case nlohmann::json::value_t::null: return "null";
        case nlohmann::json::value_t::boolean: return "a boolean";
        case nlohmann::json::value_t::string: return "a string";
        case nlohmann::json::value_t::array: return "an array";
        case nlohmann::json::value_t::object: return "an object";
        case nlohmann::json::value_t::number_integer:
        case nlohmann::json::value_t::number_unsigned:
        case nlohmann::json::value_t::number_float: return "a number";
        default: return "an unsupported value";
    }
}

FieldReader::FieldReader(const nlohmann::json& object, std::string pointer, std::string what,
                         Diagnostics& out)
    : object_(object), pointer_(std::move(pointer)), what_(std::move(what)), out_(out) {}

bool FieldReader::has(const std::string& key) const {
    return object_.is_object() && object_.contains(key);
}

void FieldReader::error(const std::string& key, const std::string& message) {
    out_.push_back({Diagnostic::Severity::Error, key.empty() ? pointer_ : pointer(key), 0, 0,
                    message});
}

const nlohmann::json* FieldReader::get(const std::string& key, Need need,
                                       nlohmann::json::value_t want, const char* want_text) {
    if (!has(key)) {
        if (need == Need::Required)
            out_.push_back({Diagnostic::Severity::Error, pointer_, 0, 0,
                            "missing \"" + key + "\", required for " + what_});
        return nullptr;
    }
    const nlohmann::json& v = object_.at(key);
    const bool number_wanted = want == nlohmann::json::value_t::number_float;
    if (number_wanted ? !v.is_number() : v.type() != want) {
        error(key, std::string("expected ") + want_text + ", found " + found_text(v));
        return nullptr;
    }
    return &v;
}

std::optional<double> FieldReader::check_number(const nlohmann::json& v, const std::string& ptr,
                                                const NumberRule& rule) {
    const double x = v.get<double>();
    if (!std::isfinite(x)) {
        out_.push_back({Diagnostic::Severity::Error, ptr, 0, 0,
                        "expected a finite number, found " + v.dump()});
        return std::nullopt;
    }
    if (rule) {
        const std::string broken = rule(x);
        if (!broken.empty()) {
            out_.push_back({Diagnostic::Severity::Error, ptr, 0, 0,
                            broken + " (got " + number_text(x) + ")"});
            return std::nullopt;
        }
    }
    return x;
}

std::optional<double> FieldReader::number(const std::string& key, Need need,
                                          const NumberRule& rule) {
    const nlohmann::json* v = get(key, need, nlohmann::json::value_t::number_float, "a number");
    if (!v) return std::nullopt;
    return check_number(*v, pointer(key), rule);
}

std::optional<double> FieldReader::wavelength_nm(const std::string& key, Need need) {
    const std::optional<double> v = number(key, need, positive());
    if (!v || (*v >= kMinWavelength_nm && *v <= kMaxWavelength_nm)) return v;
    // A unit slip: the same number in µm or pm would be a wavelength.
    std::string likely;
    if (um_to_nm(*v) >= kMinWavelength_nm && um_to_nm(*v) <= kMaxWavelength_nm)
        likely = " — micrometres? " + number_text(*v) + " µm is " + number_text(um_to_nm(*v)) + " nm";
    else if (pm_to_nm(*v) >= kMinWavelength_nm && pm_to_nm(*v) <= kMaxWavelength_nm)
        likely = " — picometres? " + number_text(*v) + " pm is " + number_text(pm_to_nm(*v)) + " nm";
    error(key, "must be a wavelength between " + number_text(kMinWavelength_nm) + " and " +
                   number_text(kMaxWavelength_nm) + " nm (got " + number_text(*v) + likely + ")");
    return std::nullopt;
}

std::optional<std::string> FieldReader::string(const std::string& key, Need need) {
    const nlohmann::json* v = get(key, need, nlohmann::json::value_t::string, "a string");
    if (!v) return std::nullopt;
    std::string s = v->get<std::string>();
    if (s.empty()) {
        error(key, "must not be empty");
        return std::nullopt;
    }
    return s;
}

std::optional<std::string> FieldReader::id(const std::string& key, Need need) {
    std::optional<std::string> s = string(key, need);
    if (!s) return std::nullopt;
    // Ids reach terminals, file names and CSV headers: an ESC would drive the terminal, a NUL
    // cut the id short. The same characters printable_text shows as \xNN; counted in
    // characters (not bytes) so that the position matches what an editor shows.
    size_t character = 0;
    for (const char c : *s) {
        const auto byte = static_cast<unsigned char>(c);
        if ((byte & 0xC0) != 0x80) ++character;  // not a UTF-8 continuation byte
        if (byte < 0x20 || byte == 0x7F) {
            char hex[8];
            std::snprintf(hex, sizeof hex, "\\x%02X", byte);
            error(key, "an id must be printable: character " + std::to_string(character) +
                           " is a control character (" + hex + ")");
            return std::nullopt;
        }
    }
    return s;
}

std::optional<std::string> FieldReader::choice(const std::string& key, Need need,
                                               const std::vector<std::string>& options) {
    const nlohmann::json* v = get(key, need, nlohmann::json::value_t::string, "a string");
    if (!v) return std::nullopt;
    const std::string s = v->get<std::string>();
    if (std::find(options.begin(), options.end(), s) != options.end()) return s;
    error(key, "expected " + quoted_list(options) + ", found \"" + s + "\"");
    return std::nullopt;
}

std::optional<std::vector<double>> FieldReader::numbers(const std::string& key, Need need,
                                                        const NumberRule& rule) {
    const nlohmann::json* v = get(key, need, nlohmann::json::value_t::array, "an array of numbers");
    if (!v) return std::nullopt;
    std::vector<double> out;
    bool ok = true;
    for (size_t i = 0; i < v->size(); ++i) {
        const nlohmann::json& item = (*v)[i];
        const std::string ptr = child_pointer(pointer(key), i);
        if (!item.is_number()) {
            out_.push_back({Diagnostic::Severity::Error, ptr, 0, 0,
                            "expected a number, found " + found_text(item)});
            ok = false;
            continue;
        }
        const std::optional<double> x = check_number(item, ptr, rule);
        if (x) out.push_back(*x);
        else ok = false;
    }
    if (!ok) return std::nullopt;
    return out;
}

std::optional<Vec2> FieldReader::point(const std::string& key, Need need) {
    if (has(key) && (!object_.at(key).is_array() || object_.at(key).size() != 2)) {
        error(key, "expected [x, y] in mm, found " + found_text(object_.at(key)));
        return std::nullopt;
    }
    const std::optional<std::vector<double>> xy = numbers(key, need, length_mm());
    if (!xy) return std::nullopt;
    return Vec2((*xy)[0], (*xy)[1]);
}

std::optional<PlanePair> FieldReader::plane_pair(const std::string& key, Need need,
                                                 const NumberRule& rule) {
    if (has(key) && object_.at(key).is_array()) {
        if (object_.at(key).size() != 2) {
                error(key, "expected one number or [tangential, sagittal], found " +
                           found_text(object_.at(key)));
            return std::nullopt;
        }
        const std::optional<std::vector<double>> ts = numbers(key, need, rule);
        if (!ts) return std::nullopt;
        return PlanePair{(*ts)[0], (*ts)[1]};
    }
    const nlohmann::json* v =
        get(key, need, nlohmann::json::value_t::number_float, "one number or [tangential, sagittal]");
    if (!v) return std::nullopt;
    const std::optional<double> x = check_number(*v, pointer(key), rule);
    if (!x) return std::nullopt;
    return PlanePair{*x, *x};
}

std::optional<std::pair<double, double>> FieldReader::interval(const std::string& key, Need need,
                                                               const NumberRule& rule) {
    if (has(key) && (!object_.at(key).is_array() || object_.at(key).size() != 2)) {
        error(key, "expected [min, max], found " + found_text(object_.at(key)));
        return std::nullopt;
    }
    const std::optional<std::vector<double>> v = numbers(key, need, rule);
    if (!v) return std::nullopt;
    if (!((*v)[0] < (*v)[1])) {
        error(key, "expected [min, max] with min < max, found [" + number_text((*v)[0]) + ", " +
                       number_text((*v)[1]) + "]");
        return std::nullopt;
    }
    return std::make_pair((*v)[0], (*v)[1]);
}

std::optional<std::vector<std::string>> FieldReader::strings(const std::string& key, Need need) {
    const nlohmann::json* v = get(key, need, nlohmann::json::value_t::array, "an array of strings");
    if (!v) return std::nullopt;
    std::vector<std::string> out;
    bool ok = true;
    for (size_t i = 0; i < v->size(); ++i) {
        if (!(*v)[i].is_string()) {
            out_.push_back({Diagnostic::Severity::Error, child_pointer(pointer(key), i), 0, 0,
                            "expected a string, found " + found_text((*v)[i])});
            ok = false;
        } else {
            out.push_back((*v)[i].get<std::string>());
        }
    }
    if (!ok) return std::nullopt;
    return out;
}

const nlohmann::json* FieldReader::object(const std::string& key, Need need) {
    return get(key, need, nlohmann::json::value_t::object, "an object");
}

const nlohmann::json* FieldReader::array(const std::string& key, Need need) {
    return get(key, need, nlohmann::json::value_t::array, "an array");
}

void FieldReader::forbid_together(const std::string& key, const std::string& other) {
    if (has(key) && has(other)) error(key, "not allowed together with \"" + other + "\"");
}

void FieldReader::finish(const std::vector<std::string>& known_keys) {
    if (!object_.is_object()) return;
    for (const auto& item : object_.items()) {
        const std::string& key = item.key();
        if (std::find(known_keys.begin(), known_keys.end(), key) != known_keys.end()) continue;
        std::string message = "unknown key for " + what_;
        if (const std::optional<std::string> near = closest_name(key, known_keys))
            message += "; did you mean \"" + *near + "\"?";
        else
            message += "; expected one of " + quoted_list(known_keys);
        error(key, message);
    }
}

}  // namespace rv
