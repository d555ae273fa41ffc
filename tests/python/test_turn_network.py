"""The turn network's self-resonance against NEC2 (Debian's nec2c, a method-of-moments wire solver): the
cached reference set (tests/reference/nec2/srf.json, written by generate.py beside it), one of its decks run
again to prove the cache current, and the sheath-helix model's error on the same set for comparison."""
import json
import pathlib
import shutil
import subprocess
import sys

import numpy as np
import pytest

import libcoil

HERE = pathlib.Path(__file__).resolve().parents[1] / "reference" / "nec2"
CACHE = json.loads((HERE / "srf.json").read_text())
COILS = CACHE["coils"]


def solenoid(c):
    return libcoil.Solenoid(mean_diameter=c["mean_diameter"], turns=c["turns"], pitch=c["pitch"],
                            wire=libcoil.Wire(diameter=c["wire_diameter"]))


def network_srf(c, mounting):
    return libcoil.TurnNetwork(solenoid(c), mounting).resonances(1)[0]


def test_cache_is_current():
    # NEC2 is deterministic: one coil's decks run again give the cached figures.
    if shutil.which("nec2c") is None:
        pytest.fail("nec2c is missing: tools/setup --references installs it")
    index = next(i for i, c in enumerate(COILS) if c["name"] == "medium")
    out = subprocess.run([sys.executable, str(HERE / "generate.py"), "--one", str(index)], capture_output=True, text=True,
                         check=True, timeout=600).stdout
    again = json.loads(out)
    for mounting in ("floating", "grounded-end"):
        for key in ("f16", "f32", "f"):
            assert again[mounting][key] == pytest.approx(COILS[index][mounting][key], rel=1e-9)


@pytest.mark.parametrize("c", COILS, ids=[c["name"] for c in COILS])
def test_nec_reference_has_converged(c):
    # NEC's own convergence: 16 and 32 segments a turn within 2.5 % of each other, the finer lower (its
    # segmentation error falls as h^2; the extrapolation removes most of the rest).
    for mounting in ("floating", "grounded-end"):
        r = c[mounting]
        assert r["f32"] < r["f16"] < 1.025 * r["f32"], (mounting, r)
        assert abs(r["f"] / r["f32"] - 1) < 0.01


def spaced(c):
    return c["pitch"] / c["wire_diameter"] >= 3


# Measured against the extrapolated NEC2 value (docs/models.md): floating -0.62 .. +1.53 %, grounded end
# -1.23 .. -0.36 % over the whole set (p/d 2 .. 8, l/D 0.4 .. 15).
@pytest.mark.parametrize("c", COILS, ids=[c["name"] for c in COILS])
@pytest.mark.parametrize("mounting", ["floating", "grounded-end"])
def test_network_srf_within_2_percent_of_nec2(c, mounting):
    f = network_srf(c, mounting)
    nec = c[mounting]
    err = f / nec["f"] - 1
    # The bound for p/d >= 3; the close turns of p/d = 2 happen to meet it as well.
    assert abs(err) <= 0.02, (c["name"], mounting, err)


def test_the_sheath_helix_is_far_off_where_the_network_is_not():
    # The reason for the network: the sheath-helix line's floating SRF is 16 .. 47 % above NEC2 on this set
    # (measured; the outside check found 16 .. 42 % on its own).
    errors = []
    for c in COILS:
        s = solenoid(c)
        sh = libcoil.self_resonance(s, s.inductance())["helical_line"]["frequency"]
        errors.append(sh / c["floating"]["f"] - 1)
    assert min(errors) > 0.15 and max(errors) < 0.5
