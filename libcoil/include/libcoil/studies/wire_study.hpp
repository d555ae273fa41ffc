// The wire study (`coil wire`): one wire, or a table of gauges, at a temperature and frequency.
#pragma once

#include <string>
#include <vector>

#include "libcoil/models/losses.hpp"
#include "libcoil/models/materials.hpp"
#include "libcoil/models/wire.hpp"

namespace libcoil {

struct WireStudy {
    Wire wire;
    std::string conductor;
    double temperature = 0, frequency = 0;  // K, Hz
    WireAtFrequency at;
};

WireStudy study_wire(const Wire& wire, const Conductor& conductor, double temperature, double frequency);
// AWG 10 .. 40 (even gauges) and the metric sizes 0.1 .. 3.15 mm, enamel grade 1.
std::vector<WireStudy> wire_table(const Conductor& conductor, double temperature, double frequency);

}  // namespace libcoil
