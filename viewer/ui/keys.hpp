#pragma once
// Key indices as the viewer reads them from ImGuiIO::KeysDown: GLFW's key codes (letters are
// their upper-case ASCII codes), which the window's input queue (ui/input_queue.hpp) writes
// and configure_context's KeyMap names for ImGui. The headless frame uses the same indices, so
// interface tests press the keys a user would.
namespace rv::ui::keys {
inline constexpr int kTab = 258, kEscape = 256, kDelete = 261, kF1 = 290;
inline constexpr int kA = 'A', kO = 'O';
inline constexpr int kD = 'D', kF = 'F', kG = 'G', kM = 'M', kQ = 'Q', kR = 'R', kS = 'S', kY = 'Y', kZ = 'Z';
inline constexpr int kLeftShift = 340, kLeftControl = 341, kLeftAlt = 342, kLeftSuper = 343;
inline constexpr int kRightShift = 344, kRightControl = 345, kRightAlt = 346, kRightSuper = 347;
}  // namespace rv::ui::keys
