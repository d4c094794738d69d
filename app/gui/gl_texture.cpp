#include "app/gui/gl_texture.hpp"

#include <GL/gl.h>

#include <cstdint>

namespace soffit::gui {
namespace {

class GlTextureFactory final : public TextureFactory {
 public:
  ImTextureID create(const uint8_t* rgba, int width, int height) override {
    if (!rgba || width <= 0 || height <= 0 || width > max_side() || height > max_side()) return nullptr;
    GLint previous = 0;  // leave the binding as the renderer had it
    glGetIntegerv(GL_TEXTURE_BINDING_2D, &previous);
    for (int i = 0; i < 8 && glGetError() != GL_NO_ERROR; ++i) {
    }  // errors left by others must not be taken for this upload's
    GLuint id = 0;
    glGenTextures(1, &id);
    if (id == 0) return nullptr;
    glBindTexture(GL_TEXTURE_2D, id);
    glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MIN_FILTER, GL_LINEAR);
    glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MAG_FILTER, GL_LINEAR);
    glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_WRAP_S, GL_CLAMP_TO_EDGE);
    glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_WRAP_T, GL_CLAMP_TO_EDGE);
    glPixelStorei(GL_UNPACK_ALIGNMENT, 1);  // rows of any width, tightly packed
    glTexImage2D(GL_TEXTURE_2D, 0, GL_RGBA, width, height, 0, GL_RGBA, GL_UNSIGNED_BYTE, rgba);
    const bool failed = glGetError() != GL_NO_ERROR;
    glBindTexture(GL_TEXTURE_2D, static_cast<GLuint>(previous));
    if (failed) {
      glDeleteTextures(1, &id);
      return nullptr;
    }
    return reinterpret_cast<ImTextureID>(static_cast<intptr_t>(id));
  }

  void destroy(ImTextureID texture) override {
    if (!texture) return;
    const GLuint id = static_cast<GLuint>(reinterpret_cast<intptr_t>(texture));
    glDeleteTextures(1, &id);
  }

  int max_side() const override {
    if (max_side_ == 0) {
      GLint v = 0;
      glGetIntegerv(GL_MAX_TEXTURE_SIZE, &v);
      max_side_ = v > 0 ? static_cast<int>(v) : 1024;  // the least OpenGL 3.0 requires (from memory)
    }
    return max_side_;
  }

 private:
  mutable int max_side_ = 0;
};

}  // namespace

std::unique_ptr<TextureFactory> make_gl_texture_factory() { return std::make_unique<GlTextureFactory>(); }

}  // namespace soffit::gui
