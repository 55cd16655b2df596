// libFuzzer target: every layout that reads is traced, propagated and reported without a crash,
// and every number the report gives is finite or absent (issue: "never print a NaN"); and the
// retrace under a few random sparse edits gives exactly a fresh trace's paths and numbers
// (support/retrace_check.hpp, the differential check the unit tests run on fixed layouts).
#include <cctype>
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <string>
#include <string_view>

#include "analysis/report.hpp"
#include "report/report_json.hpp"
#include "report/report_text.hpp"
#include "io/layout_reader.hpp"
#include "support/retrace_check.hpp"

namespace {
void require_finite(double v) {
    if (!std::isfinite(v)) __builtin_trap();
}

// Every number of the report's JSON (report/report_json.cpp, all that `report --json` prints):
// nlohmann keeps a NaN or an infinity as a float and dumps it as null, so it is caught here,
// before the dump, with its JSON pointer printed.
void require_finite_json(const nlohmann::json& j, const std::string& where) {
    if (j.is_number_float() && !std::isfinite(j.get<double>())) {
        std::fprintf(stderr, "non-finite number in the report at %s\n", where.c_str());
        __builtin_trap();
    }
    if (j.is_object())
        for (auto it = j.begin(); it != j.end(); ++it) require_finite_json(it.value(), where + "/" + it.key());
    if (j.is_array())
        for (size_t i = 0; i < j.size(); ++i) require_finite_json(j[i], where + "/" + std::to_string(i));
}

// The text report never prints NaN or infinity as a number ("nan", "-nan", "inf" as words;
// "infrared" is not one).
void require_no_non_finite_words(const std::string& text) {
    const auto letter = [](char c) { return std::isalpha(static_cast<unsigned char>(c)) != 0; };
    const auto word_at = [&](size_t i, const char* w) {
        const size_t n = std::char_traits<char>::length(w);
        if (i + n > text.size()) return false;
        for (size_t k = 0; k < n; ++k)
            if (std::tolower(static_cast<unsigned char>(text[i + k])) != w[k]) return false;
        return i + n == text.size() || !letter(text[i + n]);
    };
    for (size_t i = 0; i < text.size(); ++i) {
        if (i > 0 && letter(text[i - 1])) continue;
        if (word_at(i, "nan") || word_at(i, "inf") || word_at(i, "infinity")) {
            std::fprintf(stderr, "non-finite word in the text report: ...%s...\n",
                         text.substr(i >= 60 ? i - 60 : 0, 80).c_str());
            __builtin_trap();
        }
    }
}
// Whether the input holds "nan" or "inf" in any case anywhere (ids, names, materials).
bool user_text_has_such_words(std::string_view input) {
    std::string lower(input);
    for (char& c : lower) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    return lower.find("nan") != std::string::npos || lower.find("inf") != std::string::npos;
}
}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const rv::LayoutReadResult r = rv::read_layout(std::string_view(reinterpret_cast<const char*>(data), size));
    if (!r.layout) return 0;
    const rv::RendezvousReport rep = rv::build_report(*r.layout, rv::material_library_for(*r.layout));
    for (const rv::ReportBeam& b : rep.beams) {
        if (!b.at_target.reached) continue;
        require_finite(b.at_target.path_mm);
        require_finite(b.at_target.arrival_fs);
        require_finite(b.at_target.tangential.waist_um);
        require_finite(b.at_target.sagittal.waist_offset_mm);
    }
    if (rep.overlap) {
        require_finite(rep.overlap->combined);
        if (rep.overlap->combined < 0 || rep.overlap->combined > 1 + 1e-9) __builtin_trap();
    }
    // The NaN/infinity guard over everything the report prints: its JSON and its text.
    require_finite_json(nlohmann::json(rep), "");
    // The words could be the file's own (a layout named "nan"): only checked when no string of
    // the file holds them.
    if (!user_text_has_such_words(std::string_view(reinterpret_cast<const char*>(data), size)))
        require_no_non_finite_words(rv::report_text(rep));
    // A few edits from a seed taken from the input, so that a reproducer replays the same run.
    const std::uint32_t seed = static_cast<std::uint32_t>(size * 2654435761u);
    const rv::test::RetraceRun run = rv::test::check_retraces(*r.layout, rv::material_library_for(*r.layout), seed, 4);
    if (run.difference) {
        std::fprintf(stderr, "retrace differs from a fresh trace: %s\n", run.difference->c_str());
        __builtin_trap();
    }
    return 0;
}
