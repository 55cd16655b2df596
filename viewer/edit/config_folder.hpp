#pragma once
// Where the viewer keeps its own settings (recent files, window layout): one file each in
// $XDG_CONFIG_HOME/rendezvous/ (~/.config/rendezvous/ without it), the XDG Base Directory
// convention; in the current folder when neither variable is set.
#include <filesystem>
#include <string_view>

namespace rv::edit {

std::filesystem::path user_config_file(std::string_view name);

}  // namespace rv::edit
