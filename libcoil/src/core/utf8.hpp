// Internal: UTF-8 as the readers and the messages need it.
#pragma once

#include <cstddef>
#include <string_view>

namespace libcoil::detail {

// The length in bytes of the well-formed UTF-8 character that starts at text[i] (1 for ASCII), or 0 when
// the bytes there are not one: a stray continuation byte, a cut sequence, an overlong form, a surrogate or a
// code point past U+10FFFF (the Unicode standard's table 3-7 of well-formed byte sequences).
inline std::size_t utf8_length(std::string_view text, std::size_t i) {
    const auto byte = [&](std::size_t k) { return static_cast<unsigned char>(text[i + k]); };
    const unsigned char c = byte(0);
    if (c < 0x80) return 1;
    const std::size_t n = c >= 0xc2 && c <= 0xdf ? 2 : c >= 0xe0 && c <= 0xef ? 3 : c >= 0xf0 && c <= 0xf4 ? 4 : 0;
    if (n == 0 || i + n > text.size()) return 0;
    for (std::size_t k = 1; k < n; ++k) {
        if ((byte(k) & 0xc0) != 0x80) return 0;
    }
    const unsigned char c1 = byte(1);
    if ((c == 0xe0 && c1 < 0xa0) || (c == 0xed && c1 >= 0xa0) || (c == 0xf0 && c1 < 0x90) || (c == 0xf4 && c1 >= 0x90)) return 0;
    return n;
}

}  // namespace libcoil::detail
