// Export file names and folders (issue 5: "An export never writes outside the
// chosen folder; file names are sanitised"). The allowed characters are the
// POSIX portable filename character set (POSIX.1-2017, Base Definitions §3.282).
#include <doctest/doctest.h>

#include <filesystem>
#include <string>

#include "exports/safe_output_path.hpp"
#include "tests/exports/export_test_support.hpp"

using namespace soffit;
using soffit::test::ExportDir;
namespace fs = std::filesystem;

TEST_CASE("export names: only the portable character set, no leading dot, length-limited") {
  CHECK(sanitise_file_name("S1 MW/2019:final.csv") == "S1_MW_2019_final.csv");
  CHECK(sanitise_file_name("..hidden.svg") == "hidden.svg");
  // Without '/' the dots are only characters: the name stays inside the folder.
  CHECK(sanitise_file_name("../../etc/passwd") == "_.._etc_passwd");
  CHECK(sanitise_file_name("Br\xC3\xBC" "cke.geo") == "Br_cke.geo");  // UTF-8 ü: two bytes, one '_'
  CHECK(sanitise_file_name("") == "export");
  CHECK(sanitise_file_name("...") == "export");
  CHECK(sanitise_file_name("a\\b\nc") == "a_b_c");
  const std::string cut = sanitise_file_name(std::string(300, 'x') + ".csv");
  CHECK(cut.size() == kMaxExportNameLength);
  CHECK(cut.substr(cut.size() - 4) == ".csv");
  CHECK(sanitise_file_name("sallow-ford_S1-MW_2019_points.csv") == "sallow-ford_S1-MW_2019_points.csv");
}

TEST_CASE("export paths: '..', absolute names, folder parts and unsanitised names are refused") {
  ExportDir dir;
  CHECK_THROWS_WITH_AS(safe_output_path(dir.path(), "../x"), doctest::Contains("'..' would climb out"), ExportPathError);
  CHECK_THROWS_WITH_AS(safe_output_path(dir.path(), ".."), doctest::Contains("'..' would climb out"), ExportPathError);
  CHECK_THROWS_WITH_AS(safe_output_path(dir.path(), "/etc/x"), doctest::Contains("an absolute path"), ExportPathError);
  CHECK_THROWS_WITH_AS(safe_output_path(dir.path(), "sub/x"), doctest::Contains("has a folder part"), ExportPathError);
  CHECK_THROWS_WITH_AS(safe_output_path(dir.path(), ".hidden"), doctest::Contains("not a safe file name"), ExportPathError);
  CHECK_THROWS_AS(safe_output_path(dir.path(), ""), ExportPathError);
  CHECK_THROWS_WITH_AS(safe_output_path(dir.path() / "missing", "x.csv"), doctest::Contains("does not exist"),
                       ExportPathError);
  CHECK(safe_output_path(dir.path(), "x.csv") == dir.path() / "x.csv");
  CHECK(safe_output_path(dir.path(), sanitise_file_name("../../etc/passwd")) == dir.path() / "_.._etc_passwd");
}

TEST_CASE("export paths: a symbolic link escaping the folder is refused and the outside file is untouched") {
  ExportDir dir, outside;
  const fs::path victim = outside.path() / "victim.txt";
  soffit::test::write_text(victim.string(), "keep me");
  fs::create_symlink(victim, dir.path() / "points.csv");
  CHECK_THROWS_WITH_AS(write_export_file(dir.path(), "points.csv", "overwritten"),
                       doctest::Contains("is a symbolic link"), ExportPathError);
  CHECK(soffit::test::read_text(victim.string()) == "keep me");
  // A dangling link would let the writer create a file outside: refused too.
  fs::create_symlink(outside.path() / "new.txt", dir.path() / "new.csv");
  CHECK_THROWS_AS(write_export_file(dir.path(), "new.csv", "x"), ExportPathError);
  CHECK_FALSE(fs::exists(outside.path() / "new.txt"));
  // A link to a folder outside, used as the file name, is refused as well.
  fs::create_directory_symlink(outside.path(), dir.path() / "out");
  CHECK_THROWS_AS(safe_output_path(dir.path(), "out"), ExportPathError);
}

TEST_CASE("export paths: a folder reached through a link is fine - writes replace whole files") {
  ExportDir real, links;
  const fs::path via = links.path() / "to-real";
  fs::create_directory_symlink(real.path(), via);
  const fs::path written = write_export_file(via, "a.csv", "first");
  CHECK(written == via / "a.csv");
  CHECK(soffit::test::read_text((real.path() / "a.csv").string()) == "first");
  write_export_file(via, "a.csv", "second, longer than the first");
  CHECK(soffit::test::read_text((real.path() / "a.csv").string()) == "second, longer than the first");
  // No temporary file is left behind.
  int entries = 0;
  for (const auto& e : fs::directory_iterator(real.path())) entries += e.is_regular_file() ? 1 : 0;
  CHECK(entries == 1);
}
