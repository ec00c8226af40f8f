#include "sheetmill/batch/merge_pdf.hpp"

// qpdf 11 asks each user to choose how PointerHolder maps to std::shared_ptr.
#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4
#endif

#include <memory>
#include <qpdf/QPDF.hh>
#include <qpdf/QPDFPageDocumentHelper.hh>
#include <qpdf/QPDFWriter.hh>

#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/pdf/checked_output.hpp"

namespace sheetmill::batch {

namespace fs = std::filesystem;

namespace {

constexpr std::size_t kOpenAtOnce = 200;

void merge_into(const std::vector<fs::path>& inputs, const fs::path& temp,
                const std::string& shown_as) {
  QPDF out;
  out.emptyPDF();
  QPDFPageDocumentHelper out_pages(out);
  // The sources must outlive the write: qpdf copies foreign objects lazily.
  std::vector<std::unique_ptr<QPDF>> sources;
  for (const fs::path& p : inputs) {
    auto in = std::make_unique<QPDF>();
    try {
      in->processFile(p.c_str());
    } catch (const std::exception& e) {
      throw_input_error(p.string(), std::string("cannot read this PDF to merge it: ") + e.what());
    }
    for (QPDFPageObjectHelper& page : QPDFPageDocumentHelper(*in).getAllPages()) {
      out_pages.addPage(page, false);
    }
    sources.push_back(std::move(in));
  }
  // Checked writes: a full disk names its reason instead of leaving a short file.
  FileWriter file(temp, shown_as);
  pdf::QpdfSink sink(file);
  QPDFWriter w(out);
  w.setOutputPipeline(&sink);
  w.setStaticID(false);
  w.write();
  sink.flush();  // the sink gathers writes into blocks
  file.close();
  pdf::verify_pdf(temp, out_pages.getAllPages().size(), shown_as);
}

}  // namespace

void merge_pdfs(const std::vector<fs::path>& inputs, const fs::path& output) {
  if (inputs.empty()) throw_input_error(output.string(), "no sheets to merge");
  AtomicOutput out(output);
  try {
    if (inputs.size() <= kOpenAtOnce) {
      merge_into(inputs, out.temp_path(), output.string());
    } else {
      // Merge in groups, then merge the groups (each group file is a temporary too).
      std::vector<std::unique_ptr<AtomicOutput>> groups;
      std::vector<fs::path> group_paths;
      for (std::size_t at = 0; at < inputs.size(); at += kOpenAtOnce) {
        std::vector<fs::path> chunk(
            inputs.begin() + static_cast<long>(at),
            inputs.begin() + static_cast<long>(std::min(inputs.size(), at + kOpenAtOnce)));
        auto g = std::make_unique<AtomicOutput>(output.string() + ".group" + std::to_string(at));
        merge_into(chunk, g->temp_path(), output.string());
        group_paths.push_back(g->temp_path());
        groups.push_back(std::move(g));
      }
      merge_pdfs(group_paths, out.temp_path());
    }
  } catch (const Error&) {
    throw;
  } catch (const std::exception& e) {
    throw_input_error(output.string(), std::string("cannot write the merged PDF: ") + e.what());
  }
  out.commit();
}

}  // namespace sheetmill::batch
