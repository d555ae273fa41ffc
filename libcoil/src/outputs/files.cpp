#include "libcoil/outputs/files.hpp"

#include <unistd.h>

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <string>

#include "libcoil/core/error.hpp"

namespace libcoil {

namespace {

// Writes `content` to `path`'s temporary name and returns that name; nothing is left behind on failure.
std::string stage(const std::filesystem::path& path, std::string_view content) {
    std::error_code ec;
    if (path.has_parent_path()) {
        std::filesystem::create_directories(path.parent_path(), ec);
        if (ec) throw InputError(path.string(), "cannot create the directory: " + ec.message());
    }
    if (std::filesystem::is_directory(path, ec)) throw InputError(path.string(), "is a directory; expected a file name to write");
    const std::string tmp = path.string() + ".tmp." + std::to_string(::getpid());
    std::FILE* f = std::fopen(tmp.c_str(), "wb");
    if (!f) throw InputError(path.string(), std::string("cannot write: ") + std::strerror(errno));
    const bool ok = std::fwrite(content.data(), 1, content.size(), f) == content.size() && std::fflush(f) == 0 &&
                    ::fsync(::fileno(f)) == 0;
    const int err = errno;
    if (std::fclose(f) != 0 || !ok) {
        std::remove(tmp.c_str());
        throw InputError(path.string(), std::string("cannot write: ") + std::strerror(err));
    }
    return tmp;
}

void move_into_place(const std::string& tmp, const std::filesystem::path& path) {
    std::error_code ec;
    std::filesystem::rename(tmp, path, ec);
    if (ec) {
        std::remove(tmp.c_str());
        throw InputError(path.string(), "cannot move the finished file into place: " + ec.message());
    }
}

}  // namespace

void write_file_atomically(const std::filesystem::path& path, std::string_view content) {
    move_into_place(stage(path, content), path);
}

void write_file_set(const FileSet& files) {
    std::vector<std::string> staged;
    try {
        for (const auto& [path, content] : files) staged.push_back(stage(path, content));
    } catch (...) {
        for (const auto& t : staged) std::remove(t.c_str());
        throw;
    }
    for (std::size_t i = 0; i < files.size(); ++i) move_into_place(staged[i], files[i].first);
}

}  // namespace libcoil
