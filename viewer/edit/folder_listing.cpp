#include "edit/folder_listing.hpp"

#include <algorithm>
#include <cctype>
#include <system_error>

namespace rv::edit {

namespace {

std::string lower(std::string s) {
    std::transform(s.begin(), s.end(), s.begin(), [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
    return s;
}

bool is_layout_name(const std::string& name) {
    return name.size() > 5 && lower(name.substr(name.size() - 5)) == ".json";
}

std::filesystem::path absolute_of(const std::filesystem::path& p, const std::filesystem::path& base) {
    return (p.is_absolute() ? p : base / p).lexically_normal();
}

}  // namespace

FolderListing list_folder(const std::filesystem::path& folder) {
    FolderListing out;
    std::error_code ec;
    out.folder = std::filesystem::absolute(folder, ec).lexically_normal();
    if (ec) out.folder = folder;
    std::filesystem::directory_iterator it(out.folder, std::filesystem::directory_options::skip_permission_denied, ec);
    if (ec) {
        out.error = "cannot list " + out.folder.string() + ": " + ec.message();
        return out;
    }
    for (; it != std::filesystem::directory_iterator(); it.increment(ec)) {
        if (ec) break;
        const std::string name = it->path().filename().string();
        if (name.empty() || name[0] == '.') continue;  // hidden, recovery files among them
        std::error_code kind_ec;
        const bool folder_entry = it->is_directory(kind_ec);  // follows links
        if (folder_entry) out.entries.push_back({name, true});
        else if (is_layout_name(name) && it->is_regular_file(kind_ec)) out.entries.push_back({name, false});
    }
    std::sort(out.entries.begin(), out.entries.end(), [](const FolderEntry& a, const FolderEntry& b) {
        if (a.folder != b.folder) return a.folder;
        const std::string la = lower(a.name), lb = lower(b.name);
        return la != lb ? la < lb : a.name < b.name;
    });
    return out;
}

Completion complete_path(const std::string& typed, const std::filesystem::path& base) {
    Completion out{typed, {}};
    const size_t slash = typed.find_last_of('/');
    const std::string head = slash == std::string::npos ? "" : typed.substr(0, slash + 1);
    const std::string stem = slash == std::string::npos ? typed : typed.substr(slash + 1);
    const std::filesystem::path folder = absolute_of(head.empty() ? std::filesystem::path(".") : std::filesystem::path(head), base);
    const FolderListing listing = list_folder(folder);
    std::vector<const FolderEntry*> matches;
    for (const FolderEntry& e : listing.entries)
        if (e.name.compare(0, stem.size(), stem) == 0) matches.push_back(&e);
    if (matches.empty()) return out;
    std::string common = matches.front()->name;
    for (const FolderEntry* e : matches) {
        size_t n = 0;
        while (n < common.size() && n < e->name.size() && common[n] == e->name[n]) ++n;
        common.resize(n);
    }
    out.text = head + common;
    if (matches.size() == 1 && matches.front()->folder) out.text += "/";
    if (matches.size() > 1)
        for (const FolderEntry* e : matches) out.candidates.push_back(e->name + (e->folder ? "/" : ""));
    return out;
}

std::filesystem::path folder_of_typed(const std::string& typed, const std::filesystem::path& base) {
    std::error_code ec;
    const std::filesystem::path p = absolute_of(typed.empty() ? std::filesystem::path(".") : std::filesystem::path(typed), base);
    if (std::filesystem::is_directory(p, ec)) return p;
    const std::filesystem::path parent = p.parent_path();
    if (std::filesystem::is_directory(parent, ec)) return parent;
    return absolute_of(".", base);
}

}  // namespace rv::edit
