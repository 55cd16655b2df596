// Saves two distinct layouts over one file, alternately, until it is killed: the victim of
// kill_saver.cpp. Writes "ready\n" to stdout after its first complete save so that the killer
// knows the file exists, then keeps saving with the project's atomic save
// (io/layout_writer.hpp: save_layout → io/atomic_file.hpp).
//   hardening_save_loop TARGET
#include <unistd.h>

#include <cstdio>

#include "hardening/saver_layouts.hpp"
#include "io/layout_writer.hpp"

int main(int argc, char** argv) {
    if (argc != 2) {
        std::fprintf(stderr, "usage: %s TARGET\n", argv[0]);
        return 2;
    }
    const rv::Layout layouts[2] = {rv::hardening::saver_layout(0), rv::hardening::saver_layout(1)};
    for (unsigned long i = 0;; ++i) {
        rv::save_layout(layouts[i % 2], argv[1]);
        if (i == 0) {
            const char ready[] = "ready\n";
            if (::write(STDOUT_FILENO, ready, sizeof ready - 1) < 0) return 1;
        }
    }
}
