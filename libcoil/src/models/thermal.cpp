#include "libcoil/models/thermal.hpp"

#include <algorithm>
#include <array>
#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "models/monotone_root.hpp"

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

// Churchill & Chu's two forms: Nu = {base + 0.387 Ra^(1/6) / [1 + (c / Pr)^(9/16)]^(8/27)}^2.
struct Correlation {
    double base, c;
};
constexpr Correlation horizontal{0.60, 0.559}, vertical{0.825, 0.492};

double prandtl_factor(double pr, const Correlation& k) { return std::pow(1 + std::pow(k.c / pr, 9.0 / 16), 8.0 / 27); }

double nusselt(double ra, double base, double factor) {
    require_non_negative("rayleigh", ra);
    if (ra > 1e12) throw DomainError("Churchill & Chu: Rayleigh number " + format_value(ra) + " above 1e12 (turbulent)");
    const double s = base + 0.387 * std::sqrt(std::cbrt(ra)) / factor;  // Ra^(1/6)
    return s * s;
}

double churchill_chu(double ra, double pr, const Correlation& k) {
    require_positive("prandtl", pr);
    return nusselt(ra, k.base, prandtl_factor(pr, k));
}

constexpr double row_step = 50;  // K
constexpr bool evenly_spaced() {
    for (std::size_t i = 0; i + 1 < air_table.size(); ++i) {
        if (air_table[i + 1][0] - air_table[i][0] != row_step) return false;
    }
    return true;
}
static_assert(evenly_spaced(), "locate() assumes rows row_step apart");

// Where t falls in the table: row i and weight w towards row i + 1.
struct TableSpot {
    std::size_t i;
    double w;
};
TableSpot locate(double t) {
    require_positive("temperature", t);
    if (t < air_table.front()[0] || t > air_table.back()[0]) {
        throw DomainError("air properties: film temperature " + format_value(t - zero_celsius) +
                          " degC is outside the table (-23 .. 327 degC)");
    }
    // The rows are 50 K apart (checked at compile time below): the row comes from a division, not a search.
    const auto i = std::min(air_table.size() - 2, static_cast<std::size_t>((t - air_table.front()[0]) * (1 / row_step)));
    return {i, (t - air_table[i][0]) * (1 / row_step)};
}

AirProperties properties_at(const TableSpot& at) {
    const auto& a = air_table[at.i];
    const auto& b = air_table[at.i + 1];
    const auto lerp = [&](int c) { return a[c] + at.w * (b[c] - a[c]); };
    return AirProperties{lerp(1), lerp(2) * 1e-6, lerp(3) * 1e-6, lerp(4)};
}

// Each correlation's Prandtl factor at each row of the table, interpolated like the properties (as Pr
// itself is). Between rows it differs from the factor at the interpolated Pr by 3e-6 at most (tested), far
// inside the table's own digits, and it spares the two powers of every evaluation.
struct PrandtlFactors {
    std::array<double, air_table.size()> horizontal, vertical;
};
const PrandtlFactors& prandtl_factors() {
    static const PrandtlFactors f = [] {
        PrandtlFactors p{};
        for (std::size_t i = 0; i < air_table.size(); ++i) {
            p.horizontal[i] = prandtl_factor(air_table[i][4], horizontal);
            p.vertical[i] = prandtl_factor(air_table[i][4], vertical);
        }
        return p;
    }();
    return f;
}

}  // namespace

AirProperties air_properties(double t) { return properties_at(locate(t)); }

double churchill_chu_horizontal(double rayleigh, double prandtl) { return churchill_chu(rayleigh, prandtl, horizontal); }
double churchill_chu_vertical(double rayleigh, double prandtl) { return churchill_chu(rayleigh, prandtl, vertical); }

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
    const TableSpot at = locate(film);
    const AirProperties air = properties_at(at);
    const bool lying = s.axis == CoilAxis::horizontal;
    const double scale = lying ? s.outer_diameter : s.length;
    const double ra = gravity * (1 / film) * dt * scale * scale * scale / (air.kinematic_viscosity * air.diffusivity);
    const auto& factors = lying ? prandtl_factors().horizontal : prandtl_factors().vertical;
    const double factor = factors[at.i] + at.w * (factors[at.i + 1] - factors[at.i]);
    const double nu = nusselt(ra, lying ? horizontal.base : vertical.base, factor);
    if (rayleigh) *rayleigh = ra;
    const double h = nu * air.conductivity / scale;
    return h * pi * s.outer_diameter * s.length * dt;
}

double radiated_power(const ThermalSurface& s, double surface, double ambient) {
    require_positive("outer_diameter", s.outer_diameter);
    require_positive("length", s.length);
    if (!(s.emissivity >= 0 && s.emissivity <= 1)) throw InputError("emissivity", format_value(s.emissivity) + "; expected 0 .. 1");
    const double area = pi * s.outer_diameter * s.length;
    // T^4 - Ta^4 factored, exact near T = Ta.
    const double t = surface, ta = ambient;
    return s.emissivity * stefan_boltzmann * area * (t - ta) * (t + ta) * (t * t + ta * ta);
}

ThermalResult winding_temperature(const std::function<double(double)>& power, const ThermalSurface& surface,
                                  double ambient, double max_temperature, double tolerance,
                                  std::optional<double> shed_at_max) {
    require_positive("ambient", ambient);
    if (!(tolerance >= 1e-15 && tolerance <= 1e-3)) throw InputError("tolerance", format_value(tolerance) + "; expected 1e-15 .. 1e-3");
    ThermalResult r;
    // The balance P(T) - convected - radiated, keeping the terms of the last point evaluated.
    const auto balance = [&](double t) {
        r.temperature = t;
        r.power = power(t);
        r.convection = convected_power(surface, t, ambient, &r.rayleigh);
        r.radiation = radiated_power(surface, t, ambient);
        return r.power - r.convection - r.radiation;
    };
    const double p0 = power(ambient);
    require_non_negative("power", p0);
    if (p0 == 0) {
        r = ThermalResult{};
        r.temperature = ambient;
        return r;
    }
    const double hi = std::min(max_temperature, 2 * air_table.back()[0] - ambient);  // film <= 600 K
    // The balance falls through its root. A first guess from a total surface coefficient of about
    // 12 W/m^2 K (convection plus radiation near room temperature) starts secant steps (monotone_root.hpp);
    // the first step is Newton's with the slope estimated from the terms: the power's rise per kelvin,
    // convection as rise^(5/4) (laminar), radiation's 4 e sigma A T^3 exactly.
    const double area = pi * surface.outer_diameter * surface.length;
    const double power_slope = power(ambient + 1) - p0;
    bool first = true;
    const auto step = [&](double t) {
        const double f = balance(t);
        double s = NAN;
        if (first && t > ambient) {
            const double t3 = t * t * t;
            s = f / (power_slope - 1.25 * r.convection / (t - ambient) - 4 * surface.emissivity * stefan_boltzmann * area * t3);
        }
        first = false;
        return detail::RootStep{f, s};
    };
    double guess = ambient + p0 / (12.0 * area);
    if (shed_at_max && *shed_at_max > 0 && max_temperature <= hi) {
        // The caller knows what the surface sheds at max_temperature, S. With the power linear in T (the
        // resistivity is) and the shedding as S x^(5/4), x = (T - ambient) / (max_temperature - ambient),
        // the balance S x^(5/4) = P(ambient) + (P(max) - P(ambient)) x is solved by Newton's steps: a guess
        // good to a few per cent of the rise, where the coefficient of 12 W/m^2 K is good to tens.
        const double sh = *shed_at_max, dp = power(max_temperature) - p0;
        // From x = min(1, P(ambient) / S), left of the root of the convex balance: the first step
        // overshoots to the right, and the rest come down monotonically.
        // This simplified balance is itself good to a few per cent only, so its root is wanted to 1e-3 of
        // x: Newton's steps stop once one moves x by less than that (usually after three). The solve
        // below still meets the caller's tolerance; only its start moves.
        double x = std::min(1.0, p0 / sh);
        for (int i = 0; i < 6; ++i) {
            const double q = std::sqrt(std::sqrt(x));  // x^(1/4)
            const double g = sh * x * q - p0 - dp * x, dg = 1.25 * sh * q - dp;
            if (!(dg > 0)) break;
            const double next = std::clamp(x - g / dg, 1e-6, 1.0);
            const bool settled = std::fabs(next - x) <= 1e-3 * x;
            x = next;
            if (settled) break;
        }
        guess = ambient + x * (max_temperature - ambient);
    }
    const int bits = 1 - static_cast<int>(std::floor(std::log2(tolerance)));
    const auto t = detail::bracketed_steps(step, false, guess, {ambient, hi, p0, std::nullopt}, bits);
    if (!t) {
        throw DomainError("no thermal balance below " + format_value(hi - zero_celsius) +
                          " degC: in still air the winding would run hotter than that");
    }
    if (*t != r.temperature) balance(*t);  // the terms at the root, unless it was the last point evaluated
    r.rise = r.temperature - ambient;
    r.convection_coefficient = r.rise > 0 ? r.convection / (pi * surface.outer_diameter * surface.length * r.rise) : 0;
    return r;
}

}  // namespace libcoil
