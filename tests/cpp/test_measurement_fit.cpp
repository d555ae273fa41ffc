// The bench fit (measurement_fit.hpp) and the spec's bench section. The check values are synthetic
// measurements made by the same model with known terms (the fit must give them back: exactly without
// noise, within its standard errors with it), so no outside source is needed; the coverage check is
// textbook statistics (about 95 % of draws within two standard errors for a well-posed linearised fit).
#include <gtest/gtest.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <random>

#include "libcoil/core/error.hpp"
#include "libcoil/spec/spec.hpp"
#include "libcoil/studies/comparison.hpp"
#include "libcoil/studies/measurement_fit.hpp"
#include "libcoil/studies/sweep.hpp"

using namespace libcoil;

namespace {

// A small coil on a printed former: quick to rebuild while the permittivity moves.
const char* const small = R"(
name: fit check
coil: {form_diameter: 12 mm, turns: 8, pitch: 1.2 mm, wire: {diameter: 0.8 mm, enamel: grade 1}}
operating: {temperature: 20 degC}
former: {material: PETG, kind: grooved-tube, wall: 2 mm}
)";
const double truth[5] = {3.4, 0.02, 0.3e-12, 8e-9, 1.1};

CoilSpec with_truth(CoilSpec s) {
    s.former->material.relative_permittivity = truth[0];
    s.former->material.loss_tangent = truth[1];
    s.bench = BenchCorrections{truth[0], truth[1], truth[2], truth[3], truth[4], "test"};
    return s;
}

MeasuredImpedance synthetic(const Analysis& a, double noise, std::mt19937& rng) {
    SweepRequest q;
    q.from = 2e6;
    q.to = 3 * a.self_resonance_as_mounted;
    q.points = 151;
    const Sweep s = sweep_study(a, q);
    std::normal_distribution<double> n(0, 1);
    MeasuredImpedance m;
    for (const auto& p : s.points) {
        m.frequency.push_back(p.frequency);
        m.impedance.push_back(p.impedance * std::complex<double>(1 + noise * n(rng), noise * n(rng)));
        m.weight.push_back(1);
        m.relative_error.push_back(noise);
    }
    return m;
}

}  // namespace

TEST(BenchFit, NoiselessRecoversTheTermsExactly) {
    const CoilSpec spec = parse_coil_spec(small);
    std::mt19937 rng(1);
    const MeasuredImpedance m = synthetic(analyze(with_truth(spec)), 0, rng);
    const MeasurementFit f = fit_measurement(analyze(spec), m);
    ASSERT_EQ(f.parameters.size(), 5u);
    EXPECT_TRUE(f.converged);
    for (int k = 0; k < 5; ++k) EXPECT_NEAR(f.parameters[k].value / truth[k], 1, 1e-5) << f.parameters[k].name;
    EXPECT_GT(f.residual_rms_before, 0.1);
    EXPECT_LT(f.residual_rms_after, 1e-6);
}

TEST(BenchFit, StandardErrorsAreHonestOverSixtyDraws) {
    const CoilSpec spec = parse_coil_spec(small);
    const Analysis base = analyze(spec), true_coil = analyze(with_truth(spec));
    std::mt19937 rng(20261203);
    int inside[5] = {0, 0, 0, 0, 0};
    const int draws = 60;
    for (int d = 0; d < draws; ++d) {
        const MeasurementFit f = fit_measurement(base, synthetic(true_coil, 0.01, rng));
        for (int k = 0; k < 5; ++k) {
            const FittedParameter& p = f.parameters[static_cast<std::size_t>(k)];
            ASSERT_TRUE(p.varied) << p.name;
            ASSERT_GT(p.standard_error, 0) << p.name;
            if (std::fabs(p.value - truth[k]) < 2 * p.standard_error) ++inside[k];
            if (d == 0) {
                EXPECT_LT(std::fabs(p.value - truth[k]), 2 * p.standard_error) << p.name << " in the first draw";
            }
        }
    }
    // 95 % expected; below 50 of 60 (83 %) would say the errors are too small (binomial p < 0.2 %).
    for (int k = 0; k < 5; ++k) EXPECT_GE(inside[k], 50) << k;
}

TEST(BenchFit, WithoutAFormerItsTermsAreHeld) {
    CoilSpec spec = parse_coil_spec(small);
    spec.former.reset();
    CoilSpec t = spec;
    t.bench = BenchCorrections{std::nullopt, std::nullopt, 0.3e-12, 8e-9, 1.1, "test"};
    std::mt19937 rng(2);
    const MeasurementFit f = fit_measurement(analyze(spec), synthetic(analyze(t), 0, rng));
    EXPECT_FALSE(f.parameters[0].varied);
    EXPECT_FALSE(f.parameters[1].varied);
    EXPECT_NE(f.parameters[0].note.find("no former"), std::string::npos);
    EXPECT_NEAR(f.parameters[2].value, 0.3e-12, 1e-18);
    EXPECT_NEAR(f.parameters[3].value, 8e-9, 1e-14);
    EXPECT_FALSE(f.corrections.former_permittivity.has_value());
}

TEST(BenchFit, FewPointsAreAnError) {
    const CoilSpec spec = parse_coil_spec(small);
    MeasuredImpedance m;
    m.frequency = {1e6, 2e6};
    m.impedance = {{0.1, 50}, {0.2, 100}};
    m.weight = {1, 1};
    m.relative_error = {0.01, 0.01};
    try {
        fit_measurement(analyze(spec), m);
        FAIL();
    } catch (const InputError& e) {
        EXPECT_EQ(e.field(), "fit");
    }
}

TEST(BenchSection, TheAnalysisAndTheSweepTakeIt) {
    // The stray capacitance lowers the SRF as mounted in the analysis and in the sweep alike (one picture);
    // the permittivity replaces the material's.
    const CoilSpec plain = parse_coil_spec(small);
    const CoilSpec benched = parse_coil_spec(std::string(small) + "bench: {former_permittivity: 3.4, stray_capacitance: 0.3 pF, lead_inductance: 8 nH}\n");
    ASSERT_TRUE(benched.bench);
    EXPECT_DOUBLE_EQ(benched.former->material.relative_permittivity, 3.4);
    const Analysis a = analyze(plain), b = analyze(benched);
    EXPECT_LT(b.self_resonance_as_mounted, 0.95 * a.self_resonance_as_mounted);
    SweepRequest q;
    q.frequencies = {1e6};
    const Sweep s = sweep_study(b, q);
    EXPECT_DOUBLE_EQ(s.self_resonance, b.self_resonance_as_mounted);
    // Far below resonance the leads' inductance adds (exact algebra, Z + j w L).
    const Sweep s0 = sweep_study(a, q);
    EXPECT_GT(s.points[0].apparent_inductance - s0.points[0].apparent_inductance, 8e-9);
}

TEST(BenchSection, FromAFileBesideTheSpec) {
    const auto dir = std::filesystem::temp_directory_path() / "libcoil_bench_section";
    std::filesystem::create_directories(dir);
    std::ofstream(dir / "coil.yaml") << small << "bench: fitted.yaml\n";
    std::ofstream(dir / "fitted.yaml") << "bench:\n  stray_capacitance: 0.25 pF\n  resistance_scale: 1.2\n";
    const CoilSpec s = load_coil_spec(dir / "coil.yaml");
    ASSERT_TRUE(s.bench);
    EXPECT_DOUBLE_EQ(s.bench->stray_capacitance, 0.25e-12);
    EXPECT_DOUBLE_EQ(s.bench->resistance_scale, 1.2);
    EXPECT_NE(s.bench->source.find("fitted.yaml"), std::string::npos);
    std::ofstream(dir / "fitted.yaml") << "bench:\n  stray_capacitance: -0.25 pF\n";
    try {
        load_coil_spec(dir / "coil.yaml");
        FAIL();
    } catch (const InputError& e) {
        EXPECT_NE(e.field().find("bench.stray_capacitance"), std::string::npos) << e.field();
        EXPECT_NE(e.field().find("fitted.yaml"), std::string::npos) << e.field();
    }
    std::ofstream(dir / "fitted.yaml") << "stray_capacitance: 0.25 pF\n";
    EXPECT_THROW(load_coil_spec(dir / "coil.yaml"), InputError);
    std::filesystem::remove_all(dir);
}

TEST(BenchSection, ClearErrors) {
    const auto field_of = [](const std::string& yaml) {
        try {
            parse_coil_spec(yaml);
        } catch (const InputError& e) {
            return e.field();
        }
        return std::string("no error");
    };
    EXPECT_EQ(field_of(std::string(small) + "bench: {former_permittivity: 0.5}\n"), "bench.former_permittivity");
    EXPECT_EQ(field_of(std::string(small) + "bench: {resistance_scale: 0}\n"), "bench.resistance_scale");
    EXPECT_EQ(field_of(std::string(small) + "bench: {stray: 1 pF}\n"), "bench.stray");
    EXPECT_EQ(field_of(R"(
coil: {form_diameter: 12 mm, turns: 8, pitch: 1.2 mm, wire: {diameter: 0.8 mm}}
bench: {former_loss_tangent: 0.01}
)"), "bench.former_loss_tangent");
}
