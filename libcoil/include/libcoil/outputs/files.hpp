// Writing result files: all or nothing.
#pragma once

#include <filesystem>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

namespace libcoil {

// Writes `content` to a temporary file beside `path`, then renames it over `path`, so that a reader never
// sees a partial file. Creates missing parent directories. Throws InputError naming the path on failure.
void write_file_atomically(const std::filesystem::path& path, std::string_view content);

// A command's output set, written whole or not at all:
// - into a directory that does not exist yet, the set is written into a hidden .DIR.tmp.PID beside it and
//   renamed to DIR in one step, so that a reader (or a kill at any moment) sees all of it or none;
// - into an existing directory, every file is first staged beside its final name (NAME.tmp.PID), and only
//   when all are staged are they renamed into place, under an exclusive lock on the directory so that two
//   runs into one directory each land whole. A kill between those renames (microseconds) can leave the
//   earlier run's files beside the new ones, never a truncated file under a final name.
// If staging fails, what was staged is removed and nothing under a final name has changed; the InputError
// names the path that failed. Temporaries that killed runs left under the set's names are removed.
using FileSet = std::vector<std::pair<std::filesystem::path, std::string>>;
void write_file_set(const FileSet& files);

}  // namespace libcoil
