#pragma once
#include <string>

namespace soffit::gui {
// Writes the current back buffer (width × height) as a PNG. Returns false on failure.
bool write_back_buffer_png(const std::string& path, int width, int height);
}  // namespace soffit::gui
