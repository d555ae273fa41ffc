#!/usr/bin/env python3
"""The finite-element reference for a coil's R and L (issue 17's outside check): N coaxial rings of round
wire in series, solved axisymmetrically by Debian's gmsh and getdp (general solvers, used here as the
outside reference). `impedance(...)` meshes rings.geo, runs rings.pro and returns the coil's Z = R + jwL at
one frequency (ohm), the rings' voltages summed for 1 A. The formulation's template comes from the getdp
package itself (/usr/share/doc/getdp/examples/templates), copied beside the model in a temporary folder.

Run:  /usr/bin/python3 tests/reference/fem/fem.py A R N P F    (mean radius, wire radius, rings, pitch, Hz)
"""
import math
import os
import shutil
import subprocess
import sys
import tempfile

HERE = os.path.dirname(os.path.abspath(__file__))
TEMPLATE = "/usr/share/doc/getdp/examples/templates/Lib_Magnetodynamics2D_av_Cir.pro"
COPPER = 5.8e7  # S/m, the test's conductivity (IEC 60028's annealed copper at 20 degC is 5.8e7 S/m)


def skin_depth(frequency, sigma=COPPER):
    return math.sqrt(2 / (2 * math.pi * frequency * 4e-7 * math.pi * sigma))


def impedance(a, r, n, pitch, frequency, sigma=COPPER, wall=3, domain=5, hmax_over_a=0.1, tube=None, timeout=5400):
    """Z (ohm) of n rings in series at `frequency`; the mesh is hw = skin depth / `wall` at the wires (at
    most r / 10: on close-12-fine at 100 kHz, where the skin depth does not bind, r / 4 read R 0.23 % above
    r / 8 and r / 16 a further 0.07 % below), the air to `domain` x the coil's size, hmax = `hmax_over_a` x a. `tube` = (bore radius,
    wall thickness, length[, conductivity]) adds a coaxial conducting tube centred on the coil (an open
    shield), meshed at its skin depth / `wall` (at most a quarter of its wall). getdp gets `timeout` seconds."""
    for tool in ("gmsh", "getdp"):
        if shutil.which(tool) is None:
            raise RuntimeError(f"{tool} is missing: tools/setup --references installs it")
    if not os.path.exists(TEMPLATE):
        raise RuntimeError(f"{TEMPLATE} is missing: the getdp package installs it")
    size = max(a + r, n * pitch / 2)
    if tube is not None:
        size = max(size, tube[0] + tube[1], tube[2] / 2)
    rint, rext = domain * size, 2 * domain * size
    hw = min(skin_depth(frequency, sigma) / wall, r / 10)
    with tempfile.TemporaryDirectory() as tmp:
        for f in ("rings.geo", "rings.pro"):
            shutil.copy(os.path.join(HERE, f), tmp)
        shutil.copy(TEMPLATE, tmp)
        numbers = {"a": a, "r": r, "Rings": n, "p": pitch, "Rint": rint, "Rext": rext, "hw": hw, "hmax": hmax_over_a * a}
        sigt = sigma
        if tube is not None:
            sigt = tube[3] if len(tube) > 3 else sigma
            numbers.update({"Tube": 1, "Tb": tube[0], "Tt": tube[1], "Tl": tube[2],
                            "ht": min(skin_depth(frequency, sigt) / wall, tube[1] / 4)})
        args = [x for k, v in numbers.items() for x in ("-setnumber", k, repr(float(v)))]
        subprocess.run(["gmsh", "-2", "-format", "msh22", "rings.geo", "-o", "rings.msh"] + args, cwd=tmp, check=True,
                       capture_output=True, timeout=600)
        pro = ["-setnumber", "Rings", str(n), "-setnumber", "Freq", repr(float(frequency)), "-setnumber", "sig", repr(float(sigma)),
               "-setnumber", "Rint", repr(rint), "-setnumber", "Rext", repr(rext),
               "-setnumber", "Tube", "1" if tube is not None else "0", "-setnumber", "sigt", repr(float(sigt))]
        subprocess.run(["getdp", "rings.pro", "-msh", "rings.msh", "-solve", "Magnetodynamics2D_av", "-pos", "voltages"] + pro,
                       cwd=tmp, check=True, capture_output=True, timeout=timeout)
        values = [float(x) for line in open(os.path.join(tmp, "U.txt")) for x in line.split()[1:]]
    # One row: the time (0), then each ring's voltage as (real, imaginary). GetDP's U is the voltage the
    # field drives, -Z I for the imposed 1 A; the rings are in series.
    if len(values) != 2 * n:
        raise RuntimeError(f"getdp printed {len(values)} numbers for {n} rings")
    return -sum(complex(values[2 * k], values[2 * k + 1]) for k in range(n))


if __name__ == "__main__":
    a, r, n, p, f = (float(x) for x in sys.argv[1:6])
    z = impedance(a, r, int(n), p, f)
    print(f"R = {z.real:.9e} ohm, L = {z.imag / (2 * math.pi * f):.9e} H")
