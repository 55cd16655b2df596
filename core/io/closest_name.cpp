#include "io/closest_name.hpp"

#include <algorithm>
#include <cctype>

namespace rv {

size_t edit_distance(std::string_view a, std::string_view b) {
    std::vector<size_t> row(b.size() + 1);
    for (size_t j = 0; j <= b.size(); ++j) row[j] = j;
    for (size_t i = 1; i <= a.size(); ++i) {
        size_t diagonal = row[0];
        row[0] = i;
        for (size_t j = 1; j <= b.size(); ++j) {
            const size_t above = row[j];
            row[j] = std::min({row[j] + 1, row[j - 1] + 1, diagonal + (a[i - 1] != b[j - 1])});
            diagonal = above;
        }
    }
    return row[b.size()];
}

std::optional<std::string> closest_name(std::string_view name,
                                        const std::vector<std::string>& candidates) {
    const size_t limit = std::max<size_t>(2, name.size() / 3);
    std::optional<std::string> best;
    size_t best_distance = limit + 1;
    for (const std::string& c : candidates) {
        const size_t d = edit_distance(name, c);
        if (d < best_distance && d < name.size()) {  // not a name replaced whole ("T" → "L")
            best_distance = d;
            best = c;
        }
    }
    return best;
}

namespace {

std::string folded(std::string_view s) {
    std::string out(s);
    for (char& c : out) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    return out;
}

// "n-bk7" → "bk7", "bbo:eimerl1987" → "bbo": the forms a user may leave out.
std::string bare(std::string s) {
    if (const size_t colon = s.find(':'); colon != std::string::npos) s.resize(colon);
    if (const size_t dash = s.find('-'); dash != std::string::npos && dash >= 1 && dash <= 2 && dash + 1 < s.size() &&
                                          std::isalpha(static_cast<unsigned char>(s[0])))
        s.erase(0, dash + 1);
    return s;
}

}  // namespace

std::optional<std::string> closest_catalogue_name(std::string_view name, const std::vector<std::string>& candidates) {
    const std::string wanted = folded(name);
    for (const std::string& c : candidates)
        if (folded(c) == wanted) return c;
    const std::string wanted_bare = bare(wanted);
    for (const std::string& c : candidates)
        if (bare(folded(c)) == wanted_bare) return c;
    std::vector<std::string> lower;
    lower.reserve(candidates.size());
    for (const std::string& c : candidates) lower.push_back(folded(c));
    const std::optional<std::string> near = closest_name(wanted, lower);
    if (!near) return std::nullopt;
    return candidates[static_cast<size_t>(std::find(lower.begin(), lower.end(), *near) - lower.begin())];
}

}  // namespace rv
