"""libcoil.evaluate (studies/batch.hpp): many coils as numpy arrays.

Check values: `coil analyze` of the same coils one at a time (its closed-form loss solver), which the batch
must reproduce to rounding; for the light chain, the models it names evaluated one by one (Rosa's form,
the skin ratio, Medhurst's formula). Numbers are libcoil's own here: the models themselves are checked
against their sources in test_inductance, test_skin, test_self_resonance and test_proximity."""
import math

import numpy as np
import pytest

import libcoil


def random_coils(n, seed, turns=40, pitch_ratio=(1.05, 4)):
    rng = np.random.default_rng(seed)
    d = rng.uniform(0.2e-3, 1.6e-3, n)
    ins = rng.uniform(0, 0.05e-3, n)
    return dict(mean_diameter=rng.uniform(5e-3, 60e-3, n), turns=np.round(rng.uniform(2, turns, n) * 4) / 4,
                pitch=(d + 2 * ins) * rng.uniform(*pitch_ratio, n), wire_diameter=d, insulation=ins,
                frequency=np.exp(rng.uniform(np.log(1e4), np.log(3e7), n)), temperature=rng.uniform(250, 400, n))


def spec_yaml(c, i):
    mm = lambda v: f"{v * 1e3!r} mm"
    return (f"coil:\n  mean_diameter: {mm(c['mean_diameter'][i])}\n  turns: {c['turns'][i]!r}\n  pitch: {mm(c['pitch'][i])}\n"
            f"  wire: {{diameter: {mm(c['wire_diameter'][i])}, insulation: {mm(c['insulation'][i])}}}\n"
            f"operating:\n  frequencies: [{c['frequency'][i]!r} Hz]\n  temperature: {c['temperature'][i]!r} K\n")


def test_the_full_chain_is_the_analysis_to_rounding():
    # Issue 20: on 1000 random valid coils, L, R_dc and R_ac agree with `analyze` (closed-form loss solver) to
    # 1e-12; the SRF (the recommended model's fast path, the sheath helix solved to the search tolerance 1e-7)
    # with the analysis's sheath-helix figure to 1e-6. The coils are spaced (pitch 2.6 .. 5 wire diameters):
    # for close-wound turns at x > 3 the analysis leaves the closed form for the cross-section solver, and the
    # batch keeps the closed form (documented in batch.hpp).
    c = random_coils(1000, 7, turns=20, pitch_ratio=(2.6, 5))
    r = libcoil.evaluate(**c)
    assert np.all(r["status"] == 0)
    worst = dict(l=0.0, rdc=0.0, r=0.0, srf=0.0)
    for i in range(1000):
        a = libcoil.analyze(libcoil.parse_coil_spec(spec_yaml(c, i)), solver="closed-form")
        assert not a.at_frequency.numerical[0]
        worst["l"] = max(worst["l"], abs(r["inductance"][i] / a.inductance.recommended - 1))
        worst["rdc"] = max(worst["rdc"], abs(r["dc_resistance"][i] / a.dc_resistance - 1))
        worst["r"] = max(worst["r"], abs(r["resistance"][i] / a.at_frequency.resistance[0] - 1))
        worst["srf"] = max(worst["srf"], abs(r["self_resonance"][i] / a.self_resonance["helical_line"]["frequency"] - 1))
        q = 2 * math.pi * c["frequency"][i] * r["inductance"][i] / r["resistance"][i]
        assert r["q_factor"][i] == pytest.approx(q, rel=1e-15)
    assert worst["l"] <= 1e-12 and worst["rdc"] <= 1e-12 and worst["r"] <= 1e-12, worst
    assert worst["srf"] <= 1e-6, worst


def test_the_light_chain_is_its_models_one_by_one():
    c = random_coils(200, 3)
    r = libcoil.evaluate(**c, chain="light")
    ok = r["status"] == 0
    assert ok.sum() > 150
    cu = libcoil.conductor("copper")
    for i in np.flatnonzero(ok):
        l = libcoil.rosa_inductance(c["mean_diameter"][i], c["turns"][i], c["pitch"][i], c["wire_diameter"][i])
        rho = cu.resistivity_at(c["temperature"][i])
        delta = libcoil.skin_depth(rho, c["frequency"][i])
        skin = libcoil.skin_resistance_ratio(math.sqrt(2) * c["wire_diameter"][i] / 2 / delta)
        assert r["inductance"][i] == pytest.approx(l, rel=1e-14)
        assert r["resistance"][i] / r["dc_resistance"][i] == pytest.approx(skin, rel=1e-13)
        length = c["turns"][i] * c["pitch"][i]
        h = 0.1126 * length / c["mean_diameter"][i] + 0.08 + 0.27 / math.sqrt(length / c["mean_diameter"][i])
        srf = 1 / (2 * math.pi * math.sqrt(l * h * 1e-10 * c["mean_diameter"][i]))
        assert r["self_resonance"][i] == pytest.approx(srf, rel=1e-13)
    # Outside Medhurst's table (l/D below 0.1) the element is marked, not raised.
    short = c["turns"] * c["pitch"] / c["mean_diameter"] < 0.1
    assert np.all(r["status"][short] == 2)


def test_bad_elements_are_marked_not_raised():
    d = 1e-3
    r = libcoil.evaluate(mean_diameter=[20e-3, -20e-3, np.nan, 20e-3, 20e-3, 20e-3], turns=[10, 10, 10, 0.5, 10, 10],
                         pitch=[2e-3, 2e-3, 2e-3, 2e-3, 0.5e-3, 2e-3], wire_diameter=d, frequency=[1e6, 1e6, 1e6, 1e6, 1e6, -5.0],
                         messages=True)
    assert list(r["status"]) == [0, 1, 1, 1, 1, 1]
    assert np.all(np.isnan(r["inductance"][1:])) and np.isfinite(r["inductance"][0])
    m = r["messages"]
    assert set(m) == {1, 2, 3, 4, 5}
    assert m[1].startswith("mean_diameter") and m[3].startswith("turns") and m[5].startswith("frequency")
    assert "pitch" in m[4] or "wire" in m[4]


def test_broadcasting_and_shapes():
    r = libcoil.evaluate(20e-3, np.array([[8], [10], [12]]), np.array([1.5e-3, 2e-3]), 1e-3, frequency=1e6)
    assert r["inductance"].shape == (3, 2) and r["status"].shape == (3, 2)
    one = libcoil.evaluate(20e-3, 10, 2e-3, 1e-3, frequency=1e6)
    assert np.ndim(one["inductance"]) == 0
    assert r["inductance"][1, 1] == one["inductance"]
    # The figures share one block of memory, each its own row: writing one leaves the others.
    resistance = r["resistance"].copy()
    r["q_factor"][...] = -1
    assert np.array_equal(r["resistance"], resistance) and np.all(r["inductance"] > 0)
    assert all(r[k].flags["C_CONTIGUOUS"] and r[k].flags["WRITEABLE"] for k in ("inductance", "resistance", "self_resonance"))
    # A conductor per element, by name.
    both = libcoil.evaluate(20e-3, 10, 2e-3, 1e-3, frequency=1e6, conductor=["copper", "aluminium"])
    assert both["dc_resistance"][1] > 1.5 * both["dc_resistance"][0]
    # One thread or two: the same numbers.
    c = random_coils(3000, 11)
    a, b = libcoil.evaluate(**c, threads=1), libcoil.evaluate(**c, threads=2)
    assert all(np.array_equal(a[k], b[k], equal_nan=True) for k in a)


def test_large_outputs_own_their_memory():
    # From 1 MiB of output the block is mapped apart and, once freed, kept for the next call: an array still
    # held (a row, or a slice of one) must keep its numbers through later calls, and a reused block must
    # carry the new call's numbers only.
    c = random_coils(30000, 5)
    first = libcoil.evaluate(**c)
    held_l, held_q = first["inductance"], first["q_factor"][::7]
    expected_l, expected_q = held_l.copy(), held_q.copy()
    del first
    other = dict(c, turns=c["turns"] + 1)
    for _ in range(3):
        again = libcoil.evaluate(**other)
        assert np.array_equal(held_l, expected_l) and np.array_equal(held_q, expected_q)
        del again
    del held_l, held_q
    fresh = libcoil.evaluate(**c, chain="light")
    reused = libcoil.evaluate(**c, chain="light")  # the block `fresh` did not free is not handed out twice
    assert np.array_equal(fresh["inductance"], reused["inductance"], equal_nan=True)
    assert np.array_equal(fresh["status"], reused["status"])
    assert fresh["inductance"].ctypes.data != reused["inductance"].ctypes.data


def test_a_bad_batch_raises():
    with pytest.raises(libcoil.InputError, match="conductor"):
        libcoil.evaluate(20e-3, 10, 2e-3, 1e-3, conductor="unobtainium")
    with pytest.raises(ValueError):
        libcoil.evaluate([20e-3, 21e-3], [10, 11, 12], 2e-3, 1e-3)  # shapes that do not broadcast
    with pytest.raises(libcoil.InputError, match="chain"):
        libcoil.evaluate(20e-3, 10, 2e-3, 1e-3, chain="medium")
