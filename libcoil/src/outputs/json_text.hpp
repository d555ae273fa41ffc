// Internal: a JSON document as text. Any byte that is not UTF-8 (a name from a command-line argument, say;
// spec files are checked at reading) becomes U+FFFD instead of stopping the writer.
#pragma once

#include <string>

#include <nlohmann/json.hpp>

namespace libcoil::detail {

template <class Json>
std::string json_text(const Json& j, int indent) {
    return j.dump(indent, ' ', false, Json::error_handler_t::replace) + "\n";
}

}  // namespace libcoil::detail
