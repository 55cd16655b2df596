// All GL code of the program is in this file.
#include "window/window.hpp"

#include <GLFW/glfw3.h>
#include <imgui.h>

#include <algorithm>
#include <cfloat>
#include <filesystem>
#include <memory>
#include <ostream>
#include <string>
#include <string_view>

#include "analysis/report.hpp"
#include "cli/load.hpp"
#include "edit/config_folder.hpp"
#include "edit/recent_files.hpp"
#include "edit/window_settings.hpp"
#include "io/layout_reader.hpp"
#include "io/lens_catalog.hpp"
#include "render/cpu_rasterizer.hpp"
#include "render/export.hpp"
#include "render/headless.hpp"
#include "scene/scene.hpp"
#include "ui/actions.hpp"
#include "ui/frame.hpp"
#include "ui/input_queue.hpp"
#include "ui/status_bar.hpp"

namespace rv::window {

namespace {

// The platform side of the input queue (ui/input_queue.hpp): GLFW's callbacks only queue what
// happened; the loop feeds it to ImGui frame by frame. Any event, a resize or an expose wakes
// the loop for a few frames (kSettleFrames: ImGui lays out popups and sizes windows in the
// frames after an input).
constexpr int kSettleFrames = 3;

struct Platform {
    ui::InputQueue queue;
    int frames_due = kSettleFrames;
};

Platform& platform_of(GLFWwindow* w) { return *static_cast<Platform*>(glfwGetWindowUserPointer(w)); }

void install_callbacks(GLFWwindow* window) {
    glfwSetKeyCallback(window, [](GLFWwindow* w, int key, int, int action, int) {
        Platform& p = platform_of(w);
        // A held key's repeats change nothing in ImGui's key state, but wake a frame so that
        // ImGui's own repeat (a held Backspace in a field) advances.
        if (action != GLFW_REPEAT) p.queue.push(ui::InputEvent::key(key, action == GLFW_PRESS));
        p.frames_due = kSettleFrames;
    });
    glfwSetCharCallback(window, [](GLFWwindow* w, unsigned c) {
        platform_of(w).queue.push(ui::InputEvent::character(c));
    });
    glfwSetMouseButtonCallback(window, [](GLFWwindow* w, int button, int action, int) {
        platform_of(w).queue.push(ui::InputEvent::button(button, action == GLFW_PRESS));
    });
    glfwSetCursorPosCallback(window, [](GLFWwindow* w, double x, double y) {
        platform_of(w).queue.push(ui::InputEvent::cursor(static_cast<float>(x), static_cast<float>(y)));
    });
    glfwSetCursorEnterCallback(window, [](GLFWwindow* w, int entered) {
        if (!entered) platform_of(w).queue.push(ui::InputEvent::cursor(-FLT_MAX, -FLT_MAX));
    });
    glfwSetScrollCallback(window, [](GLFWwindow* w, double x, double y) {
        platform_of(w).queue.push(ui::InputEvent::scroll(static_cast<float>(x), static_cast<float>(y)));
    });
    glfwSetWindowFocusCallback(window, [](GLFWwindow* w, int focused) {
        platform_of(w).queue.push(ui::InputEvent::focus(focused != 0));
    });
    glfwSetWindowRefreshCallback(window, [](GLFWwindow* w) { platform_of(w).frames_due = kSettleFrames; });
    glfwSetFramebufferSizeCallback(window, [](GLFWwindow* w, int, int) { platform_of(w).frames_due = kSettleFrames; });
}

void set_clipboard(void* window, const char* text) { glfwSetClipboardString(static_cast<GLFWwindow*>(window), text); }
const char* get_clipboard(void* window) { return glfwGetClipboardString(static_cast<GLFWwindow*>(window)); }

}  // namespace

int run_window(const Layout& layout, const std::optional<std::filesystem::path>& path, const WindowOptions& options,
               std::ostream& err) {
    auto doc = std::make_unique<edit::Document>(layout, path);
    if (!glfwInit()) {
        err << "rendezvous: error: cannot open a window (no display?); use `rendezvous render` for files\n";
        return 2;
    }
    glfwWindowHint(GLFW_CONTEXT_VERSION_MAJOR, 2);
    glfwWindowHint(GLFW_CONTEXT_VERSION_MINOR, 1);
    std::string title = ui::window_title(*doc);
    GLFWwindow* window = glfwCreateWindow(options.width, options.height, title.c_str(), nullptr, nullptr);
    if (!window) {
        glfwTerminate();
        err << "rendezvous: error: cannot create a window with an OpenGL 2.1 context\n";
        return 2;
    }
    glfwMakeContextCurrent(window);
    glfwSwapInterval(1);
    Platform platform;
    glfwSetWindowUserPointer(window, &platform);

    ui::ViewerState state;
    state.doc = doc.get();
    state.tools.catalog = parse_lens_catalog(cli::lens_catalog_text(), material_library_for(layout)).lenses;
    const std::filesystem::path recent_file = edit::recent_files_path();
    state.recent = edit::load_recent(recent_file);
    if (path) {
        state.recent = edit::with_recent(state.recent, path->string());
        edit::save_recent(recent_file, state.recent);
    }
    if (const auto orphans = doc->orphaned_recoveries(); !orphans.empty())
        state.recovery_offer = orphans.front().string();
    if (const int others = doc->other_windows(); others > 0)
        state.editor.status = "this layout is also open in " + std::to_string(others) + " other window" +
                              (others > 1 ? "s" : "") + "; each keeps its own recovery file";
    double last_autosave_s = glfwGetTime();

    IMGUI_CHECKVERSION();
    ImGui::CreateContext();
    // Dear ImGui's own window settings live with the user's configuration, never in the folder
    // the program was started from; ImGui opens no file (IniFilename null): the program reads
    // the text and writes it through write_file_safely when ImGui asks (edit/window_settings.hpp).
    const std::filesystem::path settings_file = edit::window_settings_path();
    ImGuiIO& io = ImGui::GetIO();
    io.IniFilename = nullptr;
    if (const std::string settings = edit::load_window_settings(settings_file); !settings.empty())
        ImGui::LoadIniSettingsFromMemory(settings.data(), settings.size());
    const auto save_settings = [&] {
        size_t size = 0;
        const char* text = ImGui::SaveIniSettingsToMemory(&size);
        const std::string error = edit::save_window_settings(settings_file, std::string_view(text, size));
        if (!error.empty()) state.editor.status = "window settings not kept: " + error;
        ImGui::GetIO().WantSaveIniSettings = false;
    };
    render::Texture font;
    render::configure_context(font);  // the key map: GLFW's key codes (ui/keys.hpp)
    io.BackendPlatformName = "rendezvous_glfw";
    io.SetClipboardTextFn = set_clipboard;
    io.GetClipboardTextFn = get_clipboard;
    io.ClipboardUserData = window;
    install_callbacks(window);

    GLuint texture = 0;
    glGenTextures(1, &texture);
    int tex_w = 0, tex_h = 0;
    double last_frame_s = glfwGetTime();
    const bool continuous = options.quit_after_frames > 0;  // tests: N frames one after another
    for (int frame = 0; !state.quit; ) {
        if (continuous && frame >= options.quit_after_frames) break;
        // Idle: wait for an event, or until the next thing due (the status line's message
        // expires, the autosave of unsaved edits); a wake with nothing to do draws nothing.
        if (!continuous && platform.frames_due == 0 && platform.queue.empty()) {
            // ImGui's clock stands still between frames: the message's time left, less the time since.
            const auto message_left_s = [&] { return ui::status_seconds_left(state) - (glfwGetTime() - last_frame_s); };
            double wait_s = message_left_s();
            if (doc->dirty()) wait_s = std::min(wait_s, last_autosave_s + 30.0 - glfwGetTime());
            glfwWaitEventsTimeout(std::clamp(wait_s, 0.001, 30.0));
            if (!state.status_line.text.empty() && message_left_s() <= 0) platform.frames_due = std::max(platform.frames_due, 1);
        } else {
            glfwPollEvents();
        }
        if (glfwWindowShouldClose(window)) {  // the close box: ask first when there are unsaved changes
            glfwSetWindowShouldClose(window, GLFW_FALSE);
            ui::request_quit(state);
            if (state.quit) break;
            platform.frames_due = kSettleFrames;
        }
        if (glfwGetTime() - last_autosave_s > 30.0) {
            std::string error;
            if (!doc->autosave(error)) state.editor.status = error, platform.frames_due = kSettleFrames;
            last_autosave_s = glfwGetTime();
        }
        if (state.open_request) {  // File ▸ Open or a recent file
            const std::string file = *state.open_request;
            state.open_request.reset();
            ui::open_layout(state, doc, file, &recent_file);
            platform.frames_due = kSettleFrames;
        }
        if (state.template_request) {  // File ▸ New from a template
            const size_t k = *state.template_request;
            state.template_request.reset();
            ui::new_from_template(state, doc, k);
            platform.frames_due = kSettleFrames;
        }
        if (!continuous && platform.frames_due == 0 && platform.queue.empty()) continue;
        if (!platform.queue.empty()) platform.frames_due = kSettleFrames;  // an event still to apply
        platform.queue.apply_frame(io);
        --platform.frames_due;
        ++frame;
        const unsigned revision_before = doc->revision();
        const double now_s = glfwGetTime();
        io.DeltaTime = static_cast<float>(std::max(now_s - last_frame_s, 1e-4));
        last_frame_s = now_s;
        int ww = 0, wh = 0, fw = 0, fh = 0;
        glfwGetWindowSize(window, &ww, &wh);
        glfwGetFramebufferSize(window, &fw, &fh);
        io.DisplaySize = ImVec2(static_cast<float>(ww), static_cast<float>(wh));
        if (ww > 0 && wh > 0) io.DisplayFramebufferScale = ImVec2(static_cast<float>(fw) / ww, static_cast<float>(fh) / wh);
        ImGui::NewFrame();
        ui::draw_document_frame(state);
        ImGui::Render();
        if (doc->revision() != revision_before) platform.frames_due = kSettleFrames;  // the drawing follows the change
        if (const std::string now_title = ui::window_title(*doc); now_title != title) {  // the unsaved mark
            title = now_title;
            glfwSetWindowTitle(window, title.c_str());
        }
        if (io.WantSaveIniSettings) save_settings();  // set by ImGui a few seconds after a change
        if (fw <= 0 || fh <= 0) continue;
        render::Framebuffer fb(fw, fh);
        fb.clear(255, 255, 255);
        rasterize(*ImGui::GetDrawData(), fb, {options.threads});
        glBindTexture(GL_TEXTURE_2D, texture);
        if (fw != tex_w || fh != tex_h) {
            glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MIN_FILTER, GL_NEAREST);
            glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MAG_FILTER, GL_NEAREST);
            glTexImage2D(GL_TEXTURE_2D, 0, GL_RGBA, fw, fh, 0, GL_RGBA, GL_UNSIGNED_BYTE, fb.rgba.data());
            tex_w = fw;
            tex_h = fh;
        } else {
            glTexSubImage2D(GL_TEXTURE_2D, 0, 0, 0, fw, fh, GL_RGBA, GL_UNSIGNED_BYTE, fb.rgba.data());
        }
        glViewport(0, 0, fw, fh);
        glMatrixMode(GL_PROJECTION);
        glLoadIdentity();
        glOrtho(0, 1, 1, 0, -1, 1);  // the buffer's first row at the top
        glMatrixMode(GL_MODELVIEW);
        glLoadIdentity();
        glEnable(GL_TEXTURE_2D);
        glBegin(GL_QUADS);
        glTexCoord2f(0, 0), glVertex2f(0, 0);
        glTexCoord2f(1, 0), glVertex2f(1, 0);
        glTexCoord2f(1, 1), glVertex2f(1, 1);
        glTexCoord2f(0, 1), glVertex2f(0, 1);
        glEnd();
        glfwSwapBuffers(window);
        if (state.export_request) {  // File ▸ Export, outside the frame (the PNG has its own context)
            const ui::ViewerState::ExportRequest req = *state.export_request;
            state.export_request.reset();
            const std::string error = render::export_document(*doc, req.path, req.svg, options.threads);
            state.editor.status = error.empty() ? "exported " + req.path : error;
            platform.frames_due = kSettleFrames;
        }
    }
    save_settings();
    glDeleteTextures(1, &texture);
    ImGui::DestroyContext();
    glfwSetWindowUserPointer(window, nullptr);
    glfwDestroyWindow(window);
    glfwTerminate();
    return 0;
}

}  // namespace rv::window
