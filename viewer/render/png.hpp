#pragma once
#include <cstdint>
#include <filesystem>
#include <vector>

#include "io/atomic_file.hpp"
#include "render/cpu_rasterizer.hpp"

namespace rv::render {

// PNG bytes of a framebuffer (stb_image_write from Debian's libstb).
std::vector<std::uint8_t> encode_png(const Framebuffer& fb);

// Writes the PNG with write_file_safely (io/atomic_file.hpp) and `rules`; throws
// std::runtime_error naming the path on a refusal or failure.
void save_png(const Framebuffer& fb, const std::filesystem::path& path,
              const SafeWriteRules& rules = {});

}  // namespace rv::render
