// The field app's window and frame loop. Draws only when something changed
// (battery), except while a fit is running or a screenshot is due.
#include <imgui.h>

#include <backends/imgui_impl_glfw.h>
#include <backends/imgui_impl_opengl3.h>
#define GLFW_INCLUDE_NONE
#include <GL/gl.h>
#include <GLFW/glfw3.h>

#include <algorithm>
#include <clocale>
#include <cstdlib>
#include <cstdio>
#include <string>

#include "app/gui/gui_options.hpp"
#include "app/gui/flow_layout.hpp"
#include "app/gui/legend.hpp"
#include "app/gui/touch_scroll.hpp"
#include "app/gui/screenshot.hpp"
#include "app/gui/project_screens.hpp"
#include "app/gui/gl_texture.hpp"
#include "app/gui/photo_viewer.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"

namespace soffit::gui {

namespace {

const std::string kAssets = SOFFIT_ASSETS_DIR;

std::string author_name() {
  for (const char* var : {"SOFFIT_AUTHOR", "USER", "LOGNAME"})
    if (const char* v = std::getenv(var); v && *v) return v;
  return "inspector";
}

struct AppState {
  Theme theme = Theme::sunlight;
  float scale = 1.0f;
  bool restyle = true;
  bool show_frame_time = false;
  ProjectScreens screens{kAssets, author_name(), make_gl_texture_factory()};
};

// Theme, text size, legend and a developer switch, in one popup so that the
// top row keeps its room for the screens at a large text size.
void draw_display_popup(AppState& s) {
  if (!ImGui::BeginPopupModal("Display", nullptr, ImGuiWindowFlags_AlwaysAutoResize | ImGuiWindowFlags_NoMove))
    return;
  // Labelled by what it switches to: the current theme is already on screen.
  const char* theme_label = s.theme == Theme::sunlight ? "Switch to shade theme" : "Switch to sunlight theme";
  if (ImGui::Button(theme_label)) {
    s.theme = s.theme == Theme::sunlight ? Theme::shade : Theme::sunlight;
    s.restyle = true;
  }
  probe("display:theme");
  // A stepper: wide − and + either side of the size they change.
  const ImVec2 step(ImGui::GetFrameHeight() * 1.6f, 0);
  ImGui::BeginDisabled(s.scale < 0.76f);
  if (ImGui::Button("\u2212##smaller", step)) s.scale = std::max(0.75f, s.scale - 0.25f), s.restyle = true;
  probe("display:smaller");
  ImGui::EndDisabled();
  ImGui::SameLine();
  ImGui::AlignTextToFramePadding();
  ImGui::Text("Text %d%%", static_cast<int>(s.scale * 100 + 0.5f));
  ImGui::SameLine();
  ImGui::BeginDisabled(s.scale > 2.49f);
  if (ImGui::Button("+##larger", step)) s.scale = std::min(2.5f, s.scale + 0.25f), s.restyle = true;
  probe("display:larger");
  ImGui::EndDisabled();
  if (ImGui::Button("Legend\u2026")) ImGui::OpenPopup("Legend");
  probe("display:legend");
  draw_legend_popup("Legend");
  ImGui::Checkbox("Developer: frame time", &s.show_frame_time);
  probe("display:frame-time");
  ImGui::Separator();
  if (ImGui::Button("Close")) ImGui::CloseCurrentPopup();
  probe("display:close");
  ImGui::EndPopup();
}

// The top row: the app's name, the screens, and "Display…" at the right end;
// it wraps like words when the text is large.
void draw_top_bar(AppState& s) {
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Soffit");
  s.screens.draw_tabs();
  const char* display = "Display\u2026";
  const float width = ImGui::CalcTextSize(display).x + ImGui::GetStyle().FramePadding.x * 2;
  same_line_if_fits(display);
  const float right = ImGui::GetWindowContentRegionMax().x - width;
  if (ImGui::GetCursorPosX() < right && ImGui::GetCursorScreenPos().y < ImGui::GetItemRectMax().y)
    ImGui::SetCursorPosX(right);  // on the same row: at its right end, where it is always found
  if (ImGui::Button(display)) ImGui::OpenPopup("Display");
  probe("display");
  draw_display_popup(s);
}

// Developer aid, off by default: the time per frame, small, in a corner.
void draw_frame_time(const AppState& s) {
  if (!s.show_frame_time) return;
  const ImGuiViewport* vp = ImGui::GetMainViewport();
  ImGui::SetNextWindowPos(ImVec2(vp->Pos.x + vp->Size.x - 8, vp->Pos.y + vp->Size.y - 8), ImGuiCond_Always,
                          ImVec2(1, 1));
  ImGui::SetNextWindowBgAlpha(0.8f);
  ImGui::Begin("##frame-time", nullptr,
               ImGuiWindowFlags_NoDecoration | ImGuiWindowFlags_NoInputs | ImGuiWindowFlags_AlwaysAutoResize |
                   ImGuiWindowFlags_NoSavedSettings | ImGuiWindowFlags_NoFocusOnAppearing | ImGuiWindowFlags_NoNav);
  ImGui::SetWindowFontScale(0.7f);
  ImGui::Text("%.1f ms/frame", 1000.0f / std::max(ImGui::GetIO().Framerate, 1e-3f));
  ImGui::End();
}

}  // namespace

int run_gui(const GuiOptions& options) {
  std::setlocale(LC_NUMERIC, "C");  // numbers read and written the same in every locale
  if (!glfwInit()) {
    std::fputs("soffit: cannot open a window (no display?). The headless verbs still work: soffit fit …\n",
               stderr);
    return 1;
  }
  glfwWindowHint(GLFW_CONTEXT_VERSION_MAJOR, 3);
  glfwWindowHint(GLFW_CONTEXT_VERSION_MINOR, 0);
  GLFWwindow* window = glfwCreateWindow(1280, 800, "Soffit", nullptr, nullptr);
  if (!window) {
    std::fputs("soffit: cannot create an OpenGL 3.0 window\n", stderr);
    glfwTerminate();
    return 1;
  }
  glfwMakeContextCurrent(window);
  glfwSwapInterval(1);

  IMGUI_CHECKVERSION();
  ImGui::CreateContext();
  ImGui::GetIO().IniFilename = nullptr;  // layout is the app's, not a file's
  ImGui_ImplGlfw_InitForOpenGL(window, true);
  ImGui_ImplOpenGL3_Init("#version 130");

  AppState state;
  // The theme to start in (shade for work under the arch; screenshots of both).
  if (const char* theme = std::getenv("SOFFIT_THEME"); theme && std::string(theme) == "shade") state.theme = Theme::shade;
  if (options.ui_scale > 0) {
    state.scale = options.ui_scale;
  } else {
    float sx = 1, sy = 1;
    glfwGetWindowContentScale(window, &sx, &sy);
    state.scale = std::clamp(std::max(sx, sy), 0.75f, 2.5f);
  }
  if (options.demo) {
    state.screens.open_demo();
    if (options.view == "start") {
      state.screens.screen = Screen::start;
    } else if (options.view == "defects") {
      state.screens.open_first_defects();
    } else if (options.view == "elevation") {
      state.screens.open_first_defects();
      state.screens.defects.show_for_screenshot("S1", "DS spandrel", "D03");
    } else if (options.view == "photos") {
      state.screens.open_first_defects();
      if (state.screens.defects.data().loaded())
        state.screens.open_photos(state.screens.defects.data().data().inspection.id);
    } else if (options.view == "rings" || options.view == "rings-add") {
      state.screens.open_first_rings_fill();
      if (options.view == "rings-add") state.screens.rings_fill.show_add_count_for_screenshot();
    } else if (options.view == "change") {
      state.screens.open_first_sections();
      state.screens.screen = Screen::structure;
      state.screens.start_comparison();
    } else if (options.view == "structure") {
      state.screens.open_first_sections();
      state.screens.screen = Screen::structure;
    } else if (options.view == "new-section") {
      state.screens.open_first_sections();
      state.screens.open_new_section_form();
    } else if (options.view == "add-structure") {
      state.screens.open_add_structure();
    } else if (options.view != "register") {
      state.screens.open_first_sections();
      if (options.view != "section") state.screens.sections.show_dialog_for_screenshot(options.view);
    }
  }

  const bool capturing = !options.screenshot_path.empty();
  int frame = 0, settled = 0, exit_code = 0;
  while (!glfwWindowShouldClose(window)) {
    if (capturing || state.screens.busy())
      glfwPollEvents();
    else
      glfwWaitEventsTimeout(0.5);
    if (state.restyle) {
      apply_style(state.theme, state.scale);
      load_font(state.scale, kAssets + "/fonts/DejaVuSans.ttf");
      ImGui_ImplOpenGL3_DestroyFontsTexture();
      ImGui_ImplOpenGL3_CreateFontsTexture();
      state.restyle = false;
    }
    state.screens.sections.poll();
    state.screens.photos.poll();

    ImGui_ImplOpenGL3_NewFrame();
    ImGui_ImplGlfw_NewFrame();
    ImGui::NewFrame();
    const ImGuiViewport* vp = ImGui::GetMainViewport();
    ImGui::SetNextWindowPos(vp->Pos);
    ImGui::SetNextWindowSize(vp->Size);
    ImGui::Begin("##main", nullptr,
                 ImGuiWindowFlags_NoDecoration | ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoSavedSettings);
    draw_top_bar(state);
    ImGui::Separator();
    state.screens.draw_current();
    drag_to_scroll();  // at a large text scale the screen itself is longer than the window
    ImGui::End();
    draw_frame_time(state);
    ImGui::Render();

    int w = 0, h = 0;
    glfwGetFramebufferSize(window, &w, &h);
    glViewport(0, 0, w, h);
    const ImVec4 bg = ImGui::GetStyle().Colors[ImGuiCol_WindowBg];
    glClearColor(bg.x, bg.y, bg.z, 1);
    glClear(GL_COLOR_BUFFER_BIT);
    ImGui_ImplOpenGL3_RenderDrawData(ImGui::GetDrawData());

    ++frame;
    const bool waiting = (state.screens.screen == Screen::section &&
                          (state.screens.sections.busy() || !state.screens.sections.analysis())) ||
                         (state.screens.screen == Screen::compare && !state.screens.changes());
    settled = waiting || state.screens.busy() ? 0 : settled + 1;
    // Capture once the fit has arrived and a few frames have settled the layout
    // (a dialog opened for the screenshot appears a frame after it is asked for).
    if (capturing && ((frame >= options.screenshot_frames && settled >= 4) || frame > 600)) {
      if (!write_back_buffer_png(options.screenshot_path, w, h)) {
        std::fprintf(stderr, "soffit: cannot write %s\n", options.screenshot_path.c_str());
        exit_code = 1;
      }
      break;
    }
    glfwSwapBuffers(window);
  }

  state.screens.photos.close();  // its textures go while the GL context exists
  ImGui_ImplOpenGL3_Shutdown();
  ImGui_ImplGlfw_Shutdown();
  ImGui::DestroyContext();
  glfwDestroyWindow(window);
  glfwTerminate();
  return exit_code;
}

}  // namespace soffit::gui
