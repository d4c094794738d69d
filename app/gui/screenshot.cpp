#include "app/gui/screenshot.hpp"

#define GLFW_INCLUDE_NONE
#include <GL/gl.h>
#include <stb_image_write.h>

#include <vector>

namespace soffit::gui {

bool write_back_buffer_png(const std::string& path, int width, int height) {
  std::vector<unsigned char> pixels(static_cast<size_t>(width) * static_cast<size_t>(height) * 3);
  glPixelStorei(GL_PACK_ALIGNMENT, 1);
  glReadBuffer(GL_BACK);
  glReadPixels(0, 0, width, height, GL_RGB, GL_UNSIGNED_BYTE, pixels.data());
  stbi_flip_vertically_on_write(1);  // OpenGL rows start at the bottom
  return stbi_write_png(path.c_str(), width, height, 3, pixels.data(), width * 3) != 0;
}

}  // namespace soffit::gui
