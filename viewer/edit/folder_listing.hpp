#pragma once
// What the Open / Save As dialog shows of a folder, without ImGui: its entries (folders first,
// then the *.json layouts, each group by name ignoring case; hidden entries, such as the
// recovery files ".NAME.recovery.json", left out) and the completion of a typed path (Tab).
#include <filesystem>
#include <string>
#include <vector>

namespace rv::edit {

struct FolderEntry {
    std::string name;
    bool folder = false;
    bool operator==(const FolderEntry&) const = default;
};

struct FolderListing {
    std::filesystem::path folder;     // absolute, normalised
    std::vector<FolderEntry> entries;
    std::string error;                // why the folder could not be read ("" when it was)
};

FolderListing list_folder(const std::filesystem::path& folder);

// Completing a typed path: the folder part is read (relative to `base` when the path is
// relative) and the last part is extended to the longest prefix the matching entries share; a
// single matching folder also gets its '/'. `candidates` lists the matching names (in listing
// order) when more than one matches. Nothing matching: the text comes back unchanged.
struct Completion {
    std::string text;
    std::vector<std::string> candidates;
};
Completion complete_path(const std::string& typed, const std::filesystem::path& base);

// The folder a dialog shows for a typed path: the path itself when it is a folder, else its
// parent (relative to `base`); `base` when neither exists.
std::filesystem::path folder_of_typed(const std::string& typed, const std::filesystem::path& base);

}  // namespace rv::edit
