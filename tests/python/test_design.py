"""coil design driven as a user drives it: the demo requirement, its JSON, the chosen spec fed back to
analyze and sweep, and bad requirements."""
import json
import math
import pathlib
import time

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st

import libcoil

DEMO = "data/examples/bench-network-requirement.yaml"


def test_demo_requirement_designs_a_coil_that_analyze_accepts(run_coil, source_dir, tmp_path):
    start = time.monotonic()
    r = run_coil("design", source_dir / DEMO, "--out", tmp_path)
    elapsed = time.monotonic() - start
    assert r.returncode == 0, r.stderr
    assert elapsed < 60  # the bound for the demo; it takes well under a second
    assert "Chosen: design" in r.stdout and "why:" in r.stdout
    chosen = tmp_path / "bench-network-requirement.chosen.yaml"
    a = run_coil("analyze", chosen, "--json")
    assert a.returncode == 0, a.stderr
    j = json.loads(a.stdout)
    # Issues 17 and 19: the target holds at the band's low edge by the wire-harmonic solver (the analysis's
    # default), where the design spec asks for R and L; the low-frequency L is above it (L falls with f).
    low = 150e3
    at = next(p for p in j["at_frequency"] if p["frequency_Hz"] == pytest.approx(low, rel=1e-9))
    assert at["method"] == "harmonics"
    assert abs(at["inductance_H"] / 5e-6 - 1) < 0.02
    assert j["inductance_H"] > at["inductance_H"]
    assert j["band"]["pass"]
    s = run_coil("sweep", chosen, "--out", tmp_path)
    assert s.returncode == 0, s.stderr
    assert sorted(p.name for p in tmp_path.iterdir()) == sorted([
        "bench-network-requirement.chosen.yaml", "bench-network-requirement.chosen.s1p",
        "bench-network-requirement.chosen.sweep.csv", "bench-network-requirement.chosen.sweep.svg",
        "bench-network-requirement.design.json", "bench-network-requirement.design.txt"])


def test_design_json_keys(run_coil, source_dir):
    r = run_coil("design", source_dir / DEMO, "--json", "--top", "5")
    assert r.returncode == 0, r.stderr
    j = json.loads(r.stdout)
    for key in ("candidates_evaluated", "feasible", "rejected_by_reason", "designs", "chosen"):
        assert key in j
    assert len(j["designs"]) == 5
    assert j["feasible"] + sum(j["rejected_by_reason"].values()) == j["candidates_evaluated"]
    scores = [d["score"] for d in j["designs"]]
    assert scores == sorted(scores)
    chosen = j["designs"][j["chosen"]]
    assert "coil:" in chosen["spec"] and "band:" in chosen["spec"]


def test_python_design_reports_its_progress(source_dir):
    # The screen's (done, total) from the calling thread, ending at (total, total) before the confirmations;
    # a callable that raises stops the reports, the search ends, and its error reaches the caller.
    # (Front-end behaviour, no physics: common practice for a progress callback.)
    q = libcoil.load_requirement(str(source_dir / DEMO))
    seen = []
    r = libcoil.design(q, threads=2, top=1, progress=lambda done, total: seen.append((done, total)))
    assert seen and seen[-1] == (r.candidates_evaluated, r.candidates_evaluated)
    assert [d for d, _ in seen] == sorted(d for d, _ in seen)
    assert list(r.designs.spec) == list(libcoil.design(q, threads=1, top=1).designs.spec)  # the callback changes nothing

    calls = []

    def fails(done, total):
        calls.append(done)
        raise KeyError("stop here")

    with pytest.raises(KeyError, match="stop here"):
        libcoil.design(q, threads=2, top=1, progress=fails)
    assert len(calls) == 1


def test_bad_requirement_exits_2(run_coil, tmp_path):
    bad = tmp_path / "bad.yaml"
    bad.write_text("target: {inductance: 5 uH, tolerance: 2 %}\noperating: {current: 1 A}\n"
                   "limits: {max_outer_diameter: 40 mm, max_length: 60 mm}\n"
                   "search: {wires: [AWG 16], form_diameter: 20 mm, pitch_ratio: 0.5}\n")
    r = run_coil("design", bad, "--out", tmp_path / "o")
    assert r.returncode == 2
    assert r.stdout == ""
    assert r.stderr.startswith("coil: search.pitch_ratio")
    assert not (tmp_path / "o").exists()


def test_python_design_matches_the_cli(run_coil, source_dir):
    q = libcoil.load_requirement(str(source_dir / DEMO))
    py = libcoil.design(q, top=3)
    assert isinstance(py, libcoil.DesignResult)
    cli = json.loads(run_coil("design", source_dir / DEMO, "--json", "--top", "3").stdout)
    assert py.candidates_evaluated == cli["candidates_evaluated"]
    assert list(py.designs.score) == [d["score"] for d in cli["designs"]]
    assert list(py.designs.spec) == [d["spec"] for d in cli["designs"]]
    assert py.chosen == cli["chosen"]
    # The chosen design's full re-analysis comes along as an Analysis object.
    assert py.chosen_analysis.inductance.recommended == pytest.approx(py.designs.inductance[py.chosen], rel=1e-7)
    spread = libcoil.design(q, top=1, spread=True, samples=200, seed=3).spread
    assert spread.samples + spread.left_out == 200
    assert spread.inductance.low < spread.inductance.mean < spread.inductance.high


def test_thermal_energy_balance_from_python():
    # Churchill & Chu (1975) with grey-body radiation: dissipated = convected + radiated at the answer.
    r = libcoil.winding_temperature(lambda t: 3.0, 0.03, 0.05, 298.15)
    assert abs((r["convection"] + r["radiation"]) / r["power"] - 1) < 1e-9


BAD_REQUIREMENTS = sorted((pathlib.Path(__file__).resolve().parents[1] / "cli" / "bad-requirements").glob("*.yaml"))


@pytest.mark.parametrize("req", BAD_REQUIREMENTS, ids=[p.name for p in BAD_REQUIREMENTS])
def test_bad_requirement_catalogue(req, run_coil, tmp_path):
    field, text = req.read_text().splitlines()[0][len("# expect: "):].split(" | ", 1)
    for extra in ([], ["--json"], ["--out", tmp_path / "o"]):
        r = run_coil("design", req, *extra)
        assert r.returncode == 2, (r.stdout, r.stderr)
        assert r.stdout == ""
        message = r.stderr[len("coil: "):]
        assert message.split(": ", 1)[0] == field, message
        assert text in message, message
        assert not (tmp_path / "o").exists()


def test_catalogue_of_bad_requirements_is_large_enough():
    assert len(BAD_REQUIREMENTS) >= 8


@settings(max_examples=40, deadline=None)
@given(st.floats(min_value=1e-8, max_value=1e-3), st.floats(min_value=5e-3, max_value=0.1),
       st.floats(min_value=10e-3, max_value=0.2), st.floats(min_value=0, max_value=20),
       st.sampled_from(["AWG 14", "AWG 20", "AWG 30", "0.1 mm", "2 mm"]))
def test_any_requirement_gets_designs_or_an_explanation(L, outer, length, current, wire):
    # Property: for any requirement the search returns ranked designs that meet the target, or says
    # which constraint binds; on valid input it raises only for a contradiction found before the search
    # (a current no wire of the grid can carry), which names its fields.
    text = (f"target: {{inductance: {L} H, tolerance: 2 %}}\n"
            f"operating: {{current: {current} A}}\n"
            f"limits: {{max_outer_diameter: {outer} m, max_length: {length} m}}\n"
            f"search: {{wires: [{wire}], form_diameter: {{min: 3 mm, max: 60 mm, step: 19 mm}},"
            f" pitch_ratio: {{min: 1.1, max: 3, step: 0.95}}}}\n")
    try:
        r = libcoil.design(libcoil.parse_requirement(text), top=3)
    except libcoil.InputError as e:
        assert str(e).startswith("operating.current:") and "search.wires" in str(e), str(e)
        assert current > 0
        return
    assert r.candidates_evaluated == 4 * 3
    assert r.feasible + sum(r.rejected_by_reason.values()) == r.candidates_evaluated
    if len(r.designs.score):
        assert r.chosen is not None or r.warnings
        assert np.all(np.abs(r.designs.inductance / L - 1) < 1e-6)
        assert np.all(np.isfinite(r.designs.score))
    else:
        assert r.binding.startswith("No candidate meets the requirement")


def test_designs_as_a_numpy_record_array(source_dir):
    q = libcoil.load_requirement(str(source_dir / DEMO))
    a = libcoil.design_array(q, top=20)
    d = libcoil.design(q, top=20)
    # Up to 20: the returned designs are those confirmed with the turn network's SRF band (7 here since the
    # target holds at 2.1 MHz, where L has fallen 3 .. 4 %: every design winds more and resonates lower).
    assert 5 <= len(a) == len(d.designs.score) <= 20
    assert list(a.score) == list(d.designs.score)
    assert (a.turns % 0.25 == 0).all()
    assert abs(a.inductance_at_target / 5e-6 - 1).max() <= 0.02
    assert (a.target_frequency == libcoil.target_frequency(q)).all() and (a.inductance > a.inductance_at_target).all()


WINNERS = """\
name: "Reanalysis check"
target: {inductance: 5 uH, tolerance: 2 %}
band: {low: 150 kHz, ceiling: 30 MHz, srf_margin: 1.5, max_deviation: 10 %}
operating: {current: 3 A, frequency: 100 kHz, ambient: 30 degC}
limits: {max_outer_diameter: 45 mm, max_length: 110 mm}
search:
  wires: [AWG 16, AWG 18, AWG 20]
  form_diameter: {min: 14 mm, max: 34 mm, step: 2 mm}
  pitch_ratio: {min: 1.1, max: 2.5, step: 0.1}
former: {material: PETG, kind: grooved-tube, wall: 2 mm}
"""


@pytest.mark.parametrize("extra, ceiling", [
    ("", "30 MHz"),
    ("shield: {inner_diameter: 50 mm, length: 120 mm, thickness: 0.1 mm, material: copper}\n", "25 MHz"),
    # One end grounded halves the first resonance (a quarter-wave line): a lower ceiling.
    ("shield: {inner_diameter: 48 mm, length: 120 mm, thickness: 0.5 mm, material: aluminium}\n"
     "surroundings: {mounting: grounded-end}\n", "12 MHz"),
])
def test_every_winner_reanalyses_to_the_search_figures(extra, ceiling):
    # What `coil design` found for each ranked design, `coil analyze` of the spec it writes finds again, with
    # the shield and the current: the inductance in the shield (the same model, to 1e-9), the SRF as mounted
    # and the winding temperature (each solved to the search tolerance, 1e-7 relative; analyze to 3e-11).
    q = libcoil.parse_requirement(WINNERS.replace("ceiling: 30 MHz", "ceiling: " + ceiling) + extra)
    r = libcoil.design(q, threads=1, top=12)
    d = r.designs
    assert len(d.spec) >= 8
    shielded = "shield" in extra
    for i, text_i in enumerate(d.spec):
        a = libcoil.analyze(libcoil.parse_coil_spec(text_i, "design"))
        nominal = a.shield.high_frequency_inductance if shielded else a.inductance.recommended
        assert nominal == pytest.approx(d.inductance[i], rel=1e-9)
        # The target at the target frequency, by the wire-harmonic solver (issue 17), as the analysis finds it
        # (to the written digits and the temperature the figures were taken at).
        at = libcoil.inductance_at_target(a, d.target_frequency[i])
        assert at == pytest.approx(d.inductance_at_target[i], rel=1e-4)
        assert abs(at / 5e-6 - 1) <= 0.02 * (1 + 1e-9)
        assert a.self_resonance_as_mounted == pytest.approx(d.self_resonance[i], rel=1e-6)
        assert a.thermal.sets_wire_temperature and a.thermal.current_frequency == 100e3
        assert a.thermal.temperature == pytest.approx(d.temperature[i], rel=1e-6)
        # The same verdict on the SRF margin the search screened.
        srf = next(c for c in a.band.criteria if c.name == "srf_margin")
        assert srf["pass"]
    chosen = r.chosen_analysis
    assert chosen is not None and chosen.band["pass"]
    assert (chosen.shield is not None) == shielded
    assert chosen.spec.mounting == ("grounded-end" if "grounded" in extra else "floating")


NEAR_THE_MARGIN = """\
target: {inductance: 12 uH, tolerance: 2 %}
band: {low: 150 kHz, ceiling: 30 MHz, srf_margin: 1.5}
operating: {current: 6 A, ambient: 30 degC, supply_voltage: 24 V}
limits: {max_outer_diameter: 50 mm, max_length: 90 mm, max_wire_length: 5 m}
search:
  wires: [AWG 16, AWG 18, AWG 20, 1.2 mm]
  form_diameter: {min: 10 mm, max: 45 mm, step: 1 mm}
  pitch_ratio: {min: 1.1, max: 3.0, step: 0.05}
former: {material: PETG, kind: grooved-tube}
"""


def test_the_search_keeps_only_designs_whose_band_the_analysis_passes():
    # The analysis widens the SRF's band by the build's spread (two standard deviations, typical tolerances
    # here); the search's confirmation must judge the same band. On this grid (benchmarks/bench_design.cpp's
    # typical requirement) the low edges of the first three designs' bands, confirmed without the spread, sat
    # 0.3 .. 1.6 % above the margin, the spread (1.7 .. 2.1 %) took each below, and `top: 1` chose nothing. The check is the library's own
    # consistency (no outside source).
    q = libcoil.parse_requirement(NEAR_THE_MARGIN)
    r = libcoil.design(q, threads=2, top=4)
    assert r.chosen == 0 and not any("passed the search's screening" in w for w in r.warnings)
    for text in r.designs.spec:
        a = libcoil.analyze(libcoil.parse_coil_spec(text, "design"))
        assert a.band["pass"], a.band.criteria
        assert a.self_resonance.frequency_low >= 1.5 * 30e6
    assert libcoil.design(q, threads=2, top=1).chosen == 0


INFEASIBLE = [
    # (edits to the demo requirement, the field the one change must name): each makes the demo infeasible
    # through one criterion.
    ([("  srf_margin: 2.5\n", "  srf_margin: 4.5\n")], "band.srf_margin"),
    ([("  max_wire_length: 3 m\n", "  max_wire_length: 0.9 m\n")], "limits.max_wire_length"),
    # (At 40 ... 45 mm the kept designs' turn-network SRF sits within 0.4 ... 10 % of the margin: lowering it a
    # little is the smaller change. At 34 mm the length alone binds.)
    ([("  max_length: 60 mm\n", "  max_length: 34 mm\n")], "limits.max_length"),
    # (At 13 A the closest misses of the thermal limit and of band.max_deviation lay within 0.01 % of each other,
    # and at 14 A the SRF margin's lay closer than the current's; at 15 A the current alone binds.)
    ([("  current: 6 A\n", "  current: 15 A\n"), ("  max_length: 60 mm\n", "  max_length: 150 mm\n")], "operating.current"),
    ([("  max_deviation: 10 %\n", "  max_deviation: 10 %\n  min_impedance: 4.9 ohm\n")], "band.min_impedance"),
]


@pytest.mark.parametrize("edits,field", INFEASIBLE, ids=[c[1] for c in INFEASIBLE])
def test_an_infeasible_requirement_names_one_change_that_works(run_coil, source_dir, tmp_path, edits, field):
    # The demo requirement made infeasible by one limit: the report names that limit and a value for it, found by
    # searching again; the requirement with that value (the check here) then has a design. (The fixture's case
    # is in test_design_fixture.py.)
    import re
    text = (source_dir / "data/examples/bench-network-requirement.yaml").read_text()
    for old, new in edits:
        assert old in text
        text = text.replace(old, new)
    path = tmp_path / "req.yaml"
    path.write_text(text)
    r = run_coil("design", path, "--json")
    assert r.returncode == 0, r.stderr
    j = json.loads(r.stdout)
    assert j["chosen"] is None and j["one_change"] and j["one_change"].startswith(("raise " + field, "lower " + field)), j.get("one_change")
    assert all(v >= 1 for v in j["best_excess_by_reason"].values())
    reason = {"srf_margin": "srf_margin", "max_wire_length": "wire_length", "max_length": "length", "current": "thermal",
              "min_impedance": "min_impedance"}[field.split(".")[1]]
    assert j["rejected_by_reason"].get(reason, 0) > 0  # the criterion named did stop candidates
    value = re.search(r" to (.+)$", j["one_change"]).group(1)
    key = field.split(".")[1]
    fixed, n = re.subn(rf"^(\s*{key}:).*$", rf"\1 {value}", text, flags=re.M)
    assert n == 1
    path.write_text(fixed)
    again = run_coil("design", path, "--json")
    assert again.returncode == 0 and json.loads(again.stdout)["chosen"] is not None, (value, again.stdout[-500:])


CONTRADICTIONS = [
    # The demo requirement (5 uH +2 %, band from 150 kHz, SRF margin 2.5 over 30 MHz): at 150 kHz |Z| is at most
    # w L / (1 - (f / f0)^2) = 4.81 ohm for any coil resonating above 75 MHz (lumped algebra). 20 ohm cannot be
    # met whatever the search tries; 4 ohm is no contradiction.
    ("  max_deviation: 10 %\n", "  max_deviation: 10 %\n  min_impedance: 20 ohm\n", ["band.min_impedance", "cannot be met", "target.inductance"]),
    ("  max_deviation: 10 %\n", "  max_deviation: 10 %\n  min_impedance: 60 ohm\n", ["band.min_impedance", "cannot be met", "target.inductance"]),
    ("  max_deviation: 10 %\n", "  max_deviation: 10 %\n  min_impedance: 4 ohm\n", None),
    # The demo's wires (AWG 14 the thickest) on its PETG former (70 degC service): even on the smallest form at
    # the largest pitch the grid allows, AWG 14 dissipates I^2 rho / A per metre, more than still air takes from
    # the winding's cylinder at 70 degC (thermal.hpp's Churchill & Chu and radiation) at 19 A and above; at 12 A
    # there is no such contradiction (the search itself judges).
    ("  current: 6 A\n", "  current: 40 A\n", ["operating.current", "search.wires", "service temperature"]),
    ("  current: 6 A\n", "  current: 19 A\n", ["operating.current", "search.wires", "service temperature"]),
    ("  current: 6 A\n", "  current: 12 A\n", None),
]


@pytest.mark.parametrize("old,new,words", CONTRADICTIONS, ids=[c[1].strip().split("\n")[-1] for c in CONTRADICTIONS])
def test_a_contradiction_is_said_before_the_search(run_coil, source_dir, tmp_path, old, new, words):
    # Fields that no coil can satisfy together are named before any search (exit 2, nothing written).
    text = (source_dir / "data/examples/bench-network-requirement.yaml").read_text()
    assert old in text
    path = tmp_path / "req.yaml"
    path.write_text(text.replace(old, new))
    r = run_coil("design", path, "--json")
    if words:
        assert r.returncode == 2 and r.stdout == "", r.stderr
        assert all(w in r.stderr for w in words), r.stderr
    else:
        assert r.returncode == 0, r.stderr


def test_no_single_change_is_said_so(run_coil, source_dir, tmp_path):
    # Two limits that bind apart: |Z| within 2 % of wL (which a longer winding alone does not give: the skin and
    # proximity effects take more than that off L at the band's low end, 3.7 % for the demo's chosen design by the
    # wire-harmonic solver) and 34 mm of length (which alone binds, above).
    text = (source_dir / "data/examples/bench-network-requirement.yaml").read_text()
    text = text.replace("  max_deviation: 10 %\n", "  max_deviation: 2 %\n").replace("  max_length: 60 mm\n", "  max_length: 34 mm\n")
    path = tmp_path / "req.yaml"
    path.write_text(text)
    r = run_coil("design", path)
    assert r.returncode == 0 and "No single limit, relaxed alone, makes a design feasible" in r.stdout, r.stdout[-800:]
    assert "the closest misses it by" in r.stdout
