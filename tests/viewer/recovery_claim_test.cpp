// One recovery file per window (issue 19 §5), without a display: two Document instances on one
// layout stand for two windows (flock locks belong to an open file description, so two
// documents in one process exclude each other as two processes do), and a child process killed
// with SIGKILL stands for a window that crashes.
#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <catch2/catch.hpp>
#include <filesystem>
#include <optional>

#include "edit/document.hpp"
#include "edit/recovery_claim.hpp"
#include "io/layout_reader.hpp"

namespace fs = std::filesystem;

namespace {

struct Folder {
    fs::path path;
    explicit Folder(const std::string& name) : path(fs::temp_directory_path() / (name + "-" + std::to_string(::getpid()))) {
        fs::remove_all(path);
        fs::create_directories(path);
    }
    ~Folder() { fs::remove_all(path); }
};

fs::path bench_in(const Folder& dir) {
    const fs::path file = dir.path / "bench.json";
    fs::copy_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json", file);
    return file;
}

rv::Layout read(const fs::path& file) { return *rv::read_layout_file(file).layout; }

// The layout with its first element moved by dx_mm: an edit each window can tell apart.
rv::Layout moved(rv::Layout l, double dx_mm) {
    l.elements.front().at_mm.x() += dx_mm;
    return l;
}

}  // namespace

TEST_CASE("two windows on one layout keep two recovery files and neither removes the other's", "[viewer][recovery]") {
    Folder dir("rv-recovery-two");
    const fs::path file = bench_in(dir);
    rv::edit::Document first(read(file), file);
    CHECK(first.other_windows() == 0);
    rv::edit::Document second(read(file), file);
    CHECK(first.recovery_path() != second.recovery_path());
    CHECK(first.other_windows() == 1);  // told another has it open
    CHECK(second.other_windows() == 1);

    first.edit(moved(first.layout(), 3));
    second.edit(moved(second.layout(), 7));
    std::string error;
    REQUIRE(first.autosave(error));
    REQUIRE(second.autosave(error));
    CHECK(read(first.recovery_path()) == first.layout());
    CHECK(read(second.recovery_path()) == second.layout());
    // A live window's recovery is nobody's orphan, and Discard cannot remove it.
    CHECK(first.orphaned_recoveries().empty());
    CHECK_FALSE(first.discard_recovery(second.recovery_path()));
    CHECK(fs::exists(second.recovery_path()));

    // Saving one removes its own recovery only.
    REQUIRE(first.save(error));
    CHECK_FALSE(fs::exists(first.recovery_path()));
    CHECK(fs::exists(second.recovery_path()));
    CHECK(read(second.recovery_path()) == second.layout());
}

TEST_CASE("after two windows are killed both edits survive as recovery files and are offered", "[viewer][recovery]") {
    Folder dir("rv-recovery-killed");
    const fs::path file = bench_in(dir);
    const rv::Layout original = read(file);
    // Each child is a window that edits, autosaves and is then killed (no destructor runs).
    auto start_window = [&](double dx_mm) {
        int ready[2];
        REQUIRE(::pipe(ready) == 0);
        const pid_t child = ::fork();
        REQUIRE(child >= 0);
        if (child == 0) {
            rv::edit::Document doc(original, file);
            doc.edit(moved(original, dx_mm));
            std::string error;
            const char ok = doc.autosave(error) && doc.other_windows() == (dx_mm > 5 ? 1 : 0) ? 'y' : 'n';
            (void)!::write(ready[1], &ok, 1);
            ::pause();  // until killed
            ::_exit(0);
        }
        char ok = 0;
        (void)!::read(ready[0], &ok, 1);
        ::close(ready[0]);
        ::close(ready[1]);
        CHECK(ok == 'y');  // autosaved, and the second saw the first open
        return child;
    };
    // Both windows open at once, then both are killed.
    const pid_t a = start_window(3);
    const pid_t b = start_window(7);
    for (const pid_t child : {a, b}) {
        ::kill(child, SIGKILL);
        int status = 0;
        ::waitpid(child, &status, 0);
    }

    rv::edit::Document next(original, file);
    CHECK(next.other_windows() == 0);  // the dead windows' locks went with them
    const std::vector<fs::path> orphans = next.orphaned_recoveries();
    REQUIRE(orphans.size() == 2);
    std::vector<double> xs_mm;
    for (const fs::path& o : orphans) xs_mm.push_back(read(o).elements.front().at_mm.x());
    const double x0_mm = original.elements.front().at_mm.x();
    CHECK_THAT(xs_mm, Catch::Matchers::UnorderedEquals(std::vector<double>{x0_mm + 3, x0_mm + 7}));

    // Restoring one makes its edits this window's (in its own recovery file); the other stays.
    const rv::Layout restored = read(orphans[0]);
    REQUIRE(next.restore_from(orphans[0]));
    CHECK(next.layout() == restored);
    CHECK(read(next.recovery_path()) == restored);
    CHECK_FALSE(fs::exists(orphans[0]));
    CHECK(fs::exists(orphans[1]));
    REQUIRE(next.orphaned_recoveries().size() == 1);
    CHECK(next.discard_recovery(orphans[1]));
    CHECK(next.orphaned_recoveries().empty());
}

TEST_CASE("a claim never takes a name whose recovery file exists and ignores other layouts' files", "[viewer][recovery]") {
    Folder dir("rv-recovery-names");
    const fs::path file = dir.path / "bench.json";
    std::optional<fs::path> first_name;
    {
        rv::edit::RecoveryClaim a(file);
        REQUIRE(a.locked());
        first_name = a.recovery_path();
    }
    // A file left where that claim's name was (a dead window whose pid came back).
    fs::copy_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json", *first_name);
    // Files of another layout whose name starts alike, and the lockless name of earlier versions.
    fs::copy_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json", dir.path / ".bench.json.recovery-x.json");
    fs::copy_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json", dir.path / ".bench.json.old.recovery-1-1.json");
    fs::copy_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json", dir.path / ".bench.json.recovery.json");
    rv::edit::RecoveryClaim b(file);
    CHECK(b.recovery_path() != *first_name);
    CHECK_FALSE(fs::exists(b.recovery_path()));
    const std::vector<fs::path> orphans = b.orphans();
    CHECK(orphans.size() == 2);  // the left file and the earlier version's
    for (const fs::path& o : orphans)
        CHECK((o.filename() == first_name->filename() || o.filename() == ".bench.json.recovery.json"));
    CHECK_FALSE(b.remove_orphan(dir.path / ".bench.json.recovery-x.json"));
    CHECK(b.remove_orphan(dir.path / ".bench.json.recovery.json"));
    CHECK_FALSE(b.remove_orphan(b.recovery_path()));  // its own is not an orphan
}
