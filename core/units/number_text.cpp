#include "units/number_text.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstring>

namespace rv {

namespace {

std::string printed(const char* printf_format, double value) {
    char buf[160];
    std::snprintf(buf, sizeof buf, printf_format, value);
    return buf;
}

// The literal text of a printf format without its conversion ("%%" → "%").
std::string literal(const char* first, const char* last) {
    std::string out;
    for (const char* c = first; c < last; ++c) {
        out += *c;
        if (*c == '%' && c + 1 < last && c[1] == '%') ++c;
    }
    return out;
}

// The format with "n/a" in place of its one conversion.
std::string not_available(const char* printf_format) {
    const char* end = printf_format + std::strlen(printf_format);
    for (const char* c = printf_format; c < end; ++c) {
        if (*c != '%') continue;
        if (c + 1 < end && c[1] == '%') {
            ++c;
            continue;
        }
        const char* conversion = c + 1;
        while (conversion < end && !std::strchr("aAeEfFgG", *conversion)) ++conversion;
        if (conversion == end) break;
        return literal(printf_format, c) + "n/a" + literal(conversion + 1, end);
    }
    return "n/a";
}

}  // namespace

double negligible_as_zero(double value, double scale) {
    if (!std::isfinite(value)) return value;
    const double floor =
        kNegligibleFraction * std::max(1.0, std::isfinite(scale) ? std::abs(scale) : 1.0);
    return std::abs(value) < floor ? 0.0 : value;
}

double column_scale(const std::vector<double>& values) {
    double scale = 0;
    for (double v : values)
        if (std::isfinite(v)) scale = std::max(scale, std::abs(v));
    return scale;
}

std::string format_number(const char* printf_format, double value, double scale) {
    if (!std::isfinite(value)) return not_available(printf_format);
    const double v = negligible_as_zero(value, scale);
    std::string text = printed(printf_format, v);
    // A negative value that rounds to zero prints exactly as −0.0 does: print +0.0 instead.
    if (std::signbit(v) && text == printed(printf_format, -0.0)) text = printed(printf_format, 0.0);
    return text;
}

std::string format_duration_fs(double fs, bool plus_sign) {
    if (!std::isfinite(fs)) return "n/a";
    const double a = std::abs(fs);
    const char* f = plus_sign ? "%+.1f fs" : "%.1f fs";
    double shown = fs;
    if (a > 1e7) {
        f = plus_sign ? "%+.3f ns" : "%.3f ns";
        shown = fs * 1e-6;
    } else if (a > 1e4) {
        f = plus_sign ? "%+.3f ps" : "%.3f ps";
        shown = fs * 1e-3;
    }
    return format_number(f, shown);
}

}  // namespace rv
