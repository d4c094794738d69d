#pragma once
// The photos of one visit (FIELD.md §6.3): a column of thumbnails to tap, the
// chosen photo large with its caption, EXIF date and the markers that place
// the visit's defects on it. "Mark a defect": choose the defect from a list,
// then tap where it is on the photo (one undoable edit). A link is removed
// only after a confirmation. "Add photo…" copies a file into the project.
//
// Nothing here waits on the disk: thumbnails and photos are decoded by a
// PhotoLoader on its worker, and an import prepares the file (check, decode,
// hash, thumbnail, copy into the media folder) on a std::async worker that
// never touches the project's connection. Call poll() once a frame on the UI
// thread (it stores a prepared photo as one edit and uploads finished images
// as textures), then draw().
#include <functional>
#include <future>
#include <map>
#include <memory>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include <imgui.h>

#include "app/gui/gl_texture.hpp"
#include "app/model/photo_loader.hpp"
#include "storage/photo_queries.hpp"
#include "storage/photo_store.hpp"
#include "storage/project_file.hpp"

namespace soffit::gui {

class PhotoViewer {
 public:
  // Without a texture factory (headless tests) images are decoded but drawn
  // as placeholder rectangles of the same shape. `keep_large` bounds the big
  // photos kept as textures and as decoded pixels.
  explicit PhotoViewer(std::unique_ptr<TextureFactory> textures = nullptr, size_t keep_large = 4);
  ~PhotoViewer();  // destroys its textures: the GL context must still exist (call close() first)
  PhotoViewer(const PhotoViewer&) = delete;
  PhotoViewer& operator=(const PhotoViewer&) = delete;

  // Shows the photos of `inspection_id`. With `focus_defect_id` the first
  // photo of that defect is shown and "Mark a defect" offers it first. The
  // project must stay open while shown. Problems are shown, never thrown.
  void open(storage::Project& project, const std::string& inspection_id,
            const std::optional<std::string>& focus_defect_id = std::nullopt);
  // Waits for an import under way and stores it (so a copied original is never
  // left without its row), then frees every texture. The project must still be open.
  void close();
  bool is_open() const { return project_ != nullptr; }

  void poll();  // UI thread, once a frame, before draw()
  // Into the current window, filling the space left. Its "Close photos"
  // button calls close() at the end of the frame (once an import under way is
  // stored): draw the screen behind it again once is_open() is false.
  void draw();

  // Decoding or importing: keep frames coming (poll events rather than wait).
  bool busy() const;
  // A photo is being prepared on a worker (only one at a time); poll() stores it.
  bool importing() const { return import_job_.valid(); }

  // For tests and the lead's wiring.
  const storage::VisitPhotos& visit() const { return visit_; }
  std::optional<size_t> selected() const { return selected_; }
  void select_photo(size_t index);
  bool thumbnails_ready() const;  // every thumbnail decoded or failed
  bool photo_ready() const;       // the shown photo decoded or failed
  std::string photo_error() const;  // why the shown photo cannot be shown; "" when it can
  // Where the shown photo was drawn in the last frame (top left, bottom right).
  std::optional<std::pair<ImVec2, ImVec2>> image_rect() const { return image_rect_; }
  const std::string& message() const { return message_; }
  const std::string& saved_note() const { return saved_note_; }

 private:
  struct Picture {
    ImTextureID texture = nullptr;
    int width = 0, height = 0;  // as decoded (seen upright)
    bool loading = true;
    std::string error;
  };
  struct ImportResult {
    std::optional<storage::PreparedPhoto> prepared;
    std::string error, file_name;
  };

  void reload();
  void request_thumbnails();
  void request_photo();
  void upload(app::LoadedPhoto&& loaded);
  void drop_picture(const std::string& key);
  void finish_import();
  bool read_only() const { return visit_.status == "issued"; }
  void change(const std::string& label, const std::function<void(storage::Connection&)>& edit);
  void run(const char* what, const std::function<void()>& action);
  const storage::VisitPhoto* shown() const;
  const storage::VisitDefectChoice* defect(const std::string& id) const;

  void draw_toolbar();
  void draw_thumbnails();
  void draw_photo(ImVec2 size);
  void draw_image(ImDrawList* draw, const Picture* picture, ImVec2 a, ImVec2 b, const char* idle) const;
  void draw_markers(ImDrawList* draw, const storage::VisitPhoto& photo, ImVec2 a, ImVec2 b) const;
  void draw_choose_defect_popup();
  void draw_unlink_popup();
  void draw_import_popup();

  std::unique_ptr<TextureFactory> textures_;
  size_t keep_large_;
  app::PhotoLoader loader_;
  storage::Project* project_ = nullptr;
  storage::VisitPhotos visit_;
  std::optional<std::string> focus_defect_;
  std::optional<size_t> selected_;
  std::map<std::string, Picture> pictures_;  // "thumb:<photo id>" and "photo:<photo id>"
  std::vector<std::string> large_order_;      // photo keys, least recently shown first
  std::string undo_label_, redo_label_;

  std::string marking_defect_;  // a defect chosen, waiting for the tap on the photo
  bool open_choose_ = false, open_unlink_ = false, open_import_ = false, close_requested_ = false;
  std::pair<std::string, std::string> unlinking_;  // (defect id, ref) awaiting confirmation

  char import_path_[512] = {};
  char import_caption_[200] = {};
  std::future<ImportResult> import_job_;
  storage::PhotoOptions import_options_;  // of the import under way: the visit and caption as given
  std::future<std::vector<std::string>> folder_job_;
  std::vector<std::string> folder_files_;
  std::string folder_note_;

  std::string message_;     // the last problem, for the person
  std::string saved_note_;  // where the last change went
  std::optional<std::pair<ImVec2, ImVec2>> image_rect_;
};

}  // namespace soffit::gui
