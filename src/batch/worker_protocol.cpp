#include "batch/worker_protocol.hpp"

#include <unistd.h>

#include <cerrno>
#include <cstring>

#include "sheetmill/core/error.hpp"

namespace sheetmill::batch::detail {

namespace {

void put_u64(std::string& out, std::uint64_t v) {
  for (int i = 0; i < 8; ++i) out.push_back(static_cast<char>((v >> (8 * i)) & 0xff));
}
void put_str(std::string& out, const std::string& s) {
  put_u64(out, s.size());
  out += s;
}
void put_f64(std::string& out, double d) {
  std::uint64_t v;
  std::memcpy(&v, &d, sizeof v);
  put_u64(out, v);
}

struct Reader {
  const std::string& s;
  std::size_t at = 0;
  std::uint64_t u64() {
    if (at + 8 > s.size()) throw_internal_error("truncated message from a batch worker");
    std::uint64_t v = 0;
    for (int i = 0; i < 8; ++i)
      v |= std::uint64_t(static_cast<unsigned char>(s[at + i])) << (8 * i);
    at += 8;
    return v;
  }
  std::string str() {
    std::uint64_t n = u64();
    if (n > s.size() - at) throw_internal_error("truncated message from a batch worker");
    std::string v = s.substr(at, n);
    at += n;
    return v;
  }
  double f64() {
    std::uint64_t v = u64();
    double d;
    std::memcpy(&d, &v, sizeof d);
    return d;
  }
};

}  // namespace

std::string encode_outcome(const SheetOutcome& o) {
  std::string out;
  put_str(out, o.id);
  put_str(out, o.name);
  put_u64(out, static_cast<std::uint64_t>(o.status));
  put_f64(out, o.seconds);
  put_f64(out, o.cpu_seconds);
  put_u64(out, o.warnings.size());
  for (const auto& w : o.warnings) put_str(out, w);
  put_str(out, o.error);
  put_str(out, o.reason);
  put_str(out, o.output.string());
  put_u64(out, o.output_bytes);
  put_str(out, o.digest);
  put_u64(out, static_cast<std::uint64_t>(o.worker_peak_rss_kib));
  put_u64(out, static_cast<std::uint64_t>(o.worker + 1));
  return out;
}

SheetOutcome decode_outcome(const std::string& payload) {
  Reader r{payload};
  SheetOutcome o;
  o.id = r.str();
  o.name = r.str();
  std::uint64_t status = r.u64();
  if (status > static_cast<std::uint64_t>(SheetStatus::failed)) {
    throw_internal_error("bad status in a message from a batch worker");
  }
  o.status = static_cast<SheetStatus>(status);
  o.seconds = r.f64();
  o.cpu_seconds = r.f64();
  std::uint64_t n = r.u64();
  for (std::uint64_t i = 0; i < n; ++i) o.warnings.push_back(r.str());
  o.error = r.str();
  o.reason = r.str();
  o.output = r.str();
  o.output_bytes = r.u64();
  o.digest = r.str();
  o.worker_peak_rss_kib = static_cast<long>(r.u64());
  o.worker = static_cast<int>(r.u64()) - 1;
  return o;
}

std::string frame(const std::string& payload) {
  std::string out;
  std::uint32_t n = static_cast<std::uint32_t>(payload.size());
  for (int i = 0; i < 4; ++i) out.push_back(static_cast<char>((n >> (8 * i)) & 0xff));
  return out + payload;
}

bool write_all(int fd, const std::string& bytes) {
  std::size_t done = 0;
  while (done < bytes.size()) {
    ssize_t w = ::write(fd, bytes.data() + done, bytes.size() - done);
    if (w < 0 && errno == EINTR) continue;
    if (w <= 0) return false;
    done += static_cast<std::size_t>(w);
  }
  return true;
}

bool read_exact(int fd, void* buf, std::size_t n) {
  auto* p = static_cast<char*>(buf);
  std::size_t done = 0;
  while (done < n) {
    ssize_t r = ::read(fd, p + done, n - done);
    if (r < 0 && errno == EINTR) continue;
    if (r <= 0) return false;
    done += static_cast<std::size_t>(r);
  }
  return true;
}

}  // namespace sheetmill::batch::detail
