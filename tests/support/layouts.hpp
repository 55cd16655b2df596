#pragma once
// Test layouts written inline as JSON: read them and require that they read cleanly.
#include <string>

#include "io/layout_reader.hpp"
#include "support/tolerance.hpp"

namespace rv::test {

inline Layout layout_from(const std::string& json) {
    const LayoutReadResult r = read_layout(json);
    for (const Diagnostic& d : r.diagnostics) UNSCOPED_INFO(format_diagnostic(d, "inline"));
    REQUIRE(r.layout.has_value());
    return *r.layout;
}

// A one- or two-beam layout around the given beams and elements (JSON fragments).
inline std::string layout_json(const std::string& beams, const std::string& elements,
                               const std::string& target) {
    return R"({"format": "rendezvous-layout", "version": 1, "table": {"size_mm": [1000, 1000]},
               "beams": [)" + beams + R"(], "elements": [)" + elements + R"(], "target": ")" +
           target + "\"}";
}

// A layout from the layouts/ folder, read cleanly.
inline Layout bundled_layout(const std::string& file) {
    const LayoutReadResult r = read_layout_file(std::string(RV_SOURCE_DIR) + "/layouts/" + file);
    REQUIRE(r.layout.has_value());
    return *r.layout;
}

// A built-in material by the name a file would use.
inline const Material& material(const char* name) {
    const Material* m = MaterialLibrary::builtin().find(name);
    REQUIRE(m != nullptr);
    return *m;
}

}  // namespace rv::test
