// Every way opening can fail gets its own error kind, and the file is left
// byte for byte as it was (issue 3: "a damaged, foreign, locked or read-only
// file gets a clear message and is never overwritten"; STYLE.md item 4).
#include <doctest/doctest.h>
#include <sqlite3.h>
#include <sys/stat.h>

#include <filesystem>
#include <random>

#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/register_queries.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::read_bytes;
using soffit::test::TempDir;
using soffit::test::write_bytes;

namespace {

// Opens `path` for editing, expecting `kind`; checks the file was not touched
// and no -wal file was left behind.
std::string expect_refused(const std::string& path, ErrorKind kind, Access access = Access::edit) {
  const std::string before = read_bytes(path);
  std::string message;
  try {
    Project::open(path, "J. Okafor", access);
    FAIL("opened a file that should have been refused: " << path);
  } catch (const StorageError& e) {
    CHECK_MESSAGE(e.kind() == kind, "got " << error_kind_name(e.kind()) << ": " << e.what());
    CHECK(e.path() == path);
    message = e.what();
  }
  CHECK(read_bytes(path) == before);
  return message;
}

// A closed project holding enough rows to span many pages.
void make_project_with_rows(const std::string& path) {
  Project p = Project::create(path, "J. Okafor");
  p.edit("add structures", [&](Connection& db) {
    for (int i = 0; i < 300; ++i) {
      StructureFields f;
      f.ref = "BVDC-ST-" + std::to_string(1000 + i);
      f.notes = std::string(200, 'n');
      insert_structure(db, p.author(), f);
    }
  });
}

void make_foreign_sqlite(const std::string& path, int user_version) {
  sqlite3* db = nullptr;
  REQUIRE(sqlite3_open(path.c_str(), &db) == SQLITE_OK);
  const std::string sql = "CREATE TABLE t(a); INSERT INTO t VALUES (1); PRAGMA user_version = " +
                          std::to_string(user_version) + ";";
  CHECK(sqlite3_exec(db, sql.c_str(), nullptr, nullptr, nullptr) == SQLITE_OK);
  sqlite3_close(db);
}

}  // namespace

TEST_CASE("a text file is refused as not a project") {
  TempDir dir;
  const std::string path = dir.file("sheet.soffit");
  write_bytes(path, "soffit-sheet,1\nstructure,BVDC-ST-0417\n");
  const std::string msg = expect_refused(path, ErrorKind::not_sqlite);
  CHECK(msg.find("not a Soffit project file") != std::string::npos);
}

TEST_CASE("random bytes are refused as not a project") {
  TempDir dir;
  const std::string path = dir.file("noise.soffit");
  std::mt19937 rng(20190514);
  std::string bytes(8192, '\0');
  for (char& c : bytes) c = static_cast<char>(rng() & 0xff);
  write_bytes(path, bytes);
  expect_refused(path, ErrorKind::not_sqlite);
}

TEST_CASE("an empty file is refused, not silently turned into a project") {
  TempDir dir;
  const std::string path = dir.file("empty.soffit");
  write_bytes(path, "");
  expect_refused(path, ErrorKind::not_sqlite);
}

TEST_CASE("a missing file is reported as not found") {
  TempDir dir;
  try {
    Project::open(dir.file("absent.soffit"), "J. Okafor");
    FAIL("opened a missing file");
  } catch (const StorageError& e) {
    CHECK(e.kind() == ErrorKind::not_found);
  }
  CHECK_FALSE(std::filesystem::exists(dir.file("absent.soffit")));
}

TEST_CASE("a SQLite database of another program is refused as foreign") {
  TempDir dir;
  const std::string path = dir.file("other.db");
  make_foreign_sqlite(path, 0);
  const std::string msg = expect_refused(path, ErrorKind::foreign);
  CHECK(msg.find("another program") != std::string::npos);
}

TEST_CASE("a project made by a newer Soffit is refused, not downgraded") {
  TempDir dir;
  const std::string path = dir.file("newer.soffit");
  { Project::create(path, "J. Okafor"); }
  {
    sqlite3* db = nullptr;
    REQUIRE(sqlite3_open(path.c_str(), &db) == SQLITE_OK);
    CHECK(sqlite3_exec(db, "PRAGMA user_version = 99", nullptr, nullptr, nullptr) == SQLITE_OK);
    sqlite3_close(db);
  }
  const std::string msg = expect_refused(path, ErrorKind::newer_version);
  CHECK(msg.find("newer Soffit") != std::string::npos);
  expect_refused(path, ErrorKind::newer_version, Access::view);
}

TEST_CASE("a truncated project is refused as damaged") {
  TempDir dir;
  const std::string path = dir.file("truncated.soffit");
  make_project_with_rows(path);
  const auto size = std::filesystem::file_size(path);
  REQUIRE(size > 16 * 4096);
  std::filesystem::resize_file(path, size / 2);
  const std::string msg = expect_refused(path, ErrorKind::damaged);
  CHECK(msg.find("truncated") != std::string::npos);
}

TEST_CASE("a project with scrambled pages is refused as damaged by the integrity check") {
  TempDir dir;
  const std::string path = dir.file("scrambled.soffit");
  make_project_with_rows(path);
  std::string bytes = read_bytes(path);
  // Overwrite pages 3–6 with noise, keeping the 100-byte header and the size
  // (sqlite.org howtocorrupt.html §1: a stray write into the file).
  std::mt19937 rng(7);
  for (size_t i = 2 * 4096; i < 6 * 4096; ++i) bytes[i] = static_cast<char>(rng() & 0xff);
  write_bytes(path, bytes);
  expect_refused(path, ErrorKind::damaged);
}

TEST_CASE("a read-only project is refused for editing and can still be viewed") {
  TempDir dir;
  const std::string path = dir.file("readonly.soffit");
  make_project_with_rows(path);
  // Tests may run as root, who may write anyway: the write bits are what the
  // user set, and Soffit honours them.
  REQUIRE(::chmod(path.c_str(), 0444) == 0);
  const std::string msg = expect_refused(path, ErrorKind::read_only);
  CHECK(msg.find("read-only") != std::string::npos);
  {
    Project p = Project::open(path, "R. Delacroix", Access::view);
    CHECK(list_structures(p.db()).size() == 300);
    try {
      p.edit("should fail", [](Connection&) {});
      FAIL("edited a project opened for viewing");
    } catch (const StorageError& e) {
      CHECK(e.kind() == ErrorKind::read_only);
    }
  }
  CHECK_FALSE(std::filesystem::exists(path + "-wal"));
}

TEST_CASE("a project open for editing elsewhere is refused as locked") {
  TempDir dir;
  const std::string path = dir.file("locked.soffit");
  Project first = Project::create(path, "J. Okafor");
  try {
    Project::open(path, "M. Lindqvist");
    FAIL("two editors opened the same project");
  } catch (const StorageError& e) {
    CHECK_MESSAGE(e.kind() == ErrorKind::locked, e.what());
  }
  // The first editor is unaffected.
  StructureFields f;
  f.ref = "BVDC-ST-0417";
  first.edit("add", [&](Connection& db) { insert_structure(db, first.author(), f); });
  CHECK(find_structure(first.db(), "BVDC-ST-0417").has_value());
}
