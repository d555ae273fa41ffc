// `coil fixture`: a fixture's port impedance as text, JSON, CSV, Touchstone and SVG. Formatting only.
#pragma once

#include <string>

#include "libcoil/studies/fixture_study.hpp"

namespace libcoil {

std::string fixture_text_report(const FixtureResult& r);
// At least: ports[] with name, reference_ohm and impedance {frequency_Hz, real_ohm, imag_ohm} (arrays; for two
// ports the matrix as z11, z12, z21, z22), and with a reference its deviation and `verdict` {pass,
// worst_deviation, first_failure_Hz, ...}.
std::string fixture_json_report(const FixtureResult& r);
std::string fixture_csv(const FixtureResult& r);
// The ports' S parameters at their references: a .s1p for one port, a .s2p for two.
std::string fixture_touchstone(const FixtureResult& r);
// |Z| and phase of the first port, with the reference and its tolerance band where there is one.
std::string fixture_svg(const FixtureResult& r);

}  // namespace libcoil
