// The window's settings file (edit/window_settings.hpp): ImGui opens no file; the program reads
// the ini text bounded and writes it through write_file_safely in the configuration folder.
#include <imgui.h>

#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>

#include "edit/window_settings.hpp"
#include "render/headless.hpp"

namespace fs = std::filesystem;

namespace {

// One frame of a fresh context holding a window "Panel", placed at `at` unless the loaded
// settings place it; returns the settings text ImGui keeps, and where the window was.
std::pair<std::string, ImVec2> frame_with_panel(const std::string& settings, ImVec2 at) {
    ImGuiContext* context = ImGui::CreateContext();
    rv::render::Texture font;
    rv::render::configure_context(font);
    ImGuiIO& io = ImGui::GetIO();
    CHECK(io.IniFilename == nullptr);
    io.DisplaySize = ImVec2(800, 600);
    io.DeltaTime = 1.0f / 60;
    if (!settings.empty()) ImGui::LoadIniSettingsFromMemory(settings.data(), settings.size());
    ImGui::NewFrame();
    ImGui::SetNextWindowPos(at, ImGuiCond_FirstUseEver);
    ImGui::Begin("Panel");
    const ImVec2 pos = ImGui::GetWindowPos();
    ImGui::End();
    ImGui::Render();
    size_t size = 0;
    const char* text = ImGui::SaveIniSettingsToMemory(&size);
    std::string kept(text, size);
    ImGui::DestroyContext(context);
    return {kept, pos};
}

}  // namespace

TEST_CASE("window settings written and read back place a panel where it was", "[viewer][settings]") {
    const fs::path dir = fs::temp_directory_path() / "rv-window-settings-test";
    fs::remove_all(dir);
    const fs::path file = dir / "rendezvous" / "imgui.ini";
    CHECK(rv::edit::load_window_settings(file).empty());  // none yet: the default layout
    const auto [text, first] = frame_with_panel("", ImVec2(50, 60));
    CHECK(first.x == 50);
    CHECK(text.find("[Window][Panel]") != std::string::npos);
    CHECK(rv::edit::save_window_settings(file, text).empty());  // the folder is made
    CHECK(rv::edit::load_window_settings(file) == text);
    // A new session reads the file: the panel opens where the first left it, not at (300, 300).
    const auto [again, second] = frame_with_panel(rv::edit::load_window_settings(file), ImVec2(300, 300));
    CHECK(second.x == 50);
    CHECK(second.y == 60);
    fs::remove_all(dir);
}

TEST_CASE("window settings refuse to replace a folder and read no non-file", "[viewer][settings]") {
    const fs::path dir = fs::temp_directory_path() / "rv-window-settings-refuse";
    fs::remove_all(dir);
    fs::create_directories(dir / "imgui.ini");  // a folder where the file would go
    const std::string error = rv::edit::save_window_settings(dir / "imgui.ini", "[Window][X]\n");
    CHECK_FALSE(error.empty());
    CHECK(fs::is_directory(dir / "imgui.ini"));
    CHECK(rv::edit::load_window_settings(dir / "imgui.ini").empty());
    CHECK(rv::edit::load_window_settings("/dev/zero").empty());
    fs::remove_all(dir);
}
