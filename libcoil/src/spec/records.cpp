#include "libcoil/spec/records.hpp"

#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"

namespace libcoil {

void validate_band(const BandSpec& b) {
    require_positive("band.low", b.low);
    require_positive("band.ceiling", b.ceiling);
    if (!(b.ceiling > b.low)) {
        throw InputError("band.ceiling", format_quantity(b.ceiling, Dimension::frequency) + " is not above band.low (" +
                                             format_quantity(b.low, Dimension::frequency) + "); expected the top of the band");
    }
    if (b.srf_margin) {
        require_finite("band.srf_margin", *b.srf_margin);
        require_at_least("band.srf_margin", *b.srf_margin, 1.0,
                         "the self-resonance must lie at least at the ceiling (a factor >= 1)");
    }
    if (b.max_deviation) require_positive("band.max_deviation", *b.max_deviation);
    if (b.min_impedance) require_positive("band.min_impedance", *b.min_impedance);
}

}  // namespace libcoil
