// libFuzzer target: the unit parser (core/units.hpp). The first byte picks the dimension, the rest is the
// text. parse_quantity must return a finite value or throw InputError; anything else is a finding. The seeds
// (tests/fuzz/corpus/units) are named after their dimension and unit; their first byte is the dimension's
// place in the Dimension enum.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string_view>

#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    if (size < 1) return 0;
    const auto d = static_cast<libcoil::Dimension>(data[0] % (static_cast<int>(libcoil::Dimension::time) + 1));
    const std::string_view text(reinterpret_cast<const char*>(data) + 1, size - 1);
    try {
        if (!std::isfinite(libcoil::parse_quantity(text, d, "fuzz"))) std::abort();
    } catch (const libcoil::InputError&) {
    }
    return 0;
}
