// Long plate a = 400 mm, b = 100 mm (a/b = 4) for the linear buckling check of a plate with one
// unloaded edge free (tests/cli/plate_buckling_test.cpp): 40 x 10 quads. Physical groups:
// "plate" (surface), the loaded edges "x0" (x = 0) and "xa" (x = a), the supported unloaded edge
// "y0" (y = 0), the free unloaded edge "yb" (y = b) and the point "corner" (0, 0).
// Make the .msh with:   gmsh -2 -format msh41 outstand_plate.geo -o outstand_plate.msh
a = 400;
b = 100;
Point(1) = {0, 0, 0};
Point(2) = {a, 0, 0};
Point(3) = {a, b, 0};
Point(4) = {0, b, 0};
Line(1) = {1, 2};
Line(2) = {2, 3};
Line(3) = {3, 4};
Line(4) = {4, 1};
Curve Loop(1) = {1, 2, 3, 4};
Plane Surface(1) = {1};
Transfinite Curve {1, 3} = 41;
Transfinite Curve {2, 4} = 11;
Transfinite Surface {1};
Recombine Surface {1};
Physical Surface("plate") = {1};
Physical Curve("x0") = {4};
Physical Curve("xa") = {2};
Physical Curve("y0") = {1};
Physical Curve("yb") = {3};
Physical Point("corner") = {1};
