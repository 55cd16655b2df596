// Proves the third_party/ glue for Debian's Dear ImGui, stb and GLFW links and works, before
// the window exists: one headless ImGui frame, a PNG encoded in memory, GLFW's version.
// (No glfwInit: it needs a display.)
#include <GLFW/glfw3.h>
#include <imgui.h>
#include <stb_image_write.h>

#include <catch2/catch.hpp>
#include <vector>

TEST_CASE("Dear ImGui from Debian builds a frame headless", "[third-party]") {
    IMGUI_CHECKVERSION();
    ImGui::CreateContext();
    ImGuiIO& io = ImGui::GetIO();
    io.DisplaySize = ImVec2(320, 200);
    io.DeltaTime = 1.0f / 60.0f;
    unsigned char* pixels = nullptr;
    int width = 0, height = 0;
    io.Fonts->GetTexDataAsRGBA32(&pixels, &width, &height);  // stb_truetype from libstb
    REQUIRE(pixels != nullptr);
    CHECK(width > 0);
    // A new auto-sized window is measured in its first frame and drawn from the second.
    for (int frame = 0; frame < 2; ++frame) {
        ImGui::NewFrame();
        ImGui::Begin("check");
        ImGui::Text("waist %.1f um", 31.4);
        ImGui::End();
        ImGui::Render();
    }
    const ImDrawData* draw = ImGui::GetDrawData();
    REQUIRE(draw != nullptr);
    CHECK(draw->TotalVtxCount > 0);
    ImGui::DestroyContext();
    CHECK(std::string(IMGUI_VERSION) == "1.86");
}

TEST_CASE("stb_image_write and GLFW from Debian link", "[third-party]") {
    const unsigned char rgba[4 * 4 * 4] = {255, 0, 0, 255};
    std::vector<unsigned char> png;
    auto sink = [](void* ctx, void* data, int size) {
        auto* out = static_cast<std::vector<unsigned char>*>(ctx);
        out->insert(out->end(), static_cast<unsigned char*>(data),
                    static_cast<unsigned char*>(data) + size);
    };
    REQUIRE(stbi_write_png_to_func(sink, &png, 4, 4, 4, rgba, 16) != 0);
    REQUIRE(png.size() > 8);
    CHECK(png[1] == 'P');
    CHECK(png[2] == 'N');
    int major = 0, minor = 0, rev = 0;
    glfwGetVersion(&major, &minor, &rev);
    CHECK(major == 3);
}
