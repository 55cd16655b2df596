#include "layout/lens_shape.hpp"

#include <cmath>
#include <limits>

namespace rv {

const std::vector<std::string>& lens_shape_names() {
    static const std::vector<std::string> names = {"plano-convex", "convex-plano", "biconvex",
                                                   "plano-concave", "concave-plano", "biconcave"};
    return names;
}

std::optional<ShapeRadii> radii_for_shape(std::string_view shape, double f, double t, double n,
                                          std::string* why_not) {
    constexpr double flat = std::numeric_limits<double>::infinity();
    const bool convex = shape.find("convex") != std::string_view::npos;
    if (convex != (f > 0)) {
        if (why_not) *why_not = convex ? "a convex shape needs a positive focal length"
                                       : "a concave shape needs a negative focal length";
        return std::nullopt;
    }
    const double k = n - 1.0;
    if (shape == "plano-convex" || shape == "plano-concave") return ShapeRadii{flat, -k * f};
    if (shape == "convex-plano" || shape == "concave-plano") return ShapeRadii{k * f, flat};
    if (shape == "biconvex" || shape == "biconcave") {
        const double root = 1.0 - t / (n * f);
        if (root < 0) {
            if (why_not) *why_not = "the lens is too thick for that focal length";
            return std::nullopt;
        }
        const double r = k * f * (1.0 + std::sqrt(root));
        return ShapeRadii{r, -r};
    }
    if (why_not) *why_not = "unknown shape";
    return std::nullopt;
}

}  // namespace rv
