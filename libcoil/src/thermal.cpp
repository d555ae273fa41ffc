#include "libcoil/thermal.hpp"

#include <array>
#include <cmath>
#include <cstdint>

#include <boost/math/tools/roots.hpp>

#include "libcoil/constants.hpp"
#include "libcoil/error.hpp"

namespace libcoil {

namespace {

// Incropera & DeWitt, Table A.4 (air at 1 atm), quoted from memory: T (K), k (W/m K), nu (1e-6 m^2/s),
// alpha (1e-6 m^2/s), Pr.
constexpr std::array<std::array<double, 5>, 8> air_table{{
    {250, 0.0223, 11.44, 15.9, 0.720},
    {300, 0.0263, 15.89, 22.5, 0.707},
    {350, 0.0300, 20.92, 29.9, 0.700},
    {400, 0.0338, 26.41, 38.3, 0.690},
    {450, 0.0373, 32.39, 47.2, 0.686},
    {500, 0.0407, 38.79, 56.7, 0.684},
    {550, 0.0439, 45.57, 66.7, 0.683},
    {600, 0.0469, 52.69, 76.9, 0.685},
}};

double churchill_chu(double ra, double pr, double base, double pr_constant) {
    require_non_negative("rayleigh", ra);
    require_positive("prandtl", pr);
    if (ra > 1e12) throw DomainError("Churchill & Chu: Rayleigh number " + format_value(ra) + " above 1e12 (turbulent)");
    const double f = std::pow(1 + std::pow(pr_constant / pr, 9.0 / 16), 8.0 / 27);
    const double s = base + 0.387 * std::pow(ra, 1.0 / 6) / f;
    return s * s;
}

}  // namespace

AirProperties air_properties(double t) {
    require_positive("temperature", t);
    if (t < air_table.front()[0] || t > air_table.back()[0]) {
        throw DomainError("air properties: film temperature " + format_value(t - zero_celsius) +
                          " degC is outside the table (-23 .. 327 degC)");
    }
    std::size_t i = 0;
    while (i + 2 < air_table.size() && t > air_table[i + 1][0]) ++i;
    const auto& a = air_table[i];
    const auto& b = air_table[i + 1];
    const double w = (t - a[0]) / (b[0] - a[0]);
    const auto lerp = [&](int c) { return a[c] + w * (b[c] - a[c]); };
    return AirProperties{lerp(1), lerp(2) * 1e-6, lerp(3) * 1e-6, lerp(4)};
}

double churchill_chu_horizontal(double rayleigh, double prandtl) { return churchill_chu(rayleigh, prandtl, 0.60, 0.559); }
double churchill_chu_vertical(double rayleigh, double prandtl) { return churchill_chu(rayleigh, prandtl, 0.825, 0.492); }

double convected_power(const ThermalSurface& s, double surface, double ambient, double* rayleigh) {
    require_positive("outer_diameter", s.outer_diameter);
    require_positive("length", s.length);
    require_positive("ambient", ambient);
    require_positive("surface", surface);
    const double dt = surface - ambient;
    if (dt <= 0) {
        if (rayleigh) *rayleigh = 0;
        return 0;
    }
    const double film = 0.5 * (surface + ambient);
    const AirProperties air = air_properties(film);
    const double scale = s.axis == CoilAxis::horizontal ? s.outer_diameter : s.length;
    const double ra = gravity * (1 / film) * dt * scale * scale * scale / (air.kinematic_viscosity * air.diffusivity);
    const double nu = s.axis == CoilAxis::horizontal ? churchill_chu_horizontal(ra, air.prandtl)
                                                     : churchill_chu_vertical(ra, air.prandtl);
    if (rayleigh) *rayleigh = ra;
    const double h = nu * air.conductivity / scale;
    return h * pi * s.outer_diameter * s.length * dt;
}

double radiated_power(const ThermalSurface& s, double surface, double ambient) {
    require_positive("outer_diameter", s.outer_diameter);
    require_positive("length", s.length);
    if (!(s.emissivity >= 0 && s.emissivity <= 1)) throw InputError("emissivity", format_value(s.emissivity) + "; expected 0 .. 1");
    const double area = pi * s.outer_diameter * s.length;
    return s.emissivity * stefan_boltzmann * area * (std::pow(surface, 4) - std::pow(ambient, 4));
}

ThermalResult winding_temperature(const std::function<double(double)>& power, const ThermalSurface& surface,
                                  double ambient, double max_temperature) {
    require_positive("ambient", ambient);
    const auto balance = [&](double t) {
        return power(t) - convected_power(surface, t, ambient) - radiated_power(surface, t, ambient);
    };
    const double p0 = power(ambient);
    require_non_negative("power", p0);
    ThermalResult r;
    if (p0 == 0) {
        r.temperature = ambient;
        return r;
    }
    const double hi = std::min(max_temperature, 2 * air_table.back()[0] - ambient);  // film <= 600 K
    const double b_hi = balance(hi);
    if (b_hi > 0) {
        throw DomainError("the winding would pass " + format_value(hi - zero_celsius) +
                          " degC in still air: far beyond any enamel or former");
    }
    // A first guess from a total surface coefficient of about 12 W/m^2 K (convection plus radiation near
    // room temperature) narrows the bracket; it is widened back to [ambient, hi] if the guess misses.
    double lo = ambient, top = hi, f_lo = p0, f_top = b_hi;
    const double guess = ambient + p0 / (12.0 * pi * surface.outer_diameter * surface.length);
    for (double t : {0.7 * (guess - ambient) + ambient, 1.4 * (guess - ambient) + ambient}) {
        if (t <= lo || t >= top) continue;
        const double b = balance(t);
        if (b > 0) {
            lo = t;
            f_lo = b;
        } else {
            top = t;
            f_top = b;
        }
    }
    std::uintmax_t it = 200;
    const auto root = boost::math::tools::toms748_solve(balance, lo, top, f_lo, f_top,
                                                        boost::math::tools::eps_tolerance<double>(36), it);
    r.temperature = 0.5 * (root.first + root.second);
    r.rise = r.temperature - ambient;
    r.power = power(r.temperature);
    r.convection = convected_power(surface, r.temperature, ambient, &r.rayleigh);
    r.radiation = radiated_power(surface, r.temperature, ambient);
    r.convection_coefficient = r.rise > 0 ? r.convection / (pi * surface.outer_diameter * surface.length * r.rise) : 0;
    return r;
}

}  // namespace libcoil
