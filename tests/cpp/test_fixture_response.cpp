// The fixture's port as one coil varies (fixture_study.hpp's PortResponse), which the design search screens
// candidates with. Check values: the bilinear theorem of linear circuits (textbook network theory) says three
// solutions fix the port's impedance for every value of the part; the fixture study's own nodal analysis
// with that part given outright (as an inductor with its ESR and parallel capacitance) is the reference,
// itself checked against ABCD products in numpy (tests/python/test_fixture.py).
#include <gtest/gtest.h>

#include <cmath>
#include <complex>
#include <string>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/spec/fixture.hpp"
#include "libcoil/studies/fixture_study.hpp"
#include "libcoil/studies/sweep.hpp"

using namespace libcoil;
using cd = std::complex<double>;

namespace {

// A bench-network line with a coupling capacitor's ESL and a damping branch: {part} is the varying coil.
std::string line(const std::string& part) {
    return "ground: gnd\n"
           "parts:\n"
           "  - " + part + "\n"
           "  - {name: Cb, kind: capacitor, between: [s, gnd], value: 1 uF, esr: 15 mohm, esl: 4 nH}\n"
           "  - {name: Rd, kind: resistor, between: [s, d], value: 5 ohm, esl: 3 nH}\n"
           "  - {name: Cd, kind: capacitor, between: [d, gnd], value: 10 uF, esr: 10 mohm, esl: 6 nH}\n"
           "  - {name: Cc, kind: capacitor, between: [e, r], value: 100 nF, esr: 20 mohm, esl: 5 nH}\n"
           "  - {name: Rr, kind: resistor, between: [r, gnd], value: 50 ohm, esl: 1 nH}\n"
           "ports: [{name: EUT, between: [e, gnd]}]\n"
           "reference: {ideal: true, tolerance: 20 %, band: {low: 150 kHz, high: 110 MHz}}\n";
}

}  // namespace

TEST(FixtureResponse, MatchesTheNodalAnalysisForAnyCoilImpedance) {
    const std::vector<double> f = frequency_grid(1e5, 3e8, 41, Spacing::logarithmic);
    const FixtureSpec designed = parse_fixture(line("{name: L1, kind: coil, between: [s, e]}"), "line", "L1");
    const PortResponse r = port_response(designed, "L1", 5e-6, f);
    // The same line with L1 an inductor with strays: 4.7 uH, 0.3 ohm, 1.8 pF across it (resonating at 54 MHz).
    const FixtureSpec given = parse_fixture(line("{name: L1, kind: inductor, between: [s, e], value: 4.7 uH, esr: 0.3 ohm, parallel_capacitance: 1.8 pF}"));
    FixtureRequest q;
    q.frequencies = f;
    const FixtureResult study = fixture_study(given, q);
    double worst = 0, worst_reference = 0;
    for (std::size_t k = 0; k < f.size(); ++k) {
        const double w = 2 * pi * f[k];
        const cd z = 1.0 / (1.0 / cd(0.3, w * 4.7e-6) + cd(0, w * 1.8e-12));
        worst = std::max(worst, std::abs(r.port_impedance(k, z) / study.impedance[k][0] - 1.0));
        // The ideal reference: every part ideal and the coil an inductor of the nominal 5 uH.
        const cd zl(0, w * 5e-6), zc = 1.0 / cd(0, w * 100e-9) + 50.0;
        const cd ideal = 1.0 / (1.0 / zc + 1.0 / (zl + 1.0 / (1.0 / cd(0, -1 / (w * 1e-6)) + 1.0 / (5.0 + 1.0 / cd(0, w * 10e-6)))));
        worst_reference = std::max(worst_reference, std::abs(r.reference[k] / ideal - 1.0));
    }
    EXPECT_LT(worst, 1e-11);
    EXPECT_LT(worst_reference, 1e-11);
    // Measured: 1.4e-12 and 1.2e-12 (rounding in the nodal solutions near the parts' resonances).
}

TEST(FixtureResponse, AnInsensitivePortStaysExact) {
    // The coil across an ideal voltage-like short (a 1 uohm resistor in parallel at the port): the port barely
    // depends on the coil, and the coefficients' null space is nearly two-dimensional; any of its vectors gives
    // the right port impedance.
    const std::string text = "parts:\n"
                             "  - {name: L1, kind: coil, between: [a, ground]}\n"
                             "  - {name: R, kind: resistor, between: [a, ground], value: 1 uohm}\n"
                             "ports: [{name: P, between: [a, ground]}]\n"
                             "reference: {ideal: true, tolerance: 1 %, band: {low: 1 MHz, high: 10 MHz}}\n";
    const PortResponse r = port_response(parse_fixture(text, "short", "L1"), "L1", 1e-6, {1e6, 1e7});
    for (std::size_t k = 0; k < 2; ++k) {
        const cd z(0.1, 2 * pi * r.frequency[k] * 1e-6);
        const cd want = 1.0 / (1.0 / z + 1e6);
        EXPECT_LT(std::abs(r.port_impedance(k, z) / want - 1.0), 1e-9);
    }
}

TEST(FixtureResponse, NamesWhatIsMissing) {
    const FixtureSpec no_reference = parse_fixture("parts: [{name: L1, kind: coil, between: [a, ground]}, {name: R, kind: resistor, between: [a, ground], value: 50 ohm}]\n"
                                                   "ports: [{name: P, between: [a, ground]}]\n", "x", "L1");
    try {
        port_response(no_reference, "L1", 1e-6, {1e6});
        FAIL() << "expected an InputError";
    } catch (const InputError& e) {
        EXPECT_EQ(e.field(), "reference");
    }
    EXPECT_THROW(parse_fixture(line("{name: L1, kind: coil, between: [s, e]}"), "line", "L9"), InputError);
    // The designed coil without a spec is fine for the search, but the study itself wants one.
    EXPECT_THROW(fixture_study(parse_fixture(line("{name: L1, kind: coil, between: [s, e]}"), "line", "L1")), InputError);
}
