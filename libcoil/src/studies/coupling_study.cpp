#include "libcoil/studies/coupling_study.hpp"

#include <algorithm>
#include <cmath>

#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/models/shield.hpp"
#include "libcoil/studies/analysis.hpp"

namespace libcoil {

namespace {


// The coil as mounted at the crosstalk frequencies: the analysis study with those frequencies, its losses
// by the closed forms (a crosstalk figure needs R to a few per cent, not the solver's 0.5 %).
Analysis mounted(const CoilSpec& spec, const std::vector<double>& frequencies) {
    CoilSpec s = spec;
    s.operating.frequencies = frequencies;
    s.band.reset();  // the crosstalk needs no verdict
    AnalysisOptions closed_form;
    closed_form.fallback_unknowns = 0;
    return analyze(s, closed_form);
}

}  // namespace

namespace {
// Where b's wall sees a's field come from: its own radius, or the other coil's centre where that is further.
double b_source_distance(const CoilSpec& b, double distance) {
    return std::max(b.shield->inner_diameter / 2, distance - b.shield->inner_diameter / 2);
}
}  // namespace

double credited_pair_shielding_db(const CoilSpec& a, const CoilSpec& b, double distance, double frequency) {
    // Each shield is credited with its wall's figure, capped, and no more than its open ends let out.
    double db = 0;
    if (a.shield) db += credited_magnetic_shielding_db(*a.shield, frequency, a.shield->inner_diameter / 2, a.solenoid.winding_length());
    if (b.shield) db += credited_magnetic_shielding_db(*b.shield, frequency, b_source_distance(b, distance), b.solenoid.winding_length());
    return db;
}

CouplingStudy study_coupling(const CoilSpec& a, const CoilSpec& b, Arrangement arr, double distance, double offset,
                             std::vector<double> frequencies, double rs, double rl, const std::vector<double>& sweep) {
    CouplingStudy s;
    s.name_a = a.name.empty() ? "coil A" : a.name;
    s.name_b = b.name.empty() ? "coil B" : b.name;
    s.arrangement = arr;
    s.distance = require_positive("distance", distance);
    s.axial_offset = require_finite("axial_offset", offset);
    s.source_resistance = require_positive("source_resistance", rs);
    s.load_resistance = require_positive("load_resistance", rl);
    s.at = coupling(a.solenoid, b.solenoid, arr, distance, offset);
    s.dipole_mutual = dipole_mutual_inductance(a.solenoid, b.solenoid, arr, distance);
    s.shield_a = a.shield ? shield_words(*a.shield) : "";
    s.shield_b = b.shield ? shield_words(*b.shield) : "";
    if (frequencies.empty()) {
        frequencies = a.operating.frequencies;
        frequencies.insert(frequencies.end(), b.operating.frequencies.begin(), b.operating.frequencies.end());
        std::sort(frequencies.begin(), frequencies.end());
        frequencies.erase(std::unique(frequencies.begin(), frequencies.end()), frequencies.end());
        if (frequencies.empty()) s.notes.push_back("no frequency given, nor operating.frequencies in a spec: no crosstalk figures");
    } else if (frequencies.size() > max_operating_frequencies) {  // each one runs both coils' loss solvers
        throw InputError("frequencies", std::to_string(frequencies.size()) + " frequencies; expected at most " +
                                            std::to_string(max_operating_frequencies));
    }
    for (double f : frequencies) require_frequency("frequencies", f);
    const Analysis ma = mounted(a, frequencies), mb = mounted(b, frequencies);
    const CoilImpedance za = coil_impedance(ma), zb = coil_impedance(mb);
    s.mounted_inductance_a = za.nominal_inductance();
    s.mounted_inductance_b = zb.nominal_inductance();
    for (std::size_t i = 0; i < frequencies.size(); ++i) {
        const double f = frequencies[i];
        CouplingStudy::AtFrequency x;
        const ImpedancePoint pa = za.with_wire(f, ma.at_frequency[i].resistance, ma.at_frequency[i].inductance);
        const ImpedancePoint pb = zb.with_wire(f, mb.at_frequency[i].resistance, mb.at_frequency[i].inductance);
        x.resistance_a = pa.wire_resistance;
        x.inductance_a = pa.wire_inductance;
        x.resistance_b = pb.wire_resistance;
        x.inductance_b = pb.wire_inductance;
        if (a.shield) x.theoretical_shielding_db += magnetic_shielding(*a.shield, f, a.shield->inner_diameter / 2).total_db;
        if (b.shield) x.theoretical_shielding_db += magnetic_shielding(*b.shield, f, b_source_distance(b, distance)).total_db;
        x.shielding_db = credited_pair_shielding_db(a, b, distance, f);
        Coupling as_mounted = s.at;
        as_mounted.inductance_a = x.inductance_a;
        as_mounted.inductance_b = x.inductance_b;
        as_mounted.mutual *= std::pow(10.0, -x.shielding_db / 20);
        x.crosstalk = crosstalk(as_mounted, f, x.resistance_a, x.resistance_b, rs, rl);
        x.unshielded_db = crosstalk(s.at, f, ma.at_frequency[i].resistance, mb.at_frequency[i].resistance, rs, rl).transfer_db;
        s.at_frequency.push_back(x);
    }
    const double dipole_k_d3 = s.dipole_mutual * std::pow(distance, 3) / std::sqrt(s.at.inductance_a * s.at.inductance_b);
    for (double d : sweep) {
        require_positive("sweep_distances", d);
        const Coupling c = coupling(a.solenoid, b.solenoid, arr, d, offset);
        s.sweep.push_back({d, c.mutual, c.coefficient, dipole_k_d3 / std::pow(d, 3)});
    }
    if (a.shield || b.shield) {
        s.notes.push_back(std::string("shields modelled: A ") + (a.shield ? "in its " + s.shield_a : "bare") + "; B " +
                          (b.shield ? "in its " + s.shield_b : "bare"));
        s.notes.push_back("shields: Schelkunoff's plane-sheet shielding effectiveness of each wall against the near magnetic field, "
                          "applied to M, at most 100 dB a wall (common practice, no source: seams and slots leak long before the "
                          "seamless wall's figure), and for an open tube no more than leaks from its ends (the TE01 mode below cutoff, "
                          "33 dB per radius of tube beyond the winding); each coil's L and R in the crosstalk are its shielded ones "
                          "(the ring model's L(f) and wall loss)");
    } else {
        s.notes.push_back("no shield is given: the coils are bare; a conductive enclosure around both changes L and M");
    }
    s.notes.push_back("M and k are the bare coils', each as circular filaments, one per turn, on its mean diameter; the crosstalk takes "
                      "each coil as R + jwL, so it holds well below either coil's self-resonance");
    return s;
}

}  // namespace libcoil
