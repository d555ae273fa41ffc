// Steady-state temperature of a winding in still air: I^2 R(T) against natural convection and radiation.
//
// Method:  the winding is a cylinder of its outer diameter and overall length. Heat leaves its outer
//          surface by natural convection (Churchill & Chu: a horizontal cylinder, or for an upright coil a
//          vertical plate of the coil's length) and by grey-body radiation to surroundings at ambient,
//          q = eps sigma A (Ts^4 - Ta^4). Air properties at the film temperature (Ts + Ta) / 2,
//          beta = 1 / T_film. The loss P(T) grows with the wire temperature (R(T)); the balance
//          P(T) = q_conv(T) + q_rad(T) is solved for T by secant steps in a bracket (TOMS 748 as the
//          fallback; monotone_root.hpp). The winding is taken at one
//          temperature (its surface); the inner surface, the former's own conduction and the ends are
//          left out, which errs towards a hotter estimate.
// Source:  S. W. Churchill and H. H. S. Chu, Int. J. Heat Mass Transfer 18 (1975) 1049 (horizontal
//          cylinder) and 1323 (vertical plate); air properties from the table of F. P. Incropera and
//          D. P. DeWitt, "Fundamentals of Heat and Mass Transfer", Table A.4, quoted from memory.
// Domain:  still air, no enclosure, 1e-5 <= Ra <= 1e12, 250 K <= film temperature <= 600 K. It is an
//          estimate for a first check, not a rating.
// Accuracy: the balance is solved to 3e-11 in T by default, 1e-9 in power (tested). Churchill & Chu against Morgan's
//          correlation (Nu = 0.48 Ra^0.25, 1e4 <= Ra <= 1e7): -9.1 % .. +4.5 %; the vertical form against
//          0.59 Ra^0.25 (1e5 .. 1e8): -12.4 % .. +3.3 % (tests/cpp/test_thermal.cpp). Such correlations
//          are good to 10-20 % for real coils, whose surface is neither smooth nor isothermal.
#pragma once

#include <functional>
#include <optional>

namespace libcoil {

inline constexpr double stefan_boltzmann = 5.670374419e-8;  // W m^-2 K^-4, exact (CODATA 2018)
inline constexpr double gravity = 9.80665;                    // m s^-2, standard

struct AirProperties {
    double conductivity = 0;         // W/(m K)
    double kinematic_viscosity = 0;  // m^2/s
    double diffusivity = 0;          // m^2/s
    double prandtl = 0;
};
// Dry air at 1 atm, linear between the table's rows (250 .. 600 K). Throws DomainError outside.
AirProperties air_properties(double temperature);

// Churchill & Chu's Nusselt numbers: horizontal cylinder (on the diameter), vertical plate (on the height).
double churchill_chu_horizontal(double rayleigh, double prandtl);
double churchill_chu_vertical(double rayleigh, double prandtl);

enum class CoilAxis { horizontal, vertical };

struct ThermalSurface {
    double outer_diameter = 0;  // m
    double length = 0;          // m, the winding's overall length
    double emissivity = 0.85;   // of the enamelled winding (a typical value for polymer films; bare copper ~0.05)
    CoilAxis axis = CoilAxis::horizontal;
};

struct ThermalResult {
    double temperature = 0;  // K, the winding
    double rise = 0;         // K above ambient
    double power = 0;        // W dissipated at that temperature
    double convection = 0;   // W
    double radiation = 0;    // W
    double convection_coefficient = 0;  // W/(m^2 K)
    double rayleigh = 0;
};

// Convected and radiated power (W) of the surface at `surface` K in air at `ambient` K.
double convected_power(const ThermalSurface& s, double surface, double ambient, double* rayleigh = nullptr);
double radiated_power(const ThermalSurface& s, double surface, double ambient);

inline constexpr double default_max_temperature = 773.15;  // K (500 degC): beyond any enamel or former

// Steady state for a loss `power(T)` (W, at wire temperature T), to a relative `tolerance` on T.
// Throws DomainError when no balance exists below `max_temperature` (the winding would run away).
// `shed_at_max`, where the caller has it, is convected_power + radiated_power at max_temperature: it
// gives the solver a first guess good to a few per cent of the rise, one evaluation fewer.
ThermalResult winding_temperature(const std::function<double(double)>& power, const ThermalSurface& surface,
                                  double ambient, double max_temperature = default_max_temperature, double tolerance = 3e-11,
                                  std::optional<double> shed_at_max = std::nullopt);

}  // namespace libcoil
