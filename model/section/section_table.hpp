#pragma once
// Built-in table of European hot-rolled I-sections: IPE 80 .. IPE 600, HEA 100 .. HEA 1000 and
// HEB 100 .. HEB 1000 (EN 10365:2017; dimensions per Euronorm 19-57 for IPE, 53-62 for HE).
//
// Source of the numbers (a secondary compilation, in the SCI/ArcelorMittal section-table format,
// 3 significant figures): the open data set waynemaranga/steelsnakes, files
// src/steelsnakes/EU/data/IPE.json and HE.json, commit 38bc16a3d9d38e592a237b2e000a4a032071c78a.
// Each row carries the dimensions h, b, tw, tf, r [mm] and, as printed there, the tabulated
// A [cm^2], Iy, Iz [cm^4], Wpl,y [cm^3], It [cm^4] and Iw [dm^6] (the handbook values a report
// shows beside the computed ones; tests check them against real_section_properties()).
//
// Designations: "IPE 300", "HEA 300", "HEB 300" (canonical); lookups ignore case, spaces,
// hyphens and underscores and accept the EN 10365 order "HE 300 A" / "HE 300 B".

#include "model/section/i_section.hpp"

#include <optional>
#include <span>
#include <string>
#include <vector>

namespace rotcap {

struct SectionTableRow {
  const char* designation;  ///< canonical, e.g. "HEA 300"
  double h, b, tw, tf, r;   ///< [mm]
  double A_cm2, Iy_cm4, Iz_cm4, Wpl_y_cm3, It_cm4, Iw_dm6;  ///< tabulated, units as named
};

/// All rows: IPE ascending, then HEA, then HEB.
std::span<const SectionTableRow> section_table();

/// The row of a designation in any accepted spelling; nullopt when the table has no such section.
std::optional<SectionTableRow> find_section_row(const std::string& designation);

/// The section (designation canonical, r from the table, weld_throat 0); nullopt if unknown.
std::optional<ISection> find_section(const std::string& designation);

/// Canonical designations of every row, in table order (for "did you mean" error messages).
std::vector<std::string> list_sections();

}  // namespace rotcap
