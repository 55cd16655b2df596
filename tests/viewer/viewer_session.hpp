#pragma once
// The headless interface-test harness of the viewer (tests/viewer/editor_test.cpp,
// files_test.cpp): the document frame fed mouse and key input frame by frame, as a user would,
// with no display.
#include <imgui.h>

#include <catch2/catch.hpp>
#include <algorithm>
#include <map>
#include <string>

#include "edit/document.hpp"
#include "render/headless.hpp"
#include "trace/poses.hpp"
#include "ui/frame.hpp"

namespace rv::test {

inline size_t index_of(const rv::Layout& l, const std::string& id) {
    for (size_t i = 0; i < l.elements.size(); ++i)
        if (l.elements[i].id == id) return i;
    FAIL("no element " << id);
    return 0;
}

// A headless ImGui context running the document frame (1600 × 1000 unless told).
class Session {
public:
    explicit Session(rv::edit::Document& doc, ImVec2 display = ImVec2(1600, 1000)) {
        previous_ = ImGui::GetCurrentContext();
        context_ = ImGui::CreateContext();
        ImGui::SetCurrentContext(context_);
        rv::render::configure_context(font_);
        ImGuiIO& io = ImGui::GetIO();
        io.DisplaySize = display;
        io.DeltaTime = 1.0f / 60.0f;
        state.doc = &doc;
        for (int i = 0; i < 3; ++i) frame();  // windows are sized in the first frames
    }
    ~Session() {
        ImGui::DestroyContext(context_);
        ImGui::SetCurrentContext(previous_);
    }
    void frame() {
        ImGui::NewFrame();
        rv::ui::draw_document_frame(state);
        ImGui::Render();
    }
    // A few frames: a popup appears, sizes itself and takes the keyboard focus over them.
    void settle() {
        for (int k = 0; k < 4; ++k) frame();
    }
    ImVec2 screen_of(const std::string& id) {
        const rv::edit::Document& doc = *state.doc;
        std::vector<rv::Path> paths;
        for (const rv::ReportBeam& b : doc.report().beams) paths.push_back(b.path);
        return state.last_view.to_screen(rv::element_poses(doc.layout(), paths)[index_of(doc.layout(), id)].at_mm);
    }
    void mouse(ImVec2 at, bool down) {
        ImGuiIO& io = ImGui::GetIO();
        io.MousePos = at;
        io.MouseDown[0] = down;
        frame();
    }
    // Press at `from`, move to `to` in a few steps, release there.
    void drag(ImVec2 from, ImVec2 to, bool escape_before_release = false) {
        mouse(from, false);
        mouse(from, true);
        for (int k = 1; k <= 4; ++k)
            mouse(ImVec2(from.x + (to.x - from.x) * k / 4, from.y + (to.y - from.y) * k / 4), true);
        if (escape_before_release) key(ImGui::GetKeyIndex(ImGuiKey_Escape));
        mouse(to, false);
    }
    void key(int index, bool ctrl = false, bool shift = false) {
        ImGuiIO& io = ImGui::GetIO();
        io.KeyCtrl = ctrl;
        io.KeyShift = shift;
        io.KeysDown[index] = true;
        frame();
        io.KeysDown[index] = false;
        io.KeyCtrl = io.KeyShift = false;
        frame();
    }
    // A click inside an inspector field's box (its rectangle from the last frame spans the box,
    // which starts at the left, and the label after it: the middle may fall on the label).
    void click_field(const std::string& key) {
        REQUIRE(state.inspector.field_rects.count(key) == 1);
        const rv::ui::FieldRect r = state.inspector.field_rects[key];
        const ImVec2 centre(std::min(r.min.x + 20, (r.min.x + r.max.x) / 2), (r.min.y + r.max.y) / 2);
        mouse(centre, true);
        mouse(centre, false);
    }
    // The same inside any panel's rectangles (the Goals panel's, …), by its key.
    void click_field_of(const std::map<std::string, rv::ui::FieldRect>& rects, const std::string& key) {
        REQUIRE(rects.count(key) == 1);
        const rv::ui::FieldRect r = rects.at(key);
        const ImVec2 centre(std::min(r.min.x + 20, (r.min.x + r.max.x) / 2), (r.min.y + r.max.y) / 2);
        mouse(centre, true);
        mouse(centre, false);
    }
    void type(const std::string& text) {
        for (char c : text) {
            ImGui::GetIO().AddInputCharacter(static_cast<unsigned>(c));
            frame();
        }
    }
    rv::ui::ViewerState state;

private:
    ImGuiContext* previous_ = nullptr;
    ImGuiContext* context_ = nullptr;
    rv::render::Texture font_;
};

}  // namespace rv::test
