#pragma once
// Export file names and where they may be written. A name built from user
// data (a structure reference, a section label) must never escape the folder
// the user chose, nor create a hidden or unreadable file.
#include <cstddef>
#include <filesystem>
#include <stdexcept>
#include <string>
#include <string_view>

namespace soffit {

class ExportPathError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

inline constexpr std::size_t kMaxExportNameLength = 120;

// A file name made only of [A-Za-z0-9._-]: every other byte (including '/',
// '\\', spaces and any non-ASCII) becomes '_', leading dots are dropped (no
// hidden files, no "." or ".."), runs of '_' collapse, and the name is cut to
// `max_length` keeping its extension. Never empty: "export" stands in.
std::string sanitise_file_name(std::string_view wanted, std::size_t max_length = kMaxExportNameLength);

// The path of `file_name` inside `folder`, after checking that writing there
// stays inside the folder. Throws ExportPathError (naming the file) when the
// name is absolute, has a directory part or "..", is not already sanitised,
// or when the target is a symbolic link or resolves (weakly_canonical) outside
// the folder. The folder itself may be reached through a link.
std::filesystem::path safe_output_path(const std::filesystem::path& folder, std::string_view file_name);

// Writes `bytes` to safe_output_path(folder, file_name) through a temporary
// file in the same folder and a rename: a reader never sees half a file, and
// the rename replaces a link planted meanwhile instead of following it.
// Throws ExportPathError, or std::runtime_error naming the path when the
// disk refuses the write.
std::filesystem::path write_export_file(const std::filesystem::path& folder, std::string_view file_name,
                                        std::string_view bytes);

}  // namespace soffit
