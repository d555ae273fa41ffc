"""The coil command driven as a user drives it: the demo, JSON output, files, help, and the catalogue of
bad specs in tests/cli/bad (each names the field its error must name in a '# expect:' first line)."""
import json
import os
import pathlib

import pytest

import libcoil

BAD_DIR = pathlib.Path(__file__).resolve().parents[1] / "cli" / "bad"
BAD_SPECS = sorted(BAD_DIR.glob("*.yaml"))
JSON_KEYS = {"mean_diameter_m", "winding_length_m", "wire_length_m", "turns", "pitch_m", "nagaoka_coefficient",
             "inductance_current_sheet_H", "inductance_H", "inductance_by_method"}


def expectation(spec):
    """(field, text) from the spec's '# expect: FIELD | TEXT' line; the empty file carries none."""
    lines = spec.read_bytes().decode("utf-8", "replace").splitlines()  # some hold bytes that are not UTF-8 on purpose
    if not lines:
        return "spec", "the spec is empty"
    assert lines[0].startswith("# expect: "), spec
    field, text = lines[0][len("# expect: "):].split(" | ", 1)
    return field, text


BAD_CALLS = [line for line in (BAD_DIR.parent / "bad-calls.txt").read_text().splitlines() if line.strip() and not line.startswith("#")]
BAD_REQUIREMENTS = sorted((BAD_DIR.parent / "bad-requirements").glob("*.yaml"))


def test_catalogue_is_large_enough():
    # Issue 21: at least 100 bad inputs across all subcommands.
    assert len(BAD_SPECS) >= 50 and len(BAD_CALLS) >= 80
    assert len(BAD_SPECS) + len(BAD_CALLS) + len(BAD_REQUIREMENTS) >= 100
    verbs = {line.split()[0] for line in BAD_CALLS}
    assert verbs == {"analyze", "sweep", "compare", "fixture", "export-circuit", "design", "former", "couple", "wire"}


@pytest.mark.parametrize("line", BAD_CALLS, ids=[line.split(" | ")[0][:60] for line in BAD_CALLS])
def test_bad_call_exits_2_names_the_field_and_writes_nothing(line, run_coil, source_dir, tmp_path):
    import shlex
    args, field, text = (part.strip() for part in line.split(" | ", 2))
    examples = source_dir / "data/examples"
    names = {"{spec}": examples / "bench-network-coil.yaml", "{requirement}": examples / "bench-network-requirement.yaml",
             "{fixture}": examples / "bench-network-fixture.yaml", "{measured}": examples / "bench-network-coil.measured.s1p",
             "{out}": tmp_path / "out"}

    def fill(word):
        for key, path in names.items():
            word = word.replace(key, str(path))
        while "{bad:" in word:
            i = word.index("{bad:")
            j = word.index("}", i)
            word = word[:i] + str(BAD_DIR.parent / "bad-files" / word[i + 5:j]) + word[j + 1:]
        return word

    work = tmp_path / "cwd"
    work.mkdir()
    r = run_coil(*(fill(a) for a in shlex.split(args)), cwd=work)
    assert r.returncode == 2, (r.returncode, r.stdout[-300:], r.stderr)
    assert r.stdout == "" and len(r.stderr.splitlines()) == 1, r.stderr
    assert r.stderr.startswith(f"coil: {fill(field)}: "), r.stderr
    assert fill(text) in r.stderr, r.stderr
    assert "internal error" not in r.stderr
    assert not (tmp_path / "out").exists() and list(work.iterdir()) == []


@pytest.mark.parametrize("spec", BAD_SPECS, ids=[p.name for p in BAD_SPECS])
def test_bad_spec_exits_2_names_the_field_and_writes_nothing(spec, run_coil, tmp_path):
    field, text = expectation(spec)
    out_dir = tmp_path / "out"
    for verb, *extra in (["analyze"], ["analyze", "--json"], ["analyze", "--out", out_dir], ["sweep", "--out", out_dir], ["former", "--out", out_dir]):
        r = run_coil(verb, spec, *extra)
        assert r.returncode == 2, (r.stdout, r.stderr)
        assert r.stdout == ""
        assert r.stderr.startswith("coil: "), r.stderr
        message = r.stderr[len("coil: "):]
        # The field leads the message; malformed YAML leads with FILE:LINE:COLUMN instead.
        head = message.split(": ", 1)[0]
        name = pathlib.Path(head).name
        assert head == field or name == field or name.startswith(field + ":"), message
        assert text in message, message
        assert not out_dir.exists()


def test_demo_report(run_coil, source_dir):
    r = run_coil("analyze", source_dir / "data/examples/bench-network-coil.yaml")
    assert r.returncode == 0, r.stderr
    assert r.stderr == ""
    for words in ("Geometry", "Inductance", "Nagaoka + Rosa round-wire correction", "<- recommended",
                  "AWG 16, enamel grade 2", "µH"):
        assert words in r.stdout


def test_demo_json_matches_the_library(run_coil, source_dir):
    spec = source_dir / "data/examples/bench-network-coil.yaml"
    r = run_coil("analyze", spec, "--json")
    assert r.returncode == 0, r.stderr
    j = json.loads(r.stdout)
    assert JSON_KEYS <= set(j)
    assert set(j["inductance_by_method"]) == {"wheeler", "nagaoka", "lundin", "rosa", "filament"}
    a = libcoil.analyze(libcoil.load_coil_spec(str(spec)))
    assert j["inductance_H"] == a.inductance.recommended  # the same number, to the bit, through JSON
    assert j["inductance_current_sheet_H"] == a.inductance.by_method["nagaoka"]
    assert j["turns"] == 18 and j["pitch_m"] == pytest.approx(1.9e-3, rel=1e-15)
    # Geometry convention: mean = form + bare + 2 * insulation (docs/models.md).
    w = j["wire"]
    assert j["mean_diameter_m"] == pytest.approx(j["form_diameter_m"] + w["bare_diameter_m"] + 2 * w["insulation_m"], rel=1e-15)
    assert j["winding_length_m"] == pytest.approx(18 * 1.9e-3, rel=1e-15)


def test_out_directory_gets_whole_files_only(run_coil, source_dir, tmp_path):
    spec = source_dir / "data/examples/bench-network-coil.yaml"
    r = run_coil("analyze", spec, "--out", tmp_path / "o")
    assert r.returncode == 0, r.stderr
    names = sorted(p.name for p in (tmp_path / "o").iterdir())
    assert names == ["bench-network-coil.analysis.json", "bench-network-coil.analysis.txt"]  # no temporaries
    json.loads((tmp_path / "o" / "bench-network-coil.analysis.json").read_text())


def test_help_version_and_usage_errors(run_coil):
    r = run_coil("--help")
    assert r.returncode == 0 and "analyze" in r.stdout
    r = run_coil("analyze", "--help")
    assert r.returncode == 0 and "--json" in r.stdout and "--out" in r.stdout
    r = run_coil("--version")
    assert r.returncode == 0 and libcoil.__version__ in r.stdout
    r = run_coil()
    assert r.returncode == 2 and r.stdout == ""
    r = run_coil("analyze", "/nonexistent/spec.yaml")
    assert r.returncode == 2 and r.stdout == "" and "/nonexistent/spec.yaml" in r.stderr
    r = run_coil("frobnicate")
    assert r.returncode == 2


def test_wide_pitch_falls_back_to_filament_and_says_so(run_coil, tmp_path):
    spec = tmp_path / "wide.yaml"
    spec.write_text("coil: {mean_diameter: 25 mm, turns: 5, pitch: 10 mm, wire: {diameter: 1 mm}}\n")
    r = run_coil("analyze", spec, "--json")
    j = json.loads(r.stdout)
    assert j["inductance_method"] == "filament"
    assert j["inductance_H"] == j["inductance_by_method"]["filament"]
    assert any("filament sum instead" in w for w in j["warnings"])
    assert any("bare" in n for n in j["notes"])  # no insulation given
