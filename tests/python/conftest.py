"""Shared fixtures: the built module comes from PYTHONPATH (build/python), the CLI from LIBCOIL_COIL."""
import os
import pathlib
import subprocess

import pytest

SOURCE_DIR = pathlib.Path(os.environ.get("LIBCOIL_SOURCE_DIR", pathlib.Path(__file__).resolve().parents[2]))
COIL = os.environ.get("LIBCOIL_COIL", str(SOURCE_DIR / "build" / "bin" / "coil"))


@pytest.fixture(scope="session")
def source_dir():
    return SOURCE_DIR


@pytest.fixture(scope="session")
def tool_script():
    """A script of tools/ loaded as a module by its name, for its functions (its main() does not run)."""
    import importlib.util

    def load(name):
        spec = importlib.util.spec_from_file_location(name, SOURCE_DIR / "tools" / f"{name}.py")
        module = importlib.util.module_from_spec(spec)
        spec.loader.exec_module(module)
        return module
    return load


@pytest.fixture(scope="session")
def run_coil():
    def run(*args, cwd=None):
        return subprocess.run([COIL, *map(str, args)], capture_output=True, text=True, cwd=cwd, timeout=120)
    return run


# Property tests run the same examples on every CI run (a landing never hangs on a new random draw); a
# developer's run keeps exploring new ones.
try:
    from hypothesis import settings

    settings.register_profile("ci", derandomize=True, database=None)
    if os.environ.get("CI"):
        settings.load_profile("ci")
except ImportError:  # hypothesis is installed by tools/setup; without it the property tests are skipped
    pass
