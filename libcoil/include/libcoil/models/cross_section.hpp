// Cross-section filament solver: skin and proximity effect together, the numerical reference.
//
// Method:  axisymmetric partial-element model. Each turn is a ring of the mean radius; its round cross-
//          section is split into coaxial sub-filament rings on a polar grid whose layers thin towards the
//          surface (geometric grading) so that the skin depth is resolved. Sub-filament k has resistance
//          rho 2 pi r_k / A_k and self-inductance from the ring formula (ring_inductance.hpp) at the
//          radius whose geometric mean distance matches its cell (exact GMD of a rectangle); mutuals come
//          from Maxwell's formula (coaxial_mutual.hpp), between centroids for distant cells and at the
//          numerically averaged geometric mean distance for near ones, since graded cells are thin. Every sub-filament of a turn sees the turn's voltage, and every turn
//          carries the same current (series connection):
//              Z i = E V,  E^T i = I 1,  Z_coil = 1^T V / I.
//          The dense complex system is solved with Eigen's LU, halved by the coil's mirror symmetry about
//          its mid-plane. At f = 0 the currents follow the conductances and L is the energy integral.
// Source:  A. E. Ruehli, "Equivalent circuit models for three-dimensional multiconductor systems",
//          IEEE Trans. MTT 22 (1974) 216 (partial elements); Maxwell (1873) for the mutuals.
// Domain:  whole turns as parallel rings (no pitch angle), non-magnetic conductor, frequencies where the
//          outer layer is no thicker than a third of the skin depth (`resolved` says so).
// Accuracy: see docs/models.md, measured by tests/cpp/test_cross_section.cpp: convergence with the
//          subdivision, the isolated ring against the Bessel solution, DC against the filament model.
#pragma once

#include <cstddef>
#include <utility>
#include <vector>

#include "libcoil/models/solenoid.hpp"

namespace libcoil {

struct Subdivision {
    int layers = 8;         // radial layers across the wire radius; the innermost is a disc
    double grading = 1.3;   // thickness ratio of each layer to the one outside it
    int sectors = 16;       // angular cells in every annulus
};

// The coarsest subdivision (at least 8 layers, grading 1.3, two sectors per layer) whose outer layer is no
// thicker than a third of `skin_depth`, at most 24 layers. That is the 1 % criterion the tests measured:
// (8, 1.3, 16) meets it to x = 10 and is within 0.5 % there; at x = 30 an outer layer of 0.9 delta was
// 4.8 % low, 0.29 delta 1.2 % and 0.15 delta 0.8 %.
Subdivision subdivision_for(double wire_radius, double skin_depth);

// The coil's whole turns as rings (mean radius, axial position): turns() rounded to the nearest whole
// number, at least 1, centred on z = 0. Both ring solvers (this one and wire_harmonics.hpp) take them.
std::vector<std::pair<double, double>> coil_ring_centres(const Solenoid& coil);

struct RingImpedance {
    double frequency = 0;    // Hz
    double resistance = 0;   // ohm
    double inductance = 0;   // H, including the internal inductance
    bool resolved = true;    // the outer layer is no thicker than a third of the skin depth (the 1 % criterion)
    // The wire-harmonic solver in a shield: the part of R and L the wall's currents add at the terminals
    // (its eddy loss, its change of L); resistance and inductance above include them.
    double wall_resistance = 0;   // ohm
    double wall_inductance = 0;   // H (negative)
};

class CrossSectionSolver {
public:
    // The coil's whole turns (turns() rounded to the nearest whole number, at least 1), centred on z = 0.
    CrossSectionSolver(const Solenoid& coil, double resistivity, Subdivision sub = {});
    // Explicit rings (radius, axial position) of one wire radius; for tests and references. The mirror
    // symmetry is used only if the set of rings is symmetric about z = 0.
    CrossSectionSolver(std::vector<std::pair<double, double>> ring_centres, double wire_radius, double resistivity,
                       Subdivision sub = {});

    RingImpedance solve(double frequency) const;

    std::size_t filaments() const { return cells_.size(); }
    std::size_t unknowns() const { return orbits_.size(); }

private:
    struct Cell {
        double r, z;       // ring radius and axial position of the sub-filament
        double area;       // cross-section
        int turn;
        int shape;         // index into the cross-section template
    };
    void build(const Subdivision& sub);

    std::vector<std::pair<double, double>> rings_;
    double wire_radius_, resistivity_, outer_layer_ = 0;
    std::vector<Cell> cells_;
    std::vector<double> self_;                 // self-inductance of each cell's ring
    std::vector<std::vector<int>> orbits_;     // cells identified by the mirror symmetry
    std::vector<int> turn_orbit_of_turn_;      // turn -> turn orbit
    std::vector<int> turn_orbit_multiplicity_;
    std::vector<double> mutual_reduced_;       // orbits x orbits, row-major: sum over the column orbit
};

}  // namespace libcoil
