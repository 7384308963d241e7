// Test mesh for tests/io: a 50 x 50 mm plate meshed with TRIANGLES (no Recombine), which rotcap
// must reject with an error naming element type 2.
// Regenerate: gmsh -2 -format msh41 io_triangle_plate.geo -o io_triangle_plate.msh
Point(1) = {0, 0, 0};
Point(2) = {50, 0, 0};
Point(3) = {50, 50, 0};
Point(4) = {0, 50, 0};
Line(1) = {1, 2};
Line(2) = {2, 3};
Line(3) = {3, 4};
Line(4) = {4, 1};
Curve Loop(1) = {1, 2, 3, 4};
Plane Surface(1) = {1};
Transfinite Curve {1:4} = 2;
Transfinite Surface {1};
Physical Surface("plate") = {1};
Physical Curve("edge") = {4};
