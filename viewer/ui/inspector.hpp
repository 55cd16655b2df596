#pragma once
// The inspector: every numeric field of the selected element with its unit. Editing a field
// re-traces live (a Document gesture); leaving the field (Enter, Tab or a click elsewhere)
// makes the edit one undo step.
#include <map>
#include <string>

#include <imgui.h>

#include "edit/document.hpp"
#include "ui/editor.hpp"

namespace rv::ui {

struct FieldRect {
    ImVec2 min, max;
};

struct InspectorState {
    Layout scratch;        // the layout the fields edit (the document's, while none is active)
    bool editing = false;  // a field is active: its gesture is open
    edit::Document::Gesture gesture = 0;
    std::string element;   // the id of the element or beam being edited
    bool editing_beam = false;  // `element` names a beam, not an element
    bool active_this_frame = false;
    std::map<std::string, FieldRect> field_rects;  // last frame's field rectangles, for interface tests
    std::map<std::string, std::string> text;       // text fields being typed in (material names)
    std::string process_error;  // why the last process button could not set the crystal
};

void draw_inspector(edit::Document& doc, EditorState& editor, InspectorState& state);

}  // namespace rv::ui
