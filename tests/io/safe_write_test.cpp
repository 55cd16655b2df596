// The one file writer (io/atomic_file.hpp): links written through, special files, hard-linked
// files and the input refused, permissions and owner kept, read-back checks, and save_layout's
// refusal of NaN and infinity.
#include <sys/socket.h>
#include <sys/stat.h>
#include <sys/sysmacros.h>
#include <sys/un.h>
#include <unistd.h>

#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <limits>
#include <sstream>

#include "io/atomic_file.hpp"
#include "io/layout_reader.hpp"
#include "io/layout_writer.hpp"

namespace fs = std::filesystem;
using Catch::Matchers::Contains;
using Catch::Matchers::Equals;

namespace {

const fs::path kLayouts = fs::path(RV_SOURCE_DIR) / "layouts";

std::string slurp(const fs::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::ostringstream s;
    s << in.rdbuf();
    return s.str();
}

void put(const fs::path& p, const std::string& text) {
    std::ofstream(p, std::ios::binary) << text;
}

// A fresh folder per test, removed afterwards.
struct Scratch {
    fs::path dir;
    explicit Scratch(const std::string& name)
        : dir(fs::temp_directory_path() / ("rv-safe-write-" + name)) {
        fs::remove_all(dir);
        fs::create_directories(dir);
    }
    ~Scratch() { fs::remove_all(dir); }
    // Every name in the folder (a leftover temporary file would show here).
    std::vector<std::string> names() const {
        std::vector<std::string> out;
        for (const auto& e : fs::directory_iterator(dir))
            out.push_back(e.path().filename().string());
        std::sort(out.begin(), out.end());
        return out;
    }
};

mode_t mode_of(const fs::path& p) {
    struct stat st {};
    REQUIRE(::stat(p.c_str(), &st) == 0);
    return st.st_mode & 07777;
}

rv::Layout demo() {
    const rv::LayoutReadResult r = rv::read_layout_file(kLayouts / "sfg-bbo.json");
    REQUIRE(r.layout);
    return *r.layout;
}

}  // namespace

TEST_CASE("a symbolic link is written through and stays a link", "[safe_write]") {
    Scratch s("link");
    put(s.dir / "target.json", "old");
    fs::create_symlink("target.json", s.dir / "link.json");  // relative, same folder
    rv::write_file_safely(s.dir / "link.json", "new");
    CHECK(fs::is_symlink(s.dir / "link.json"));
    CHECK(fs::read_symlink(s.dir / "link.json") == "target.json");
    CHECK(slurp(s.dir / "target.json") == "new");
    CHECK_THAT(s.names(), Equals(std::vector<std::string>{"link.json", "target.json"}));
}

TEST_CASE("a link into another folder writes the temporary file in the target's folder",
          "[safe_write]") {
    Scratch s("link-folder");
    fs::create_directories(s.dir / "a");
    fs::create_directories(s.dir / "b");
    put(s.dir / "b" / "real.json", "old");
    // A relative link from a/ into b/, and a chain: an absolute link to that link.
    fs::create_symlink("../b/real.json", s.dir / "a" / "near.json");
    fs::create_symlink(s.dir / "a" / "near.json", s.dir / "far.json");
    rv::write_file_safely(s.dir / "far.json", "new");
    CHECK(fs::is_symlink(s.dir / "far.json"));
    CHECK(fs::is_symlink(s.dir / "a" / "near.json"));
    CHECK(slurp(s.dir / "b" / "real.json") == "new");
    // No temporary file left in any of the folders, and none made beside the links.
    CHECK(std::distance(fs::directory_iterator(s.dir / "a"), fs::directory_iterator()) == 1);
    CHECK(std::distance(fs::directory_iterator(s.dir / "b"), fs::directory_iterator()) == 1);
    // A dangling link is written through to the file it names.
    fs::create_symlink("b/new.json", s.dir / "dangling.json");
    rv::write_file_safely(s.dir / "dangling.json", "fresh");
    CHECK(fs::is_symlink(s.dir / "dangling.json"));
    CHECK(slurp(s.dir / "b" / "new.json") == "fresh");
}

TEST_CASE("a device a FIFO a socket or a directory is refused and left alone", "[safe_write]") {
    Scratch s("special");
    // As root a broken writer could rename over the system's /dev/null: use a private node of the
    // same device (1, 3) then. Anyone else may not replace /dev/null, so it is safe to aim at.
    fs::path null_device = "/dev/null";
    if (::geteuid() == 0) {
        null_device = s.dir / "null";
        REQUIRE(::mknod(null_device.c_str(), S_IFCHR | 0666, makedev(1, 3)) == 0);
    }
    CHECK_THROWS_WITH(
        rv::write_file_safely(null_device, "x"),
        "cannot write " + null_device.string() + ": it is a character device, not a regular file");
    CHECK(fs::is_character_file(null_device));
    const fs::path fifo = s.dir / "pipe";
    REQUIRE(::mkfifo(fifo.c_str(), 0644) == 0);
    CHECK_THROWS_WITH(
        rv::write_file_safely(fifo, "x"),
        "cannot write " + fifo.string() + ": it is a FIFO (named pipe), not a regular file");
    CHECK(fs::is_fifo(fifo));
    const fs::path folder = s.dir / "folder";
    fs::create_directories(folder);
    CHECK_THROWS_WITH(
        rv::write_file_safely(folder, "x"),
        "cannot write " + folder.string() + ": it is a directory, not a regular file");
    CHECK(fs::is_directory(folder));
    // A link to a device names both.
    fs::create_symlink(null_device, s.dir / "null-link");
    CHECK_THROWS_WITH(rv::write_file_safely(s.dir / "null-link", "x"),
                      "cannot write " + (s.dir / "null-link").string() + " (a link to " +
                          null_device.string() + "): it is a character device, not a regular file");
    CHECK(fs::is_symlink(s.dir / "null-link"));
    const fs::path sock = s.dir / "sock";
    const int fd = ::socket(AF_UNIX, SOCK_STREAM, 0);
    REQUIRE(fd >= 0);
    sockaddr_un addr{};
    addr.sun_family = AF_UNIX;
    std::snprintf(addr.sun_path, sizeof addr.sun_path, "%s", sock.c_str());
    REQUIRE(::bind(fd, reinterpret_cast<sockaddr*>(&addr), sizeof addr) == 0);
    CHECK_THROWS_WITH(rv::write_file_safely(sock, "x"),
                      "cannot write " + sock.string() + ": it is a socket, not a regular file");
    ::close(fd);
    CHECK(fs::is_socket(sock));
    // Nothing else appeared: no temporary file was made for any of them.
    std::vector<std::string> expected{"folder", "null-link", "pipe", "sock"};
    if (null_device.parent_path() == s.dir) expected.insert(expected.begin() + 1, "null");
    CHECK_THAT(s.names(), Equals(expected));
}

TEST_CASE("the input file is refused however it is named", "[safe_write]") {
    Scratch s("input");
    const fs::path input = s.dir / "in.json";
    put(input, "input");
    fs::create_symlink("in.json", s.dir / "alias.json");
    rv::SafeWriteRules rules;
    rules.must_not_be = input;
    rules.how_to_replace_it = "write elsewhere and move it";
    for (const fs::path& spelling : {input, s.dir / "." / "in.json", s.dir / "alias.json"}) {
        CHECK_THROWS_WITH(
            rv::write_file_safely(spelling, "output", rules),
            Contains("it is the input file " + input.string() + "; write elsewhere and move it"));
    }
    CHECK(slurp(input) == "input");
    // Another file, and the input named through a link as the rule, are told apart by identity.
    rules.must_not_be = s.dir / "alias.json";
    CHECK_THROWS(rv::write_file_safely(input, "output", rules));
    rv::write_file_safely(s.dir / "out.json", "output", rules);
    CHECK(slurp(s.dir / "out.json") == "output");
    CHECK(slurp(input) == "input");
}

TEST_CASE("the replaced file keeps its permissions and owner", "[safe_write]") {
    Scratch s("mode");
    const fs::path p = s.dir / "private.json";
    put(p, "old");
    REQUIRE(::chmod(p.c_str(), 0600) == 0);
    rv::write_file_safely(p, "new");
    CHECK(mode_of(p) == 0600);
    REQUIRE(::chmod(p.c_str(), 0640) == 0);
    rv::write_file_safely(p, "newer");
    CHECK(mode_of(p) == 0640);
    CHECK(slurp(p) == "newer");
    // A new file: 0666 less the umask, as any program's new file.
    const mode_t before = ::umask(027);
    rv::write_file_safely(s.dir / "fresh.json", "x");
    ::umask(before);
    CHECK(mode_of(s.dir / "fresh.json") == 0640);
    if (::geteuid() == 0) {
        // Root gives the new file the old one's owner and group (65534: nobody/nogroup).
        REQUIRE(::chown(p.c_str(), 65534, 65534) == 0);
        rv::write_file_safely(p, "as root");
        struct stat st {};
        REQUIRE(::stat(p.c_str(), &st) == 0);
        CHECK(st.st_uid == 65534);
        CHECK(st.st_gid == 65534);
        CHECK((st.st_mode & 07777) == 0640);
    }
}

TEST_CASE("a file with several hard links is refused", "[safe_write]") {
    Scratch s("hardlink");
    const fs::path p = s.dir / "a.json";
    put(p, "shared");
    fs::create_hard_link(p, s.dir / "b.json");
    CHECK_THROWS_WITH(
        rv::write_file_safely(p, "new"),
        "cannot write " + p.string() +
            ": it has 2 hard links, and replacing it would part it from the others, which would "
            "keep the old content (write to another name, or remove the other links first)");
    CHECK(slurp(p) == "shared");
    CHECK(fs::hard_link_count(p) == 2);
    CHECK_THAT(s.names(), Equals(std::vector<std::string>{"a.json", "b.json"}));
}

TEST_CASE("a read-back check that refuses leaves the old file", "[safe_write]") {
    Scratch s("check");
    const fs::path p = s.dir / "f.txt";
    put(p, "old");
    rv::SafeWriteRules rules;
    std::string seen;
    rules.check_read_back = [&seen](std::string_view back) {
        seen = back;
        return std::string("not wanted");
    };
    CHECK_THROWS_WITH(
        rv::write_file_safely(p, "new", rules),
        "cannot write " + p.string() + ": what was written does not read back: not wanted");
    CHECK(seen == "new");  // the check saw the file's bytes
    CHECK(slurp(p) == "old");
    CHECK_THAT(s.names(), Equals(std::vector<std::string>{"f.txt"}));
}

TEST_CASE("save_layout refuses NaN and infinity and a layout that does not read back",
          "[safe_write]") {
    Scratch s("layout");
    const fs::path p = s.dir / "l.json";
    rv::Layout nan_layout = demo();
    nan_layout.beams[0].wavelength_nm = std::numeric_limits<double>::quiet_NaN();
    CHECK_THROWS_WITH(
        rv::save_layout(nan_layout, p),
        "cannot write " + p.string() +
            ": the layout holds a value that is not a finite number (NaN or infinity) at "
            "/beams/0/wavelength_nm, which a layout file cannot hold");
    rv::Layout inf_layout = demo();
    inf_layout.elements[1].at_mm = rv::Vec2(0, std::numeric_limits<double>::infinity());
    CHECK_THROWS_WITH(rv::save_layout(inf_layout, p), Contains("at /elements/1/at_mm/1,"));
    CHECK(rv::unwritable_reason(demo()).empty());
    // Writable numbers the reader refuses (a negative aperture): refused after the read-back.
    rv::Layout negative = demo();
    negative.elements[0].aperture_mm = -1;
    CHECK_THROWS_WITH(rv::save_layout(negative, p),
                      Contains("what was written does not read back: /elements/0/aperture_mm: "));
    CHECK(s.names().empty());
    rv::save_layout(demo(), p);
    CHECK(slurp(p) == rv::write_layout(demo()));
}
