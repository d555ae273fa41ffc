// libFuzzer target: the measurement readers (inputs/network_file.hpp). The first byte picks the reader
// (Touchstone as .s1p, .s2p, or a version 2 file that states its ports; or the CSV layout), the rest is the
// file's text. A reader must return a consistent record or throw InputError; anything else (another
// exception, a crash, a sanitizer report, a NaN in the record) is a finding.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string_view>

#include "libcoil/core/error.hpp"
#include "libcoil/inputs/network_file.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    if (size < 1) return 0;
    const std::string_view text(reinterpret_cast<const char*>(data) + 1, size - 1);
    try {
        libcoil::NetworkData d;
        switch (data[0] % 4) {
            case 0: d = libcoil::read_touchstone(text, "fuzz.s1p", 1); break;
            case 1: d = libcoil::read_touchstone(text, "fuzz.s2p", 2); break;
            case 2: d = libcoil::read_touchstone(text, "fuzz.ts", 0); break;
            default: d = libcoil::read_measurement_csv(text, "fuzz.csv"); break;
        }
        const std::size_t per = static_cast<std::size_t>(d.ports) * static_cast<std::size_t>(d.ports);
        if (d.ports < 1 || d.values.size() != d.frequency.size() * per) std::abort();
        for (std::size_t k = 0; k < d.frequency.size(); ++k) {
            if (!std::isfinite(d.frequency[k]) || (k > 0 && !(d.frequency[k] > d.frequency[k - 1]))) std::abort();
        }
        for (const auto& v : d.values) {
            if (!std::isfinite(v.real()) || !std::isfinite(v.imag())) std::abort();
        }
        for (double r : d.reference) {
            if (!std::isfinite(r)) std::abort();
        }
    } catch (const libcoil::InputError&) {
    }
    return 0;
}
