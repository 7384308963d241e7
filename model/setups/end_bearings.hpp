#pragma once
// The simply supported beam's end bearings, shared by the three- and four-point setups: bearings
// at the bottom-flange centre-line node over each support, groups "bearing_a" (x = 0; ux, uy, uz
// fixed) and "bearing_b" (x = L; uy, uz fixed); twist held by fixing uy of the top-flange
// centre-line node there, groups "twist_a", "twist_b".

#include "model/setups/loading_setup.hpp"

namespace rotcap {

void add_end_bearings(const HingeZoneMesh& mesh);

}  // namespace rotcap
