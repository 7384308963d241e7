// Test mesh for tests/io: a 100 x 50 mm flat plate in the x-y plane made of two square regions
// ("thin" x in [0, 50], "thick" x in [50, 100]), 2 x 2 quadrangles each (15 nodes, 8 quads).
// Boundary groups: curve "clamped" (x = 0), curve "tip" (x = 100), point "corner" (100, 50).
// Regenerate: gmsh -2 -format msh41 io_two_region_plate.geo -o io_two_region_plate.msh
// and the MSH 2.2 copy rotcap must reject:
//             gmsh -2 -format msh22 io_two_region_plate.geo -o io_two_region_plate_v22.msh
Point(1) = {0, 0, 0};
Point(2) = {50, 0, 0};
Point(3) = {100, 0, 0};
Point(4) = {100, 50, 0};
Point(5) = {50, 50, 0};
Point(6) = {0, 50, 0};
Line(1) = {1, 2};
Line(2) = {2, 3};
Line(3) = {3, 4};
Line(4) = {4, 5};
Line(5) = {5, 6};
Line(6) = {6, 1};
Line(7) = {2, 5};
Curve Loop(1) = {1, 7, 5, 6};
Plane Surface(1) = {1};
Curve Loop(2) = {2, 3, 4, -7};
Plane Surface(2) = {2};
Transfinite Curve {1:7} = 3;
Transfinite Surface {1, 2};
Recombine Surface {1, 2};
Physical Surface("thin") = {1};
Physical Surface("thick") = {2};
Physical Curve("clamped") = {6};
Physical Curve("tip") = {3};
Physical Point("corner") = {4};
