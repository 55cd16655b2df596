#pragma once
// Readouts on the table view (issue 17 §5): hovering a beam shows its path length from the
// start, both radii and the arrival time there; hovering an optic shows its summary; the ruler
// also measures along a beam when both its ends lie on the same beam's chief ray. What is read
// comes from scene/beam_probe (no UI there, unit-tested); this file only draws it.
#include <imgui.h>

#include "edit/document.hpp"
#include "ui/editor.hpp"
#include "ui/view.hpp"

namespace rv::ui {

// How near the cursor must be to a beam's chief ray, in screen pixels.
inline constexpr double kBeamPickPx = 6.0;

// The tooltip for what is under the cursor (none while dragging or measuring).
void draw_hover_readout(ImDrawList* draw, const edit::Document& doc, const EditorState& editor, const View& view,
                        const std::optional<Vec2>& cursor_mm);

// The ruler: the straight distance and angle, and, when both ends lie within 8 px of one beam,
// that beam's path between them highlighted with its length along the beam.
void draw_ruler_along_beams(ImDrawList* draw, const edit::Document& doc, const EditorState::Ruler& ruler,
                            const View& view);

}  // namespace rv::ui
