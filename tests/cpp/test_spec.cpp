// The YAML coil spec: what it accepts, and the errors it gives.
#include <gtest/gtest.h>

#include "spec_errors.hpp"

#include "libcoil/studies/analysis.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/spec/spec.hpp"
#include "libcoil/models/wire.hpp"

using namespace libcoil;

namespace {

const char* base = R"(
coil:
  form_diameter: 20 mm
  turns: 10
  pitch: 1.5 mm
  wire:
    diameter: 1.0 mm
    insulation: 0.04 mm
  conductor: copper
)";

}  // namespace

TEST(Spec, IssueExample) {
    const CoilSpec s = parse_coil_spec(base);
    EXPECT_DOUBLE_EQ(s.solenoid.mean_diameter(), 20e-3 + 1e-3 + 0.08e-3);
    EXPECT_DOUBLE_EQ(s.solenoid.winding_length(), 15e-3);
    EXPECT_EQ(s.conductor.name, "copper");
    EXPECT_TRUE(s.notes.empty());
}

TEST(Spec, Alternatives) {
    const CoilSpec s = parse_coil_spec(R"(
name: alt
coil:
  mean_diameter: 0.98 in
  turns: 12.5
  winding_length: 25 mm
  lead_length: 80 mm
  wire: {gauge: AWG 18, enamel: grade 2}
)");
    EXPECT_EQ(s.name, "alt");
    EXPECT_DOUBLE_EQ(s.solenoid.mean_diameter(), 0.98 * 0.0254);
    EXPECT_DOUBLE_EQ(s.solenoid.pitch(), 2e-3);
    EXPECT_DOUBLE_EQ(s.solenoid.wire().bare_diameter, awg_diameter(18));
    EXPECT_DOUBLE_EQ(s.solenoid.wire().insulation, enamel_build(awg_diameter(18), 2));
    EXPECT_DOUBLE_EQ(s.solenoid.lead_length(), 0.08);
    ASSERT_EQ(s.notes.size(), 1u);  // copper assumed
    EXPECT_NE(s.notes[0].find("copper"), std::string::npos);
}

TEST(Spec, ErrorsNameTheYamlPath) {
    std::string y = base;
    EXPECT_EQ(error_of(std::string(y).replace(y.find("1.5 mm"), 6, "2 mn")),
              "coil.pitch: \"2 mn\": unknown unit \"mn\"; expected a length such as \"2 mm\"");
    EXPECT_EQ(error_of(std::string(y).replace(y.find("pitch"), 5, "pich")).substr(0, 47),
              "coil.pich: unknown key; did you mean \"pitch\"? (");
    EXPECT_EQ(error_of(std::string(y).replace(y.find("1.5 mm"), 6, "0.5 mm")).substr(0, 11), "coil.pitch:");
    EXPECT_EQ(error_of(std::string(y).replace(y.find("20 mm"), 5, "-20 mm")).substr(0, 19), "coil.form_diameter:");
    EXPECT_EQ(error_of(std::string(y).replace(y.find("copper"), 6, "coper")).substr(0, 15), "coil.conductor:");
    EXPECT_EQ(error_of(""), "spec: the spec is empty; expected a mapping with a \"coil:\" section");
    EXPECT_EQ(error_of("coil: [1, 2").substr(0, 10), "test.yaml:");  // malformed YAML gives file:line:col
    EXPECT_EQ(error_of("coil:\n  turns: 10\n").substr(0, 10), "coil.wire:");
}

TEST(Spec, WrittenBackWithoutAnOperatingSectionReadsBack) {
    // Found by tests/fuzz (fuzz_spec): a spec with no operating section was written back with "operating:"
    // alone, which the reader refuses as an empty value.
    const CoilSpec s = parse_coil_spec(base, "base");
    const Wire& w = s.solenoid.wire();
    const std::string text = coil_spec_yaml(s, WireChoice{std::nullopt, w.bare_diameter, w.insulation, std::nullopt});
    EXPECT_EQ(text.find("operating:"), std::string::npos);
    const CoilSpec again = parse_coil_spec(text, "again");
    EXPECT_DOUBLE_EQ(again.solenoid.pitch(), s.solenoid.pitch());
    EXPECT_DOUBLE_EQ(again.solenoid.turns(), s.solenoid.turns());
}

TEST(Spec, ACoilAtTheEndOfTheLengthRangeReadsBackFromItsFormDiameter) {
    // Found by tests/fuzz (fuzz_spec): l / D = 1000 exactly, given by its mean diameter, was written back by
    // its form diameter (4.8 mm + 0.2 mm wire), which read back a rounding past 1000 and was refused.
    const CoilSpec s = parse_coil_spec("coil: {mean_diameter: 5 mm, turns: 5000, pitch: 1 mm, wire: {diameter: 0.2 mm}}\n", "edge");
    const Wire& w = s.solenoid.wire();
    const CoilSpec again = parse_coil_spec(coil_spec_yaml(s, WireChoice{std::nullopt, w.bare_diameter, w.insulation, std::nullopt}), "again");
    EXPECT_NEAR(again.solenoid.mean_diameter(), 5e-3, 1e-17);
    EXPECT_THROW(parse_coil_spec("coil: {mean_diameter: 5 mm, turns: 5001, pitch: 1 mm, wire: {diameter: 0.2 mm}}\n", "past"), InputError);
}
