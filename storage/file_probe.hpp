#pragma once
// Looks at a file before SQLite touches it, so that a foreign or damaged file
// is named as such and never opened for writing.
#include <string>

namespace soffit::storage {

struct FileProbe {
  bool exists = false;
  bool sqlite_header = false;    // starts with "SQLite format 3\0"
  bool empty = false;
  bool truncated = false;        // shorter than the page count its header vouches for
  bool writable = true;          // file has a write permission bit and may be written
  bool folder_writable = true;   // the -wal and -journal files can be created beside it
  bool wal_present = false;      // PATH-wal exists: the last session did not close cleanly
  long long size = 0;
};

FileProbe probe_file(const std::string& path);

}  // namespace soffit::storage
