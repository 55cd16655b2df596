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
// third of the name's length for long names, and less than the name's length (a one-letter
// name is not "close" to every other). Ties go to the earlier candidate.
std::optional<std::string> closest_name(std::string_view name,
                                        const std::vector<std::string>& candidates);

// The same for a material name, as a user might write it: case-insensitive ("bbo" → "BBO"),
// without a maker's one- or two-letter prefix ("BK7" → "N-BK7") or a data set's ":Author"
// suffix ("LBO" is found beside "LBO:Kato1994"); failing those, the closest by edit distance
// ignoring case.
std::optional<std::string> closest_catalogue_name(std::string_view name, const std::vector<std::string>& candidates);

}  // namespace rv
