// Internal: the last few results of an expensive model call, kept per thread under exact keys (no tolerance:
// a result is reused only for inputs equal to the bit, so reuse never changes a figure). The turn network
// keeps its near-field sections and its bodies' reaction on the rings this way: one analysis, and a design
// search's confirmation followed by its analysis, ask for the same ones several times.
#pragma once

#include <cstddef>
#include <utility>
#include <vector>

namespace libcoil::detail {

template <class Key, class Value, std::size_t size = 8>
class RecentResults {
public:
    const Value* find(const Key& key) const {
        for (const auto& [k, v] : entries_) {
            if (k == key) return &v;
        }
        return nullptr;
    }
    void add(Key key, Value value) {
        if (entries_.size() >= size) entries_.erase(entries_.begin());  // the oldest
        entries_.emplace_back(std::move(key), std::move(value));
    }

private:
    std::vector<std::pair<Key, Value>> entries_;
};

}  // namespace libcoil::detail
