// Material tables: conductors and former plastics, read from data/*.yaml.
//
// The data directory is found without configuration: $LIBCOIL_DATA_DIR if set, else share/libcoil next
// to the running binary or module (build tree and installed tree), else the install prefix, else the
// source tree. data_directory() says which one was used.
#pragma once

#include <filesystem>
#include <string>
#include <string_view>
#include <vector>

namespace libcoil {

struct Conductor {
    std::string name;
    double resistivity_20 = 0;            // ohm*m at 20 degC
    double temperature_coefficient = 0;   // 1/K at 20 degC
    double relative_permeability = 1;
    std::string source;

    // rho(T) = rho20 * (1 + alpha20 * (T - 293.15 K)), the linear law of IEC 60028.
    double resistivity_at(double temperature_kelvin) const;
};

struct FormerMaterial {
    std::string name;
    double relative_permittivity = 1;
    double loss_tangent = 0;
    double max_service_temperature = 0;  // K
    std::string source;
};

std::filesystem::path data_directory();

const Conductor& conductor(std::string_view name, std::string_view field = "conductor");
const FormerMaterial& former_material(std::string_view name, std::string_view field = "former.material");
std::vector<std::string> conductor_names();
std::vector<std::string> former_material_names();

}  // namespace libcoil
