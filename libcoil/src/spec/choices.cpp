#include "libcoil/spec/choices.hpp"

#include <array>

#include "libcoil/core/error.hpp"

namespace libcoil {

namespace {

constexpr std::array<Choice<Mounting>, 2> mountings{{
    {Mounting::floating, "floating", "both terminals free of ground"},
    {Mounting::grounded_end, "grounded-end", "one terminal on a ground plane, driven against it"},
}};
constexpr std::array<Choice<FormerKind>, 2> former_kinds{{
    {FormerKind::grooved_tube, "grooved-tube", "a tube with a helical groove"},
    {FormerKind::ribbed, "ribbed", "axial ribs on a hub, grooved"},
}};
constexpr std::array<Choice<GrooveProfile>, 2> groove_profiles{{
    {GrooveProfile::round, "round", "a round-bottomed groove that fits the wire"},
    {GrooveProfile::vee, "vee", "a vee groove"},
}};
constexpr std::array<Choice<TurnCapacitance>, 3> turn_capacitances{{
    {TurnCapacitance::thin_wire, "thin-wire", "a line charge on each turn's axis"},
    {TurnCapacitance::wire_surface, "wire-surface", "the charge on each wire's surface and its enamel, solved whole"},
    {TurnCapacitance::near_field_corrected, "near-field-corrected", "the thin wire, corrected by the wire surface on a section of turns"},
}};

constexpr std::array<Choice<ImpedanceModel>, 3> impedance_models{{
    {ImpedanceModel::helical_line, "helical-line", "the winding as a distributed line, resonating at the recommended SRF"},
    {ImpedanceModel::lumped, "lumped", "(R + jwL) in parallel with the self-capacitance"},
    {ImpedanceModel::network, "network", "the turn network: Z(f) with every resonance of the coupled turns"},
}};
constexpr std::array<Choice<CapacitanceSource>, 2> capacitance_sources{{
    {CapacitanceSource::helical_line, "helical-line", "the helical line's self-capacitance"},
    {CapacitanceSource::medhurst, "medhurst", "Medhurst's measured self-capacitance (lumped model only)"},
}};
constexpr std::array<Choice<LossSolver>, 3> loss_solvers{{
    {LossSolver::harmonics, "harmonics", "Bessel harmonics of every wire's current: skin and proximity effect together (the default)"},
    {LossSolver::closed_form, "closed-form", "Bessel skin effect and Butterworth proximity effect"},
    {LossSolver::filaments, "filaments", "the numerical cross-section solver"},
}};
constexpr std::array<Choice<Arrangement>, 2> arrangements{{
    {Arrangement::coaxial, "coaxial", "on one axis"},
    {Arrangement::side_by_side, "side-by-side", "parallel axes"},
}};
constexpr std::array<Choice<MeasurementArrangement>, 3> measurement_arrangements{{
    {MeasurementArrangement::reflection, "reflection", "one port at the coil's terminals: Z = Z0 (1 + S11) / (1 - S11)"},
    {MeasurementArrangement::series_through, "series-through", "the coil in series between two ports: Z = 2 Z0 (1 - S21) / S21"},
    {MeasurementArrangement::shunt_through, "shunt-through", "the coil from the through line to ground: Z = Z0 S21 / (2 (1 - S21))"},
}};
constexpr std::array<Choice<Spacing>, 2> spacings{{
    {Spacing::logarithmic, "log", "logarithmic"},
    {Spacing::linear, "linear", "linear"},
}};

template <class E, std::size_t N>
const char* name_in(const std::array<Choice<E>, N>& table, E value) {
    for (const auto& c : table) {
        if (c.value == value) return c.name;
    }
    return "?";
}

template <class E, std::size_t N>
E parse_in(const std::array<Choice<E>, N>& table, std::string_view text, std::string_view field) {
    std::string allowed;
    for (const auto& c : table) {
        if (text == c.name) return c.value;
        allowed += (allowed.empty() ? "\"" : ", \"") + std::string(c.name) + "\"";
    }
    throw InputError(std::string(field), quoted(text) + "; expected one of " + allowed);
}

}  // namespace

#define LIBCOIL_CHOICES(E, table)                                                                   \
    template <>                                                                                     \
    std::span<const Choice<E>> choices<E>() {                                                       \
        return table;                                                                               \
    }                                                                                               \
    template <>                                                                                     \
    const char* choice_name<E>(E value) {                                                           \
        return name_in(table, value);                                                               \
    }                                                                                               \
    template <>                                                                                     \
    E parse_choice<E>(std::string_view text, std::string_view field) {                             \
        return parse_in(table, text, field);                                                        \
    }

LIBCOIL_CHOICES(Mounting, mountings)
LIBCOIL_CHOICES(FormerKind, former_kinds)
LIBCOIL_CHOICES(GrooveProfile, groove_profiles)
LIBCOIL_CHOICES(ImpedanceModel, impedance_models)
LIBCOIL_CHOICES(TurnCapacitance, turn_capacitances)
LIBCOIL_CHOICES(CapacitanceSource, capacitance_sources)
LIBCOIL_CHOICES(LossSolver, loss_solvers)
LIBCOIL_CHOICES(Arrangement, arrangements)
LIBCOIL_CHOICES(Spacing, spacings)
LIBCOIL_CHOICES(MeasurementArrangement, measurement_arrangements)

#undef LIBCOIL_CHOICES

}  // namespace libcoil
