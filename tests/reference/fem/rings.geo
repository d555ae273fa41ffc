// Axisymmetric model of Rings coaxial rings of round wire (libcoil's finite-element reference, issue 17):
// rings of wire radius r on the mean radius a, Rings of them a pitch p apart and centred on z = 0, in the
// half-plane x = rho >= 0, y = z. Air to the radius Rint, then a shell to Rext that the formulation maps to
// infinity; the axis and the outer arc carry a = 0. The mesh is graded from hw at the wires' surfaces (a
// fraction of the skin depth) to hmax. Physical surfaces 1 .. Rings: the rings; Rings + 1: air; Rings + 2: the shell.
// Physical curves Rings + 3: the outer arc; Rings + 4: the axis. With Tube = 1 a coaxial conducting tube (an
// open shield) of bore radius Tb, wall Tt and length Tl, centred on z = 0, meshed at ht: physical surface Rings + 5.
// Written for Debian's gmsh 4.8 (built-in kernel).
DefineConstant[ a = 20e-3, r = 1e-3, Rings = 1, p = 3e-3, Rint = 0.1, Rext = 0.2, hw = 0.05e-3, hmax = 0.01,
                Tube = 0, Tb = 30e-3, Tt = 0.5e-3, Tl = 60e-3, ht = 0.05e-3 ];
loops[] = {};
wires[] = {};
For k In {0 : Rings - 1}
  z = (k - (Rings - 1) / 2) * p;
  c = newp; Point(c) = {a, z, 0, hw};
  p1 = newp; Point(p1) = {a + r, z, 0, hw};
  p2 = newp; Point(p2) = {a, z + r, 0, hw};
  p3 = newp; Point(p3) = {a - r, z, 0, hw};
  p4 = newp; Point(p4) = {a, z - r, 0, hw};
  c1 = newc; Circle(c1) = {p1, c, p2};
  c2 = newc; Circle(c2) = {p2, c, p3};
  c3 = newc; Circle(c3) = {p3, c, p4};
  c4 = newc; Circle(c4) = {p4, c, p1};
  cl = newll; Curve Loop(cl) = {c1, c2, c3, c4};
  s = news; Plane Surface(s) = {cl};
  loops[] += {cl};
  wires[] += {c1, c2, c3, c4};
  Physical Surface(k + 1) = {s};
EndFor
tubecurves[] = {};
If (Tube)
  t1 = newp; Point(t1) = {Tb, -Tl / 2, 0, ht};
  t2 = newp; Point(t2) = {Tb + Tt, -Tl / 2, 0, ht};
  t3 = newp; Point(t3) = {Tb + Tt, Tl / 2, 0, ht};
  t4 = newp; Point(t4) = {Tb, Tl / 2, 0, ht};
  l1 = newc; Line(l1) = {t1, t2};
  l2 = newc; Line(l2) = {t2, t3};
  l3 = newc; Line(l3) = {t3, t4};
  l4 = newc; Line(l4) = {t4, t1};
  tl = newll; Curve Loop(tl) = {l1, l2, l3, l4};
  ts = news; Plane Surface(ts) = {tl};
  loops[] += {tl};
  tubecurves[] = {l1, l2, l3, l4};
  Physical Surface(Rings + 5) = {ts};
EndIf
o = newp; Point(o) = {0, 0, 0, hmax};
q1 = newp; Point(q1) = {0, -Rint, 0, hmax};
q2 = newp; Point(q2) = {Rint, 0, 0, hmax};
q3 = newp; Point(q3) = {0, Rint, 0, hmax};
q4 = newp; Point(q4) = {0, -Rext, 0, hmax};
q5 = newp; Point(q5) = {Rext, 0, 0, hmax};
q6 = newp; Point(q6) = {0, Rext, 0, hmax};
i1 = newc; Circle(i1) = {q1, o, q2};
i2 = newc; Circle(i2) = {q2, o, q3};
e1 = newc; Circle(e1) = {q4, o, q5};
e2 = newc; Circle(e2) = {q5, o, q6};
ax0 = newc; Line(ax0) = {q3, q1};
ax1 = newc; Line(ax1) = {q6, q3};
ax2 = newc; Line(ax2) = {q1, q4};
inner = newll; Curve Loop(inner) = {i1, i2, ax0};
air = news; Plane Surface(air) = {inner, loops[]};
outer = newll; Curve Loop(outer) = {e1, e2, ax1, -i2, -i1, ax2};
shell = news; Plane Surface(shell) = {outer};
Physical Surface(Rings + 1) = {air};
Physical Surface(Rings + 2) = {shell};
Physical Curve(Rings + 3) = {e1, e2};
Physical Curve(Rings + 4) = {ax0, ax1, ax2};
Field[1] = Distance; Field[1].CurvesList = {wires[]}; Field[1].NumPointsPerCurve = 200;
Field[2] = Threshold; Field[2].InField = 1; Field[2].SizeMin = hw; Field[2].SizeMax = hmax;
Field[2].DistMin = 0; Field[2].DistMax = 30 * r;
Field[3] = Threshold; Field[3].InField = 1; Field[3].SizeMin = r / 4; Field[3].SizeMax = hmax;
Field[3].DistMin = r; Field[3].DistMax = 3 * r;
Field[4] = Min; Field[4].FieldsList = {2, 3};
If (Tube)
  Field[5] = Distance; Field[5].CurvesList = {tubecurves[]}; Field[5].NumPointsPerCurve = 400;
  Field[6] = Threshold; Field[6].InField = 5; Field[6].SizeMin = ht; Field[6].SizeMax = hmax;
  Field[6].DistMin = 0; Field[6].DistMax = 20 * Tt + 10 * ht;
  Field[4].FieldsList = {2, 3, 6};
EndIf
Background Field = 4;
Mesh.MeshSizeExtendFromBoundary = 0; Mesh.MeshSizeFromPoints = 0; Mesh.MeshSizeFromCurvature = 0;
