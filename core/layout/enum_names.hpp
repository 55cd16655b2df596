#pragma once
// One table per enum (or two-valued choice) that the layout file spells as text: the value and
// its file text, in the order layouts/schema.json lists them. The reader parses with them (and
// names them in its "expected one of …"), the writer writes with them, the inspector labels its
// choices with them, and tests/layout/enum_names_test.cpp checks each table against the
// schema's enum. A crystal's process has its own parse/format pair (layout/process_text.hpp).

#include <array>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "layout/layout.hpp"

namespace rv {

template <class Value>
struct NamedValue {
    Value value;
    std::string_view text;
};

inline constexpr std::array<NamedValue<Polarization::Kind>, 5> kPolarizationNames{{
    {Polarization::Kind::Horizontal, "horizontal"},
    {Polarization::Kind::Vertical, "vertical"},
    {Polarization::Kind::Linear, "linear"},
    {Polarization::Kind::CircularLeft, "circular-left"},
    {Polarization::Kind::CircularRight, "circular-right"},
}};

inline constexpr std::array<NamedValue<Plate::Role>, 5> kPlateRoleNames{{
    {Plate::Role::Window, "window"},
    {Plate::Role::HalfWave, "half-wave"},
    {Plate::Role::QuarterWave, "quarter-wave"},
    {Plate::Role::PolarizingCube, "polarizing-cube"},
    {Plate::Role::Polarizer, "polarizer"},
}};

inline constexpr std::array<NamedValue<Crystal::PhaseMatching>, 2> kPhaseMatchingNames{{
    {Crystal::PhaseMatching::TypeI, "type-I"},
    {Crystal::PhaseMatching::TypeII, "type-II"},
}};

inline constexpr std::array<NamedValue<PrincipalPlane>, 3> kPrincipalPlaneNames{{
    {PrincipalPlane::XY, "XY"},
    {PrincipalPlane::YZ, "YZ"},
    {PrincipalPlane::XZ, "XZ"},
}};

inline constexpr std::array<NamedValue<SolveGoals::Aim>, 3> kSolveAimNames{{
    {SolveGoals::Aim::Waist, "waist"},
    {SolveGoals::Aim::EqualConfocal, "equal-confocal"},
    {SolveGoals::Aim::Focus, "focus"},
}};

// Two-valued choices kept as bools in the layout.
inline constexpr std::array<NamedValue<bool>, 2> kOpticAxisNames{{  // Crystal::optic_axis_horizontal
    {true, "horizontal"},
    {false, "vertical"},
}};
inline constexpr std::array<NamedValue<bool>, 2> kDichroicReflectsNames{{  // Dichroic::reflects_shorter
    {true, "shorter"},
    {false, "longer"},
}};
inline constexpr std::array<NamedValue<bool>, 2> kCubeReflectsNames{{  // Plate::reflects_left
    {true, "left"},
    {false, "right"},
}};

// An enum's tables list every enumerator once, in the enum's order (so a new enumerator without
// its text fails here): checked at compile time for the enums above.
template <class Value, size_t N>
constexpr bool lists_every_enumerator(const std::array<NamedValue<Value>, N>& table, Value last) {
    if (static_cast<size_t>(last) + 1 != N) return false;
    for (size_t i = 0; i < N; ++i)
        if (static_cast<size_t>(table[i].value) != i) return false;
    return true;
}
static_assert(lists_every_enumerator(kPolarizationNames, Polarization::Kind::CircularRight));
static_assert(lists_every_enumerator(kPlateRoleNames, Plate::Role::Polarizer));
static_assert(lists_every_enumerator(kPhaseMatchingNames, Crystal::PhaseMatching::TypeII));
static_assert(lists_every_enumerator(kPrincipalPlaneNames, PrincipalPlane::XZ));
static_assert(lists_every_enumerator(kSolveAimNames, SolveGoals::Aim::Focus));

// The text of a value (every value is in its table).
template <class Value, size_t N>
constexpr std::string_view text_of(const std::array<NamedValue<Value>, N>& table, Value v) {
    for (const NamedValue<Value>& n : table)
        if (n.value == v) return n.text;
    return table[0].text;  // not reached for the tables above (each lists every value)
}

// The value a text names; nullopt for a text no entry has.
template <class Value, size_t N>
std::optional<Value> value_named(const std::array<NamedValue<Value>, N>& table, std::string_view text) {
    for (const NamedValue<Value>& n : table)
        if (n.text == text) return n.value;
    return std::nullopt;
}

// The texts in order (for FieldReader::choice, which names them when a text is none of them).
template <class Value, size_t N>
std::vector<std::string> texts_of(const std::array<NamedValue<Value>, N>& table) {
    std::vector<std::string> out;
    for (const NamedValue<Value>& n : table) out.emplace_back(n.text);
    return out;
}

// The position of a value in its table (for a list box's index).
template <class Value, size_t N>
constexpr size_t position_in(const std::array<NamedValue<Value>, N>& table, Value v) {
    for (size_t i = 0; i < N; ++i)
        if (table[i].value == v) return i;
    return 0;
}

}  // namespace rv
