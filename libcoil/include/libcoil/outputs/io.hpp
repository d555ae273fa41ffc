// Writing result files: all or nothing.
#pragma once

#include <filesystem>
#include <string_view>

namespace libcoil {

// Writes `content` to a temporary file beside `path`, then renames it over `path`, so that a reader never
// sees a partial file. Creates missing parent directories. Throws InputError naming the path on failure.
void write_file_atomically(const std::filesystem::path& path, std::string_view content);

}  // namespace libcoil
