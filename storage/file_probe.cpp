#include "storage/file_probe.hpp"

#include <sys/stat.h>
#include <unistd.h>

#include <cstring>
#include <filesystem>
#include <fstream>

namespace soffit::storage {
namespace {

unsigned long long big_endian(const unsigned char* p, int n) {
  unsigned long long v = 0;
  for (int i = 0; i < n; ++i) v = (v << 8) | p[i];
  return v;
}

}  // namespace

FileProbe probe_file(const std::string& path) {
  FileProbe p;
  struct stat st {};
  if (::stat(path.c_str(), &st) != 0) return p;
  p.exists = true;
  p.size = static_cast<long long>(st.st_size);
  p.empty = st.st_size == 0;

  // Root may write anything, so access() alone would call every file writable;
  // a file whose write bits are all cleared was marked read-only on purpose.
  p.writable = (st.st_mode & (S_IWUSR | S_IWGRP | S_IWOTH)) != 0 && ::access(path.c_str(), W_OK) == 0;
  const std::string parent = std::filesystem::path(path).parent_path().string();
  // Not `folder = "."` on an empty string: GCC 12 warns falsely (-Wrestrict) on that assignment.
  const std::string folder = parent.empty() ? std::string(".") : parent;
  p.folder_writable = ::access(folder.c_str(), W_OK) == 0;
  p.wal_present = std::filesystem::exists(path + "-wal");

  unsigned char header[100] = {};
  std::ifstream in(path, std::ios::binary);
  in.read(reinterpret_cast<char*>(header), sizeof header);
  const auto got = in.gcount();
  static const char kMagic[] = "SQLite format 3";  // 16 bytes with its NUL (sqlite.org fileformat2 §1.3)
  p.sqlite_header = got == 100 && std::memcmp(header, kMagic, 16) == 0;
  if (!p.sqlite_header) return p;

  // Header bytes 16–17 page size (1 means 65536), 28–31 page count, valid only
  // when 92–95 equals the change counter at 24–27 (fileformat2 §1.3.7).
  unsigned long long page_size = big_endian(header + 16, 2);
  if (page_size == 1) page_size = 65536;
  const auto page_count = big_endian(header + 28, 4);
  const bool count_valid = big_endian(header + 92, 4) == big_endian(header + 24, 4);
  // With a -wal file the database file may legitimately lag behind; only a
  // checkpointed file is judged by its size.
  if (count_valid && !p.wal_present && page_count * page_size > static_cast<unsigned long long>(p.size))
    p.truncated = true;
  return p;
}

}  // namespace soffit::storage
