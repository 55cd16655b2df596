#include "cli/progress_bar.hpp"

#include <unistd.h>

#include <cstdio>

namespace rv::cli {

ProgressBar::ProgressBar(std::string label)
    : label_(std::move(label)), terminal_(isatty(STDERR_FILENO) == 1),
      start_(std::chrono::steady_clock::now()), last_(start_) {}

ProgressBar::~ProgressBar() {
    if (drawn_) std::fprintf(stderr, "\r\033[K");
}

void ProgressBar::update(size_t done, size_t total) {
    if (!terminal_ || total == 0) return;
    const std::lock_guard<std::mutex> lock(mutex_);
    const auto now = std::chrono::steady_clock::now();
    if (now - start_ < std::chrono::milliseconds(300) || now - last_ < std::chrono::milliseconds(100)) return;
    last_ = now;
    constexpr int kWidth = 30;
    const int filled = static_cast<int>(kWidth * done / total);
    std::fprintf(stderr, "\r%s [%.*s%*s] %zu/%zu", label_.c_str(), filled, "##############################",
                 kWidth - filled, "", done, total);
    std::fflush(stderr);
    drawn_ = true;
}

}  // namespace rv::cli
