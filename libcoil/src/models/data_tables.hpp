// Internal: the tables read from the data directory, loaded once on first use.
#pragma once

#include <array>
#include <filesystem>
#include <vector>

#include "libcoil/models/materials.hpp"

namespace libcoil::detail {

struct EnamelRow {
    double bare_diameter;         // m
    std::array<double, 3> build;  // m, radial build for grades 1, 2, 3
};

struct Tables {
    std::filesystem::path directory;
    std::vector<EnamelRow> enamel;  // sorted by bare diameter
    std::vector<double> metric_diameters;
    std::vector<Conductor> conductors;
    std::vector<FormerMaterial> former_materials;
};

const Tables& tables();

}  // namespace libcoil::detail
