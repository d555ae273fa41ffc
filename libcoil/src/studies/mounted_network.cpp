#include "studies/mounted_network.hpp"

#include <algorithm>
#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/losses.hpp"

namespace libcoil::detail {

NetworkTerms spec_terms(const CoilSpec& spec) {
    NetworkTerms t;
    if (spec.former) {
        t.former_permittivity = spec.former->material.relative_permittivity;
        t.former_loss_tangent = spec.former->material.loss_tangent;
    }
    if (spec.bench) {
        t.stray_capacitance = spec.bench->stray_capacitance;
        t.lead_inductance = spec.bench->lead_inductance;
        t.resistance_scale = spec.bench->resistance_scale;
    }
    return t;
}

MountedNetwork::MountedNetwork(const Analysis& a, std::vector<double> frequencies) : a_(a), f_(std::move(frequencies)) {
    if (!a.self_resonance.network.available) {
        throw InputError("model", "network: the turn network is not built for this coil (over 600 turns)");
    }
    const Solenoid& coil = a.spec.solenoid;
    options_.mounting = a.spec.surroundings.mounting;
    options_.relative_permittivity = a.spec.surroundings.relative_permittivity;
    if (a.spec.former) bare_in_air_ = TurnNetwork(coil, options_).first_resonance();
    if (a.spec.shield) options_.shield = *a.spec.shield;
    wire_ = coil_at_frequencies(coil, a.spec.conductor, a.spec.operating.temperature, a.inductance.recommended, f_);
}

double MountedNetwork::loss_tangent_share(double permittivity) {
    // The bare coil's SRF on the former: the analysis's at the material's own permittivity, else this one's.
    double on_former = a_.self_resonance.network.frequency;
    if (permittivity != a_.spec.former->material.relative_permittivity) {
        if (options_.shield) {
            TurnNetworkOptions o = options_;
            o.shield.reset();
            o.former = a_.spec.former->dielectric(a_.spec.solenoid.form_diameter());
            o.former.relative_permittivity = permittivity;
            on_former = TurnNetwork(a_.spec.solenoid, o).first_resonance();
        } else {
            on_former = net_->first_resonance();
        }
    }
    const double ratio = std::min(1.0, on_former / bare_in_air_);
    return 1 - ratio * ratio;
}

const TurnNetwork& MountedNetwork::network(double permittivity) {
    if (built_for_ && (*built_for_ == permittivity || !a_.spec.former)) return *net_;
    TurnNetworkOptions o = options_;
    if (a_.spec.former) {
        o.former = a_.spec.former->dielectric(a_.spec.solenoid.form_diameter());
        o.former.relative_permittivity = permittivity;
    }
    net_ = std::make_unique<TurnNetwork>(a_.spec.solenoid, o);
    built_for_ = permittivity;
    share_ = a_.spec.former ? loss_tangent_share(permittivity) : 0.0;
    return *net_;
}

std::vector<ImpedancePoint> MountedNetwork::points(const NetworkTerms& t) {
    const TurnNetwork& net = network(t.former_permittivity);
    const double tan_d = t.former_loss_tangent * share_;
    const auto& shield = a_.shield;
    std::vector<ImpedancePoint> out;
    out.reserve(f_.size());
    for (std::size_t i = 0; i < f_.size(); ++i) {
        const double f = f_[i], w = 2 * pi * f;
        ImpedancePoint p;
        p.frequency = f;
        // In a shield the network holds the perfect conductor's change to L; below the frequencies where the
        // wall is that, the ring model's own change differs, and its wall loss adds to the wire's.
        double r = wire_[i].resistance * t.resistance_scale, extra_l = 0;
        if (shield && f > 0) {
            r += shield->table.added_resistance(f);
            extra_l = shield->table.inductance_change(f) - (shield->result.perfect_conductor - a_.inductance.recommended);
        }
        p.wire_resistance = r;
        p.wire_inductance = wire_[i].inductance + (shield && f > 0 ? shield->table.inductance_change(f) : 0.0) + t.lead_inductance;
        if (f > 0) {
            p.impedance = net.impedance(f, r, tan_d, extra_l);
            if (t.stray_capacitance != 0) p.impedance = 1.0 / (1.0 / p.impedance + std::complex<double>(0, w * t.stray_capacitance));
            p.impedance += std::complex<double>(0, w * t.lead_inductance);
            p.apparent_inductance = p.impedance.imag() / w;
        } else {
            p.impedance = {wire_[i].resistance * t.resistance_scale, 0};
            p.apparent_inductance = wire_[i].inductance + t.lead_inductance;
        }
        p.q_factor = p.impedance.imag() / p.impedance.real();
        out.push_back(p);
    }
    return out;
}

double MountedNetwork::self_resonance(const NetworkTerms& t) {
    if (t.stray_capacitance == 0) {
        if (t.former_permittivity == (a_.spec.former ? a_.spec.former->material.relative_permittivity : 1.0)) {
            return a_.shield ? a_.shield->self_resonance : a_.self_resonance.network.frequency;
        }
        return network(t.former_permittivity).first_resonance();
    }
    TurnNetworkOptions o = options_;
    if (a_.spec.former) {
        o.former = a_.spec.former->dielectric(a_.spec.solenoid.form_diameter());
        o.former.relative_permittivity = t.former_permittivity;
    }
    o.terminal_capacitance = t.stray_capacitance;
    return TurnNetwork(a_.spec.solenoid, o).first_resonance();
}

}  // namespace libcoil::detail
