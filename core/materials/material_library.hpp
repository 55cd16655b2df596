#pragma once
// The built-in dispersion library and lookup by the names layout files use.
//
// Names: a family name gives its default set ("BBO" → "BBO:Tamosauskas2018"); a specific set is
// "FAMILY:SET" ("BBO:Eimerl1987"). User-defined materials are added by id. The library is a
// value: adding a material returns a new library, the built-in one never changes.

#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "materials/material.hpp"

namespace rv {

class MaterialLibrary {
public:
    // The published sets listed in docs/file-format.md (Materials), each with its source.
    static const MaterialLibrary& builtin();

    // The material a file's name refers to, or nullptr.
    const Material* find(std::string_view name) const;

    // A copy of this library with one more material (its name must not be taken yet).
    MaterialLibrary with(Material material) const;

    // A copy of this library with the set `name` refers to taken to temperature_c
    // (materials/thermo_optic.hpp); unchanged when there is no such set or it has no
    // thermo-optic data.
    MaterialLibrary with_temperature(std::string_view name, double temperature_c) const;

    // Every name find() accepts (sets and family aliases), sorted, for messages.
    std::vector<std::string> names() const;

    const std::vector<Material>& materials() const { return data_->materials; }

    // Shared ownership of what find()'s pointers point into. A holder (the trace cache) keeps
    // them valid for as long as it holds this, and two libraries share it only when one is a
    // copy of the other: the same storage means the same materials.
    std::shared_ptr<const void> storage() const { return data_; }

private:
    struct Alias {
        std::string family, default_set;
    };
    struct Data {
        std::vector<Material> materials;
        std::vector<Alias> aliases;
    };
    std::shared_ptr<const Data> data_ = std::make_shared<const Data>();
};

// A user-defined isotropic material given in the SCHOTT Sellmeier form
// n² − 1 = Σ B_i λ²/(λ² − C_i), λ in µm, C_i in µm².
Material user_sellmeier_material(std::string id, std::vector<double> b,
                                 std::vector<double> c_um2, double min_wavelength_nm,
                                 double max_wavelength_nm, std::string source);

}  // namespace rv
