#include "libcoil/studies/measurement.hpp"

#include <algorithm>
#include <cmath>
#include <complex>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"

namespace libcoil {

namespace {

using cd = std::complex<double>;

constexpr double good_error = 0.01, poor_error = 0.05;

std::string hz(double f) { return format_quantity(f, Dimension::frequency, 3); }

// Where Im(v) passes zero from below between points k and k + 1: f by linear interpolation.
std::optional<double> rising_zero(const std::vector<double>& f, const std::vector<cd>& v, std::size_t from, std::size_t& at) {
    for (std::size_t k = from; k + 1 < f.size(); ++k) {
        const double a = v[k].imag(), b = v[k + 1].imag();
        if (a < 0 && b >= 0) {
            at = k;
            return f[k] + (f[k + 1] - f[k]) * (-a) / (b - a);
        }
    }
    return std::nullopt;
}

void check_fixture(const Fixture& fx, MeasurementArrangement arrangement, double z0) {
    require_non_negative("fixture_inductance", fx.series_inductance);
    require_non_negative("fixture_capacitance", fx.shunt_capacitance);
    if (!fx.network) return;
    const NetworkData& x = *fx.network;
    if (arrangement != MeasurementArrangement::reflection) {
        throw InputError("fixture", "a fixture file is removed from a reflection measurement only; give a through fixture as its series L and shunt C");
    }
    if (x.ports != 2 || x.parameter != 'S') throw InputError("fixture", "expected a 2-port file of S parameters (port 1 at the analyser, port 2 at the coil)");
    const double xz0 = x.reference.empty() ? 50.0 : x.reference[0];
    if (xz0 != z0) throw InputError("fixture", "its reference (" + format_value(xz0) + " ohm) differs from the measurement's (" + format_value(z0) + " ohm)");
}

}  // namespace

MeasuredImpedance measured_impedance(const NetworkData& d, MeasurementArrangement arrangement, const Fixture& fixture) {
    MeasuredImpedance out;
    out.notes = d.notes;
    const double z0 = d.reference.empty() ? 50.0 : d.reference[0];
    const bool through = arrangement != MeasurementArrangement::reflection;
    if (!through && d.ports != 1) throw InputError("arrangement", "reflection reads a 1-port file; this one has " + std::to_string(d.ports) + " ports");
    if (through && (d.ports != 2 || d.parameter != 'S')) {
        throw InputError("arrangement", std::string(choice_name(arrangement)) + " reads a 2-port file of S parameters");
    }
    if (through && d.reference.size() == 2 && d.reference[0] != d.reference[1]) {
        throw InputError("arrangement", "the two ports' references differ (" + format_value(d.reference[0]) + " and " +
                                            format_value(d.reference[1]) + " ohm)");
    }
    check_fixture(fixture, arrangement, z0);
    if (d.parameter == 'S') out.measured_as = arrangement;
    out.reference = z0;
    for (std::size_t k = 0; k < d.frequency.size(); ++k) {
        cd z;
        double e = 0;
        if (!through) {
            cd v = d.at(k, 0, 0);
            if (fixture.network) {  // to the coil's plane, as a reflection
                if (d.parameter == 'Z') v = (v - z0) / (v + z0);
                if (d.parameter == 'Y') v = (1.0 - z0 * v) / (1.0 + z0 * v);
                const auto x = matrix_at(*fixture.network, d.frequency[k], "fixture");  // S11, S12, S21, S22
                v = (v - x[0]) / (x[1] * x[2] + x[3] * (v - x[0]));
                z = z0 * (1.0 + v) / (1.0 - v);
                e = 2 * trace_error / std::abs(1.0 - v * v);
            } else if (d.parameter == 'Z') {
                z = v;
                e = trace_error;  // an impedance file: no arrangement's error to add
            } else if (d.parameter == 'Y') {
                z = 1.0 / v;
                e = trace_error;
            } else {
                z = z0 * (1.0 + v) / (1.0 - v);
                e = 2 * trace_error / std::abs(1.0 - v * v);
            }
        } else {
            const cd s21 = d.at(k, 1, 0);
            z = arrangement == MeasurementArrangement::series_through ? 2 * z0 * (1.0 - s21) / s21 : z0 * s21 / (2.0 * (1.0 - s21));
            e = trace_error / std::abs(s21 * (1.0 - s21));
        }
        if (d.frequency[k] > 0 && (fixture.series_inductance != 0 || fixture.shunt_capacitance > 0)) {
            const double w = 2 * pi * d.frequency[k];
            z = 1.0 / (1.0 / (z - cd(0, w * fixture.series_inductance)) - cd(0, w * fixture.shunt_capacitance));
        }
        if (!std::isfinite(z.real()) || !std::isfinite(z.imag())) {
            throw InputError("measurement", "at " + hz(d.frequency[k]) + " the " + choice_name(arrangement) +
                                                " arrangement gives no finite impedance (an open or a short)");
        }
        out.frequency.push_back(d.frequency[k]);
        out.impedance.push_back(z);
        out.relative_error.push_back(e);
        out.weight.push_back(std::min(1.0, (good_error / e) * (good_error / e)));
    }
    // The poorly measured ranges.
    for (std::size_t k = 0; k < out.frequency.size();) {
        if (out.relative_error[k] <= poor_error) {
            ++k;
            continue;
        }
        std::size_t j = k;
        while (j + 1 < out.frequency.size() && out.relative_error[j + 1] > poor_error) ++j;
        const std::string where = j == k ? "at " + hz(out.frequency[k]) : "from " + hz(out.frequency[k]) + " to " + hz(out.frequency[j]);
        out.notes.push_back(std::string(choice_name(arrangement)) + " measures poorly " + where +
                            " (a trace error of 0.001 moves Z by more than 5 %); those points weigh less");
        k = j + 1;
    }
    return out;
}

std::complex<double> measured_quantity(MeasurementArrangement arrangement, std::complex<double> z, double z0) {
    switch (arrangement) {
        case MeasurementArrangement::reflection: return (z - z0) / (z + z0);
        case MeasurementArrangement::series_through: return 2 * z0 / (2 * z0 + z);
        case MeasurementArrangement::shunt_through: return 2.0 * z / (2.0 * z + z0);
    }
    return z;
}

MeasuredFigures measured_figures(const MeasuredImpedance& m) {
    if (m.frequency.empty()) throw InputError("measurement", "no points");
    MeasuredFigures out;
    const std::size_t n = m.frequency.size();
    std::vector<cd> y(n);
    for (std::size_t k = 0; k < n; ++k) y[k] = 1.0 / m.impedance[k];
    std::size_t at = 0;
    out.self_resonance = rising_zero(m.frequency, y, 0, at);
    // The reference point: the lowest well-measured frequency (weight 1/2 or more), else the lowest.
    std::size_t ref = 0;
    while (ref < n && m.weight[ref] < 0.5) ++ref;
    if (ref == n) ref = 0;
    const double f = m.frequency[ref], w = 2 * pi * f;
    if (!(f > 0)) throw InputError("measurement", "the lowest frequency must be above 0 Hz to read L");
    cd zc = m.impedance[ref];
    double c = 0;
    for (int it = 0; it < 50; ++it) {
        const double l = zc.imag() / w, r = zc.real();
        if (out.self_resonance && l > 0) {
            const double w0 = 2 * pi * *out.self_resonance;
            c = l / (r * r + w0 * w0 * l * l);
        }
        const cd next = 1.0 / (y[ref] - cd(0, w * c));
        if (std::abs(next - zc) <= 1e-13 * std::abs(zc)) break;
        zc = next;
    }
    out.reference_frequency = f;
    out.inductance = zc.imag() / w;
    out.resistance = zc.real();
    if (out.self_resonance) {
        out.self_capacitance = c;
        // |Z| at the SRF: 1 / Re(Y) there, Re(Y) interpolated between the points beside the crossing (smooth,
        // where |Z| itself peaks between the points of a sweep coarser than the resonance's width).
        const double t = (*out.self_resonance - m.frequency[at]) / (m.frequency[at + 1] - m.frequency[at]);
        const double g = y[at].real() + t * (y[at + 1].real() - y[at].real());
        const double top = g > 0 ? 1 / g : std::max(std::abs(m.impedance[at]), std::abs(m.impedance[at + 1]));
        out.impedance_at_resonance = top;
        if (out.inductance > 0) out.q_at_resonance = top / (2 * pi * *out.self_resonance * out.inductance);
        std::size_t second = 0;
        out.second_resonance = rising_zero(m.frequency, m.impedance, at + 1, second);
    }
    for (const cd& z : m.impedance) out.q_factor.push_back(z.real() != 0 ? z.imag() / z.real() : 0.0);
    return out;
}

}  // namespace libcoil

