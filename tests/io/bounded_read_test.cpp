// The one bounded reader (io/bounded_read.hpp): the limit is exact, a file of another type is
// refused by its type, and the lens catalog and the layout reader go through it.
#include <sys/stat.h>
#include <unistd.h>

#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <string>

#include "io/bounded_read.hpp"
#include "io/diagnostic.hpp"
#include "io/layout_reader.hpp"
#include "io/lens_catalog.hpp"
#include "materials/material_library.hpp"

namespace {

std::filesystem::path fresh_folder() {
    std::string pattern = (std::filesystem::temp_directory_path() / "rv-bounded-XXXXXX").string();
    REQUIRE(::mkdtemp(pattern.data()) != nullptr);
    return pattern;
}

void write(const std::filesystem::path& file, const std::string& text) {
    std::ofstream out(file, std::ios::binary);
    out << text;
}

}  // namespace

TEST_CASE("a file of exactly the limit is read and one byte more is refused", "[bounded_read]") {
    const std::filesystem::path folder = fresh_folder();
    write(folder / "ten.txt", std::string(10, 'a'));
    write(folder / "eleven.txt", std::string(11, 'a'));
    const rv::BoundedRead ten = rv::read_file_bounded(folder / "ten.txt", 10, "a test file");
    const rv::BoundedRead eleven = rv::read_file_bounded(folder / "eleven.txt", 10, "a test file");
    const rv::BoundedRead empty = rv::read_file_bounded(folder / "ten.txt", 0, "a test file");
    std::filesystem::remove_all(folder);
    CHECK(ten.ok());
    CHECK(ten.text == std::string(10, 'a'));
    CHECK(eleven.error == "the file has 11 bytes; a test file may have at most 10");
    CHECK(empty.error == "the file has 10 bytes; a test file may have at most 0");
}

TEST_CASE("a directory a device and a FIFO are refused by their type", "[bounded_read]") {
    const std::filesystem::path folder = fresh_folder();
    REQUIRE(::mkfifo((folder / "pipe").c_str(), 0600) == 0);
    // A FIFO with no writer: an ordinary open would wait here for ever.
    CHECK(rv::read_file_bounded(folder / "pipe", 100).error ==
          "not read: it is a FIFO (named pipe), not a regular file");
    CHECK(rv::read_file_bounded(folder, 100).error ==
          "not read: it is a directory, not a regular file");
    CHECK(rv::read_file_bounded("/dev/zero", 100).error ==
          "not read: it is a character device, not a regular file");
    CHECK(rv::read_file_bounded(folder / "missing", 100).error ==
          "cannot open the file for reading");
    std::filesystem::remove_all(folder);
}

TEST_CASE("the layout reader and the lens catalog read through the bounded reader",
          "[bounded_read]") {
    const rv::LayoutReadResult layout = rv::read_layout_file("/dev/zero");
    REQUIRE(layout.diagnostics.size() == 1);
    CHECK(rv::format_diagnostic(layout.diagnostics[0], "/dev/zero") ==
          "/dev/zero: error: not read: it is a character device, not a regular file");
    const rv::CatalogReadResult catalog =
        rv::read_lens_catalog("/dev/zero", rv::MaterialLibrary::builtin());
    REQUIRE(catalog.diagnostics.size() == 1);
    CHECK(catalog.diagnostics[0].message ==
          "not read: it is a character device, not a regular file");
}
