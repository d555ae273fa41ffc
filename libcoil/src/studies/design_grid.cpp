// The design search's grid: its candidates enumerated by index and screened on threads, and the candidates of
// one row that snap to the same turns checked once (design_search.hpp).
#include <algorithm>
#include <exception>
#include <string>

#include "studies/design_search.hpp"
#include "studies/parallel.hpp"

namespace libcoil::detail {

std::size_t grid_size(const Requirement& q) { return q.wires.size() * q.form_diameter.values().size() * q.pitch_ratio.values().size(); }

std::vector<Tally> screen_grid(const Requirement& q, const Evaluator& ev, unsigned threads,
                               const std::function<void(std::size_t, std::size_t)>& progress) {
    // The grid is enumerated by index, never stored: candidate i is (wire, diameter, ratio) in row-major order.
    const std::vector<double> diameters = q.form_diameter.values(), ratios = q.pitch_ratio.values();
    const std::size_t per_wire = diameters.size() * ratios.size(), total = q.wires.size() * per_wire;
    // The threads take chunks of whole wire-and-form rows where a row is short, so that the ratios of one row
    // that snap to the same turns are checked once (Tally::repeats). Outcomes repeat only within a chunk,
    // and the chunks' bounds do not depend on the threads: neither do the outcomes.
    const std::size_t chunk = ratios.size() <= 4096 ? std::max<std::size_t>(1, 256 / ratios.size()) * ratios.size() : 256;
    const auto candidate = [&](std::size_t i) {
        return Candidate{i / per_wire, diameters[(i % per_wire) / ratios.size()], ratios[i % ratios.size()], i / chunk};
    };
    std::vector<Tally> tallies(std::max(1u, threads), Tally{Archive(ev.ceiling())});
    parallel_chunks(total, tallies, [&](std::size_t i, Tally& t) { ev.evaluate(candidate(i), t); }, progress, chunk);
    return tallies;
}

void Evaluator::evaluate(const Candidate& c, Tally& t) const {
    t.repeats.recording = SIZE_MAX;
    try {
        check(c, t);
    } catch (const std::exception& e) {  // InputError, DomainError
        const std::string why = e.what();
        t.reject(Reason::model_domain, 10, [&] { return what(c) + ": " + why; });
    }
}

// A repeat that passed is offered to the front again as what c solved before the snap: the archive keeps, of
// such equal designs, the one whose solved turns lie nearest the snapped (pareto_archive.hpp), from whose
// grid pitch a retarget starts.
bool Evaluator::repeated(const Candidate& c, double turns, double solved, double grid_pitch, Tally& t) const {
    if (c.chunk == SIZE_MAX) return false;
    Tally::Repeats& r = t.repeats;  // (evaluate() has cleared its recording)
    if (r.chunk != c.chunk || r.wire != c.wire || r.form_diameter != c.form_diameter) {
        r.chunk = c.chunk;
        r.wire = c.wire;
        r.form_diameter = c.form_diameter;
        r.outcomes.clear();
    }
    for (std::size_t i = r.outcomes.size(); i-- > 0;) {
        const Tally::Outcome& o = r.outcomes[i];
        if (o.turns != turns) continue;
        if (!o.done) break;  // its check ended in neither (it cannot; then c is checked afresh)
        if (o.feasible) {
            ++t.feasible;
            DesignFigures d = o.design;
            d.turns_solved = solved;
            d.pitch_before_trim = grid_pitch;
            t.front.add(d);
        } else {
            // Never the closest miss: the first of them, counted in this tally, was at least as close.
            t.reject(o.reason, o.excess, [&] { return what(c) + ": the same coil as a lower pitch ratio's"; });
        }
        return true;
    }
    r.outcomes.push_back({turns});
    r.recording = r.outcomes.size() - 1;
    return false;
}

}  // namespace libcoil::detail
