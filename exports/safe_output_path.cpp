#include "exports/safe_output_path.hpp"

#include <fcntl.h>
#include <unistd.h>

#include <cerrno>
#include <cstring>

namespace soffit {

namespace fs = std::filesystem;

namespace {

bool allowed(char c) {
  return (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9') || c == '.' ||
         c == '_' || c == '-';
}

[[noreturn]] void refuse(std::string_view file_name, const std::string& why) {
  throw ExportPathError("export file '" + std::string(file_name) + "': " + why);
}

}  // namespace

std::string sanitise_file_name(std::string_view wanted, std::size_t max_length) {
  std::string name;
  for (char c : wanted) {
    const char kept = allowed(c) ? c : '_';
    if (kept == '_' && !name.empty() && name.back() == '_') continue;
    name += kept;
  }
  const std::size_t first = name.find_first_not_of('.');
  name = first == std::string::npos ? std::string() : name.substr(first);
  if (name.empty() || name == "_") name = "export";
  max_length = std::max<std::size_t>(max_length, 16);
  if (name.size() > max_length) {
    // Keep a short extension so the file still opens in the right program.
    const std::size_t dot = name.rfind('.');
    const std::string extension =
        (dot != std::string::npos && dot > 0 && name.size() - dot <= 8) ? name.substr(dot) : std::string();
    name = name.substr(0, max_length - extension.size()) + extension;
  }
  return name;
}

fs::path safe_output_path(const fs::path& folder, std::string_view file_name) {
  if (file_name.empty()) refuse(file_name, "the name is empty");
  if (fs::path(file_name).is_absolute() || file_name.front() == '/')
    refuse(file_name, "an absolute path; exports take a plain file name inside the chosen folder");
  for (std::size_t start = 0; start <= file_name.size();) {
    const std::size_t end = std::min(file_name.find_first_of("/\\", start), file_name.size());
    if (file_name.substr(start, end - start) == "..")
      refuse(file_name, "'..' would climb out of the chosen folder");
    start = end + 1;
  }
  if (file_name.find_first_of("/\\") != std::string_view::npos)
    refuse(file_name, "has a folder part; exports take a plain file name");
  if (sanitise_file_name(file_name) != file_name)
    refuse(file_name, "not a safe file name (only A-Z, a-z, 0-9, '.', '_' and '-', no leading dot, at most " +
                          std::to_string(kMaxExportNameLength) + " characters)");

  std::error_code ec;
  if (!fs::is_directory(folder, ec))
    throw ExportPathError("export folder '" + folder.string() + "' does not exist or is not a folder");
  const fs::path target = folder / fs::path(file_name);
  const fs::file_status link_status = fs::symlink_status(target, ec);
  if (fs::is_symlink(link_status))
    refuse(file_name, "is a symbolic link in '" + folder.string() + "'; an export never writes through one");
  if (fs::exists(link_status) && !fs::is_regular_file(link_status))
    refuse(file_name, "exists in '" + folder.string() + "' and is not a plain file");
  const fs::path canonical_folder = fs::weakly_canonical(folder, ec);
  if (ec) throw ExportPathError("export folder '" + folder.string() + "': " + ec.message());
  const fs::path canonical_target = fs::weakly_canonical(target, ec);
  if (ec || canonical_target.parent_path() != canonical_folder)
    refuse(file_name, "would be written outside '" + folder.string() + "'");
  return target;
}

fs::path write_export_file(const fs::path& folder, std::string_view file_name, std::string_view bytes) {
  const fs::path target = safe_output_path(folder, file_name);
  const fs::path temporary = folder / ("." + std::string(file_name) + ".part-" + std::to_string(::getpid()));
  const int fd = ::open(temporary.c_str(), O_WRONLY | O_CREAT | O_EXCL | O_NOFOLLOW | O_CLOEXEC, 0644);
  if (fd < 0)
    throw std::runtime_error("cannot write '" + temporary.string() + "': " + std::strerror(errno));
  const char* data = bytes.data();
  std::size_t left = bytes.size();
  int failure = 0;
  while (left > 0 && failure == 0) {
    const ssize_t written = ::write(fd, data, left);
    if (written < 0 && errno == EINTR) continue;
    if (written <= 0) {
      failure = written < 0 ? errno : EIO;
      break;
    }
    data += written;
    left -= static_cast<std::size_t>(written);
  }
  if (failure == 0 && ::fsync(fd) != 0) failure = errno;
  if (::close(fd) != 0 && failure == 0) failure = errno;
  std::error_code renamed;
  if (failure == 0) fs::rename(temporary, target, renamed);
  if (failure != 0 || renamed) {
    std::error_code ignored;
    fs::remove(temporary, ignored);
    throw std::runtime_error("cannot write '" + target.string() +
                             "': " + (failure != 0 ? std::strerror(failure) : renamed.message()));
  }
  return target;
}

}  // namespace soffit
