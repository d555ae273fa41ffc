// Vector fitting and the Foster realisation (rational_fit.hpp). Check values: a known passive network's
// admittance (exact circuit algebra) is fitted back to its own poles and elements.
#include <gtest/gtest.h>

#include <cmath>
#include <complex>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/rational_fit.hpp"

using namespace libcoil;
using cd = std::complex<double>;

namespace {

// G || C || (R1 + s L1) || (R2 + s L2 + 1 / (G2 + s C2)): a coil's low-frequency path, its capacitance, and a
// second branch resonating near 120 MHz.
const double g0 = 2e-6, c0 = 0.8e-12, r1 = 0.05, l1 = 5e-6, r2 = 20, l2 = 2e-6, c2 = 0.9e-12, g2 = 1e-7;

cd network(double f) {
    const cd s(0, 2 * pi * f);
    return g0 + s * c0 + 1.0 / (r1 + s * l1) + 1.0 / (r2 + s * l2 + 1.0 / (g2 + s * c2));
}

}  // namespace

TEST(RationalFit, AKnownNetworkComesBackToItsElements) {
    std::vector<double> f;
    std::vector<cd> y;
    for (int k = 0; k < 400; ++k) {
        f.push_back(1e4 * std::pow(3e8 / 1e4, k / 399.0));
        y.push_back(network(f.back()));
    }
    const RationalFit fit = vector_fit(f, y, 3, 20);
    EXPECT_LT(fit.max_relative_error, 1e-8);
    const FosterAdmittance foster = foster_admittance(fit);
    ASSERT_TRUE(foster.realisable) << foster.reason;
    EXPECT_NEAR(foster.conductance / g0, 1, 1e-5);
    EXPECT_NEAR(foster.capacitance / c0, 1, 1e-6);
    ASSERT_EQ(foster.branches.size(), 2u);
    const FosterBranch& a = foster.branches[0].capacitance == 0 ? foster.branches[0] : foster.branches[1];
    const FosterBranch& b = foster.branches[0].capacitance == 0 ? foster.branches[1] : foster.branches[0];
    EXPECT_NEAR(a.resistance / r1, 1, 1e-5);
    EXPECT_NEAR(a.inductance / l1, 1, 1e-6);
    EXPECT_NEAR(b.resistance / r2, 1, 1e-5);
    EXPECT_NEAR(b.inductance / l2, 1, 1e-6);
    EXPECT_NEAR(b.capacitance / c2, 1, 1e-6);
    EXPECT_NEAR(b.conductance / g2, 1, 1e-3);
}

TEST(RationalFit, ClearErrors) {
    const std::vector<double> f{1e6, 2e6, 3e6};
    const std::vector<cd> y{1.0, 1.0, 1.0};
    EXPECT_THROW(vector_fit(f, y, 4), InputError);               // too few points
    EXPECT_THROW(vector_fit(f, {1.0, 1.0}, 1), InputError);      // one value a frequency
    EXPECT_THROW(vector_fit(f, y, 0), InputError);               // order
}
