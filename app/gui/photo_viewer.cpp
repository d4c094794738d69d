#include "app/gui/photo_viewer.hpp"

#include <algorithm>
#include <cctype>
#include <chrono>
#include <cstdio>
#include <exception>
#include <filesystem>

#include "app/gui/defect_marks.hpp"
#include "app/gui/fitted_modal.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"

namespace soffit::gui {
namespace {

namespace fs = std::filesystem;

// The largest photo texture: more than a tablet screen, and 16 MB at most.
constexpr int kPhotoSide = 2048;

std::string thumb_key(const std::string& photo_id) { return "thumb:" + photo_id; }
std::string photo_key(const std::string& photo_id) { return "photo:" + photo_id; }

template <typename T>
bool ready(const std::future<T>& f) {
  return f.valid() && f.wait_for(std::chrono::seconds(0)) == std::future_status::ready;
}

std::string words(std::string key) {
  std::replace(key.begin(), key.end(), '_', ' ');
  return key;
}

std::string file_size_text(long long bytes) {
  char buf[32];
  if (bytes >= 1024 * 1024)
    std::snprintf(buf, sizeof buf, "%.1f MB", static_cast<double>(bytes) / (1024.0 * 1024.0));
  else
    std::snprintf(buf, sizeof buf, "%lld kB", (bytes + 1023) / 1024);
  return buf;
}

// What the person calls the photo: the start of its caption (the demo's and
// FIELD.md §6.3's habit is an ID first), else the name it was added under.
std::string short_name(const storage::VisitPhoto& p) {
  if (!p.caption.empty()) return p.caption.substr(0, p.caption.find_first_of(" ,"));
  return p.original_name.empty() ? p.file_name : p.original_name;
}

float button_width(const std::string& label) {
  return ImGui::CalcTextSize(label.c_str()).x + ImGui::GetStyle().FramePadding.x * 2;
}

// Continues the row when `width` more fits, else starts a new one: at large
// text scales a row of buttons must wrap, not run off the screen.
void same_line_if_fits(float width) {
  const float right = ImGui::GetItemRectMax().x + ImGui::GetStyle().ItemSpacing.x + width;
  if (right <= ImGui::GetWindowPos().x + ImGui::GetWindowContentRegionMax().x) ImGui::SameLine();
}

bool is_photo_file(const fs::path& p) {
  std::string ext = p.extension().string();
  std::transform(ext.begin(), ext.end(), ext.begin(), [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return ext == ".jpg" || ext == ".jpeg" || ext == ".png";
}

// The JPEG and PNG files in the folder of `typed` (or in it, if it is a folder).
std::vector<std::string> list_photo_files(const std::string& typed) {
  std::error_code ec;
  fs::path folder = typed.empty() ? fs::current_path(ec) : fs::path(typed);
  if (!fs::is_directory(folder, ec)) folder = folder.parent_path();
  std::vector<std::string> out;
  for (fs::directory_iterator it(folder, ec), end; !ec && it != end; it.increment(ec))
    if (it->is_regular_file(ec) && is_photo_file(it->path())) out.push_back(it->path().string());
  std::sort(out.begin(), out.end());
  if (out.size() > 60) out.resize(60);  // a camera card's DCIM folder can hold thousands
  return out;
}

}  // namespace

PhotoViewer::PhotoViewer(std::unique_ptr<TextureFactory> textures, size_t keep_large)
    : textures_(std::move(textures)), keep_large_(std::max<size_t>(1, keep_large)), loader_(keep_large_) {}

PhotoViewer::~PhotoViewer() { close(); }

void PhotoViewer::open(storage::Project& project, const std::string& inspection_id,
                       const std::optional<std::string>& focus_defect_id) {
  close();
  project_ = &project;
  visit_.inspection_id = inspection_id;
  focus_defect_ = focus_defect_id;
  reload();
  if (focus_defect_)
    for (size_t i = 0; i < visit_.photos.size() && !selected_; ++i)
      for (const auto& l : visit_.photos[i].links)
        if (l.defect_id == *focus_defect_) selected_ = i;
  if (!selected_ && !visit_.photos.empty()) selected_ = 0;
  request_photo();
}

void PhotoViewer::close() {
  // The worker may have copied the original into the media folder: store its
  // row now rather than leave the file without one.
  if (import_job_.valid() && project_) {
    import_job_.wait();
    finish_import();
  }
  import_job_ = {};
  close_requested_ = false;
  folder_job_ = {};
  loader_.clear();
  for (auto& [key, picture] : pictures_)
    if (picture.texture && textures_) textures_->destroy(picture.texture);
  pictures_.clear();
  large_order_.clear();
  project_ = nullptr;
  visit_ = {};
  selected_.reset();
  focus_defect_.reset();
  marking_defect_.clear();
  message_.clear();
  saved_note_.clear();
  image_rect_.reset();
}

void PhotoViewer::reload() {
  if (!project_) return;
  const std::string keep_id = shown() ? shown()->id : std::string();
  try {
    visit_ = storage::load_visit_photos(project_->db(), visit_.inspection_id);
    undo_label_ = project_->undo_label();
    redo_label_ = project_->redo_label();
  } catch (const std::exception& e) {
    const std::string id = visit_.inspection_id;
    visit_ = {};
    visit_.inspection_id = id;
    message_ = std::string("Cannot read the visit's photos: ") + e.what();
  }
  selected_.reset();
  for (size_t i = 0; i < visit_.photos.size(); ++i)
    if (visit_.photos[i].id == keep_id) selected_ = i;
  request_thumbnails();
}

void PhotoViewer::request_thumbnails() {
  for (const auto& p : visit_.photos) {
    const std::string key = thumb_key(p.id);
    if (pictures_.count(key)) continue;
    Picture& pic = pictures_[key];
    if (p.thumbnail_png.empty()) {
      pic.loading = false;
      pic.error = "no thumbnail stored";
      continue;
    }
    loader_.request_bytes(key, "thumbnail of " + short_name(p), p.thumbnail_png, storage::kThumbnailSide);
  }
}

void PhotoViewer::request_photo() {
  const storage::VisitPhoto* p = shown();
  if (!p || !project_) return;
  const std::string key = photo_key(p->id);
  // The person moved on: photos asked for before and not begun are not wanted now.
  for (const auto& other : visit_.photos)
    if (other.id != p->id) {
      const auto it = pictures_.find(photo_key(other.id));
      if (it != pictures_.end() && it->second.loading) {
        std::erase(large_order_, it->first);
        loader_.cancel(it->first);
        pictures_.erase(it);
      }
    }
  std::erase(large_order_, key);
  large_order_.push_back(key);
  if (pictures_.count(key)) return;
  pictures_[key] = Picture{};
  const int side = textures_ ? std::min(kPhotoSide, textures_->max_side()) : kPhotoSide;
  loader_.request(key, storage::photo_file_path(project_->path(), p->file_name), side, p->orientation);
  // Textures of photos shown long ago go first; their pixels may still be in the loader's cache.
  while (large_order_.size() > keep_large_) {
    drop_picture(large_order_.front());
    large_order_.erase(large_order_.begin());
  }
}

void PhotoViewer::drop_picture(const std::string& key) {
  const auto it = pictures_.find(key);
  if (it == pictures_.end()) return;
  if (it->second.texture && textures_) textures_->destroy(it->second.texture);
  if (it->second.loading) loader_.cancel(key);
  pictures_.erase(it);
}

void PhotoViewer::select_photo(size_t index) {
  if (index >= visit_.photos.size()) return;
  selected_ = index;
  request_photo();
}

const storage::VisitPhoto* PhotoViewer::shown() const {
  return selected_ && *selected_ < visit_.photos.size() ? &visit_.photos[*selected_] : nullptr;
}

const storage::VisitDefectChoice* PhotoViewer::defect(const std::string& id) const {
  for (const auto& d : visit_.defects)
    if (d.id == id) return &d;
  return nullptr;
}

bool PhotoViewer::busy() const { return loader_.busy() || import_job_.valid() || folder_job_.valid(); }

bool PhotoViewer::thumbnails_ready() const {
  for (const auto& p : visit_.photos) {
    const auto it = pictures_.find(thumb_key(p.id));
    if (it == pictures_.end() || it->second.loading) return false;
  }
  return true;
}

bool PhotoViewer::photo_ready() const {
  const storage::VisitPhoto* p = shown();
  if (!p) return false;
  const auto it = pictures_.find(photo_key(p->id));
  return it != pictures_.end() && !it->second.loading;
}

std::string PhotoViewer::photo_error() const {
  const storage::VisitPhoto* p = shown();
  const auto it = p ? pictures_.find(photo_key(p->id)) : pictures_.end();
  return it == pictures_.end() ? std::string() : it->second.error;
}

void PhotoViewer::poll() {
  if (ready(import_job_)) finish_import();
  if (ready(folder_job_)) {
    folder_files_ = folder_job_.get();
    folder_note_ = folder_files_.empty() ? "No JPEG or PNG files there." : "";
  }
  for (app::LoadedPhoto& loaded : loader_.poll()) upload(std::move(loaded));
}

void PhotoViewer::upload(app::LoadedPhoto&& loaded) {
  const auto it = pictures_.find(loaded.key);
  if (it == pictures_.end()) return;  // no longer wanted
  Picture& pic = it->second;
  pic.loading = false;
  if (!loaded.image) {
    pic.error = loaded.error;
    return;
  }
  pic.width = loaded.image->width;
  pic.height = loaded.image->height;
  if (textures_) {
    if (pic.texture) textures_->destroy(pic.texture);
    pic.texture = textures_->create(loaded.image->rgba.data(), pic.width, pic.height);
    if (!pic.texture) pic.error = "the display could not take the image (" + std::to_string(pic.width) + " x " +
                                  std::to_string(pic.height) + " px)";
  }
}

void PhotoViewer::run(const char* what, const std::function<void()>& action) {
  try {
    action();
    message_.clear();
  } catch (const std::exception& e) {
    message_ = std::string(what) + ": " + e.what();
  }
}

void PhotoViewer::change(const std::string& label, const std::function<void(storage::Connection&)>& edit) {
  if (!project_) return;
  run("Not saved", [&] {
    project_->edit(label, edit);
    saved_note_ = "Saved to " + fs::path(project_->path()).filename().string() + ": " + label + ".";
  });
  reload();
}

void PhotoViewer::finish_import() {
  ImportResult result;
  try {
    result = import_job_.get();
  } catch (const std::exception& e) {
    result.error = e.what();
  }
  import_job_ = {};
  // The worker only prepared the file; the row is stored here, on the UI
  // thread that owns the connection, as one edit.
  std::optional<storage::PhotoRecord> stored;
  if (result.prepared) {
    try {
      stored = storage::insert_prepared_photo(*project_, *result.prepared, import_options_);
    } catch (const std::exception& e) {
      result.error = e.what();
    }
  }
  if (!stored) {
    message_ = "Photo not added: " + result.error;
    reload();
    return;
  }
  const storage::PhotoRecord& r = *stored;
  const std::string media = fs::path(storage::media_folder(project_->path())).filename().string();
  saved_note_ = r.already_present ? result.file_name + " was already in the project; nothing new was stored."
                                  : "Copied " + result.file_name + " into " + media + " and saved it to the visit.";
  message_.clear();
  const std::string author = project_->author(), visit = visit_.inspection_id;
  if (r.already_present) {
    // Stored before without a visit: give it to this one (one more undo step).
    bool given = false;
    run("Not saved", [&] {
      project_->edit("give photo " + result.file_name + " to the visit",
                     [&](storage::Connection& db) { given = storage::give_photo_to_visit(db, author, r.id, visit); });
    });
    if (given) saved_note_ += " It now belongs to this visit.";
  }
  if (focus_defect_) {
    bool linked = false;
    for (const auto& p : visit_.photos)
      if (p.id == r.id)
        for (const auto& l : p.links) linked = linked || l.defect_id == *focus_defect_;
    const auto* d = defect(*focus_defect_);
    if (!linked && d) {
      // Linked to the defect the viewer was opened for, as a whole; "Mark a defect" places it.
      run("Not linked", [&] {
        project_->edit("link photo " + result.file_name + " to " + d->ref, [&](storage::Connection& db) {
          storage::link_photo_to_defect(db, author, r.id, *focus_defect_, std::nullopt);
        });
        saved_note_ += " Linked to " + d->ref + ".";
      });
    }
  }
  reload();
  // The new photo is shown, unless the person is marking a defect on another
  // one meanwhile: their next tap belongs to the photo they are looking at.
  if (marking_defect_.empty())
    for (size_t i = 0; i < visit_.photos.size(); ++i)
      if (visit_.photos[i].id == r.id) select_photo(i);
}

// ---------------------------------------------------------------- drawing

void PhotoViewer::draw() {
  image_rect_.reset();
  if (!project_) {
    ImGui::TextWrapped("Open a visit to see its photos.");
    return;
  }
  draw_toolbar();
  const float f = ImGui::GetFontSize();
  const ImVec2 avail = ImGui::GetContentRegionAvail();
  // At a large text size the rows above leave little room: the photo keeps most
  // of a display's height and the screen scrolls instead of shrinking it.
  const float pane_h = std::max({f * 6, avail.y, ImGui::GetIO().DisplaySize.y * 0.75f});
  const float thumbs_w = f * 9.5f;
  // The scrollbar is always there, so thumbnails do not shift under a finger when it appears.
  ImGui::BeginChild("##thumbnails", ImVec2(thumbs_w, pane_h), true,
                    ImGuiWindowFlags_AlwaysVerticalScrollbar);
  draw_thumbnails();
  ImGui::EndChild();
  ImGui::SameLine();
  ImGui::BeginChild("##photo", ImVec2(0, pane_h), false,
                    ImGuiWindowFlags_NoScrollbar | ImGuiWindowFlags_NoScrollWithMouse);
  draw_photo(ImGui::GetContentRegionAvail());
  ImGui::EndChild();
  draw_choose_defect_popup();
  draw_unlink_popup();
  draw_import_popup();
  // While a photo is being prepared, closing waits for it (poll() stores it)
  // rather than make this frame wait on the disk.
  if (close_requested_ && !importing()) {
    close_requested_ = false;
    close();
  }
}

void PhotoViewer::draw_toolbar() {
  const Palette& c = palette();
  ImGui::AlignTextToFramePadding();
  ImGui::Text("Photos of the visit on %s (%s)", visit_.date.c_str(), visit_.status.c_str());
  same_line_if_fits(button_width("Close photos"));
  if (ImGui::Button("Close photos")) close_requested_ = true;
  probe("close photos");
  same_line_if_fits(button_width("Add photo..."));
  ImGui::BeginDisabled(read_only());
  ImGui::BeginDisabled(importing());  // one import at a time
  if (ImGui::Button("Add photo...")) open_import_ = true;
  probe("add photo");
  ImGui::EndDisabled();
  same_line_if_fits(button_width("Mark a defect"));
  ImGui::BeginDisabled(!shown() || visit_.defects.empty());
  if (ImGui::Button("Mark a defect")) open_choose_ = true;
  probe("mark defect");
  ImGui::EndDisabled();
  ImGui::EndDisabled();
  same_line_if_fits(button_width("Undo"));
  ImGui::BeginDisabled(undo_label_.empty());
  if (ImGui::Button("Undo")) {
    run("Undo", [&] { project_->undo(); });
    reload();
  }
  probe("undo");
  ImGui::EndDisabled();
  same_line_if_fits(button_width("Redo"));
  ImGui::BeginDisabled(redo_label_.empty());
  if (ImGui::Button("Redo")) {
    run("Redo", [&] { project_->redo(); });
    reload();
  }
  probe("redo");
  ImGui::EndDisabled();
  if (!undo_label_.empty()) {
    const std::string next = "next undo: " + undo_label_;
    same_line_if_fits(ImGui::CalcTextSize(next.c_str()).x);
    ImGui::AlignTextToFramePadding();
    ImGui::TextDisabled("%s", next.c_str());
  }
  if (read_only())
    ImGui::TextWrapped("This visit is issued and read-only: photos and markers are shown, not changed. A correction is "
                       "a new revision of the visit.");
  if (importing())
    ImGui::TextWrapped(close_requested_ ? "Adding the photo: the photos close once it is stored..."
                                        : "Adding the photo: copying it into the project and checking it...");
  if (!saved_note_.empty()) ImGui::TextWrapped("%s", saved_note_.c_str());
  if (!message_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(c.residual_below));
    ImGui::TextWrapped("%s", message_.c_str());
    ImGui::PopStyleColor();
  }
}

void PhotoViewer::draw_image(ImDrawList* draw, const Picture* picture, ImVec2 a, ImVec2 b, const char* idle) const {
  const Palette& c = palette();
  if (picture && picture->texture) {
    draw->AddImage(picture->texture, a, b);
    return;
  }
  // No texture yet (decoding), none possible (headless), or the file failed: a
  // rectangle of the photo's shape keeps the layout and the marker positions.
  draw->AddRectFilled(a, b, c.grid);
  draw->AddRect(a, b, c.faint_ink);
  const char* text = !picture || picture->loading ? "loading..." : !picture->error.empty() ? "cannot show" : idle;
  const ImVec2 size = ImGui::CalcTextSize(text);
  if (size.x < b.x - a.x) draw->AddText(ImVec2((a.x + b.x - size.x) / 2, (a.y + b.y - size.y) / 2), c.ink, text);
}

void PhotoViewer::draw_thumbnails() {
  const float f = ImGui::GetFontSize();
  const float side = ImGui::GetContentRegionAvail().x;
  if (visit_.photos.empty()) {
    ImGui::TextWrapped("No photos in this visit yet. Add one with \"Add photo...\".");
    return;
  }
  ImDrawList* draw = ImGui::GetWindowDrawList();
  for (size_t i = 0; i < visit_.photos.size(); ++i) {
    const storage::VisitPhoto& p = visit_.photos[i];
    const auto it = pictures_.find(thumb_key(p.id));
    const Picture* pic = it == pictures_.end() ? nullptr : &it->second;
    float aspect = 0.75f;
    if (pic && pic->width > 0) aspect = static_cast<float>(pic->height) / static_cast<float>(pic->width);
    const float h = std::clamp(side * aspect, f * 3, side * 1.4f);
    ImGui::PushID(static_cast<int>(i));
    const ImVec2 a = ImGui::GetCursorScreenPos();
    // One tap target for the picture and its label together.
    const float label_h = ImGui::GetTextLineHeightWithSpacing();
    if (ImGui::InvisibleButton("##thumb", ImVec2(side, h + label_h))) select_photo(i);
    probe("photo:" + std::to_string(i + 1));
    const ImVec2 b(a.x + side, a.y + h);
    draw_image(draw, pic, a, b, "photo");
    if (selected_ == i) draw->AddRect(ImVec2(a.x - 2, a.y - 2), ImVec2(b.x + 2, b.y + label_h + 2),
                                      palette().reading, 0, 0, f * 0.2f);
    std::string label = short_name(p);
    for (const auto& l : p.links) label += " " + l.defect_ref;
    draw->PushClipRect(a, ImVec2(b.x, b.y + label_h), true);
    draw->AddText(ImVec2(a.x + f * 0.2f, b.y + 2), palette().ink, label.c_str());
    draw->PopClipRect();
    ImGui::PopID();
  }
}

void PhotoViewer::draw_markers(ImDrawList* draw, const storage::VisitPhoto& photo, ImVec2 a, ImVec2 b) const {
  const Palette& c = palette();
  const float f = ImGui::GetFontSize();
  draw->PushClipRect(a, b, true);
  for (const auto& l : photo.links) {
    if (!l.marker) continue;
    const ImVec2 p(a.x + static_cast<float>(l.marker->x) * (b.x - a.x), a.y + static_cast<float>(l.marker->y) * (b.y - a.y));
    const storage::VisitDefectChoice* d = defect(l.defect_id);
    const unsigned int colour = defect_family(d ? d->defect_type : "other").colour;
    // Soffit's marker: a ring with a gap at the centre so the defect itself
    // stays visible, haloed in paper so it reads on dark brick and bright sky.
    const float r = f * 0.9f;
    draw->AddCircle(p, r, c.paper, 0, f * 0.42f);
    draw->AddCircle(p, r, colour, 0, f * 0.22f);
    for (const ImVec2 dir : {ImVec2(1, 0), ImVec2(-1, 0), ImVec2(0, 1), ImVec2(0, -1)}) {
      const ImVec2 from(p.x + dir.x * r * 1.25f, p.y + dir.y * r * 1.25f), to(p.x + dir.x * r * 1.9f, p.y + dir.y * r * 1.9f);
      draw->AddLine(from, to, c.paper, f * 0.32f);
      draw->AddLine(from, to, colour, f * 0.14f);
    }
    const bool focused = focus_defect_ && *focus_defect_ == l.defect_id;
    const ImVec2 text = ImGui::CalcTextSize(l.defect_ref.c_str());
    // The label sits up and to the right, turning inwards near the photo's edges so it is never cut off.
    const float box_w = text.x + f * 0.6f, box_h = text.y + f * 0.3f;
    float box_x = p.x + r * 1.4f, box_y = p.y - r * 1.9f - text.y * 0.5f;
    if (box_x + box_w > b.x) box_x = p.x - r * 1.4f - box_w;
    if (box_y < a.y) box_y = p.y + r * 1.9f - box_h + text.y * 0.5f;
    const ImVec2 box_a(box_x, box_y), box_b(box_x + box_w, box_y + box_h);
    draw->AddRectFilled(box_a, box_b, c.paper, f * 0.2f);
    draw->AddRect(box_a, box_b, focused ? c.caution : colour, f * 0.2f, 0, focused ? f * 0.2f : f * 0.1f);
    draw->AddText(ImVec2(box_a.x + f * 0.3f, box_a.y + f * 0.15f), c.ink, l.defect_ref.c_str());
  }
  draw->PopClipRect();
}

void PhotoViewer::draw_photo(ImVec2 size) {
  const storage::VisitPhoto* p = shown();
  const float f = ImGui::GetFontSize();
  if (!p) {
    ImGui::TextWrapped("Tap a photo on the left to see it large.");
    return;
  }
  // Facts first, so the photo takes what is left.
  ImGui::TextWrapped("%s", p->caption.empty() ? "(no caption)" : p->caption.c_str());
  std::string facts = p->exif_taken_at ? "Taken " + *p->exif_taken_at + " (EXIF)" : std::string("No EXIF date");
  const bool turned = p->orientation >= 5;
  facts += "; " + std::to_string(turned ? p->height_px : p->width_px) + " x " +
           std::to_string(turned ? p->width_px : p->height_px) + " px, " + file_size_text(p->byte_size);
  if (p->orientation != 1) facts += ", turned upright from EXIF orientation " + std::to_string(p->orientation);
  ImGui::TextDisabled("%s", facts.c_str());

  if (!marking_defect_.empty()) {
    const auto* d = defect(marking_defect_);
    ImGui::AlignTextToFramePadding();
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().caution));
    ImGui::Text("Tap the photo where %s is.", d ? d->ref.c_str() : "the defect");
    ImGui::PopStyleColor();
    ImGui::SameLine();
    if (ImGui::Button("Cancel marking")) marking_defect_.clear();
    probe("cancel marking");
  } else if (p->links.empty()) {
    ImGui::AlignTextToFramePadding();
    ImGui::TextUnformatted("No defect marked on this photo yet.");
  } else {
    ImGui::AlignTextToFramePadding();
    ImGui::TextUnformatted("Marked:");
    for (const auto& l : p->links) {
      const std::string where = l.marker ? "" : l.marker_problem.empty() ? " (whole photo)" : " (marker unreadable)";
      const std::string label = l.defect_ref + where + ": remove link...";
      same_line_if_fits(button_width(label));
      ImGui::BeginDisabled(read_only());
      if (ImGui::Button(label.c_str())) {
        unlinking_ = {l.defect_id, l.defect_ref};
        open_unlink_ = true;
      }
      probe("unlink:" + l.defect_ref);
      ImGui::EndDisabled();
    }
    for (const auto& l : p->links)
      if (!l.marker_problem.empty()) ImGui::TextWrapped("%s: %s", l.defect_ref.c_str(), l.marker_problem.c_str());
  }

  const auto it = pictures_.find(photo_key(p->id));
  const Picture* pic = it == pictures_.end() ? nullptr : &it->second;
  if (pic && !pic->error.empty()) ImGui::TextWrapped("%s", pic->error.c_str());

  const ImVec2 top = ImGui::GetCursorScreenPos();
  const float used = top.y - (ImGui::GetWindowPos().y);
  const float w = std::max(f * 4, size.x), h = std::max(f * 4, ImGui::GetWindowHeight() - used - f * 0.5f);
  float iw = static_cast<float>(turned ? p->height_px : p->width_px), ih = static_cast<float>(turned ? p->width_px : p->height_px);
  if (pic && pic->width > 0) iw = static_cast<float>(pic->width), ih = static_cast<float>(pic->height);
  if (iw <= 0 || ih <= 0) iw = 4, ih = 3;
  const float scale = std::min(w / iw, h / ih);
  const ImVec2 a(top.x + (w - iw * scale) / 2, top.y), b(a.x + iw * scale, a.y + ih * scale);
  image_rect_ = std::make_pair(a, b);

  ImGui::SetCursorScreenPos(a);
  // The photo is one tap target: while marking, a tap places the marker.
  const bool tapped = ImGui::InvisibleButton("##photo", ImVec2(b.x - a.x, b.y - a.y));
  probe("photo view");
  ImDrawList* draw = ImGui::GetWindowDrawList();
  draw_image(draw, pic, a, b, "photo (no display)");
  draw_markers(draw, *p, a, b);
  if (tapped && !marking_defect_.empty()) {
    const ImVec2 m = ImGui::GetIO().MousePos;
    const storage::PhotoMarker marker{std::clamp((m.x - a.x) / (b.x - a.x), 0.0f, 1.0f),
                                      std::clamp((m.y - a.y) / (b.y - a.y), 0.0f, 1.0f)};
    const std::string defect_id = marking_defect_, photo_id = p->id;
    const auto* d = defect(defect_id);
    bool moved = false;
    for (const auto& l : p->links) moved = moved || l.defect_id == defect_id;
    const std::string author = project_->author();
    marking_defect_.clear();
    change(std::string(moved ? "move marker of " : "mark ") + (d ? d->ref : "defect") + " on " + short_name(*p),
           [&](storage::Connection& db) {
             if (moved) storage::unlink_photo_from_defect(db, photo_id, defect_id);  // one marker per defect a photo
             storage::link_photo_to_defect(db, author, photo_id, defect_id, marker);
           });
  }
}

void PhotoViewer::draw_choose_defect_popup() {
  if (open_choose_) {
    ImGui::OpenPopup("Mark a defect");
    open_choose_ = false;
  }
  // One modal is open at a time, so one layout state per dialog is enough (kept
  // here: the class's header is not this file's).
  static FittedModal modal;
  if (!modal.begin("Mark a defect", 36)) return;
  const float f = ImGui::GetFontSize();
  const storage::VisitPhoto* p = shown();
  ImGui::TextWrapped("Which defect is on this photo? Then tap the photo where it is.");
  const float choice_w = std::min(f * 17.0f, ImGui::GetContentRegionAvail().x);
  std::vector<const storage::VisitDefectChoice*> order;
  if (focus_defect_)
    if (const auto* d = defect(*focus_defect_)) order.push_back(d);
  for (const auto& d : visit_.defects)
    if (!focus_defect_ || d.id != *focus_defect_) order.push_back(&d);
  int column = 0;
  for (const auto* d : order) {
    if (column++ % 2 != 0) same_line_if_fits(choice_w);
    bool marked = false;
    if (p)
      for (const auto& l : p->links) marked = marked || l.defect_id == d->id;
    const std::string text = d->ref + "  " + words(d->defect_type) + ", " + d->element + (marked ? " (moves it)" : "");
    if (ImGui::Button(text.c_str(), ImVec2(choice_w, f * 2.2f))) {
      marking_defect_ = d->id;
      ImGui::CloseCurrentPopup();
    }
    probe("defect:" + d->ref);
  }
  modal.footer();
  if (ImGui::Button("Cancel", ImVec2(f * 6.0f, f * 2.2f))) ImGui::CloseCurrentPopup();
  probe("cancel choose");
  modal.end_footer();
  ImGui::EndPopup();
}

void PhotoViewer::draw_unlink_popup() {
  if (open_unlink_) {
    ImGui::OpenPopup("Remove link?");
    open_unlink_ = false;
  }
  static FittedModal modal;
  if (!modal.begin("Remove link?", 30)) return;
  const float f = ImGui::GetFontSize();
  const storage::VisitPhoto* p = shown();
  ImGui::TextWrapped("Remove the link between this photo and %s, and its marker? The photo and the defect stay.",
                     unlinking_.second.c_str());
  ImGui::TextWrapped("Undo brings the link back.");
  modal.footer();
  if (ImGui::Button("Remove link", ImVec2(f * 8.0f, f * 2.2f))) {
    if (p) {
      const std::string photo_id = p->id, defect_id = unlinking_.first;
      change("remove link " + unlinking_.second + " from " + short_name(*p),
             [&](storage::Connection& db) { storage::unlink_photo_from_defect(db, photo_id, defect_id); });
    }
    ImGui::CloseCurrentPopup();
  }
  probe("confirm unlink");
  same_line_if_fits(f * 6.0f);
  if (ImGui::Button("Keep", ImVec2(f * 6.0f, f * 2.2f))) ImGui::CloseCurrentPopup();
  probe("keep link");
  modal.end_footer();
  ImGui::EndPopup();
}

void PhotoViewer::draw_import_popup() {
  if (open_import_) {
    ImGui::OpenPopup("Add a photo");
    open_import_ = false;
    folder_files_.clear();
    folder_note_.clear();
  }
  static FittedModal modal;
  if (!modal.begin("Add a photo", 36)) return;
  const float f = ImGui::GetFontSize();
  ImGui::TextUnformatted("Photo file (JPEG or PNG):");
  ImGui::SetNextItemWidth(std::min(f * 30, ImGui::GetContentRegionAvail().x));
  ImGui::InputText("##path", import_path_, sizeof import_path_);
  probe("photo path");
  same_line_if_fits(button_width("List the folder"));
  ImGui::BeginDisabled(folder_job_.valid());
  if (ImGui::Button("List the folder")) {
    folder_files_.clear();
    folder_note_ = "Reading the folder...";
    folder_job_ = std::async(std::launch::async, [typed = std::string(import_path_)] { return list_photo_files(typed); });
  }
  probe("list folder");
  ImGui::EndDisabled();
  if (!folder_note_.empty()) ImGui::TextDisabled("%s", folder_note_.c_str());
  if (!folder_files_.empty()) {
    ImGui::BeginChild("##files", ImVec2(-FLT_MIN, std::min(f * 12, f * 2.6f * static_cast<float>(folder_files_.size()))));
    for (const std::string& file : folder_files_) {
      const std::string name = fs::path(file).filename().string();
      if (ImGui::Button(name.c_str(), ImVec2(-1, f * 2.2f)))
        std::snprintf(import_path_, sizeof import_path_, "%s", file.c_str());
      probe("file:" + name);
    }
    ImGui::EndChild();
  }
  ImGui::TextUnformatted("Caption:");
  ImGui::SetNextItemWidth(std::min(f * 30, ImGui::GetContentRegionAvail().x));
  ImGui::InputText("##caption", import_caption_, sizeof import_caption_);
  probe("photo caption");
  // FIELD.md §6.3: what a survey photo needs to be repeatable next visit.
  ImGui::PushTextWrapPos(0.0f);  // the notes wrap in the dialog at a large text size
  ImGui::TextDisabled("Say which way it looks (\"looking N\"; soffit: \"looking up, top = DS face\").");
  ImGui::TextDisabled("The original is copied into the project unchanged, EXIF kept.");
  ImGui::PopTextWrapPos();
  modal.footer();
  ImGui::BeginDisabled(import_path_[0] == '\0' || importing());
  if (ImGui::Button("Add", ImVec2(f * 6.0f, f * 2.2f))) {
    const std::string project_path = project_->path(), path = import_path_;
    import_options_ = storage::PhotoOptions{visit_.inspection_id, import_caption_};
    marking_defect_.clear();
    // Reading, hashing, decoding and copying a big photo takes seconds, so it
    // runs on a worker. The worker gets paths, never the project: the
    // connection stays with this thread, and poll() stores the row.
    import_job_ = std::async(std::launch::async, [project_path, path] {
      ImportResult r;
      r.file_name = fs::path(path).filename().string();
      try {
        r.prepared = storage::prepare_photo(project_path, path);
      } catch (const std::exception& e) {
        r.error = e.what();
      }
      return r;
    });
    import_path_[0] = '\0';
    import_caption_[0] = '\0';
    ImGui::CloseCurrentPopup();
  }
  probe("confirm add photo");
  ImGui::EndDisabled();
  same_line_if_fits(f * 6.0f);
  if (ImGui::Button("Cancel", ImVec2(f * 6.0f, f * 2.2f))) ImGui::CloseCurrentPopup();
  probe("cancel add photo");
  modal.end_footer();
  ImGui::EndPopup();
}

}  // namespace soffit::gui
