// All GL code of the program is in this file.
#include "window/window.hpp"

#include <GLFW/glfw3.h>
#include <backends/imgui_impl_glfw.h>
#include <imgui.h>

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
#include "ui/frame.hpp"

namespace rv::window {

int run_window(const Layout& layout, const std::optional<std::filesystem::path>& path, const WindowOptions& options,
               std::ostream& err) {
    auto doc = std::make_unique<edit::Document>(layout, path);
    const std::string title = doc->title();
    if (!glfwInit()) {
        err << "rendezvous: error: cannot open a window (no display?); use `rendezvous render` for files\n";
        return 2;
    }
    glfwWindowHint(GLFW_CONTEXT_VERSION_MAJOR, 2);
    glfwWindowHint(GLFW_CONTEXT_VERSION_MINOR, 1);
    GLFWwindow* window = glfwCreateWindow(options.width, options.height, ("Rendezvous — " + title).c_str(), nullptr, nullptr);
    if (!window) {
        glfwTerminate();
        err << "rendezvous: error: cannot create a window with an OpenGL 2.1 context\n";
        return 2;
    }
    glfwMakeContextCurrent(window);
    glfwSwapInterval(1);

    ui::ViewerState state;
    state.doc = doc.get();
    state.tools.catalog = parse_lens_catalog(cli::lens_catalog_text(), material_library_for(layout)).lenses;
    const std::filesystem::path recent_file = edit::recent_files_path();
    state.recent = edit::load_recent(recent_file);
    if (path) {
        state.recent = edit::with_recent(state.recent, path->string());
        edit::save_recent(recent_file, state.recent);
    }
    if (std::filesystem::exists(doc->recovery_path())) state.recovery_offer = doc->recovery_path().string();
    double last_autosave_s = glfwGetTime();

    IMGUI_CHECKVERSION();
    ImGui::CreateContext();
    // Dear ImGui's own window settings live with the user's configuration, never in the folder
    // the program was started from; ImGui opens no file (IniFilename null): the program reads
    // the text and writes it through write_file_safely when ImGui asks (edit/window_settings.hpp).
    const std::filesystem::path settings_file = edit::window_settings_path();
    ImGui::GetIO().IniFilename = nullptr;
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
    render::configure_context(font);
    ImGui_ImplGlfw_InitForOther(window, true);

    GLuint texture = 0;
    glGenTextures(1, &texture);
    int tex_w = 0, tex_h = 0;
    for (int frame = 0; !state.quit; ++frame) {
        if (options.quit_after_frames > 0 && frame >= options.quit_after_frames) break;
        glfwPollEvents();
        if (glfwWindowShouldClose(window)) {  // the close box: ask first when there are unsaved changes
            glfwSetWindowShouldClose(window, GLFW_FALSE);
            if (doc->dirty()) state.close_requested = true;
            else break;
        }
        if (glfwGetTime() - last_autosave_s > 30.0) {
            std::string error;
            if (!doc->autosave(error)) state.editor.status = error;
            last_autosave_s = glfwGetTime();
        }
        if (state.open_request) {  // File ▸ Open or a recent file
            const std::string file = *state.open_request;
            state.open_request.reset();
            const LayoutReadResult r = read_layout_file(file);
            if (doc->dirty()) {
                state.editor.status = "unsaved changes: save or undo them before opening another layout";
            } else if (!r.layout) {
                state.editor.status = r.diagnostics.empty() ? "cannot read " + file : format_diagnostic(r.diagnostics.front(), file);
            } else {
                doc = std::make_unique<edit::Document>(*r.layout, std::filesystem::path(file));
                state.doc = doc.get();
                state.editor = {};
                state.inspector = {};
                state.tools.solve = {};
                state.tools.previewing.reset();
                state.tools.tolerance.reset();
                state.view.reset();
                state.recent = edit::with_recent(state.recent, file);
                edit::save_recent(recent_file, state.recent);
                glfwSetWindowTitle(window, ("Rendezvous — " + doc->title()).c_str());
                if (std::filesystem::exists(doc->recovery_path())) state.recovery_offer = doc->recovery_path().string();
            }
        }
        ImGui_ImplGlfw_NewFrame();
        ImGui::NewFrame();
        ui::draw_document_frame(state);
        ImGui::Render();
        if (ImGui::GetIO().WantSaveIniSettings) save_settings();  // set by ImGui a few seconds after a change
        int fw = 0, fh = 0;
        glfwGetFramebufferSize(window, &fw, &fh);
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
        }
    }
    save_settings();
    glDeleteTextures(1, &texture);
    ImGui_ImplGlfw_Shutdown();
    ImGui::DestroyContext();
    glfwDestroyWindow(window);
    glfwTerminate();
    return 0;
}

}  // namespace rv::window
