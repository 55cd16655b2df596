#pragma once
// The viewer's keyboard shortcuts and mouse gestures: one table. The frame dispatches keys from
// it (pressed_action), the menus show their keys from it and the help window (F1) lists it, so
// what is listed is what is done.
#include <optional>
#include <span>
#include <string>

struct ImGuiIO;

namespace rv::ui {

// What a shortcut does; the frame performs it (frame.cpp, a switch over every value).
enum class Action {
    Undo,
    Redo,
    Duplicate,
    Save,
    Quit,
    RotateForward,
    RotateBack,
    ToggleMeasure,
    ToggleSnap,
    Delete,
    Escape,
    FitView,
    SelectNext,
    SelectPrevious,
    Open,
    SaveAs,
    AddHere,
    Help,
};
inline constexpr int kActionCount = static_cast<int>(Action::Help) + 1;

struct Shortcut {
    int key;  // ui/keys.hpp
    bool ctrl, shift;
    Action action;
    const char* description;
    bool edits;  // changes the layout: refused while a solver's solution is previewed
};

std::span<const Shortcut> shortcuts();

// "Ctrl+Shift+Z", "Delete", "F1".
std::string key_name(int key);
std::string keys_text(const Shortcut& s);
// Every key of an action, for a menu item: "Ctrl+Shift+Z / Ctrl+Y".
std::string keys_of(Action action);

// The shortcut pressed in this frame (its key went down with exactly its Ctrl and Shift), if
// any; none while a text field takes the keyboard.
std::optional<Action> pressed_action(const ImGuiIO& io);

struct MouseGesture {
    const char* gesture;
    const char* description;
};
std::span<const MouseGesture> mouse_gestures();

}  // namespace rv::ui
