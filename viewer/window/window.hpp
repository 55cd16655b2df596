#pragma once
// The interactive window: GLFW for the window, input and a plain GL context whose only job is
// to show the finished CPU-rendered frame as one texture (no GL renderer backend).
#include <iosfwd>
#include <string>

#include "layout/layout.hpp"

namespace rv::window {

struct WindowOptions {
    int width = 1600, height = 1000;
    int quit_after_frames = 0;  // > 0: close by itself after that many frames (tests)
    int threads = 2;            // rasterizer threads
};

// Returns the exit status: 0, or 2 when no window can be opened (no display).
int run_window(const Layout& layout, const std::string& title, const WindowOptions& options, std::ostream& err);

}  // namespace rv::window
