// A coaxial conductive shield around a coil: what it does to L, R and the capacitance.
//
// Method:  numerical, axisymmetric: the shield's wall becomes rings, n_z along its length and n_t through
//          its thickness (graded from the inner surface, the first layer a third of a skin depth, when the
//          wall is thicker than half a skin depth), and optional end discs become rings across their
//          radius. The coil's turns are filaments carrying the coil current. Each shield ring k obeys
//          R_k I_k + j w sum_j M_kj I_j = -j w M_kc I, with Maxwell's formula for the mutuals
//          (coaxial_mutual.hpp), a ring's self-inductance at the geometric mean distance of its rectangular
//          section (ring_inductance.hpp) and its DC resistance 2 pi r rho / (w t); the coil's impedance
//          gains dZ = j w M_ck I_k / I (Eigen's LU on the complex system). L(f) = L0 + Im(dZ) / w, and the
//          shield's eddy loss R_s(f) = Re(dZ). The wall is modelled to wall_reach_radii (4) inner radii
//          beyond the winding: the rings further out, and an end disc further out, are left out.
//          Closed form, the long coil in a long shield at high frequency (the return flux confined between
//          coil and wall): L = L0 (1 - a^2 / b^2), L0 the unshielded inductance (derived in docs/models.md).
//          Capacitance to the shield: the coaxial C = 2 pi eps0 l_o / ln(b / r_outer) over the length l_o of
//          winding the shield covers, seen between the terminals (voltage linear along the winding) as C/12
//          for a floating coil and C/3 with one end grounded to the shield where it covers the whole winding
//          (shield_terminal_capacitance for a part), added to the coil's own self-capacitance for the shifted SRF.
// Source:  the ring model is the losses issue's (Maxwell 1873 art. 701; Grover 1946 for the GMD).
// Domain:  coaxial shields around the coil (inner radius above the coil's outer radius), any thickness
//          and frequency; nonmagnetic conductors.
// Accuracy (tests/cpp/test_shield.cpp, tests/python/test_shield.py): the long coil (l/D 20) against
//          L0 (1 - a^2/b^2) -0.08 %; the ring model against the Fourier-Bessel closed form, dL within 1.1 %
//          and the shielded L within 0.5 % (l/D 0.5 .. 10, b/a 1.25 .. 3); the closed form against scipy
//          1e-9; the wall loss at 100 MHz +0.54 % from the surface-resistance form; at 1 Hz L changes 1e-6;
//          the wall's back-action with the rings within reach against the whole 0.4 m tube's, 1.7e-7.
#pragma once

#include <complex>
#include <cstddef>
#include <memory>
#include <utility>
#include <vector>

#include "libcoil/models/materials.hpp"
#include "libcoil/models/solenoid.hpp"
#include "libcoil/spec/records.hpp"

namespace libcoil {

struct ShieldPoint {
    double frequency = 0;         // Hz
    double skin_depth = 0;        // m, in the shield
    double inductance = 0;        // H, the coil's, shielded
    double added_resistance = 0;  // ohm, the shield's eddy loss as seen at the coil's terminals
};

struct ShieldResult {
    double unshielded_inductance = 0;   // H, as given
    double long_coil_limit = 0;         // H, L0 (1 - a^2 / b^2)
    double closed_form = 0;             // H, L0 + sheet_in_long_shield_change: the finite coil in a long tube
    double perfect_conductor = 0;       // H, the ring model with no resistance (the high-frequency limit)
    double capacitance_to_shield = 0;   // F, coaxial over the winding length
    std::vector<ShieldPoint> points;
    int rings = 0;                      // at the highest frequency
};

// Closed form with the coil's finite length: a current sheet (radius a, length l, N turns) in an infinitely
// long perfectly conducting tube of radius b. By Fourier transform along the axis, the sheet's vector
// potential is (mu0 a / 2 pi) integral K(k) I1(|k| r<) K1(|k| r>) e^(ikz) dk, and the tube adds the
// reflected part that makes A_phi(b) = 0, so that
//   dL = -8 mu0 a^2 N^2 / l^2 integral_0^inf sin^2(k l / 2) / k^2 I1(k a)^2 K1(k b) / I1(k b) dk,
// which for l >> b tends to -L_inf a^2 / b^2 (derived in docs/models.md; Boost.Math's Bessel functions
// and Gauss-Kronrod quadrature, period by period for the first 2000 periods of sin^2, its mean 1/2 beyond:
// within 1e-3 of the long-coil limit at l = 5000 b, tests/python/test_hardening.py). Negative, in H.
double sheet_in_long_shield_change(double mean_radius, double length, double turns, double shield_radius);

// The change of the coil's inductance by the shield in its high-frequency limit (the perfect conductor:
// the ring model without resistance on one thin layer at the inner surface), in H (negative). Cheap: the
// design search calls it per candidate.
double shield_inductance_change(const Solenoid& coil, const ShieldSpec& shield);

// The same change turn by turn, for the turn network: entry (i, j) of the N x N row-major matrix is the
// shield's change to the partial mutual inductance of the turns i and j (turn_filaments' rings, each of its
// weight), -M_ts M_ss^-1 M_st (the perfect conductor's surface currents cancel the flux through every wall
// ring), H. Its entries sum to shield_inductance_change.
std::vector<double> shield_turn_inductance_change(const Solenoid& coil, const ShieldSpec& shield);

// The wall's own currents (the ring model's rings at `frequency`, the same discretisation as shielded_coil)
// when every one of `turns` (ring radius, axial position) carries 1 A: what the wire-harmonic solver adds to
// the field at the wires, so that a shielded coil's R is the wall's loss plus the wires' changed loss.
struct WallRingCurrent {
    double radius = 0, z = 0;            // m
    std::complex<double> current;        // A per ampere of coil current
};
std::vector<WallRingCurrent> shield_wall_currents(const std::vector<std::pair<double, double>>& turns, const ShieldSpec& shield,
                                                  double frequency);
// The same driven by ring currents of any complex amplitude (a turn's dipole as two close rings, say).
std::vector<WallRingCurrent> shield_wall_currents(const std::vector<WallRingCurrent>& sources, const ShieldSpec& shield,
                                                  double frequency);

// Where the sources that drive a wall lie (m): out to `radius` from the axis (the bore must clear it), between
// `z_low` and `z_high` along it, in the coil's frame (the shield's axial_offset is measured in the same).
struct SourceReach {
    double radius = 0, z_low = 0, z_high = 0;
};
// The reach of round wires given by their centres (radius, axial position): each wire's sources lie out to
// `radial` beyond its centre and `axial` either side of it. None for no wires.
SourceReach reach_of_wires(const std::vector<std::pair<double, double>>& centres, double radial, double axial);

// How far beyond its sources a wall is modelled, in inner radii of the tube: the rings further out are left
// out, and so is an end disc further out. Inside a good conductor's tube the field beyond the winding falls as
// exp(-3.83 z / b) (the lowest mode below cut-off, J1(x) = 0), 2e-7 at four radii; in a wall thin against the
// skin depth the far rings see the winding's dipole field, and what they add falls as z^-6 (measured:
// tests/cpp/test_shield.cpp, ALongTubeIsModelledNearItsWinding).
inline constexpr double wall_reach_radii = 4;

// The wall at one frequency as a linear system, for solvers that couple many sources to it (the cross-
// section solver's cells): the ring model's rings (the same discretisation as shielded_coil, within
// wall_reach_radii of the sources) and their impedance matrix Z_w, factorised once.
class ShieldWall {
public:
    ShieldWall(const ShieldSpec& shield, const SourceReach& sources, double frequency);
    // The rings (radius, axial position), m.
    const std::vector<std::pair<double, double>>& rings() const { return rings_; }
    // Whether the wall built for `sources` would be this one, ring for ring (the rings' spacing follows the
    // gap to the sources only where that gap is what binds it).
    bool serves(const SourceReach& sources) const;
    // The wall's currents when the sources link `flux[k]` (Wb) with ring k: Z_w I = -j w flux. `flux` holds
    // `columns` such vectors one after another (column-major, rings() x columns) and is overwritten by the
    // currents (A).
    void currents(std::complex<double>* flux, std::size_t columns) const;

private:
    struct Factor;
    std::vector<std::pair<double, double>> rings_;
    ShieldSpec shield_;
    double omega_ = 0, delta_ = 0;
    std::shared_ptr<const Factor> factor_;
};

// shield_wall_currents on a wall already built for the sources (within the SourceReach it was built for): a
// solver that drives the same wall again and again (the wire-harmonic solver's passes) builds and factors it
// once.
std::vector<WallRingCurrent> shield_wall_currents(const ShieldWall& wall, const std::vector<WallRingCurrent>& sources);

// `inductance`: the coil's unshielded inductance (the recommended one). Throws InputError for a shield that
// would touch the winding (shield.inner_diameter) or a non-positive size.
ShieldResult shielded_coil(const Solenoid& coil, double inductance, const ShieldSpec& shield, const std::vector<double>& frequencies);

// The shield as the coil's impedance sees it at any frequency: the ring model (shielded_coil) solved on a
// log grid of `per_decade` points a decade over [low, high] and interpolated, the inductance change
// linearly and the wall's loss log-log in log f. Beyond the grid the eddy currents' own limits hold:
// below it dL and R grow as f^2 (the resistive limit of the ring system), above it dL stays and R grows
// as sqrt(f) (the skin-effect limit). With 6 points a decade the interpolation is within 0.2 % of the
// ring model between its points (tests/cpp/test_shield.cpp).
class ShieldTable {
public:
    ShieldTable() = default;  // no shield: no change
    ShieldTable(const Solenoid& coil, double inductance, const ShieldSpec& shield, double low, double high, int per_decade = 6);
    // A constant change and no loss: the perfect conductor, for screening in a search.
    static ShieldTable perfect(double inductance_change);

    double inductance_change(double frequency) const;  // H, negative
    double added_resistance(double frequency) const;   // ohm
    double low() const { return f_.empty() ? 0 : f_.front(); }
    double high() const { return f_.empty() ? 0 : f_.back(); }

private:
    std::vector<double> f_, dl_, r_;  // the grid, the change of L and the wall's loss there
    double constant_change_ = 0;
};

// The shield's inner radius over the coil's mean radius, b / a (self_resonance.hpp's shield_band_term reads
// whether the NEC2 reference's range holds it).
double shield_radius_ratio(const Solenoid& coil, const ShieldSpec& shield);
// The coaxial capacitance from the winding to the shield over the length of winding it covers (its axial
// offset and length taken), 2 pi eps0 l_o / ln(b / r_outer), F: 0 for a shield wholly beside the winding.
double shield_capacitance(const Solenoid& coil, const ShieldSpec& shield);
// The same as seen between the terminals, F. The voltage is linear along the winding (length l) and the
// energy c' (v - v_shield)^2 / 2 over the covered part, c' the capacitance per metre, gives (derived here,
// as the textbook's C/12): floating, the shield at the covered part's mean potential, c' l_o^3 / (12 l^2),
// C/12 where it covers the whole winding; one end grounded (the winding's start, joined to the shield),
// c' (u2^3 - u1^3) / (3 l^2) for the part u1 .. u2 from that end, C/3 for the whole.
double shield_terminal_capacitance(const Solenoid& coil, const ShieldSpec& shield, bool grounded_end);
// The SRF in the shield, lumped: the coil's own capacitance C = 1 / ((2 pi f0)^2 L0) from its bare SRF f0
// and inductance L0, joined by the shield's terminal capacitance, with the shielded inductance.
double shielded_self_resonance(double bare_self_resonance, double bare_inductance, double shielded_inductance,
                               double terminal_capacitance);

// Shielding effectiveness of the wall against the near magnetic field of a source `source_distance`
// inside it, after Schelkunoff's transmission-line theory of a plane sheet: SE = A + R + B in dB, with
// absorption A = 8.686 t / delta, reflection R = 20 log10 |(Z_s + Z_w)^2 / (4 Z_s Z_w)| (the usual
// |Z_w| / (4 |Z_s|) where |Z_w| >> |Z_s|) for the magnetic source's wave impedance Z_w = j w mu0 r against
// the metal's Z_s = (1 + j) / (sigma delta), and the multiple-reflection
// term B = 20 log10 |1 - ((Z_s - Z_w) / (Z_s + Z_w))^2 exp(-2 (1 + j) t / delta)|. Floored at 0 dB: the
// plane-sheet theory says nothing useful where it falls below. It assumes a seamless wall; seams, slots
// and the open ends of a tube leak long before these figures are reached.
struct ShieldingEffectiveness {
    double absorption_db = 0, reflection_db = 0, multiple_reflection_db = 0, total_db = 0;
};
ShieldingEffectiveness magnetic_shielding(const ShieldSpec& shield, double frequency, double source_distance);

// What leaks out of an open tube's ends, in dB: the coil's axisymmetric field travels along the tube as the
// TE01 mode below cutoff, falling by exp(-3.832 e / b) over the distance e from the winding's end to the
// tube's end (textbook waveguide theory: 3.832 is the first zero of J1, quoted from memory), so
// 8.686 x 3.832 e / b = 33.3 e / b dB. Infinite (no leak) for a tube with end discs. `winding_length`: the
// coil's, centred in the tube less the shield's axial offset.
double open_end_leakage_db(const ShieldSpec& shield, double winding_length);

// The most a wall is credited with, dB: common practice, no source; real cans with seams and slots rarely
// do better, whatever the seamless wall's theory says.
inline constexpr double max_wall_db = 100;
// What one shield is credited with against the near magnetic field: the wall's figure, at most
// max_wall_db, and for an open tube at most what leaks from its ends.
double credited_magnetic_shielding_db(const ShieldSpec& shield, double frequency, double source_distance, double winding_length);

}  // namespace libcoil
