#pragma once
// Power and polarization of a beam along its traced path (polarization/polarization_model.hpp
// for the elements), as fractions of the source power: after every hit, what each loss took and
// where it went, and the state at the target. Losses: power cut off at an aperture (the
// clipping estimate of trace/propagate.hpp), coating losses (`transmission`), the blocked part at
// a polarizer, the part a polarizing cube reflects (that beam is traced onward from the cube to
// where it ends), and what a dump absorbs. What is left after the last hit goes where the path
// ends (it leaves the table). The fractions add up to 1.

#include <string>
#include <vector>

#include "layout/layout.hpp"
#include "materials/material_library.hpp"
#include "polarization/polarization_model.hpp"
#include "trace/path.hpp"
#include "trace/propagate.hpp"

namespace rv {

struct PowerLoss {
    std::string element;
    std::string what;     // "clipped at its aperture", "coating loss", "blocked by the polarizer", …
    double fraction = 0;  // of the source power
    std::string goes_to;  // cube reflections: where the reflected beam ends; "" otherwise
    bool leaves_table = false;  // a reflected beam that leaves the table (a stray beam)
    Vec2 exit_mm{0, 0};         // where it leaves the table
    std::vector<Vec2> branch_mm = {};  // cube reflections: the traced path of the reflected beam
};

struct WavePlatePass {
    size_t element = 0;
    std::string id;
    double retardance_waves = 0;  // at this beam's wavelength
    double fast_axis_deg = 0;
};

struct BeamPower {
    std::vector<double> fraction_after_hit;  // one per Path::hits entry
    std::vector<Stokes> stokes_after_hit;    // S0 = that fraction
    std::vector<PowerLoss> losses;
    std::vector<WavePlatePass> plates;       // wave plates met, in order
    bool reached = false;
    Stokes at_target = Stokes::Zero();       // arriving at the target plane
    double end_fraction = 0;                 // left after the last hit
};

BeamPower trace_power(const Layout& layout, const MaterialLibrary& library, const Path& path, const Caustic& caustic);

// The Stokes vector arriving at the target, without tracing where cube reflections go (the
// cheap part of trace_power, for choosing the crystal's index before the report's trace).
Stokes target_stokes(const Layout& layout, const MaterialLibrary& library, const Path& path, const Caustic& caustic);

// The Stokes vector at the target for a beam whose plate (element index) is turned to
// fast_axis_deg, all else as in the layout (for the wave-plate advice and the solver).
Stokes target_stokes_with_plate(const Layout& layout, const MaterialLibrary& library, const Path& path,
                                const Caustic& caustic, size_t plate, double fast_axis_deg);

}  // namespace rv
