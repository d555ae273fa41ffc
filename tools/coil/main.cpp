// coil: the command-line face of libcoil. It parses arguments, calls the library and prints; the physics
// lives in libcoil. Exit codes: 0 done, 2 bad input (nothing written to stdout or to files), 1 other failure.
#include <unistd.h>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <filesystem>
#include <iostream>
#include <memory>
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

#include "libcoil/libcoil.hpp"

namespace {

constexpr int exit_bad_input = 2;

struct AnalyzeOptions {
    std::string spec;
    bool json = false;
    std::string out_dir;
    std::string solver = "closed-form";
    int layers = 0;   // 0: chosen from the highest frequency
    int sectors = 0;
};

// Progress on stderr once a numerical solve has run for more than a second.
struct Progress {
    std::chrono::steady_clock::time_point start = std::chrono::steady_clock::now();
    bool shown = false;
    void operator()(std::size_t done, std::size_t total) {
        const double s = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
        if (s < 1.0 && !shown) return;
        shown = true;
        // On a terminal one line is redrawn; elsewhere each update is its own line.
        const bool tty = ::isatty(STDERR_FILENO) != 0;
        std::fprintf(stderr, "%scoil: cross-section solver, frequency %zu of %zu (%.0f s)%s", tty ? "\r" : "", done, total, s,
                     (!tty || done == total) ? "\n" : "");
        std::fflush(stderr);
    }
};

int run_analyze(const AnalyzeOptions& o) {
    libcoil::AnalysisOptions opt;
    if (o.solver == "filaments") {
        opt.solver = libcoil::LossSolver::filaments;
        if (o.layers > 0) {
            opt.auto_subdivision = false;
            opt.subdivision.layers = o.layers;
            opt.subdivision.sectors = o.sectors > 0 ? o.sectors : 2 * o.layers;
        }
        auto progress = std::make_shared<Progress>();
        opt.progress = [progress](std::size_t d, std::size_t t) { (*progress)(d, t); };
    }
    const libcoil::Analysis a = libcoil::analyze(libcoil::load_coil_spec(o.spec), opt);
    const std::string text = libcoil::text_report(a);
    const std::string json = libcoil::json_report(a);
    if (!o.out_dir.empty()) {
        const std::filesystem::path dir(o.out_dir);
        const std::string stem = std::filesystem::path(o.spec).stem().string();
        libcoil::write_file_atomically(dir / (stem + ".analysis.txt"), text);
        libcoil::write_file_atomically(dir / (stem + ".analysis.json"), json);
    }
    std::cout << (o.json ? json : text);
    if (!o.out_dir.empty() && !o.json) {
        const auto base = std::filesystem::path(o.out_dir) / std::filesystem::path(o.spec).stem();
        std::cout << "\nWritten: " << base.string() << ".analysis.txt\n         " << base.string() << ".analysis.json\n";
    }
    return 0;
}

struct SweepOptions {
    std::string spec, from, to, out_dir;
    int points = 401;
    std::string spacing = "log", model = "helical-line", capacitance = "helical-line";
};

int run_sweep(const SweepOptions& o) {
    using libcoil::Dimension;
    const libcoil::Analysis a = libcoil::analyze(libcoil::load_coil_spec(o.spec));
    const libcoil::SelfResonance& sr = a.self_resonance;
    const auto& band = a.spec.band;
    // Defaults: from below the band (or 1/1000 of the SRF) to past the SRF (and the band).
    const double from = !o.from.empty() ? libcoil::parse_quantity(o.from, Dimension::frequency, "--from")
                        : band            ? band->low / 2
                                          : sr.frequency / 1000;
    const double to = !o.to.empty() ? libcoil::parse_quantity(o.to, Dimension::frequency, "--to")
                                    : std::max(3 * sr.frequency, band ? 2 * band->ceiling : 0.0);
    const auto freqs = libcoil::frequency_grid(from, to, o.points, o.spacing == "log");
    const auto model = o.model == "lumped" ? libcoil::ImpedanceModel::lumped : libcoil::ImpedanceModel::helical_line;
    double c = 0;
    if (o.capacitance == "medhurst") {
        if (model != libcoil::ImpedanceModel::lumped) {
            throw libcoil::InputError("--capacitance", "medhurst applies to --model lumped only");
        }
        if (!sr.medhurst.available) throw libcoil::InputError("--capacitance", "this coil is outside Medhurst's table");
        c = sr.medhurst.capacitance;
    }
    const auto points = libcoil::coil_impedance(a).sweep(freqs, model, c);
    const double srf = c > 0 ? sr.medhurst.frequency : sr.frequency;
    const std::string csv = libcoil::sweep_csv(points);
    if (o.out_dir.empty()) {
        std::cout << csv;
        return 0;
    }
    const std::string title = a.spec.name.empty() ? std::filesystem::path(o.spec).stem().string() : a.spec.name;
    std::vector<std::string> comments{
        "libcoil " + std::string(libcoil::version) + " one-port S11 of the coil, " + title,
        std::string("impedance model: ") + libcoil::impedance_model_name(model) + ", self-resonance " +
            libcoil::format_quantity(srf, Dimension::frequency) + ", " + libcoil::mounting_name(sr.mounting),
        "inductance " + libcoil::format_quantity(a.inductance.recommended, Dimension::inductance) + ", wire at " +
            libcoil::format_quantity(a.spec.operating.temperature, Dimension::temperature)};
    libcoil::SweepPicture pic{title, a.inductance.recommended, srf, {}, {}, libcoil::impedance_model_name(model)};
    if (band) {
        pic.band_low = band->low;
        pic.band_ceiling = band->ceiling;
    }
    const std::string svg = libcoil::impedance_svg(points, pic);
    const std::filesystem::path dir(o.out_dir);
    const std::string stem = std::filesystem::path(o.spec).stem().string();
    const auto csv_path = dir / (stem + ".sweep.csv"), s1p_path = dir / (stem + ".s1p"), svg_path = dir / (stem + ".sweep.svg");
    const std::string s1p = libcoil::touchstone_s1p(points, comments);
    libcoil::write_file_atomically(csv_path, csv);
    libcoil::write_file_atomically(s1p_path, s1p);
    libcoil::write_file_atomically(svg_path, svg);
    std::cout << "coil sweep: " << points.size() << " points, " << libcoil::format_quantity(from, Dimension::frequency)
              << " to " << libcoil::format_quantity(to, Dimension::frequency) << " (" << o.spacing << "), "
              << libcoil::impedance_model_name(model) << " model; self-resonance "
              << libcoil::format_quantity(srf, Dimension::frequency) << "\n";
    std::cout << "Written: " << csv_path.string() << "\n         " << s1p_path.string() << "\n         " << svg_path.string()
              << "\n";
    return 0;
}

struct DesignCliOptions {
    std::string requirement, out_dir;
    bool json = false;
    int top = 10;
    unsigned threads = 0;
    bool spread = false;
    std::size_t samples = 2000;
    std::uint64_t seed = 1;
};

int run_design(const DesignCliOptions& o) {
    const libcoil::Requirement q = libcoil::load_requirement(o.requirement);
    libcoil::DesignOptions opt;
    opt.threads = o.threads;
    opt.top = static_cast<std::size_t>(std::max(1, o.top));
    opt.spread = o.spread;
    opt.samples = o.samples;
    opt.seed = o.seed;
    // Progress on stderr, on a terminal only, once the search has run for a second.
    const auto start = std::chrono::steady_clock::now();
    if (::isatty(STDERR_FILENO) != 0) {
        opt.progress = [start](std::size_t done, std::size_t total) {
            const double s = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
            if (s < 1.0) return;
            std::fprintf(stderr, "\rcoil: design search, %zu of %zu candidates (%.0f s)%s", done, total, s,
                         done == total ? "\n" : "");
            std::fflush(stderr);
        };
    }
    const libcoil::DesignResult r = libcoil::design(q, opt);
    const std::string text = libcoil::design_text_report(q, r, opt.top);
    const std::string json = libcoil::design_json_report(q, r, opt.top);
    std::vector<std::string> written;
    if (!o.out_dir.empty()) {
        const std::filesystem::path dir(o.out_dir);
        const std::string stem = std::filesystem::path(o.requirement).stem().string();
        libcoil::write_file_atomically(dir / (stem + ".design.txt"), text);
        libcoil::write_file_atomically(dir / (stem + ".design.json"), json);
        written = {(dir / (stem + ".design.txt")).string(), (dir / (stem + ".design.json")).string()};
        if (r.chosen) {
            const auto& d = r.pareto[*r.chosen];
            const auto path = dir / (stem + ".chosen.yaml");
            libcoil::write_file_atomically(path, libcoil::coil_spec_yaml(libcoil::design_spec(q, d), q.wires[d.wire_index].choice));
            written.push_back(path.string());
        }
    }
    std::cout << (o.json ? json : text);
    if (!o.json && !written.empty()) {
        std::cout << "\nWritten: ";
        for (std::size_t i = 0; i < written.size(); ++i) std::cout << (i ? "         " : "") << written[i] << "\n";
    }
    return 0;
}

struct FormerCliOptions {
    std::string spec, out_dir, kind, profile, depth, clearance, flange, ends, rib_width, bore_oversize, chord = "0.01 mm";
    int ribs = 0;
    bool json = false, ascii = false;
};

int run_former(const FormerCliOptions& o) {
    using libcoil::Dimension;
    libcoil::FormerOptions opt;
    const auto length = [](const std::string& text, const char* field) { return libcoil::parse_quantity(text, Dimension::length, field); };
    if (!o.kind.empty()) opt.kind = o.kind == "ribbed" ? libcoil::FormerKind::ribbed : libcoil::FormerKind::grooved_tube;
    if (o.ribs > 0) opt.ribs = o.ribs;
    if (!o.rib_width.empty()) opt.rib_width = length(o.rib_width, "--rib-width");
    if (!o.profile.empty()) opt.profile = o.profile == "vee" ? libcoil::GrooveProfile::vee : libcoil::GrooveProfile::round;
    if (!o.depth.empty()) opt.groove_depth = length(o.depth, "--groove-depth");
    if (!o.clearance.empty()) opt.clearance = length(o.clearance, "--clearance");
    if (!o.ends.empty()) opt.ends = length(o.ends, "--ends");
    if (!o.bore_oversize.empty()) opt.bore_oversize = length(o.bore_oversize, "--bore-oversize");
    if (!o.flange.empty()) {
        const auto x = o.flange.find('x');
        if (x == std::string::npos) throw libcoil::InputError("--flange", "\"" + o.flange + "\"; expected DIAMETER x THICKNESS, e.g. \"40 mm x 2 mm\"");
        opt.flange = libcoil::FlangeSpec{length(o.flange.substr(0, x), "--flange"), length(o.flange.substr(x + 1), "--flange")};
    }
    opt.chord_tolerance = length(o.chord, "--chord");
    if (!(opt.chord_tolerance > 0)) throw libcoil::InputError("--chord", "\"" + o.chord + "\"; expected a length above zero, e.g. \"0.01 mm\"");
    libcoil::CoilSpec spec = libcoil::load_coil_spec(o.spec);
    if (opt.kind == libcoil::FormerKind::ribbed && !(spec.former && spec.former->kind == libcoil::FormerKind::ribbed) && !(opt.ribs && opt.rib_width)) {
        throw libcoil::InputError("--kind", "ribbed needs --ribs and --rib-width when the spec's former is not ribbed");
    }
    const libcoil::FormerBuild b = libcoil::build_former(spec, opt);
    const std::string stem = std::filesystem::path(o.spec).stem().string();
    const auto paths = libcoil::former_file_paths(o.out_dir, stem);
    const std::string text = libcoil::former_text_report(b, paths), json = libcoil::former_json_report(b, paths);
    libcoil::write_former_files(b, o.out_dir, stem, o.ascii);
    std::cout << (o.json ? json : text);
    return 0;
}

struct CoupleOptions {
    std::string a, b, distance, offset = "0 mm", arrangement = "coaxial", sweep, source = "50 ohm", load = "50 ohm", out_dir;
    std::vector<std::string> frequencies;
    bool json = false;
};

int run_couple(const CoupleOptions& o) {
    using libcoil::Dimension;
    const double d = libcoil::parse_quantity(o.distance, Dimension::length, "--distance");
    const double h = libcoil::parse_quantity(o.offset, Dimension::length, "--offset");
    std::vector<double> f;
    for (const auto& t : o.frequencies) f.push_back(libcoil::parse_quantity(t, Dimension::frequency, "--frequency"));
    std::vector<double> sweep;
    if (!o.sweep.empty()) {
        // FROM:TO:N, log-spaced
        const auto c1 = o.sweep.find(':'), c2 = o.sweep.rfind(':');
        if (c1 == std::string::npos || c2 == c1) {
            throw libcoil::InputError("--sweep-distance", "\"" + o.sweep + "\"; expected FROM:TO:POINTS, e.g. \"30 mm:300 mm:25\"");
        }
        const double lo = libcoil::parse_quantity(o.sweep.substr(0, c1), Dimension::length, "--sweep-distance");
        const double hi = libcoil::parse_quantity(o.sweep.substr(c1 + 1, c2 - c1 - 1), Dimension::length, "--sweep-distance");
        const double n = libcoil::parse_quantity(o.sweep.substr(c2 + 1), Dimension::dimensionless, "--sweep-distance");
        if (!(lo > 0 && hi > lo && n >= 2 && n <= 1000 && n == std::floor(n))) {
            throw libcoil::InputError("--sweep-distance", "\"" + o.sweep + "\"; expected 0 < FROM < TO and 2 to 1000 points");
        }
        sweep = libcoil::frequency_grid(lo, hi, static_cast<std::size_t>(n), true);
    }
    const auto arr = libcoil::parse_arrangement(o.arrangement, "--arrangement");
    const libcoil::CouplingStudy s = libcoil::study_coupling(
        libcoil::load_coil_spec(o.a), libcoil::load_coil_spec(o.b), arr, d, h, f, libcoil::parse_quantity(o.source, Dimension::resistance, "--source"),
        libcoil::parse_quantity(o.load, Dimension::resistance, "--load"), sweep);
    std::vector<std::pair<std::filesystem::path, std::string>> files;
    if (!o.out_dir.empty()) {
        const std::filesystem::path dir(o.out_dir);
        const std::string stem = std::filesystem::path(o.a).stem().string() + "+" + std::filesystem::path(o.b).stem().string() + ".couple";
        files.emplace_back(dir / (stem + ".json"), "");
        if (s.sweep.size() >= 2) files.emplace_back(dir / (stem + ".svg"), libcoil::coupling_svg(s));
    }
    std::vector<std::string> names;
    for (const auto& [p, c] : files) names.push_back(p.string());
    const std::string json = libcoil::coupling_json_report(s, names);
    for (auto& [p, c] : files) libcoil::write_file_atomically(p, c.empty() ? json : c);
    std::cout << (o.json ? json : libcoil::coupling_text_report(s, names));
    return 0;
}

struct WireOptions {
    std::string gauge, diameter, insulation, enamel = "1";
    std::string frequency = "1 MHz", temperature = "20 degC", conductor = "copper";
    bool json = false, table = false;
};

int run_wire(const WireOptions& o) {
    using libcoil::Dimension;
    const double f = libcoil::parse_quantity(o.frequency, Dimension::frequency, "--frequency");
    const double t = libcoil::parse_quantity(o.temperature, Dimension::temperature, "--temperature");
    const libcoil::Conductor& c = libcoil::conductor(o.conductor, "--conductor");
    if (o.table) {
        std::cout << libcoil::wire_table_text(c, t, f);
        return 0;
    }
    if (o.gauge.empty() == o.diameter.empty()) {
        throw libcoil::InputError("--gauge", "give either --gauge (\"AWG 18\") or --diameter (\"1 mm\"), or --table");
    }
    libcoil::WireChoice choice;
    if (!o.gauge.empty()) choice.gauge = libcoil::parse_awg(o.gauge, "--gauge");
    if (!o.diameter.empty()) choice.diameter = libcoil::parse_quantity(o.diameter, Dimension::length, "--diameter");
    if (!o.insulation.empty()) {
        choice.insulation = libcoil::parse_quantity(o.insulation, Dimension::length, "--insulation");
    } else {
        choice.enamel_grade = libcoil::parse_enamel_grade(o.enamel, "--enamel");
    }
    const libcoil::Wire w = libcoil::make_wire(choice, "--");
    std::cout << (o.json ? libcoil::wire_json_report(w, c, t, f) : libcoil::wire_text_report(w, c, t, f));
    return 0;
}

}  // namespace

int main(int argc, char** argv) {
    CLI::App app{"coil: design and check single-layer air-core coils (libcoil " + std::string(libcoil::version) + ")"};
    app.set_version_flag("--version", std::string("coil (libcoil) ") + libcoil::version);
    app.require_subcommand(1);
    app.footer("Run 'coil VERB --help' for the options of each verb. Values take units: \"20 mm\", \"1.2 uH\".");

    AnalyzeOptions analyze;
    CLI::App* a = app.add_subcommand("analyze", "Compute the geometry and inductance of the coil in a YAML spec");
    a->add_option("spec", analyze.spec, "Coil spec (YAML)")->required()->check(CLI::ExistingFile);
    a->add_flag("--json", analyze.json, "Print one JSON object with SI values instead of the report");
    a->add_option("--out", analyze.out_dir, "Also write the report and the JSON into this directory");
    a->add_option("--solver", analyze.solver,
                  "Losses by 'closed-form' (Bessel skin + Butterworth proximity) or 'filaments' (numerical "
                  "cross-section solver)")
        ->check(CLI::IsMember({"closed-form", "filaments"}))
        ->capture_default_str();
    a->add_option("--layers", analyze.layers,
                  "Solver: radial layers across the wire (default: enough to resolve the skin depth)");
    a->add_option("--sectors", analyze.sectors, "Solver: angular cells per layer (default: twice the layers)");

    SweepOptions sweep;
    CLI::App* sw = app.add_subcommand("sweep", "Impedance of the coil over frequency: CSV, Touchstone (.s1p) and a picture");
    sw->add_option("spec", sweep.spec, "Coil spec (YAML)")->required()->check(CLI::ExistingFile);
    sw->add_option("--from", sweep.from, "First frequency (default: half the band's low edge, or SRF / 1000)");
    sw->add_option("--to", sweep.to, "Last frequency (default: 3 x SRF, or twice the band ceiling if higher)");
    sw->add_option("--points", sweep.points, "Number of frequencies")->capture_default_str();
    sw->add_option("--spacing", sweep.spacing, "log or linear")->check(CLI::IsMember({"log", "linear"}))->capture_default_str();
    sw->add_option("--model", sweep.model, "Impedance model: helical-line (distributed) or lumped (R + jwL parallel C)")
        ->check(CLI::IsMember({"helical-line", "lumped"}))
        ->capture_default_str();
    sw->add_option("--capacitance", sweep.capacitance, "Lumped model only: self-capacitance by helical-line or medhurst")
        ->check(CLI::IsMember({"helical-line", "medhurst"}))
        ->capture_default_str();
    sw->add_option("--out", sweep.out_dir, "Write STEM.sweep.csv, STEM.s1p and STEM.sweep.svg here (else CSV to stdout)");

    DesignCliOptions dsg;
    CLI::App* de = app.add_subcommand("design", "Search for the coils that meet a requirement (YAML) and rank them");
    de->add_option("requirement", dsg.requirement, "Design requirement (YAML)")->required()->check(CLI::ExistingFile);
    de->add_flag("--json", dsg.json, "Print one JSON object with SI values instead of the report");
    de->add_option("--out", dsg.out_dir, "Also write the report, the JSON and the chosen design's spec (NAME.chosen.yaml)");
    de->add_option("--top", dsg.top, "Designs to list")->capture_default_str();
    de->add_option("--threads", dsg.threads, "Search threads (default: all cores)");
    de->add_flag("--spread", dsg.spread, "Monte Carlo of the build tolerances on the chosen design");
    de->add_option("--samples", dsg.samples, "Spread: number of samples")->capture_default_str();
    de->add_option("--seed", dsg.seed, "Spread: random seed (the same seed gives the same samples)")->capture_default_str();

    FormerCliOptions fo;
    CLI::App* fm = app.add_subcommand("former", "A printable winding former for the coil in a spec: STL, a dimension sheet (SVG) and its dimensions (YAML)");
    fm->add_option("spec", fo.spec, "Coil spec (YAML), such as the NAME.chosen.yaml that 'coil design' writes")->required()->check(CLI::ExistingFile);
    fm->add_option("--out", fo.out_dir, "Write STEM.former.stl, STEM.former.svg and STEM.former.yaml here")->required();
    fm->add_option("--kind", fo.kind, "grooved-tube or ribbed (default: the spec's former.kind)")->check(CLI::IsMember({"grooved-tube", "ribbed"}));
    fm->add_option("--ribs", fo.ribs, "Ribbed: number of ribs");
    fm->add_option("--rib-width", fo.rib_width, "Ribbed: width of each rib at the groove root, e.g. \"3 mm\"");
    fm->add_option("--profile", fo.profile, "Groove profile: round or vee")->check(CLI::IsMember({"round", "vee"}));
    fm->add_option("--groove-depth", fo.depth, "Groove depth below the outer surface (default: half the insulated wire)");
    fm->add_option("--clearance", fo.clearance, "How much wider than the insulated wire the groove is (default 0.1 mm)");
    fm->add_option("--flange", fo.flange, "End flanges, DIAMETER x THICKNESS, e.g. \"40 mm x 2 mm\"");
    fm->add_option("--bore-oversize", fo.bore_oversize, "Print the bore this much wider (on the diameter) than nominal, for the shrinkage of printed holes");
    fm->add_option("--ends", fo.ends, "Plain former beyond the winding at each end (default: the spec's, else 5 mm)");
    fm->add_option("--chord", fo.chord, "Chord tolerance of the mesh")->capture_default_str();
    fm->add_flag("--ascii", fo.ascii, "Write ASCII STL instead of binary");
    fm->add_flag("--json", fo.json, "Print one JSON summary instead of the report");

    CoupleOptions cp;
    CLI::App* cu = app.add_subcommand("couple", "Mutual inductance, coupling and crosstalk between two coils (YAML specs)");
    cu->add_option("a", cp.a, "Coil A, the driven one (YAML spec)")->required()->check(CLI::ExistingFile);
    cu->add_option("b", cp.b, "Coil B, the victim (YAML spec)")->required()->check(CLI::ExistingFile);
    cu->add_option("--distance", cp.distance, "Centre-to-centre distance, e.g. \"60 mm\"")->required();
    cu->add_option("--arrangement", cp.arrangement, "coaxial (one axis) or side-by-side (parallel axes)")
        ->check(CLI::IsMember({"coaxial", "side-by-side"}))
        ->capture_default_str();
    cu->add_option("--offset", cp.offset, "Side by side: B's centre shifted along the axes")->capture_default_str();
    cu->add_option("--frequency", cp.frequencies, "Crosstalk frequencies (default: the specs' operating frequencies)");
    cu->add_option("--source", cp.source, "Source resistance driving A")->capture_default_str();
    cu->add_option("--load", cp.load, "Load resistance on B")->capture_default_str();
    cu->add_option("--sweep-distance", cp.sweep, "FROM:TO:POINTS, log-spaced: a table of k, and a picture with --out");
    cu->add_option("--out", cp.out_dir, "Write A+B.couple.json (and .svg with --sweep-distance) here");
    cu->add_flag("--json", cp.json, "Print one JSON object with SI values instead of the report");

    WireOptions wire;
    CLI::App* w = app.add_subcommand("wire", "Diameter, DC resistance, skin depth and skin ratio of a wire");
    w->add_option("--gauge", wire.gauge, "AWG gauge, e.g. \"AWG 18\"");
    w->add_option("--diameter", wire.diameter, "Bare diameter, e.g. \"1 mm\"");
    w->add_option("--insulation", wire.insulation, "Radial insulation build, e.g. \"0.04 mm\"");
    w->add_option("--enamel", wire.enamel, "IEC 60317 enamel grade 1, 2 or 3 (when no --insulation)")->capture_default_str();
    w->add_option("--frequency", wire.frequency, "Frequency")->capture_default_str();
    w->add_option("--temperature", wire.temperature, "Wire temperature")->capture_default_str();
    w->add_option("--conductor", wire.conductor, "copper, aluminium or silver")->capture_default_str();
    w->add_flag("--json", wire.json, "Print one JSON object with SI values");
    w->add_flag("--table", wire.table, "Print a table of AWG and metric wires instead");

    try {
        app.parse(argc, argv);
    } catch (const CLI::CallForHelp& e) {
        return app.exit(e);
    } catch (const CLI::CallForAllHelp& e) {
        return app.exit(e);
    } catch (const CLI::CallForVersion& e) {
        return app.exit(e);
    } catch (const CLI::ParseError& e) {
        app.exit(e);
        return exit_bad_input;
    }

    try {
        if (a->parsed()) return run_analyze(analyze);
        if (w->parsed()) return run_wire(wire);
        if (sw->parsed()) return run_sweep(sweep);
        if (de->parsed()) return run_design(dsg);
        if (fm->parsed()) return run_former(fo);
        if (cu->parsed()) return run_couple(cp);
    } catch (const libcoil::InputError& e) {
        std::cerr << "coil: " << e.what() << "\n";
        return exit_bad_input;
    } catch (const libcoil::DomainError& e) {
        std::cerr << "coil: outside every model's domain: " << e.what() << "\n";
        return exit_bad_input;
    } catch (const std::exception& e) {
        std::cerr << "coil: internal error: " << e.what() << "\n";
        return 1;
    }
    return 1;
}
