"""The type stubs (bindings/python/libcoil/__init__.pyi) are complete and current: generated from the compiled
module by tools/python_stubs.py, they name every public object, and the result records' fields they list are
the fields real results have. (Tooling, no physics: common practice for a typed Python package.)"""
import ast
import os
import subprocess
import sys

import numpy as np
import pytest

import libcoil


@pytest.fixture(scope="module")
def stub(source_dir):
    return (source_dir / "bindings" / "python" / "libcoil" / "__init__.pyi").read_text()


def test_stub_is_current(source_dir, stub):
    out = subprocess.run([sys.executable, str(source_dir / "tools" / "python_stubs.py")], capture_output=True, text=True,
                         check=True, env={**os.environ}).stdout
    assert out == stub, ("regenerate: PYTHONPATH=build/python /usr/bin/python3 tools/python_stubs.py > "
                         "bindings/python/libcoil/__init__.pyi")


def test_stub_names_every_public_object(stub):
    tree = ast.parse(stub)
    named = {n.name for n in tree.body if isinstance(n, (ast.FunctionDef, ast.ClassDef))}
    named |= {t.target.id for t in tree.body if isinstance(t, ast.AnnAssign)}
    public = {n for n in dir(libcoil) if not n.startswith("_") and not isinstance(getattr(libcoil, n), type(libcoil))}
    assert public <= named, sorted(public - named)


def stub_fields(stub, cls):
    tree = ast.parse(stub)
    node = next(n for n in tree.body if isinstance(n, ast.ClassDef) and n.name == cls)
    return {t.target.id for t in node.body if isinstance(t, ast.AnnAssign)}


SPEC = """\
coil: {form_diameter: 20 mm, turns: 8, pitch: 3 mm, wire: {diameter: 1 mm, insulation: 0.03 mm}}
operating: {frequencies: [1 MHz]}
"""


def test_record_fields_are_the_results_fields(stub, source_dir):
    spec = libcoil.parse_coil_spec(SPEC)
    a = libcoil.analyze(spec)
    results = {
        "Sweep": libcoil.sweep(a, np.geomspace(1e5, 1e8, 5)),
        "FormerResult": libcoil.former(spec),
        "CouplingResult": libcoil.couple(spec, spec, 0.08),
        "DesignResult": libcoil.design(libcoil.load_requirement(str(source_dir / "data/examples/bench-network-requirement.yaml")), top=2),
    }
    for cls, result in results.items():
        assert type(result).__name__ == cls
        assert set(result.keys()) == stub_fields(stub, cls), cls
