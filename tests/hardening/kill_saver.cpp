// Crash-safe saving under SIGKILL: starts hardening_save_loop (save_loop.cpp), which saves two
// layouts alternately over one file with the project's atomic save, kills it with SIGKILL at a
// seeded random moment, and checks the file: it must hold exactly the bytes of one of the two
// layouts and read back (real reader) as that layout — never empty, cut short or mixed. Also
// checks that what a kill leaves behind stays bounded: every leftover temporary file
// (".layout.json.tmp-XXXXXX", io/atomic_file.cpp) is no larger than the larger layout and a
// kill leaves at most one. Prints how many were left.
//   hardening_kill_saver SAVER KILLS SEED
#include <poll.h>
#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <random>
#include <sstream>
#include <string>
#include <thread>

#include "hardening/saver_layouts.hpp"
#include "io/layout_reader.hpp"
#include "io/layout_writer.hpp"

namespace {

int failures = 0;
void fail(const std::string& what) {
    std::fprintf(stderr, "FAIL: %s\n", what.c_str());
    ++failures;
}

std::string file_text(const std::filesystem::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::ostringstream s;
    s << in.rdbuf();
    return s.str();
}

// Starts the saver on `target`; returns its pid once it has said "ready" (or -1).
pid_t start_saver(const char* saver, const std::string& target) {
    int fds[2];
    if (::pipe(fds) != 0) return -1;
    const pid_t pid = ::fork();
    if (pid == 0) {
        ::dup2(fds[1], STDOUT_FILENO);
        ::close(fds[0]);
        ::close(fds[1]);
        ::execl(saver, saver, target.c_str(), static_cast<char*>(nullptr));
        std::_Exit(127);
    }
    ::close(fds[1]);
    pollfd p{fds[0], POLLIN, 0};
    char buf[16] = {};
    const bool ready = ::poll(&p, 1, 20000) == 1 && ::read(fds[0], buf, sizeof buf) > 0;
    ::close(fds[0]);
    if (!ready) {
        ::kill(pid, SIGKILL);
        ::waitpid(pid, nullptr, 0);
        return -1;
    }
    return pid;
}

}  // namespace

int main(int argc, char** argv) {
    if (argc != 4) {
        std::fprintf(stderr, "usage: %s SAVER KILLS SEED\n", argv[0]);
        return 2;
    }
    const char* saver = argv[1];
    const int kills = std::atoi(argv[2]);
    std::mt19937_64 rng(std::strtoull(argv[3], nullptr, 10));

    const rv::Layout layouts[2] = {rv::hardening::saver_layout(0), rv::hardening::saver_layout(1)};
    const std::string texts[2] = {rv::write_layout(layouts[0]), rv::write_layout(layouts[1])};
    const size_t largest = std::max(texts[0].size(), texts[1].size());
    if (texts[0] == texts[1]) fail("the two saver layouts are the same");

    std::string folder_template =
        (std::filesystem::temp_directory_path() / "rv-kill-XXXXXX").string();
    if (!::mkdtemp(folder_template.data())) {
        std::perror("mkdtemp");
        return 1;
    }
    const std::filesystem::path folder = folder_template;
    const std::filesystem::path target = folder / "layout.json";

    const auto began = std::chrono::steady_clock::now();
    int seen[2] = {0, 0};
    size_t leftovers = 0, leftover_bytes = 0;
    for (int k = 0; k < kills && failures < 10; ++k) {
        const pid_t pid = start_saver(saver, target.string());
        if (pid < 0) {
            fail("the saver did not start or never finished its first save");
            break;
        }
        // A moment within the next few saves (each is a write, two fsyncs and a rename).
        const long delay_us = static_cast<long>(rng() % 12000);
        std::this_thread::sleep_for(std::chrono::microseconds(delay_us));
        ::kill(pid, SIGKILL);
        int status = 0;
        ::waitpid(pid, &status, 0);
        if (!(WIFSIGNALED(status) && WTERMSIG(status) == SIGKILL))
            fail("kill " + std::to_string(k) + ": the saver ended by itself (status " +
                 std::to_string(status) + ") before it was killed");

        const std::string now = file_text(target);
        const int which = now == texts[0] ? 0 : now == texts[1] ? 1 : -1;
        if (which < 0) {
            fail("kill " + std::to_string(k) + " after " + std::to_string(delay_us) +
                 " us: the file holds neither layout (" + std::to_string(now.size()) + " bytes)");
            continue;
        }
        ++seen[which];
        const rv::LayoutReadResult r = rv::read_layout_file(target);
        if (!r.layout || !(*r.layout == layouts[which]))
            fail("kill " + std::to_string(k) +
                 ": the file does not read back as the layout it holds");

        leftovers = 0;
        leftover_bytes = 0;
        for (const auto& entry : std::filesystem::directory_iterator(folder)) {
            if (entry.path() == target) continue;
            const std::string name = entry.path().filename().string();
            if (name.rfind(".layout.json.tmp-", 0) != 0) fail("unexpected file " + name);
            ++leftovers;
            leftover_bytes += entry.file_size();
            if (entry.file_size() > largest)
                fail("temporary file " + name + " has " + std::to_string(entry.file_size()) +
                     " bytes, more than the larger layout (" + std::to_string(largest) + ")");
        }
        if (leftovers > static_cast<size_t>(k + 1))
            fail("more temporary files (" + std::to_string(leftovers) + ") than kills (" +
                 std::to_string(k + 1) + ")");
    }
    const double seconds =
        std::chrono::duration<double>(std::chrono::steady_clock::now() - began).count();
    std::printf(
        "%d kills in %.1f s: file held layout 0 %d times, layout 1 %d times; %zu temporary "
        "file(s) left behind (%zu bytes)\n",
        kills, seconds, seen[0], seen[1], leftovers, leftover_bytes);
    // Both layouts must have been caught on disk, or the kills were not landing between saves.
    if (failures == 0 && (seen[0] < kills / 10 || seen[1] < kills / 10))
        fail("the kills did not land at varied moments (each layout should be seen often)");
    std::filesystem::remove_all(folder);
    return failures == 0 ? 0 : 1;
}
