#pragma once
// A located problem in an input: what a user sees when a file or a value is wrong.
// Rendered as "FILE: error: /elements/3/focal_length_mm (L2): must be non-zero (got 0)", or with
// "FILE:LINE:COLUMN: error: ..." for syntax errors, where the pointer is unknown.

#include <string>
#include <string_view>
#include <vector>

namespace rv {

struct Diagnostic {
    enum class Severity { Error, Warning };
    Severity severity = Severity::Error;
    std::string pointer;  // JSON pointer of the offending value ("" for the whole document)
    int line = 0;         // 1-based; 0 when not known
    int column = 0;
    std::string message;  // one plain sentence: what was expected, what was found
    std::string subject = {};  // the id of the element or beam the pointer lies in, "" when none
    bool operator==(const Diagnostic&) const = default;
};

using Diagnostics = std::vector<Diagnostic>;

bool has_errors(const Diagnostics& diagnostics);

// Text fit for a terminal: bytes that are not UTF-8, and control characters, as \xNN; longer
// than max_chars (a 1 MB id quoted in a message), the middle left out with a note of how much.
inline constexpr size_t kMaxShownChars = 300;
std::string printable_text(std::string_view text, size_t max_chars);

// "FILE: error: POINTER (SUBJECT): MESSAGE" (or "FILE:LINE:COL: error: MESSAGE"), pointer,
// subject and message through printable_text.
std::string format_diagnostic(const Diagnostic& d, std::string_view file);

}  // namespace rv
