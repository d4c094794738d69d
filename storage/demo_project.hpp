#pragma once
// The demo project (issue 3 "Demo project"): the invented Sallow Ford Bridge
// of FIELD.md §10 with both visits, eight sections, ring counts, fill
// depths, defects D01–D10 on each visit where they existed, and a drawn
// picture for every defect. Nothing in it is real; the structure's location
// is the placeholder 0°, 0°, flagged fictitious.
#include <string>

namespace soffit::storage {

struct DemoSummary {
  int sections = 0, readings = 0, ring_counts = 0, fill_depths = 0, defects = 0, photos = 0;
};

// Creates the project at `path` (refused if anything is there) from the
// survey sheets in `sheets_dir` (demo_assets.hpp). Pictures are drawn into a
// temporary folder, then added through add_photo like any photo.
DemoSummary write_demo_project(const std::string& path, const std::string& sheets_dir, const std::string& author);

}  // namespace soffit::storage
