// The winding as a network of coupled turns (PEEC, partial-element equivalent circuit): its resonances and
// its impedance between the terminals, from the turns' partial inductances and capacitances.
//
// Method:  one ring per turn (turn_filaments: a fractional N gives ceil(N) rings of N / ceil(N) turns each)
//          on the mean radius a, wire radius r, one branch each between N + 1 nodes.
//          Inductance: Maxwell's mutual inductance between rings (coaxial_mutual.hpp), each ring's own at
//          high frequency mu0 a (ln(8a/r) - 2) (the thin ring with its current on the surface, Rosa &
//          Grover as ring_inductance.hpp, less the internal quarter); and the helix's axial current, a
//          sheet segment of one pitch on the cylinder per turn, coupled to the others by mu0 / 4 pi times
//          the double integral of the azimuth-averaged 1 / R (Gauss-Legendre). The axial part matters for
//          long coils of coarse pitch (without it the SRF reads up to 7.7 % high against NEC2).
//          Capacitance: the turns' Maxwell matrix (TurnCapacitance, spec/choices.hpp): thin-wire
//          potential coefficients of uniformly charged rings, (1 / 4 pi eps0) (2 / pi) K(m) / sqrt((a +
//          rho)^2 + z^2), on the other rings and averaged round a ring's own wire; the former's polarisation
//          charge added to them (axisymmetric_charge.hpp); and by default the near-field correction, the
//          wire-surface solution less the thin-wire one on a section of 7 turns (the charge crowding towards
//          the neighbours, the enamel between them). Each turn's mean potential is the mean of its end
//          nodes' (C_n = A^T C A). Along a turn the potential runs linearly from
//          one node to the next; the sawtooth about the mean has the harmonics -(dV) sin(n phi) / (n pi),
//          which hold charges sin(n phi) on the rings through their own potential coefficients
//          H_n = (a / 4 pi eps0) integral cos(n psi) / R d psi, adding (a / (pi n^2)) B^T H_n^-1 B to C_n
//          (n = 1 .. 3; without them few-turn coils read up to 2.9 % high).
//          One end on a ground plane (Mounting::grounded_end): the plane is an image of every ring and
//          segment, `base_height` below the first turn's centre (the coil's axis upright, as Medhurst's
//          coils stood): charges and ring currents reversed, axial currents not; that end's node is ground.
//          Resonances: the generalised eigenvalues of B^T L^-1 B V = w^2 C_n V (B the incidence matrix),
//          solved as the symmetric-definite pencil (K', C_n + K'), K' = K / w0^2, whose eigenvalues
//          mu = lambda / (1 + lambda) stay finite where C_n is singular (the alternating mode, mu = 1); the
//          free coil's common mode (K 1 = 0) is deflated first (the vectors C-orthogonal to it). Z(f) between the terminals by the nodal solve
//          Y = B^T (R + j w L)^-1 B + j w C_n (1 - j tan d), the series resistance R(f) spread evenly over
//          the turns, the dielectric's loss tangent on the capacitances (Eigen's LU).
// Source:  A. E. Ruehli, "Equivalent circuit models for three-dimensional multiconductor systems", IEEE
//          Trans. MTT 22 (1974) 216 (PEEC); the ring's potential as in Smythe, "Static and Dynamic
//          Electricity" (quoted from memory); the axial sheet, the charge harmonics and the eigenproblem's
//          reformulation are ours.
//          A shield: its wall and end discs a grounded conductor of the charge solver, and its perfect-
//          conductor currents' change to the partial inductances (shield_turn_inductance_change); one end
//          grounded is then one end to the shield.
// Domain:  quasi-static (no retardation: against NEC2 it costs nothing on the set below, and adding its
//          real part moved the SRF the wrong way by up to 1 %); round wire, p >= insulated d; free space,
//          one ground plane or a coaxial shield; a uniform medium and a coaxial former. No leads yet.
// Accuracy: against NEC2 (nec2c, Richardson-extrapolated from 16 and 32 segments a turn) on its coils of
//          p/d >= 3, l/D 0.4 .. 15: floating -1.28 .. +1.34 %, one end grounded -1.76 .. -0.45 %
//          (tests/python/test_turn_network.py, enforced 2 %); at p/d 2, -2.07 .. -1.73 % where NEC2's thin wire
//          misses the charge crowding. Close-wound turns (p/d 1.08 .. 3, bare and enamelled) against the
//          wire-surface reference: -2.64 .. +0.32 % (tests/cpp/test_turn_network.cpp; the thin wire alone
//          reads up to +39 % high). The former's polarisation: within 0.2 % of finer panels. Limits: a single
//          ring's capacitance tends to the thin torus's; a uniform dielectric lowers every resonance by
//          exactly 1 / sqrt(eps); far below resonance Im Z / w is the network's L; long coils of fine pitch
//          come towards the sheath helix. Medhurst's table in his arrangement: 0.76 .. 1.02 of his C in air,
//          0.78 .. 1.20 on a polystyrene rod (tests/python/test_medhurst_arrangement.py; docs/models.md says
//          why that misses the 10 % aimed at).
#pragma once

#include <complex>
#include <optional>
#include <vector>

#include "libcoil/models/solenoid.hpp"
#include "libcoil/spec/choices.hpp"
#include "libcoil/spec/records.hpp"

namespace libcoil {

// The capacitance of one isolated ring of round wire (ring radius a, wire radius r) by the network's own
// potential coefficient (the ring's potential averaged over its wire surface), F. The thin torus's
// 4 pi^2 eps0 a / ln(8 a / r) is its limit for r << a.
double ring_capacitance(double ring_radius, double wire_radius);

struct TurnNetworkOptions {
    Mounting mounting = Mounting::floating;
    double base_height = -1;          // m, grounded end: the ground plane below the first turn's centre;
                                      // < 0: half a pitch (the winding stands on the plane)
    double relative_permittivity = 1; // a uniform medium around and inside the winding
    // The former under the winding: a tube (or a solid rod where the wall reaches the axis) from the form
    // diameter inwards, `former_ends` longer than the winding at each end; ribs as a tube of their
    // circumference-averaged permittivity 1 + (eps - 1) x fill (an equivalent). Its polarisation charge by
    // axisymmetric_charge.hpp.
    FormerDielectric former{};
    double former_ends = 5e-3;        // m
    TurnCapacitance capacitance = TurnCapacitance::near_field_corrected;
    double enamel_permittivity = 3.5; // wire_surface only (polyurethane or polyester-imide enamel, from memory)
    double terminal_capacitance = 0;  // F, a capacitor between the terminals (from the far end to ground
                                      // where one end is grounded)
    // A coaxial shield: its wall (and end discs) a grounded conductor for the capacitances, and the
    // perfect conductor's change to the partial inductances (shield.hpp). With a shield, one end grounded
    // means one end to the shield: the shield is the ground, no plane.
    std::optional<ShieldSpec> shield{};
};

class TurnNetwork {
public:
    explicit TurnNetwork(const Solenoid& coil, const TurnNetworkOptions& options = {});

    // The lowest `count` natural frequencies with the terminals open, Hz, rising (fewer if the network
    // has fewer). The first is the self-resonance.
    std::vector<double> resonances(int count = 3) const;
    // The first of them; DomainError if the network has none (a single turn between free ends).
    double first_resonance() const;
    // Z between the terminals at f (Hz, > 0): `series_resistance` is the winding's R(f), spread over the
    // turns in proportion to their length; `loss_tangent` the dielectric's.
    // `series_inductance` (H, may be negative) adds to the turns' self terms in the same proportion.
    std::complex<double> impedance(double frequency, double series_resistance = 0, double loss_tangent = 0,
                                   double series_inductance = 0) const;

    // The current in each turn (first to last, A, complex) with 1 A driven into the terminals at f (Hz, > 0),
    // the rest going through the capacitances: uniform far below resonance, bunched towards the middle
    // (floating) or the grounded end near it. The same terms as impedance().
    std::vector<std::complex<double>> turn_currents(double frequency, double series_resistance = 0, double loss_tangent = 0,
                                                    double series_inductance = 0) const;

    // The sum of the partial inductances: the network's low-frequency L (external: high-frequency self
    // terms, and with the ground plane's images).
    double inductance() const;
    int elements() const { return n_; }
    // The capacitance between the turns and to infinity (or ground), each turn one conductor: the Maxwell
    // matrix, row-major N x N, F (the charge harmonics along the turns not included).
    const std::vector<double>& turn_capacitance() const { return turn_c_; }
    int panels() const { return panels_; }  // the charge solver's panels (0: the bare thin-wire network)

private:
    // The free nodes' voltages with 1 A into the far terminal (out of the near one, or of ground).
    std::vector<std::complex<double>> node_voltages(double frequency, double series_resistance, double loss_tangent,
                                                    double series_inductance) const;
    int n_ = 0;                // turns (branches)
    std::vector<double> l_;    // partial inductances, H, N x N row-major
    std::vector<double> c_;    // node capacitances, F, row-major over the free nodes (N + 1, or N grounded)
    std::vector<double> turn_c_;
    int panels_ = 0;
    Mounting mounting_ = Mounting::floating;
};

}  // namespace libcoil
