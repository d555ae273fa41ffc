// The coil as mounted, by its turn network, at fixed frequencies: the sweep's network model, and the model a
// bench fit (measurement_fit.cpp) adjusts. Internal to the studies.
//
// Z(f) by the turn network (turn_network.hpp): every resonance of the coupled turns, with the winding's
// closed-form R(f) spread over the turns (and in a shield, the ring model's wall loss with it). The former is
// in the network (its polarisation charge); its loss tangent acts on the share of the capacitance it
// brings, 1 - (f_former / f_air)^2 by the network's SRFs. A shield is in the network too.
// The bench terms (records.hpp's BenchCorrections) at the terminals: the winding's R(f) times a factor; a
// capacitance across the terminals, Y + j w C (the same as the network's own terminal capacitor, which for
// either mounting sits between the terminals); then the leads' series inductance, Z + j w L.
#pragma once

#include <complex>
#include <memory>
#include <optional>
#include <vector>

#include "libcoil/models/impedance.hpp"
#include "libcoil/models/turn_network.hpp"
#include "libcoil/studies/analysis.hpp"

namespace libcoil::detail {

struct NetworkTerms {
    double former_permittivity = 1;  // of the former's material (unused without a former)
    double former_loss_tangent = 0;
    double stray_capacitance = 0;    // F
    double lead_inductance = 0;      // H
    double resistance_scale = 1;
};

// The spec's own: its former material's figures (a bench section has already replaced them) and its bench
// section's terminal terms.
NetworkTerms spec_terms(const CoilSpec& spec);

class MountedNetwork {
public:
    // InputError naming "model" where the network is not built for this coil.
    MountedNetwork(const Analysis& a, std::vector<double> frequencies);

    std::vector<ImpedancePoint> points(const NetworkTerms& t);
    // The first resonance between the terminals, as mounted, with the terms' capacitance across them.
    double self_resonance(const NetworkTerms& t);
    const std::vector<double>& frequencies() const { return f_; }

private:
    const TurnNetwork& network(double permittivity);  // built again only when the permittivity changes
    double loss_tangent_share(double permittivity);

    const Analysis& a_;
    std::vector<double> f_;
    std::vector<CoilAtFrequency> wire_;
    TurnNetworkOptions options_;
    double bare_in_air_ = 0;   // the unshielded network's first resonance without the former
    std::optional<double> built_for_;
    std::unique_ptr<TurnNetwork> net_;
    double share_ = 0;         // 1 - (f_former / f_air)^2 at built_for_
};

}  // namespace libcoil::detail
