// Errors raised by libcoil.
//
// InputError names the input field (a YAML path such as "coil.pitch", or an argument name), the offending
// value and what was expected. Every public function validates its inputs and throws InputError rather than
// let a NaN or an infinity escape. DomainError marks a request that is valid input but lies outside the
// domain of every model that could answer it.
#pragma once

#include <cmath>
#include <stdexcept>
#include <string>
#include <string_view>

namespace libcoil {

class InputError : public std::invalid_argument {
public:
    InputError(std::string field, std::string detail);

    // The field, e.g. "coil.pitch"; empty when the error concerns the whole input.
    const std::string& field() const noexcept { return field_; }
    // The message without the field prefix.
    const std::string& detail() const noexcept { return detail_; }
    // The same error with the field placed under `prefix` ("pitch" within "coil" is "coil.pitch").
    InputError within(std::string_view prefix) const;

private:
    std::string field_;
    std::string detail_;
};

class DomainError : public std::domain_error {
public:
    using std::domain_error::domain_error;
};

// Formats a double for messages with up to 6 significant digits ("nan", "inf" spelled out).
std::string format_value(double value);
// The user's text for a message, in double quotes: control bytes and bytes that are not UTF-8 escaped
// (\x1b, \xff), cut to 60 characters.
std::string quoted(std::string_view text);

namespace detail {
[[noreturn]] void throw_not_finite(std::string_view field, double value);
[[noreturn]] void throw_not_positive(std::string_view field, double value);
[[noreturn]] void throw_negative(std::string_view field, double value);
[[noreturn]] void throw_below(std::string_view field, double value, double minimum, std::string_view why);
[[noreturn]] void throw_not_finite_result(std::string_view model, double value);
}  // namespace detail

// Validation helpers used by every public entry point. They throw InputError naming `field`. The checks
// are inline (they sit on every hot path); the messages are built only when they throw.
inline double require_finite(std::string_view field, double value) {
    if (!std::isfinite(value)) detail::throw_not_finite(field, value);
    return value;
}
inline double require_positive(std::string_view field, double value) {  // finite and > 0
    if (!(value > 0 && std::isfinite(value))) detail::throw_not_positive(field, value);
    return value;
}
inline double require_non_negative(std::string_view field, double value) {  // finite and >= 0
    if (!(value >= 0 && std::isfinite(value))) detail::throw_negative(field, value);
    return value;
}
inline double require_at_least(std::string_view field, double value, double minimum, std::string_view why) {
    require_finite(field, value);
    if (value < minimum) detail::throw_below(field, value, minimum, why);
    return value;
}
// The bounds past which no model of the library means anything (common practice, no source): frequencies to
// 100 GHz, wire temperatures to 1000 degC (past every enamel, short of copper's melting at 1085 degC),
// currents to 10 kA.
inline constexpr double max_model_frequency = 100e9;     // Hz
inline constexpr double max_model_temperature = 1273.15;  // K
inline constexpr double max_model_current = 10e3;        // A
// Finite, above zero and within max_model_frequency; InputError naming `field` otherwise.
double require_frequency(std::string_view field, double hz);
// Finite, above absolute zero and within max_model_temperature; InputError naming `field` otherwise.
double require_temperature(std::string_view field, double kelvin);

// A model's result must be finite: inputs that are each valid can still overflow (a 1e200 m coil).
// Throws DomainError naming the model when it is not.
inline double finite_result(std::string_view model, double value) {
    if (!std::isfinite(value)) detail::throw_not_finite_result(model, value);
    return value;
}

}  // namespace libcoil
