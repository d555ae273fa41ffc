// Many coils at once: arrays in, arrays out, for sweeps over geometry and for numpy users (issue 20).
//
// Each element i is a coil (mean diameter, turns, pitch, bare wire diameter, enamel build), its conductor (an
// index into `conductors`), wire temperature and frequency. Two chains:
//   full   L: the recommended inductance (inductance.hpp: Rosa in its domain, else the filament sum);
//          R: the closed-form R_ac with skin and proximity effect (proximity.hpp's ac_resistance, no leads),
//          everywhere: `coil analyze` takes the cross-section solver instead for close-wound turns at x > 3,
//          where the closed form spreads from -22 % to +12 % (proximity.hpp);
//          SRF: the self-resonance's fast path (self_resonance.hpp with cross_checks false: the sheath helix,
//          solved to search_tolerance, Medhurst where it does not hold). It is not the analysis's recommended
//          SRF, the turn network (within 2 % of NEC2 on its set, about 1 ms a coil): the sheath helix reads
//          +16 .. +47 % above NEC2 for free-standing coils and -12 .. +18 % with one end grounded, so a
//          verdict against a band ceiling belongs to `coil analyze` or the band check;
//   light  L: Rosa's form; R: R_dc times the exact skin ratio (skin_effect.hpp's tables); SRF: Medhurst's
//          empirical formula for the capacitance (medhurst.hpp) with that L.
// Q = w L / R (0 at f = 0). A bad element gets a status and NaN figures, never an exception; its message is
// available from batch_message. Threads take chunks of 512 elements from a shared counter; within a chunk,
// eight coils at a time go through each model in turn (batch.cpp).
//
// Accuracy: the full chain is the analysis's own functions, so it agrees with `coil analyze` (its
// closed-form loss solver) to rounding, and its SRF with the analysis's sheath-helix figure to the search
// tolerance (tests/python/test_batch.py).
#pragma once

#include <cstdint>
#include <span>
#include <string>
#include <vector>

#include "libcoil/models/materials.hpp"

namespace libcoil {

enum class BatchChain { full, light };

enum class BatchStatus : std::uint8_t {
    ok = 0,
    bad_input = 1,      // an InputError: a figure out of range, a wire fatter than the pitch, ...
    outside_domain = 2, // a DomainError: no model holds, or a result out of double range
};

struct BatchInput {
    // Each of length n, or of length 1 for a value every element shares (n is the longest).
    std::span<const double> mean_diameter, turns, pitch, wire_diameter, insulation;  // m, turns
    std::span<const double> temperature;  // K
    std::span<const double> frequency;    // Hz, >= 0
    std::span<const std::uint16_t> conductor;  // index into conductors; empty: conductors[0] for all
    std::vector<Conductor> conductors;
    std::size_t size() const;
};

// Where the figures go: spans of length n the caller owns (numpy's arrays, say).
struct BatchOutputView {
    std::span<double> inductance, dc_resistance, resistance, q_factor, self_resonance;
    std::span<BatchStatus> status;
};

struct BatchOutput {
    std::vector<double> inductance;      // H
    std::vector<double> dc_resistance;   // ohm, at the temperature
    std::vector<double> resistance;      // ohm, at the frequency
    std::vector<double> q_factor;
    std::vector<double> self_resonance;  // Hz
    std::vector<BatchStatus> status;
};

// InputError only for the batch itself (lengths that differ, no conductor, an index past the table).
BatchOutput evaluate_batch(const BatchInput& input, BatchChain chain = BatchChain::full, unsigned threads = 0);
void evaluate_batch(const BatchInput& input, const BatchOutputView& out, BatchChain chain = BatchChain::full, unsigned threads = 0);
// What went wrong with element i ("" when it is fine): the InputError or DomainError message.
std::string batch_message(const BatchInput& input, std::size_t i, BatchChain chain = BatchChain::full);

}  // namespace libcoil
