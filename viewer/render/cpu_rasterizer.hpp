#pragma once
// A CPU rasterizer for Dear ImGui's draw data: the whole window is rendered into an RGBA8
// buffer with no GPU and no GL (the window only shows the finished buffer; headless runs write
// it to PNG).
//
// Features: textured, per-vertex-coloured triangles; clip rectangles truncated to whole
// pixels as glScissor does; ImDrawCmd::VtxOffset (large meshes); straight-alpha blending like
// the OpenGL backends, glBlendFuncSeparate(SRC_ALPHA, ONE_MINUS_SRC_ALPHA, ONE,
// ONE_MINUS_SRC_ALPHA); nearest-texel sampling (lines are drawn as polygons:
// style.AntiAliasedLinesUseTex = false); a fast path for the axis-aligned one-colour
// rectangles and glyph quads ImGui emits; bands of rows on several threads with bit-identical
// output (each pixel sees the same triangles in the same order whatever the thread count).
// Coverage: a pixel belongs to a triangle when its centre is inside, ties broken by the
// top-left rule, so triangles sharing an edge cover each pixel exactly once.

#include <cstddef>
#include <cstdint>
#include <vector>

struct ImDrawData;

namespace rv::render {

// A texture in straight (not premultiplied) RGBA8, rows top to bottom. ImTextureID values
// handed to ImGui point at one of these.
struct Texture {
    int width = 0, height = 0;
    const std::uint8_t* rgba = nullptr;
};

struct Framebuffer {
    int width = 0, height = 0;
    std::vector<std::uint8_t> rgba;  // width × height × 4, rows top to bottom

    Framebuffer(int w, int h) : width(w), height(h), rgba(static_cast<std::size_t>(w) * h * 4, 0) {}
    void clear(std::uint8_t r, std::uint8_t g, std::uint8_t b, std::uint8_t a = 255);
    const std::uint8_t* pixel(int x, int y) const { return &rgba[(static_cast<std::size_t>(y) * width + x) * 4]; }
};

struct RasterOptions {
    int threads = 1;
};

void rasterize(const ImDrawData& draw_data, Framebuffer& target, const RasterOptions& options = {});

}  // namespace rv::render
