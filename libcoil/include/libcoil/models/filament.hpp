// Filament model of a single-layer coil: the independent numerical reference for inductance.
//
// Method:  each turn is a circular filament of the mean radius a, the turns spaced by the pitch p.
//          L = N L_ring + 2 sum_{k=1}^{ceil(N)-1} (N - k) M(a, a, k p), with Maxwell's mutual
//          inductance M (coaxial_mutual.hpp) and the round-wire ring self-inductance L_ring
//          (ring_inductance.hpp). Equal radii make M depend only on the turn offset, so the sum is O(N);
//          the near offsets (z <= 4 a) take their elliptic integrals eight at a time (elliptic.hpp).
//          The helix is replaced by parallel rings; the pitch angle is not modelled. Fractional N weights
//          the offsets as Rosa's B does.
// Source:  the superposition of Maxwell's formula (Grover 1946 ch. 16, "summation of mutual inductances").
// Domain:  p >= wire diameter, a >> wire radius, small pitch angle.
// Accuracy: agrees with the Rosa-corrected Nagaoka value within 0.46 % inside Rosa's domain p <= 0.4 a
//          (tests/cpp/test_inductance.cpp); its own approximations are in r / a alone (the ring formula and
//          filament mutuals between round wires), plus the neglected pitch angle.
#pragma once

namespace libcoil {

double filament_inductance(double mean_diameter, double turns, double pitch, double wire_diameter);

}  // namespace libcoil
