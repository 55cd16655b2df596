#pragma once
// The report as plain text (`rendezvous report`, the default): the verdict, each beam at the
// target, power and polarization, mismatch, overlap, stage, phase matching, focusing, findings
// and the laser-safety cautions. The one place the report's text is worded.

#include <ostream>
#include <string>

#include "analysis/report.hpp"

namespace rv {

void write_report_text(const RendezvousReport& r, std::ostream& out);
std::string report_text(const RendezvousReport& r);

// The verdict's three lines as the report prints them ("  space  met  waists …\n"), each
// followed by "         -> ACTION" when with_actions and it has one (the tolerance command
// prints them without).
std::string verdict_text(const Verdict& v, bool with_actions);

}  // namespace rv
