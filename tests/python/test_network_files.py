"""Measurement files in (libcoil/inputs/network_file.hpp): Touchstone 1.x and 2.0 and the CSV layout, read
back from files an outside writer made (scikit-rf, the reference library) and a catalogue of malformed files,
each a clear error naming its line. The Touchstone format is the open standard (IBIS Open Forum, Touchstone
2.0, 2009); the version 1 rules checked here (option line defaults, the 2-port order 11 21 12 22, Z and Y
normalised to R, the noise block after the frequency falls back) are that standard's, quoted from memory."""
import math

import numpy as np
import pytest

import libcoil

skrf = pytest.importorskip("skrf")


def series_rlc(w, r=2.0, l=1e-6, c=10e-12):
    return r + 1j * w * l + 1 / (1j * w * c)


def parallel_rlc(w, r=5e3, l=1e-6, c=10e-12):
    return 1 / (1 / r + 1 / (1j * w * l) + 1j * w * c)


@pytest.mark.parametrize("form", ["ri", "ma", "db"])
@pytest.mark.parametrize("unit", ["Hz", "MHz"])
@pytest.mark.parametrize("z0", [50.0, 75.0])
def test_one_port_files_written_by_scikit_rf_read_back(tmp_path, form, unit, z0):
    f = skrf.Frequency(0.3, 300, 41, "MHz")
    f.unit = unit
    w = 2 * math.pi * f.f
    for name, z in (("series", series_rlc(w)), ("parallel", parallel_rlc(w))):
        s = ((z - z0) / (z + z0)).reshape(-1, 1, 1)
        skrf.Network(frequency=f, s=s, z0=z0, name=name).write_touchstone(str(tmp_path / name), form=form)
        got = libcoil.read_network(str(tmp_path / f"{name}.s1p"))
        assert got.ports == 1 and got.parameter == "S" and got.reference == [z0]
        np.testing.assert_allclose(got.frequency, f.f, rtol=1e-12)
        np.testing.assert_allclose(got.matrix, s, rtol=1e-9, atol=1e-12)
        again = skrf.Network(str(tmp_path / f"{name}.s1p"))  # the reference library's own reading of the file
        np.testing.assert_allclose(got.matrix, again.s, rtol=1e-9, atol=1e-12)


@pytest.mark.parametrize("form", ["ri", "ma", "db"])
def test_two_port_files_written_by_scikit_rf_read_back(tmp_path, form):
    # A series element between the ports: S11 = Z / (Z + 2 Z0), S21 = 2 Z0 / (Z + 2 Z0); S12 set apart from
    # S21 by a factor so that the port order is seen.
    f = skrf.Frequency(1, 200, 23, "MHz")
    w = 2 * math.pi * f.f
    z = series_rlc(w)
    s = np.zeros((len(w), 2, 2), complex)
    s[:, 0, 0] = z / (z + 100)
    s[:, 1, 0] = 100 / (z + 100)
    s[:, 0, 1] = 0.5 * s[:, 1, 0]
    s[:, 1, 1] = 0.9 * s[:, 0, 0]
    skrf.Network(frequency=f, s=s, z0=50).write_touchstone(str(tmp_path / "thru"), form=form)
    got = libcoil.read_network(str(tmp_path / "thru.s2p"))
    assert got.ports == 2 and got.reference == [50.0, 50.0]
    np.testing.assert_allclose(got.matrix, s, rtol=1e-9, atol=1e-12)


def write(tmp_path, name, text):
    p = tmp_path / name
    p.write_text(text)
    return str(p)


def test_version_1_z_is_normalised_to_r_and_the_noise_block_is_left_out(tmp_path):
    text = ("! a 2-port in Z, normalised to 75 ohm\n# kHz Z RI R 75\n"
            "100 1 0  0.5 0  0.25 0  2 0\n200 1 1  0.5 0.5  0.25 0.25  2 2\n"
            "! noise: frequency, NFmin, |Gopt|, angle, Rn\n150 1.0 0.5 30 0.2\n250 1.2 0.4 35 0.2\n")
    got = libcoil.read_network(write(tmp_path, "z.s2p", text))
    assert got.parameter == "Z"
    np.testing.assert_allclose(got.frequency, [1e5, 2e5])
    np.testing.assert_allclose(got.matrix[0], [[75, 0.25 * 75], [0.5 * 75, 150]])  # 11 21 12 22
    assert any("noise" in n for n in got.notes)


def test_version_2_keywords(tmp_path):
    text = ("! version 2, 12_21 order, its own references, Z not normalised\n[Version] 2.0\n# GHz Z MA R 50\n"
            "[Number of Ports] 2\n[Two-Port Data Order] 12_21\n[Number of Frequencies] 2\n[Reference] 50\n 75\n"
            "[Network Data]\n0.1 10 0  20 90\n  30 0  40 -90\n0.2 11 0 21 0 31 0 41 0\n[End]\n")
    got = libcoil.read_network(write(tmp_path, "v2.ts", text))
    assert got.ports == 2 and got.reference == [50.0, 75.0]
    np.testing.assert_allclose(got.frequency, [1e8, 2e8])
    np.testing.assert_allclose(got.matrix[0], [[10, 20j], [30, -40j]], atol=1e-12)


def test_csv_layouts(tmp_path):
    rect = libcoil.read_network(write(tmp_path, "r.csv", "frequency [MHz], Z real [ohm], Z imag [ohm]\n1, 2, 3\n2, 4, -5\n"))
    assert rect.parameter == "Z"
    np.testing.assert_allclose(rect.frequency, [1e6, 2e6])
    np.testing.assert_allclose(rect.matrix[:, 0, 0], [2 + 3j, 4 - 5j])
    polar = libcoil.read_network(write(tmp_path, "p.csv", "Frequency [Hz],Z Magnitude [ohm],Z Phase [deg]\r\n10,2,90\r\n20,1,-180\r\n"))
    np.testing.assert_allclose(polar.matrix[:, 0, 0], [2j, -1], atol=1e-12)
    s = libcoil.read_network(write(tmp_path, "s.csv", "# reference 75 ohm\nfrequency [GHz], S11 real, S11 imag\n0.5, 0.1, 0.2\n"))
    assert s.parameter == "S" and s.reference == [75.0]


# Each malformed file: its name, its text, the line the error names, and a fragment of what it says.
MALFORMED = [
    ("a.s1p", "# MHz S RI R 50\n1 0.5\n", 2, "cut short"),
    ("b.s1p", "# MHz S RI R 50\n1 0.5 x\n", 2, "finite number"),
    ("c.s1p", "# MHz S RI R 50\n2 0.5 0\n1 0.5 0\n", 3, "rise"),
    ("d.s1p", "# MHz S RI R 50\n1 0.5 0\n1 0.5 0\n", 3, "rise"),
    ("e.s1p", "1 0.5 0\n# MHz S RI R 50\n", 1, "before the option line"),
    ("f.s1p", "# MHz Q RI R 50\n1 0.5 0\n", 1, "unknown option"),
    ("g.s1p", "# MHz H RI R 50\n1 0.5 0\n", 1, "G and H"),
    ("h.s1p", "# MHz S RI R\n1 0.5 0\n", 1, "R needs"),
    ("i.s1p", "# MHz S RI R -50\n1 0.5 0\n", 1, "positive"),
    ("j.s1p", "# MHz S MA R 50\n1 -0.5 0\n", 2, "magnitude"),
    ("k.s1p", "# MHz S RI R 50\n-1 0.5 0\n", 2, "negative"),
    ("l.s1p", "# MHz S RI R 50\n! nothing\n", 2, "no network data"),
    ("m.s1p", "# MHz S RI R 50\n1 0.5 nan\n", 2, "finite number"),
    ("n.s1p", "# MHz S RI R 50\n1 0.5 1e999\n", 2, "finite number"),
    ("o.s1p", "# MHz S RI R 50\n[Number of Ports] 1\n1 0.5 0\n", 2, "version 1"),
    ("p.ts", "[Version] 3.0\n", 1, "2.0"),
    ("q.ts", "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 1\n1 0.5 0\n[End]\n", 5, "outside [Network Data]"),
    ("r.ts", "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 1\n[Network Data]\n1 0.5 0\n[End]\n", 4, "[Number of Frequencies]"),
    ("s.ts", "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 2\n[Number of Frequencies] 1\n[Network Data]\n", 5, "Two-Port Data Order"),
    ("t.ts", "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 2\n[Network Data]\n1 0.5 0\n[End]\n", 7, "says 2"),
    ("u.ts", "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 1\n[Network Data]\n1 0.5 0\n", 6, "[End]"),
    ("v.ts", "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 1\n[Network Data]\n1 0.5 0\n[End]\n2 0 0\n", 8, "follow [End]"),
    ("w.ts", "[Version] 2.0\n[Number of Ports] 1\n[Frobnicate] 3\n", 3, "unknown keyword"),
    ("x.ts", "[Version] 2.0\n[Number of Ports 1\n", 2, "closing"),
    ("y.ts", "[Version] 2.0\n[Number of Ports] 1.5\n", 2, "whole number"),
    ("z.ts", "[Version] 2.0\n[Number of Ports] 2\n[Reference] 50 50 50\n", 3, "one value a port"),
    ("aa.ts", "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 1\n[Matrix Format] Lower\n", 5, "Full"),
    ("ab.s2p", "[Version] 2.0\n[Number of Ports] 1\n", 2, "extension 2"),
    ("ac.csv", "frequency [MHz], Z real [ohm]\n1, 2\n", 1, "a pair"),
    ("ad.csv", "frequency, Z real [ohm], Z imag [ohm]\n1, 2, 3\n", 1, "unit"),
    ("ae.csv", "frequency [MHz], Z real [ohm], Z imag [ohm]\n1, 2\n", 2, "3 cells"),
    ("af.csv", "frequency [MHz], Z real [ohm], Z imag [ohm]\n2, 2, 3\n1, 2, 3\n", 3, "rise"),
    ("ag.csv", "frequency [MHz], Z magnitude [ohm], Z phase\n1, 2, 3\n", 1, "phase column"),
    ("ah.csv", "frequency [MHz], Z real [ohm], Z imag [ohm], comment\n1, 2, 3, x\n", 1, "unknown column"),
    ("ai.csv", "frequency [MHz], Z real [ohm], Z imag [ohm]\n", 1, "no data rows"),
    ("aj.csv", "frequency [MHz], Z magnitude [ohm], Z phase [deg]\n1, -2, 3\n", 2, "magnitude"),
    ("ak.csv", "# reference fifty ohm\nfrequency [MHz], S11 real, S11 imag\n1, 0, 0\n", 1, "finite number"),
    ("al.csv", "frequency [MHz], Z real [mohm], Z imag [ohm]\n1, 2, 3\n", 1, "ohm"),
    ("am.csv", "frequency [MHz], frequency [Hz], Z real [ohm], Z imag [ohm]\n", 1, "second column"),
    # Found by tests/fuzz/fuzz_network_file (tools/fuzz): numbers that overflow once scaled.
    ("an.s1p", "# MHz S DB R 50\n1 7000 0\n", 2, "out of range"),
    ("ar.ts", "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 2e49\n", 4, "1 .. 10000000"),
    ("ao.s1p", "# GHz S RI R 50\n1e308 0.5 0\n", 2, "out of range"),
    ("ap.s1p", "# MHz Z RI R 50\n1 1e307 0\n", 2, "out of range"),
    ("aq.csv", "frequency [GHz], Z real [ohm], Z imag [ohm]\n1e308, 2, 3\n", 2, "out of range"),
]


def test_a_huge_angle_stays_finite(tmp_path):
    # Found by the fuzz target: an angle of 1e308 degrees once became NaN (the angle times pi overflowed);
    # it is reduced modulo 360 first, which for a whole number of turns is exact.
    got = libcoil.read_network(write(tmp_path, "big.s1p", "# MHz S MA R 50\n1 0.5 1e308\n2 0.5 720090\n"))
    assert np.all(np.isfinite(got.matrix))
    assert got.matrix[1, 0, 0] == pytest.approx(0.5 * np.exp(1j * np.radians(90)), abs=1e-12)


@pytest.mark.parametrize("name,text,line,fragment", MALFORMED, ids=[m[0] for m in MALFORMED])
def test_a_malformed_file_is_a_clear_error_naming_its_line(tmp_path, name, text, line, fragment):
    with pytest.raises(libcoil.InputError) as e:
        libcoil.read_network(write(tmp_path, name, text))
    assert f"{name}:{line}:" in str(e.value)
    assert fragment in str(e.value)


def test_the_catalogue_is_long_enough():
    assert len(MALFORMED) >= 25


def test_unknown_extension_and_missing_file(tmp_path):
    with pytest.raises(libcoil.InputError, match="s1p"):
        libcoil.read_network(write(tmp_path, "x.txt", "1 2 3\n"))
    with pytest.raises(libcoil.InputError, match="cannot open"):
        libcoil.read_network(str(tmp_path / "missing.s1p"))
