#include "render/cpu_rasterizer.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <cstring>
#include <thread>

#include "units/clamped_int.hpp"

namespace rv::render {

namespace {

struct Rgba {
    int r, g, b, a;
};

Rgba unpack(ImU32 c) {
    return {static_cast<int>(c & 0xff), static_cast<int>((c >> 8) & 0xff), static_cast<int>((c >> 16) & 0xff),
            static_cast<int>(c >> 24)};
}

// Straight-alpha "over": rgb = src·a + dst·(1 − a), alpha = a + dst_a·(1 − a), in 8 bits.
inline void blend(std::uint8_t* dst, int r, int g, int b, int a) {
    if (a <= 0) return;
    if (a >= 255) {
        dst[0] = static_cast<std::uint8_t>(r);
        dst[1] = static_cast<std::uint8_t>(g);
        dst[2] = static_cast<std::uint8_t>(b);
        dst[3] = 255;
        return;
    }
    const int inv = 255 - a;
    dst[0] = static_cast<std::uint8_t>((r * a + dst[0] * inv + 127) / 255);
    dst[1] = static_cast<std::uint8_t>((g * a + dst[1] * inv + 127) / 255);
    dst[2] = static_cast<std::uint8_t>((b * a + dst[2] * inv + 127) / 255);
    dst[3] = static_cast<std::uint8_t>(a + (dst[3] * inv + 127) / 255);
}

inline Rgba sample(const Texture* t, float u, float v) {
    if (!t || !t->rgba) return {255, 255, 255, 255};
    const int x = clamped_int(u * t->width, 0, t->width - 1);
    const int y = clamped_int(v * t->height, 0, t->height - 1);
    const std::uint8_t* p = t->rgba + (static_cast<size_t>(y) * t->width + x) * 4;
    return {p[0], p[1], p[2], p[3]};
}

inline int mul255(int a, int b) { return (a * b + 127) / 255; }

struct Clip {
    int x0, y0, x1, y1;  // pixels [x0, x1) × [y0, y1)
};

struct Vert {
    float x, y, u, v;
    Rgba c;
};

// The edge function of (a, b) at p; > 0 on the inner side once the triangle is oriented.
inline float edge(float ax, float ay, float bx, float by, float px, float py) {
    return (px - ax) * (by - ay) - (py - ay) * (bx - ax);
}

// Top-left rule: moving +x (left edge) or, for a horizontal edge, +y (top edge) goes inside.
inline bool top_left(float ax, float ay, float bx, float by) {
    const float gx = by - ay, gy = -(bx - ax);
    return gx > 0 || (gx == 0 && gy > 0);
}

void fill_triangle(Vert v0, Vert v1, Vert v2, const Texture* tex, const Clip& clip, Framebuffer& fb) {
    float area = edge(v0.x, v0.y, v1.x, v1.y, v2.x, v2.y);
    if (area == 0) return;
    if (area < 0) {
        std::swap(v1, v2);
        area = -area;
    }
    // Clamped to the clip before the cast (a vertex far off the canvas, or NaN, is no UB).
    const int x_min = clamped_int(std::floor(std::min({v0.x, v1.x, v2.x})), clip.x0, clip.x1);
    const int x_max = clamped_int(std::ceil(std::max({v0.x, v1.x, v2.x})), clip.x0 - 1, clip.x1 - 1);
    const int y_min = clamped_int(std::floor(std::min({v0.y, v1.y, v2.y})), clip.y0, clip.y1);
    const int y_max = clamped_int(std::ceil(std::max({v0.y, v1.y, v2.y})), clip.y0 - 1, clip.y1 - 1);
    if (x_min > x_max || y_min > y_max) return;
    const bool tl0 = top_left(v1.x, v1.y, v2.x, v2.y);
    const bool tl1 = top_left(v2.x, v2.y, v0.x, v0.y);
    const bool tl2 = top_left(v0.x, v0.y, v1.x, v1.y);
    const bool flat_colour = v0.c.r == v1.c.r && v1.c.r == v2.c.r && v0.c.g == v1.c.g && v1.c.g == v2.c.g &&
                             v0.c.b == v1.c.b && v1.c.b == v2.c.b && v0.c.a == v1.c.a && v1.c.a == v2.c.a;
    const bool flat_uv = v0.u == v1.u && v1.u == v2.u && v0.v == v1.v && v1.v == v2.v;
    const Rgba texel0 = sample(tex, v0.u, v0.v);
    const float inv_area = 1.0f / area;
    for (int y = y_min; y <= y_max; ++y) {
        const float py = y + 0.5f;
        std::uint8_t* row = &fb.rgba[(static_cast<size_t>(y) * fb.width) * 4];
        for (int x = x_min; x <= x_max; ++x) {
            const float px = x + 0.5f;
            const float w0 = edge(v1.x, v1.y, v2.x, v2.y, px, py);
            const float w1 = edge(v2.x, v2.y, v0.x, v0.y, px, py);
            const float w2 = edge(v0.x, v0.y, v1.x, v1.y, px, py);
            if (w0 < 0 || w1 < 0 || w2 < 0) continue;
            if ((w0 == 0 && !tl0) || (w1 == 0 && !tl1) || (w2 == 0 && !tl2)) continue;
            const float b0 = w0 * inv_area, b1 = w1 * inv_area, b2 = w2 * inv_area;
            Rgba c = v0.c;
            if (!flat_colour) {
                c = {static_cast<int>(b0 * v0.c.r + b1 * v1.c.r + b2 * v2.c.r + 0.5f),
                     static_cast<int>(b0 * v0.c.g + b1 * v1.c.g + b2 * v2.c.g + 0.5f),
                     static_cast<int>(b0 * v0.c.b + b1 * v1.c.b + b2 * v2.c.b + 0.5f),
                     static_cast<int>(b0 * v0.c.a + b1 * v1.c.a + b2 * v2.c.a + 0.5f)};
            }
            const Rgba t = flat_uv ? texel0
                                   : sample(tex, b0 * v0.u + b1 * v1.u + b2 * v2.u, b0 * v0.v + b1 * v1.v + b2 * v2.v);
            blend(row + x * 4, mul255(c.r, t.r), mul255(c.g, t.g), mul255(c.b, t.b), mul255(c.a, t.a));
        }
    }
}

// Fast path: two triangles forming an axis-aligned rectangle of one colour whose texture
// coordinates either stay put (a filled rectangle) or map linearly (a glyph). Covers the same
// pixels as the two triangles would (centres inside, top-left rule: [ceil(x − 0.5), …)).
bool fill_rectangle(const ImDrawVert* v, const ImDrawIdx* idx, const Texture* tex, const Clip& clip,
                    Framebuffer& fb) {
    // ImGui's PrimRect/PrimRectUV: vertices a, b, c, d with indices (0,1,2) (0,2,3).
    if (!(idx[0] == idx[3] && idx[2] == idx[4])) return false;
    const ImDrawVert& a = v[idx[0]];
    const ImDrawVert& b = v[idx[1]];
    const ImDrawVert& c = v[idx[2]];
    const ImDrawVert& d = v[idx[5]];
    if (!(a.col == b.col && b.col == c.col && c.col == d.col)) return false;
    if (!(a.pos.y == b.pos.y && b.pos.x == c.pos.x && c.pos.y == d.pos.y && d.pos.x == a.pos.x)) return false;
    if (!(a.uv.y == b.uv.y && b.uv.x == c.uv.x && c.uv.y == d.uv.y && d.uv.x == a.uv.x)) return false;
    const float x0 = std::min(a.pos.x, c.pos.x), x1 = std::max(a.pos.x, c.pos.x);
    const float y0 = std::min(a.pos.y, c.pos.y), y1 = std::max(a.pos.y, c.pos.y);
    if (x0 == x1 || y0 == y1) return true;
    const int px0 = clamped_int(std::ceil(x0 - 0.5f), clip.x0, clip.x1);
    const int px1 = clamped_int(std::ceil(x1 - 0.5f), clip.x0, clip.x1);
    const int py0 = clamped_int(std::ceil(y0 - 0.5f), clip.y0, clip.y1);
    const int py1 = clamped_int(std::ceil(y1 - 0.5f), clip.y0, clip.y1);
    const Rgba col = unpack(a.col);
    const bool flat_uv = a.uv.x == c.uv.x && a.uv.y == c.uv.y;
    const Rgba texel0 = sample(tex, a.uv.x, a.uv.y);
    if (flat_uv && px0 < px1) {
        // One colour over the whole rectangle: blend it once per pixel with no sampling, and
        // fill opaque ones as 32-bit words (the window backgrounds are most of every frame).
        const int r = mul255(col.r, texel0.r), g = mul255(col.g, texel0.g), b = mul255(col.b, texel0.b);
        const int alpha = mul255(col.a, texel0.a);
        if (alpha <= 0) return true;
        if (alpha >= 255) {
            std::uint32_t word;
            const std::uint8_t bytes[4] = {static_cast<std::uint8_t>(r), static_cast<std::uint8_t>(g),
                                           static_cast<std::uint8_t>(b), 255};
            std::memcpy(&word, bytes, 4);
            for (int y = py0; y < py1; ++y) {
                std::uint8_t* row = &fb.rgba[(static_cast<size_t>(y) * fb.width + px0) * 4];
                for (int x = px0; x < px1; ++x, row += 4) std::memcpy(row, &word, 4);
            }
            return true;
        }
        for (int y = py0; y < py1; ++y) {
            std::uint8_t* row = &fb.rgba[(static_cast<size_t>(y) * fb.width) * 4];
            for (int x = px0; x < px1; ++x) blend(row + x * 4, r, g, b, alpha);
        }
        return true;
    }
    // Texture coordinates at pixel centres, linear across the rectangle.
    const float du = (c.pos.x != a.pos.x) ? (c.uv.x - a.uv.x) / (c.pos.x - a.pos.x) : 0;
    const float dv = (c.pos.y != a.pos.y) ? (c.uv.y - a.uv.y) / (c.pos.y - a.pos.y) : 0;
    for (int y = py0; y < py1; ++y) {
        std::uint8_t* row = &fb.rgba[(static_cast<size_t>(y) * fb.width) * 4];
        const float tv = a.uv.y + (y + 0.5f - a.pos.y) * dv;
        for (int x = px0; x < px1; ++x) {
            const Rgba t = flat_uv ? texel0 : sample(tex, a.uv.x + (x + 0.5f - a.pos.x) * du, tv);
            blend(row + x * 4, mul255(col.r, t.r), mul255(col.g, t.g), mul255(col.b, t.b), mul255(col.a, t.a));
        }
    }
    return true;
}

void rasterize_band(const ImDrawData& data, Framebuffer& fb, int band_y0, int band_y1) {
    const ImVec2 offset = data.DisplayPos;
    const ImVec2 scale = data.FramebufferScale;
    for (int n = 0; n < data.CmdListsCount; ++n) {
        const ImDrawList* list = data.CmdLists[n];
        for (const ImDrawCmd& cmd : list->CmdBuffer) {
            if (cmd.UserCallback) continue;  // no callbacks in this program
            // Clamped to the framebuffer (and the band) before the cast.
            Clip clip{clamped_int((cmd.ClipRect.x - offset.x) * scale.x, 0, fb.width),
                      clamped_int((cmd.ClipRect.y - offset.y) * scale.y, std::max(0, band_y0), fb.height),
                      clamped_int((cmd.ClipRect.z - offset.x) * scale.x, 0, fb.width),
                      clamped_int((cmd.ClipRect.w - offset.y) * scale.y, 0, std::min(fb.height, band_y1))};
            if (clip.x0 >= clip.x1 || clip.y0 >= clip.y1) continue;
            const Texture* tex = static_cast<const Texture*>(cmd.TextureId);
            const ImDrawVert* verts = list->VtxBuffer.Data + cmd.VtxOffset;
            const ImDrawIdx* idx = list->IdxBuffer.Data + cmd.IdxOffset;
            for (unsigned i = 0; i + 2 < cmd.ElemCount; i += 3) {
                if (i + 5 < cmd.ElemCount && fill_rectangle(verts, idx + i, tex, clip, fb)) {
                    i += 3;
                    continue;
                }
                auto vert = [&](ImDrawIdx k) {
                    const ImDrawVert& v = verts[k];
                    return Vert{(v.pos.x - offset.x) * scale.x, (v.pos.y - offset.y) * scale.y, v.uv.x, v.uv.y,
                                unpack(v.col)};
                };
                fill_triangle(vert(idx[i]), vert(idx[i + 1]), vert(idx[i + 2]), tex, clip, fb);
            }
        }
    }
}

}  // namespace

void Framebuffer::clear(std::uint8_t r, std::uint8_t g, std::uint8_t b, std::uint8_t a) {
    std::uint32_t word;
    const std::uint8_t bytes[4] = {r, g, b, a};
    std::memcpy(&word, bytes, 4);
    for (size_t i = 0; i < rgba.size(); i += 4) std::memcpy(&rgba[i], &word, 4);
}

void rasterize(const ImDrawData& data, Framebuffer& fb, const RasterOptions& options) {
    const int threads = std::clamp(options.threads, 1, 16);
    if (threads == 1) {
        rasterize_band(data, fb, 0, fb.height);
        return;
    }
    std::vector<std::thread> pool;
    for (int t = 0; t < threads; ++t) {
        const int y0 = fb.height * t / threads, y1 = fb.height * (t + 1) / threads;
        pool.emplace_back([&data, &fb, y0, y1] { rasterize_band(data, fb, y0, y1); });
    }
    for (std::thread& th : pool) th.join();
}

}  // namespace rv::render
