#pragma once
// Textures for ImGui::Image. Views ask a TextureFactory, never OpenGL, so they
// draw headless in tests (no factory, or a fake one: a placeholder rectangle
// where the image would be). The OpenGL factory lives in gl_texture.cpp, which
// only the executable links (app/CMakeLists.txt, SOFFIT_WINDOW_SOURCES).
#include <imgui.h>

#include <cstdint>
#include <memory>

namespace soffit::gui {

class TextureFactory {
 public:
  virtual ~TextureFactory() = default;
  // Uploads w x h RGBA8 pixels; nullptr when it cannot. UI thread only.
  virtual ImTextureID create(const uint8_t* rgba, int width, int height) = 0;
  virtual void destroy(ImTextureID texture) = 0;
  // The largest side a texture may have here.
  virtual int max_side() const = 0;
};

// OpenGL textures in the current context (GL_TEXTURE_2D, linear filtering).
// Textures must be destroyed before the context is.
std::unique_ptr<TextureFactory> make_gl_texture_factory();

}  // namespace soffit::gui
