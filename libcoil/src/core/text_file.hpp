// Internal: a whole text file read at the edge (specs, requirements, measurements), or an InputError naming
// the path.
#pragma once

#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>
#include <string_view>

#include "libcoil/core/error.hpp"

namespace libcoil::detail {

inline std::string read_text_file(const std::filesystem::path& path, std::string_view what) {
    std::ifstream in(path, std::ios::binary);
    if (!in) throw InputError(path.string(), "cannot open the " + std::string(what));
    std::ostringstream buf;
    buf << in.rdbuf();
    if (in.bad()) throw InputError(path.string(), "cannot read the " + std::string(what));
    return buf.str();
}

}  // namespace libcoil::detail
