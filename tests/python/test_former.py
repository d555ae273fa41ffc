"""The printable former as a user gets it: `coil former` and libcoil.former(). The outside checker is
admesh (Debian's package): it must find no disconnected facets, fix no edges and remove no facets, and
its volume must agree with libcoil's closed form within 0.5 %."""
import json
import re
import shutil
import subprocess

import numpy as np
import pytest

import libcoil

SPEC = """\
name: "Test former"
coil:
  form_diameter: 20 mm
  turns: 12.25
  pitch: 1.5 mm
  lead_length: 60 mm
  wire: {diameter: 1.0 mm, insulation: 0.05 mm}
former:
  material: PETG
  kind: grooved-tube
  wall: 3 mm
"""
VARIANTS = {
    "tube": [],
    "ribbed": ["--kind", "ribbed", "--ribs", "8", "--rib-width", "3 mm"],
    "vee-flanges": ["--profile", "vee", "--flange", "30 mm x 2 mm"],
    "ascii": ["--ascii"],
}


def admesh(path):
    exe = shutil.which("admesh")
    assert exe, "admesh is missing: tools/setup installs it"
    out = subprocess.run([exe, str(path)], capture_output=True, text=True, timeout=120, check=True).stdout
    def number(label):
        m = re.search(re.escape(label) + r"\s*:\s*([-0-9.]+)", out)
        assert m, (label, out)
        return float(m.group(1))
    return {k: number(k) for k in ("Total disconnected facets", "Edges fixed", "Facets removed", "Facets added",
                                   "Facets reversed", "Backwards edges", "Degenerate facets", "Number of parts",
                                   "Volume", "Number of facets")}


def read_binary_stl(path):
    data = path.read_bytes()
    n = int(np.frombuffer(data, np.uint32, 1, 80)[0])
    assert len(data) == 84 + 50 * n  # the header and count agree with the size
    rec = np.frombuffer(data, np.dtype([("n", "<f4", 3), ("v", "<f4", (3, 3)), ("a", "<u2")]), n, 84)
    return rec["n"].astype(float), rec["v"].astype(float)


@pytest.fixture
def spec_file(tmp_path):
    p = tmp_path / "coil.yaml"
    p.write_text(SPEC)
    return p


@pytest.mark.parametrize("variant", VARIANTS)
def test_admesh_accepts_the_former_and_agrees_on_its_volume(variant, spec_file, run_coil, tmp_path):
    out = tmp_path / "out"
    r = run_coil("former", spec_file, "--out", out, "--json", *VARIANTS[variant])
    assert r.returncode == 0, r.stderr
    summary = json.loads(r.stdout)
    assert summary["files"] == [str(out / f"coil.former.{ext}") for ext in ("stl", "svg", "yaml")]
    a = admesh(out / "coil.former.stl")
    assert a["Number of facets"] == summary["triangles"]
    for key in ("Total disconnected facets", "Edges fixed", "Facets removed", "Facets added", "Facets reversed",
                "Backwards edges", "Degenerate facets"):
        assert a[key] == 0, (key, a)
    assert a["Number of parts"] == 1
    # Measured: -0.013 % (tube), -0.062 % (ribbed), -0.094 % (vee with flanges).
    assert a["Volume"] / summary["volume_mm3"] - 1 == pytest.approx(0, abs=5e-3)
    if variant == "ascii":
        assert (out / "coil.former.stl").read_text().startswith("solid libcoil_former")


def test_pitch_and_root_from_the_stl_vertices(spec_file, run_coil, tmp_path):
    r = run_coil("former", spec_file, "--out", tmp_path, "--json")
    s = json.loads(r.stdout)
    normals, tri = read_binary_stl(tmp_path / "coil.former.stl")
    v = tri.reshape(-1, 3)
    radius = np.hypot(v[:, 0], v[:, 1])
    root = s["root_diameter_mm"] / 2
    assert radius[radius > s["bore_diameter_mm"] / 2 + 1e-3].min() == pytest.approx(root, abs=1e-5)  # float32 in mm
    # Groove bottoms, grouped by angle: consecutive turns one design pitch apart within 1 um.
    bottom = np.abs(radius - root) < 1e-5
    angle = np.round(np.arctan2(v[bottom, 1], v[bottom, 0]), 5)
    diffs = []
    for a in np.unique(angle):
        z = np.sort(v[bottom][angle == a, 2])
        z = z[np.r_[True, np.diff(z) > 1e-4]]  # each bottom vertex once (the STL repeats shared ones)
        diffs.extend(np.diff(z))
    diffs = np.array(diffs)
    assert len(diffs) > 500
    assert np.abs(diffs - s["pitch_mm"]).max() < 1e-3  # 1 um; measured 9.5e-7 mm (float32 rounding)
    # Every stored normal points the way the winding order says.
    n = np.cross(tri[:, 1] - tri[:, 0], tri[:, 2] - tri[:, 0])
    n /= np.linalg.norm(n, axis=1)[:, None]
    assert np.einsum("ij,ij->i", n, normals).min() > 0.99


def test_python_module_returns_the_mesh_and_writes_the_files(spec_file, tmp_path):
    spec = libcoil.load_coil_spec(str(spec_file))
    r = libcoil.former(spec, out_dir=str(tmp_path), stem="py", kind="ribbed", ribs=6, rib_width=3e-3)
    assert isinstance(r, libcoil.FormerResult)
    v, f = r.vertices, r.faces
    assert v.shape[1] == 3 and f.shape == (r.triangles, 3) and f.max() < len(v)
    # The signed volume by the divergence theorem, in numpy, equals the library's check (both m^3).
    vol = np.einsum("ij,ij->i", v[f[:, 0]], np.cross(v[f[:, 1]], v[f[:, 2]])).sum() / 6
    assert vol == pytest.approx(r.mesh_volume, rel=1e-12)
    assert vol == pytest.approx(r.volume, rel=5e-3)
    assert [p.split("/")[-1] for p in r.files] == ["py.former.stl", "py.former.svg", "py.former.yaml"]
    assert all((tmp_path / p.split("/")[-1]).stat().st_size > 0 for p in r.files)
    assert r.ribs.count == 6 and r.mesh_check.sound
    assert any("ribs" in n for n in r.notes)  # the chord between ribs, stated
    assert set(r.to_dict()) >= {"vertices", "faces", "pitch", "outer_diameter", "groove"}
    with pytest.raises(libcoil.InputError, match="former.ribs"):
        libcoil.former(spec, kind="ribbed", ribs=12, rib_width=4.5e-3)


def test_every_design_of_a_requirement_makes_a_former(source_dir, tmp_path, run_coil):
    req = libcoil.load_requirement(str(source_dir / "data" / "examples" / "bench-network-requirement.yaml"))
    result = libcoil.design(req, threads=1, top=10)
    d = result.designs
    assert len(d.spec) >= 5  # seven pass the turn network's band since the target holds at 2.1 MHz (issue 17)
    for text, pitch, form in zip(d.spec, d.pitch, d.form_diameter):
        spec = libcoil.parse_coil_spec(text, "design")
        r = libcoil.former(spec)  # the design spec, unchanged
        assert r.mesh_check.sound
        assert r.pitch == pytest.approx(pitch, rel=1e-9)
        assert r.root_diameter == pytest.approx(form, rel=1e-9)


def test_the_sheet_carries_the_dimensions(spec_file, run_coil, tmp_path):
    r = run_coil("former", spec_file, "--out", tmp_path, "--json")
    s = json.loads(r.stdout)
    svg = (tmp_path / "coil.former.svg").read_text()
    assert svg.startswith("<svg")
    for key, attr in (("pitch_mm", "data-pitch-mm"), ("outer_diameter_mm", "data-outer-diameter-mm"),
                      ("root_diameter_mm", "data-root-diameter-mm")):
        m = re.search(attr + r'="([0-9.e+-]+)"', svg)
        assert float(m.group(1)) == pytest.approx(s[key], rel=1e-8)
    for gid in ("dim-length", "dim-winding", "dim-bore", "dim-root", "dim-outer", "dim-pitch", "dim-depth", "section", "detail"):
        assert f'id="{gid}"' in svg, gid
    dims = (tmp_path / "coil.former.yaml").read_text()
    assert "wire_cut_length:" in dims and "groove:" in dims
    # The wire to cut: the helix, N sqrt((pi D)^2 + p^2) with D the wire centre diameter, plus the leads.
    d, n, p = s["wire_centre_diameter_mm"], s["turns"], s["pitch_mm"]
    assert s["wire_cut_length_m"] * 1e3 == pytest.approx(n * np.hypot(np.pi * d, p) + 60, rel=1e-12)


@pytest.mark.parametrize("args, field", [
    (["--clearance", "0.5 mm"], "coil.pitch"),
    (["--groove-depth", "0.9 mm"], "former.groove.depth"),
    (["--flange", "40 mm"], "--flange"),
    (["--kind", "ribbed"], "--kind"),
    (["--chord", "-1 mm"], "--chord"),
    (["--bore-oversize", "3.8 mm"], "former.bore_oversize"),
])
def test_unprintable_former_exits_2_names_the_field_and_writes_nothing(args, field, spec_file, run_coil, tmp_path):
    out = tmp_path / "out"
    r = run_coil("former", spec_file, "--out", out, *args)
    assert r.returncode == 2, (r.stdout, r.stderr)
    assert r.stdout == ""
    assert r.stderr.startswith("coil: " + field), r.stderr
    assert not out.exists() or not any(out.iterdir())


def test_the_search_keeps_the_grooves_clearance_between_turns(source_dir):
    # The demo requirement with a wider groove clearance: the grid's close pitches are rejected as "groove",
    # and every design left has pitch >= insulated wire + clearance (the wire's insulated diameter from the
    # design's own outer - form diameters).
    text = (source_dir / "data" / "examples" / "bench-network-requirement.yaml").read_text()
    text = text.replace("  wall: 3 mm", "  wall: 3 mm\n  groove: {clearance: 0.3 mm}")
    assert "clearance: 0.3 mm" in text
    result = libcoil.design(libcoil.parse_requirement(text), threads=1, top=50)
    base = libcoil.design(libcoil.load_requirement(str(source_dir / "data" / "examples" / "bench-network-requirement.yaml")),
                          threads=1, top=50)
    assert result.rejected_by_reason["groove"] > base.rejected_by_reason["groove"]
    d = result.designs
    insulated = (d.outer_diameter - d.form_diameter) / 2
    assert len(d.pitch) > 0 and np.all(d.pitch >= insulated + 0.3e-3 * (1 - 1e-12))
    b = base.designs
    assert np.min(b.pitch - (b.outer_diameter - b.form_diameter) / 2) < 0.3e-3
