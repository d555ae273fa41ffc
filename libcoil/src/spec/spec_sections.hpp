// Internal: the YAML sections that a coil spec and a design requirement share.
#pragma once

#include <filesystem>
#include <string>
#include <string_view>
#include <vector>

#include <yaml-cpp/yaml.h>

#include "libcoil/spec/spec.hpp"
#include "libcoil/spec/fixture.hpp"
#include "core/text_file.hpp"
#include "spec/yaml_reader.hpp"

namespace libcoil::detail {

// `form_diameter` is the smallest former the section must fit (the wall, the ribs' gaps).
FormerSpec read_former(const YamlMap& m, double form_diameter, std::vector<std::string>& notes);
Surroundings read_surroundings(const YamlMap& m);
ShieldSpec read_shield(const YamlMap& m);
BandSpec read_band(const YamlMap& m);
// tolerances: one standard deviation each (form_diameter, pitch, wire_diameter as a percentage, turns).
BuildTolerances read_tolerances(const YamlMap& m);
// limits.enamel_class: an IEC 60317 thermal class in degC, returned in K.
double read_enamel_class(const YamlMap& m);

// bench: a mapping, or the name of a file holding one under "bench:" (relative to `base`, the spec's
// directory). InputError names the field (in the file, the file's path and the field).
BenchCorrections read_bench(const YamlMap& top, const std::filesystem::path& base);

// A coil spec from its YAML node (inline in a fixture, say); relative paths inside it from `base`.
CoilSpec read_coil_spec(const YAML::Node& root, const std::filesystem::path& base);

// A fixture from its YAML node (fixture.hpp; inline in a requirement, say); `designed` as parse_fixture's.
FixtureSpec read_fixture(const YAML::Node& root, const std::filesystem::path& base, std::string_view designed);

// YAML text to a node; malformed YAML is an InputError naming source:line:column.
YAML::Node load_yaml(std::string_view text, std::string_view source);

}  // namespace libcoil::detail
