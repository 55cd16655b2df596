#pragma once
// The text of the process a crystal is set for, as the layout file (a crystal's "process"), the
// command line (`rendezvous phase --process`) and the report's advice spell it: "sfg" (the sum
// frequency of the two beams) or "shg:BEAM" (the second harmonic of the beam with id BEAM).
// Crystal::Process::Auto has no text (the file leaves the key out). One parse and one format,
// used everywhere the text is read or written.

#include <optional>
#include <string>
#include <string_view>

#include "layout/layout.hpp"

namespace rv {

// A process named by its text: SumFrequency with no beam, or SecondHarmonic of `beam`.
struct ProcessChoice {
    Crystal::Process process = Crystal::Process::SumFrequency;
    std::string beam;  // the beam's id, with SecondHarmonic; empty otherwise
    bool operator==(const ProcessChoice&) const = default;
};

// What the text must look like, for the "expected …" of an error message.
inline constexpr std::string_view kProcessTextForms = "\"sfg\" or \"shg:BEAM\" (BEAM a beam's id)";

// "sfg" → SumFrequency; "shg:BEAM" with a non-empty BEAM → SecondHarmonic of BEAM; anything else
// (including "shg:" with no beam and "auto") → nullopt. Whether BEAM is a beam of the layout is
// the caller's check (it has the layout).
std::optional<ProcessChoice> parse_process_text(std::string_view text);

// The text of a process: "sfg", "shg:" + beam_id; nullopt for Auto (not written).
std::optional<std::string> format_process_text(Crystal::Process process, std::string_view beam_id);

}  // namespace rv
