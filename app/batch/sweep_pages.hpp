#pragma once
// The pictures and the index page of a sweep folder:
//  - r_vs_flange_ct.svg, m_max_vs_flange_ct.svg: R and M_max/Mp of every finished case against
//    the flange outstand's c/t, with the EN 1993-1-1:2005 Table 5.2 limits of an outstand flange
//    in compression (9, 10, 14 eps for Classes 1, 2, 3; eps = sqrt(235/fy)) as vertical lines.
//    When all cases share one fy the axis is c/t and the lines sit at 9, 10, 14 eps; when fy
//    varies the axis is c/(t eps) and the lines at 9, 10, 14, so one set of limits holds for all;
//  - index.html: the plan, the counts, the results table (each case's name links to its
//    report.html) and the two plots.
#include "app/batch/sweep_results.hpp"

#include <filesystem>
#include <vector>

namespace rotcap::app {

/// Writes the two plots and index.html into folder.
void write_sweep_pages(const SweepPlan& plan, const std::vector<SweepRow>& rows, const std::filesystem::path& folder);

}  // namespace rotcap::app
