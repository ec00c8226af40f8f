#include "batch/fake_sheets.hpp"

#include <cairo-pdf.h>
#include <cairo.h>
#include <fcntl.h>
#include <unistd.h>

#include <chrono>
#include <cstdlib>
#include <sstream>
#include <thread>

#include "sheetmill/batch/sha256.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "support/test_env.hpp"

namespace sheetmill::test {

namespace fs = std::filesystem;

std::vector<batch::SheetJob> fake_jobs(int n, const fs::path& out_dir) {
  std::vector<batch::SheetJob> jobs;
  for (int i = 0; i < n; ++i) {
    batch::SheetJob j;
    j.id = "S" + std::to_string(i);
    j.name = "Fake sheet " + std::to_string(i);
    j.footprint = Box::of(i * 1000.0, 0, i * 1000.0 + 1000, 1000);
    j.output = out_dir / (j.id + ".pdf");
    jobs.push_back(j);
  }
  return jobs;
}

render::RenderReport FakeRenderer::operator()(const batch::SheetJob& job) const {
  if (throw_on.count(job.id)) throw_input_error("fake.gpkg", "sheet " + job.id + " is broken");
  if (crash_on.count(job.id)) std::abort();
  AtomicOutput out(job.output);
  {
    cairo_surface_t* s = cairo_pdf_surface_create(out.temp_path().c_str(), 200, 200);
    cairo_t* cr = cairo_create(s);
    cairo_move_to(cr, 20, 100);
    cairo_show_text(cr, job.id.c_str());
    // Slow sheets are slow while their file is half written, which is when a kill hurts.
    if (sleep_ms > 0) std::this_thread::sleep_for(std::chrono::milliseconds(sleep_ms));
    cairo_destroy(cr);
    cairo_surface_finish(s);
    cairo_status_t st = cairo_surface_status(s);
    cairo_surface_destroy(s);
    if (st != CAIRO_STATUS_SUCCESS) throw_internal_error("fake PDF failed");
  }
  out.commit();
  if (!log.empty()) {
    int fd = ::open(log.c_str(), O_WRONLY | O_CREAT | O_APPEND, 0644);
    std::string line = job.id + "\n";
    if (fd >= 0) {
      (void)!::write(fd, line.data(), line.size());
      ::close(fd);
    }
  }
  render::RenderReport r;
  r.output = job.output;
  if (job.id == "S1") r.warnings.push_back("fake warning for S1");
  return r;
}

std::vector<std::string> render_log(const fs::path& log) {
  std::vector<std::string> lines;
  std::istringstream in(read_text(log));
  for (std::string l; std::getline(in, l);) lines.push_back(l);
  return lines;
}

batch::SheetDigest file_digest(const fs::path& inputs, const batch::SheetJob& job) {
  batch::SheetDigest d;
  d.parts["input"] = batch::sha256_hex(read_text(inputs / (job.id + ".txt")));
  d.hex = batch::sha256_hex(d.parts["input"]);
  return d;
}

bool pdf_opens(const fs::path& pdf, int pages) {
  CommandResult r = run_command({"pdfinfo", pdf.string()});
  std::size_t at = r.out.find("\nPages:");
  if (r.exit_code != 0 || at == std::string::npos) return false;
  return std::stoi(r.out.substr(at + 7)) == pages;
}

}  // namespace sheetmill::test
