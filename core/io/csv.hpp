#pragma once
// One field of a CSV table as RFC 4180 writes it: a field holding a comma, a double quote or a
// line break is enclosed in double quotes, with each quote inside doubled; any other field is
// written as it is. Ids are the fields that can hold such characters (an id "L1,a" would
// otherwise shift every column after it).

#include <string>
#include <string_view>

namespace rv {

inline std::string csv_field(std::string_view text) {
    if (text.find_first_of(",\"\r\n") == std::string_view::npos) return std::string(text);
    std::string out = "\"";
    for (const char c : text) {
        if (c == '"') out += '"';
        out += c;
    }
    return out + "\"";
}

}  // namespace rv
