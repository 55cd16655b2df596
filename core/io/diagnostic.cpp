#include "io/diagnostic.hpp"

#include <algorithm>
#include <cstdio>

namespace rv {

bool has_errors(const Diagnostics& diagnostics) {
    return std::any_of(diagnostics.begin(), diagnostics.end(), [](const Diagnostic& d) {
        return d.severity == Diagnostic::Severity::Error;
    });
}

namespace {

// The length of the valid UTF-8 sequence at s[i] (1–4), or 0 when the bytes there are not one.
size_t utf8_length(std::string_view s, size_t i) {
    const auto byte = [&](size_t k) { return static_cast<unsigned char>(s[k]); };
    const unsigned char c = byte(i);
    const size_t n = c < 0x80 ? 1 : (c >> 5) == 0x6 ? 2 : (c >> 4) == 0xE ? 3 : (c >> 3) == 0x1E ? 4 : 0;
    if (n == 0 || i + n > s.size()) return 0;
    for (size_t k = 1; k < n; ++k)
        if ((byte(i + k) >> 6) != 0x2) return 0;
    return n;
}

}  // namespace

std::string printable_text(std::string_view s, size_t max_chars) {
    std::string out;
    for (size_t i = 0; i < s.size();) {
        const size_t n = utf8_length(s, i);
        const unsigned char c = static_cast<unsigned char>(s[i]);
        if (n == 0 || (n == 1 && (c < 0x20 || c == 0x7F))) {
            char hex[8];
            std::snprintf(hex, sizeof hex, "\\x%02X", c);
            out += hex;
            ++i;
        } else {
            out.append(s.substr(i, n));
            i += n;
        }
    }
    if (out.size() <= max_chars) return out;
    // Keep the start and the end (cut at character boundaries), say how much is left out.
    auto boundary = [&](size_t k) {
        while (k > 0 && k < out.size() && (static_cast<unsigned char>(out[k]) >> 6) == 0x2) --k;
        return k;
    };
    const size_t head = boundary(max_chars * 2 / 3), tail = boundary(out.size() - max_chars / 4);
    return out.substr(0, head) + " … (" + std::to_string(tail - head) + " bytes left out) … " + out.substr(tail);
}

std::string format_diagnostic(const Diagnostic& d, std::string_view file) {
    std::string out(file);
    if (d.line > 0) out += ":" + std::to_string(d.line) + ":" + std::to_string(d.column);
    out += d.severity == Diagnostic::Severity::Error ? ": error: " : ": warning: ";
    if (!d.pointer.empty()) {
        out += printable_text(d.pointer, kMaxShownChars);
        if (!d.subject.empty()) out += " (" + printable_text(d.subject, kMaxShownChars) + ")";
        out += ": ";
    }
    out += printable_text(d.message, kMaxShownChars);
    return out;
}

}  // namespace rv
