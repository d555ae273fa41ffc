// Quantities with units, parsed only at the edges (YAML specs, the command line).
//
// Inside libcoil every value is a plain SI double. parse_quantity turns "25 mm", "0.98 in", "1.2 uH",
// "1.2 µH", "108 MHz", "25 degC" or "2 %" into SI for a field of known dimension. A bare number is SI.
// format_quantity does the reverse for reports, in engineering notation.
#pragma once

#include <string>
#include <string_view>

namespace libcoil {

enum class Dimension {
    dimensionless,  // plain numbers, "%", "ppm"
    length,         // m
    inductance,     // H
    capacitance,    // F
    frequency,      // Hz
    current,        // A
    voltage,        // V
    resistance,     // ohm
    power,          // W
    temperature,    // K (also degC, degF)
    time,           // s
};

// "a length", "an inductance", ...
std::string_view dimension_noun(Dimension d);
// An example of a valid entry, used in error messages: "2 mm", "1.2 uH", ...
std::string_view dimension_example(Dimension d);
// The SI unit symbol ("m", "H", "ohm" is written as the Ohm sign).
std::string_view si_unit(Dimension d);

// Parses `text` as a quantity of dimension `d` and returns it in SI. Throws InputError naming `field`:
//   coil.pitch: "2 mn": unknown unit "mn"; expected a length such as "2 mm"
double parse_quantity(std::string_view text, Dimension d, std::string_view field);

// Formats an SI value in engineering notation with `digits` significant digits: "1.234 uH" is written
// "1.234 µH". Temperatures are written in degrees Celsius.
std::string format_quantity(double value, Dimension d, int digits = 4);

}  // namespace libcoil
