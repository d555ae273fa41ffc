"""Result records: what a libcoil study returns to Python.

A record holds one study's result as attributes: numbers as floats, curves over frequency (or over
designs, distances) as numpy arrays, nested parts as records of their own. It reads like an object
(``a.self_resonance.frequency``) and, for code written against plain dicts, like a mapping
(``a.self_resonance["frequency"]``). ``to_dict()`` gives plain dicts, lists and arrays back.
"""
from __future__ import annotations

from typing import Any, Iterator

import numpy as np

__all__ = ["Record", "Sweep", "DesignResult", "FormerResult", "CouplingResult", "Comparison"]


def _wrap(value: Any) -> Any:
    if isinstance(value, dict):
        return Record(value)
    if isinstance(value, list) and value and all(isinstance(v, dict) for v in value):
        return [Record(v) for v in value]
    return value


def _unwrap(value: Any) -> Any:
    if isinstance(value, Record):
        return value.to_dict()
    if isinstance(value, list):
        return [_unwrap(v) for v in value]
    return value


class Record:
    """One study's result: attributes, item access, ``keys()`` and ``to_dict()``."""

    __slots__ = ("_fields",)

    def __init__(self, fields: dict | None = None, **more: Any) -> None:
        merged = dict(fields or {})
        merged.update(more)
        object.__setattr__(self, "_fields", {k: _wrap(v) for k, v in merged.items()})

    def __getattr__(self, name: str) -> Any:
        try:
            return self._fields[name]
        except KeyError:
            raise AttributeError(f"{type(self).__name__} has no field {name!r}; fields: {', '.join(self._fields)}") from None

    def __setattr__(self, name: str, value: Any) -> None:
        raise AttributeError(f"{type(self).__name__} is read-only")

    def __getitem__(self, key: str) -> Any:
        return self._fields[key]

    def __contains__(self, key: object) -> bool:
        return key in self._fields

    def __iter__(self) -> Iterator[str]:
        return iter(self._fields)

    def __len__(self) -> int:
        return len(self._fields)

    def __dir__(self) -> list[str]:
        return sorted(set(super().__dir__()) | set(self._fields))

    def keys(self):
        return self._fields.keys()

    def values(self):
        return self._fields.values()

    def items(self):
        return self._fields.items()

    def get(self, key: str, default: Any = None) -> Any:
        return self._fields.get(key, default)

    def to_dict(self) -> dict:
        """Plain dicts and lists all the way down; arrays stay numpy arrays."""
        return {k: _unwrap(v) for k, v in self._fields.items()}

    def __repr__(self) -> str:
        def short(v: Any) -> str:
            if isinstance(v, np.ndarray):
                return f"array(shape={v.shape})"
            if isinstance(v, Record):
                return f"{type(v).__name__}(...)"
            if isinstance(v, list):
                return f"[{len(v)} items]"
            text = repr(v)
            return text if len(text) <= 40 else text[:37] + "..."

        inner = ", ".join(f"{k}={short(v)}" for k, v in self._fields.items())
        return f"{type(self).__name__}({inner})"


class Sweep(Record):
    """Z(f) of a coil as mounted: ``frequency``, ``impedance`` (complex), ``self_resonance``, ..."""

    __slots__ = ()

    def plot(self, ax=None):
        """|Z| against frequency on log axes, with the ideal wL dashed (matplotlib)."""
        import matplotlib.pyplot as plt

        ax = ax or plt.gca()
        f = self.frequency
        ax.loglog(f, np.abs(self.impedance), label="|Z|")
        ax.loglog(f, 2 * np.pi * f * self.nominal_inductance, "--", label="ideal ωL")
        ax.axvline(self.self_resonance, color="C3", lw=0.8)
        ax.set_xlabel("frequency (Hz)")
        ax.set_ylabel("|Z| (Ω)")
        ax.legend()
        return ax


class DesignResult(Record):
    """The ranked designs of a requirement: ``designs`` (arrays over the ranking), ``chosen``, ..."""

    __slots__ = ()


class FormerResult(Record):
    """The printable former: its dimensions (SI), ``vertices`` (n, 3) in m and ``faces`` (m, 3)."""

    __slots__ = ()


class CouplingResult(Record):
    """M, k and the crosstalk between two coils as mounted."""

    __slots__ = ()


class Comparison(Record):
    """A measurement beside the prediction: ``extracted``, ``predicted``, ``deviation`` (figures by key), the
    arrays ``frequency``, ``measured``, ``predicted_impedance``, and with a fit ``fitted`` and ``bench_yaml``."""

    __slots__ = ()

    def plot(self, ax=None):
        """|Z| measured, predicted (and fitted) against frequency on log axes (matplotlib)."""
        import matplotlib.pyplot as plt

        ax = ax or plt.gca()
        ax.loglog(self.frequency, np.abs(self.measured), label="measured")
        ax.loglog(self.frequency, np.abs(self.predicted_impedance), "--", label="predicted")
        if self.fitted_impedance is not None:
            ax.loglog(self.frequency, np.abs(self.fitted_impedance), ":", label="fitted")
        ax.set_xlabel("frequency (Hz)")
        ax.set_ylabel("|Z| (Ω)")
        ax.legend()
        return ax
