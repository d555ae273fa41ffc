#include "libcoil/models/materials.hpp"

#include <dlfcn.h>

#include <algorithm>
#include <cstdlib>
#include <mutex>

#include <yaml-cpp/yaml.h>

#include "models/data_tables.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "core/suggest.hpp"

#ifndef LIBCOIL_INSTALL_DATADIR
#define LIBCOIL_INSTALL_DATADIR ""
#endif
#ifndef LIBCOIL_SOURCE_DATADIR
#define LIBCOIL_SOURCE_DATADIR ""
#endif

namespace libcoil {

double Conductor::resistivity_at(double temperature_kelvin) const {
    require_temperature("temperature", temperature_kelvin);
    const double rho = resistivity_20 * (1 + temperature_coefficient * (temperature_kelvin - (zero_celsius + 20)));
    if (!(rho > 0)) {
        throw InputError("temperature", format_value(temperature_kelvin - zero_celsius) +
                                            " degC is outside the linear resistivity law of " + name);
    }
    return rho;
}

namespace {

constexpr const char* marker = "wires.yaml";

std::vector<std::filesystem::path> candidate_directories() {
    std::vector<std::filesystem::path> dirs;
    if (const char* env = std::getenv("LIBCOIL_DATA_DIR"); env && *env) dirs.emplace_back(env);
    // The binary or module that holds this code: build/bin/coil, build/python/libcoil/_core*.so, or
    // PREFIX/bin/coil. Its data sits in share/libcoil beside or above it.
    Dl_info info{};
    if (dladdr(reinterpret_cast<void*>(&candidate_directories), &info) && info.dli_fname) {
        std::error_code ec;
        auto self = std::filesystem::weakly_canonical(info.dli_fname, ec);
        if (!ec) {
            for (auto dir = self.parent_path(); dir.has_relative_path(); dir = dir.parent_path()) {
                dirs.push_back(dir / "share" / "libcoil");
                if (dirs.size() > 6) break;
            }
        }
    }
    if (*LIBCOIL_INSTALL_DATADIR) dirs.emplace_back(LIBCOIL_INSTALL_DATADIR);
    if (*LIBCOIL_SOURCE_DATADIR) dirs.emplace_back(LIBCOIL_SOURCE_DATADIR);
    return dirs;
}

std::filesystem::path find_data_directory() {
    std::string searched;
    for (const auto& d : candidate_directories()) {
        std::error_code ec;
        if (std::filesystem::is_regular_file(d / marker, ec)) return d;
        searched += "\n  " + d.string();
    }
    throw InputError("LIBCOIL_DATA_DIR", "the libcoil data files (" + std::string(marker) +
                                             ") were not found; searched:" + searched);
}

YAML::Node load(const std::filesystem::path& file) {
    try {
        return YAML::LoadFile(file.string());
    } catch (const YAML::Exception& e) {
        throw InputError(file.string(), std::string("cannot read data file: ") + e.what());
    }
}

double number(const YAML::Node& n, const std::string& where) {
    try {
        return require_finite(where, n.as<double>());
    } catch (const YAML::Exception&) {
        throw InputError(where, "expected a number in the data file");
    }
}

detail::Tables read_tables() {
    detail::Tables t;
    t.directory = find_data_directory();

    const auto wires = load(t.directory / "wires.yaml");
    for (const auto& d : wires["metric_diameters_mm"]) t.metric_diameters.push_back(number(d, "metric_diameters_mm") * 1e-3);
    for (const auto& row : wires["enamel_grades"]["rows"]) {
        const double bare = number(row[0], "enamel_grades.rows") * 1e-3;
        detail::EnamelRow r{bare, {}};
        for (int g = 0; g < 3; ++g) r.build[g] = (number(row[g + 1], "enamel_grades.rows") * 1e-3 - bare) / 2;
        t.enamel.push_back(r);
    }
    std::sort(t.enamel.begin(), t.enamel.end(),
              [](const auto& a, const auto& b) { return a.bare_diameter < b.bare_diameter; });

    const auto cond = load(t.directory / "conductors.yaml");
    for (const auto& kv : cond["conductors"]) {
        const auto name = kv.first.as<std::string>();
        const auto& v = kv.second;
        t.conductors.push_back(Conductor{name, number(v["resistivity_20"], name + ".resistivity_20"),
                                         number(v["temperature_coefficient"], name + ".temperature_coefficient"),
                                         number(v["relative_permeability"], name + ".relative_permeability"),
                                         v["source"].as<std::string>("")});
    }

    const auto formers = load(t.directory / "former_materials.yaml");
    for (const auto& kv : formers["former_materials"]) {
        const auto name = kv.first.as<std::string>();
        const auto& v = kv.second;
        t.former_materials.push_back(
            FormerMaterial{name, number(v["relative_permittivity"], name + ".relative_permittivity"),
                           number(v["loss_tangent"], name + ".loss_tangent"),
                           number(v["max_service_temperature"], name + ".max_service_temperature") + zero_celsius,
                           v["source"].as<std::string>("")});
    }
    return t;
}

template <class T>
const T& find_named(const std::vector<T>& items, std::string_view name, std::string_view field, const char* what) {
    std::vector<std::string> names;
    for (const auto& it : items) {
        if (detail::equal_ignoring_case(it.name, name)) return it;
        names.push_back(it.name);
    }
    throw InputError(std::string(field), "unknown " + std::string(what) + " \"" + std::string(name) + "\"" +
                                             detail::did_you_mean(name, names) + " Known: " + detail::join(names));
}

}  // namespace

const detail::Tables& detail::tables() {
    static const Tables t = read_tables();  // thread-safe initialisation; a throw retries next call
    return t;
}

std::filesystem::path data_directory() { return detail::tables().directory; }

const Conductor& conductor(std::string_view name, std::string_view field) {
    return find_named(detail::tables().conductors, name, field, "conductor");
}

const FormerMaterial& former_material(std::string_view name, std::string_view field) {
    return find_named(detail::tables().former_materials, name, field, "former material");
}

std::vector<std::string> conductor_names() {
    std::vector<std::string> n;
    for (const auto& c : detail::tables().conductors) n.push_back(c.name);
    return n;
}

std::vector<std::string> former_material_names() {
    std::vector<std::string> n;
    for (const auto& m : detail::tables().former_materials) n.push_back(m.name);
    return n;
}

}  // namespace libcoil
