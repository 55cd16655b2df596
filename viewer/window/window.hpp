#pragma once
// The interactive window: GLFW for the window, input and a plain GL context whose only job is
// to show the finished CPU-rendered frame as one texture (no GL renderer backend).
#include <filesystem>
#include <iosfwd>
#include <optional>
#include <string>

#include "layout/layout.hpp"

namespace rv::window {

struct WindowOptions {
    int width = 1600, height = 1000;
    int quit_after_frames = 0;  // > 0: close by itself after that many frames (tests)
    int threads = 2;            // rasterizer threads
};

// Returns the exit status: 0, or 2 when no window can be opened (no display).
// With a path, edits are saved there (and autosaved to its recovery file every 30 s while
// unsaved); without one (the demo), Save As names a file.
int run_window(const Layout& layout, const std::optional<std::filesystem::path>& path, const WindowOptions& options,
               std::ostream& err);

}  // namespace rv::window
