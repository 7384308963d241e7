#pragma once
// The pictures and the page of a study folder:
//  - study_curves.svg: every variant's moment-rotation curve (M/Mp against theta in mrad, from its
//    curve.csv) in one plot, the case as written drawn thicker;
//  - report.html: R as a band first ("R = 2.64, 2.31..2.80 over 11 variants; lowest: mode 2,
//    negative sign"), the verdicts, the bands, one row per variant (linking to its own report)
//    and the overlay plot.
#include "app/batch/study_results.hpp"

#include <filesystem>

namespace rotcap::app {

void write_study_pages(const std::filesystem::path& case_file, const StudyResult& study, const std::filesystem::path& folder);

}  // namespace rotcap::app
