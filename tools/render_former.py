#!/usr/bin/python3
"""Renders a coil spec's printable former to a PNG through the libcoil module and matplotlib.

    PYTHONPATH=build/python /usr/bin/python3 tools/render_former.py SPEC.yaml OUT.png [--ribbed N WIDTH_MM]

The mesh comes from libcoil.former(), as `coil former` writes it. Facets turned away from the eye are left
out, the rest shaded by the angle of their normal to a light, and matplotlib draws them back to front.
"""
import argparse

import matplotlib
matplotlib.use("Agg")
import matplotlib.pyplot as plt  # noqa: E402
import numpy as np  # noqa: E402
from mpl_toolkits.mplot3d.art3d import Poly3DCollection  # noqa: E402

import libcoil  # noqa: E402


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("spec")
    ap.add_argument("png")
    ap.add_argument("--ribbed", nargs=2, metavar=("RIBS", "WIDTH_MM"))
    ap.add_argument("--chord-mm", type=float, default=0.02)
    a = ap.parse_args()
    options = {"chord_tolerance": a.chord_mm * 1e-3}
    if a.ribbed:
        options.update(kind="ribbed", ribs=int(a.ribbed[0]), rib_width=float(a.ribbed[1]) * 1e-3)
    r = libcoil.former(libcoil.load_coil_spec(a.spec), **options)
    tri = r["vertices"][r["faces"]] * 1e3  # mm
    n = np.cross(tri[:, 1] - tri[:, 0], tri[:, 2] - tri[:, 0])
    n /= np.linalg.norm(n, axis=1)[:, None]
    light = np.array([-0.45, -0.75, 0.5])
    light /= np.linalg.norm(light)
    elev, azim = np.radians(24), np.radians(-58)
    eye = np.array([np.cos(elev) * np.cos(azim), np.cos(elev) * np.sin(azim), np.sin(elev)])
    front = n @ eye > 0  # facets turned away from the eye are hidden: the painter's sort then holds
    tri, n = tri[front], n[front]
    shade = 0.25 + 0.75 * np.clip(n @ light, 0, 1)
    colour = np.array([0.93, 0.62, 0.28])  # a PETG orange
    faces = np.clip(shade[:, None] * colour, 0, 1)

    fig = plt.figure(figsize=(6.4, 6.4), dpi=110)
    ax = fig.add_subplot(111, projection="3d")
    ax.add_collection3d(Poly3DCollection(tri, facecolors=faces, edgecolor="none", linewidth=0, antialiased=False))
    r_out = np.hypot(tri[..., 0], tri[..., 1]).max()  # of the facets drawn
    z_max = tri[..., 2].max()
    half = max(r_out, z_max / 2)
    ax.set_xlim(-half, half)
    ax.set_ylim(-half, half)
    ax.set_zlim(z_max / 2 - half, z_max / 2 + half)
    ax.set_box_aspect((1, 1, 1))
    ax.view_init(elev=np.degrees(elev), azim=np.degrees(azim))
    ax.set_axis_off()
    title = f"{r['name']}\n{r['kind']}, {r['turns']:g} turns at {r['pitch_mm']:.3f} mm pitch, {r['triangles']} triangles"
    ax.set_title(title, fontsize=9)
    fig.savefig(a.png, bbox_inches="tight")


if __name__ == "__main__":
    main()
