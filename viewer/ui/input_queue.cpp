#include "ui/input_queue.hpp"

#include <imgui.h>

#include <bitset>
#include <iterator>

#include "ui/keys.hpp"

namespace rv::ui {

namespace {

constexpr int kKeyCount = static_cast<int>(sizeof(ImGuiIO::KeysDown) / sizeof(bool));
constexpr int kButtonCount = static_cast<int>(sizeof(ImGuiIO::MouseDown) / sizeof(bool));

bool down(const ImGuiIO& io, int key) { return key >= 0 && key < kKeyCount && io.KeysDown[key]; }

bool is_modifier(int key) {
    return key == keys::kLeftControl || key == keys::kRightControl || key == keys::kLeftShift || key == keys::kRightShift ||
           key == keys::kLeftAlt || key == keys::kRightAlt || key == keys::kLeftSuper || key == keys::kRightSuper;
}

}  // namespace

size_t InputQueue::apply_frame(ImGuiIO& io) {
    std::bitset<kKeyCount> keys_changed;
    std::bitset<kButtonCount> buttons_changed;
    bool other_key_changed = false;  // a key that is no modifier, in this frame
    bool cursor_moved = false;
    size_t applied = 0;
    while (!events_.empty()) {
        const InputEvent& e = events_.front();
        bool wait = false;
        switch (e.kind) {
        case InputEvent::Kind::Key:
            if (e.code < 0 || e.code >= kKeyCount) break;  // a key ImGui has no index for: dropped
            if (io.KeysDown[e.code] == e.down) break;      // no transition (a repeated press)
            // The modifier flags hold for the whole frame: a modifier changing after another key
            // did (Ctrl released after the A of Ctrl+A) waits, or A would be seen without Ctrl.
            if (keys_changed[e.code] || (is_modifier(e.code) && other_key_changed)) wait = true;
            else keys_changed[e.code] = true, io.KeysDown[e.code] = e.down, other_key_changed |= !is_modifier(e.code);
            break;
        case InputEvent::Kind::MouseButton:
            if (e.code < 0 || e.code >= kButtonCount || io.MouseDown[e.code] == e.down) break;
            // After a move in this frame a button waits: a quick drag's release would otherwise
            // share the frame of its last move, and the drag would end where it began.
            if (buttons_changed[e.code] || cursor_moved) wait = true;
            else buttons_changed[e.code] = true, io.MouseDown[e.code] = e.down;
            break;
        case InputEvent::Kind::CursorPos:
            if (buttons_changed.any()) wait = true;  // the press (or release) is seen where it happened
            else io.MousePos = ImVec2(e.x, e.y), cursor_moved = true;
            break;
        case InputEvent::Kind::Scroll:
            io.MouseWheelH += e.x;
            io.MouseWheel += e.y;
            break;
        case InputEvent::Kind::Char:
            io.AddInputCharacter(static_cast<unsigned>(e.code));
            break;
        case InputEvent::Kind::Focus:
            io.AddFocusEvent(e.down);
            break;
        }
        if (wait) break;
        events_.pop_front();
        ++applied;
    }
    io.KeyCtrl = down(io, keys::kLeftControl) || down(io, keys::kRightControl);
    io.KeyShift = down(io, keys::kLeftShift) || down(io, keys::kRightShift);
    io.KeyAlt = down(io, keys::kLeftAlt) || down(io, keys::kRightAlt);
    io.KeySuper = down(io, keys::kLeftSuper) || down(io, keys::kRightSuper);
    return applied;
}

}  // namespace rv::ui
