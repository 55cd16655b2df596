// The CPU rasterizer: exact pixels for coverage, the top-left rule, clipping, blending,
// texture sampling, large-mesh offsets and thread counts.
#include "render/cpu_rasterizer.hpp"

#include <imgui.h>

#include <catch2/catch.hpp>

namespace {

using rv::render::Framebuffer;

// One draw list of hand-made triangles (no ImGui context needed to fill the buffers).
struct Mesh {
    ImDrawList list{nullptr};
    ImDrawData data;
    ImDrawList* lists[1];

    void vertex(float x, float y, ImU32 col, float u = 0, float v = 0) {
        ImDrawVert vert;
        vert.pos = ImVec2(x, y);
        vert.uv = ImVec2(u, v);
        vert.col = col;
        list.VtxBuffer.push_back(vert);
    }
    void index(std::initializer_list<int> idx) {
        for (int i : idx) list.IdxBuffer.push_back(static_cast<ImDrawIdx>(i));
    }
    void command(ImVec4 clip, unsigned count, unsigned idx_offset = 0, unsigned vtx_offset = 0,
                 ImTextureID tex = nullptr) {
        ImDrawCmd cmd;
        cmd.ClipRect = clip;
        cmd.ElemCount = count;
        cmd.IdxOffset = idx_offset;
        cmd.VtxOffset = vtx_offset;
        cmd.TextureId = tex;
        list.CmdBuffer.push_back(cmd);
    }
    const ImDrawData& finish(int w, int h) {
        lists[0] = &list;
        data.Valid = true;
        data.CmdLists = lists;
        data.CmdListsCount = 1;
        data.TotalVtxCount = list.VtxBuffer.Size;
        data.TotalIdxCount = list.IdxBuffer.Size;
        data.DisplayPos = ImVec2(0, 0);
        data.DisplaySize = ImVec2(static_cast<float>(w), static_cast<float>(h));
        data.FramebufferScale = ImVec2(1, 1);
        return data;
    }
};

const ImVec4 kNoClip(0, 0, 1e6f, 1e6f);
const ImU32 kHalfRed = IM_COL32(255, 0, 0, 128);

int count_red(const Framebuffer& fb, int level) {
    int n = 0;
    for (int y = 0; y < fb.height; ++y)
        for (int x = 0; x < fb.width; ++x) n += fb.pixel(x, y)[0] == level;
    return n;
}

}  // namespace

TEST_CASE("two triangles sharing an edge cover each pixel exactly once", "[raster]") {
    // A 4×4 square split along its diagonal, which passes through pixel centres. Drawn at
    // 50 % red over black: a pixel covered once is 128, twice would be 192 (straight-alpha
    // blending, glBlendFunc(SRC_ALPHA, ONE_MINUS_SRC_ALPHA)).
    Mesh m;
    m.vertex(0, 0, kHalfRed);
    m.vertex(4, 0, kHalfRed);
    m.vertex(4, 4, kHalfRed);
    m.vertex(0, 4, kHalfRed);
    m.index({0, 1, 2, 2, 3, 0});  // not the rectangle pattern: the triangle path
    m.command(kNoClip, 6);
    Framebuffer fb(6, 6);
    fb.clear(0, 0, 0);
    rv::render::rasterize(m.finish(6, 6), fb);
    CHECK(count_red(fb, 128) == 16);
    CHECK(count_red(fb, 0) == 36 - 16);
}

TEST_CASE("the top-left rule on edges through pixel centres", "[raster]") {
    // A square from (0.5, 0.5) to (2.5, 2.5): its left and top edges pass through the centres of
    // columns 0 and rows 0 (included), its right and bottom edges through column 2 and row 2
    // (excluded): pixels (0..1, 0..1). The rectangle fast path must agree with the triangles.
    for (bool fast : {false, true}) {
        CAPTURE(fast);
        Mesh m;
        m.vertex(0.5f, 0.5f, kHalfRed);
        m.vertex(2.5f, 0.5f, kHalfRed);
        m.vertex(2.5f, 2.5f, kHalfRed);
        m.vertex(0.5f, 2.5f, kHalfRed);
        if (fast) m.index({0, 1, 2, 0, 2, 3});
        else m.index({0, 1, 2, 2, 3, 0});
        m.command(kNoClip, 6);
        Framebuffer fb(4, 4);
        fb.clear(0, 0, 0);
        rv::render::rasterize(m.finish(4, 4), fb);
        CHECK(count_red(fb, 128) == 4);
        CHECK(fb.pixel(0, 0)[0] == 128);
        CHECK(fb.pixel(1, 1)[0] == 128);
        CHECK(fb.pixel(2, 1)[0] == 0);
        CHECK(fb.pixel(1, 2)[0] == 0);
    }
}

TEST_CASE("clip rectangles are whole pixels as glScissor takes them", "[raster]") {
    Mesh m;
    m.vertex(0, 0, IM_COL32(255, 0, 0, 255));
    m.vertex(8, 0, IM_COL32(255, 0, 0, 255));
    m.vertex(8, 8, IM_COL32(255, 0, 0, 255));
    m.vertex(0, 8, IM_COL32(255, 0, 0, 255));
    m.index({0, 1, 2, 2, 3, 0});
    m.command(ImVec4(2.7f, 1.2f, 5.9f, 4.0f), 6);  // truncated to [2, 5) × [1, 4)
    Framebuffer fb(8, 8);
    fb.clear(0, 0, 0);
    rv::render::rasterize(m.finish(8, 8), fb);
    CHECK(count_red(fb, 255) == 3 * 3);
    CHECK(fb.pixel(2, 1)[0] == 255);
    CHECK(fb.pixel(4, 3)[0] == 255);
    CHECK(fb.pixel(5, 3)[0] == 0);
    CHECK(fb.pixel(2, 4)[0] == 0);
}

TEST_CASE("straight-alpha blending like the OpenGL backends", "[raster]") {
    // rgb = src·a + dst·(1 − a); alpha = a + dst_a·(1 − a): half red over opaque blue.
    Mesh m;
    for (auto [x, y] : {std::pair{0.f, 0.f}, {2.f, 0.f}, {2.f, 2.f}, {0.f, 2.f}}) m.vertex(x, y, kHalfRed);
    m.index({0, 1, 2, 0, 2, 3});
    m.command(kNoClip, 6);
    Framebuffer fb(2, 2);
    fb.clear(0, 0, 255);
    rv::render::rasterize(m.finish(2, 2), fb);
    const std::uint8_t* p = fb.pixel(1, 1);
    CHECK(int(p[0]) == 128);
    CHECK(int(p[1]) == 0);
    CHECK(int(p[2]) == 127);
    CHECK(int(p[3]) == 255);
}

TEST_CASE("texture sampling and vertex colour modulation", "[raster]") {
    // A 2×2 texture mapped over 4×4 pixels: each 2×2 block takes its texel (nearest), times
    // the vertex colour (here a half-green filter on the green channel).
    const std::uint8_t texels[16] = {255, 0, 0, 255, 0, 255, 0, 255, 0, 0, 255, 255, 255, 255, 255, 255};
    rv::render::Texture tex{2, 2, texels};
    for (bool fast : {false, true}) {
        CAPTURE(fast);
        Mesh m;
        const ImU32 col = IM_COL32(255, 128, 255, 255);
        m.vertex(0, 0, col, 0, 0);
        m.vertex(4, 0, col, 1, 0);
        m.vertex(4, 4, col, 1, 1);
        m.vertex(0, 4, col, 0, 1);
        if (fast) m.index({0, 1, 2, 0, 2, 3});
        else m.index({0, 1, 2, 2, 3, 0});
        m.command(kNoClip, 6, 0, 0, &tex);
        Framebuffer fb(4, 4);
        fb.clear(0, 0, 0);
        rv::render::rasterize(m.finish(4, 4), fb);
        CHECK(int(fb.pixel(0, 0)[0]) == 255);
        CHECK(int(fb.pixel(3, 0)[1]) == 128);   // green texel × 128/255
        CHECK(int(fb.pixel(0, 3)[2]) == 255);   // blue texel
        CHECK(int(fb.pixel(3, 3)[1]) == 128);   // white texel, green halved
        CHECK(int(fb.pixel(3, 3)[0]) == 255);
    }
}

TEST_CASE("a command's vertex offset is honoured", "[raster]") {
    Mesh m;
    for (int q = 0; q < 2; ++q) {
        const float x0 = q * 4.0f;
        const ImU32 col = q ? IM_COL32(0, 255, 0, 255) : IM_COL32(255, 0, 0, 255);
        m.vertex(x0, 0, col);
        m.vertex(x0 + 4, 0, col);
        m.vertex(x0 + 4, 4, col);
        m.vertex(x0, 4, col);
    }
    m.index({0, 1, 2, 2, 3, 0});
    m.command(kNoClip, 6, 0, 4);  // the same indices, read from the second quad
    Framebuffer fb(8, 4);
    fb.clear(0, 0, 0);
    rv::render::rasterize(m.finish(8, 4), fb);
    CHECK(int(fb.pixel(5, 1)[1]) == 255);
    CHECK(int(fb.pixel(1, 1)[0]) == 0);
}

TEST_CASE("the thread count does not change a single pixel", "[raster]") {
    IMGUI_CHECKVERSION();
    ImGui::CreateContext();
    ImGuiIO& io = ImGui::GetIO();
    io.DisplaySize = ImVec2(320, 240);
    ImGui::GetStyle().AntiAliasedLinesUseTex = false;
    unsigned char* pixels = nullptr;
    int w = 0, h = 0;
    io.Fonts->GetTexDataAsRGBA32(&pixels, &w, &h);
    rv::render::Texture font{w, h, pixels};
    io.Fonts->SetTexID(&font);
    for (int frame = 0; frame < 2; ++frame) {
        ImGui::NewFrame();
        ImGui::SetNextWindowPos(ImVec2(10, 10));
        ImGui::Begin("threads");
        ImGui::Text("Waist 31.4 um at 1030 nm");
        ImDrawList* dl = ImGui::GetWindowDrawList();
        dl->AddCircleFilled(ImVec2(150, 120), 40, IM_COL32(200, 60, 20, 180));
        dl->AddLine(ImVec2(20, 200), ImVec2(300, 60), IM_COL32(20, 200, 60, 255), 2.5f);
        ImGui::End();
        ImGui::Render();
    }
    Framebuffer one(320, 240), two(320, 240), three(320, 240);
    for (Framebuffer* fb : {&one, &two, &three}) fb->clear(30, 30, 30);
    rv::render::rasterize(*ImGui::GetDrawData(), one, {1});
    rv::render::rasterize(*ImGui::GetDrawData(), two, {2});
    rv::render::rasterize(*ImGui::GetDrawData(), three, {3});
    CHECK(one.rgba == two.rgba);
    CHECK(one.rgba == three.rgba);
    size_t changed = 0;
    for (size_t i = 0; i < one.rgba.size(); i += 4) changed += one.rgba[i] != 30;
    CHECK(changed > 1000);  // something was drawn
    ImGui::DestroyContext();
}
