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

}  // namespace

size_t InputQueue::apply_frame(ImGuiIO& io) {
    std::bitset<kKeyCount> keys_changed;
    std::bitset<kButtonCount> buttons_changed;
    size_t applied = 0;
    while (!events_.empty()) {
        const InputEvent& e = events_.front();
        bool wait = false;
        switch (e.kind) {
        case InputEvent::Kind::Key:
            if (e.code < 0 || e.code >= kKeyCount) break;  // a key ImGui has no index for: dropped
            if (io.KeysDown[e.code] == e.down) break;      // no transition (a repeated press)
            if (keys_changed[e.code]) wait = true;
            else keys_changed[e.code] = true, io.KeysDown[e.code] = e.down;
            break;
        case InputEvent::Kind::MouseButton:
            if (e.code < 0 || e.code >= kButtonCount || io.MouseDown[e.code] == e.down) break;
            if (buttons_changed[e.code]) wait = true;
            else buttons_changed[e.code] = true, io.MouseDown[e.code] = e.down;
            break;
        case InputEvent::Kind::CursorPos:
            if (buttons_changed.any()) wait = true;  // the press (or release) is seen where it happened
            else io.MousePos = ImVec2(e.x, e.y);
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
