#include "libcoil/models/impedance.hpp"

#include <algorithm>
#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/losses.hpp"
#include "libcoil/models/proximity.hpp"

namespace libcoil {

namespace {

using cplx = std::complex<double>;

// e^z - 1 without cancellation for small z: (expm1(x) cos y - 2 sin^2(y/2)) + j e^x sin y.
cplx expm1(cplx z) {
    const double x = z.real(), y = z.imag(), s = std::sin(y / 2);
    return {std::expm1(x) * std::cos(y) - 2 * s * s, std::exp(x) * std::sin(y)};
}

// tanh for any complex argument, without overflow for large Re z or cancellation for small |z|:
// tanh z = -m / (2 + m), m = e^-2z - 1, for Re z >= 0.
cplx stable_tanh(cplx z) {
    if (z.real() < 0) return -stable_tanh(-z);
    const cplx m = expm1(-2.0 * z);
    return -m / (2.0 + m);
}

void require_finite_impedance(const cplx& z) {
    if (!std::isfinite(z.real()) || !std::isfinite(z.imag())) {
        throw DomainError("coil impedance: the result is not finite (an exact lossless resonance)");
    }
}

}  // namespace

cplx lumped_impedance(double w, double resistance, double inductance, double capacitance, double loss_tangent) {
    require_non_negative("angular_frequency", w);
    require_positive("resistance", resistance);
    require_positive("inductance", inductance);
    require_non_negative("capacitance", capacitance);
    require_non_negative("loss_tangent", loss_tangent);
    const cplx series(resistance, w * inductance);
    const cplx z = series / (1.0 + cplx(0, w * capacitance) * cplx(1, -loss_tangent) * series);
    require_finite_impedance(z);
    return z;
}

cplx line_impedance(double w, double resistance, double inductance, double phase_velocity, double length,
                    Mounting mounting, double loss_tangent) {
    require_non_negative("loss_tangent", loss_tangent);
    require_non_negative("angular_frequency", w);
    require_positive("resistance", resistance);
    require_positive("inductance", inductance);
    require_positive("phase_velocity", phase_velocity);
    require_positive("length", length);
    if (w == 0) return {resistance, 0};
    const double lp = inductance / length;                        // L' (H/m)
    const cplx z(resistance / length, w * lp);                    // series impedance per metre
    const cplx y = cplx(0, w / (lp * phase_velocity * phase_velocity)) * cplx(1, -loss_tangent);  // j w C' (1 - j tan d), C' = 1 / (L' v^2)
    const cplx gamma = std::sqrt(z * y), z0 = std::sqrt(z / y);
    const cplx zin = mounting == Mounting::floating ? 2.0 * z0 * stable_tanh(gamma * (length / 2))
                                                    : z0 * stable_tanh(gamma * length);
    require_finite_impedance(zin);
    return zin;
}

CoilImpedance::CoilImpedance(const Solenoid& coil, const Conductor& conductor, double temperature, double dc_inductance,
                             const SelfResonance& sr, std::optional<ShieldLoad> shield, WireLossTable wire)
    : coil_(coil),
      conductor_(conductor),
      temperature_(temperature),
      dc_inductance_(require_positive("dc_inductance", dc_inductance)),
      field_(mean_square_field_per_ampere(coil)),
      sr_(sr),
      helix_(sr.radius, sr.pitch_angle, sr.medium),
      shield_(std::move(shield)),
      wire_(std::move(wire)) {
    if (shield_) {
        require_positive("shield.self_resonance", shield_->self_resonance);
        require_positive("shield.inductance", shield_->inductance);
        require_non_negative("shield.terminal_capacitance", shield_->terminal_capacitance);
    }
}

void CoilImpedance::set_terminal_terms(const TerminalTerms& t) {
    require_non_negative("stray_capacitance", t.stray_capacitance);
    require_finite("lead_inductance", t.lead_inductance);
    require_positive("resistance_scale", t.resistance_scale);
    require_non_negative("resonance", t.resonance);
    terms_ = t;
}

void CoilImpedance::set_dielectric_loss(double loss_tangent) { loss_tangent_ = require_non_negative("loss_tangent", loss_tangent); }

double CoilImpedance::resonance_low() const {
    const double own = shield_ ? shield_->self_resonance : sr_.frequency;
    const double moved = terms_.resonance > 0 ? terms_.resonance / own : 1;  // the bench terms' shift
    const double relative = (sr_.frequency_low > 0 ? sr_.frequency_low / sr_.frequency : 1) * moved;
    if (!shield_) return sr_.frequency * relative;
    // The shield's own term (self_resonance.hpp's shield_band_term).
    return shield_->self_resonance * relative *
           shield_band_term(shield_->self_resonance, sr_.frequency, shield_->by_network, shield_->radius_ratio).low;
}

double CoilImpedance::phase_velocity(double frequency) const {
    require_non_negative("frequency", frequency);
    if (!sr_.helical_line.available) throw DomainError("the helical-line model does not hold for this coil");
    if (shield_) {  // the bare line's dispersion, scaled to resonate at the shielded SRF
        const double s = shield_->self_resonance / sr_.frequency;
        return s * bare_phase_velocity(frequency / s);
    }
    return bare_phase_velocity(frequency);
}

double CoilImpedance::bare_phase_velocity(double frequency) const {
    // The sheath helix's dispersion, scaled so that the line resonates at the recommended SRF (the turn
    // network's, where it is computed).
    const double s = sr_.frequency / sr_.helical_line.frequency;
    if (s != 1) return s * helix_phase_velocity(frequency / s);
    return helix_phase_velocity(frequency);
}

double CoilImpedance::helix_phase_velocity(double frequency) const {
    if (frequency <= sr_.helical_line.frequency) return sr_.phase_velocity;
    const double k = 2 * pi * frequency / speed_of_light;
    const double beta = helix_.axial_wavenumber(k);
    if (beta <= sr_.resonance_wavenumber) return sr_.phase_velocity;
    return 2 * pi * frequency / beta;
}

ImpedancePoint CoilImpedance::at(double frequency, ImpedanceModel model, double capacitance) const {
    return sweep({frequency}, model, capacitance).front();
}

std::vector<ImpedancePoint> CoilImpedance::sweep(const std::vector<double>& frequencies, ImpedanceModel model,
                                                 double capacitance) const {
    require_non_negative("capacitance", capacitance);
    auto wire = coil_at_frequencies(coil_, conductor_, temperature_, dc_inductance_, frequencies, field_);
    wire_.correct(wire);
    std::vector<ImpedancePoint> out;
    out.reserve(frequencies.size());
    for (std::size_t i = 0; i < frequencies.size(); ++i) {
        out.push_back(with_wire(frequencies[i], wire[i].resistance, wire[i].inductance, model, capacitance));
    }
    return out;
}

ImpedancePoint CoilImpedance::with_wire(double f, double resistance, double inductance, ImpedanceModel model,
                                        double capacitance) const {
    require_non_negative("capacitance", capacitance);
    if (model == ImpedanceModel::network) throw InputError("model", "network: the turn network's Z(f) comes from the sweep study");
    double c = capacitance > 0 ? capacitance : sr_.capacitance;
    resistance *= terms_.resistance_scale;
    if (shield_) {
        resistance += shield_->table.added_resistance(f);
        inductance += shield_->table.inductance_change(f);
        c += shield_->terminal_capacitance;
    }
    // Without a helical-line solution (outside the sheath helix's domain) the lumped form stands in.
    if (!sr_.helical_line.available) model = ImpedanceModel::lumped;
    const double w = 2 * pi * f;
    ImpedancePoint p;
    p.frequency = f;
    p.wire_resistance = resistance;
    p.wire_inductance = inductance;
    p.impedance = model == ImpedanceModel::lumped
                      ? lumped_impedance(w, resistance, inductance, c, loss_tangent_)
                      : line_impedance(w, resistance, inductance, phase_velocity(f), coil_.winding_length(), sr_.mounting, loss_tangent_);
    if (f > 0 && terms_.stray_capacitance > 0) p.impedance = 1.0 / (1.0 / p.impedance + cplx(0, w * terms_.stray_capacitance));
    if (f > 0) p.impedance += cplx(0, w * terms_.lead_inductance);
    require_finite_impedance(p.impedance);
    p.wire_inductance += terms_.lead_inductance;
    p.apparent_inductance = f > 0 ? p.impedance.imag() / w : p.wire_inductance;
    p.q_factor = p.impedance.imag() / p.impedance.real();
    return p;
}

}  // namespace libcoil
