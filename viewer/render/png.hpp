#pragma once
#include <cstdint>
#include <filesystem>
#include <vector>

#include "render/cpu_rasterizer.hpp"

namespace rv::render {

// PNG bytes of a framebuffer (stb_image_write from Debian's libstb).
std::vector<std::uint8_t> encode_png(const Framebuffer& fb);

// Writes the PNG atomically; throws std::runtime_error naming the path on failure.
void save_png(const Framebuffer& fb, const std::filesystem::path& path);

}  // namespace rv::render
