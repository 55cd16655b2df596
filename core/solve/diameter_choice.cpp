#include "solve/diameter_choice.hpp"

#include <algorithm>
#include <cmath>
#include <optional>

#include "analysis/crystal_waves.hpp"
#include "layout/visit.hpp"
#include "trace/propagate.hpp"

namespace rv {

namespace {

// What a catalog lens is but for its size: the kind of model, the focal length asked for, glass,
// shape and design wavelength (a singlet's centre thickness follows its diameter).
struct Family {
    size_t model = 0;
    double focal_length_mm = 0;
    std::string glass, shape;
    double design_wavelength_nm = 0;
    bool operator==(const Family&) const = default;
};

Family family_of(const CatalogLens& c) {
    Family f{c.lens.model.index(), c.focal_length_mm, "", "", 0};
    std::visit(overloaded{
                   [](const IdealLens&) {},
                   [&](const ThinChromaticLens& t) {
                       f.glass = t.glass;
                       f.design_wavelength_nm = t.design_wavelength_nm;
                   },
                   [&](const ThickLens& t) {
                       f.glass = t.glass;
                       f.shape = t.shape.value_or("");
                       f.design_wavelength_nm = t.design_wavelength_nm;
                   },
               },
               c.lens.model);
    return f;
}

// How a member passes its beam: the swapped lenses that clip above the warning level (the
// report's clipping findings at them) and the largest and total power lost there.
struct Clipping {
    int lenses = 0;
    double total = 0;
    std::optional<double> largest;
};

// The findings are the report's clipping findings: build_report takes them from the caustic
// propagate_path makes of each path trace_arriving_waves gives, with the default propagation
// options; here the same two calls without the envelope samples, power and phase figures that a
// whole report adds and that do not change them (diameter_choice_test holds the two equal).
Clipping clipping_of(const TelescopeSolution& s, const std::vector<std::string>& swapped_ids,
                     const MaterialLibrary& library) {
    Clipping c;
    PropagationOptions options;
    options.sample_envelope = false;
    std::vector<Finding> findings;
    for (const Path& p : trace_arriving_waves(s.layout, library)) {
        const Caustic caustic = propagate_path(s.layout, p, options);
        findings.insert(findings.end(), caustic.findings.begin(), caustic.findings.end());
    }
    for (const std::string& id : swapped_ids) {
        double lost = 0;
        bool clips = false;
        for (const Finding& f : findings)
            if (f.kind == Finding::Kind::Clipping && f.element == id)
                clips = true, lost = std::max(lost, f.amount);
        if (!clips) continue;
        ++c.lenses;
        c.total += lost;
        c.largest = std::max(c.largest.value_or(0.0), lost);
    }
    return c;
}

double diameter_sum_mm(const std::vector<const CatalogLens*>& choice) {
    double sum = 0;
    for (const CatalogLens* c : choice) sum += c->diameter_mm;
    return sum;
}

}  // namespace

bool same_but_diameter(const std::vector<const CatalogLens*>& a,
                       const std::vector<const CatalogLens*>& b) {
    if (a.size() != b.size()) return false;
    for (size_t k = 0; k < a.size(); ++k)
        if (!(family_of(*a[k]) == family_of(*b[k]))) return false;
    return true;
}

std::vector<SolvedChoice> collapse_diameters(
    std::vector<SolvedChoice> ranked, size_t keep, const std::vector<std::string>& swapped_ids,
    const MaterialLibrary& library,
    const std::function<bool(const TelescopeSolution&, const TelescopeSolution&)>& ranks_before) {
    // The families in the order of their best member, each with its members best first.
    std::vector<std::vector<size_t>> families;
    for (size_t i = 0; i < ranked.size(); ++i) {
        auto it = std::find_if(families.begin(), families.end(), [&](const std::vector<size_t>& f) {
            return same_but_diameter(ranked[f[0]].choice, ranked[i].choice);
        });
        if (it != families.end())
            it->push_back(i);
        else
            families.push_back({i});
    }
    if (families.size() > keep) families.resize(keep);
    std::vector<SolvedChoice> out;
    for (const std::vector<size_t>& members : families) {
        std::vector<Clipping> clip;
        for (size_t i : members)
            clip.push_back(swapped_ids.empty()
                               ? Clipping{}
                               : clipping_of(ranked[i].solution, swapped_ids, library));
        // The kept member (see the header): fewest clipping lenses, least loss to 0.1 %, smallest
        // diameters, best rank (members are in rank order, so the first of equals).
        auto key = [&](size_t m) {
            return std::make_tuple(clip[m].lenses,
                                   clip[m].lenses ? std::round(clip[m].total * 1e3) : 0.0,
                                   diameter_sum_mm(ranked[members[m]].choice), m);
        };
        size_t kept = 0;
        for (size_t m = 1; m < members.size(); ++m)
            if (key(m) < key(kept)) kept = m;
        SolvedChoice chosen = std::move(ranked[members[kept]]);
        chosen.solution.clipped_fraction = clip[kept].largest;
        chosen.solution.also.clear();
        for (size_t m = 0; m < members.size(); ++m) {
            if (m == kept) continue;
            const SolvedChoice& other = ranked[members[m]];
            DiameterAlternative a;
            for (size_t k = 0; k < other.choice.size(); ++k)
                if (other.choice[k] != chosen.choice[k]) {
                    a.swaps.emplace_back(swapped_ids[k], other.choice[k]->id);
                    a.diameters_mm.push_back(other.choice[k]->diameter_mm);
                }
            a.clipped_fraction = clip[m].largest;
            chosen.solution.also.push_back(std::move(a));
        }
        // Smallest diameters first: the order a user reads "also: …" in.
        std::stable_sort(chosen.solution.also.begin(), chosen.solution.also.end(),
                         [](const DiameterAlternative& x, const DiameterAlternative& y) {
                             double sx = 0, sy = 0;
                             for (double d : x.diameters_mm) sx += d;
                             for (double d : y.diameters_mm) sy += d;
                             return sx < sy;
                         });
        out.push_back(std::move(chosen));
    }
    std::stable_sort(out.begin(), out.end(), [&](const SolvedChoice& x, const SolvedChoice& y) {
        return ranks_before(x.solution, y.solution);
    });
    return out;
}

}  // namespace rv
