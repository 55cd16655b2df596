// The process text of a crystal ("sfg" | "shg:BEAM", docs/file-format.md, the crystal row): one
// parse and one format (layout/process_text.hpp), shared by the reader, the writer, the phase
// command and the inspector.
#include <catch2/catch.hpp>

#include "layout/process_text.hpp"

using rv::Crystal;
using rv::ProcessChoice;

TEST_CASE("Process text parses the two forms of the file format") {
    // docs/file-format.md (crystal: `process`): "sfg" or "shg:BEAM" with a beam's id.
    CHECK(rv::parse_process_text("sfg") == ProcessChoice{Crystal::Process::SumFrequency, ""});
    CHECK(rv::parse_process_text("shg:pump") == ProcessChoice{Crystal::Process::SecondHarmonic, "pump"});
    // The beam id is everything after the first colon, colons included.
    CHECK(rv::parse_process_text("shg:a:b") == ProcessChoice{Crystal::Process::SecondHarmonic, "a:b"});
}

TEST_CASE("Process text refuses what is neither form") {
    for (const char* text : {"", "SFG", "sfg ", "shg:", "shg", "auto", "thg:pump", " shg:pump"}) {
        INFO(text);
        CHECK_FALSE(rv::parse_process_text(text).has_value());
    }
}

TEST_CASE("Process text formats what it parses and nothing for auto") {
    CHECK(rv::format_process_text(Crystal::Process::Auto, "pump") == std::nullopt);
    CHECK(rv::format_process_text(Crystal::Process::SumFrequency, "") == "sfg");
    CHECK(rv::format_process_text(Crystal::Process::SecondHarmonic, "signal") == "shg:signal");
    for (const char* text : {"sfg", "shg:pump", "shg:x:y"}) {
        const auto parsed = rv::parse_process_text(text);
        REQUIRE(parsed);
        CHECK(rv::format_process_text(parsed->process, parsed->beam) == text);
    }
}
