#pragma once
// Solutions that differ only by a lens's diameter are one solution: the same stock focal
// lengths in the same places, bought in one size or another. A catalog usually holds each focal
// length in several diameters (12.7, 25.4, 50.8 mm); the solver solves each as its own choice
// (a singlet's centre thickness follows its diameter, so the moves differ a little), and without
// this the best few solutions would be one design in three sizes.
//
// Same family: for every swapped lens, the same kind of catalog lens (ideal thin, or a singlet of
// the same glass and shape), the same focal length and design wavelength; the diameter and the
// centre thickness may differ. Of each family, the member kept is the one with
//   1. the fewest swapped lenses that clip above the warning level,
//   2. (when every member clips somewhere) the least power lost at those lenses, to 0.1 %,
//   3. the smallest sum of the swapped lenses' diameters,
//   4. the better rank;
// i.e. the smallest diameter that passes the beam without clipping. Whether a lens clips is the
// report's own clipping finding (Finding::Kind::Clipping at that lens, found by the
// propagation's aperture check above PropagationOptions::clipping_warning_fraction, as
// build_report gathers it from the same trace and propagation), never a second copy of the
// test. The others are named beside it (TelescopeSolution::also).

#include <functional>
#include <vector>

#include "io/lens_catalog.hpp"
#include "materials/material_library.hpp"
#include "solve/telescope.hpp"

namespace rv {

struct SolvedChoice {
    std::vector<const CatalogLens*>
        choice;  // one catalog lens per swapped lens (goals.solve.swap order)
    TelescopeSolution solution;
};

// Whether two choices differ only by their lenses' diameters (and what follows from them).
bool same_but_diameter(const std::vector<const CatalogLens*>& a,
                       const std::vector<const CatalogLens*>& b);

// `ranked` best first (by `ranks_before`); the first `keep` families, each as its kept member with
// `also` and `clipped_fraction` filled, best first again. `swapped_ids`: the swapped lenses'
// element ids, in the order of each choice.
std::vector<SolvedChoice> collapse_diameters(
    std::vector<SolvedChoice> ranked, size_t keep, const std::vector<std::string>& swapped_ids,
    const MaterialLibrary& library,
    const std::function<bool(const TelescopeSolution&, const TelescopeSolution&)>& ranks_before);

}  // namespace rv
