// The words a user may choose from: every enumerated option of a spec, a requirement or a study, with
// its names, in one table. The YAML reader, the `coil` command and the Python module all parse through
// it, so that each accepts and rejects the same words; none keeps a list of its own.
//
//   parse_choice<Mounting>("grounded-end", "surroundings.mounting")   -> Mounting::grounded_end
//   parse_choice<Mounting>("ground", "mounting")                      -> InputError naming "mounting"
//   choice_name(Mounting::floating)                                   -> "floating"
//   choice_names<Mounting>()                                          -> {"floating", "grounded-end"}
//
// The field name is the caller's: a YAML path in a spec, an option in a front end. The library itself
// never names a command-line flag.
#pragma once

#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace libcoil {

// How the coil meets ground: both terminals free (half-wave resonance), or one on a ground plane.
enum class Mounting { floating, grounded_end };
// The printed former: a tube with a helical groove, or axial ribs with grooves cut in them.
enum class FormerKind { grooved_tube, ribbed };
// The groove's section.
enum class GrooveProfile { round, vee };
// Z(f) between the terminals: the distributed helical line, (R + jwL) parallel C, or the turn network
// (every resonance of the coupled turns).
enum class ImpedanceModel { helical_line, lumped, network };
// Where the lumped model takes its self-capacitance from.
enum class CapacitanceSource { helical_line, medhurst };
// How the losses are computed: closed forms, or the numerical cross-section solver.
enum class LossSolver { harmonics, closed_form, filaments };
// Two coils: on one axis, or side by side with parallel axes.
enum class Arrangement { coaxial, side_by_side };
// A frequency grid's spacing.
enum class Spacing { logarithmic, linear };
// How a measured file holds the coil (measurement.hpp): one port at its terminals, or between two ports
// in series, or from the through line to ground (shunt).
enum class MeasurementArrangement { reflection, series_through, shunt_through };
// How the turn network takes the turns' capacitances (turn_network.hpp):
//  thin_wire             a line charge on each turn's axis (as NEC2's thin-wire kernel);
//  wire_surface          the charge on each wire's true surface and its enamel (axisymmetric_charge.hpp):
//                        the reference, at (40 N)^3 cost; no former (the wires' contact with it is not
//                        resolved: refused);
//  near_field_corrected  the thin wire (with the former's polarisation) plus the wire surface's difference
//                        solved on a section of 7 turns in free space (the crowding of charge towards the
//                        neighbours and the enamel between them act within a few turns); a coil of up to
//                        7 turns is its own section.
enum class TurnCapacitance { thin_wire, wire_surface, near_field_corrected };

template <class E>
struct Choice {
    E value;
    const char* name;     // the word the user writes
    const char* meaning;  // one line, for help texts
};

template <class E>
std::span<const Choice<E>> choices();

// The word for a value.
template <class E>
const char* choice_name(E value);

// The value for a word; anything else is an InputError naming `field`, quoting the word and listing the
// words allowed.
template <class E>
E parse_choice(std::string_view text, std::string_view field);

// The tables live in choices.cpp; these declare the ones there are.
#define LIBCOIL_DECLARE_CHOICES(E)                                    \
    template <>                                                       \
    std::span<const Choice<E>> choices<E>();                          \
    template <>                                                       \
    const char* choice_name<E>(E value);                              \
    template <>                                                       \
    E parse_choice<E>(std::string_view text, std::string_view field);
LIBCOIL_DECLARE_CHOICES(Mounting)
LIBCOIL_DECLARE_CHOICES(FormerKind)
LIBCOIL_DECLARE_CHOICES(GrooveProfile)
LIBCOIL_DECLARE_CHOICES(ImpedanceModel)
LIBCOIL_DECLARE_CHOICES(TurnCapacitance)
LIBCOIL_DECLARE_CHOICES(MeasurementArrangement)
LIBCOIL_DECLARE_CHOICES(CapacitanceSource)
LIBCOIL_DECLARE_CHOICES(LossSolver)
LIBCOIL_DECLARE_CHOICES(Arrangement)
LIBCOIL_DECLARE_CHOICES(Spacing)
#undef LIBCOIL_DECLARE_CHOICES

template <class E>
std::vector<std::string> choice_names() {
    std::vector<std::string> out;
    for (const auto& c : choices<E>()) out.emplace_back(c.name);
    return out;
}

// The names the reports have always used.
inline const char* mounting_name(Mounting m) { return choice_name(m); }
inline const char* former_kind_name(FormerKind k) { return choice_name(k); }
inline const char* impedance_model_name(ImpedanceModel m) { return choice_name(m); }
inline const char* arrangement_name(Arrangement a) { return choice_name(a); }

}  // namespace libcoil
