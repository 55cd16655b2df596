#include "edit/window_settings.hpp"

#include <system_error>

#include "edit/config_folder.hpp"
#include "io/atomic_file.hpp"
#include "io/bounded_read.hpp"

namespace rv::edit {

namespace {
// A few hundred bytes per panel; a megabyte is far more than any window's settings.
constexpr std::size_t kMaxSettingsBytes = 1 << 20;
}  // namespace

std::filesystem::path window_settings_path() { return user_config_file("imgui.ini"); }

std::string load_window_settings(const std::filesystem::path& file) {
    const BoundedRead read = read_file_bounded(file, kMaxSettingsBytes, "the window settings");
    return read.ok() ? read.text : std::string();
}

std::string save_window_settings(const std::filesystem::path& file, std::string_view text) {
    try {
        std::error_code ec;
        if (file.has_parent_path()) std::filesystem::create_directories(file.parent_path(), ec);
        write_file_safely(file, text);
        return "";
    } catch (const std::exception& e) {
        return e.what();
    }
}

}  // namespace rv::edit
