"""A command writes its whole output set or nothing (issue 21): a blocked output name, a kill at a random
moment, stale temporaries of killed runs, two runs into one directory.

Check values: common practice (no outside source): a reader never finds a truncated file under a final name,
and a set written into a new directory appears all at once (it is renamed into place as one directory)."""
import os
import random
import signal
import subprocess
import time

import pytest

SPEC = "data/examples/bench-network-coil.yaml"


def verbs(source_dir):
    """Each verb that writes files, its arguments (with OUT for the directory) and the names it writes."""
    ex = source_dir / "data/examples"
    stem = "bench-network-coil"
    return {
        "analyze": (["analyze", ex / f"{stem}.yaml", "--out", "OUT"], [f"{stem}.analysis.txt", f"{stem}.analysis.json"]),
        "sweep": (["sweep", ex / f"{stem}.yaml", "--points", "41", "--out", "OUT"], [f"{stem}.sweep.csv", f"{stem}.s1p", f"{stem}.sweep.svg"]),
        "former": (["former", ex / f"{stem}.yaml", "--out", "OUT"], [f"{stem}.former.stl", f"{stem}.former.svg", f"{stem}.former.yaml"]),
        "compare": (["compare", ex / f"{stem}.yaml", ex / f"{stem}.measured.s1p", "--out", "OUT"], None),
        "couple": (["couple", ex / f"{stem}.yaml", ex / f"{stem}.yaml", "--distance", "60 mm", "--sweep-distance", "40 mm:200 mm:5", "--out", "OUT"],
                   [f"{stem}+{stem}.couple.json", f"{stem}+{stem}.couple.svg"]),
    }


def fill(args, out):
    return [str(out) if a == "OUT" else a for a in args]


@pytest.mark.parametrize("verb", ["analyze", "sweep", "former", "compare", "couple"])
def test_a_blocked_name_leaves_nothing(run_coil, source_dir, tmp_path, verb):
    args, names = verbs(source_dir)[verb]
    good = tmp_path / "good"
    r = run_coil(*fill(args, good))
    assert r.returncode == 0, r.stderr
    names = names or sorted(p.name for p in good.iterdir())
    assert sorted(p.name for p in good.iterdir()) == sorted(names)
    for blocked in names:  # each name in turn taken by a directory
        out = tmp_path / ("blocked-" + blocked)
        (out / blocked).mkdir(parents=True)
        r = run_coil(*fill(args, out))
        assert r.returncode == 2 and r.stdout == "", (r.returncode, r.stderr)
        assert blocked in r.stderr and "is a directory" in r.stderr, r.stderr
        assert [p.name for p in out.iterdir()] == [blocked], list(out.iterdir())  # nothing else, no temporaries
        assert list((out / blocked).iterdir()) == []


def kill_at_random(argv, delays, cwd):
    """Runs argv once per delay and SIGKILLs it after that many seconds (if it is still running)."""
    for delay in delays:
        p = subprocess.Popen(argv, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, cwd=cwd)
        time.sleep(delay)
        p.send_signal(signal.SIGKILL)
        p.wait()
        yield delay


@pytest.mark.parametrize("verb", ["former", "sweep"])
def test_a_kill_at_any_moment_leaves_the_whole_set_or_nothing(source_dir, tmp_path, verb):
    coil = os.environ.get("LIBCOIL_COIL", str(source_dir / "build/bin/coil"))
    args, names = verbs(source_dir)[verb]
    reference = tmp_path / "reference"
    took = []
    for i in range(3):  # as the kills will see it: a started process to its end, on this machine now
        t0 = time.monotonic()
        subprocess.run([coil, *fill(args, tmp_path / f"timing-{i}")], check=True, capture_output=True)
        took.append(time.monotonic() - t0)
    took = sorted(took)[1]
    subprocess.run([coil, *fill(args, reference)], check=True, capture_output=True)
    whole = {n: (reference / n).read_bytes() for n in names}
    rng = random.Random(21)
    # Into a new directory: the set appears all at once or not at all.
    delays = [rng.uniform(0, 2 * took) for _ in range(20)]
    finished = 0
    for i, _ in enumerate(kill_at_random([coil, *fill(args, tmp_path / "new")], delays, tmp_path)):
        out = tmp_path / "new"
        if out.exists():
            assert sorted(p.name for p in out.iterdir()) == sorted(names)
            for n in names:
                assert (out / n).read_bytes() == whole[n], n
            finished += 1
            os.rename(out, tmp_path / f"done-{i}")
        left = [p.name for p in tmp_path.iterdir() if p.name.startswith(".new.tmp.")]
        assert len(left) <= 1  # a killed run's hidden staging directory, removed by the next run
    # Into an existing directory holding an earlier set: every final file is always whole.
    out = tmp_path / "existing"
    subprocess.run([coil, *fill(args, out)], check=True, capture_output=True)
    for _ in kill_at_random([coil, *fill(args, out)], delays, tmp_path):
        for n in names:
            assert (out / n).read_bytes() == whole[n], n
    # The next whole run cleans what the killed ones left.
    subprocess.run([coil, *fill(args, out)], check=True, capture_output=True)
    subprocess.run([coil, *fill(args, tmp_path / "new")], check=True, capture_output=True)
    assert sorted(p.name for p in out.iterdir()) == sorted(names)
    assert not [p for p in tmp_path.iterdir() if ".tmp." in p.name]
    assert finished < len(delays), (finished, took)  # kills fell before the end, not only after it


def test_two_runs_into_one_directory_each_land_whole(source_dir, tmp_path):
    # Two formers of different chord tolerance into one directory at the same time: the directory ends with
    # one run's three files, not a mixture (it was the SVG of one and the STL of the other).
    coil = os.environ.get("LIBCOIL_COIL", str(source_dir / "build/bin/coil"))
    spec = source_dir / SPEC
    sets = {}
    for chord in ("0.01 mm", "0.05 mm"):
        d = tmp_path / chord.replace(" ", "")
        subprocess.run([coil, "former", spec, "--out", d, "--chord", chord], check=True, capture_output=True)
        sets[chord] = {p.name: p.read_bytes() for p in d.iterdir()}
    assert sets["0.01 mm"]["bench-network-coil.former.stl"] != sets["0.05 mm"]["bench-network-coil.former.stl"]
    out = tmp_path / "shared"
    out.mkdir()
    for _ in range(5):
        runs = [subprocess.Popen([coil, "former", spec, "--out", out, "--chord", c], stdout=subprocess.DEVNULL) for c in sets]
        assert [p.wait() for p in runs] == [0, 0]
        got = {p.name: p.read_bytes() for p in out.iterdir()}
        assert got in list(sets.values())
