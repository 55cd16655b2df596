// Writes N seeded random valid layouts (random_layout.hpp) into a folder as random-<i>.json,
// for the command-line checks (check_cli_random.py).
//   hardening_write_layouts FOLDER N SEED
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <string>

#include "hardening/random_layout.hpp"

int main(int argc, char** argv) {
    if (argc != 4) {
        std::fprintf(stderr, "usage: %s FOLDER N SEED\n", argv[0]);
        return 2;
    }
    const std::filesystem::path folder = argv[1];
    const int n = std::atoi(argv[2]);
    const std::uint64_t seed = std::strtoull(argv[3], nullptr, 10);
    std::filesystem::create_directories(folder);
    for (int i = 0; i < n; ++i) {
        std::ofstream out(folder / ("random-" + std::to_string(i) + ".json"));
        out << rv::hardening::random_layout(seed + static_cast<std::uint64_t>(i)).dump(2) << "\n";
        if (!out) return 1;
    }
    return 0;
}
