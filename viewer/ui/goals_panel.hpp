#pragma once
// The Goals panel: the layout's goals as the file has them (goals.waist_um per beam,
// goals.solve with its aim, moves, swaps and constraints, goals.tolerance and the verdict
// thresholds of goals.verdict). Each change is one edit of the document, which the file
// format's reader validates (edit::Document::acceptable writes the layout and reads it back):
// a value the reader refuses is not applied and the panel shows the reader's whole message.
#include <map>
#include <string>

#include "edit/document.hpp"
#include "ui/inspector.hpp"

namespace rv::ui {

struct GoalsState {
    Goals scratch;         // what the fields edit (the document's goals while none is active)
    bool editing = false;  // a field is active
    std::string error;     // the reader's message for the last refused change ("" after one it took)
    std::string new_move;  // the element chosen for a new move
    std::map<std::string, FieldRect> field_rects;  // last frame's field rectangles, for interface tests
};

void draw_goals_panel(edit::Document& doc, GoalsState& state);

}  // namespace rv::ui
