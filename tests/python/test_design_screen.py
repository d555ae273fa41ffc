"""The design screen's bounds on the turn network's SRF (libcoil/src/studies/srf_screen_envelope.hpp, written by
tools/srf_screen_envelope.py from 40 000 random bare coils and 16 000 on random formers): on coils the generator
never saw (other seeds), the network's SRF never exceeds the bound times the screen's, floating or grounded, and
on a former the network's shift over the sheath helix's never exceeds its bound. They are measured bounds; this is
the check that they hold beyond their own samples. (A former only lowers the network's SRF:
tests/cpp/test_turn_network.cpp. The C++ reading of the tables against the script's: tests/cpp/test_design.cpp.)"""
import importlib.util
import os
import pathlib
import statistics

import pytest

ROOT = pathlib.Path(os.environ.get("LIBCOIL_SOURCE_DIR", pathlib.Path(__file__).resolve().parents[2]))


def generator():
    spec = importlib.util.spec_from_file_location("srf_screen_envelope", ROOT / "tools" / "srf_screen_envelope.py")
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def header(g):
    return g.read_header((ROOT / "libcoil" / "src" / "studies" / "srf_screen_envelope.hpp").read_text())


@pytest.mark.parametrize("seed", [29, 31, 37])
def test_bound_holds_on_fresh_coils(seed):
    g = generator()
    h = header(g)
    rows = g.sample(seed, 400)
    worst = max(row[7] / g.bound(row, h) for row in rows)
    # Measured (the generator's own evaluation, this header): at most 0.987 of the bound on 15 800 fresh coils
    # (seeds 29, 31, 37, 53); one fresh coil of a first version reached 1.012, and the bins were then made to
    # need 100 samples near.
    assert worst <= 1.0


@pytest.mark.parametrize("seed", [41, 43])
def test_former_bound_holds_on_fresh_coils(seed):
    g = generator()
    h = header(g)
    bounded = [(row[7], g.former_bound(row, h)) for row in g.sample(seed, 300, former=True)]
    bounded = [(r, b) for r, b in bounded if b is not None]
    assert len(bounded) > 250  # the fit's range covers nearly all of its domain (2994 of 3000, seed 9)
    # Measured: at most 0.995 of the bound on 3000 fresh coils (seed 9).
    assert max(r / b for r, b in bounded) <= 1.0


def test_fit_is_tight_where_the_search_works():
    # Close-wound coils of 8 turns or more, l / D 0.5 .. 2 (the dense grid's designs): the fitted bound sits a
    # few per cent above the network (measured: 5.6 % at the median on 1242 such fresh coils of seeds 29 .. 53,
    # the bins' envelope alone 18 %), so that the screen lets through few designs the network then rejects.
    g = generator()
    h = header(g)
    rows = [row for row in g.sample(53, 3000) if 1.05 < row[0] < 1.6 and 0.5 < row[2] < 2 and row[4] >= 8]
    assert len(rows) > 60
    assert statistics.median(g.bound(row, h) / row[7] for row in rows) < 1.07


def test_bins_follow_the_solenoids_spacing():
    # The generator bins by p / bare d, as the search does (Solenoid::pitch_to_wire), not by the insulated d.
    import random

    g = generator()
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
