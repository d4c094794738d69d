#include "app/model/photo_loader.hpp"

#include <stb_image.h>
#include <stb_image_resize.h>

#include <algorithm>
#include <cmath>
#include <exception>
#include <filesystem>
#include <fstream>

#include "storage/image_thumbnail.hpp"
#include "storage/photo_store.hpp"

namespace soffit::app {
namespace {

namespace fs = std::filesystem;

LoadedPhoto failure(const std::string& key, const std::string& name, const std::string& why) {
  return {key, nullptr, name + ": " + why};
}

struct StbFree {
  void operator()(unsigned char* p) const { stbi_image_free(p); }
};

// Decoded as RGB so that the storage library's EXIF turn (tested there) applies;
// alpha is added last, for the texture.
LoadedPhoto decode(const std::string& key, const std::string& name, const uint8_t* data, size_t size, int max_side,
                   int orientation) {
  if (size == 0) return failure(key, name, "the file is empty");
  if (size > static_cast<size_t>(storage::kMaxPhotoBytes)) return failure(key, name, "the file is too large to show");
  const int n = static_cast<int>(size);
  int w = 0, h = 0, comp = 0;
  if (!stbi_info_from_memory(data, n, &w, &h, &comp))
    return failure(key, name, std::string("the image is damaged or not a JPEG or PNG (") + stbi_failure_reason() + ")");
  if (w <= 0 || h <= 0 || static_cast<long long>(w) * h > storage::kMaxPhotoPixels)
    return failure(key, name, "the image is " + std::to_string(w) + " x " + std::to_string(h) +
                                  " pixels, more than a photo may have");
  std::unique_ptr<unsigned char, StbFree> pixels(stbi_load_from_memory(data, n, &w, &h, &comp, 3));
  if (!pixels)
    return failure(key, name, std::string("the image is damaged or unreadable (") + stbi_failure_reason() + ")");

  storage::RgbImage rgb;
  max_side = std::max(1, max_side);
  const int longest = std::max(w, h);
  if (longest > max_side) {
    // Fits the longer side exactly (a whole-factor box average could halve a
    // 2100 px photo to 1050 px); stb's default filter for shrinking is Mitchell.
    const double k = static_cast<double>(max_side) / longest;
    rgb.width = std::max(1, static_cast<int>(std::lround(w * k)));
    rgb.height = std::max(1, static_cast<int>(std::lround(h * k)));
    rgb.rgb.resize(size_t(rgb.width) * size_t(rgb.height) * 3);
    if (!stbir_resize_uint8(pixels.get(), w, h, 0, rgb.rgb.data(), rgb.width, rgb.height, 0, 3))
      return failure(key, name, "the image could not be reduced to show it");
  } else {
    rgb.width = w;
    rgb.height = h;
    rgb.rgb.assign(pixels.get(), pixels.get() + size_t(w) * size_t(h) * 3);
  }
  pixels.reset();
  const storage::RgbImage seen = storage::apply_exif_orientation(rgb, orientation);

  auto image = std::make_shared<RgbaImage>();
  image->width = seen.width;
  image->height = seen.height;
  image->rgba.resize(size_t(seen.width) * size_t(seen.height) * 4);
  for (size_t i = 0, count = size_t(seen.width) * size_t(seen.height); i < count; ++i) {
    image->rgba[i * 4 + 0] = seen.rgb[i * 3 + 0];
    image->rgba[i * 4 + 1] = seen.rgb[i * 3 + 1];
    image->rgba[i * 4 + 2] = seen.rgb[i * 3 + 2];
    image->rgba[i * 4 + 3] = 255;
  }
  return {key, std::move(image), {}};
}

}  // namespace

LoadedPhoto decode_photo_bytes(const std::string& key, const std::string& name, const std::vector<uint8_t>& bytes,
                               int max_side, int orientation) {
  try {
    return decode(key, name, bytes.data(), bytes.size(), max_side, orientation);
  } catch (const std::bad_alloc&) {
    return failure(key, name, "not enough memory to show the image");
  }
}

LoadedPhoto decode_photo_file(const std::string& key, const std::string& path, int max_side, int orientation) {
  std::error_code ec;
  const auto status = fs::status(path, ec);
  if (ec || !fs::exists(status))
    return failure(key, path, "no such photo file (is the project's media folder beside it?)");
  if (!fs::is_regular_file(status)) return failure(key, path, "not a file");
  const auto size = fs::file_size(path, ec);
  if (ec) return failure(key, path, "cannot read its size (" + ec.message() + ")");
  if (size > static_cast<uintmax_t>(storage::kMaxPhotoBytes)) return failure(key, path, "the file is too large to show");
  try {
    std::vector<uint8_t> bytes(static_cast<size_t>(size));
    std::ifstream in(path, std::ios::binary);
    if (!in.read(reinterpret_cast<char*>(bytes.data()), static_cast<std::streamsize>(size)))
      return failure(key, path, "the file could not be read to its end");
    return decode(key, path, bytes.data(), bytes.size(), max_side, orientation);
  } catch (const std::bad_alloc&) {
    return failure(key, path, "not enough memory to show the image");
  }
}

PhotoLoader::PhotoLoader(size_t keep) : keep_(std::max<size_t>(1, keep)), worker_([this] { work(); }) {}

PhotoLoader::~PhotoLoader() {
  {
    std::lock_guard lock(mutex_);
    stop_ = true;
    queue_.clear();
  }
  wake_.notify_all();
  worker_.join();
}

bool PhotoLoader::known(const std::string& key) const {
  if (running_ == key) return true;
  for (const Job& j : queue_)
    if (j.key == key) return true;
  for (const LoadedPhoto& f : finished_)
    if (f.key == key) return true;
  return false;
}

void PhotoLoader::request(const std::string& key, const std::string& path, int max_side, int orientation) {
  {
    std::lock_guard lock(mutex_);
    if (known(key)) return;
    for (const LoadedPhoto& c : cache_)
      if (c.key == key) {
        finished_.push_back(c);
        return;
      }
    queue_.push_back({key, path, path, {}, max_side, orientation});
  }
  wake_.notify_one();
}

void PhotoLoader::request_bytes(const std::string& key, const std::string& name, std::vector<uint8_t> bytes,
                                int max_side, int orientation) {
  {
    std::lock_guard lock(mutex_);
    if (known(key)) return;
    for (const LoadedPhoto& c : cache_)
      if (c.key == key) {
        finished_.push_back(c);
        return;
      }
    queue_.push_back({key, {}, name, std::move(bytes), max_side, orientation});
  }
  wake_.notify_one();
}

void PhotoLoader::cancel(const std::string& key) {
  std::lock_guard lock(mutex_);
  std::erase_if(queue_, [&](const Job& j) { return j.key == key; });
}

void PhotoLoader::clear() {
  std::lock_guard lock(mutex_);
  queue_.clear();
  finished_.clear();
  cache_.clear();
  running_.clear();  // the image being decoded is dropped when it finishes (see work)
}

std::vector<LoadedPhoto> PhotoLoader::poll() {
  std::lock_guard lock(mutex_);
  std::vector<LoadedPhoto> out;
  out.swap(finished_);
  return out;
}

bool PhotoLoader::busy() const {
  std::lock_guard lock(mutex_);
  return !queue_.empty() || !running_.empty() || !finished_.empty();
}

std::shared_ptr<const RgbaImage> PhotoLoader::cached(const std::string& key) const {
  std::lock_guard lock(mutex_);
  for (const LoadedPhoto& c : cache_)
    if (c.key == key) return c.image;
  return nullptr;
}

size_t PhotoLoader::cached_count() const {
  std::lock_guard lock(mutex_);
  return cache_.size();
}

void PhotoLoader::remember(const LoadedPhoto& done) {
  if (!done.image) return;  // failures are not cached: the file may be put back
  std::erase_if(cache_, [&](const LoadedPhoto& c) { return c.key == done.key; });
  cache_.push_front(done);
  while (cache_.size() > keep_) cache_.pop_back();
}

void PhotoLoader::work() {
  std::unique_lock lock(mutex_);
  for (;;) {
    wake_.wait(lock, [&] { return stop_ || !queue_.empty(); });
    if (stop_) return;
    Job job = std::move(queue_.front());
    queue_.pop_front();
    running_ = job.key;
    lock.unlock();
    LoadedPhoto done;
    try {
      done = job.path.empty() ? decode_photo_bytes(job.key, job.name, job.bytes, job.max_side, job.orientation)
                              : decode_photo_file(job.key, job.path, job.max_side, job.orientation);
    } catch (const std::exception& e) {  // never let a photo end the program
      done = failure(job.key, job.name, e.what());
    }
    lock.lock();
    if (stop_) return;
    if (running_ == job.key) {  // else clear() was called meanwhile: the result is stale
      running_.clear();
      if (!job.path.empty()) remember(done);  // thumbnails are cheap to decode again
      finished_.push_back(std::move(done));
    }
  }
}

}  // namespace soffit::app
