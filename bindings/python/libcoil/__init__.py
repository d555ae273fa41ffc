"""libcoil: design of single-layer air-core coils.

All values are SI (m, H, F, ohm, Hz, A, K). Functions of a ratio or a geometry accept numpy arrays.
Bad input raises libcoil.InputError (a ValueError) naming the field.
"""
from ._core import *  # noqa: F401,F403
from ._core import __version__, InputError, DomainError  # noqa: F401
