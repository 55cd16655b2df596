#include "edit/recent_files.hpp"

#include <algorithm>
#include <sstream>
#include <system_error>

#include "edit/config_folder.hpp"
#include "io/atomic_file.hpp"
#include "io/bounded_read.hpp"

namespace rv::edit {

std::filesystem::path recent_files_path() { return user_config_file("recent.txt"); }

std::vector<std::string> load_recent(const std::filesystem::path& file) {
    std::vector<std::string> list;
    // kMaxRecent paths of at most PATH_MAX (4096) bytes each; anything else is not our list.
    constexpr std::size_t kMaxRecentBytes = kMaxRecent * 4097;
    const BoundedRead read = read_file_bounded(file, kMaxRecentBytes, "the recent-files list");
    if (!read.ok()) return list;
    std::istringstream in(read.text);
    for (std::string line; std::getline(in, line) && list.size() < kMaxRecent;)
        if (!line.empty()) list.push_back(line);
    return list;
}

std::vector<std::string> with_recent(std::vector<std::string> list, const std::string& path) {
    std::error_code ec;
    std::filesystem::path absolute = std::filesystem::absolute(path, ec);
    const std::string p = ec ? path : absolute.lexically_normal().string();
    list.erase(std::remove(list.begin(), list.end(), p), list.end());
    list.insert(list.begin(), p);
    if (list.size() > kMaxRecent) list.resize(kMaxRecent);
    return list;
}

bool save_recent(const std::filesystem::path& file, const std::vector<std::string>& list) {
    try {
        std::error_code ec;
        std::filesystem::create_directories(file.parent_path(), ec);
        std::string text;
        for (const std::string& p : list) text += p + "\n";
        write_file_safely(file, text);
        return true;
    } catch (const std::exception&) {
        return false;
    }
}

}  // namespace rv::edit
