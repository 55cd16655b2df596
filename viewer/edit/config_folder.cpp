#include "edit/config_folder.hpp"

#include <cstdlib>

namespace rv::edit {

std::filesystem::path user_config_file(std::string_view name) {
    if (const char* xdg = std::getenv("XDG_CONFIG_HOME"); xdg && *xdg) return std::filesystem::path(xdg) / "rendezvous" / name;
    if (const char* home = std::getenv("HOME"); home && *home)
        return std::filesystem::path(home) / ".config" / "rendezvous" / name;
    return std::filesystem::path("rendezvous-" + std::string(name));
}

}  // namespace rv::edit
