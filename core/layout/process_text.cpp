#include "layout/process_text.hpp"

namespace rv {

namespace {
constexpr std::string_view kSumFrequencyText = "sfg";
constexpr std::string_view kSecondHarmonicPrefix = "shg:";
}  // namespace

std::optional<ProcessChoice> parse_process_text(std::string_view text) {
    if (text == kSumFrequencyText) return ProcessChoice{Crystal::Process::SumFrequency, {}};
    if (text.size() > kSecondHarmonicPrefix.size() && text.starts_with(kSecondHarmonicPrefix))
        return ProcessChoice{Crystal::Process::SecondHarmonic, std::string(text.substr(kSecondHarmonicPrefix.size()))};
    return std::nullopt;
}

std::optional<std::string> format_process_text(Crystal::Process process, std::string_view beam_id) {
    switch (process) {
        case Crystal::Process::Auto: return std::nullopt;
        case Crystal::Process::SumFrequency: return std::string(kSumFrequencyText);
        case Crystal::Process::SecondHarmonic: return std::string(kSecondHarmonicPrefix) + std::string(beam_id);
    }
    return std::nullopt;  // not reached: every enumerator is a case (-Wswitch)
}

}  // namespace rv
