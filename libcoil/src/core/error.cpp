#include "libcoil/core/error.hpp"

#include "libcoil/core/constants.hpp"

#include <cmath>
#include <cstdio>

#include "core/utf8.hpp"

namespace libcoil {

namespace {
std::string compose(const std::string& field, const std::string& detail) {
    return field.empty() ? detail : field + ": " + detail;
}
}  // namespace

InputError::InputError(std::string field, std::string detail)
    : std::invalid_argument(compose(field, detail)), field_(std::move(field)), detail_(std::move(detail)) {}

InputError InputError::within(std::string_view prefix) const {
    std::string f(prefix);
    if (!field_.empty()) {
        f += f.empty() ? field_ : "." + field_;
    }
    return InputError(f, detail_);
}

std::string format_value(double value) {
    if (std::isnan(value)) return "nan";
    if (std::isinf(value)) return value > 0 ? "inf" : "-inf";
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.6g", value);
    return buf;
}

std::string quoted(std::string_view text) {
    constexpr std::size_t longest = 60;  // characters
    std::string o = "\"";
    std::size_t shown = 0;
    for (std::size_t i = 0; i < text.size(); ++shown) {
        if (shown == longest) {
            o += "...";
            break;
        }
        const auto u = static_cast<unsigned char>(text[i]);
        const std::size_t n = detail::utf8_length(text, i);
        if (n == 0 || u < 0x20 || u == 0x7f) {  // control bytes and bytes that are not UTF-8, escaped
            char buf[8];
            std::snprintf(buf, sizeof buf, "\\x%02x", u);
            o += buf;
            ++i;
        } else {
            o.append(text.substr(i, n));
            i += n;
        }
    }
    return o + "\"";
}

namespace detail {

[[noreturn]] void throw_not_finite(std::string_view field, double value) {
    throw InputError(std::string(field), format_value(value) + " is not a finite number");
}

[[noreturn]] void throw_not_positive(std::string_view field, double value) {
    if (!std::isfinite(value)) throw_not_finite(field, value);
    throw InputError(std::string(field), format_value(value) + " must be greater than zero");
}

[[noreturn]] void throw_negative(std::string_view field, double value) {
    if (!std::isfinite(value)) throw_not_finite(field, value);
    throw InputError(std::string(field), format_value(value) + " must not be negative");
}

}  // namespace detail

double require_frequency(std::string_view field, double hz) {
    require_positive(field, hz);
    if (hz > max_model_frequency) throw InputError(std::string(field), format_value(hz) + " is beyond 100 GHz, where no model of a wound coil holds");
    return hz;
}

double require_temperature(std::string_view field, double kelvin) {
    require_finite(field, kelvin);
    if (!(kelvin > 0)) {
        throw InputError(std::string(field), "at or below absolute zero: " + format_value(kelvin) + " K (" + format_value(kelvin - zero_celsius) + " degC)");
    }
    if (kelvin > max_model_temperature) {
        throw InputError(std::string(field), "beyond 1000 degC (copper melts at 1085 degC): " + format_value(kelvin) + " K (" +
                                                 format_value(kelvin - zero_celsius) + " degC)");
    }
    return kelvin;
}

void detail::throw_below(std::string_view field, double value, double minimum, std::string_view why) {
    throw InputError(std::string(field), format_value(value) + " is below " + format_value(minimum) + ": " + std::string(why));
}

void detail::throw_not_finite_result(std::string_view model, double value) {
    throw DomainError(std::string(model) + ": the inputs are outside the range this model can evaluate in "
                      "double precision (result " + format_value(value) + ")");
}

}  // namespace libcoil
