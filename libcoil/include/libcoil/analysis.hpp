// One coil, analysed: the geometry and every model's result, ready for a report.
#pragma once

#include <string>
#include <vector>

#include "libcoil/inductance.hpp"
#include "libcoil/spec.hpp"

namespace libcoil {

struct Analysis {
    CoilSpec spec;
    InductanceResult inductance;
    std::vector<std::string> warnings;  // everything a reader must see: domains, fall-backs, cautions
    std::vector<std::string> notes;     // assumptions
};

Analysis analyze(const CoilSpec& spec);

}  // namespace libcoil
