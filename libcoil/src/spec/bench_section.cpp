// The spec's `bench:` section: the values a bench fit taught about the built coil (records.hpp's
// BenchCorrections), written inline or as the name of the file `coil compare --fit` wrote.
#include <cmath>

#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "spec/spec_sections.hpp"

namespace libcoil::detail {

namespace {

BenchCorrections read_values(const YamlMap& m) {
    m.allow_only({"former_permittivity", "former_loss_tangent", "stray_capacitance", "lead_inductance", "resistance_scale"});
    BenchCorrections b;
    if (m.has("former_permittivity")) {
        b.former_permittivity = m.quantity("former_permittivity", Dimension::dimensionless);
        if (!(*b.former_permittivity >= 1 && *b.former_permittivity <= 30)) {
            throw InputError(m.path_of("former_permittivity"), "\"" + m.text("former_permittivity") + "\"; expected 1 .. 30");
        }
    }
    if (m.has("former_loss_tangent")) {
        b.former_loss_tangent = m.quantity("former_loss_tangent", Dimension::dimensionless);
        if (!(*b.former_loss_tangent >= 0 && *b.former_loss_tangent <= 1)) {
            throw InputError(m.path_of("former_loss_tangent"), "\"" + m.text("former_loss_tangent") + "\"; expected 0 .. 1");
        }
    }
    if (m.has("stray_capacitance")) b.stray_capacitance = m.non_negative_quantity("stray_capacitance", Dimension::capacitance);
    if (m.has("lead_inductance")) b.lead_inductance = m.quantity("lead_inductance", Dimension::inductance);
    if (m.has("resistance_scale")) b.resistance_scale = m.positive_quantity("resistance_scale", Dimension::dimensionless);
    return b;
}

}  // namespace

BenchCorrections read_bench(const YamlMap& top, const std::filesystem::path& base) {
    if (top.has_map("bench")) {
        BenchCorrections b = read_values(top.map("bench"));
        b.source = "the spec's bench section";
        return b;
    }
    std::filesystem::path file(top.text("bench"));
    if (file.is_relative()) file = base / file;
    const YAML::Node root = load_yaml(read_text_file(file, "bench file"), file.string());
    const YamlMap doc(root, file.string() + ":");
    if (!root.IsMap() || !doc.has_map("bench")) {
        throw InputError(top.path_of("bench"), "\"" + file.string() + "\" holds no \"bench:\" mapping (the file coil compare --fit writes)");
    }
    doc.allow_only({"bench"});
    BenchCorrections b = read_values(YamlMap(root["bench"], file.string() + ": bench"));
    b.source = file.string();
    return b;
}

}  // namespace libcoil::detail
