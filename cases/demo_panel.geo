// Demo mesh: a 600 x 300 mm plate (invented scenario: the outstand of a bearing plate of a
// fictitious footbridge cross girder), 24 x 12 quads. Physical groups: "plate" (surface),
// "clamped" (edge x = 0), "loaded_edge" (edge x = 600). Make the .msh with:
//   gmsh -2 -format msh41 demo_panel.geo -o demo_panel.msh
Point(1) = {0, 0, 0};
Point(2) = {600, 0, 0};
Point(3) = {600, 300, 0};
Point(4) = {0, 300, 0};
Line(1) = {1, 2};
Line(2) = {2, 3};
Line(3) = {3, 4};
Line(4) = {4, 1};
Curve Loop(1) = {1, 2, 3, 4};
Plane Surface(1) = {1};
Transfinite Curve {1, 3} = 25;
Transfinite Curve {2, 4} = 13;
Transfinite Surface {1};
Recombine Surface {1};
Physical Surface("plate") = {1};
Physical Curve("clamped") = {4};
Physical Curve("loaded_edge") = {2};
