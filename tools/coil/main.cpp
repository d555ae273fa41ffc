// coil: the command-line face of libcoil. It parses arguments (the options come from the one option table,
// tools/options/option_table.hpp), calls a study and prints or writes what an output formats; the physics
// and every policy live in libcoil. Exit codes: 0 done, 2 bad input (nothing written to stdout or to files),
// 1 other failure.
#include <unistd.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <iostream>
#include <map>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

#include "libcoil/libcoil.hpp"
#include "option_table.hpp"

namespace {

namespace fe = libcoil::frontend;
using libcoil::Dimension;

constexpr int exit_bad_input = 2;

// What the user gave one verb: its positional arguments and its options, by the table's keys.
struct Given {
    std::string verb;
    std::vector<std::string> positional;
    std::map<std::string, std::vector<std::string>> values;  // options with a value (repeatable ones hold several)
    std::map<std::string, bool> flags;

    bool has(const std::string& key) const { return values.count(key) && !values.at(key).empty(); }
    bool flag(const std::string& key) const { return flags.count(key) && flags.at(key); }
    std::string text(const std::string& key, const std::string& fallback = "") const {
        return has(key) ? values.at(key).back() : fallback;
    }
    double quantity(const std::string& key) const {
        const fe::Option& o = fe::option(verb, key);
        return libcoil::parse_quantity(text(key, o.default_text), o.dimension, o.flag);
    }
    std::optional<double> optional_quantity(const std::string& key) const {
        if (!has(key)) return std::nullopt;
        return quantity(key);
    }
    // A whole number within [low, high], or an InputError naming the flag.
    long whole(const std::string& key, long low, long high, long fallback = 0) const {
        if (!has(key)) return fallback;
        const std::string t = text(key);
        const fe::Option& o = fe::option(verb, key);
        const double v = libcoil::parse_quantity(t, Dimension::dimensionless, o.flag);
        if (!(v == std::floor(v) && v >= static_cast<double>(low) && v <= static_cast<double>(high))) {
            throw libcoil::InputError(o.flag, libcoil::quoted(t) + "; expected a whole number from " + std::to_string(low) + " to " +
                                                  std::to_string(high));
        }
        return static_cast<long>(v);
    }
    template <class E>
    std::optional<E> choice(const std::string& key) const {
        if (!has(key)) {
            const fe::Option& o = fe::option(verb, key);
            if (!*o.default_text) return std::nullopt;
            return libcoil::parse_choice<E>(o.default_text, o.flag);
        }
        return libcoil::parse_choice<E>(text(key), fe::option(verb, key).flag);
    }
};

// The verb's options, from the table.
void add_options(CLI::App* app, Given& g) {
    for (const fe::Option& o : fe::option_table()) {
        if (g.verb != o.verb || !*o.flag) continue;
        std::string help = o.help;
        if (o.choices) {
            std::string words;
            for (const auto& w : o.choices()) words += (words.empty() ? "" : ", ") + w;
            help += " (" + words + ")";
        }
        if (*o.default_text) help += " [default: " + std::string(o.default_text) + "]";
        if (o.kind == fe::Kind::flag) {
            app->add_flag(o.flag, g.flags[o.key], help);
        } else {
            app->add_option(o.flag, g.values[o.key], help)->take_all();
        }
    }
}

// Progress on stderr once a numerical solve has run for more than a second.
struct Progress {
    std::chrono::steady_clock::time_point start = std::chrono::steady_clock::now();
    const char* what;
    bool shown = false;
    void operator()(std::size_t done, std::size_t total) {
        const double s = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
        if (s < 1.0 && !shown) return;
        shown = true;
        // On a terminal one line is redrawn; elsewhere each update is its own line.
        const bool tty = ::isatty(STDERR_FILENO) != 0;
        std::fprintf(stderr, "%scoil: %s %zu of %zu (%.0f s)%s", tty ? "\r" : "", what, done, total, s, (!tty || done == total) ? "\n" : "");
        std::fflush(stderr);
    }
};

std::string stem_of(const std::string& path) { return std::filesystem::path(path).stem().string(); }

// Writes the set whole (or nothing) and returns the paths, for the "Written:" lines.
std::vector<std::string> write_all(const libcoil::FileSet& files) {
    libcoil::write_file_set(files);
    std::vector<std::string> names;
    for (const auto& [p, c] : files) names.push_back(p.string());
    return names;
}

void print_written(const std::vector<std::string>& names) {
    if (names.empty()) return;
    std::cout << "\nWritten: ";
    for (std::size_t i = 0; i < names.size(); ++i) std::cout << (i ? "         " : "") << names[i] << "\n";
}

int run_analyze(const Given& g) {
    libcoil::AnalysisOptions opt;
    opt.solver = *g.choice<libcoil::LossSolver>("solver");
    opt.threads = static_cast<unsigned>(g.whole("threads", 1, 1024, 0));
    if (g.has("layers")) {
        const long layers = g.whole("layers", -1000000, 1000000);
        opt.auto_subdivision = false;
        opt.subdivision.layers = static_cast<int>(layers);
        opt.subdivision.sectors = static_cast<int>(g.whole("sectors", -1000000, 1000000, 0));  // 0: the library's default
    } else if (g.has("sectors")) {
        throw libcoil::InputError("--sectors", "goes with --layers");
    }
    if (opt.solver == libcoil::LossSolver::filaments) {
        auto progress = std::make_shared<Progress>(Progress{std::chrono::steady_clock::now(), "cross-section solver, frequency"});
        opt.progress = [progress](std::size_t d, std::size_t t) { (*progress)(d, t); };
    }
    const std::string& spec = g.positional.at(0);
    const libcoil::Analysis a = libcoil::analyze(libcoil::load_coil_spec(spec), opt);
    const std::string text = libcoil::text_report(a), json = libcoil::json_report(a);
    std::vector<std::string> written;
    if (g.has("out")) {
        const std::filesystem::path dir(g.text("out"));
        written = write_all({{dir / (stem_of(spec) + ".analysis.txt"), text}, {dir / (stem_of(spec) + ".analysis.json"), json}});
    }
    std::cout << (g.flag("json") ? json : text);
    if (!g.flag("json")) print_written(written);
    return 0;
}

int run_sweep(const Given& g) {
    const std::string& spec = g.positional.at(0);
    const libcoil::Analysis a = libcoil::analyze(libcoil::load_coil_spec(spec));
    libcoil::SweepRequest q;
    q.from = g.optional_quantity("from");
    q.to = g.optional_quantity("to");
    q.points = static_cast<int>(g.whole("points", 2, 1000000, 401));
    q.spacing = *g.choice<libcoil::Spacing>("spacing");
    q.model = g.choice<libcoil::ImpedanceModel>("model");
    q.capacitance = *g.choice<libcoil::CapacitanceSource>("capacitance");
    libcoil::Sweep s = libcoil::sweep_study(a, q);
    if (s.title.empty()) s.title = stem_of(spec);
    if (!g.has("out")) {
        std::cout << libcoil::sweep_csv(s);
        return 0;
    }
    const std::filesystem::path dir(g.text("out"));
    const std::string stem = stem_of(spec);
    const auto written = write_all({{dir / (stem + ".sweep.csv"), libcoil::sweep_csv(s)},
                                    {dir / (stem + ".s1p"), libcoil::touchstone_s1p(s)},
                                    {dir / (stem + ".sweep.svg"), libcoil::impedance_svg(s)}});
    std::cout << "coil sweep: " << s.points.size() << " points, " << libcoil::format_quantity(s.from, Dimension::frequency) << " to "
              << libcoil::format_quantity(s.to, Dimension::frequency) << " (" << libcoil::choice_name(s.spacing) << "), "
              << libcoil::choice_name(s.model) << " model; self-resonance " << libcoil::format_quantity(s.self_resonance, Dimension::frequency)
              << (s.shield ? ", in its shield" : "") << "\n";
    std::cout << "Written: " << written[0] << "\n         " << written[1] << "\n         " << written[2] << "\n";
    return 0;
}

int run_compare(const Given& g) {
    const std::string& spec = g.positional.at(0);
    libcoil::Fixture fixture;
    if (g.has("fixture")) fixture.network = libcoil::read_network_file(g.text("fixture"));
    if (g.has("fixture_inductance")) fixture.series_inductance = g.quantity("fixture_inductance");
    if (g.has("fixture_capacitance")) fixture.shunt_capacitance = g.quantity("fixture_capacitance");
    const libcoil::MeasuredImpedance m = libcoil::measured_impedance(libcoil::read_network_file(g.positional.at(1)),
                                                                     *g.choice<libcoil::MeasurementArrangement>("arrangement"), fixture);
    const libcoil::Comparison c = libcoil::compare_study(libcoil::analyze(libcoil::load_coil_spec(spec)), m, g.flag("fit"));
    const std::string text = libcoil::comparison_text_report(c), json = libcoil::comparison_json_report(c);
    std::vector<std::string> written;
    if (g.has("out")) {
        const std::filesystem::path dir(g.text("out"));
        const std::string stem = stem_of(spec);
        libcoil::FileSet files{
            {dir / (stem + ".compare.txt"), text}, {dir / (stem + ".compare.json"), json},
            {dir / (stem + ".compare.csv"), libcoil::comparison_csv(c)}, {dir / (stem + ".compare.svg"), libcoil::comparison_svg(c)}};
        if (c.fit) files.emplace_back(dir / (stem + ".bench.yaml"), libcoil::bench_yaml(c, std::filesystem::path(g.positional.at(1)).filename().string()));
        written = write_all(files);
    }
    std::cout << (g.flag("json") ? json : text);
    if (!g.flag("json")) print_written(written);
    return 0;
}

int run_fixture(const Given& g) {
    const std::string& path = g.positional.at(0);
    libcoil::FixtureRequest q;
    if (g.has("from")) q.from = g.quantity("from");
    if (g.has("to")) q.to = g.quantity("to");
    if (g.has("points")) q.points = static_cast<int>(g.whole("points", 2, 100000, 401));
    const libcoil::FixtureResult r = libcoil::fixture_study(libcoil::load_fixture(path), q);
    const std::string text = libcoil::fixture_text_report(r), json = libcoil::fixture_json_report(r);
    std::vector<std::string> written;
    if (g.has("out")) {
        const std::filesystem::path dir(g.text("out"));
        const std::string stem = stem_of(path);
        written = write_all({{dir / (stem + ".fixture.txt"), text}, {dir / (stem + ".fixture.json"), json},
                             {dir / (stem + ".fixture.csv"), libcoil::fixture_csv(r)}, {dir / (stem + ".fixture.svg"), libcoil::fixture_svg(r)},
                             {dir / (stem + (r.ports.size() == 2 ? ".s2p" : ".s1p")), libcoil::fixture_touchstone(r)}});
    }
    std::cout << (g.flag("json") ? json : text);
    if (!g.flag("json")) print_written(written);
    return 0;
}

int run_export_circuit(const Given& g) {
    const std::string& path = g.positional.at(0);
    libcoil::CircuitExportRequest q;
    if (g.has("from")) q.from = g.quantity("from");
    if (g.has("to")) q.to = g.quantity("to");
    if (g.has("order")) q.order = static_cast<int>(g.whole("order", 1, 30));
    const libcoil::CircuitExport c = libcoil::circuit_export(libcoil::analyze(libcoil::load_coil_spec(path)), q);
    std::string name = "COIL_" + stem_of(path);
    for (char& ch : name) {
        if (!std::isalnum(static_cast<unsigned char>(ch))) ch = '_';
    }
    if (g.has("name")) name = g.text("name");
    const std::string text = libcoil::circuit_export_text(c), spice = libcoil::spice_subcircuit(c, name);
    std::vector<std::string> written;
    if (g.has("out")) {
        const std::filesystem::path dir(g.text("out"));
        written = write_all({{dir / (stem_of(path) + ".cir"), spice}, {dir / (stem_of(path) + ".circuit.txt"), text}});
        std::cout << text;
        print_written(written);
    } else {
        std::cout << spice;
    }
    return 0;
}

int run_design(const Given& g) {
    const std::string& path = g.positional.at(0);
    const libcoil::Requirement q = libcoil::load_requirement(path);
    libcoil::DesignOptions opt;
    opt.threads = static_cast<unsigned>(g.whole("threads", 1, 1024, 0));
    opt.top = static_cast<std::size_t>(g.whole("top", 1, 100000, 10));
    opt.spread = g.flag("spread");
    opt.samples = static_cast<std::size_t>(g.whole("samples", 10, 10000000, 2000));
    opt.seed = static_cast<std::uint64_t>(g.whole("seed", 0, 2147483647, 1));
    // Progress on stderr, on a terminal only, once the search has run for a second.
    if (::isatty(STDERR_FILENO) != 0) {
        auto progress = std::make_shared<Progress>(Progress{std::chrono::steady_clock::now(), "design search, candidate"});
        opt.progress = [progress](std::size_t d, std::size_t t) { (*progress)(d, t); };
    }
    const libcoil::DesignResult r = libcoil::design(q, opt);
    const std::string text = libcoil::design_text_report(q, r, opt.top), json = libcoil::design_json_report(q, r, opt.top);
    std::vector<std::string> written;
    if (g.has("out")) {
        const std::filesystem::path dir(g.text("out"));
        const std::string stem = stem_of(path);
        libcoil::FileSet files{{dir / (stem + ".design.txt"), text}, {dir / (stem + ".design.json"), json}};
        if (r.chosen) {
            const auto& d = r.pareto[*r.chosen];
            files.emplace_back(dir / (stem + ".chosen.yaml"), libcoil::coil_spec_yaml(r.specs[*r.chosen], q.wires[d.wire_index].choice));
        }
        written = write_all(files);
    }
    std::cout << (g.flag("json") ? json : text);
    if (!g.flag("json")) print_written(written);
    return 0;
}

// "40 mm x 2 mm"
libcoil::FlangeSpec parse_flange(const std::string& text, const std::string& flag) {
    const auto x = text.find('x');
    if (x == std::string::npos) {
        throw libcoil::InputError(flag, libcoil::quoted(text) + "; expected DIAMETER x THICKNESS, e.g. \"40 mm x 2 mm\"");
    }
    const libcoil::FlangeSpec f{libcoil::parse_quantity(text.substr(0, x), Dimension::length, flag),
                                libcoil::parse_quantity(text.substr(x + 1), Dimension::length, flag)};
    if (!(f.diameter > 0 && f.thickness > 0)) {
        throw libcoil::InputError(flag, libcoil::quoted(text) + "; expected a diameter and a thickness both greater than zero");
    }
    return f;
}

int run_former(const Given& g) {
    if (!g.has("out_dir")) throw libcoil::InputError("out_dir", "required: the directory to write the former's files into");
    libcoil::FormerOptions opt;
    opt.kind = g.choice<libcoil::FormerKind>("kind");
    opt.profile = g.choice<libcoil::GrooveProfile>("profile");
    if (g.has("ribs")) opt.ribs = static_cast<int>(g.whole("ribs", -1000000, 1000000));
    opt.rib_width = g.optional_quantity("rib_width");
    opt.groove_depth = g.optional_quantity("groove_depth");
    opt.clearance = g.optional_quantity("clearance");
    opt.ends = g.optional_quantity("ends");
    opt.bore_oversize = g.optional_quantity("bore_oversize");
    if (g.has("flange")) opt.flange = parse_flange(g.text("flange"), "--flange");
    opt.chord_tolerance = g.quantity("chord_tolerance");
    const std::string& spec = g.positional.at(0);
    const libcoil::FormerBuild b = libcoil::build_former(libcoil::load_coil_spec(spec), opt);
    const libcoil::FileSet files = libcoil::former_files(b, g.text("out_dir"), stem_of(spec), g.flag("ascii"));
    std::vector<std::string> names;
    for (const auto& [p, c] : files) names.push_back(p.string());
    const std::string text = libcoil::former_text_report(b, names), json = libcoil::former_json_report(b, names);
    libcoil::write_file_set(files);
    std::cout << (g.flag("json") ? json : text);
    return 0;
}

// "30 mm:300 mm:25": FROM:TO:POINTS, log-spaced
std::vector<double> parse_distance_sweep(const std::string& text) {
    const std::string flag = "--sweep-distance";
    const auto c1 = text.find(':'), c2 = text.rfind(':');
    if (c1 == std::string::npos || c2 == c1) {
        throw libcoil::InputError(flag, libcoil::quoted(text) + "; expected FROM:TO:POINTS, e.g. \"30 mm:300 mm:25\"");
    }
    const double lo = libcoil::parse_quantity(text.substr(0, c1), Dimension::length, flag);
    const double hi = libcoil::parse_quantity(text.substr(c1 + 1, c2 - c1 - 1), Dimension::length, flag);
    const double n = libcoil::parse_quantity(text.substr(c2 + 1), Dimension::dimensionless, flag);
    if (!(lo > 0 && hi > lo && n >= 2 && n <= 1000 && n == std::floor(n))) {
        throw libcoil::InputError(flag, libcoil::quoted(text) + "; expected 0 < FROM < TO and 2 to 1000 points");
    }
    return libcoil::frequency_grid(lo, hi, static_cast<int>(n), libcoil::Spacing::logarithmic);
}

int run_couple(const Given& g) {
    if (!g.has("distance")) throw libcoil::InputError("distance", "required: the distance between the coils' centres, e.g. \"60 mm\"");
    std::vector<double> f;
    if (g.has("frequencies")) {
        for (const auto& t : g.values.at("frequencies")) f.push_back(libcoil::parse_quantity(t, Dimension::frequency, "--frequency"));
    }
    const std::vector<double> sweep = g.has("sweep_distances") ? parse_distance_sweep(g.text("sweep_distances")) : std::vector<double>{};
    const libcoil::CouplingStudy s = libcoil::study_coupling(
        libcoil::load_coil_spec(g.positional.at(0)), libcoil::load_coil_spec(g.positional.at(1)), *g.choice<libcoil::Arrangement>("arrangement"),
        g.quantity("distance"), g.quantity("axial_offset"), f, g.quantity("source_resistance"), g.quantity("load_resistance"), sweep);
    libcoil::FileSet files;
    if (g.has("out")) {
        const std::filesystem::path dir(g.text("out"));
        const std::string stem = stem_of(g.positional[0]) + "+" + stem_of(g.positional[1]) + ".couple";
        files.emplace_back(dir / (stem + ".json"), "");
        if (s.sweep.size() >= 2) files.emplace_back(dir / (stem + ".svg"), libcoil::coupling_svg(s));
    }
    std::vector<std::string> names;
    for (const auto& [p, c] : files) names.push_back(p.string());
    const std::string json = libcoil::coupling_json_report(s, names);
    for (auto& [p, c] : files) {
        if (c.empty()) c = json;
    }
    libcoil::write_file_set(files);
    std::cout << (g.flag("json") ? json : libcoil::coupling_text_report(s, names));
    return 0;
}

int run_wire(const Given& g) {
    const double f = g.quantity("frequency");
    const double t = g.quantity("temperature");
    const libcoil::Conductor& c = libcoil::conductor(g.text("conductor", "copper"), "--conductor");
    if (g.flag("table")) {
        std::cout << libcoil::wire_table_text(libcoil::wire_table(c, t, f));
        return 0;
    }
    if (g.has("gauge") == g.has("diameter")) {
        throw libcoil::InputError("--gauge", "give either --gauge (\"AWG 18\") or --diameter (\"1 mm\"), or --table");
    }
    libcoil::WireChoice choice;
    if (g.has("gauge")) choice.gauge = libcoil::parse_awg(g.text("gauge"), "--gauge");
    if (g.has("diameter")) choice.diameter = g.quantity("diameter");
    if (g.has("insulation")) {
        choice.insulation = g.quantity("insulation");
    } else {
        choice.enamel_grade = libcoil::parse_enamel_grade(g.text("enamel_grade", "1"), "--enamel");
    }
    const libcoil::WireStudy w = libcoil::study_wire(libcoil::make_wire(choice, ""), c, t, f);
    std::cout << (g.flag("json") ? libcoil::wire_json_report(w) : libcoil::wire_text_report(w));
    return 0;
}

// A library check of an option speaks SI ("-0.001 must be greater than zero"); when the message begins with
// the value of the text the user typed for that option, it is said in the user's words ("-1 mm" ...).
std::string in_users_words(const Given& g, const libcoil::InputError& e) {
    const auto given = g.values.find(e.field());
    if (given == g.values.end() || given->second.size() != 1) return e.detail();
    const fe::Option& o = fe::option(g.verb, e.field());
    if (o.kind != fe::Kind::quantity) return e.detail();
    const std::string& text = given->second.front();
    const std::string si = libcoil::format_value(libcoil::parse_quantity(text, o.dimension, o.flag)) + " ";
    if (e.detail().compare(0, si.size(), si) != 0) return e.detail();
    return libcoil::quoted(text) + e.detail().substr(si.size() - 1);
}

struct Verb {
    const char* name;
    const char* help;
    std::vector<std::pair<const char*, const char*>> positional;  // name, help
    int (*run)(const Given&);
};

const Verb verbs[] = {
    {"analyze", "Geometry, inductance, losses, self-resonance and the band check of the coil in a YAML spec",
     {{"spec", "Coil spec (YAML)"}}, run_analyze},
    {"sweep", "Impedance of the coil over frequency: CSV, Touchstone (.s1p) and a picture", {{"spec", "Coil spec (YAML)"}}, run_sweep},
    {"compare", "The coil in a spec against a measurement of it (Touchstone .s1p/.s2p/.ts or CSV): the figures of both, side by side",
     {{"spec", "Coil spec (YAML)"}, {"measurement", "The measured file"}}, run_compare},
    {"fixture", "The port impedance of a fixture (YAML) with its coils as their analyses see them, against its reference",
     {{"fixture", "Fixture description (YAML)"}}, run_fixture},
    {"export-circuit", "An equivalent circuit of the coil for a circuit simulator: a SPICE subcircuit fitted to its impedance",
     {{"spec", "Coil spec (YAML)"}}, run_export_circuit},
    {"design", "Search for the coils that meet a requirement (YAML) and rank them", {{"requirement", "Design requirement (YAML)"}},
     run_design},
    {"former", "A printable winding former for the coil in a spec: STL, a dimension sheet (SVG) and its dimensions (YAML)",
     {{"spec", "Coil spec (YAML), such as the NAME.chosen.yaml that 'coil design' writes"}}, run_former},
    {"couple", "Mutual inductance, coupling and crosstalk between two coils (YAML specs)",
     {{"a", "Coil A, the driven one (YAML spec)"}, {"b", "Coil B, the victim (YAML spec)"}}, run_couple},
    {"wire", "Diameter, DC resistance, skin depth and skin ratio of a wire", {}, run_wire},
};

}  // namespace

int main(int argc, char** argv) {
    CLI::App app{"coil: design and check single-layer air-core coils (libcoil " + std::string(libcoil::version) + ")"};
    app.set_version_flag("--version", std::string("coil (libcoil) ") + libcoil::version);
    app.require_subcommand(1);
    app.footer("Run 'coil VERB --help' for the options of each verb. Values take units: \"20 mm\", \"1.2 uH\".");

    std::vector<std::pair<CLI::App*, std::unique_ptr<Given>>> subs;
    for (const Verb& v : verbs) {
        auto given = std::make_unique<Given>();
        given->verb = v.name;
        CLI::App* sub = app.add_subcommand(v.name, v.help);
        given->positional.resize(v.positional.size());
        for (std::size_t i = 0; i < v.positional.size(); ++i) {
            sub->add_option(v.positional[i].first, given->positional[i], v.positional[i].second)->required()->check(CLI::ExistingFile);
        }
        add_options(sub, *given);
        subs.emplace_back(sub, std::move(given));
    }

    try {
        app.parse(argc, argv);
    } catch (const CLI::CallForHelp& e) {
        return app.exit(e);
    } catch (const CLI::CallForAllHelp& e) {
        return app.exit(e);
    } catch (const CLI::CallForVersion& e) {
        return app.exit(e);
    } catch (const CLI::ParseError& e) {
        // One line, as every other bad input's (CLI11 words it: an unknown option, a missing file, ...).
        std::cerr << "coil: " << e.what() << " ('coil VERB --help' lists the options)\n";
        return exit_bad_input;
    }

    for (std::size_t i = 0; i < subs.size(); ++i) {
        if (!subs[i].first->parsed()) continue;
        const Given& g = *subs[i].second;
        try {
            // An option given as an empty text is a mistake (an unset shell variable, say), never "the default":
            // --out "" would otherwise write into the current directory.
            for (const auto& [key, given] : g.values) {
                for (const auto& v : given) {
                    if (v.empty()) throw libcoil::InputError(key, "is empty; give a value or leave the option out");
                }
            }
            return verbs[i].run(g);
        } catch (const libcoil::InputError& e) {
            // The library names its fields; the table turns an option's field back into the flag the user typed.
            std::cerr << "coil: " << libcoil::InputError(fe::flag_for_field(g.verb, e.field()), in_users_words(g, e)).what() << "\n";
            return exit_bad_input;
        } catch (const libcoil::DomainError& e) {
            std::cerr << "coil: outside every model's domain: " << e.what() << "\n";
            return exit_bad_input;
        } catch (const std::exception& e) {
            std::cerr << "coil: internal error, please report: " << e.what() << "\n";
            return 1;
        }
    }
    return 1;
}
