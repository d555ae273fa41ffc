#include "libcoil/analysis.hpp"

namespace libcoil {

Analysis analyze(const CoilSpec& spec) {
    Analysis a{spec, inductance(spec.solenoid), {}, spec.notes};
    a.warnings = a.inductance.warnings;
    return a;
}

}  // namespace libcoil
