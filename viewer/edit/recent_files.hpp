#pragma once
// The viewer's recent files: newest first, each once, at most kMaxRecent, kept one path per line
// in $XDG_CONFIG_HOME/rendezvous/recent.txt (~/.config/rendezvous/recent.txt without it).
#include <filesystem>
#include <string>
#include <vector>

namespace rv::edit {

inline constexpr size_t kMaxRecent = 10;

std::filesystem::path recent_files_path();
std::vector<std::string> load_recent(const std::filesystem::path& file);
// Puts `path` first (as an absolute path) and returns the new list.
std::vector<std::string> with_recent(std::vector<std::string> list, const std::string& path);
// Atomic; a list that cannot be written is not an error worth stopping for (returns false).
bool save_recent(const std::filesystem::path& file, const std::vector<std::string>& list);

}  // namespace rv::edit
