#pragma once
// The parts list of a layout: what to take from the shelf. Every element is a physical part
// (a lens, mirror, dichroic, plate, crystal or retroreflector in its mount, a translation
// stage, a beam dump, a target's mount). Parts whose specification is the same are one group
// with a count.
//
// A specification holds what a part IS, never how it is set up: no position, angle, fast-axis
// or polarizer setting, aim, stage reading or carried optics. It is built from the element's
// own fields (type, focal length or radii, diameter, glass or material, thickness, …) in the
// file's units, and names the catalog id where the file gives one (a lens's `part`): two lenses
// of the same numbers but different ids are different parts.

#include <optional>
#include <string>
#include <vector>

#include "layout/layout.hpp"

namespace rv {

// One property of a part: a number with its unit ("mm", "nm", "deg", "" for a plain number)
// or a word (a glass, "flat", "shorter").
struct SpecField {
    std::string name;              // e.g. "focal_length", "diameter", "glass"
    std::optional<double> number;  // set for a numeric property
    std::string unit;              // of the number
    std::string text;              // set for a word
    bool operator==(const SpecField&) const = default;
};

struct PartSpec {
    std::string kind;  // e.g. "thin lens", "flat mirror", "half-wave plate", "translation stage"
    std::optional<std::string> part;  // the catalog id (a lens's `part`), absent when the file gives none
    std::vector<SpecField> fields;
    bool operator==(const PartSpec&) const = default;
};

PartSpec part_spec(const Element& element);

struct PartGroup {
    PartSpec spec;
    std::vector<size_t> elements;  // indices into Layout::elements, in file order
};

// The groups in the order their first element appears in the file.
std::vector<PartGroup> group_parts(const Layout& layout);

}  // namespace rv
