// Wire gauges, enamel build and the material tables.
#include <gtest/gtest.h>

#include <cmath>

#include "libcoil/core/error.hpp"
#include "libcoil/models/materials.hpp"
#include "libcoil/models/wire.hpp"

using namespace libcoil;

TEST(Awg, DefiningPoints) {
    // ASTM B258: AWG 36 is 0.005 in and AWG 0000 is 0.46 in exactly.
    EXPECT_NEAR(awg_diameter(36) / (0.005 * 0.0254), 1.0, 1e-14);
    EXPECT_NEAR(awg_diameter(-3) / (0.46 * 0.0254), 1.0, 1e-14);
    // ASTM B258 tabulated values (to 0.1 mil): AWG 18 = 40.3 mil, AWG 10 = 101.9 mil, AWG 30 = 10.0 mil.
    EXPECT_NEAR(awg_diameter(18) / 0.0254e-3, 40.3, 0.05);
    EXPECT_NEAR(awg_diameter(10) / 0.0254e-3, 101.9, 0.05);
    EXPECT_NEAR(awg_diameter(30) / 0.0254e-3, 10.0, 0.05);
    // Every 6 gauges halve the diameter to within 0.5 % (92^(6/39) = 2.005), a property of the formula.
    EXPECT_NEAR(awg_diameter(12) / awg_diameter(18), 2.0051, 1e-4);
    EXPECT_THROW(awg_diameter(57), InputError);
    EXPECT_THROW(awg_diameter(-4), InputError);
}

TEST(Awg, Parsing) {
    EXPECT_EQ(parse_awg("AWG 18", "g"), 18);
    EXPECT_EQ(parse_awg("18 AWG", "g"), 18);
    EXPECT_EQ(parse_awg("awg18", "g"), 18);
    EXPECT_EQ(parse_awg("AWG 0", "g"), 0);
    EXPECT_EQ(parse_awg("AWG 00", "g"), -1);
    EXPECT_EQ(parse_awg("AWG 0000", "g"), -3);
    EXPECT_EQ(parse_awg("AWG 4/0", "g"), -3);
    EXPECT_EQ(awg_label(-3), "AWG 4/0");
    EXPECT_EQ(awg_label(18), "AWG 18");
    try {
        parse_awg("AWG 60", "coil.wire.gauge");
        FAIL();
    } catch (const InputError& e) {
        EXPECT_EQ(e.field(), "coil.wire.gauge");
    }
    EXPECT_THROW(parse_awg("SWG 18", "g"), InputError);
    EXPECT_THROW(parse_awg("AWG", "g"), InputError);
}

TEST(Enamel, GradesFromTable) {
    // data/wires.yaml (IEC 60317-0-1 maximum overall diameters, from memory): 1.000 mm grade 2 is 1.093 mm.
    EXPECT_NEAR(enamel_build(1.0e-3, 2), (1.093e-3 - 1.0e-3) / 2, 1e-12);
    for (double d : {0.05e-3, 0.3e-3, 1.0e-3, 2.2e-3}) {
        EXPECT_LT(enamel_build(d, 1), enamel_build(d, 2)) << d;  // grades build up
        EXPECT_LT(enamel_build(d, 2), enamel_build(d, 3)) << d;
    }
    EXPECT_THROW(enamel_build(1e-3, 4), InputError);
    EXPECT_THROW(enamel_build(10e-3, 1), InputError);
}

TEST(Metric, PreferredDiameters) {
    const auto& d = metric_wire_diameters();
    ASSERT_GE(d.size(), 30u);
    // R20 series (ISO 3): theoretical values 10^(n/20) per decade, here 1 mm * 10^((i - 26) / 20) with
    // 1.000 mm the 27th entry; ISO 3 keeps the rounded values within about +1.3 % / -1.1 % of the
    // theoretical ones (limits quoted from memory).
    EXPECT_NEAR(d.front(), 0.05e-3, 1e-12);
    EXPECT_NEAR(d.at(26), 1.0e-3, 1e-12);
    for (std::size_t i = 0; i < d.size(); ++i) {
        EXPECT_NEAR(d[i] / (1e-3 * std::pow(10.0, (static_cast<double>(i) - 26) / 20.0)), 1.0, 0.013) << i;
    }
}

TEST(Materials, CopperPerIec60028) {
    const Conductor& cu = conductor("copper");
    EXPECT_DOUBLE_EQ(cu.resistivity_20, 1.7241e-8);           // IEC 60028
    EXPECT_DOUBLE_EQ(cu.temperature_coefficient, 0.00393);    // IEC 60028
    EXPECT_NEAR(cu.resistivity_at(393.15), 1.7241e-8 * (1 + 0.00393 * 100), 1e-20);
    EXPECT_EQ(conductor("Copper").name, "copper");  // case-insensitive
    try {
        conductor("coper", "coil.conductor");
        FAIL();
    } catch (const InputError& e) {
        EXPECT_NE(std::string(e.what()).find("did you mean \"copper\""), std::string::npos) << e.what();
    }
}

TEST(Materials, FormerPlastics) {
    for (const char* n : {"PLA", "PETG", "ABS", "ASA", "PC", "nylon", "PTFE", "polystyrene"}) {
        const FormerMaterial& m = former_material(n);
        EXPECT_GT(m.relative_permittivity, 1.9) << n;
        EXPECT_LT(m.relative_permittivity, 5.0) << n;
        EXPECT_GT(m.max_service_temperature, 300.0) << n;
        EXPECT_FALSE(m.source.empty()) << n;
    }
    // Handbook values: PTFE 2.1, polystyrene 2.55 (quoted from memory, marked in the data file).
    EXPECT_DOUBLE_EQ(former_material("PTFE").relative_permittivity, 2.1);
    EXPECT_DOUBLE_EQ(former_material("polystyrene").relative_permittivity, 2.55);
    EXPECT_TRUE(std::filesystem::is_regular_file(data_directory() / "wires.yaml"));
}

TEST(Wire, MakeWireFromAChoice) {
    WireChoice c;
    c.gauge = 18;
    c.enamel_grade = 2;
    const Wire w = make_wire(c, "coil.wire.");
    EXPECT_EQ(w.label, "AWG 18, enamel grade 2");
    EXPECT_DOUBLE_EQ(w.insulation, enamel_build(awg_diameter(18), 2));
    const auto field_of = [](const WireChoice& ch) {
        try {
            make_wire(ch, "coil.wire.");
        } catch (const InputError& e) {
            return e.field();
        }
        return std::string("(no error)");
    };
    WireChoice none;
    EXPECT_EQ(field_of(none), "coil.wire.diameter");  // neither gauge nor diameter
    WireChoice both;
    both.gauge = 18;
    both.diameter = 1e-3;
    EXPECT_EQ(field_of(both), "coil.wire.diameter");
    WireChoice twice;
    twice.diameter = 1e-3;
    twice.insulation = 40e-6;
    twice.enamel_grade = 1;
    EXPECT_EQ(field_of(twice), "coil.wire.insulation");
    WireChoice bare;
    bare.diameter = 0.5e-3;
    EXPECT_EQ(make_wire(bare).insulation, 0.0);
    EXPECT_EQ(make_wire(bare).label, "0.5 mm wire");
}
