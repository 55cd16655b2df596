#include "findings/finding_json.hpp"

namespace rv {

nlohmann::json finding_json(const Finding& f) {
    auto id_or_null = [](const std::string& s) { return s.empty() ? nlohmann::json(nullptr) : nlohmann::json(s); };
    nlohmann::json j = {{"code", finding_code(f.kind)},
                        {"severity", severity_name(finding_severity(f.kind))},
                        {"beam", id_or_null(f.beam)},
                        {"element", id_or_null(f.element)},
                        {"message", finding_line(f)}};
    if (!f.material.empty()) j["material"] = f.material;
    if (!f.other_element.empty()) j["other_element"] = f.other_element;
    for (const auto& [name, value] : finding_numbers(f)) j[name] = value;
    return j;
}

}  // namespace rv
