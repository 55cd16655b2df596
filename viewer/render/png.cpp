#include "render/png.hpp"

#include <stb_image_write.h>

#include <stdexcept>
#include <string_view>

#include "io/atomic_file.hpp"

namespace rv::render {

std::vector<std::uint8_t> encode_png(const Framebuffer& fb) {
    std::vector<std::uint8_t> out;
    auto sink = [](void* ctx, void* data, int size) {
        auto* bytes = static_cast<std::vector<std::uint8_t>*>(ctx);
        bytes->insert(bytes->end(), static_cast<std::uint8_t*>(data), static_cast<std::uint8_t*>(data) + size);
    };
    if (!stbi_write_png_to_func(sink, &out, fb.width, fb.height, 4, fb.rgba.data(), fb.width * 4))
        throw std::runtime_error("PNG encoding failed");
    return out;
}

void save_png(const Framebuffer& fb, const std::filesystem::path& path,
              const SafeWriteRules& rules) {
    const std::vector<std::uint8_t> bytes = encode_png(fb);
    write_file_safely(
        path, std::string_view(reinterpret_cast<const char*>(bytes.data()), bytes.size()), rules);
}

}  // namespace rv::render
