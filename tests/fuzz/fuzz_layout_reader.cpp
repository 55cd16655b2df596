// libFuzzer target: the layout reader must turn any bytes into a layout or into diagnostics,
// never crash, hang or read past its input.
#include <cstddef>
#include <cstdint>
#include <string_view>

#include "io/layout_reader.hpp"
#include "io/layout_writer.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const rv::LayoutReadResult r = rv::read_layout(std::string_view(reinterpret_cast<const char*>(data), size));
    if (r.layout) {
        // What reads must write and read back to the same layout.
        const rv::LayoutReadResult again = rv::read_layout(rv::write_layout(*r.layout));
        if (!again.layout || !(*again.layout == *r.layout)) __builtin_trap();
    } else if (r.diagnostics.empty()) {
        __builtin_trap();  // a refused file always says why
    }
    return 0;
}
