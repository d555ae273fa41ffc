#include "libcoil/outputs/io.hpp"

#include <unistd.h>

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <string>

#include "libcoil/core/error.hpp"

namespace libcoil {

void write_file_atomically(const std::filesystem::path& path, std::string_view content) {
    std::error_code ec;
    if (path.has_parent_path()) {
        std::filesystem::create_directories(path.parent_path(), ec);
        if (ec) throw InputError(path.string(), "cannot create the directory: " + ec.message());
    }
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
    std::filesystem::rename(tmp, path, ec);
    if (ec) {
        std::remove(tmp.c_str());
        throw InputError(path.string(), "cannot move the finished file into place: " + ec.message());
    }
}

}  // namespace libcoil
