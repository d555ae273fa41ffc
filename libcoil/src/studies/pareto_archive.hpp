// Internal: the design search's Pareto set, an epsilon-Pareto archive over loss, size and SRF margin.
#pragma once

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <utility>
#include <vector>

#include "libcoil/studies/design.hpp"

namespace libcoil::detail {

// The Pareto set is kept as an epsilon-Pareto archive (Laumanns, Thiele, Deb & Zitzler, Evolutionary
// Computation 10 (2002) 263): each figure is binned on a log scale of ratio 1 + epsilon, a design whose
// box is dominated by an archived box is dropped, and one box holds one design. Designs within 0.5 %
// on all three figures count as one, which keeps the set small and the insertion cheap.
constexpr double archive_epsilon = 0.005;

struct Box {
    int loss, size, srf;
    bool operator==(const Box&) const = default;
    bool at_or_below(const Box& o) const { return loss <= o.loss && size <= o.size && srf <= o.srf; }
};

inline bool dominates(const DesignFigures& a, const DesignFigures& b, double ceiling) {
    const double la = a.loss_metric(), lb = b.loss_metric(), va = a.volume, vb = b.volume;
    const double sa = a.srf_metric(ceiling), sb = b.srf_metric(ceiling);
    return la <= lb && va <= vb && sa <= sb && (la < lb || va < vb || sa < sb);
}

inline const double box_step = std::log1p(archive_epsilon);

// The archive stores box coordinates as 16-bit integers (half the work of its scans). A coordinate of
// 32767 bins is a figure of e^163, or 1e71 of its unit: clamping there touches no real design.
inline int bin(double figure) { return static_cast<int>(std::clamp(std::floor(std::log(figure) / box_step), -32767.0, 32767.0)); }

inline Box box_of(const DesignFigures& d, double ceiling) {
    return {bin(d.loss_metric()), bin(d.volume), bin(d.srf_metric(ceiling))};
}

// Distance of a design from its box's lower corner, in bins: the tie-break within one box.
inline double corner_distance(const DesignFigures& d, const Box& b, double ceiling) {
    const double x = std::log(d.loss_metric()) / box_step - b.loss;
    const double y = std::log(d.volume) / box_step - b.size;
    const double z = std::log(d.srf_metric(ceiling)) / box_step - b.srf;
    return x * x + y * y + z * z;
}

inline double snap_of(const DesignFigures& d) { return std::fabs(d.turns - d.turns_solved); }

// The boxes, one array per figure, and their designs beside them: the dominance scan reads only the
// small integer arrays, in blocks the compiler vectorises.
class Archive {
public:
    explicit Archive(double ceiling = 0) : ceiling_(ceiling) {}

    void add(const DesignFigures& d) {
        const Box b = box_of(d, ceiling_);
        if (const std::size_t i = first_at_or_below(b); i < designs_.size()) {
            if (box(i) == b) {  // one design per box: the dominating one, else the nearer to the corner
                DesignFigures& f = designs_[i];
                if (dominates(f, d, ceiling_)) return;
                const double to_d = corner_distance(d, b, ceiling_), to_f = corner_distance(f, b, ceiling_);
                // Of one coil reached from several grid pitches, the one whose solved turns lie nearest the snapped.
                if (dominates(d, f, ceiling_) || to_d < to_f || (to_d == to_f && snap_of(d) < snap_of(f))) f = d;
                return;
            }
            // Dominated. Neighbouring candidates tend to fall to the same box: move it forward, so that
            // the next scan usually stops early. The archive's content does not depend on its order.
            if (i > 0) swap(i, i / 2);
            return;
        }
        // A new box: it drops the boxes it dominates (none equals it, or the scan would have found it).
        // Most new boxes dominate none, which the vectorised scan says before any is touched.
        if (any_at_or_above(b)) {
            for (std::size_t i = designs_.size(); i-- > 0;) {
                if (b.at_or_below(box(i))) {
                    swap(i, designs_.size() - 1);
                    loss_.pop_back();
                    size_.pop_back();
                    srf_.pop_back();
                    designs_.pop_back();
                }
            }
        }
        loss_.push_back(static_cast<std::int16_t>(b.loss));
        size_.push_back(static_cast<std::int16_t>(b.size));
        srf_.push_back(static_cast<std::int16_t>(b.srf));
        designs_.push_back(d);
    }

    const std::vector<DesignFigures>& designs() const { return designs_; }
    std::vector<DesignFigures> take() { return std::move(designs_); }

private:
    Box box(std::size_t i) const { return {loss_[i], size_[i], srf_[i]}; }

    // The box in the stored width, so that the scans compare 16-bit integers (bin() keeps it in range).
    struct Narrow {
        std::int16_t loss, size, srf;
        explicit Narrow(const Box& b)
            : loss(static_cast<std::int16_t>(b.loss)), size(static_cast<std::int16_t>(b.size)), srf(static_cast<std::int16_t>(b.srf)) {}
    };
    static constexpr std::size_t block = 16;  // scanned with a fixed count and no branch: vector instructions

    // The first box at or below b in every figure, or size() if none.
    std::size_t first_at_or_below(const Box& box_b) const {
        const Narrow b(box_b);
        const std::size_t n = designs_.size();
        std::size_t start = 0;
        for (; start + block <= n; start += block) {
            std::int16_t any = 0;
            for (std::size_t j = 0; j < block; ++j) {
                const std::size_t i = start + j;
                any |= static_cast<std::int16_t>((loss_[i] <= b.loss) & (size_[i] <= b.size) & (srf_[i] <= b.srf));
            }
            if (!any) continue;
            for (std::size_t i = start; i < start + block; ++i) {
                if (box(i).at_or_below(box_b)) return i;
            }
        }
        for (std::size_t i = start; i < n; ++i) {
            if (box(i).at_or_below(box_b)) return i;
        }
        return n;
    }

    // Whether any box is at or above b in every figure.
    bool any_at_or_above(const Box& box_b) const {
        const Narrow b(box_b);
        const auto above = [&](std::size_t i) {
            return static_cast<std::int16_t>((loss_[i] >= b.loss) & (size_[i] >= b.size) & (srf_[i] >= b.srf));
        };
        const std::size_t n = designs_.size();
        std::int16_t any = 0;
        std::size_t start = 0;
        for (; start + block <= n; start += block) {
            for (std::size_t j = 0; j < block; ++j) any |= above(start + j);
        }
        for (std::size_t i = start; i < n; ++i) any |= above(i);
        return any != 0;
    }

    void swap(std::size_t i, std::size_t j) {
        std::swap(loss_[i], loss_[j]);
        std::swap(size_[i], size_[j]);
        std::swap(srf_[i], srf_[j]);
        std::swap(designs_[i], designs_[j]);
    }

    double ceiling_;
    std::vector<std::int16_t> loss_, size_, srf_;
    std::vector<DesignFigures> designs_;
};

}  // namespace libcoil::detail
