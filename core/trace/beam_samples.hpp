#pragma once
// Material samples at one beam's wavelength, kept by the trace cache so that a repeated trace
// samples no dispersion formula: a slab's phase and absolute group index, a crystal's principal
// indices, a lens glass at the beam's and the design wavelength. Each is tagged with what it was
// taken of (the material, and for lenses the model kind, for crystals the principal plane), so
// a changed glass is sampled again.

#include <array>
#include <limits>
#include <optional>
#include <vector>

#include "materials/material.hpp"
#include "nonlinear/phase_matching.hpp"
#include "trace/ray_state.hpp"

namespace rv {

struct LensGlass {
    double design_wavelength_nm = 0;
    double index = 1, design_index = 1, group_index = 1;  // absolute group index
    double gvd_fs2_per_mm = 0, tod_fs3_per_mm = 0;         // absolute (thick singlets)
    // A thick singlet's effective focal length at `index`, and the radii and centre thickness
    // it was computed for (NaN: none yet).
    std::array<double, 3> efl_shape{std::numeric_limits<double>::quiet_NaN(), 0, 0};
    double efl_mm = 0;
};

template <class T>
struct TaggedSample {
    const Material* material = nullptr;
    int variant = 0;
    std::optional<T> value;
    // The sample when it was taken of the same material and variant, else a fresh one.
    template <class Make>
    T& get(const Material* m, int v, Make make) {
        if (!value || material != m || variant != v) {
            material = m;
            variant = v;
            value = make();
        }
        return *value;
    }
};

struct BeamSamples {
    std::vector<TaggedSample<Medium>> slab;             // isotropic slabs, dichroic substrates
    std::vector<TaggedSample<CrystalIndices>> crystal;  // birefringent crystals
    std::vector<TaggedSample<LensGlass>> lens;          // chromatic and thick lenses
    void resize(size_t elements) {
        slab.resize(elements);
        crystal.resize(elements);
        lens.resize(elements);
    }
};

}  // namespace rv
