"""The turn network in Medhurst's arrangement, against his measured self-capacitance.

Medhurst (Wireless Engineer, 1947) measured single-layer coils standing upright on an earthed plate, the
lower end earthed, and took the self-capacitance C_0 as the intercept of his straight line 1 / w^2 =
L (C_t + C_0) over added capacitors C_t across the terminals. As later reviews of his data point out, the
coils were wound on solid polystyrene rods. Here the network stands on a ground plane (its first turn half a
pitch above it), the rod (eps 2.55, polystyrene, from memory) fills the winding and reaches 0.1 D past its
top, and C_0 comes from the same straight line over C_t = 1 .. 8 times Medhurst's own value (a common
practice; his capacitor range is not known to us). His table is libcoil's medhurst_h (the table as
published).

What this measures (docs/models.md): in air the network reads -15 .. +2 % of Medhurst's C for
0.5 <= l/D <= 2, -12 % at 5 and -24 % at 10; the rod adds +35 % at l/D = 0.5 falling to +2 % at 10, which
brings the short coils 15 .. 20 % above his values and leaves the long ones 8 .. 22 % below. So the issue's goal (within 10 % for 0.5 <= l/D <= 10)
is not met in this reconstruction of his arrangement. The network itself is within 2 % of NEC2 on the same
grounded coils in air (test_turn_network.py), so the gap lies in what we do not know of his arrangement:
the rod's permittivity and length, the winding's height above the plate (raising a short coil by D / 2
lowers its C by 9 %), his leads, and his capacitor range (0.5 .. 3 or 20 .. 100 times C_0 instead of 2 .. 16
moves the long coils' C by +5 or -2 %).
"""
import numpy as np
import pytest

import libcoil

ROD_PERMITTIVITY = 2.55  # polystyrene, from memory


def apparent_capacitance(solenoid, medhurst_c, rod):
    """Medhurst's C_0 of the network: the intercept over the slope of 1 / w^2 against C_t."""
    d = solenoid.mean_diameter
    former = dict(former_permittivity=ROD_PERMITTIVITY, former_wall=d, former_fill=1.0, former_ends=0.1 * d) if rod else {}
    ct = medhurst_c * np.array([1.0, 2.0, 4.0, 8.0])
    y = []
    for c in ct:
        f = libcoil.TurnNetwork(solenoid, "grounded-end", terminal_capacitance=c, **former).resonances(1)[0]
        y.append(1 / (2 * np.pi * f) ** 2)
    slope, intercept = np.polyfit(ct, y, 1)
    return intercept / slope


def coil(l_over_d):
    d, wire = 50e-3, 1.25e-3  # p / d = 2, d / D = 0.025: the ratios below move by 1 % or less with either
    pitch = 2 * wire
    turns = round(l_over_d * d / pitch)
    return libcoil.Solenoid(mean_diameter=d, turns=turns, pitch=pitch, wire=libcoil.Wire(diameter=wire))


# l/D: (network / Medhurst in air, with the rod), measured; the test holds each within 3 %.
MEASURED = {0.5: (0.852, 1.149), 1.0: (0.972, 1.200), 2.0: (1.022, 1.152), 5.0: (0.875, 0.915), 10.0: (0.761, 0.775)}


@pytest.mark.parametrize("l_over_d", sorted(MEASURED))
def test_network_in_medhurst_arrangement(l_over_d):
    s = coil(l_over_d)
    medhurst = libcoil.medhurst_capacitance(s.mean_diameter, s.winding_length)
    air = apparent_capacitance(s, medhurst, rod=False) / medhurst
    rod = apparent_capacitance(s, medhurst, rod=True) / medhurst
    expected_air, expected_rod = MEASURED[l_over_d]
    assert air == pytest.approx(expected_air, rel=0.03)
    assert rod == pytest.approx(expected_rod, rel=0.03)
    assert rod > air  # the rod only adds


def test_the_rods_share_falls_with_length():
    # The rod's share of the capacitance: most for short coils, whose field crosses the winding's inside;
    # least for long ones, whose field is mostly outside.
    shares = [MEASURED[k][1] / MEASURED[k][0] - 1 for k in sorted(MEASURED)]
    assert shares == sorted(shares, reverse=True)
    assert shares[0] > 0.3 and shares[-1] < 0.03
