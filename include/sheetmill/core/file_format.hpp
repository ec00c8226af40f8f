#pragma once
// The kind of file a command writes, chosen by the output's extension (case-insensitive), and
// the one refusal for an extension the command cannot write: "sheet.svg: cannot write .svg
// files; this command writes .pdf, .png, .tif or .tiff".

#include <filesystem>
#include <initializer_list>

namespace sheetmill {

enum class FileFormat { pdf, png, geotiff };

// The format `path`'s extension names, if it is one of `supported`; otherwise throws
// Error(input) naming the path and listing the extensions of `supported`.
FileFormat file_format_for(const std::filesystem::path& path,
                           std::initializer_list<FileFormat> supported);

}  // namespace sheetmill
