#include "app/gui/ring_fill_dialogs.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstring>

#include "app/gui/flow_layout.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"
#include "app/model/ring_fill_records.hpp"

namespace soffit::gui {

namespace {

// One popup each, whatever its title says ("###": the id after it).
constexpr const char* kRingPopup = "###ring-count-form";
constexpr const char* kFillPopup = "###fill-depth-form";
constexpr const char* kPositions[] = {"W springing", "crown", "E springing"};
constexpr const char* kBasisChoices[] = {"face count only", "core", "trial pit"};
constexpr std::pair<const char*, const char*> kMethods[] = {
    {"trial_pit", "Trial pit"}, {"core", "Core"}, {"gpr", "GPR"}, {"estimate", "Estimate"}};

void copy_to(char* buf, size_t size, const std::string& text) {
  std::snprintf(buf, size, "%s", text.c_str());
}

std::string number(double v, int decimals) {
  char buf[48];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, v);
  return buf;
}

// The keypad starts from the value as typed, without trailing zeros to delete first.
std::string keypad_text(const std::optional<double>& v, int decimals) {
  if (!v) return "";
  std::string t = number(*v, decimals);
  if (t.find('.') != std::string::npos) {
    while (!t.empty() && t.back() == '0') t.pop_back();
    if (!t.empty() && t.back() == '.') t.pop_back();
  }
  return t;
}

bool choice(const char* label, bool chosen, const std::string& probe_name) {
  if (chosen) {
    // Chosen reads as chosen in glare: the pressed fill and a border, not a hover tint.
    ImGui::PushStyleColor(ImGuiCol_Button, ImGui::GetStyleColorVec4(ImGuiCol_ButtonActive));
    ImGui::PushStyleVar(ImGuiStyleVar_FrameBorderSize, 2.0f);
  }
  const bool pressed = ImGui::Button(label);
  if (chosen) {
    ImGui::PopStyleVar();
    ImGui::PopStyleColor();
  }
  probe(probe_name);
  return pressed;
}

// A row of choices that wraps at large text: label, then the buttons.
template <class Each>
void choice_row(const char* label, Each each) {
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted(label);
  each();
}

void field_label(const char* label) {
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted(label);
  ImGui::SameLine(ImGui::GetFontSize() * 11.0f);
}

// Number fields are all this wide, so that their values line up.
float number_width() { return ImGui::GetFontSize() * 8.0f; }

void hint(const char* text) {
  ImGui::SameLine();
  ImGui::AlignTextToFramePadding();
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().faint_ink));
  ImGui::PushTextWrapPos(0.0f);  // wraps at the form's edge at large text, never runs off it
  ImGui::TextUnformatted(text);
  ImGui::PopTextWrapPos();
  ImGui::PopStyleColor();
}

// A form as large as the screen allows, its body scrolling and Save / Cancel
// always in view under it (never pushed off the bottom at a large text size).
bool begin_form(const char* title, const char* popup) {
  const ImVec2 display = ImGui::GetIO().DisplaySize;
  const float f = ImGui::GetFontSize();
  ImGui::SetNextWindowSize(ImVec2(std::min(display.x * 0.96f, f * 46.0f), display.y * 0.92f), ImGuiCond_Always);
  ImGui::SetNextWindowPos(ImVec2(display.x * 0.5f, display.y * 0.5f), ImGuiCond_Always, ImVec2(0.5f, 0.5f));
  return ImGui::BeginPopupModal((std::string(title) + popup).c_str(), nullptr, ImGuiWindowFlags_NoResize | ImGuiWindowFlags_NoMove |
                                                    ImGuiWindowFlags_NoSavedSettings);
}

float footer_height(const std::string& error) {
  const ImGuiStyle& style = ImGui::GetStyle();
  float h = ImGui::GetFrameHeight() + style.ItemSpacing.y * 2 + style.WindowPadding.y;
  if (!error.empty())
    h += ImGui::CalcTextSize(error.c_str(), nullptr, false, ImGui::GetContentRegionAvail().x).y + style.ItemSpacing.y;
  return h;
}

// The refusal in the caution colour, then Save and Cancel; returns 1 for Save, -1 for Cancel.
int footer(const std::string& error, const char* save_label, const std::string& prefix) {
  ImGui::Separator();
  if (!error.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().caution));
    ImGui::TextWrapped("%s", error.c_str());
    ImGui::PopStyleColor();
    probe(prefix + ":error");
  }
  const float f = ImGui::GetFontSize();
  const bool save = ImGui::Button(save_label, ImVec2(f * 9.0f, 0));
  probe(prefix + ":save");
  ImGui::SameLine();
  const bool cancel = ImGui::Button("Cancel", ImVec2(f * 6.0f, 0));
  probe(prefix + ":cancel");
  return save ? 1 : cancel ? -1 : 0;
}

// Why the form was not saved; the form stays open with everything typed.
std::nullopt_t not_saved(std::string& error, const char* why) {
  error = why;
  return std::nullopt;
}

// Storage messages start with the file's path: the field is what the inspector needs.
std::string without_path(const std::string& message) {
  const size_t at = message.find(".soffit: ");
  return at == std::string::npos ? message : message.substr(at + 9);
}

// Opens the form when asked and draws it while open: `body` scrolls above the
// footer; Save stores what `gather` returns (nothing when a field is refused)
// and closes when `save` kept it, Cancel closes. Returns whether it is shown.
template <class Fields, class Body, class Gather>
bool run_form(bool& open, const char* title, const char* popup, const char* save_label, const std::string& prefix,
              std::string& error, Body body, Gather gather, const SaveFields<Fields>& save) {
  if (open) {
    ImGui::OpenPopup(popup);
    open = false;
  }
  if (!begin_form(title, popup)) return false;
  ImGui::BeginChild(("##" + prefix + "-body").c_str(), ImVec2(0, -footer_height(error)));
  body();
  ImGui::EndChild();
  const int pressed = footer(error, save_label, prefix);
  if (pressed == 1) {
    if (const std::optional<Fields> f = gather()) {
      error = without_path(save(*f));
      if (error.empty()) ImGui::CloseCurrentPopup();
    }
  } else if (pressed == -1) {
    ImGui::CloseCurrentPopup();
  }
  ImGui::EndPopup();
  return true;
}

}  // namespace

// ---------------------------------------------------------------- ring count

void RingCountDialog::open_new(const std::vector<SpanChoice>& spans, const std::string& inspection_id) {
  spans_ = spans;
  base_ = storage::RingCountFields();
  base_.inspection_id = inspection_id;
  editing_ = false;
  // Nothing where a wrong default could be saved unnoticed: a lone span only.
  span_id_ = spans.size() == 1 ? spans.front().id : std::string();
  face_.clear();
  position_.clear();
  confidence_.clear();
  rings_ = 0;
  ring_depth_mm_ = span() ? app::default_ring_depth_mm(span()->details) : std::nullopt;
  taped_mm_.reset();
  face_text_[0] = position_text_[0] = basis_[0] = notes_[0] = 0;
  error_.clear();
  open_ = true;
}

void RingCountDialog::open_edit(const std::vector<SpanChoice>& spans, const storage::RingCountFields& f) {
  spans_ = spans;
  base_ = f;
  editing_ = true;
  span_id_ = f.span_id;
  face_ = f.face;
  position_ = f.position;
  if (face_ != "US" && face_ != "DS") copy_to(face_text_, sizeof face_text_, face_);
  else face_text_[0] = 0;
  const bool named = std::any_of(std::begin(kPositions), std::end(kPositions), [&](const char* p) { return position_ == p; });
  if (!named) copy_to(position_text_, sizeof position_text_, position_);
  else position_text_[0] = 0;
  confidence_ = f.confidence;
  rings_ = f.rings;
  ring_depth_mm_ = span() ? app::ring_depth_mm(f, span()->details) : f.unit_depth_mm;
  taped_mm_ = f.thickness_mm;
  copy_to(basis_, sizeof basis_, f.basis);
  copy_to(notes_, sizeof notes_, f.notes);
  error_.clear();
  open_ = true;
}

const SpanChoice* RingCountDialog::span() const {
  for (const SpanChoice& s : spans_)
    if (s.id == span_id_) return &s;
  return nullptr;
}

void RingCountDialog::keep_rings(double typed) {
  if (typed != std::floor(typed) || typed < 1 || typed > 20) {
    char buf[160];
    std::snprintf(buf, sizeof buf, "Number of rings: %g was not kept; enter a whole number from 1 to 20.", typed);
    error_ = buf;
  } else {
    rings_ = static_cast<int>(typed);
  }
}

void RingCountDialog::draw(const SaveFields<storage::RingCountFields>& save) {
  shown_ = run_form(open_, editing_ ? "Edit ring count" : "Add ring count", kRingPopup,
                    editing_ ? "Save changes" : "Save count", "rc", error_, [&] { draw_body(); },
                    [&] { return gathered(); }, save);
}

void RingCountDialog::draw_body() {
  const float f = ImGui::GetFontSize();
  choice_row("Span:", [&] {
    for (const SpanChoice& s : spans_) {
      same_line_if_fits(s.label.c_str());
      if (choice(s.label.c_str(), s.id == span_id_, "rc:span:" + s.label)) {
        // A new count takes the brick + joint of the span it is on.
        if (!editing_ && s.id != span_id_) ring_depth_mm_ = app::default_ring_depth_mm(s.details);
        span_id_ = s.id;
      }
    }
  });
  choice_row("Face:", [&] {
    for (const char* face : {"US", "DS"}) {
      ImGui::SameLine();
      if (choice(face, face_ == face, std::string("rc:face:") + face)) {
        face_ = face;
        face_text_[0] = 0;
      }
    }
    ImGui::SameLine();
    ImGui::SetNextItemWidth(f * 10.0f);
    if (ImGui::InputTextWithHint("##face", "other face", face_text_, sizeof face_text_)) face_ = face_text_;
    probe("rc:face-text");
  });
  choice_row("Position:", [&] {
    for (const char* p : kPositions) {
      same_line_if_fits(p);
      if (choice(p, position_ == p, std::string("rc:pos:") + p)) {
        position_ = p;
        position_text_[0] = 0;
      }
    }
    same_line_if_fits("s 3.10 along the intrados");
    ImGui::SetNextItemWidth(f * 12.0f);
    if (ImGui::InputTextWithHint("##position", "other, e.g. s 3.10 m", position_text_, sizeof position_text_))
      position_ = position_text_;
    probe("rc:pos-text");
  });

  field_label("Rings counted:");
  const float square = ImGui::GetFrameHeight() * 1.2f;
  if (ImGui::Button("-##rings", ImVec2(square, 0)) && rings_ > 1) rings_--;
  probe("rc:rings-");
  ImGui::SameLine();
  numbers_.button(rings_typed_, rings_ > 0 ? std::to_string(rings_) : std::string("tap to enter"), "rc:rings",
                  number_width(), "Rings counted", rings_ > 0 ? std::to_string(rings_) : "");
  ImGui::SameLine();
  if (ImGui::Button("+##rings", ImVec2(square, 0)) && rings_ < 20) rings_ = std::max(rings_ + 1, 1);
  probe("rc:rings+");

  const SpanChoice* s = span();
  const bool joint_known = s && s->details.joint_thickness_mm;
  field_label(joint_known || !s ? "Brick + joint:" : "Brick depth:");
  numbers_.button(ring_depth_mm_, ring_depth_mm_ ? number(*ring_depth_mm_, 0) + " mm" : "not entered", "rc:unit",
                  number_width(), joint_known ? "Brick + joint (mm)" : "Brick depth (mm)",
                  keypad_text(ring_depth_mm_, 1));
  char why[160];
  if (!s)
    std::snprintf(why, sizeof why, "one ring, mm; choose the span first (its joint is taken off)");
  else if (joint_known)
    std::snprintf(why, sizeof why, "one ring, mm (%s joint %s mm)", s->label.c_str(),
                  number(*s->details.joint_thickness_mm, 0).c_str());
  else
    std::snprintf(why, sizeof why, "mm; no joint recorded for %s, so no thickness from the count",
                  s->label.c_str());
  hint(why);

  field_label("Face depth taped:");
  numbers_.button(taped_mm_, taped_mm_ ? number(*taped_mm_, 0) + " mm" : "not measured", "rc:taped", number_width(),
                  "Face depth taped (mm)", keypad_text(taped_mm_, 1));
  ImGui::SameLine();
  ImGui::BeginDisabled(!taped_mm_);
  if (ImGui::Button("Not measured##taped")) taped_mm_.reset();
  probe("rc:taped-clear");
  ImGui::EndDisabled();
  hint("intrados arris to extrados arris");

  if (base_.thickness_lower_mm && base_.thickness_upper_mm) {
    ImGui::AlignTextToFramePadding();
    ImGui::Text("Thickness range used: %s to %s mm, as recorded (kept).", number(*base_.thickness_lower_mm, 0).c_str(),
                number(*base_.thickness_upper_mm, 0).c_str());
    ImGui::SameLine();
    if (ImGui::Button("Remove range")) base_.thickness_lower_mm = base_.thickness_upper_mm = std::nullopt;
    probe("rc:range-clear");
  }

  choice_row("Confidence:", [&] {
    for (const char* c : {"low", "medium", "high"}) {
      ImGui::SameLine();
      // Tapping the chosen one again leaves the confidence unstated.
      if (choice(c, confidence_ == c, std::string("rc:conf:") + c)) confidence_ = confidence_ == c ? "" : c;
    }
    hint(confidence_ == "high" ? "high: verified through the barrel" : "high only when verified through the barrel");
  });

  choice_row("Basis:", [&] {
    for (const char* b : kBasisChoices) {
      same_line_if_fits(b);
      if (choice(b, std::strcmp(basis_, b) == 0, std::string("rc:basis:") + b)) copy_to(basis_, sizeof basis_, b);
    }
  });
  ImGui::SetNextItemWidth(-1);
  ImGui::InputTextWithHint("##basis", "basis, e.g. core at the S1 crown", basis_, sizeof basis_);
  probe("rc:basis");
  ImGui::TextUnformatted("Notes (optional):");
  ImGui::InputTextMultiline("##notes", notes_, sizeof notes_, ImVec2(-1, f * 3.0f));
  probe("rc:notes");

  if (numbers_.draw()) {
    error_.clear();
    if (rings_typed_) keep_rings(*rings_typed_);
    rings_typed_.reset();
  }
}

std::optional<storage::RingCountFields> RingCountDialog::gathered() {
  storage::RingCountFields f = base_;
  const SpanChoice* s = span();
  if (!s) return not_saved(error_, "Span: choose the span the count is on.");
  if (face_.find_first_not_of(' ') == std::string::npos) return not_saved(error_, "Face: choose US or DS, or type the face.");
  if (position_.find_first_not_of(' ') == std::string::npos)
    return not_saved(error_, "Position: choose where along the face, or type it.");
  if (rings_ < 1) return not_saved(error_, "Rings counted: enter the number of rings (1 to 20).");
  f.span_id = s->id;
  f.face = face_;
  f.position = position_;
  f.rings = rings_;
  f.unit_depth_mm.reset();
  if (ring_depth_mm_) {
    std::string problem;
    f.unit_depth_mm = app::unit_depth_from_ring_depth(*ring_depth_mm_, s->details, problem);
    if (!problem.empty()) return not_saved(error_, problem.c_str());
  }
  f.thickness_mm = taped_mm_;
  f.confidence = confidence_;
  f.basis = basis_;
  f.notes = notes_;
  return f;
}

// ---------------------------------------------------------------- fill depth

void FillDepthDialog::open_new(const std::vector<SpanChoice>& spans, const std::string& inspection_id) {
  spans_ = spans;
  base_ = storage::FillDepthFields();
  base_.inspection_id = inspection_id;
  editing_ = false;
  span_id_ = spans.size() == 1 ? spans.front().id : std::string();
  method_.clear();
  chainage_m_ = offset_m_ = depth_m_ = uncertainty_m_ = surfacing_m_ = std::nullopt;
  notes_[0] = 0;
  error_.clear();
  open_ = true;
}

void FillDepthDialog::open_edit(const std::vector<SpanChoice>& spans, const storage::FillDepthFields& f) {
  spans_ = spans;
  base_ = f;
  editing_ = true;
  span_id_ = f.span_id;
  method_ = f.method;
  chainage_m_ = f.chainage_m;
  offset_m_ = f.offset_y_m;
  depth_m_ = f.depth_m;
  uncertainty_m_ = f.uncertainty_m;
  surfacing_m_ = f.surfacing_m;
  copy_to(notes_, sizeof notes_, f.notes);
  error_.clear();
  open_ = true;
}

void FillDepthDialog::draw(const SaveFields<storage::FillDepthFields>& save) {
  shown_ = run_form(open_, editing_ ? "Edit fill depth" : "Add fill depth", kFillPopup,
                    editing_ ? "Save changes" : "Save depth", "fd", error_, [&] { draw_body(); },
                    [&] { return gathered(); }, save);
}

void FillDepthDialog::draw_body() {
  const float f = ImGui::GetFontSize();
  choice_row("Span:", [&] {
    for (const SpanChoice& s : spans_) {
      same_line_if_fits(s.label.c_str());
      if (choice(s.label.c_str(), s.id == span_id_, "fd:span:" + s.label)) span_id_ = s.id;
    }
  });
  // One row per number: the value on a button that opens the keypad, and what it is measured from.
  const auto row = [&](const char* label, const char* probe_name, std::optional<double>& value,
                       const char* keypad_title, const char* missing, bool optional_field, const char* what) {
    field_label(label);
    numbers_.button(value, value ? number(*value, 3) + " m" : std::string(missing), probe_name, number_width(),
                    keypad_title, keypad_text(value, 3));
    if (optional_field) {
      ImGui::SameLine();
      ImGui::BeginDisabled(!value);
      if (ImGui::Button((std::string("Not recorded##") + probe_name).c_str())) value.reset();
      probe(std::string(probe_name) + "-clear");
      ImGui::EndDisabled();
    }
    hint(what);
  };
  row("Chainage:", "fd:chainage", chainage_m_, "Chainage along the span (m)", "tap to enter", false,
      "x along the span from its W springing");
  row("Offset across:", "fd:offset", offset_m_, "Offset across (m)", "not recorded", true,
      "y from the US face");
  choice_row("Method:", [&] {
    for (const auto& [key, label] : kMethods) {
      same_line_if_fits(label);
      if (choice(label, method_ == key, std::string("fd:method:") + key)) method_ = key;
    }
  });
  row("Depth:", "fd:depth", depth_m_, "Fill depth (m)", "tap to enter", false,
      "road surface to extrados, surfacing included");
  row("Uncertainty:", "fd:uncertainty", uncertainty_m_, "Uncertainty (m)", "not recorded", true,
      "+/- m");
  row("Surfacing:", "fd:surfacing", surfacing_m_, "Surfacing (m)", "not recorded", true,
      "bound layers, part of the depth");
  ImGui::TextUnformatted("Notes (optional):");
  ImGui::InputTextMultiline("##notes", notes_, sizeof notes_, ImVec2(-1, f * 3.0f));
  probe("fd:notes");

  if (numbers_.draw()) error_.clear();
}

std::optional<storage::FillDepthFields> FillDepthDialog::gathered() {
  storage::FillDepthFields f = base_;
  const bool span_known = std::any_of(spans_.begin(), spans_.end(), [&](const SpanChoice& s) { return s.id == span_id_; });
  if (!span_known) return not_saved(error_, "Span: choose the span the depth is over.");
  if (!chainage_m_) return not_saved(error_, "Chainage: enter x along the span (m).");
  if (method_.empty()) return not_saved(error_, "Method: choose trial pit, core, GPR or estimate.");
  if (!depth_m_) return not_saved(error_, "Depth: enter the depth in metres.");
  f.span_id = span_id_;
  f.chainage_m = *chainage_m_;
  f.offset_y_m = offset_m_;
  f.method = method_;
  f.depth_m = *depth_m_;
  f.uncertainty_m = uncertainty_m_;
  f.surfacing_m = surfacing_m_;
  f.notes = notes_;
  return f;
}

}  // namespace soffit::gui
