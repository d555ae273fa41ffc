#include "libcoil/models/skin_effect.hpp"

#include <cmath>
#include <numbers>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/kelvin.hpp"
#include "models/wire_bessel.hpp"
#include "models/wire_kernels.hpp"

namespace libcoil {

double skin_depth(double resistivity, double frequency, double mu_r) {
    require_positive("resistivity", resistivity);
    require_positive("frequency", frequency);
    require_positive("relative_permeability", mu_r);
    return finite_result("skin depth", std::sqrt(resistivity / (pi * frequency * mu0 * mu_r)));
}

SkinRatios skin_ratios(double x) {
    require_non_negative("x", x);
    const detail::WireKernels k = detail::wire_kernels(x);
    return {finite_result("skin ratio", k.resistance), finite_result("skin ratio", k.internal_inductance)};
}

SkinRatios skin_ratios_series(double x) {
    require_non_negative("x", x);
    if (x < 1e-3) {
        const double x4 = x * x * x * x;
        return {1 + x4 / 192, 1 - x4 / 384};
    }
    return detail::skin_ratios_from(scaled_kelvin_bessel(x), x);
}

SkinRatios detail::skin_ratios_from(const ScaledBesselPair& s, double x) {
    // Scaled alike, so the scale cancels in every ratio.
    const double ber = s.j0.real(), bei = s.j0.imag(), berp = s.d.real(), beip = s.d.imag();
    const double den = berp * berp + beip * beip;
    return {finite_result("skin ratio", x / 2 * (ber * beip - bei * berp) / den),
            finite_result("skin ratio", 4 / x * (ber * berp + bei * beip) / den)};
}

SkinRatios wire_skin_ratios(double r, double rho, double f, double mu_r) {
    require_positive("wire_radius", r);
    require_non_negative("frequency", f);
    if (f == 0) return {};
    return skin_ratios(std::numbers::sqrt2 * r / skin_depth(rho, f, mu_r));
}

double dc_internal_inductance_per_length(double mu_r) {
    require_positive("relative_permeability", mu_r);
    return mu0 * mu_r / (8 * pi);
}

}  // namespace libcoil
