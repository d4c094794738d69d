#pragma once
// SHA-256 (FIPS 180-4 §6.2), for content-hash names of photos in the media
// folder: the same picture added twice is stored once, and a changed byte
// gives a different name.
#include <array>
#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>

namespace soffit::storage {

class Sha256 {
 public:
  Sha256();
  void update(const void* data, size_t size);
  void update(std::string_view s) { update(s.data(), s.size()); }
  std::array<uint8_t, 32> digest();  // finishes; the object is then spent
  std::string hex_digest();          // 64 lower-case hex characters

 private:
  void compress(const uint8_t* block);
  std::array<uint32_t, 8> h_;
  std::array<uint8_t, 64> buffer_{};
  size_t buffered_ = 0;
  uint64_t total_bytes_ = 0;
};

std::string sha256_hex(const void* data, size_t size);

}  // namespace soffit::storage
