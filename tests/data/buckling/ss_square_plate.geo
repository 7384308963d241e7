// Square plate a = b = 100 mm for the linear buckling check through `rotcap buckle`
// (tests/cli/plate_buckling_test.cpp): 20 x 20 quads. Physical groups: "plate" (surface), the
// edges "x0" (x = 0), "xa" (x = a), "y0" (y = 0), "yb" (y = b) and the point "corner" (0, 0).
// Make the .msh with:   gmsh -2 -format msh41 ss_square_plate.geo -o ss_square_plate.msh
a = 100;
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
Transfinite Curve {1, 2, 3, 4} = 21;
Transfinite Surface {1};
Recombine Surface {1};
Physical Surface("plate") = {1};
Physical Curve("x0") = {4};
Physical Curve("xa") = {2};
Physical Curve("y0") = {1};
Physical Curve("yb") = {3};
Physical Point("corner") = {1};
