"""The design screen's bound on the turn network's SRF (libcoil/src/studies/srf_screen_envelope.hpp, written by
tools/srf_screen_envelope.py from 3000 random bare coils): on coils the generator never saw (other seeds), the
network's SRF never exceeds the envelope times the screen's, floating or grounded. The envelope is a measured
bound; this is the check that it holds beyond its own sample. (A former only lowers the network's SRF:
tests/cpp/test_turn_network.cpp.)"""
import importlib.util
import os
import pathlib
import re

import pytest

ROOT = pathlib.Path(os.environ.get("LIBCOIL_SOURCE_DIR", pathlib.Path(__file__).resolve().parents[2]))


def generator():
    spec = importlib.util.spec_from_file_location("srf_screen_envelope", ROOT / "tools" / "srf_screen_envelope.py")
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def tables():
    text = (ROOT / "libcoil" / "src" / "studies" / "srf_screen_envelope.hpp").read_text()
    out = {}
    for name, body in re.findall(r"double (\w+)\[spacing_bins\]\[length_bins\] = \{(.*?)\};", text, re.S):
        out[name] = [[float(v) for v in row.split(",")] for row in re.findall(r"\{([^{}]*)\}", body)]
    return out


@pytest.mark.parametrize("seed", [29, 31, 37])
def test_envelope_holds_on_fresh_coils(seed):
    g = generator()
    t = tables()
    assert set(t) == {"floating", "grounded"}
    worst = 0.0
    for spacing, length, mounting, ratio in g.sample(seed, 400):
        i, j = g.bin_of(spacing, g.SPACING_EDGES), g.bin_of(length, g.LENGTH_EDGES)
        worst = max(worst, ratio / t["grounded" if mounting == "grounded-end" else "floating"][i][j])
    # Measured on these samples: at most 0.956, 0.951 and 0.949 of the bound (seeds 41 and 43: 0.952, 0.951).
    assert worst <= 1.0


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
    assert row[0] > pitch / (d + 2 * enamel) * 1.01
    assert g.bin_of(1.0, g.SPACING_EDGES) == 0
    assert g.bin_of(100.0, g.SPACING_EDGES) == len(g.SPACING_EDGES)
    assert g.bin_of(g.LENGTH_EDGES[0], g.LENGTH_EDGES) == 1
