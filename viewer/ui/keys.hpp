#pragma once
// Key indices as the viewer reads them from ImGuiIO::KeysDown: GLFW's key codes, which the
// GLFW backend of Dear ImGui 1.86 uses as indices (letters are their upper-case ASCII codes).
// The headless frame maps ImGuiKey_Delete and ImGuiKey_Escape to the same codes, so interface
// tests press the keys a user would.
namespace rv::ui::keys {
inline constexpr int kEscape = 256, kDelete = 261;
inline constexpr int kD = 'D', kF = 'F', kG = 'G', kM = 'M', kR = 'R', kS = 'S', kY = 'Y', kZ = 'Z';
}  // namespace rv::ui::keys
