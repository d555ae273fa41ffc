// Quantity parsing and formatting. Check values are exact unit definitions: SI prefixes (SI Brochure,
// 9th ed.), 1 in = 25.4 mm exactly (international yard and pound agreement, 1959), 0 degC = 273.15 K.
#include <gtest/gtest.h>

#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"

using libcoil::Dimension;
using libcoil::parse_quantity;

namespace {

double q(const char* text, Dimension d) { return parse_quantity(text, d, "field"); }

std::string error_of(const char* text, Dimension d, const char* field = "coil.pitch") {
    try {
        parse_quantity(text, d, field);
    } catch (const libcoil::InputError& e) {
        return e.what();
    }
    return "(no error)";
}

}  // namespace

TEST(Units, IssueExamples) {
    EXPECT_DOUBLE_EQ(q("25 mm", Dimension::length), 0.025);
    EXPECT_DOUBLE_EQ(q("0.98 in", Dimension::length), 0.98 * 0.0254);
    EXPECT_DOUBLE_EQ(q("1.2 uH", Dimension::inductance), 1.2e-6);
    EXPECT_DOUBLE_EQ(q("1.2 \u00b5H", Dimension::inductance), 1.2e-6);  // micro sign
    EXPECT_DOUBLE_EQ(q("1.2 \u03bcH", Dimension::inductance), 1.2e-6);  // Greek mu
    EXPECT_DOUBLE_EQ(q("108 MHz", Dimension::frequency), 108e6);
    EXPECT_DOUBLE_EQ(q("4 A", Dimension::current), 4.0);
    EXPECT_DOUBLE_EQ(q("35 um", Dimension::length), 35e-6);
    EXPECT_DOUBLE_EQ(q("25 degC", Dimension::temperature), 298.15);
    EXPECT_DOUBLE_EQ(q("2.5 pF", Dimension::capacitance), 2.5e-12);
}

TEST(Units, MoreUnits) {
    EXPECT_DOUBLE_EQ(q("10 mil", Dimension::length), 254e-6);
    EXPECT_DOUBLE_EQ(q("1.5e-3", Dimension::length), 1.5e-3);  // a bare number is SI
    EXPECT_DOUBLE_EQ(q("  3cm ", Dimension::length), 0.03);
    EXPECT_DOUBLE_EQ(q("2 %", Dimension::dimensionless), 0.02);
    EXPECT_DOUBLE_EQ(q("50 ohm", Dimension::resistance), 50.0);
    EXPECT_DOUBLE_EQ(q("50 \u03a9", Dimension::resistance), 50.0);
    EXPECT_DOUBLE_EQ(q("2 kV", Dimension::voltage), 2000.0);
    EXPECT_DOUBLE_EQ(q("300 K", Dimension::temperature), 300.0);
    EXPECT_NEAR(q("212 degF", Dimension::temperature), 373.15, 1e-12);
    EXPECT_DOUBLE_EQ(q("-40 degC", Dimension::temperature), 233.15);
    EXPECT_DOUBLE_EQ(q("+1 MHz", Dimension::frequency), 1e6);
}

TEST(Units, ErrorMessagesNameFieldValueAndExpectation) {
    EXPECT_EQ(error_of("2 mn", Dimension::length),
              "coil.pitch: \"2 mn\": unknown unit \"mn\"; expected a length such as \"2 mm\"");
    EXPECT_EQ(error_of("2 uH", Dimension::length),
              "coil.pitch: \"2 uH\": \"uH\" is an inductance, not a length; expected a length such as \"2 mm\"");
    EXPECT_NE(error_of("", Dimension::length).find("empty value"), std::string::npos);
    EXPECT_NE(error_of("mm", Dimension::length).find("does not start with a number"), std::string::npos);
    EXPECT_NE(error_of("1e999 m", Dimension::length).find("out of range"), std::string::npos);
    EXPECT_NE(error_of("nan", Dimension::length).find("coil.pitch"), std::string::npos);
    EXPECT_NE(error_of("inf mm", Dimension::length).find("coil.pitch"), std::string::npos);
}

TEST(Units, EngineeringFormat) {
    EXPECT_EQ(libcoil::format_quantity(1.72990e-6, Dimension::inductance), "1.730 \u00b5H");
    EXPECT_EQ(libcoil::format_quantity(0.02108, Dimension::length), "21.08 mm");
    EXPECT_EQ(libcoil::format_quantity(999.96e-6, Dimension::inductance), "1.000 mH");  // rounding carries
    EXPECT_EQ(libcoil::format_quantity(30e6, Dimension::frequency), "30.00 MHz");
    EXPECT_EQ(libcoil::format_quantity(298.15, Dimension::temperature), "25 \u00b0C");
    EXPECT_EQ(libcoil::format_quantity(0.0, Dimension::length), "0.000 m");
}

TEST(Units, QuotedTextIsPrintableUtf8) {
    // A message quotes the user's text: control bytes and bytes that are not UTF-8 escaped (a byte 0xff from a
    // measurement file reached the terminal raw and left Python's InputError empty), UTF-8 kept, 60 characters.
    const auto quoted = [](std::string_view t) { return libcoil::quoted(t); };  // not std::quoted, which ADL finds
    EXPECT_EQ(quoted("2 mm"), "\"2 mm\"");
    EXPECT_EQ(quoted("a\x1b[31m"), "\"a\\x1b[31m\"");
    EXPECT_EQ(quoted("2\xff"), "\"2\\xff\"");
    EXPECT_EQ(quoted("\xc3("), "\"\\xc3(\"");              // a cut two-byte sequence
    EXPECT_EQ(quoted("\xed\xa0\x80"), "\"\\xed\\xa0\\x80\"");  // a surrogate
    EXPECT_EQ(quoted("20 \xc2\xb5H"), "\"20 \xc2\xb5H\"");    // µ kept
    EXPECT_EQ(quoted(std::string(70, 'x')), "\"" + std::string(60, 'x') + "...\"");
    EXPECT_EQ(quoted(std::string(70, '\xff')).size(), 2 + 60 * 4 + 3);
}
