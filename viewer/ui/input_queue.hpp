#pragma once
// The window's input between frames, fed to Dear ImGui in order.
//
// Dear ImGui 1.86 reads input as state once per frame (io.KeysDown[], io.MouseDown[],
// io.MousePos): a key pressed and released between two frames would be seen as never pressed.
// The platform's callbacks therefore only queue events; before each frame apply_frame() moves
// the events due into ImGuiIO, in the order they happened, and stops at the first event that
// would be a second transition of a key or mouse button already changed in this frame (that
// event and every later one wait for the next frame, so nothing is reordered). A cursor move
// after a button transition also waits, so a press is seen where it happened; a button after a
// cursor move waits, so a drag's moves are seen with the button down; and a modifier
// (Ctrl, Shift, Alt, Super) changing after another key waits, so that key is seen with the
// modifiers it was pressed with. No GLFW here: the
// interface tests feed the same queue the window does.
#include <cstddef>
#include <deque>

struct ImGuiIO;

namespace rv::ui {

struct InputEvent {
    enum class Kind { Key, Char, MouseButton, CursorPos, Scroll, Focus };
    Kind kind = Kind::Key;
    int code = 0;        // Key: key index (ui/keys.hpp); MouseButton: 0–4; Char: the code point
    bool down = false;   // Key / MouseButton: pressed; Focus: gained
    float x = 0, y = 0;  // CursorPos: window pixels; Scroll: the wheel's offsets (steps)

    static InputEvent key(int code, bool down) { return {Kind::Key, code, down, 0, 0}; }
    static InputEvent button(int button, bool down) { return {Kind::MouseButton, button, down, 0, 0}; }
    static InputEvent character(unsigned code) { return {Kind::Char, static_cast<int>(code), false, 0, 0}; }
    static InputEvent cursor(float x_px, float y_px) { return {Kind::CursorPos, 0, false, x_px, y_px}; }
    static InputEvent scroll(float x_steps, float y_steps) { return {Kind::Scroll, 0, false, x_steps, y_steps}; }
    static InputEvent focus(bool gained) { return {Kind::Focus, 0, gained, 0, 0}; }
};

class InputQueue {
public:
    void push(const InputEvent& e) { events_.push_back(e); }
    bool empty() const { return events_.empty(); }
    size_t size() const { return events_.size(); }
    // Applies this frame's events to io (call before ImGui::NewFrame); the modifier flags
    // (KeyCtrl, KeyShift, KeyAlt, KeySuper) follow the modifier keys. Returns how many were applied.
    size_t apply_frame(ImGuiIO& io);

private:
    std::deque<InputEvent> events_;
};

}  // namespace rv::ui
