"""The design screen's bounds on the turn network's SRF (libcoil/src/studies/srf_screen_envelope.hpp, written by
tools/srf_screen_envelope.py from 40 000 random bare coils, 16 000 on random formers and about 35 000 more on
formers in the mounted fit's interior): on coils the generator never saw (other seeds), the network's SRF never
exceeds the bound times the screen's, floating or grounded; on a former the network's shift over the sheath
helix's never exceeds its bound, nor the network's SRF on it the mounted bound times the helix's. They are
measured bounds; this is the check that they hold beyond their own samples. (A former only lowers the network's SRF:
tests/cpp/test_turn_network.cpp. The C++ reading of the tables against the script's: tests/cpp/test_design.cpp.)"""
import os
import pathlib
import statistics

import pytest

ROOT = pathlib.Path(os.environ.get("LIBCOIL_SOURCE_DIR", pathlib.Path(__file__).resolve().parents[2]))


def header(g):
    return g.read_header((ROOT / "libcoil" / "src" / "studies" / "srf_screen_envelope.hpp").read_text())


@pytest.mark.parametrize("seed", [29, 31, 37])
def test_bound_holds_on_fresh_coils(seed, tool_script):
    g = tool_script("srf_screen_envelope")
    h = header(g)
    rows = g.sample(seed, 400)
    worst = max(row[7] / g.bound(row, h) for row in rows)
    # Measured (this header): at most 0.994 of the bound on 16 000 fresh coils (seeds 29, 31, 37, 53, 4000
    # each). One fresh coil of a first version reached 1.012, and the bins were then made to need 100 samples
    # near; fitted on the whole domain (before 2026-12-05), two corners of those 16 000 reached 1.034 and
    # 1.001, and the fit was then kept to the interior.
    assert worst <= 1.0


@pytest.mark.parametrize("spacing, coat, diameter, turns, mounting", [
    (1.1010498674313105, 0.044549748516396925, 8.607687169218856, 4.5, "grounded-end"),  # 1.034 of that bound
    (1.331101743420991, 0.0061805098984634025, 172.39318008150804, 4.0, "floating"),     # 1.001
])
def test_bound_holds_at_the_corners_a_whole_domain_fit_missed(spacing, coat, diameter, turns, mounting, tool_script):
    # Two fresh coils of the 16 000 above (seeds 29 and 31), at the domain's corners (a gap of 1.1 %; l / D
    # 0.03), where the bare fit fitted on the whole domain sat below the network. The fit now keeps to the
    # interior and these take the envelope. The ratio is scale-free: the coils drawn again at d = 1 mm.
    g = tool_script("srf_screen_envelope")
    d = 1e-3
    row = g.ratios((d, coat * d, diameter * d, spacing * d, turns, mounting))
    assert not g.interior(row)
    assert row[7] <= g.bound(row, header(g))


@pytest.mark.parametrize("seed", [41, 43])
def test_former_bound_holds_on_fresh_coils(seed, tool_script):
    g = tool_script("srf_screen_envelope")
    h = header(g)
    bounded = [(row[7], g.former_bound(row, h)) for row in g.sample(seed, 300, former=True)]
    bounded = [(r, b) for r, b in bounded if b is not None]
    assert len(bounded) > 250  # the fit's range covers nearly all of its domain (2994 of 3000, seed 9)
    # Measured: at most 0.993 of the bound on 55 900 fresh coils (2026-12-05; seeds 101, 202 and 303 of
    # the generator's draws). With the margin of the other fits, 1.02 in place of 1.05, four of them lay
    # above it, by up to 2.2 %, where 2994 (seed 9) had found none.
    assert max(r / b for r, b in bounded) <= 1.0


@pytest.mark.parametrize("seed", [47, 59])
def test_mounted_bound_holds_on_fresh_coils(seed, tool_script):
    g = tool_script("srf_screen_envelope")
    h = header(g)
    bounded = [(row[7], g.mounted_bound(row, h)) for row in g.sample(seed, 300, mounted=True) if g.interior(row)]
    bounded = [(r, b) for r, b in bounded if b is not None]
    assert len(bounded) > 180  # the interior holds about three in four of the domain's coils
    # Measured: at most 0.994 of the bound on 17 780 fresh coils in the fit's range (seeds 7 and 8 of the
    # generator's draws, the interior's); fitted on the whole domain instead, one reached 1.03 of it.
    assert max(r / b for r, b in bounded) <= 1.0


def test_mounted_fit_is_tight_where_the_search_works(tool_script):
    # Close-wound coils of 8 turns or more, l / D 0.4 .. 2, on formers (the dense grid's designs are such): the
    # mounted bound sits about 4 % above the network at the median (1.040 on 5160 such fresh coils, seeds 7 and
    # 8), where the bare bound times the former's sat 9 ... 11 % above it on the dense grid's designs (their 110
    # drops).
    g = tool_script("srf_screen_envelope")
    h = header(g)
    rows = [row for row in g.sample(61, 1500, mounted=True) if 1.05 < row[0] < 2.2 and 0.4 < row[2] < 2 and row[4] >= 8]
    ratios = [b / row[7] for row in rows if (b := g.mounted_bound(row, h)) is not None]
    assert len(ratios) > 60
    assert statistics.median(ratios) < 1.05


def test_fit_is_tight_where_the_search_works(tool_script):
    # Close-wound coils of 8 turns or more, l / D 0.5 .. 2 (the dense grid's designs): the fitted bound sits a
    # few per cent above the network (measured: 4.3 % at the median on 1285 such fresh coils of seeds 29 .. 53,
    # the bins' envelope alone 18 %), so that the screen lets through few designs the network then rejects.
    g = tool_script("srf_screen_envelope")
    h = header(g)
    rows = [row for row in g.sample(53, 3000) if 1.05 < row[0] < 1.6 and 0.5 < row[2] < 2 and row[4] >= 8]
    assert len(rows) > 60
    assert statistics.median(g.bound(row, h) / row[7] for row in rows) < 1.07


def test_bins_follow_the_solenoids_spacing(tool_script):
    # The generator bins by p / bare d, as the search does (Solenoid::pitch_to_wire), not by the insulated d.
    import random

    g = tool_script("srf_screen_envelope")
    rng = random.Random(3)
    while True:
        coil = g.draw(rng)
        d, enamel, _, pitch, *_ = coil
        row = g.ratios(coil)
        if enamel > 0 and row is not None:
            break
    assert row[0] == pytest.approx(pitch / d, rel=1e-15)
    assert row[1] == pytest.approx(enamel / d, rel=1e-15)
    assert row[0] > pitch / (d + 2 * enamel) * 1.01
    assert g.bin_of(1.0, g.SPACING_EDGES) == 0
    assert g.bin_of(100.0, g.SPACING_EDGES) == len(g.SPACING_EDGES)
    assert g.bin_of(g.LENGTH_EDGES[0], g.LENGTH_EDGES) == 1
