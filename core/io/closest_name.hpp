#pragma once
// "Did you mean …?": the known name closest to a misspelt one, by edit distance.
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace rv {

// Levenshtein distance (insert, delete, substitute; case-sensitive).
size_t edit_distance(std::string_view a, std::string_view b);

// The closest candidate if it is close enough to be a plausible typo: distance ≤ 2, or ≤ a
// third of the name's length for long names. Ties go to the earlier candidate.
std::optional<std::string> closest_name(std::string_view name,
                                        const std::vector<std::string>& candidates);

}  // namespace rv
