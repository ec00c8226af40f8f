#pragma once
// Test doubles for the batch runner: jobs with outputs in a folder, and a renderer that writes
// a small but real one-page PDF (with Cairo, atomically, like the real renderer), records each
// render in a log (one O_APPEND line per render) and can be told to fail or crash per sheet.

#include <filesystem>
#include <set>
#include <string>
#include <vector>

#include "sheetmill/batch/runner.hpp"

namespace sheetmill::test {

std::vector<batch::SheetJob> fake_jobs(int n, const std::filesystem::path& out_dir);

struct FakeRenderer {
  std::filesystem::path log;       // one line "ID" appended after each committed render
  std::set<std::string> throw_on;  // render throws Error(input)
  std::set<std::string> crash_on;  // the worker process aborts
  int sleep_ms = 0;
  render::RenderReport operator()(const batch::SheetJob& job) const;
};

// Lines of the render log (missing file = none).
std::vector<std::string> render_log(const std::filesystem::path& log);

// A digest read from a file per sheet, so tests change a sheet's inputs from outside the
// workers: inputs/ID.txt (absent = "").
batch::SheetDigest file_digest(const std::filesystem::path& inputs, const batch::SheetJob& job);

// pdfinfo (poppler) opens it and finds the given number of pages.
bool pdf_opens(const std::filesystem::path& pdf, int pages = 1);

}  // namespace sheetmill::test
