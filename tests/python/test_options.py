"""One table of options, both front ends: every row of libcoil.option_table() drives the `coil` command by its
flag and the Python module by its keyword, and the two accept and reject the same values, naming the option
the way each user wrote it. (No physics here: common practice for a command line and its bindings.)"""
import re

import pytest

import libcoil

SPEC = """\
name: "Options check"
coil: {form_diameter: 20 mm, turns: 8, pitch: 3 mm, wire: {diameter: 1 mm, insulation: 0.03 mm}}
operating: {frequencies: [1 MHz]}
former: {material: PETG, kind: grooved-tube, wall: 2 mm}
"""

TABLE = libcoil.option_table()
PY_FUNCTIONS = {"analyze": libcoil.analyze, "sweep": libcoil.sweep, "design": libcoil.design, "former": libcoil.former,
                "couple": libcoil.couple, "wire": libcoil.Wire.__init__}


def python_keywords(function):
    """The keyword names of a pybind11 function, from the signature line of its docstring."""
    first = function.__doc__.strip().splitlines()[0]
    return set(re.findall(r"(\w+): ", first[first.index("("):]))


def test_table_is_whole():
    verbs = {row["verb"] for row in TABLE}
    assert verbs == {"analyze", "sweep", "compare", "fixture", "export-circuit", "design", "former", "couple", "wire"}
    seen = set()
    for row in TABLE:
        assert row["flag"].startswith("--") and row["key"] and row["help"]
        assert (row["verb"], row["flag"]) not in seen, row  # one row per option
        seen.add((row["verb"], row["flag"]))
        assert (row["kind"] == "choice") == bool(row["choices"]), row


@pytest.mark.parametrize("row", [r for r in TABLE if r["python"]], ids=lambda r: f'{r["verb"]}:{r["key"]}')
def test_python_takes_every_shared_option_by_its_key(row):
    assert row["key"] in python_keywords(PY_FUNCTIONS[row["verb"]]), row


@pytest.mark.parametrize("verb", sorted({r["verb"] for r in TABLE}))
def test_cli_offers_every_option_of_the_table(run_coil, verb):
    help_text = run_coil(verb, "--help").stdout
    for row in TABLE:
        if row["verb"] == verb:
            assert row["flag"] in help_text, row
            for word in row["choices"]:
                assert word in help_text, (row, word)


@pytest.fixture
def files(tmp_path):
    spec = tmp_path / "coil.yaml"
    spec.write_text(SPEC)
    return spec, tmp_path


def run_both(run_coil, files, verb, key, value):
    """(cli accepted, cli message), (python accepted, python message) for one choice option's value."""
    spec, tmp = files
    flag = next(r["flag"] for r in TABLE if r["verb"] == verb and r["key"] == key)
    parsed = libcoil.load_coil_spec(str(spec))
    cli_args = {
        "analyze": ["analyze", spec],
        "sweep": ["sweep", spec, "--from", "1 MHz", "--to", "300 MHz", "--points", "21"],
        "former": ["former", spec, "--out", tmp / "former"],
        "couple": ["couple", spec, spec, "--distance", "80 mm"],
    }[verb]
    r = run_coil(*cli_args, flag, value)
    cli = (r.returncode == 0, r.stderr)
    if r.returncode != 0:
        assert r.returncode == 2 and r.stdout == "", r
        assert r.stderr.startswith(f"coil: {flag}: "), r.stderr
    try:
        if verb == "analyze":
            libcoil.analyze(parsed, **{key: value})
        elif verb == "sweep":
            libcoil.sweep(libcoil.analyze(parsed), [1e6, 300e6], **{key: value})
        elif verb == "former":
            libcoil.former(parsed, **{key: value})
        elif verb == "couple":
            libcoil.couple(parsed, parsed, 0.08, **{key: value})
        py = (True, "")
    except libcoil.InputError as e:
        assert str(e).startswith(f"{key}: "), str(e)
        py = (False, str(e))
    return cli, py


CHOICE_ROWS = [r for r in TABLE if r["kind"] == "choice" and r["python"]]


@pytest.mark.parametrize("row, value", [(r, v) for r in CHOICE_ROWS for v in r["choices"] + ["bogus"]],
                         ids=lambda x: x if isinstance(x, str) else f'{x["verb"]}:{x["key"]}')
def test_cli_and_python_accept_and_reject_the_same_words(run_coil, files, row, value):
    cli, py = run_both(run_coil, files, row["verb"], row["key"], value)
    assert cli[0] == py[0], (cli, py)
    if value == "bogus":
        assert not cli[0]
        # Both list the words allowed, from the one table.
        for word in row["choices"]:
            assert f'"{word}"' in cli[1] and f'"{word}"' in py[1]
        # Both quote the word they refused.
        assert '"bogus"' in cli[1] and '"bogus"' in py[1]


def test_a_policy_both_front_ends_keep(run_coil, files):
    # Medhurst's capacitance belongs to the lumped model: both front ends refuse it with the line model, and
    # name the option they were given.
    cli, py = run_both(run_coil, files, "sweep", "capacitance", "medhurst")
    assert not cli[0] and not py[0]
    assert "lumped model only" in cli[1] and "lumped model only" in py[1]
    # A ribbed former needs its ribs when the spec's former is not ribbed.
    cli, py = run_both(run_coil, files, "former", "kind", "ribbed")
    assert not cli[0] and not py[0] and "ribs" in cli[1] and "ribs" in py[1]


@pytest.mark.parametrize("verb, key, cli_value, py_value", [
    ("former", "chord_tolerance", "-1 mm", -1e-3),
    ("former", "groove_depth", "-1 mm", -1e-3),
    ("former", "clearance", "-0.1 mm", -1e-4),
    ("former", "ends", "-2 mm", -2e-3),
    ("former", "rib_width", "0 mm", 0.0),
    ("couple", "distance", "0 mm", 0.0),
    ("couple", "source_resistance", "-50 ohm", -50.0),
])
def test_cli_and_python_refuse_the_same_quantities(run_coil, files, verb, key, cli_value, py_value):
    spec, tmp = files
    flag = next(r["flag"] for r in TABLE if r["verb"] == verb and r["key"] == key)
    parsed = libcoil.load_coil_spec(str(spec))
    if verb == "former":
        r = run_coil("former", spec, "--out", tmp / "f", flag, cli_value)
        with pytest.raises(libcoil.InputError, match=f"^{key}: "):
            libcoil.former(parsed, **{key: py_value})
    else:
        args = {"distance": "80 mm", key: cli_value}
        r = run_coil("couple", spec, spec, *[x for k, v in args.items() for x in (next(
            row["flag"] for row in TABLE if row["verb"] == "couple" and row["key"] == k), v)])
        kwargs = {"distance": 0.08, key: py_value}
        with pytest.raises(libcoil.InputError, match=f"^{key}: "):
            libcoil.couple(parsed, parsed, **kwargs)
    assert r.returncode == 2 and r.stdout == "" and r.stderr.startswith(f"coil: {flag}: "), r.stderr
    assert not (tmp / "f").exists()


@pytest.mark.parametrize("value", [0, 500])
def test_cli_and_python_refuse_the_same_subdivision(run_coil, files, value):
    spec, _ = files
    r = run_coil("analyze", spec, "--solver", "filaments", "--layers", str(value))
    assert r.returncode == 2 and r.stderr.startswith("coil: --layers: "), r.stderr
    with pytest.raises(libcoil.InputError, match="^layers: "):
        libcoil.analyze(libcoil.load_coil_spec(str(spec)), solver="filaments", layers=value)


def test_the_sectors_default_is_the_librarys(run_coil, files):
    # Given layers and no sectors, both front ends leave the choice to the library: twice the layers.
    import json
    spec, _ = files
    cli = json.loads(run_coil("analyze", spec, "--json", "--solver", "filaments", "--layers", "3").stdout)
    py = libcoil.analyze(libcoil.load_coil_spec(str(spec)), solver="filaments", layers=3)
    assert cli["subdivision"]["sectors"] == 6
    assert py.to_dict()["loss_method"] == "filaments"
    assert cli["at_frequency"][0]["resistance_ohm"] == py.at_frequency.resistance[0]
