#pragma once
// A progress bar on stderr for long runs at a terminal: nothing when stderr is not a terminal
// (pipes, CI logs) or when the run ends within 0.3 s; redrawn at most ten times a second on one
// line, cleared when done.
#include <chrono>
#include <cstddef>
#include <mutex>
#include <string>

namespace rv::cli {

class ProgressBar {
public:
    explicit ProgressBar(std::string label);
    ~ProgressBar();  // clears the line if it was drawn
    void update(size_t done, size_t total);  // thread-safe

private:
    std::string label_;
    bool terminal_;
    bool drawn_ = false;
    std::chrono::steady_clock::time_point start_, last_;
    std::mutex mutex_;
};

}  // namespace rv::cli
