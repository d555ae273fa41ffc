// The one table of front-end options: every option of every `coil` verb, with the name the command line
// gives it (its flag) and the name the Python module gives it (its keyword, which is also the field name
// the library's errors use). The CLI builds its parser from this table and turns a library error's field
// back into the flag the user typed; the Python module names its keywords from it and exposes it as
// libcoil.option_table(), so that a test can drive both front ends from the same rows.
//
// Enumerated options take their words from the library's choices table (libcoil/spec/choices.hpp): neither
// front end spells a choice itself.
#pragma once

#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include "libcoil/core/units.hpp"
#include "libcoil/spec/choices.hpp"

namespace libcoil::frontend {

enum class Kind {
    flag,      // on or off
    integer,   // a whole number
    quantity,  // a number with a unit ("20 mm"); SI float in Python
    choice,    // one word of a choices table
    text,      // free text (a gauge, a flange "40 mm x 2 mm", a path)
};

struct Option {
    const char* verb;   // "analyze", "sweep", ...; "" for a positional argument's verb as well
    const char* key;    // the Python keyword and the library's field name
    const char* flag;   // the command-line flag, "--solver"; a positional argument has none ("")
    Kind kind;
    const char* help;
    Dimension dimension = Dimension::dimensionless;      // quantity only
    std::vector<std::string> (*choices)() = nullptr;     // choice only
    const char* default_text = "";                        // shown in help; "" when there is none
    bool python = true;                                   // the Python function takes it by this key
};

inline const std::vector<Option>& option_table() {
    using D = Dimension;
    static const std::vector<Option> table{
        // coil analyze SPEC
        {"analyze", "json", "--json", Kind::flag, "Print one JSON object with SI values instead of the report", D::dimensionless, nullptr, "", false},
        {"analyze", "out", "--out", Kind::text, "Also write the report and the JSON into this directory", D::dimensionless, nullptr, "", false},
        {"analyze", "solver", "--solver", Kind::choice,
         "Losses by 'harmonics' (Bessel harmonics of each wire's current, the default), 'closed-form' (Bessel skin + "
         "Butterworth proximity) or 'filaments' (numerical cross-section solver)",
         D::dimensionless, &choice_names<LossSolver>, "harmonics"},
        {"analyze", "layers", "--layers", Kind::integer, "Solver: radial layers across the wire (default: enough to resolve the skin depth)"},
        {"analyze", "sectors", "--sectors", Kind::integer, "Solver: angular cells per layer (default: twice the layers)"},
        {"analyze", "threads", "--threads", Kind::integer,
         "Threads for the wire-harmonic solver's frequencies (default: all cores; the figures are the same whatever the threads)"},
        // coil sweep SPEC
        {"sweep", "from", "--from", Kind::quantity, "First frequency (default: half the band's low edge, or SRF / 1000)", D::frequency,
         nullptr, "", false},
        {"sweep", "to", "--to", Kind::quantity, "Last frequency (default: 3 x SRF, or twice the band ceiling if higher)", D::frequency,
         nullptr, "", false},
        {"sweep", "points", "--points", Kind::integer, "Number of frequencies", D::dimensionless, nullptr, "401", false},
        {"sweep", "spacing", "--spacing", Kind::choice, "Frequency spacing", D::dimensionless, &choice_names<Spacing>, "log", false},
        {"sweep", "model", "--model", Kind::choice,
         "Impedance model: network (coupled turns), helical-line (distributed) or lumped (R + jwL parallel C); default: "
         "the recommended SRF's model (network up to 150 turns without a shield, else helical-line)",
         D::dimensionless, &choice_names<ImpedanceModel>, ""},
        {"sweep", "capacitance", "--capacitance", Kind::choice, "Lumped model only: self-capacitance by helical-line or medhurst",
         D::dimensionless, &choice_names<CapacitanceSource>, "helical-line"},
        {"sweep", "out", "--out", Kind::text, "Write STEM.sweep.csv, STEM.s1p and STEM.sweep.svg here (else CSV to stdout)",
         D::dimensionless, nullptr, "", false},
        // coil compare SPEC MEASUREMENT
        {"compare", "arrangement", "--arrangement", Kind::choice,
         "How the file holds the coil: 'reflection' (one port at its terminals), 'series-through' (in series between two "
         "ports) or 'shunt-through' (from the through line to ground)",
         D::dimensionless, &choice_names<MeasurementArrangement>, "reflection", false},
        {"compare", "fit", "--fit", Kind::flag,
         "Also fit what the model cannot know (the former's permittivity and loss tangent, a stray capacitance across the "
         "terminals, the leads' inductance, an R factor) and, with --out, write them as STEM.bench.yaml for the spec's bench: line",
         D::dimensionless, nullptr, "", false},
        {"compare", "fixture", "--fixture", Kind::text,
         "A 2-port Touchstone file of the fixture between the analyser (port 1) and the coil (port 2), removed from a reflection measurement",
         D::dimensionless, nullptr, "", false},
        {"compare", "fixture_inductance", "--fixture-inductance", Kind::quantity,
         "The fixture's series inductance from the reference plane to the coil, removed from the measurement", D::inductance, nullptr, "", false},
        {"compare", "fixture_capacitance", "--fixture-capacitance", Kind::quantity,
         "The fixture's capacitance across the coil's terminals, removed from the measurement", D::capacitance, nullptr, "", false},
        {"compare", "json", "--json", Kind::flag, "Print one JSON object with SI values instead of the report", D::dimensionless, nullptr, "", false},
        {"compare", "out", "--out", Kind::text, "Also write STEM.compare.txt, .json, .csv (both on the measurement's "
         "frequencies) and .svg (|Z| and phase of both) here", D::dimensionless, nullptr, "", false},
        // coil fixture FIXTURE
        {"fixture", "from", "--from", Kind::quantity, "First frequency (default: the fixture's sweep, else half the reference band's low edge or 10 kHz)",
         D::frequency, nullptr, "", false},
        {"fixture", "to", "--to", Kind::quantity, "Last frequency (default: the fixture's sweep, else twice the band's top or 300 MHz)",
         D::frequency, nullptr, "", false},
        {"fixture", "points", "--points", Kind::integer, "Number of frequencies (log spaced)", D::dimensionless, nullptr, "401", false},
        {"fixture", "json", "--json", Kind::flag, "Print one JSON object with SI values instead of the report", D::dimensionless, nullptr, "", false},
        {"fixture", "out", "--out", Kind::text, "Also write STEM.fixture.txt, .json, .csv, .svg and the ports' .s1p or .s2p here",
         D::dimensionless, nullptr, "", false},
        // coil export-circuit SPEC
        {"export-circuit", "from", "--from", Kind::quantity, "Bottom of the fitted range (default: SRF / 1000)", D::frequency, nullptr, "", false},
        {"export-circuit", "to", "--to", Kind::quantity, "Top of the fitted range (default: 2.5 x SRF)", D::frequency, nullptr, "", false},
        {"export-circuit", "order", "--order", Kind::integer,
         "Pole pairs of the fit (default: the least from 2 to 10 within 1 % and 1 degree, and passive)", D::dimensionless, nullptr, "", false},
        {"export-circuit", "name", "--name", Kind::text, "The subcircuit's name (default: COIL_ and the spec's file name)", D::dimensionless,
         nullptr, "", false},
        {"export-circuit", "out", "--out", Kind::text, "Write STEM.cir and STEM.circuit.txt here (else the subcircuit to stdout)",
         D::dimensionless, nullptr, "", false},
        // coil design REQUIREMENT
        {"design", "json", "--json", Kind::flag, "Print one JSON object with SI values instead of the report", D::dimensionless, nullptr, "", false},
        {"design", "out", "--out", Kind::text, "Also write the report, the JSON and the chosen design's spec (NAME.chosen.yaml)",
         D::dimensionless, nullptr, "", false},
        {"design", "top", "--top", Kind::integer, "Designs to list", D::dimensionless, nullptr, "10"},
        {"design", "threads", "--threads", Kind::integer, "Search threads (default: all cores)"},
        {"design", "spread", "--spread", Kind::flag, "Monte Carlo of the build tolerances on the chosen design"},
        {"design", "samples", "--samples", Kind::integer, "Spread: number of samples", D::dimensionless, nullptr, "2000"},
        {"design", "seed", "--seed", Kind::integer, "Spread: random seed (the same seed gives the same samples)", D::dimensionless, nullptr, "1"},
        // coil former SPEC
        {"former", "out_dir", "--out", Kind::text, "Write STEM.former.stl, STEM.former.svg and STEM.former.yaml here"},
        {"former", "kind", "--kind", Kind::choice, "Former kind (default: the spec's former.kind)", D::dimensionless,
         &choice_names<FormerKind>},
        {"former", "ribs", "--ribs", Kind::integer, "Ribbed: number of ribs"},
        {"former", "rib_width", "--rib-width", Kind::quantity, "Ribbed: width of each rib at the groove root, e.g. \"3 mm\"", D::length},
        {"former", "profile", "--profile", Kind::choice, "Groove profile", D::dimensionless, &choice_names<GrooveProfile>},
        {"former", "groove_depth", "--groove-depth", Kind::quantity, "Groove depth below the outer surface (default: half the insulated wire)",
         D::length},
        {"former", "clearance", "--clearance", Kind::quantity, "How much wider than the insulated wire the groove is (default 0.1 mm)",
         D::length},
        {"former", "flange", "--flange", Kind::text, "End flanges, DIAMETER x THICKNESS, e.g. \"40 mm x 2 mm\" (Python: a pair in m)"},
        {"former", "bore_oversize", "--bore-oversize", Kind::quantity,
         "Print the bore this much wider (on the diameter) than nominal, for the shrinkage of printed holes", D::length},
        {"former", "ends", "--ends", Kind::quantity, "Plain former beyond the winding at each end (default: the spec's, else 5 mm)", D::length},
        {"former", "chord_tolerance", "--chord", Kind::quantity, "Chord tolerance of the mesh", D::length, nullptr, "0.01 mm"},
        {"former", "ascii", "--ascii", Kind::flag, "Write ASCII STL instead of binary"},
        {"former", "json", "--json", Kind::flag, "Print one JSON summary instead of the report", D::dimensionless, nullptr, "", false},
        // coil couple A B
        {"couple", "distance", "--distance", Kind::quantity, "Centre-to-centre distance, e.g. \"60 mm\"", D::length},
        {"couple", "arrangement", "--arrangement", Kind::choice, "coaxial (one axis) or side-by-side (parallel axes)", D::dimensionless,
         &choice_names<Arrangement>, "coaxial"},
        {"couple", "axial_offset", "--offset", Kind::quantity, "Side by side: B's centre shifted along the axes", D::length, nullptr, "0 mm"},
        {"couple", "frequencies", "--frequency", Kind::quantity, "Crosstalk frequencies (default: the specs' operating frequencies)",
         D::frequency},
        {"couple", "source_resistance", "--source", Kind::quantity, "Source resistance driving A", D::resistance, nullptr, "50 ohm"},
        {"couple", "load_resistance", "--load", Kind::quantity, "Load resistance on B", D::resistance, nullptr, "50 ohm"},
        {"couple", "sweep_distances", "--sweep-distance", Kind::text,
         "FROM:TO:POINTS, log-spaced: a table of k, and a picture with --out (Python: an array of distances in m)"},
        {"couple", "out", "--out", Kind::text, "Write A+B.couple.json (and .svg with --sweep-distance) here", D::dimensionless, nullptr, "", false},
        {"couple", "json", "--json", Kind::flag, "Print one JSON object with SI values instead of the report", D::dimensionless, nullptr, "", false},
        // coil wire
        {"wire", "gauge", "--gauge", Kind::text, "AWG gauge, e.g. \"AWG 18\""},
        {"wire", "diameter", "--diameter", Kind::quantity, "Bare diameter, e.g. \"1 mm\"", D::length},
        {"wire", "insulation", "--insulation", Kind::quantity, "Radial insulation build, e.g. \"0.04 mm\"", D::length},
        {"wire", "enamel_grade", "--enamel", Kind::text, "IEC 60317 enamel grade 1, 2 or 3 (when no --insulation)", D::dimensionless,
         nullptr, "1"},
        {"wire", "frequency", "--frequency", Kind::quantity, "Frequency", D::frequency, nullptr, "1 MHz", false},
        {"wire", "temperature", "--temperature", Kind::quantity, "Wire temperature", D::temperature, nullptr, "20 degC", false},
        {"wire", "conductor", "--conductor", Kind::text, "copper, aluminium or silver", D::dimensionless, nullptr, "copper", false},
        {"wire", "json", "--json", Kind::flag, "Print one JSON object with SI values", D::dimensionless, nullptr, "", false},
        {"wire", "table", "--table", Kind::flag, "Print a table of AWG and metric wires instead", D::dimensionless, nullptr, "", false},
    };
    return table;
}

inline const Option& option(std::string_view verb, std::string_view key) {
    for (const Option& o : option_table()) {
        if (verb == o.verb && key == o.key) return o;
    }
    throw std::logic_error("no option " + std::string(key) + " for " + std::string(verb));
}

// The flag a library field names for a verb (an error's field: an option's key, or its flag's word, as
// make_wire's "enamel"), or the field itself when no option has it.
inline std::string flag_for_field(std::string_view verb, const std::string& field) {
    for (const Option& o : option_table()) {
        if (verb != o.verb || !*o.flag) continue;
        if (field == o.key || field == std::string_view(o.flag).substr(2)) return o.flag;
    }
    return field;
}

}  // namespace libcoil::frontend
