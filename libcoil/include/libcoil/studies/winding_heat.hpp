// The winding's temperature under its current: one computation for `coil analyze` and the design search.
//
// The loss is I^2 R(T), with R(T) the DC resistance at the wire temperature T times the AC/DC ratio of the
// current's frequency taken at ambient (skin and proximity, losses.hpp); the winding sheds it from its
// outer cylinder by natural convection and radiation (thermal.hpp: outer diameter, overall length,
// emissivity 0.85, horizontal axis, still air). The limit is the enamel's thermal class or the former's
// service temperature, whichever is lower.
#pragma once

#include <optional>
#include <string>

#include "libcoil/models/materials.hpp"
#include "libcoil/spec/choices.hpp"
#include "libcoil/models/solenoid.hpp"
#include "libcoil/models/thermal.hpp"

namespace libcoil {

// I^2 R(T) of one coil, with the factors that do not depend on T taken once.
struct WindingHeat {
    double per_resistivity = 0;  // W per (ohm m): I^2 (R_ac / R_dc) R_dc(T) / rho(T)
    const Conductor* conductor = nullptr;  // the caller's (a search evaluates millions: no copy)
    ThermalSurface surface;
    double ambient = 0;  // K
    double limit = 0;    // K

    double power(double temperature) const { return per_resistivity * conductor->resistivity_at(temperature); }
};

// `current_frequency`: the current's frequency (nothing or 0: DC). `limit`: the lower of the enamel's
// class and the former's service temperature, K. `conductor` must outlive the result. `ac_ratio`: the
// winding's R_ac / R_dc at that frequency from elsewhere (the wire-harmonic solver's); not given, the
// closed forms' at the ambient temperature.
WindingHeat winding_heat(const Solenoid& coil, const Conductor& conductor, double current,
                         std::optional<double> current_frequency, double ambient, double limit,
                         std::optional<double> ac_ratio = std::nullopt);
// R_ac / R_dc of the winding at `frequency` and `temperature` by `solver` (losses.hpp's
// coil_at_frequencies_by), what the analysis and the search's last step heat it with where a solver is
// the loss model (default_loss_solver).
double ac_ratio_by(LossSolver solver, const Solenoid& coil, const Conductor& conductor, double temperature, double frequency);

struct WindingTemperature {
    bool over_limit = false;  // the winding would settle above its limit (or run away)
    double excess = 0;        // over the limit: the power over what the winding sheds at the limit (> 1)
    double temperature = 0;   // K, the balance (within [ambient, limit] unless over_limit)
    double rise = 0;          // K above ambient
    double power = 0;         // W at that temperature
    bool runaway = false;     // no balance below 500 degC
};

// The balance to a relative `tolerance` on T. Below the limit, one evaluation at the limit decides first
// (a winding that dissipates more there than it sheds settles above it). `settle_above_limit`: find the
// balance above the limit too (an analysis reports it; a search needs only the verdict).
WindingTemperature settle_winding(const WindingHeat& heat, double tolerance, bool settle_above_limit);

// The words that name the limit: "enamel class 155 °C" or "PETG former, 65 °C".
std::string winding_limit_source(double enamel_class, const std::optional<FormerMaterial>& former);

}  // namespace libcoil
