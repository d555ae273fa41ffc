"""The layers stay visible (DEVELOPERS.md): models, studies and outputs in folders of their own, each
depending only on the layers below it; outputs that only format; no command-line flag named inside the
library; no source file grown past about 500 lines. A check of the code's shape: common practice, no source."""
import re

import pytest

LAYERS = ["core", "spec", "inputs", "models", "studies", "outputs"]
# What each layer may include from the library (its own folder, and these).
ALLOWED = {
    "core": {"core"},
    "inputs": {"core", "inputs"},           # measurement files in: plain text to records, no physics
    "spec": {"core", "spec", "models"},     # the records name materials and wires (models/materials.hpp, wire.hpp)
    "models": {"core", "spec", "models"},   # models read the plain input records (spec/records.hpp, choices.hpp)
    "studies": {"core", "spec", "inputs", "models", "studies"},
    "outputs": {"core", "spec", "inputs", "models", "studies", "outputs"},
}
# A model may see the spec layer's records and choices, never its readers.
MODEL_SPEC_HEADERS = {"spec/records.hpp", "spec/choices.hpp"}


def sources(source_dir, layer):
    return sorted((source_dir / "libcoil" / "src" / layer).glob("*.[ch]pp")) + \
        sorted((source_dir / "libcoil" / "include" / "libcoil" / layer).glob("*.hpp"))


def includes(path):
    found = []
    for m in re.finditer(r'#include "(?:libcoil/)?(\w+)/(\w+\.hpp)"', path.read_text()):
        found.append((m.group(1), f"{m.group(1)}/{m.group(2)}"))
    return found


@pytest.mark.parametrize("layer", LAYERS)
def test_each_layer_includes_only_the_layers_below(source_dir, layer):
    files = sources(source_dir, layer)
    assert files, layer
    for path in files:
        for folder, header in includes(path):
            if folder not in LAYERS:
                continue
            assert folder in ALLOWED[layer], f"{path.name} ({layer}) includes {header}"
            if layer == "models" and folder == "spec":
                assert header in MODEL_SPEC_HEADERS, f"{path.name} includes {header}"


# The names of the computations a writer must not call: the studies and the models' entry points.
COMPUTATIONS = re.compile(
    r"\b(analyze|sweep_study|study_coupling|study_wire|wire_table|design|design_spec|build_former|former_geometry|former_mesh|"
    r"check_band|screen_band|self_resonance|helical_line_resonance|shielded_coil|shield_inductance_change|"
    r"shield_capacitance|shield_terminal_capacitance|shielded_self_resonance|coupling|crosstalk|"
    r"ac_resistance|coil_at_frequencies\w*|wire_at_frequency|winding_temperature|winding_heat|settle_winding|"
    r"inductance|recommended_inductance\w*|nagaoka_\w+|skin_\w+|proximity_\w+|dc_resistance|coil_impedance|"
    r"check_mesh|magnetic_shielding|safety_cautions)\s*\(")


def test_outputs_only_format(source_dir):
    for path in sources(source_dir, "outputs"):
        text = re.sub(r'"(\\.|[^"\\])*"', '""', re.sub(r"//.*", "", path.read_text()))  # code only
        calls = COMPUTATIONS.findall(text)
        assert not calls, f"{path.name} computes: {sorted(set(calls))}"
        assert ".volume()" not in text and ".sweep(" not in text and ".at(" not in text, path.name


def test_the_library_never_names_a_flag(source_dir):
    for path in (source_dir / "libcoil").rglob("*.[ch]pp"):
        for line in path.read_text().splitlines():
            assert not re.search(r'"--\w', line), f"{path.name}: {line.strip()}"


def test_no_source_file_past_500_lines(source_dir):
    roots = [source_dir / "libcoil", source_dir / "bindings", source_dir / "tools"]
    for root in roots:
        for path in root.rglob("*.[ch]pp"):
            n = len(path.read_text().splitlines())
            assert n <= 500, f"{path.relative_to(source_dir)}: {n} lines"


def test_front_ends_share_the_one_option_table(source_dir):
    # Neither front end spells a choice word: the CLI takes the words from the table, the bindings parse with
    # the library's choices.
    cli = (source_dir / "tools" / "coil" / "main.cpp").read_text()
    bindings = "".join(p.read_text() for p in (source_dir / "bindings" / "python").glob("*.cpp"))
    for word in ['"grounded-end"', '"helical-line"', '"lumped"', '"medhurst"', '"filaments"', '"closed-form"', '"ribbed"',
                 '"grooved-tube"', '"vee"', '"side-by-side"', "IsMember"]:
        assert word not in cli, word
    for word in ['"grounded-end"', '"lumped"', '"medhurst"', '"filaments"', '"ribbed"', '"vee"', '"side-by-side"']:
        assert f"== {word}" not in bindings and f"!= {word}" not in bindings, word
