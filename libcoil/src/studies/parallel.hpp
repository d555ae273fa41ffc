// Internal: a loop over [0, total) on several threads. Workers take chunks from a shared counter; the
// calling thread works too and alone reports progress. Each worker k gets its own state (state[k]), so
// that nothing is shared while it runs.
#pragma once

#include <algorithm>
#include <atomic>
#include <chrono>
#include <cstddef>
#include <functional>
#include <thread>
#include <vector>

namespace libcoil::detail {

template <class State, class Work>
void parallel_chunks(std::size_t total, std::vector<State>& state, const Work& work,
                     const std::function<void(std::size_t, std::size_t)>& progress, std::size_t chunk = 256) {
    std::atomic<std::size_t> next{0}, done{0};
    const auto run = [&](std::size_t k, bool report) {
        auto last = std::chrono::steady_clock::now();
        for (std::size_t start; (start = next.fetch_add(chunk)) < total;) {
            const std::size_t end = std::min(total, start + chunk);
            for (std::size_t i = start; i < end; ++i) work(i, state[k]);
            done.fetch_add(end - start);
            if (report && std::chrono::steady_clock::now() - last > std::chrono::milliseconds(200)) {
                progress(done.load(), total);
                last = std::chrono::steady_clock::now();
            }
        }
    };
    std::vector<std::thread> pool;
    for (std::size_t k = 1; k < state.size(); ++k) pool.emplace_back(run, k, false);
    run(0, static_cast<bool>(progress));
    for (auto& t : pool) t.join();
    if (progress) progress(total, total);
}

}  // namespace libcoil::detail
