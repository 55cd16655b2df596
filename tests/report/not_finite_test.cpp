// No NaN or infinity as a number (issue 19 §1): a beam whose Gaussian parameter stops being
// finite gives a not-finite finding naming the element, and no figure of it is printed or
// written as a number from there on, in the report's JSON and text, the envelope and the trace.
// The layouts are built in memory, past the reader, so that the check holds whatever bounds the
// reader sets at the door.
#include <catch2/catch.hpp>
#include <cmath>
#include <nlohmann/json.hpp>
#include <string>

#include "analysis/report.hpp"
#include "io/layout_reader.hpp"
#include "report/report_json.hpp"
#include "report/report_text.hpp"

namespace {

rv::Layout demo_with_focal_length(const std::string& lens_id, double focal_length_mm) {
    rv::Layout layout = *rv::read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout;
    for (rv::Element& e : layout.elements)
        if (e.id == lens_id) {
            rv::Lens& lens = std::get<rv::Lens>(e.kind);
            std::visit([&](auto& m) { m.focal_length_mm = focal_length_mm; }, lens.model);
        }
    return layout;
}

// The JSON pointer of the first non-finite float, or "" (nlohmann keeps NaN as a float and
// would dump it as null).
std::string first_non_finite(const nlohmann::json& j, const std::string& where = "") {
    if (j.is_number_float() && !std::isfinite(j.get<double>())) return where.empty() ? "/" : where;
    if (j.is_object())
        for (auto it = j.begin(); it != j.end(); ++it)
            if (std::string w = first_non_finite(it.value(), where + "/" + it.key()); !w.empty()) return w;
    if (j.is_array())
        for (size_t i = 0; i < j.size(); ++i)
            if (std::string w = first_non_finite(j[i], where + "/" + std::to_string(i)); !w.empty()) return w;
    return "";
}

bool has_non_finite_word(const std::string& text) {
    for (const char* w : {"nan", "inf", "NaN", "Inf"})
        for (size_t at = text.find(w); at != std::string::npos; at = text.find(w, at + 1)) {
            const bool letter_before = at > 0 && std::isalpha(static_cast<unsigned char>(text[at - 1]));
            const size_t end = at + 3;
            const bool letter_after = end < text.size() && std::isalpha(static_cast<unsigned char>(text[end]));
            if (!letter_before && !letter_after) return true;
        }
    return false;
}

}  // namespace

TEST_CASE("a lens of 1e-320 mm gives a not-finite finding and no NaN in the report", "[report][not-finite]") {
    // Hand computation (IEEE 754 doubles, from memory): 1 / 1e-320 overflows to infinity, so the
    // thin lens's 1/q' = 1/q - 1/f is -infinity, q' = -0 and the radius w0 sqrt(1 + (z/zR)^2)
    // is 0/0 = NaN from the lens on: the pump's figures after L2_P cannot be computed.
    const rv::Layout layout = demo_with_focal_length("L2_P", 1e-320);
    const rv::RendezvousReport r = rv::build_report(layout, rv::material_library_for(layout));
    int not_finite = 0;
    for (const rv::Finding& f : r.findings)
        if (f.kind == rv::Finding::Kind::NotFinite) {
            ++not_finite;
            CHECK(f.element == "L2_P");
            CHECK(f.beam == "pump");
        }
    CHECK(not_finite == 1);
    const rv::ReportBeam& pump = r.beams[0];
    REQUIRE(pump.id == "pump");
    CHECK_FALSE(pump.at_target.reached);  // no figure at the target is given for it
    for (const rv::EnvelopeSample& e : pump.caustic.envelope) {
        CHECK(std::isfinite(e.radius_tangential_um));
        CHECK(std::isfinite(e.radius_sagittal_um));
    }
    CHECK(first_non_finite(nlohmann::json(r)) == "");
    const std::string text = rv::report_text(r);
    CHECK_FALSE(has_non_finite_word(text));
    CHECK(text.find("no longer a finite number at L2_P") != std::string::npos);  // the finding, in words
    // The other beam is untouched: its figures at the target are there and finite.
    REQUIRE(r.beams[1].at_target.reached);
    CHECK(std::isfinite(r.beams[1].at_target.tangential.waist_um));
}

TEST_CASE("an ordinary lens gives no not-finite finding", "[report][not-finite]") {
    // The demo as bundled: every figure finite, so the guard finds nothing (it is not a filter
    // that fires on every layout).
    const rv::Layout layout = demo_with_focal_length("L2_P", 100);
    const rv::RendezvousReport r = rv::build_report(layout, rv::material_library_for(layout));
    for (const rv::Finding& f : r.findings) CHECK(f.kind != rv::Finding::Kind::NotFinite);
    CHECK(r.beams[0].at_target.reached);
    CHECK(first_non_finite(nlohmann::json(r)) == "");
}
