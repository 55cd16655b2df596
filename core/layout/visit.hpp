#pragma once
// Handling every element kind (or every lens model) with the compiler's check: a std::visit over
// an overload set, one function per alternative,
//
//     std::visit(overloaded{[](const Lens& l) { … }, [](const Mirror& m) { … }, …}, e.kind);
//
// or a struct with one operator() per kind (as KindWriter, SpecOf). A kind added to ElementKind
// without its function fails to compile at each such visit (tests/kinds/check_exhaustive.cmake
// proves it for the files it lists). Never add a catch-all (`[](const auto&)`) to such a set: it
// would take the new kind silently, the default branch this file exists to remove. A single
// std::get_if asking one question of one kind ("is it a mirror that aims?") is fine.

namespace rv {

template <class... Functions>
struct overloaded : Functions... {
    using Functions::operator()...;
};
template <class... Functions>
overloaded(Functions...) -> overloaded<Functions...>;

}  // namespace rv
