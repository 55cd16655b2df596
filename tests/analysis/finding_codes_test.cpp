// The finding codes are a contract: unique, and every one listed in the user guide's table
// (docs/user-guide.md, The report, Findings).
#include <fstream>
#include <set>
#include <sstream>

#include "findings/finding.hpp"
#include "support/tolerance.hpp"

TEST_CASE("every finding code is unique or shared on purpose and listed in the user guide", "[findings]") {
    std::ifstream in(std::string(RV_SOURCE_DIR) + "/docs/user-guide.md");
    REQUIRE(in);
    std::stringstream guide;
    guide << in.rdbuf();
    std::set<std::string> codes;
    for (const rv::Finding::Kind k : rv::all_finding_kinds()) {
        const std::string code = rv::finding_code(k);
        CAPTURE(code);
        CHECK(code != "finding");  // every kind has its own entry in finding_code
        // The table row: "| `code` | severity |".
        const std::string row = "| `" + code + "` | " + rv::severity_name(rv::finding_severity(k)) + " |";
        CHECK(guide.str().find(row) != std::string::npos);
        codes.insert(code);
    }
    // Intensity and fluence damage share "damage" (one code since the first release).
    CHECK(codes.size() + 1 == rv::all_finding_kinds().size());
}
