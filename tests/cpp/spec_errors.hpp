// Test helper: the message a spec's parse error carries, or "(no error)".
#pragma once

#include <string>

#include "libcoil/core/error.hpp"
#include "libcoil/spec/spec.hpp"

inline std::string error_of(const std::string& yaml) {
    try {
        libcoil::parse_coil_spec(yaml, "test.yaml");
    } catch (const libcoil::InputError& e) {
        return e.what();
    }
    return "(no error)";
}
