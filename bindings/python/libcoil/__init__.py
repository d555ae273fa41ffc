"""libcoil: design of single-layer air-core coils.

All values are SI (m, H, F, ohm, Hz, A, K). Functions of a ratio or a geometry accept numpy arrays.
Studies return result records (libcoil.Record and its kinds): attributes, numpy arrays over frequency,
and to_dict(). Bad input raises libcoil.InputError (a ValueError) naming the field; valid input that no
model can answer raises libcoil.DomainError.
"""
from ._core import *  # noqa: F401,F403
from ._core import __version__, InputError, DomainError  # noqa: F401
from ._records import CouplingResult, DesignResult, FormerResult, Record, Sweep  # noqa: F401
