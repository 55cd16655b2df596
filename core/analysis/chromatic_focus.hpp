#pragma once
// Two (or more) colours focused by one shared singlet: the focal length each colour sees, where
// each waist forms and how large it is, and how far apart the foci are compared with their
// depth of focus. Round beams in air; both planes agree, so one plane is propagated.
//
// Model: each beam's waist sits a distance before the lens's front vertex; q is carried
// through free space and the thick singlet's matrix at that colour's index (thick_lens.hpp),
// and the new waist is read off after the back vertex. Lengths in mm, radii in µm.

#include <string>
#include <vector>

#include "materials/material_library.hpp"
#include "optics/thick_lens.hpp"

namespace rv {

struct FocusBeam {
    std::string id;
    double wavelength_nm;
    double waist_um;               // input second-moment waist radius
    double waist_before_lens_mm;   // distance from the input waist to the front vertex
    double m2 = 1.0;
};

struct SharedSinglet {
    std::string id;
    std::string glass;  // a MaterialLibrary name
    ThickSinglet shape;
};

struct ChromaticFocusCase {
    std::string name;
    SharedSinglet lens;
    std::vector<FocusBeam> beams;
};

struct BeamFocus {
    std::string id;
    double wavelength_nm;
    double glass_index;
    bool glass_in_valid_range;
    double effective_focal_length_mm;
    double back_focal_distance_mm;
    double waist_um;                 // output waist radius
    double waist_after_lens_mm;      // from the back vertex, + = downstream
    double rayleigh_range_mm;
    double radius_at_lens_um;        // beam radius at the front vertex
};

struct ChromaticFocusSummary {
    std::vector<BeamFocus> beams;
    // Between the first two beams (0 when there is only one):
    double focal_shift_mm = 0.0;           // waist position of beam 1 minus beam 0
    double shift_over_rayleigh = 0.0;      // |shift| / the shorter Rayleigh range
    double waist_ratio = 1.0;              // waist of beam 1 / waist of beam 0
};

// Throws std::invalid_argument when the lens glass is not in the library.
ChromaticFocusSummary summarize_chromatic_focus(const ChromaticFocusCase& c,
                                                const MaterialLibrary& library);

}  // namespace rv
