// A fixture: the circuit a coil serves (a supply network, a filter, a bias tee), read from YAML at the edge.
// The fixture study (studies/fixture_study.hpp) computes its port impedance with each coil as its full
// analysis sees it.
//
//   name: ...                               # optional
//   description: ...                        # optional
//   ground: gnd                             # the reference node ("ground" if not given)
//   parts:
//     - {name: L1, kind: coil, between: [supply, line], spec: coil.yaml}   # a spec file (beside this one)
//     - {name: L2, kind: coil, between: [a, b], coil: {form_diameter: ..., turns: ..., ...}}   # or inline
//     - {name: C1, kind: capacitor, between: [line, port], value: 100 nF, esr: 20 mohm, esl: 4 nH}
//     - {name: R1, kind: resistor, between: [port, gnd], value: 50 ohm, esl: 2 nH}
//     - {name: C2, kind: capacitor, between: [supply, gnd], value: 1 uF, parallel_resistance: 10 Mohm}
//     - {name: L3, kind: inductor, between: [x, y], value: 1 mH, esr: 1 ohm, parallel_capacitance: 5 pF}
//     - {name: Z1, kind: capacitor, between: [a, b], touchstone: part.s1p}  # its Z from a one-port file instead
//     - {name: K12, kind: coupling, coils: [L1, L2], arrangement: side-by-side, distance: 60 mm}  # M between two coils
//   ports:                                  # one or two
//     - {name: EUT, between: [line, gnd], reference: 50 ohm}
//   reference:                              # optional: what the port impedance should be
//     ideal: true                           # the same fixture with ideal parts and each coil at its nominal L
//     table: port-reference.csv             # or a table: frequency and |Z| (with phase), as a measurement CSV
//     tolerance: 20 %                       # or in dB: "1.5 dB"
//     band: {low: 150 kHz, high: 110 MHz}
//   sweep: {from: 10 kHz, to: 300 MHz, points: 401}   # optional: the default frequencies
//
// Each part's impedance: resistor R + j w ESL; capacitor ESR + j w ESL + 1 / (j w C); inductor ESR + j w L;
// then in parallel with `parallel_resistance` and `parallel_capacitance` where given. A coupling joins two
// coil parts by their mutual inductance, as the coupling study computes it (coupling_study.hpp: the bare
// coils' M at `distance`, `axial_offset` along the axes, less both shields' credited shielding), each coil
// wound the same way from its first node to its second.
#pragma once

#include <filesystem>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "libcoil/spec/records.hpp"

namespace libcoil {

enum class FixturePartKind { coil, resistor, capacitor, inductor, coupling };

struct FixturePart {
    std::string name;
    FixturePartKind kind = FixturePartKind::resistor;
    std::string from, to;                      // nodes (a coupling: the two coil parts it joins)
    double value = 0;                          // ohm, F or H (0 for a coil or a Touchstone part)
    double esr = 0, esl = 0;                   // ohm, H
    std::optional<double> parallel_resistance; // ohm
    std::optional<double> parallel_capacitance;// F
    std::optional<CoilSpec> coil;              // kind coil
    std::optional<std::filesystem::path> touchstone;  // a one-port file: the part's Z (the study reads it)
    std::string source;                        // the coil's spec file or the Touchstone file, for the report
    Arrangement arrangement = Arrangement::side_by_side;  // a coupling's
    double distance = 0, axial_offset = 0;     // m, a coupling's
    bool ideal() const {
        return esr == 0 && esl == 0 && !parallel_resistance && !parallel_capacitance && !touchstone && kind != FixturePartKind::coil &&
               kind != FixturePartKind::coupling;
    }
};

struct FixturePort {
    std::string name;
    std::string from, to;
    double reference = 50;  // ohm
};

struct FixtureReference {
    bool ideal = true;
    std::optional<std::filesystem::path> table;  // a one-port table of the first port's Z (the study reads it)
    double tolerance = 0.2;            // a fraction, or dB where `in_db`
    bool in_db = false;
    double band_low = 0, band_high = 0;  // Hz
};

struct FixtureSpec {
    std::string name, description;
    std::string ground = "ground";
    std::vector<FixturePart> parts;
    std::vector<FixturePort> ports;
    std::optional<FixtureReference> reference;
    std::optional<double> from, to;
    int points = 401;
    std::vector<std::string> notes;
};

// InputError names the YAML path (parts[2].value, ports[0].between, ...), the file where it is another one.
// `designed`: the coil part a design search supplies (requirement.hpp's fixture:), which may come without a
// spec; it must be a coil part, and no coupling may reach it.
FixtureSpec parse_fixture(std::string_view yaml_text, std::string_view source = "fixture", std::string_view designed = {});
FixtureSpec load_fixture(const std::filesystem::path& path, std::string_view designed = {});
// The fixture with the part named `part` (a coil) given `coil`.
FixtureSpec with_coil(FixtureSpec fixture, std::string_view part, const CoilSpec& coil);

std::string_view fixture_part_kind_name(FixturePartKind k);

}  // namespace libcoil
