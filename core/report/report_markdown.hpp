#pragma once
// The report as Markdown (`rendezvous report --markdown`): the verdict as a table, each beam at
// the target, delay, overlap, stage, the phase-matching table, findings and the laser-safety
// cautions. The one place the report's Markdown is worded.

#include <ostream>
#include <string>

#include "analysis/report.hpp"

namespace rv {

void write_report_markdown(const RendezvousReport& r, std::ostream& out);
std::string report_markdown(const RendezvousReport& r);

}  // namespace rv
