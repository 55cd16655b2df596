#include "ui/shortcuts.hpp"

#include <imgui.h>

#include <array>

#include "ui/keys.hpp"

namespace rv::ui {

namespace {

constexpr std::array kShortcuts{
    Shortcut{keys::kZ, true, false, Action::Undo, "undo the last change", true},
    Shortcut{keys::kZ, true, true, Action::Redo, "redo", true},
    Shortcut{keys::kY, true, false, Action::Redo, "redo", true},
    Shortcut{keys::kD, true, false, Action::Duplicate, "duplicate the selected optic one hole up and right", true},
    Shortcut{keys::kS, true, false, Action::Save, "save to the layout's file", true},
    Shortcut{keys::kQ, true, false, Action::Quit, "quit (asks first when there are unsaved changes)", false},
    Shortcut{keys::kR, false, false, Action::RotateForward, "turn the selected optic by +15° (counter-clockwise)", true},
    Shortcut{keys::kR, false, true, Action::RotateBack, "turn the selected optic by −15° (clockwise)", true},
    Shortcut{keys::kM, false, false, Action::ToggleMeasure, "measuring tool on or off (drag on the table to measure)", false},
    Shortcut{keys::kG, false, false, Action::ToggleSnap, "snapping to the breadboard holes on or off", false},
    Shortcut{keys::kDelete, false, false, Action::Delete, "delete the selected optic", true},
    Shortcut{keys::kEscape, false, false, Action::Escape,
             "cancel a move in progress; otherwise clear the selection and the ruler", false},
    Shortcut{keys::kF, false, false, Action::FitView, "fit the whole table in the view", false},
    Shortcut{keys::kTab, false, false, Action::SelectNext, "select the next optic (in the file's order)", false},
    Shortcut{keys::kTab, false, true, Action::SelectPrevious, "select the previous optic", false},
    Shortcut{keys::kO, true, false, Action::Open, "open a layout file (the file dialog)", true},
    Shortcut{keys::kS, true, true, Action::SaveAs, "save to another file (the file dialog)", true},
    Shortcut{keys::kA, false, true, Action::AddHere, "add an optic or a beam at the cursor (a menu there)", true},
    Shortcut{keys::kF1, false, false, Action::Help, "show or hide this list of shortcuts", false},
};

constexpr std::array kGestures{
    MouseGesture{"click an optic", "select it (the inspector shows its fields)"},
    MouseGesture{"drag an optic", "move it, snapped to the nearest hole while snapping is on"},
    MouseGesture{"Alt + drag an optic", "move it freely (no snapping)"},
    MouseGesture{"drag the empty table", "pan the view (left or right button)"},
    MouseGesture{"wheel", "zoom about the cursor"},
    MouseGesture{"double-click the empty table", "fit the whole table in the view"},
    MouseGesture{"drag while measuring (M)", "measure from the press to the release; ends snap to an optic within 8 px"},
    MouseGesture{"click a finding in the report", "select the element it names"},
};

}  // namespace

std::span<const Shortcut> shortcuts() { return kShortcuts; }
std::span<const MouseGesture> mouse_gestures() { return kGestures; }

std::string key_name(int key) {
    switch (key) {
    case keys::kTab: return "Tab";
    case keys::kEscape: return "Esc";
    case keys::kDelete: return "Delete";
    case keys::kF1: return "F1";
    default: break;
    }
    if (key >= 'A' && key <= 'Z') return std::string(1, static_cast<char>(key));
    return "key " + std::to_string(key);
}

std::string keys_text(const Shortcut& s) {
    return std::string(s.ctrl ? "Ctrl+" : "") + (s.shift ? "Shift+" : "") + key_name(s.key);
}

std::string keys_of(Action action) {
    std::string out;
    for (const Shortcut& s : kShortcuts)
        if (s.action == action) out += (out.empty() ? "" : " / ") + keys_text(s);
    return out;
}

std::optional<Action> pressed_action(const ImGuiIO& io) {
    if (io.WantTextInput) return std::nullopt;  // typing in a field is not a shortcut
    for (const Shortcut& s : kShortcuts)
        if (s.ctrl == io.KeyCtrl && s.shift == io.KeyShift && ImGui::IsKeyPressed(s.key, false)) return s.action;
    return std::nullopt;
}

}  // namespace rv::ui
