#include "storage/storage_error.hpp"

namespace soffit::storage {

const char* error_kind_name(ErrorKind kind) {
  switch (kind) {
    case ErrorKind::not_sqlite: return "not_sqlite";
    case ErrorKind::foreign: return "foreign";
    case ErrorKind::newer_version: return "newer_version";
    case ErrorKind::damaged: return "damaged";
    case ErrorKind::locked: return "locked";
    case ErrorKind::read_only: return "read_only";
    case ErrorKind::disk_full: return "disk_full";
    case ErrorKind::already_exists: return "already_exists";
    case ErrorKind::not_found: return "not_found";
    case ErrorKind::invalid: return "invalid";
    case ErrorKind::io: return "io";
  }
  return "io";
}

}  // namespace soffit::storage
