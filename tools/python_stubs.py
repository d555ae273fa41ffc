#!/usr/bin/env python3
"""Writes bindings/python/libcoil/__init__.pyi: the type stubs of the Python module, so that editors and type
checkers complete the API.

The functions' signatures come from the compiled module itself (pybind11 puts each one in the first line of
its docstring); the result records' fields are listed below and checked against real results by
tests/python/test_stubs.py, which also re-runs this script and fails if the committed stub differs.

Run (after a build):  PYTHONPATH=build/python /usr/bin/python3 tools/python_stubs.py > bindings/python/libcoil/__init__.pyi
"""
import inspect
import re
import sys

import libcoil
from libcoil import _core

# The fields of each result record, and what they hold: the tests compare these with real results.
ARRAY = "NDArray[np.float64]"
RECORD_FIELDS = {
    "Sweep": {
        "frequency": ARRAY, "impedance": "NDArray[np.complex128]", "wire_resistance": ARRAY, "wire_inductance": ARRAY,
        "apparent_inductance": ARRAY, "q_factor": ARRAY, "model": "str", "capacitance": "str", "mounting": "str",
        "nominal_inductance": "float", "self_resonance": "float", "temperature": "float", "band_low": "float | None",
        "band_ceiling": "float | None", "shield": "str | None",
    },
    "DesignResult": {
        "candidates_evaluated": "int", "feasible": "int", "pareto_size": "int", "rejected_by_reason": "Record",
        "designs": "Record", "chosen": "int | None", "why_chosen": "str", "binding": "str", "closest": "Record | None",
        "spread": "Record | None", "chosen_analysis": "Analysis | None", "cautions": "list[str]", "warnings": "list[str]",
        "notes": "list[str]", "fixture_check": "Record | None", "one_change": "str | None",
    },
    "FormerResult": {
        "name": "str", "kind": "str", "material": "str", "turns": "float", "pitch": "float", "outer_diameter": "float",
        "root_diameter": "float", "wire_centre_diameter": "float", "bore_diameter": "float", "bore_oversize": "float",
        "groove": "Record", "length": "float", "ends": "float", "ribs": "Record | None", "flange": "Record | None",
        "wire_cut_length": "float", "volume": "float", "mesh_volume": "float", "triangles": "int", "chord_tolerance": "float",
        "mesh_check": "Record", "files": "list[str]", "cautions": "list[str]", "notes": "list[str]",
        "vertices": ARRAY, "faces": "NDArray[np.uint32]",
    },
    "Comparison": {
        "libcoil_version": "str", "title": "str", "model": "str", "reference_frequency_Hz": "float",
        "extracted": "dict[str, float | None]", "predicted": "dict[str, float | None]", "deviation": "dict[str, float | None]",
        "fitted": "dict[str, dict[str, Any]] | None", "residual_rms_before": "float | None", "residual_rms_after": "float | None",
        "correlation": "dict[str, Any] | None", "fitted_self_resonance_Hz": "float | None", "notes": "list[str]",
        "frequency": ARRAY, "measured": "NDArray[np.complex128]", "predicted_impedance": "NDArray[np.complex128]", "weight": ARRAY,
        "fitted_impedance": "NDArray[np.complex128] | None", "bench_yaml": "str | None", "text": "str",
    },
    "CouplingResult": {
        "coil_a": "str", "coil_b": "str", "arrangement": "str", "distance": "float", "axial_offset": "float",
        "mutual_inductance": "float", "inductance_a": "float", "inductance_b": "float", "coupling_coefficient": "float",
        "dipole_mutual_inductance": "float", "source_resistance": "float", "load_resistance": "float",
        "shield_a": "str | None", "shield_b": "str | None", "mounted_inductance_a": "float", "mounted_inductance_b": "float",
        "crosstalk": "Record", "sweep": "Record", "notes": "list[str]",
    },
}
# Functions whose pybind11 return type says only "object".
RETURNS = {
    "read_network": "Record", "read_measurement": "Record", "measured_figures": "Record",
    "evaluate": "dict[str, Any]", "compare": "Comparison", "fixture": "Record", "export_circuit": "Record", "design": "DesignResult", "couple": "CouplingResult", "former": "FormerResult", "sweep": "Sweep",
    "self_resonance": "Record", "design_array": "np.recarray", "lumped_impedance": "complex | NDArray[np.complex128]",
    "awg_diameter": "float | NDArray[np.float64]",
}
# Properties of the compiled classes.
PROPERTY_TYPES = {
    "Analysis": {"spec": "CoilSpec", "inductance": "InductanceResult", "dc_resistance": "float", "loss_method": "str",
                 "at_frequency": "Record", "self_resonance": "Record", "self_resonance_as_mounted": "float",
                 "self_resonance_low_as_mounted": "float", "self_resonance_high_as_mounted": "float",
                 "impedance": "Record", "band": "Record | None", "thermal": "Record | None", "shield": "Record | None",
                 "cautions": "list[str]", "warnings": "list[str]", "notes": "list[str]"},
    "CoilSpec": {"name": "str", "description": "str", "solenoid": "Solenoid", "conductor": "Conductor", "notes": "list[str]",
                 "mounting": "str", "has_shield": "bool", "has_band": "bool", "operating": "Record", "enamel_class": "float"},
    "InductanceResult": {"nagaoka_coefficient": "float", "recommended": "float", "warnings": "list[str]",
                         "by_method": "dict[str, float]"},
}


def py_type(t):
    t = t.strip()
    t = re.sub(r"numpy\.ndarray\[numpy\.\w+\]", "ArrayLike", t)
    t = t.replace("libcoil._core.", "").replace("libcoil::", "")
    t = t.replace("os.PathLike", "str | os.PathLike[str]")
    t = re.sub(r"\bList\[", "list[", t)
    t = re.sub(r"\bTuple\[", "tuple[", t)
    t = re.sub(r"\bDict\[", "dict[", t)
    # Optional[X] as X | None, X nested two deep at most (Callable[[int, int], None]).
    t = re.sub(r"Optional\[((?:[^\[\]]|\[(?:[^\[\]]|\[[^\[\]]*\])*\])+)\]", r"\1 | None", t)
    return t


def split_params(text):
    """Top-level comma split of a parameter list."""
    out, depth, cur = [], 0, ""
    for ch in text:
        if ch in "[(":
            depth += 1
        elif ch in "])":
            depth -= 1
        if ch == "," and depth == 0:
            out.append(cur)
            cur = ""
        else:
            cur += ch
    if cur.strip():
        out.append(cur)
    return [p.strip() for p in out]


def signature_line(name, doc, method=False):
    first = doc.strip().splitlines()[0]
    m = re.match(r"^\w+\((.*)\) -> (.+)$", first)
    if not m:
        return None
    params = []
    for p in split_params(m.group(1)):
        if p == "self" or p.startswith("self:"):
            params.append("self")
            continue
        pm = re.match(r"^(\w+): (.+?)(?: = (.+))?$", p)
        if not pm:
            params.append(p)
            continue
        pname, ptype, default = pm.groups()
        ptype = py_type(ptype)
        params.append(f"{pname}: {ptype}" + (" = ..." if default is not None else ""))
    ret = py_type(m.group(2))
    if ret == "object" or ret.startswith("ArrayLike"):
        ret = RETURNS.get(name, "float | NDArray[np.float64]" if "numpy.ndarray" in m.group(1) and ret == "object" else "Any")
    if ret == "dict":
        ret = "dict[str, Any]"
    if ret == "list":
        ret = "list[dict[str, Any]]"
    if ret == "tuple":
        ret = "tuple[float, float, float, float]"
    ret = ret.replace("None", "None")
    if method and params and params[0] != "self":
        params.insert(0, "self")
    return f"def {name}({', '.join(params)}) -> {ret}: ..."


def class_block(name, cls):
    lines = [f"class {name}:"]
    body = []
    for attr, value in sorted(vars(cls).items()):
        if attr.startswith("_") and attr != "__init__":
            continue
        if isinstance(value, property):
            t = PROPERTY_TYPES.get(name, {}).get(attr)
            if t is None:  # the getter's own signature, "(self: ...) -> float"
                m = re.search(r"-> (.+)$", (getattr(value.fget, "__doc__", None) or "").strip().splitlines()[0] if value.fget.__doc__ else "")
                t = py_type(m.group(1)) if m else "Any"
            body.append(f"    @property\n    def {attr}(self) -> {t}: ...")
        elif callable(value) and getattr(value, "__doc__", None):
            docs = value.__doc__.strip().split("\n\n")
            overloads = [d for d in value.__doc__.splitlines() if re.match(r"^\d+\. ", d)]
            if overloads:
                for o in overloads:
                    sig = signature_line(attr, o.split(". ", 1)[1], method=True)
                    if sig:
                        body.append("    @overload\n    " + sig)
            else:
                sig = signature_line(attr, docs[0], method=True)
                if sig:
                    body.append("    " + sig)
    return "\n".join(lines + (body or ["    ..."]))


def main():
    out = ['"""Type stubs of libcoil (generated by tools/python_stubs.py from the compiled module; do not edit)."""',
           "import os",
           "from typing import Any, Callable, Iterator, overload",
           "",
           "import numpy as np",
           "from numpy.typing import ArrayLike, NDArray",
           "",
           "__version__: str",
           "mu0: float",
           "eps0: float",
           "speed_of_light: float",
           "min_harmonic_diameter_ratio: float",
           "",
           "class InputError(ValueError): ...",
           "class DomainError(ValueError): ...",
           "",
           "class Record:",
           "    def __init__(self, fields: dict[str, Any] | None = ..., **more: Any) -> None: ...",
           "    def __getattr__(self, name: str) -> Any: ...",
           "    def __getitem__(self, key: str) -> Any: ...",
           "    def __contains__(self, key: object) -> bool: ...",
           "    def __iter__(self) -> Iterator[str]: ...",
           "    def __len__(self) -> int: ...",
           "    def keys(self) -> Any: ...",
           "    def values(self) -> Any: ...",
           "    def items(self) -> Any: ...",
           "    def get(self, key: str, default: Any = ...) -> Any: ...",
           "    def to_dict(self) -> dict[str, Any]: ...",
           ""]
    for record, fields in RECORD_FIELDS.items():
        out.append(f"class {record}(Record):")
        out.extend(f"    {k}: {v}" for k, v in fields.items())
        if record == "Sweep":
            out.append("    def plot(self, ax: Any = ...) -> Any: ...")
        out.append("")
    for name in sorted(dir(_core)):
        if name.startswith("_") or name in ("InputError", "DomainError", "mu0", "eps0", "speed_of_light", "min_harmonic_diameter_ratio"):
            continue
        obj = getattr(_core, name)
        if inspect.isclass(obj):
            out.append(class_block(name, obj))
            out.append("")
    for name in sorted(dir(_core)):
        obj = getattr(_core, name)
        if name.startswith("_") or inspect.isclass(obj) or not callable(obj):
            continue
        sig = signature_line(name, obj.__doc__)
        assert sig, name
        out.append(sig)
    sys.stdout.write("\n".join(out) + "\n")


if __name__ == "__main__":
    main()
