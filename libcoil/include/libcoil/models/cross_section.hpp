// Cross-section filament solver: skin and proximity effect together, the numerical reference.
//
// Method:  axisymmetric partial-element model. Each turn is a ring of the mean radius; its round cross-
//          section is split into coaxial sub-filament rings on a polar grid whose layers thin towards the
//          surface (geometric grading) so that the skin depth is resolved. Sub-filament k has resistance
//          rho 2 pi r_k / A_k and self-inductance from the ring formula (ring_inductance.hpp) at the
//          radius whose geometric mean distance matches its cell (exact GMD of a rectangle); mutuals come
//          from Maxwell's formula (coaxial_mutual.hpp), between centroids for distant cells and at the
//          geometric mean distance for near ones: two sectors of one wire by the exact GMD of rectangles
//          (ring_inductance.hpp's rectangles_gmd, after an area-preserving map of the sectors) with a
//          sampled correction for the map, other pairs by averaging ln(distance) over Gauss samples.
//          Every sub-filament of a turn sees the turn's voltage, and every turn carries the same current
//          (series connection):
//              Z i = E V,  E^T i = I 1,  Z_coil = 1^T V / I.
//          The dense complex system is solved with Eigen's LU, halved by the coil's mirror symmetry about
//          its mid-plane. At f = 0 the currents follow the conductances and L is the energy integral.
//          In a shield, the wall's rings (shield.hpp's ShieldWall) are coupled to every cell.
// Source:  A. E. Ruehli, "Equivalent circuit models for three-dimensional multiconductor systems",
//          IEEE Trans. MTT 22 (1974) 216 (partial elements); Maxwell (1873) for the mutuals.
// Domain:  whole turns as parallel rings (no pitch angle), non-magnetic conductor, frequencies where the
//          outer layer is no thicker than a sixth of the skin depth (`resolved` says so).
// Accuracy: see docs/models.md, measured by tests/cpp/test_cross_section.cpp (convergence with the
//          subdivision, the isolated ring against the Bessel solution, DC against the filament model) and
//          tests/python/test_fem_reference.py (R and L against the finite-element set, bare and in tubes).
#pragma once

#include <complex>
#include <cstddef>
#include <optional>
#include <utility>
#include <vector>

#include "libcoil/models/solenoid.hpp"
#include "libcoil/spec/records.hpp"

namespace libcoil {

struct Subdivision {
    int layers = 8;         // radial layers across the wire radius; the innermost is a disc
    double grading = 1.3;   // thickness ratio of each layer to the one outside it
    int sectors = 16;       // angular cells in every annulus
};

// The coarsest subdivision (at least 8 layers, grading 1.3, two sectors per layer) whose outer layer is no
// thicker than a sixth of `skin_depth`, at most 30 layers. Measured against the isolated ring's Bessel
// solution (a = 200 mm, r = 1 mm): at d / delta 30 .. 166 an outer layer of delta / 2.6 reads R 0.7 % low,
// delta / 4.5 0.1 % low, and finer ones converge to +0.19 % (the grading's own error; 1.2 gives +0.1 %).
// Against the finite-element set (tests/reference/fem) R is within 0.5 % at every point to d / delta 83.
// Cost: 1 + (layers - 1) x sectors cells a turn: at d / delta 100, 18 layers and 36 sectors, 613 cells a
// turn; a coil's block form (cross_section_blocks.cpp) solves 64 such turns in 27 s and 250 MB.
Subdivision subdivision_for(double wire_radius, double skin_depth);
// The rule's criterion: the outer layer no thicker than the skin depth over this.
inline constexpr double layers_per_skin_depth = 6;

// The solver's measured error against the finite-element set with subdivision_for's rule, for reports
// (tests/python/test_fem_reference.py enforces 0.5 % for R).
inline constexpr const char* cross_section_measured_error =
    "R -0.35 .. +0.47 %, L -0.19 .. -0.01 % (six bare coils 100 kHz .. 30 MHz, three in copper tubes to 1 MHz)";

// The coil's whole turns as rings (mean radius, axial position): turns() rounded to the nearest whole
// number, at least 1, centred on z = 0. Both ring solvers (this one and wire_harmonics.hpp) take them.
std::vector<std::pair<double, double>> coil_ring_centres(const Solenoid& coil);

struct RingImpedance {
    double frequency = 0;    // Hz
    double resistance = 0;   // ohm
    double inductance = 0;   // H, including the internal inductance
    bool resolved = true;    // the outer layer is no thicker than a sixth of the skin depth (the 0.5 % criterion)
    // In a shield: the part of R and L the wall's currents add at the terminals as the shield ring model
    // gives it (the wall driven by the turns as filaments: its eddy loss, its change of L); resistance and
    // inductance above include them, and the rest is the wires' own loss and L in the shield.
    double wall_resistance = 0;   // ohm
    double wall_inductance = 0;   // H (negative)
};

class CrossSectionSolver {
public:
    // The coil's whole turns (turns() rounded to the nearest whole number, at least 1), centred on z = 0.
    // In a shield, every cell is coupled to the wall's rings (shield.hpp's ShieldWall): the wall's currents
    // change the field at the wires, so that R is the wall's loss plus the wires' changed loss.
    CrossSectionSolver(const Solenoid& coil, double resistivity, Subdivision sub = {}, std::optional<ShieldSpec> shield = {});
    // Explicit rings (radius, axial position) of one wire radius; for tests and references. The mirror
    // symmetry is used only if the set of rings (and the shield) is symmetric about z = 0.
    CrossSectionSolver(std::vector<std::pair<double, double>> ring_centres, double wire_radius, double resistivity,
                       Subdivision sub = {}, std::optional<ShieldSpec> shield = {});

    RingImpedance solve(double frequency) const;

    std::size_t filaments() const { return cells_.size(); }
    // Complex unknowns of the system solved (the block form: every cell and every turn's voltage).
    std::size_t unknowns() const { return blocks_.empty() ? orbits_.size() : cells_.size() + rings_.size(); }

private:
    struct Cell {
        double r, z;       // ring radius and axial position of the sub-filament
        double area;       // cross-section
        int turn;
        int shape;         // index into the cross-section template
    };
    void build(const Subdivision& sub);
    // The shield's wall coupled to every cell (in a shield the dense system is not mirror-reduced, so its
    // unknowns are the cells too): the cells' impedance gains j w back drive (column-major, cells x wall
    // rings and wall rings x cells); `out` gets the wall's share.
    void wall_coupling(double frequency, std::vector<std::complex<double>>& back, std::vector<std::complex<double>>& drive,
                       RingImpedance& out) const;
    bool resolved_at(double frequency) const;       // the outer layer within skin depth / layers_per_skin_depth
    double cell_resistance(std::size_t cell) const;  // ohm, of the cell's ring
    // Coils of equal rings at a uniform pitch: the turns' couplings depend only on their distance, so one
    // block per distance (block Toeplitz) and an iterative solve (cross_section_blocks.cpp).
    RingImpedance solve_blocks(double frequency) const;

    std::vector<std::pair<double, double>> rings_;
    double wire_radius_, resistivity_, outer_layer_ = 0;
    std::optional<ShieldSpec> shield_;
    std::vector<Cell> cells_;
    std::vector<double> self_;                 // self-inductance of each cell's ring
    std::vector<std::vector<int>> orbits_;     // cells identified by the mirror symmetry
    std::vector<int> turn_orbit_of_turn_;      // turn -> turn orbit
    std::vector<int> turn_orbit_multiplicity_;
    std::vector<double> mutual_reduced_;       // orbits x orbits, row-major: sum over the column orbit
    // Block Toeplitz form (equal rings at a uniform pitch): blocks_[m] (C x C, row-major) couples cell q of
    // turn t with cell q' of turn t + m; C = cells_per_turn_. Empty: the dense form above.
    std::vector<std::vector<double>> blocks_;
    std::size_t cells_per_turn_ = 0;
};

}  // namespace libcoil
