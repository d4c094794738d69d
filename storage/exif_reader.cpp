#include "storage/exif_reader.hpp"

#include <cmath>

namespace soffit::storage {
namespace {

// Reads from the TIFF block only; every read says whether it fitted.
class TiffBlock {
 public:
  TiffBlock(const uint8_t* p, size_t n) : p_(p), n_(n) {}
  size_t size() const { return n_; }
  bool little_endian = true;

  bool fits(size_t offset, size_t length) const { return offset <= n_ && length <= n_ - offset; }
  bool u16(size_t off, uint16_t& v) const {
    if (!fits(off, 2)) return false;
    v = little_endian ? uint16_t(p_[off] | (p_[off + 1] << 8)) : uint16_t((p_[off] << 8) | p_[off + 1]);
    return true;
  }
  bool u32(size_t off, uint32_t& v) const {
    if (!fits(off, 4)) return false;
    if (little_endian)
      v = uint32_t(p_[off]) | (uint32_t(p_[off + 1]) << 8) | (uint32_t(p_[off + 2]) << 16) | (uint32_t(p_[off + 3]) << 24);
    else
      v = (uint32_t(p_[off]) << 24) | (uint32_t(p_[off + 1]) << 16) | (uint32_t(p_[off + 2]) << 8) | uint32_t(p_[off + 3]);
    return true;
  }
  const uint8_t* at(size_t off) const { return p_ + off; }

 private:
  const uint8_t* p_;
  size_t n_;
};

struct Entry {
  uint16_t tag = 0, type = 0;
  uint32_t count = 0;
  size_t value_offset = 0;  // where the value's bytes start in the block (checked to fit)
};

size_t type_size(uint16_t type) {
  switch (type) {
    case 1: case 2: case 6: case 7: return 1;  // BYTE, ASCII, SBYTE, UNDEFINED
    case 3: case 8: return 2;                  // SHORT, SSHORT
    case 4: case 9: case 11: return 4;         // LONG, SLONG, FLOAT
    case 5: case 10: case 12: return 8;        // RATIONAL, SRATIONAL, DOUBLE
    default: return 0;
  }
}

// A real camera IFD has tens of entries; more than this is damage.
constexpr uint16_t kMaxEntries = 1000;

// Reads an IFD's entries whose values lie wholly inside the block; false if
// the IFD itself does not fit.
bool read_ifd(const TiffBlock& t, uint32_t offset, std::vector<Entry>& out, std::vector<std::string>& warnings,
              const char* name) {
  uint16_t count = 0;
  if (!t.u16(offset, count) || count > kMaxEntries || !t.fits(size_t(offset) + 2, size_t(count) * 12)) {
    warnings.push_back(std::string("EXIF ") + name + " directory lies outside the segment (truncated); skipped");
    return false;
  }
  for (uint16_t i = 0; i < count; ++i) {
    const size_t e = size_t(offset) + 2 + size_t(i) * 12;
    Entry entry;
    uint32_t inline_or_offset = 0;
    t.u16(e, entry.tag);
    t.u16(e + 2, entry.type);
    t.u32(e + 4, entry.count);
    t.u32(e + 8, inline_or_offset);
    const size_t unit = type_size(entry.type);
    if (unit == 0 || entry.count == 0 || entry.count > t.size()) continue;
    const size_t bytes = unit * entry.count;
    entry.value_offset = bytes <= 4 ? e + 8 : inline_or_offset;
    if (!t.fits(entry.value_offset, bytes)) {
      warnings.push_back(std::string("EXIF ") + name + " tag " + std::to_string(entry.tag) +
                         " points outside the segment; skipped");
      continue;
    }
    out.push_back(entry);
  }
  return true;
}

const Entry* find(const std::vector<Entry>& entries, uint16_t tag, uint16_t type) {
  for (const auto& e : entries)
    if (e.tag == tag && e.type == type) return &e;
  return nullptr;
}

// "YYYY:MM:DD HH:MM:SS" → "YYYY-MM-DDTHH:MM:SS"; nullopt if not that shape.
std::optional<std::string> exif_date(const TiffBlock& t, const Entry& e) {
  if (e.count < 19) return std::nullopt;
  const std::string s(reinterpret_cast<const char*>(t.at(e.value_offset)), 19);
  for (size_t i = 0; i < 19; ++i) {
    const bool sep = i == 4 || i == 7 || i == 10 || i == 13 || i == 16;
    if (sep ? (s[i] != (i == 10 ? ' ' : ':')) : (s[i] < '0' || s[i] > '9')) return std::nullopt;
  }
  if (s.compare(0, 4, "0000") == 0) return std::nullopt;  // cameras write zeros when the clock was never set
  std::string iso = s;
  iso[4] = '-';
  iso[7] = '-';
  iso[10] = 'T';
  return iso;
}

// GPS degrees, minutes, seconds as three RATIONALs.
std::optional<double> exif_degrees(const TiffBlock& t, const Entry* e) {
  if (!e || e->count != 3) return std::nullopt;
  double parts[3];
  for (int i = 0; i < 3; ++i) {
    uint32_t num = 0, den = 0;
    t.u32(e->value_offset + 8 * size_t(i), num);
    t.u32(e->value_offset + 8 * size_t(i) + 4, den);
    if (den == 0) return std::nullopt;
    parts[i] = double(num) / double(den);
  }
  return parts[0] + parts[1] / 60.0 + parts[2] / 3600.0;
}

char exif_ref(const TiffBlock& t, const Entry* e) {
  if (!e || e->count < 1) return 0;
  return static_cast<char>(*t.at(e->value_offset));
}

void read_tiff(const TiffBlock& block, ExifFacts& facts) {
  TiffBlock t = block;
  if (t.size() < 8 || !((t.at(0)[0] == 'I' && t.at(0)[1] == 'I') || (t.at(0)[0] == 'M' && t.at(0)[1] == 'M'))) {
    facts.warnings.push_back("EXIF segment has no TIFF header; skipped");
    return;
  }
  t.little_endian = t.at(0)[0] == 'I';
  uint16_t magic = 0;
  uint32_t ifd0 = 0;
  t.u16(2, magic);
  t.u32(4, ifd0);
  if (magic != 42) {
    facts.warnings.push_back("EXIF TIFF header is damaged; skipped");
    return;
  }
  std::vector<Entry> main;
  if (!read_ifd(t, ifd0, main, facts.warnings, "IFD0")) return;

  if (const Entry* o = find(main, 0x0112, 3)) {
    uint16_t v = 0;
    t.u16(o->value_offset, v);
    if (v >= 1 && v <= 8) facts.orientation = v;
    else facts.warnings.push_back("EXIF orientation " + std::to_string(v) + " is not 1 to 8; ignored");
  }
  if (const Entry* p = find(main, 0x8769, 4)) {
    uint32_t off = 0;
    t.u32(p->value_offset, off);
    std::vector<Entry> exif;
    if (read_ifd(t, off, exif, facts.warnings, "Exif"))
      if (const Entry* d = find(exif, 0x9003, 2)) {
        facts.taken_at = exif_date(t, *d);
        if (!facts.taken_at) facts.warnings.push_back("EXIF DateTimeOriginal is not YYYY:MM:DD HH:MM:SS; ignored");
      }
  }
  if (const Entry* p = find(main, 0x8825, 4)) {
    uint32_t off = 0;
    t.u32(p->value_offset, off);
    std::vector<Entry> gps;
    if (read_ifd(t, off, gps, facts.warnings, "GPS")) {
      const char lat_ref = exif_ref(t, find(gps, 1, 2)), lon_ref = exif_ref(t, find(gps, 3, 2));
      const auto lat = exif_degrees(t, find(gps, 2, 5)), lon = exif_degrees(t, find(gps, 4, 5));
      if (lat && lon && (lat_ref == 'N' || lat_ref == 'S') && (lon_ref == 'E' || lon_ref == 'W') && *lat <= 90 &&
          *lon <= 180) {
        facts.latitude_deg = lat_ref == 'S' ? -*lat : *lat;
        facts.longitude_deg = lon_ref == 'W' ? -*lon : *lon;
      } else if (!gps.empty()) {
        facts.warnings.push_back("EXIF GPS position is incomplete or out of range; ignored");
      }
    }
  }
}

}  // namespace

ExifFacts read_jpeg_exif(const uint8_t* data, size_t size) {
  ExifFacts facts;
  if (size < 4 || data[0] != 0xFF || data[1] != 0xD8) return facts;
  size_t pos = 2;
  // JPEG (ITU-T T.81 Annex B): markers FF xx, most followed by a 16-bit
  // big-endian length that counts itself; metadata comes before the scan.
  while (pos + 4 <= size) {
    if (data[pos] != 0xFF) {
      facts.warnings.push_back("JPEG marker expected at byte " + std::to_string(pos) + "; stopped reading metadata");
      break;
    }
    const uint8_t marker = data[pos + 1];
    if (marker == 0xFF) {  // fill byte
      ++pos;
      continue;
    }
    if (marker == 0xDA || marker == 0xD9) break;  // start of scan, end of image
    if (marker == 0x01 || (marker >= 0xD0 && marker <= 0xD7)) {  // no length
      pos += 2;
      continue;
    }
    const size_t length = (size_t(data[pos + 2]) << 8) | data[pos + 3];
    if (length < 2 || length > size - pos - 2) {
      facts.warnings.push_back("JPEG segment at byte " + std::to_string(pos) + " runs past the end of the file");
      break;
    }
    const uint8_t* body = data + pos + 4;
    const size_t body_size = length - 2;
    static const uint8_t kExif[6] = {'E', 'x', 'i', 'f', 0, 0};
    if (marker == 0xE1 && body_size >= 6 && std::equal(kExif, kExif + 6, body)) {
      read_tiff(TiffBlock(body + 6, body_size - 6), facts);
      break;  // the first EXIF segment is the camera's
    }
    pos += 2 + length;
  }
  return facts;
}

}  // namespace soffit::storage
