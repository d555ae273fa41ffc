// Wire-harmonic solver: skin and proximity effect of coaxial round-wire rings, by Bessel harmonics.
//
// Method:  inside a round wire the current density obeys the diffusion equation
//          lap J = j omega mu0 sigma J, whose solutions regular at the wire's axis are the cylindrical
//          harmonics J_m(kappa rho) {cos, sin}(m theta), kappa = (1 - j) / delta. Each turn's current is a sum
//          of them up to order M, normalised to 1 at the surface. Then J / sigma + j omega A - V / (2 pi r)
//          is harmonic inside the wire, so it vanishes everywhere if it vanishes on the surface: the
//          equations are its Fourier coefficients on each wire's circle (Q points, trapezoid rule), and the
//          unknowns each turn's harmonics and its voltage (every turn carries the same current, in series).
//          A harmonic of order m >= 1 acts outside its wire as a 2-D multipole of order m, its strength
//          in closed form, mu0 a^(m+2) s_m / (2 m) with s_m = J_{m+1}(kappa a) / (kappa a J_m(kappa a))
//          (backward recurrence); the net current (m = 0) acts as Maxwell's ring at the wire's centre, so
//          the field of the coil at every wire keeps the rings' exact curvature. The 2-D multipoles carry
//          the curvature only as sqrt(R_source / r), an error of order (wire radius / ring radius) in the
//          proximity currents' own back-reaction (measured against the cross-section solver).
//          A grounded coaxial tube (a shield) enters as a perfect conductor: the image field of the
//          turns' net currents from shield.hpp's wall model is added to every wire's field (optional).
// Source:  the harmonic expansion of eddy currents in round conductors: J. Lammeraner and M. Stafl, "Eddy
//          Currents" (1966); the equivalent method of moments with cylindrical harmonics, e.g.
//          J. A. Tegopoulos and E. E. Kriezis, "Eddy Currents in Linear Conducting Media" (1985) (from
//          memory); Maxwell (1873) for the rings.
// Domain:  whole turns as parallel rings, non-magnetic wire, wires not overlapping (pitch >= wire diameter),
//          any frequency (DC by the low-frequency limit). M grows with the closeness of the turns and
//          with wire diameter / skin depth (harmonics_for).
// Accuracy: against the cross-section solver and the finite-element reference (tests/reference/fem):
//          see docs/models.md and tests/cpp/test_wire_harmonics.cpp.
#pragma once

#include <cstddef>
#include <optional>
#include <utility>
#include <vector>

#include "libcoil/models/cross_section.hpp"
#include "libcoil/models/materials.hpp"
#include "libcoil/models/solenoid.hpp"
#include "libcoil/spec/records.hpp"

namespace libcoil {

// The solver's measured error against the finite-element reference (tests/python/test_fem_reference.py
// enforces it), for reports.
inline constexpr const char* wire_harmonics_measured_error =
    "R -0.04 .. +0.61 %, L -0.26 .. -0.08 % (six bare coils 100 kHz .. 30 MHz, three in copper tubes to 1 MHz)";

// The number of harmonics per wire that holds R to 0.1 % of a converged solution (measured in
// tests/cpp/test_wire_harmonics.cpp) at pitch / wire diameter `pitch_to_wire` and wire diameter / skin
// depth `d_over_delta`.
int harmonics_for(double pitch_to_wire, double d_over_delta);

// The unknowns the solver takes for `coil` at `frequency` (its cost grows as their cube: 576 take 0.15 s a
// frequency on one core, 1800 take 2.7 s).
std::size_t wire_harmonic_unknowns(const Solenoid& coil, double resistivity, double frequency);
// The same for `turns` (rounded to the whole rings the solver takes) at `pitch_to_wire` and `d_over_delta`.
std::size_t harmonic_unknowns_for(double turns, double pitch_to_wire, double d_over_delta);

// Where libcoil takes the solver by default: non-magnetic wire, a mean diameter of at least
// min_harmonic_diameter_ratio wire diameters, and at most `max_unknowns` at the highest frequency asked for
// (beyond, the cross-section solver or the closed forms, with a warning where a report is made).
// The diameter ratio: the multipoles carry the rings' curvature to first order in wire radius / ring
// radius, and on the cross-section grid (tests/reference/cross_section) coils of D/d 3.4 .. 5.8 read R up
// to 2.4 % high (the ratio R(f) / R(0) 3.0 %) against the filament solver; from D/d 6 on, within
// -0.27 .. +1.41 %.
inline constexpr std::size_t default_max_harmonic_unknowns = 1000;
inline constexpr double min_harmonic_diameter_ratio = 6;
// Wire too fat for the solver: a mean diameter under min_harmonic_diameter_ratio wire diameters.
inline bool fat_wire(const Solenoid& coil) { return coil.mean_radius() < min_harmonic_diameter_ratio * coil.wire().radius(); }
bool wire_harmonics_apply(const Solenoid& coil, const Conductor& conductor, double temperature, double highest_frequency,
                          std::size_t max_unknowns = default_max_harmonic_unknowns);

class WireHarmonicSolver {
public:
    // The coil's whole turns centred on z = 0; `harmonics` 0 chooses by harmonics_for at each frequency.
    // `shield`: a coaxial tube around the turns (shield.hpp's ring model gives its wall currents).
    WireHarmonicSolver(const Solenoid& coil, double resistivity, int harmonics = 0, std::optional<ShieldSpec> shield = {});
    // Explicit rings (radius, axial position) of one wire radius.
    WireHarmonicSolver(std::vector<std::pair<double, double>> ring_centres, double wire_radius, double resistivity,
                       int harmonics = 0, std::optional<ShieldSpec> shield = {});

    // R and L of the rings in series (L including the internal inductance). f = 0 gives the DC limit.
    RingImpedance solve(double frequency) const;
    // The same at each of `frequencies`, to the bit: the kernel's terms that depend on the geometry alone
    // (Maxwell's formula at each wire's collocation points, most of a solve's assembly) are computed once for
    // all the frequencies that take the same number of harmonics. On up to `threads` threads (0: the
    // hardware's), each taking a run of neighbouring frequencies of about equal cost with kernels of its
    // own: the figures the same to the bit whatever the threads.
    std::vector<RingImpedance> solve(const std::vector<double>& frequencies, unsigned threads = 1) const;

    std::size_t turns() const { return rings_.size(); }

private:
    struct Kernel;  // the geometric terms at one count of collocation points
    RingImpedance solve(double frequency, std::vector<Kernel>& kept) const;
    double solved_frequency(double frequency) const;  // `frequency`, or DC's stand-in for 0
    int harmonics_at(double frequency) const;          // the harmonics a solve at `frequency` takes
    // The kernel at the collocation points whose angles have these cosines and sines: from `kept`, or computed
    // and added to it.
    const Kernel& kernel(const std::vector<double>& cth, const std::vector<double>& sth, std::vector<Kernel>& kept,
                         const std::vector<int>& reps) const;

    std::vector<std::pair<double, double>> rings_;
    double wire_radius_, resistivity_;
    int harmonics_;
    std::optional<ShieldSpec> shield_;
    double min_gap_ = 0;  // smallest centre distance over the wire diameter
    std::vector<int> partner_;  // each ring's mirror image in z (itself without the symmetry)
    bool mirror_ = false;
};

}  // namespace libcoil
