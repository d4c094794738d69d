#pragma once
// Decodes photos off the UI thread (DEVELOPERS.md "The app": heavy work never
// runs in a frame). One worker thread takes requests in order; each result is
// RGBA8 pixels turned the way EXIF orientation says the photo is seen and
// shrunk to fit a texture side. The UI thread collects results with poll().
// A missing, damaged or oversized file gives a message naming it, never a
// throw. The last `keep` photo files decoded stay cached (a 2048 px RGBA image
// is up to 16 MB), so going back to a photo does not decode it again; encoded
// bytes (thumbnails) are not cached.
#include <condition_variable>
#include <cstdint>
#include <deque>
#include <list>
#include <memory>
#include <mutex>
#include <string>
#include <thread>
#include <vector>

namespace soffit::app {

struct RgbaImage {
  int width = 0, height = 0;
  std::vector<uint8_t> rgba;  // row by row, 4 bytes a pixel, alpha 255
};

struct LoadedPhoto {
  std::string key;                          // as requested
  std::shared_ptr<const RgbaImage> image;   // null when it failed
  std::string error;                        // names the file; empty on success
};

// Decodes now, on the caller's thread (the worker calls it; tests too).
// `name` is what messages call the image. `max_side` ≥ 1.
LoadedPhoto decode_photo_file(const std::string& key, const std::string& path, int max_side, int orientation);
LoadedPhoto decode_photo_bytes(const std::string& key, const std::string& name, const std::vector<uint8_t>& bytes,
                               int max_side, int orientation);

class PhotoLoader {
 public:
  explicit PhotoLoader(size_t keep = 6);
  ~PhotoLoader();  // drops queued requests and waits for the one being decoded
  PhotoLoader(const PhotoLoader&) = delete;
  PhotoLoader& operator=(const PhotoLoader&) = delete;

  // Queues a photo file, or encoded bytes (e.g. a stored PNG thumbnail).
  // A key already queued or cached is not decoded again: a cached one is
  // handed back by the next poll().
  void request(const std::string& key, const std::string& path, int max_side, int orientation = 1);
  void request_bytes(const std::string& key, const std::string& name, std::vector<uint8_t> bytes, int max_side,
                     int orientation = 1);
  // Drops a request still waiting in the queue (the person moved on).
  void cancel(const std::string& key);
  // Drops every queued request and every cached image (another project or visit).
  void clear();

  // Results finished since the last call, oldest first. UI thread.
  std::vector<LoadedPhoto> poll();
  // True while anything is queued, being decoded or waiting for poll().
  bool busy() const;

  std::shared_ptr<const RgbaImage> cached(const std::string& key) const;
  size_t cached_count() const;

 private:
  struct Job {
    std::string key, path, name;
    std::vector<uint8_t> bytes;  // used when path is empty
    int max_side = 2048, orientation = 1;
  };
  void work();
  bool known(const std::string& key) const;  // lock held
  void remember(const LoadedPhoto& done);    // lock held

  const size_t keep_;
  mutable std::mutex mutex_;
  std::condition_variable wake_;
  std::deque<Job> queue_;
  std::string running_;                    // key being decoded, "" when idle
  std::vector<LoadedPhoto> finished_;      // waiting for poll()
  std::list<LoadedPhoto> cache_;           // most recent first, at most keep_
  bool stop_ = false;
  std::thread worker_;                     // last: starts after the members it uses
};

}  // namespace soffit::app
