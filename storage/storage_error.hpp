#pragma once
// Why a project file could not be opened or an edit could not be saved.
//
// Each kind maps to one message the user can act on (STYLE.md item 4): the
// app shows it in a dialog, the command line prints it and exits 2.
#include <stdexcept>
#include <string>

namespace soffit::storage {

enum class ErrorKind {
  not_sqlite,       // not a database at all (text, image, random bytes, empty)
  foreign,          // a SQLite database, but not a Soffit project
  newer_version,    // made by a newer Soffit; opening it here could lose data
  damaged,          // integrity check failed or SQLite reports corruption
  locked,           // open in another Soffit window or process
  read_only,        // the file or its folder may not be written
  disk_full,        // the edit did not fit; nothing was saved, earlier work is intact
  already_exists,   // create() refuses to replace any existing file
  not_found,        // no such file, or no such record
  invalid,          // the edit breaks a rule of the register (constraint, issued inspection)
  io,               // any other failure of the file system or SQLite
};

const char* error_kind_name(ErrorKind kind);

class StorageError : public std::runtime_error {
 public:
  StorageError(ErrorKind kind, std::string path, const std::string& what)
      : std::runtime_error(path.empty() ? what : path + ": " + what),
        kind_(kind), path_(std::move(path)) {}
  ErrorKind kind() const { return kind_; }
  const std::string& path() const { return path_; }

 private:
  ErrorKind kind_;
  std::string path_;
};

}  // namespace soffit::storage
