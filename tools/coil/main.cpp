// coil: the command-line face of libcoil. It parses arguments, calls the library and prints; the physics
// lives in libcoil. Exit codes: 0 done, 2 bad input (nothing written to stdout or to files), 1 other failure.
#include <filesystem>
#include <iostream>
#include <string>

#include <CLI/CLI.hpp>

#include "libcoil/libcoil.hpp"

namespace {

constexpr int exit_bad_input = 2;

struct AnalyzeOptions {
    std::string spec;
    bool json = false;
    std::string out_dir;
};

int run_analyze(const AnalyzeOptions& o) {
    const libcoil::Analysis a = libcoil::analyze(libcoil::load_coil_spec(o.spec));
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
