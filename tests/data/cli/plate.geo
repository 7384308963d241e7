// Small plate for the command-line tests (tests/cli): 100 x 50 mm, 4 x 2 quads. Physical groups:
// "plate" (surface), "clamped" (edge x = 0), "tip" (edge x = 100).
// Make the .msh with:   gmsh -2 -format msh41 plate.geo -o plate.msh
Point(1) = {0, 0, 0};
Point(2) = {100, 0, 0};
Point(3) = {100, 50, 0};
Point(4) = {0, 50, 0};
Line(1) = {1, 2};
Line(2) = {2, 3};
Line(3) = {3, 4};
Line(4) = {4, 1};
Curve Loop(1) = {1, 2, 3, 4};
Plane Surface(1) = {1};
Transfinite Curve {1, 3} = 5;
Transfinite Curve {2, 4} = 3;
Transfinite Surface {1};
Recombine Surface {1};
Physical Surface("plate") = {1};
Physical Curve("clamped") = {4};
Physical Curve("tip") = {2};
