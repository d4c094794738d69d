#pragma once
// Where the demo project's survey sheets are: beside the program once
// installed (<prefix>/bin/soffit → <prefix>/share/soffit/sheets), or in the
// source tree for a program run from any build folder.
#include <string>

namespace soffit::storage {

// The first folder holding sallow-ford_S1-MW_2019.csv; empty if none does.
std::string find_demo_sheets();

}  // namespace soffit::storage
