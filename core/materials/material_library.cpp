#include "materials/material_library.hpp"

#include <algorithm>
#include <cassert>

#include "materials/thermo_optic.hpp"

namespace rv {

namespace {

Material isotropic(std::string name, std::string family, std::string source,
                   DispersionFormula f, double min_nm, double max_nm, bool relative_to_air) {
    return {std::move(name), std::move(family), std::move(source), Symmetry::Isotropic,
            {std::move(f)}, min_nm, max_nm, relative_to_air, std::nullopt, std::nullopt};
}

Material uniaxial(std::string name, std::string source, DispersionFormula o, DispersionFormula e,
                  double min_nm, double max_nm) {
    std::string family = name.substr(0, name.find(':'));
    return {std::move(name), std::move(family), std::move(source), Symmetry::Uniaxial,
            {std::move(o), std::move(e)}, min_nm, max_nm, false, std::nullopt, std::nullopt};
}

std::vector<Material> published_sets() {
    std::vector<Material> m;
    // Glasses. Coefficients: SCHOTT optical glass data sheets, via the refractiveindex.info
    // database (CC0); λ in µm, index relative to air, 22 °C / 1013 mbar (SCHOTT "Optical Glass").
    m.push_back(isotropic("N-BK7", "N-BK7", "SCHOTT optical glass data sheet N-BK7",
                          sellmeier_squared_poles({1.03961212, 0.231792344, 1.01046945},
                                                  {0.00600069867, 0.0200179144, 103.560653}),
                          300, 2500, true));
    m.push_back(isotropic("N-SF11", "N-SF11", "SCHOTT optical glass data sheet N-SF11",
                          sellmeier_squared_poles({1.73759695, 0.313747346, 1.89878101},
                                                  {0.013188707, 0.0623068142, 155.23629}),
                          370, 2500, true));
    // I. H. Malitson, "Interspecimen comparison of the refractive index of fused silica",
    // JOSA 55, 1205 (1965); 20 °C. Prism data relative to air (from memory).
    m.push_back(isotropic("fused-silica", "fused-silica", "Malitson, JOSA 55, 1205 (1965)",
                          sellmeier_resonances({0.6961663, 0.4079426, 0.8974794},
                                               {0.0684043, 0.1162414, 9.896161}),
                          210, 3710, true));
    // I. H. Malitson, "A redetermination of some optical properties of calcium fluoride",
    // Appl. Opt. 2, 1103 (1963); 24 °C.
    m.push_back(isotropic("CaF2:Malitson1963", "CaF2", "Malitson, Appl. Opt. 2, 1103 (1963)",
                          sellmeier_resonances({0.5675888, 0.4710914, 3.8484723},
                                               {0.050263605, 0.1003909, 34.649040}),
                          230, 9700, true));
    // H. H. Li, J. Phys. Chem. Ref. Data 9, 161 (1980); 20 °C.
    m.push_back(isotropic("CaF2:Li1980", "CaF2", "H. H. Li, J. Phys. Chem. Ref. Data 9, 161 (1980)",
                          sellmeier_resonances({0.69913, 0.11994, 4.35181},
                                               {0.09374, 21.18, 38.46}, 0.33973),
                          150, 12000, true));
    // P. E. Ciddor, "Refractive index of air", Appl. Opt. 35, 1566 (1996): standard dry air,
    // 15 °C, 101 325 Pa, 450 ppm CO2; absolute index, vacuum wavelength.
    m.push_back(isotropic("air:Ciddor1996", "air", "Ciddor, Appl. Opt. 35, 1566 (1996)",
                          inverse_square_poles({0.05792105, 0.00167917}, {238.0185, 57.362}),
                          230, 1690, false));
    // E. R. Peck and K. Reeder, JOSA 62, 958 (1972); 15 °C, 101 325 Pa.
    m.push_back(isotropic("air:PeckReeder1972", "air", "Peck & Reeder, JOSA 62, 958 (1972)",
                          inverse_square_poles({2.480990e-2, 1.74557e-4}, {132.274, 39.32957},
                                               8.06051e-5),
                          185, 1700, false));
    // β-BaB2O4, negative uniaxial. λ in µm; n² = A + B/(λ² − C) − D λ² (+ higher terms).
    // K. Kato, IEEE JQE 22, 1013 (1986) (attribution and range from memory; coefficients as
    // printed in the Wikipedia "Beta barium borate" article and vendor sheets).
    m.push_back(uniaxial("BBO:Kato1986", "Kato, IEEE JQE 22, 1013 (1986)",
                         crystal_form(2.7359, 0.01878, 0.01822, {{-0.01354, 2}}),
                         crystal_form(2.3753, 0.01224, 0.01667, {{-0.01516, 2}}), 200, 1060));
    // D. Eimerl et al., J. Appl. Phys. 62, 1968 (1987); range 0.22–1.06 µm (Weber, Handbook of
    // Optical Materials, 2003).
    m.push_back(uniaxial("BBO:Eimerl1987", "Eimerl et al., J. Appl. Phys. 62, 1968 (1987)",
                         crystal_form(2.7405, 0.0184, 0.0179, {{-0.0155, 2}}),
                         crystal_form(2.3730, 0.0128, 0.0156, {{-0.0044, 2}}), 220, 1060));
    // D. Zhang, Y. Kong, J.-Y. Zhang, Opt. Commun. 184, 485 (2000); near-IR set, 0.64–3.18 µm.
    m.push_back(uniaxial(
        "BBO:Zhang2000", "Zhang, Kong & Zhang, Opt. Commun. 184, 485 (2000)",
        crystal_form(2.7359, 0.01878, 0.01822, {{-0.01471, 2}, {0.0006081, 4}, {-0.00006740, 6}}),
        crystal_form(2.3753, 0.01224, 0.01667, {{-0.01627, 2}, {0.0005716, 4}, {-0.00006305, 6}}),
        640, 3180));
    // G. Tamošauskas et al., Opt. Mater. Express 8, 1410 (2018); 0.188–5.2 µm.
    m.push_back(uniaxial("BBO:Tamosauskas2018", "Tamošauskas et al., Opt. Mater. Express 8, 1410 (2018)",
                         sellmeier_squared_poles({0.90291, 0.83155, 0.76536},
                                                 {0.003926, 0.018786, 60.01}),
                         sellmeier_squared_poles({1.151075, 0.21803, 0.656},
                                                 {0.007142, 0.02259, 263}),
                         188, 5200));
    // Crystalline quartz (α-SiO2), positive uniaxial, for wave plates. G. Ghosh, Opt. Commun. 163,
    // 95 (1999): n² = A + B λ²/(λ² − C) + D λ²/(λ² − E), λ in µm, C and E in µm², 0.198–2.0531 µm
    // (coefficients via the refractiveindex.info database, Ghosh-o/-e). A second set:
    // T. Radhakrishnan, Proc. Indian Acad. Sci. A 31, 22 (1951), 18 °C, 0.18–3 µm.
    m.push_back(uniaxial("quartz:Ghosh1999", "Ghosh, Opt. Commun. 163, 95 (1999)",
                         sellmeier_squared_poles({1.07044083, 1.10202242}, {1.00585997e-2, 100}, 0.28604141),
                         sellmeier_squared_poles({1.09509924, 1.15662475}, {1.02101864e-2, 100}, 0.28851804),
                         198, 2053));
    m.push_back(uniaxial("quartz:Radhakrishnan1951", "Radhakrishnan, Proc. Indian Acad. Sci. A 31, 22 (1951)",
                         sellmeier_resonances({0.663044, 0.517852, 0.175912, 0.565380, 1.675299},
                                              {0.060, 0.106, 0.119, 8.844, 20.742}),
                         sellmeier_resonances({0.665721, 0.503511, 0.214792, 0.539173, 1.807613},
                                              {0.060, 0.106, 0.119, 8.792, 19.70}),
                         180, 3000));
    // MgF2, positive uniaxial, for wave plates. M. J. Dodge, Appl. Opt. 23, 1980 (1984), 19 °C,
    // 0.2–7.0 µm: n² − 1 = Σ B λ²/(λ² − λ_i²), λ_i in µm.
    m.push_back(uniaxial("MgF2:Dodge1984", "Dodge, Appl. Opt. 23, 1980 (1984)",
                         sellmeier_resonances({0.48755108, 0.39875031, 2.3120353}, {0.04338408, 0.09461442, 23.793604}),
                         sellmeier_resonances({0.41344023, 0.50497499, 2.4904862}, {0.03684262, 0.09076162, 23.771995}),
                         200, 7000));
    // LiB3O5, biaxial; principal indices α < β < γ as x, y, z. C. Chen et al., JOSA B 6, 616
    // (1989), fit by Hanson & Dick, Opt. Lett. 16, 205 (1991); 0.2894–1.064 µm.
    m.push_back({"LBO:Chen1989", "LBO", "Chen et al., JOSA B 6, 616 (1989); Hanson & Dick, Opt. Lett. 16, 205 (1991)",
                 Symmetry::Biaxial,
                 {crystal_form(2.45768, 0.0098877, 0.026095, {{-0.013847, 2}}),
                  crystal_form(2.52500, 0.017123, -0.0060517, {{-0.0087838, 2}}),
                  crystal_form(2.58488, 0.012737, 0.021414, {{-0.016293, 2}})},
                 289.4, 1064, false, std::nullopt, std::nullopt});
    // LiB3O5 with its temperature dependence, for non-critical phase matching by temperature.
    // Indices at 20 °C: K. Kato, IEEE J. Quantum Electron. 30, 2950 (1994),
    //   n² = A + B/(λ² − C) − Dλ² + Eλ⁴ − Fλ⁶;
    // thermo-optic slopes: K. Kato, S. G. Grechin and N. Umemura, Laser Phys. 28, 095403 (2018),
    //   dn/dT = a + bλ (per K, λ in µm), linear in T about 20 °C.
    // The coefficients are as transcribed in the open ndispers library (docs/physics.md §4.5);
    // we have not checked them against the papers. Our transcription gives no
    // wavelength range, so the set claims only 532–1064 nm, the span our test checks against a
    // published result (the non-critical SHG of 1064 nm); outside it every figure warns.
    {
        Material lbo{"LBO:Kato2018", "LBO",
                     "Kato, IEEE JQE 30, 2950 (1994); Kato, Grechin & Umemura, Laser Phys. 28, 095403 (2018)",
                     Symmetry::Biaxial,
                     {crystal_form(2.4542, 0.01125, 0.01135, {{-0.01388, 2}}),
                      crystal_form(2.5390, 0.01277, 0.01189, {{-0.01849, 2}, {4.3025e-5, 4}, {-2.9131e-5, 6}}),
                      crystal_form(2.5865, 0.01310, 0.01223, {{-0.01862, 2}, {4.5778e-5, 4}, {-3.2526e-5, 6}})},
                     532, 1064, false, std::nullopt, std::nullopt};
        lbo.thermo_optic = ThermoOptic{20.0,
                                       {{0.2300e-5, -0.3760e-5}, {-1.9318e-5, 0.5779e-5}, {-1.1569e-5, 0.4073e-5}},
                                       "Kato, Grechin & Umemura, Laser Phys. 28, 095403 (2018)"};
        lbo.temperature_c = 20.0;
        m.push_back(std::move(lbo));
    }
    // KTiOPO4, biaxial. K. Kato and E. Takaoka, Appl. Opt. 41, 5040 (2002); 20 °C, 0.43–3.54 µm.
    m.push_back({"KTP:Kato2002", "KTP", "Kato & Takaoka, Appl. Opt. 41, 5040 (2002)",
                 Symmetry::Biaxial,
                 {two_pole_form(3.29100, {0.04140, 9.35522}, {0.03978, 31.45571}),
                  two_pole_form(3.45018, {0.04341, 16.98825}, {0.04597, 39.43799}),
                  two_pole_form(4.59423, {0.06206, 110.80672}, {0.04763, 86.12171})},
                 430, 3540, false, std::nullopt, std::nullopt});
    return m;
}

}  // namespace

const MaterialLibrary& MaterialLibrary::builtin() {
    static const MaterialLibrary library = [] {
        MaterialLibrary lib;
        Data data;
        data.materials = published_sets();
        data.aliases = {{"CaF2", "CaF2:Malitson1963"}, {"air", "air:Ciddor1996"},
                        {"BBO", "BBO:Tamosauskas2018"}, {"LBO", "LBO:Chen1989"},
                        {"KTP", "KTP:Kato2002"},       {"quartz", "quartz:Ghosh1999"},
                        {"MgF2", "MgF2:Dodge1984"}};
        lib.data_ = std::make_shared<const Data>(std::move(data));
        return lib;
    }();
    return library;
}

const Material* MaterialLibrary::find(std::string_view name) const {
    for (const Alias& a : data_->aliases)
        if (a.family == name) return find(a.default_set);
    for (const Material& m : data_->materials)
        if (m.name == name) return &m;
    return nullptr;
}

MaterialLibrary MaterialLibrary::with(Material material) const {
    assert(find(material.name) == nullptr);
    Data data = *data_;
    data.materials.push_back(std::move(material));
    MaterialLibrary copy;
    copy.data_ = std::make_shared<const Data>(std::move(data));
    return copy;
}

MaterialLibrary MaterialLibrary::with_temperature(std::string_view name, double temperature_c) const {
    const Material* m = find(name);
    if (!m || !m->thermo_optic) return *this;
    Data data = *data_;
    for (Material& s : data.materials)
        if (s.name == m->name) s = at_temperature(s, temperature_c);
    MaterialLibrary copy;
    copy.data_ = std::make_shared<const Data>(std::move(data));
    return copy;
}

std::vector<std::string> MaterialLibrary::names() const {
    std::vector<std::string> out;
    for (const Material& m : data_->materials) out.push_back(m.name);
    for (const Alias& a : data_->aliases) out.push_back(a.family);
    std::sort(out.begin(), out.end());
    return out;
}

Material user_sellmeier_material(std::string id, std::vector<double> b,
                                 std::vector<double> c_um2, double min_wavelength_nm,
                                 double max_wavelength_nm, std::string source) {
    return isotropic(id, id, std::move(source), sellmeier_squared_poles(b, c_um2),
                     min_wavelength_nm, max_wavelength_nm, false);
}

}  // namespace rv
