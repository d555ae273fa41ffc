// libFuzzer targets: the YAML documents a user writes (spec/spec.hpp, requirement.hpp, fixture.hpp), one
// executable each (FUZZ_DOCUMENT picks the reader). A reader must return its record or throw InputError (a
// DomainError where a figure leaves a model's domain); any other exception, a crash or a sanitizer report is
// a finding. A coil spec that parses is also written back and read again (coil_spec_yaml): the round
// trip must parse.
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <optional>
#include <string>
#include <string_view>

#include "libcoil/core/error.hpp"
#include "libcoil/spec/fixture.hpp"
#include "libcoil/spec/requirement.hpp"
#include "libcoil/spec/spec.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string_view text(reinterpret_cast<const char*>(data), size);
    try {
#if FUZZ_DOCUMENT == 0
        const libcoil::CoilSpec spec = libcoil::parse_coil_spec(text, "fuzz");
        const libcoil::Wire& w = spec.solenoid.wire();
        const std::string again = libcoil::coil_spec_yaml(spec, libcoil::WireChoice{std::nullopt, w.bare_diameter, w.insulation, std::nullopt});
        try {
            libcoil::parse_coil_spec(again, "round trip");
        } catch (const libcoil::InputError&) {
            std::abort();  // what the writer wrote must read back
        }
#elif FUZZ_DOCUMENT == 1
        libcoil::parse_requirement(text, "fuzz");
#else
        libcoil::parse_fixture(text, "fuzz");
#endif
    } catch (const libcoil::InputError&) {
    } catch (const libcoil::DomainError&) {
    }
    return 0;
}
