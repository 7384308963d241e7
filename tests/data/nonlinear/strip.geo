// Cantilever strip for the end-to-end nonlinear runs (tests/verification/nonlinear): 200 x 20 mm in
// the plane z = 0, clamped at x = 0, 10 x 2 quads. Physical groups: "strip" (surface), "clamped"
// (edge x = 0), "tip" (edge x = 200, three nodes), "corner" (point x = 200, y = 0).
// Make the .msh with:   gmsh -2 -format msh41 strip.geo -o strip.msh
Point(1) = {0, 0, 0};
Point(2) = {200, 0, 0};
Point(3) = {200, 20, 0};
Point(4) = {0, 20, 0};
Line(1) = {1, 2};
Line(2) = {2, 3};
Line(3) = {3, 4};
Line(4) = {4, 1};
Curve Loop(1) = {1, 2, 3, 4};
Plane Surface(1) = {1};
Transfinite Curve {1, 3} = 11;
Transfinite Curve {2, 4} = 3;
Transfinite Surface {1};
Recombine Surface {1};
Physical Surface("strip") = {1};
Physical Curve("clamped") = {4};
Physical Curve("tip") = {2};
Physical Point("corner") = {2};
