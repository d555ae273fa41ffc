// Internal: a whole text file read at the edge (specs, requirements, measurements), or an InputError naming
// the path.
#pragma once

#include <cstdint>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>
#include <string_view>

#include "libcoil/core/error.hpp"

namespace libcoil::detail {

// Input files are bounded before they are opened: a regular file (a FIFO or a device would block or never
// end), of at most max_text_file_bytes.
inline constexpr std::uintmax_t max_text_file_bytes = 64u << 20;

inline std::string read_text_file(const std::filesystem::path& path, std::string_view what) {
    std::error_code ec;
    const auto st = std::filesystem::status(path, ec);
    if (ec || !std::filesystem::exists(st)) throw InputError(path.string(), "cannot open the " + std::string(what) + ": no such file");
    if (!std::filesystem::is_regular_file(st)) {
        throw InputError(path.string(), "is not a regular file (a directory, device or pipe); expected the " + std::string(what));
    }
    const std::uintmax_t size = std::filesystem::file_size(path, ec);
    if (ec || size > max_text_file_bytes) {
        throw InputError(path.string(), "is " + std::to_string(size >> 20) + " MiB; a " + std::string(what) + " may be at most " +
                                            std::to_string(max_text_file_bytes >> 20) + " MiB");
    }
    std::ifstream in(path, std::ios::binary);
    if (!in) throw InputError(path.string(), "cannot open the " + std::string(what));
    std::ostringstream buf;
    buf << in.rdbuf();
    if (in.bad()) throw InputError(path.string(), "cannot read the " + std::string(what));
    return buf.str();
}

}  // namespace libcoil::detail
