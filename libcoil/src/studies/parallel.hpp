// Internal: loops on several threads.
// parallel_chunks: a loop over [0, total). Workers take chunks from a shared counter; the calling thread
// works too and alone reports progress. Each worker k gets its own state (state[k]), so that nothing is
// shared while it runs.
#pragma once

#include <algorithm>
#include <atomic>
#include <chrono>
#include <cstddef>
#include <functional>
#include <mutex>
#include <optional>
#include <thread>
#include <type_traits>
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

// Items [0, total) on `threads` threads (the calling one too), taken in order from a shared counter, their
// results handed to take(i, result) strictly in the order of i, one at a time, until take returns false.
// Work already begun past that point is discarded, so the outcome is the one-thread one. Work that takes
// (i, stopped) may read `stopped` and give up early once it is set: its result will not be taken (the
// design search's checks, a retarget and confirmation of 10 ... 20 ms each, had made the loop's end wait
// for them). The threads live for the whole loop: what they keep for their next item (solve_in_place.hpp)
// stays warm.
template <class Result, class Work, class Take>
void in_order_until(std::size_t total, unsigned threads, const Work& work, const Take& take) {
    std::vector<std::optional<Result>> results(total);
    std::atomic<std::size_t> next{0};
    std::atomic<bool> stop{false};
    std::mutex taking;
    std::size_t taken = 0;  // under `taking`
    const auto run = [&] {
        for (std::size_t i; !stop.load() && (i = next.fetch_add(1)) < total;) {
            Result r = [&] {
                if constexpr (std::is_invocable_v<const Work&, std::size_t, const std::atomic<bool>&>) return work(i, stop);
                else return work(i);
            }();
            const std::lock_guard<std::mutex> lock(taking);
            results[i] = std::move(r);
            for (; !stop.load() && taken < total && results[taken]; ++taken) {
                if (!take(taken, std::move(*results[taken]))) stop = true;
                results[taken].reset();
            }
        }
    };
    std::vector<std::thread> pool;
    for (unsigned k = 1; k < threads; ++k) pool.emplace_back(run);
    run();
    for (auto& t : pool) t.join();
}

}  // namespace libcoil::detail
