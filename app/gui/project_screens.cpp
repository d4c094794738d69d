#include "app/gui/project_screens.hpp"

#include <imgui.h>

#include <algorithm>
#include <chrono>
#include <filesystem>
#include <fstream>

#include "app/gui/flow_layout.hpp"
#include "app/gui/touch_scroll.hpp"
#include "app/model/local_time.hpp"
#include "app/model/section_store.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"
#include "exports/fit_report_json.hpp"
#include "storage/storage_error.hpp"
#include "storage/undo_journal.hpp"

namespace soffit::gui {

namespace {

constexpr size_t kRecentCount = 8;

std::string recent_file() { return app::app_data_dir() + "/recent-projects.txt"; }

bool big_button(const char* label, const std::string& probe_name) {
  const bool pressed = ImGui::Button(label, ImVec2(ImGui::GetFontSize() * 18, ImGui::GetFrameHeight() * 1.4f));
  probe(probe_name);
  return pressed;
}

// Where a change went, in the words of the standards: the project file, by name.
std::string saved_to(const std::string& project_path, const std::string& what) {
  return what + ". Saved to the project file " + std::filesystem::path(project_path).filename().string() + " at " +
         app::clock_hhmm() + ".";
}

// Lists leave room under them for their paging buttons, but never shrink to nothing.
float list_height(float reserve_below) {
  return std::max(ImGui::GetContentRegionAvail().y - reserve_below, ImGui::GetFrameHeight() * 5);
}

}  // namespace

ProjectScreens::ProjectScreens(std::string assets_dir, std::string author, std::unique_ptr<TextureFactory> textures)
    : photos(std::move(textures)), assets_dir_(std::move(assets_dir)), author_(std::move(author)) {
  std::ifstream in(recent_file());
  for (std::string line; std::getline(in, line) && recent_.size() < kRecentCount;)
    if (!line.empty()) recent_.push_back(line);
}

void ProjectScreens::remember(const std::string& path) {
  std::erase(recent_, path);
  recent_.insert(recent_.begin(), path);
  if (recent_.size() > kRecentCount) recent_.resize(kRecentCount);
  std::error_code ec;
  std::filesystem::create_directories(app::app_data_dir(), ec);
  std::ofstream out(recent_file());
  for (const std::string& p : recent_) out << p << "\n";
}

void ProjectScreens::open_path(const std::string& path, bool create) {
  photos.close();
  defects.close();
  rings_fill.close();
  visit_views_open_ = false;
  try {
    if (create) storage::Project::create(path, author_).close();
    session_.open(path, author_);
    structures_ = session_.structures();
    hits_.clear();
    detail_.reset();
    message_.clear();
    saved_note_.clear();
    highlight_ref_.clear();
    remember(path);
    screen = Screen::register_list;
  } catch (const std::exception& e) {
    message_ = e.what();  // the file is left as it was: storage never overwrites on a failed open
  }
}

void ProjectScreens::open_demo() {
  const std::string path = app::app_data_dir() + "/sallow-ford-demo.soffit";
  photos.close();
  defects.close();
  rings_fill.close();
  visit_views_open_ = false;
  try {
    session_.open_demo(path, assets_dir_ + "/sheets", author_);
    structures_ = session_.structures();
    message_.clear();
    saved_note_.clear();
    highlight_ref_.clear();
    remember(path);
    screen = Screen::register_list;
  } catch (const std::exception& e) {
    message_ = e.what();
  }
}

void ProjectScreens::open_first_sections() {
  if (structures_.empty()) return;
  show_structure(structures_.front().structure.fields.ref);
  if (!detail_) return;
  // The latest visit with sections: the one being recorded, not an issued one from years ago.
  for (auto v = detail_->inspections.rbegin(); v != detail_->inspections.rend(); ++v)
    if (!v->sections.empty()) {
      open_sections(*v);
      return;
    }
}

void ProjectScreens::open_first_defects() {
  if (structures_.empty()) return;
  show_structure(structures_.front().structure.fields.ref);
  if (detail_ && !detail_->inspections.empty()) {
    open_visit_views(detail_->inspections.back().date);
    screen = Screen::defects;
  }
}

void ProjectScreens::open_first_rings_fill() {
  open_first_defects();
  if (visit_views_open_) screen = Screen::rings_fill;
}

void ProjectScreens::open_visit_views(const std::string& date) {
  if (!detail_ || !session_.project()) return;
  defects.close();
  rings_fill.close();
  defects.open(*session_.project(), detail_->structure.fields.ref, date);
  // From a defect (or the visit) to its photos; back on "Close photos".
  defects.set_photos_request([this](const std::string& visit, const std::optional<std::string>& defect) {
    open_photos(visit, defect);
  });
  rings_fill.open(*session_.project(), detail_->structure.fields.ref, date);
  visit_views_open_ = true;
  visit_views_date_ = date;
}

void ProjectScreens::show_structure(const std::string& ref) {
  detail_ = session_.structure(ref);
  if (detail_) screen = Screen::structure;
}

void ProjectScreens::open_sections(const storage::InspectionRecord& visit) {
  reload_sections(visit);
  screen = Screen::section;
}

void ProjectScreens::reload_sections(const storage::InspectionRecord& visit) {
  std::vector<std::pair<std::string, SurveySheet>> sheets;
  section_ids_.clear();
  for (const storage::SectionRecord& s : visit.sections) {
    try {
      sheets.emplace_back(s.span_label + " " + s.label, session_.section_sheet(s.id));
      section_ids_.push_back(s.id);
    } catch (const std::exception& e) {
      message_ = e.what();
    }
  }
  sections.load_sheets(std::move(sheets));
  sections.set_heading("Visit " + visit.date + " (" + visit.status + ")");
  // Exclusions go to the project as they are made (an issued visit refuses them, and says so).
  sections.set_exclusion_store([this](size_t section, size_t reading, const std::string& reason) {
    session_.set_reading_exclusion(section_ids_.at(section), reading, reason);
  });
  if (visit.status == "issued")
    sections.set_locked("Issued visit: read-only. A correction is a new revision (Structure screen, New revision).");
  // Typed cells and new readings too, each as one undoable edit of the project.
  sections.set_rows_store([this](size_t section, const SurveySheet& sheet, const std::string& label) {
    if (storage::Project* project = session_.project()) app::save_section(*project, section_ids_.at(section), sheet, label);
  });
  sections_visit_id_ = visit.id;
  sections_structure_id_ = detail_ ? detail_->structure.id : std::string();
}

ProjectScreens::~ProjectScreens() { photos.close(); }

bool ProjectScreens::busy() const {
  // A finished job waits to be collected by its screen; only one still running counts.
  const auto running = [](const auto& job) {
    return job.valid() && job.wait_for(std::chrono::seconds(0)) != std::future_status::ready;
  };
  return sections.busy() || photos.busy() || running(compare_job_) || running(geometry_job_);
}

void ProjectScreens::open_photos(const std::string& inspection_id, const std::optional<std::string>& defect_id) {
  if (!session_.project()) return;
  photos.open(*session_.project(), inspection_id, defect_id);
  screen = Screen::photos;
}

void ProjectScreens::draw_tabs() {
  // One rule, the same on every screen: a structure's tabs are on once it is
  // open and has a visit (Change: two). A tab whose view is not loaded yet
  // opens the structure's latest visit there.
  const bool structure = detail_.has_value();
  const size_t visits = structure ? detail_->inspections.size() : 0;
  struct Tab {
    const char* label;
    Screen screen;
    bool enabled;
  };
  const Tab tabs[] = {{"Start", Screen::start, true},
                      {"Register", Screen::register_list, session_.is_open()},
                      {"Structure", Screen::structure, structure},
                      {"Sections", Screen::section, visits > 0},
                      {"Defects", Screen::defects, visits > 0},
                      {"Rings & fill", Screen::rings_fill, visits > 0},
                      {"Photos", Screen::photos, visits > 0},
                      {"Change", Screen::compare, visits > 1}};
  for (const Tab& t : tabs) {
    same_line_if_fits(t.label);  // after the app's name on the top row, wrapping like words
    ImGui::BeginDisabled(!t.enabled);
    const bool pressed = choice_button(t.label, screen == t.screen);
    probe(std::string("tab:") + t.label);
    ImGui::EndDisabled();
    if (!pressed) continue;
    // (Only a structure's tabs reach the branches that read detail_: they are off without one.)
    if (t.screen == Screen::section && (sections.empty() || sections_structure_id_ != detail_->structure.id)) {
      open_sections(detail_->inspections.back());
    } else if ((t.screen == Screen::defects || t.screen == Screen::rings_fill) && !visit_views_open_) {
      open_visit_views(detail_->inspections.back().date);
      screen = t.screen;
    } else if (t.screen == Screen::photos && !photos.is_open()) {
      open_photos(detail_->inspections.back().id);
    } else if (t.screen == Screen::compare && !changes_ && !comparing()) {
      start_comparison();
    } else {
      screen = t.screen;
    }
  }
}

void ProjectScreens::draw_current() {
  switch (screen) {
    case Screen::start: draw_start(); break;
    case Screen::register_list: draw_register(); break;
    case Screen::structure: draw_structure(); break;
    case Screen::section: sections.draw(); break;
    case Screen::defects: defects.draw(); break;
    case Screen::rings_fill: rings_fill.draw(); break;
    case Screen::photos:
      photos.draw();
      if (!photos.is_open()) {  // "Close photos": back where they were asked for, with counts read again
        if (visit_views_open_) defects.reload();
        screen = visit_views_open_ ? Screen::defects : Screen::structure;
      }
      break;
    case Screen::compare: draw_compare(); break;
  }
}

void ProjectScreens::draw_start() {
  const Palette& c = palette();
  ImGui::TextWrapped(
      "Soffit records the survey of a masonry arch bridge: profiles, rings, fill, defects and photographs, "
      "offline, in one project file.");
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(c.caution));
  ImGui::TextWrapped("%s", kSurveyDataCaution);
  ImGui::PopStyleColor();
  ImGui::Spacing();
  if (big_button("Open the demo project", "start:demo")) open_demo();
  ImGui::Spacing();
  ImGui::TextUnformatted("Project file (.soffit):");
  // Open and Create new beside the path while it keeps room for a path, else
  // under it: at a large text size nothing runs off the right edge.
  const ImGuiStyle& style = ImGui::GetStyle();
  const float buttons_w = ImGui::CalcTextSize("Open").x + ImGui::CalcTextSize("Create new").x +
                          4 * style.FramePadding.x + 2 * style.ItemSpacing.x;
  const float avail = ImGui::GetContentRegionAvail().x;
  const bool beside = avail - buttons_w >= ImGui::GetFontSize() * 12;
  ImGui::SetNextItemWidth(beside ? std::min(ImGui::GetFontSize() * 28, avail - buttons_w) : avail);
  ImGui::InputText("##path", path_, sizeof path_);
  probe("start:path");
  if (beside) ImGui::SameLine();
  const bool open = ImGui::Button("Open");
  probe("start:open");
  same_line_if_fits("Create new");
  const bool create = ImGui::Button("Create new");
  probe("start:create");
  if (open) open_path(path_, false);
  else if (create) open_path(path_, true);
  if (!message_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(c.residual_below));
    ImGui::TextWrapped("%s", message_.c_str());
    ImGui::PopStyleColor();
  }
  if (!recent_.empty()) {
    ImGui::Spacing();
    ImGui::TextUnformatted("Recent projects");
    // Each a full-width button, path from the left: it looks tappable, and a long path is cut at its end.
    ImGui::PushStyleVar(ImGuiStyleVar_ButtonTextAlign, ImVec2(0.0f, 0.5f));
    std::optional<std::string> chosen;
    for (size_t i = 0; i < recent_.size(); ++i) {
      ImGui::PushID(static_cast<int>(i));
      if (ImGui::Button(recent_[i].c_str(), ImVec2(-FLT_MIN, 0))) chosen = recent_[i];
      probe("start:recent:" + std::to_string(i));
      ImGui::PopID();
    }
    ImGui::PopStyleVar();
    if (chosen) open_path(*chosen, false);  // after the loop: opening may rewrite the list
  }
}

void ProjectScreens::draw_edit_bar(bool on_structure) {
  if (on_structure) {
    const bool edit = ImGui::Button("Edit details");
    probe("edit-structure");
    if (edit && detail_) structure_form_.open_edit(detail_->structure);
  } else {
    const bool add = ImGui::Button("Add structure");
    probe("add-structure");
    if (add) structure_form_.open_new();
  }
  // The project's own journal: what is undone is named on the button, and it
  // may be an edit made on another screen.
  const std::string undo_label = session_.undo_label(), redo_label = session_.redo_label();
  ImGui::SameLine();
  ImGui::BeginDisabled(undo_label.empty());
  // "###": the same button whatever step it names.
  const bool undo = ImGui::Button(((undo_label.empty() ? "Undo" : "Undo: " + undo_label) + "###undo").c_str());
  probe("undo");
  ImGui::EndDisabled();
  ImGui::SameLine();
  ImGui::BeginDisabled(redo_label.empty());
  const bool redo = ImGui::Button(((redo_label.empty() ? "Redo" : "Redo: " + redo_label) + "###redo").c_str());
  probe("redo");
  ImGui::EndDisabled();
  // Ctrl+Z / Ctrl+Y (or Ctrl+Shift+Z) when no text is being typed and no dialog is up:
  // a text field has its own undo, and a dialog's edit is not finished yet.
  const ImGuiIO& io = ImGui::GetIO();
  const bool keys_free = io.KeyCtrl && !io.WantTextInput && !structure_form_.is_open() &&
                         !ImGui::IsPopupOpen("", ImGuiPopupFlags_AnyPopupId | ImGuiPopupFlags_AnyPopupLevel);
  const bool key_z = keys_free && ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Z), false);
  const bool key_y = keys_free && ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Y), false);
  if ((undo || (key_z && !io.KeyShift)) && !undo_label.empty()) undo_or_redo(true);
  else if ((redo || key_y || (key_z && io.KeyShift)) && !redo_label.empty()) undo_or_redo(false);
  if (!saved_note_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().reading));
    ImGui::TextWrapped("%s", saved_note_.c_str());
    ImGui::PopStyleColor();
    probe("saved-note");
  }
}

void ProjectScreens::undo_or_redo(bool undo) {
  const std::string step = undo ? session_.undo_label() : session_.redo_label();
  try {
    if (!(undo ? session_.undo() : session_.redo())) return;
    saved_note_ = saved_to(session_.path(), (undo ? "Undone: " : "Redone: ") + step);
    message_.clear();
  } catch (const std::exception& e) {
    message_ = e.what();  // the journal refused (an issued visit, say): the file is as it was
  }
  reload_after_change(true);
}

void ProjectScreens::reload_after_change(bool sections_too) {
  structures_ = session_.structures();
  hits_ = search_[0] ? session_.search(search_) : std::vector<storage::SearchHit>{};
  // Structures are found again by their key: the step may have changed a reference.
  const auto by_id = [&](const std::string& id) -> std::optional<storage::StructureDetail> {
    for (const auto& s : structures_)
      if (s.structure.id == id) return session_.structure(s.structure.fields.ref);
    return std::nullopt;
  };
  if (detail_) detail_ = by_id(detail_->structure.id);
  if (detail_ && visit_views_open_) {
    open_visit_views(visit_views_date_);
  } else if (!detail_) {
    photos.close();
    if (screen == Screen::photos) screen = Screen::register_list;
    defects.close();
    rings_fill.close();
    visit_views_open_ = false;
    if (screen == Screen::structure) screen = Screen::register_list;
  }
  // A journal step may be a reading's (its label is whatever the person named
  // it), so the sections are read again; every change in them is already in
  // the file, so nothing but the view's place and fit is lost.
  if (!sections_too || sections_visit_id_.empty()) return;
  const std::optional<storage::StructureDetail> owner = by_id(sections_structure_id_);
  if (owner)
    for (const auto& v : owner->inspections)
      if (v.id == sections_visit_id_) return reload_sections(v);
  sections.load_sheets({});  // the visit is gone with the step: show nothing rather than rows that are not there
  sections_visit_id_.clear();
}

void ProjectScreens::draw_structure_form() {
  const std::string id = structure_form_.structure_id();
  const bool saved = structure_form_.draw([&](const storage::StructureFields& f) {
    if (id.empty())
      session_.add_structure(f);
    else
      session_.update_structure(id, f);
  });
  if (!saved) return;
  const std::string& ref = structure_form_.saved().ref;
  saved_note_ = saved_to(session_.path(), (id.empty() ? "Added structure " : "Saved the details of ") + ref);
  message_.clear();
  highlight_ref_ = ref;
  scroll_to_highlight_ = true;
  reload_after_change(false);  // a structure's details hold no readings
}

void ProjectScreens::draw_register() {
  ImGui::Text("Register: %s", session_.path().c_str());
  draw_edit_bar(false);
  if (!message_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().residual_below));
    ImGui::TextWrapped("%s", message_.c_str());
    ImGui::PopStyleColor();
  }
  ImGui::SetNextItemWidth(ImGui::GetFontSize() * 20);
  const bool enter = ImGui::InputText("##search", search_, sizeof search_, ImGuiInputTextFlags_EnterReturnsTrue);
  ImGui::SameLine();
  if (ImGui::Button("Search") || enter) hits_ = search_[0] ? session_.search(search_) : std::vector<storage::SearchHit>{};
  ImGui::SameLine();
  if (ImGui::Button("Clear")) {
    search_[0] = '\0';
    hits_.clear();
  }
  if (!hits_.empty()) {
    ImGui::Text("%zu found", hits_.size());
    for (size_t i = 0; i < hits_.size(); ++i) {
      const auto& h = hits_[i];
      ImGui::PushID(static_cast<int>(i));
      const std::string line = std::string(storage::search_kind_name(h.kind)) + "  " + h.structure_ref + "  " +
                               h.title + "  " + h.snippet;
      if (ImGui::Selectable(line.c_str(), false, 0, ImVec2(0, ImGui::GetFrameHeight())))
        show_structure(h.structure_ref);
      ImGui::PopID();
    }
    ImGui::Separator();
  }
  // Filters and order: big checkboxes and buttons, nothing behind a hover.
  ImGui::Checkbox("Due for inspection: last visit at least", &filter_.due_only);
  ImGui::SameLine();
  ImGui::SetNextItemWidth(ImGui::GetFontSize() * 7);
  ImGui::InputInt("years ago", &filter_.interval_years);
  filter_.interval_years = std::clamp(filter_.interval_years, 1, 20);
  ImGui::Checkbox("Severe defects (4 or 5 of 5) at the latest visit", &filter_.severe_only);
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Order:");
  const std::pair<const char*, app::RegisterOrder> orders[] = {{"reference", app::RegisterOrder::reference},
                                                                {"name", app::RegisterOrder::name},
                                                                {"oldest visit first", app::RegisterOrder::latest_visit}};
  for (const auto& [label, order] : orders) {
    ImGui::SameLine();
    if (ImGui::RadioButton(label, filter_.order == order)) filter_.order = order;
  }
  const std::vector<size_t> shown = app::filter_register(structures_, filter_, app::today_iso());
  ImGui::Text("%zu of %zu structures", shown.size(), structures_.size());
  bool highlight_shown = highlight_ref_.empty();
  // The header row stays put while the rows scroll (by finger, wheel or the page buttons).
  const ImGuiTableFlags flags = ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg | ImGuiTableFlags_ScrollY;
  if (ImGui::BeginTable("structures", 7, flags, ImVec2(0, list_height(ImGui::GetFrameHeightWithSpacing())))) {
    ImGui::TableSetupScrollFreeze(0, 1);
    ImGui::TableSetupColumn("Reference");
    ImGui::TableSetupColumn("Name");
    ImGui::TableSetupColumn("Spans");
    ImGui::TableSetupColumn("Visits");
    ImGui::TableSetupColumn("Sections");
    ImGui::TableSetupColumn("Last visit");
    ImGui::TableSetupColumn("Worst severity");
    ImGui::TableHeadersRow();
    std::string open_ref;
    for (size_t i : shown) {
      const auto& s = structures_[i];
      const bool marked = s.structure.fields.ref == highlight_ref_;
      ImGui::PushID(static_cast<int>(i));
      ImGui::TableNextRow();
      ImGui::TableNextColumn();
      if (ImGui::Selectable(s.structure.fields.ref.c_str(), marked, ImGuiSelectableFlags_SpanAllColumns,
                            ImVec2(0, ImGui::GetFrameHeight())))
        open_ref = s.structure.fields.ref;
      probe("structure:" + s.structure.fields.ref);
      if (marked) {
        highlight_shown = true;
        if (scroll_to_highlight_) ImGui::SetScrollHereY(0.5f);
        scroll_to_highlight_ = false;
      }
      ImGui::TableNextColumn();
      ImGui::TextUnformatted(s.structure.fields.name.c_str());
      ImGui::TableNextColumn();
      ImGui::Text("%d", s.span_count);
      ImGui::TableNextColumn();
      ImGui::Text("%d", s.inspection_count);
      ImGui::TableNextColumn();
      ImGui::Text("%d", s.section_count);
      ImGui::TableNextColumn();
      ImGui::TextUnformatted(s.latest_visit.empty() ? "never" : s.latest_visit.c_str());
      ImGui::TableNextColumn();
      if (s.worst_severity) ImGui::Text("%d", *s.worst_severity); else ImGui::TextUnformatted("-");
      ImGui::PopID();
    }
    drag_to_scroll();  // inside the table's own scrolling window
    ImGui::EndTable();
    paging_buttons("register");
    if (!open_ref.empty()) show_structure(open_ref);  // after the table: it replaces the rows drawn from
  }
  if (!highlight_shown) {
    ImGui::SameLine();
    ImGui::AlignTextToFramePadding();
    ImGui::Text("%s is hidden by the filters.", highlight_ref_.c_str());
  }
  draw_structure_form();
}

void ProjectScreens::draw_structure() {
  if (!detail_) return;
  ImGui::Text("%s  %s", detail_->structure.fields.ref.c_str(), detail_->structure.fields.name.c_str());
  draw_edit_bar(true);
  if (!detail_) return;  // an undo just took the structure away
  const auto& f = detail_->structure.fields;  // read after the bar: an undo there re-reads the structure
  if (!f.carries.empty() || !f.crosses.empty())
    ImGui::TextWrapped("Carries %s over %s", f.carries.empty() ? "-" : f.carries.c_str(),
                       f.crosses.empty() ? "-" : f.crosses.c_str());
  if (f.latitude_deg && f.longitude_deg)
    ImGui::Text("Location %.5f, %.5f%s", *f.latitude_deg, *f.longitude_deg,
                f.location_fictitious ? "  (fictitious)" : "");
  if (!f.notes.empty()) ImGui::TextWrapped("%s", f.notes.c_str());
  std::string spans = "Spans:";
  for (const auto& s : detail_->spans) spans += " " + (s.label.empty() ? std::to_string(s.index) : s.label);
  // The register's count is the owner's; the spans are those surveyed. Say so when they differ.
  if (f.span_count && static_cast<size_t>(*f.span_count) != detail_->spans.size())
    spans += "  (the register says " + std::to_string(*f.span_count) + ")";
  ImGui::TextUnformatted(spans.c_str());
  draw_latest_geometry();
  ImGui::Separator();
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Visits");
  ImGui::SameLine();
  const bool new_visit = ImGui::Button("New visit...");
  probe("new-visit");
  if (new_visit) new_visit_.request(detail_->structure.fields.ref, author_);
  if (detail_->inspections.size() >= 2) {
    same_line_if_fits("Change between the last two visits");
    const bool compare = ImGui::Button("Change between the last two visits");
    probe("compare");
    if (compare) start_comparison();
  }
  const float message_room = message_.empty() ? 0.0f : ImGui::GetTextLineHeightWithSpacing() * 3;
  ImGui::BeginChild("visits", ImVec2(0, list_height(ImGui::GetFrameHeightWithSpacing() + message_room)));
  const storage::InspectionRecord* to_open = nullptr;
  for (size_t i = 0; i < detail_->inspections.size(); ++i) {
    const auto& v = detail_->inspections[i];
    ImGui::PushID(static_cast<int>(i));
    ImGui::AlignTextToFramePadding();
    ImGui::Text("%s  %s  %s  revision %d  (%s)", v.date.c_str(), v.kind.c_str(), v.inspector.c_str(), v.revision,
                v.status.c_str());
    // The visit's actions on their own line, wrapping at large text rather than running off the screen.
    ImGui::BeginDisabled(v.sections.empty());
    const bool open = ImGui::Button("Sections");
    probe("visit:" + v.date);
    ImGui::EndDisabled();
    same_line_if_fits("Defects");
    if (ImGui::Button("Defects")) {
      open_visit_views(v.date);
      screen = Screen::defects;
    }
    same_line_if_fits("Rings & fill");
    if (ImGui::Button("Rings & fill")) {
      open_visit_views(v.date);
      screen = Screen::rings_fill;
    }
    same_line_if_fits("Photos");
    const bool photos_pressed = ImGui::Button("Photos");
    probe("photos:" + v.date);
    if (photos_pressed) open_photos(v.id);
    if (v.status != "issued") {
      // A section surveyed on site starts here, empty, and is typed into in the section view.
      same_line_if_fits("New section...");
      const bool new_pressed = ImGui::Button("New section...");
      probe("new-section:" + v.date);
      if (new_pressed) new_section_.request(detail_->structure.fields.ref, v.date, detail_->spans);
    }
    draw_sign_off(v);
    same_line_if_fits("Export...");
    const bool export_pressed = ImGui::Button("Export...");
    probe("export:" + v.date);
    if (export_pressed && session_.project())
      export_dialog.request(*session_.project(), detail_->structure.fields.ref, v.date);
    for (const auto& s : v.sections)
      ImGui::BulletText("%s %s: %s, %d readings (%d excluded)", s.span_label.c_str(), s.label.c_str(),
                        s.method.c_str(), s.reading_count, s.excluded_count);
    ImGui::PopID();
    if (open) to_open = &v;
  }
  drag_to_scroll();
  ImGui::EndChild();
  paging_buttons("visits");
  if (to_open) open_sections(*to_open);
  export_dialog.draw();
  draw_sign_off_dialogs();
  if (const auto made = new_section_.draw(session_.project())) show_new_section(*made);
  if (const auto date = new_visit_.draw(session_.project())) {
    show_structure(detail_->structure.fields.ref);
    saved_note_ = saved_to(session_.path(), "Started the visit of " + *date);
  }
  if (refresh_structure_) {
    refresh_structure_ = false;
    show_structure(detail_->structure.fields.ref);
  }
  if (!message_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().residual_below));
    ImGui::TextWrapped("%s", message_.c_str());
    ImGui::PopStyleColor();
  }
  draw_structure_form();
}

void ProjectScreens::open_new_section_form() {
  if (!detail_) return;
  screen = Screen::structure;
  for (auto v = detail_->inspections.rbegin(); v != detail_->inspections.rend(); ++v)
    if (v->status != "issued") {
      new_section_.request(detail_->structure.fields.ref, v->date, detail_->spans);
      return;
    }
}

void ProjectScreens::show_new_section(const std::string& section_id) {
  detail_ = session_.structure(detail_->structure.fields.ref);
  if (!detail_) return;
  for (const storage::InspectionRecord& v : detail_->inspections)
    for (const storage::SectionRecord& s : v.sections)
      if (s.id == section_id) {
        open_sections(v);
        for (size_t i = 0; i < section_ids_.size(); ++i)
          if (section_ids_[i] == section_id) sections.select(i);
        saved_note_ = saved_to(session_.path(), "Added section " + s.span_label + " " + s.label);
        return;
      }
}

void ProjectScreens::draw_latest_geometry() {
  if (!detail_ || detail_->inspections.empty() || !session_.project()) return;
  const storage::InspectionRecord& latest = detail_->inspections.back();
  // Fitted again whenever the project changes (an edit, an undo) or another structure is shown.
  const std::string key = latest.id + "|" + storage::journal_state(session_.project()->db());
  if (geometry_job_.valid() && geometry_job_.wait_for(std::chrono::seconds(0)) == std::future_status::ready)
    geometry_ = geometry_job_.get();
  if (key != geometry_key_ && !geometry_job_.valid()) {
    std::vector<app::LabelledSheet> sheets;
    try {
      // Sheets are read here, on the UI thread; the fits run on a worker with the copies.
      for (const storage::SectionRecord& s : latest.sections)
        sheets.push_back({s.span_label, s.label, session_.section_sheet(s.id)});
      geometry_job_ = std::async(std::launch::async, [sheets = std::move(sheets)] {
        return app::summarise_geometry(sheets);
      });
      geometry_key_ = key;
      geometry_visit_ = latest.date;
    } catch (const std::exception& e) {
      message_ = e.what();
      geometry_key_ = key;  // not again until something changes
    }
  }
  if (latest.sections.empty()) return;
  ImGui::Text("Latest geometry (visit of %s)%s", geometry_visit_.c_str(), geometry_job_.valid() ? "  fitting..." : "");
  if (!geometry_) return;
  if (ImGui::BeginTable("latest geometry", 6, ImGuiTableFlags_Borders | ImGuiTableFlags_SizingFixedFit)) {
    for (const char* h : {"Span", "Section", "Shape", "Span m (95%)", "Rise mm (95%)", "RMS mm"})
      ImGui::TableSetupColumn(h);
    ImGui::TableHeadersRow();
    for (const app::SectionGeometry& g : *geometry_) {
      ImGui::TableNextRow();
      ImGui::TableNextColumn();
      ImGui::TextUnformatted(g.span.c_str());
      ImGui::TableNextColumn();
      ImGui::TextUnformatted(g.section.c_str());
      ImGui::TableNextColumn();
      if (!g.span_m || !g.rise_m) {
        ImGui::TextUnformatted("no fit");
        ImGui::TableNextColumn();
        ImGui::TextWrapped("%s", g.error.substr(0, 80).c_str());
        continue;
      }
      ImGui::TextUnformatted(g.shape.c_str());
      ImGui::TableNextColumn();
      ImGui::Text("%.4f (%.4f to %.4f)", g.span_m->value, g.span_m->lo, g.span_m->hi);
      ImGui::TableNextColumn();
      ImGui::Text("%.1f (%.1f to %.1f)", g.rise_m->value * 1000, g.rise_m->lo * 1000, g.rise_m->hi * 1000);
      ImGui::TableNextColumn();
      ImGui::Text("%.1f", g.rms_mm);
    }
    ImGui::EndTable();
  }
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().caution));
  ImGui::TextWrapped("Survey data, not an assessment: a qualified engineer decides what it means.");
  ImGui::PopStyleColor();
}

void ProjectScreens::start_comparison() {
  if (!detail_ || detail_->inspections.size() < 2 || comparing()) return;
  const auto& earlier = detail_->inspections[detail_->inspections.size() - 2];
  const auto& later = detail_->inspections.back();
  // Sheets are read here, on the UI thread; the fits run on a worker with the copies.
  std::vector<app::SectionPair> pairs;
  try {
    for (const auto& a : earlier.sections)
      for (const auto& b : later.sections)
        if (a.span_label == b.span_label && a.label == b.label)
          pairs.push_back({a.span_label, a.label, session_.section_sheet(a.id), session_.section_sheet(b.id)});
  } catch (const std::exception& e) {
    message_ = e.what();
    return;
  }
  compare_title_ = "Change from " + earlier.date + " to " + later.date;
  changes_.reset();
  compare_job_ = std::async(std::launch::async, [pairs = std::move(pairs)] { return app::compare_sections(pairs); });
  screen = Screen::compare;
}

void ProjectScreens::draw_compare() {
  if (compare_job_.valid() && compare_job_.wait_for(std::chrono::seconds(0)) == std::future_status::ready)
    changes_ = compare_job_.get();
  ImGui::TextUnformatted(compare_title_.c_str());
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().caution));
  ImGui::TextWrapped("Measured differences of the fitted profiles, each with its standard uncertainty (both "
                     "fits and 1 mm of datum per visit). Survey data, not an assessment: what a change means is "
                     "for a qualified engineer under the local codes.");
  ImGui::PopStyleColor();
  if (!changes_) {
    ImGui::TextUnformatted("Fitting both visits...");
    return;
  }
  if (!ImGui::BeginTable("changes", 5, ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg)) return;
  ImGui::TableSetupColumn("Section");
  ImGui::TableSetupColumn("Rise before mm");
  ImGui::TableSetupColumn("Rise after mm");
  ImGui::TableSetupColumn("Change mm (u)");
  ImGui::TableSetupColumn("Reading of the change");
  ImGui::TableHeadersRow();
  for (const app::SectionChange& c : *changes_) {
    ImGui::TableNextRow();
    ImGui::TableNextColumn();
    ImGui::Text("%s %s", c.span.c_str(), c.section.c_str());
    ImGui::TableNextColumn();
    if (c.rise_earlier) ImGui::Text("%.1f (sd %.1f)", c.rise_earlier->value * 1000, c.rise_earlier->sd * 1000);
    ImGui::TableNextColumn();
    if (c.rise_later) ImGui::Text("%.1f (sd %.1f)", c.rise_later->value * 1000, c.rise_later->sd * 1000);
    ImGui::TableNextColumn();
    if (c.rise_earlier && c.rise_later)
      ImGui::Text("%+.1f (%.1f)", c.rise_change_m * 1000, c.rise_change_u_m * 1000);
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(c.verdict.c_str());
  }
  ImGui::EndTable();
}

void ProjectScreens::sign_off_step(const std::function<void()>& step) {
  try {
    step();
    message_.clear();
  } catch (const std::exception& e) {
    message_ = e.what();  // an issued visit refuses, a locked file refuses: said on the screen
  }
  refresh_structure_ = true;  // not now: the caller may be iterating over the visits
}

void ProjectScreens::draw_sign_off(const storage::InspectionRecord& v) {
  same_line_if_fits(v.status == "draft" ? "Mark checked" : v.status == "checked" ? "Issue..." : "New revision...");
  if (v.status == "draft") {
    const bool pressed = ImGui::Button("Mark checked");
    probe("checked:" + v.date);
    if (pressed) sign_off_step([&] { session_.set_visit_status(v.id, "checked"); });
  } else if (v.status == "checked") {
    const bool pressed = ImGui::Button("Issue...");
    probe("issue:" + v.date);
    if (pressed) {
      signing_visit_ = v.id;
      open_issue_ = true;
    }
  } else if (v.status == "issued") {
    const bool pressed = ImGui::Button("New revision...");
    probe("revise:" + v.date);
    if (pressed) {
      signing_visit_ = v.id;
      revision_reason_[0] = '\0';
      open_revise_ = true;
    }
  }
}

void ProjectScreens::draw_sign_off_dialogs() {
  if (open_issue_) ImGui::OpenPopup("Issue visit");
  if (open_revise_) ImGui::OpenPopup("New revision");
  open_issue_ = open_revise_ = false;
  if (ImGui::BeginPopupModal("Issue visit", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) {
    ImGui::TextWrapped("Once issued, this visit is read-only. A correction becomes a new revision, "
                       "with who, when and why.");
    const bool issue = ImGui::Button("Issue");
    probe("issue:confirm");
    if (issue) {
      sign_off_step([&] { session_.set_visit_status(signing_visit_, "issued"); });
      ImGui::CloseCurrentPopup();
    }
    ImGui::SameLine();
    if (ImGui::Button("Cancel")) ImGui::CloseCurrentPopup();
    ImGui::EndPopup();
  }
  if (ImGui::BeginPopupModal("New revision", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) {
    ImGui::TextWrapped("A draft copy of the issued visit is made for the correction; the issued one stays as it is.");
    ImGui::SetNextItemWidth(ImGui::GetFontSize() * 24);
    ImGui::InputText("why", revision_reason_, sizeof revision_reason_);
    ImGui::BeginDisabled(revision_reason_[0] == '\0');
    if (ImGui::Button("Make revision")) {
      sign_off_step([&] { session_.revise_visit(signing_visit_, revision_reason_); });
      ImGui::CloseCurrentPopup();
    }
    ImGui::EndDisabled();
    ImGui::SameLine();
    if (ImGui::Button("Cancel")) ImGui::CloseCurrentPopup();
    ImGui::EndPopup();
  }
}

}  // namespace soffit::gui
