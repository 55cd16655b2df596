#pragma once
// The window's own settings (where Dear ImGui's panels were, their sizes: the text ImGui keeps
// in its ini format), in the user's configuration folder (config_folder.hpp) as "imgui.ini".
// The program reads and writes this file itself (ImGui's IniFilename is null, so ImGui never
// opens a file): read bounded like every file (io/bounded_read.hpp), written through
// write_file_safely (io/atomic_file.hpp). No ImGui here: window.cpp moves the text in and out.

#include <filesystem>
#include <string>
#include <string_view>

namespace rv::edit {

std::filesystem::path window_settings_path();

// The settings text; "" when there is none or it cannot be read (the window starts with its
// default layout: settings are a convenience, never a reason to refuse to open).
std::string load_window_settings(const std::filesystem::path& file);

// Writes the text, creating the folder; "" when written, else why not (the caller shows it).
std::string save_window_settings(const std::filesystem::path& file, std::string_view text);

}  // namespace rv::edit
