// The bench fit: what the model cannot know of a built coil, fitted to its measured impedance.
//
// Parameters (records.hpp's BenchCorrections): the former's effective relative permittivity and loss
// tangent (a coil with a former only), a capacitance across the terminals, the leads' series inductance,
// and a factor on the winding's R(f). The model is the coil as mounted by its turn network with these terms
// (studies/mounted_network.hpp: the sweep's own network model), so that the fitted values carried into a
// spec's `bench:` section give the next analysis the fitted curve.
//
// Method:  weighted least squares of the relative misfit, the real and imaginary parts of
//          sqrt(w_i) (Z(f_i; p) - Z_i) / |Z_i| over the points of weight w_i > 0 (measurement.hpp's weights);
//          Levenberg-Marquardt (Marquardt's diagonal scaling) on Eigen, parameters scaled by their typical
//          sizes, forward-difference Jacobian, bounds by projection. The start: the material's permittivity
//          moved (or without a former the stray capacitance) so that the model's first resonance meets the
//          measured one, since the misfit of two sharp resonances apart has no useful slope.
//          Standard errors from the Jacobian at the solution, s^2 (J^T J)^-1 with s^2 the residual sum of
//          squares over its degrees of freedom (the noise is taken from the misfit itself); the correlation
//          matrix from the same. A parameter the data cannot fix (a rank-deficient Jacobian by pivoted QR, or
//          no effect at all) is held at its start and said so; one whose standard error exceeds its typical
//          size is reported as not determined.
// Source:  K. Levenberg, Q. Appl. Math. 2 (1944) 164; D. W. Marquardt, J. SIAM 11 (1963) 431 (the method, quoted
//          from memory). The linearised standard errors are textbook least squares.
// Accuracy: on synthetic measurements made by the same model with 1 % noise, each parameter lies within two
//          standard errors of its true value in about 95 % of seeded draws (tests/cpp/test_measurement_fit.cpp
//          measures the coverage over 60 draws). The fit cannot mend a model error: the residual after the fit
//          says how much of the misfit the five terms explain.
#pragma once

#include <complex>
#include <string>
#include <vector>

#include "libcoil/core/units.hpp"
#include "libcoil/spec/records.hpp"
#include "libcoil/studies/analysis.hpp"
#include "libcoil/studies/measurement.hpp"

namespace libcoil {

struct FittedParameter {
    std::string name;               // former_permittivity, former_loss_tangent, stray_capacitance, lead_inductance,
                                    // resistance_scale
    Dimension dimension = Dimension::dimensionless;
    double start = 0;               // the model's own value (the spec's)
    double value = 0;
    double standard_error = 0;      // 0 where held
    double typical = 0;             // the size the standard error is judged against
    bool varied = false;            // false: held (no effect on this coil, or the data cannot separate it)
    bool determined = false;        // varied, and the standard error below `typical`
    std::string note;               // why held or not determined
};

struct MeasurementFit {
    std::vector<FittedParameter> parameters;    // the five, in the order above
    std::vector<std::string> varied;            // names of the varied ones, the correlation's order
    std::vector<std::vector<double>> correlation;
    double residual_rms_before = 0;             // weighted rms of |Z - Z_i| / |Z_i|, the spec's own terms
    double residual_rms_after = 0;
    int points = 0;                             // the points fitted (weight > 0, f > 0)
    int iterations = 0;
    bool converged = false;
    std::vector<std::complex<double>> impedance;  // ohm, the fitted model at every measured frequency
    double self_resonance = 0;                  // Hz, the fitted model's first resonance as mounted
    BenchCorrections corrections;               // the fitted values as a spec's bench section takes them
    std::vector<std::string> notes;
};

// InputError naming "fit" where the turn network is not built for the coil or fewer points than
// parameters carry weight.
MeasurementFit fit_measurement(const Analysis& analysis, const MeasuredImpedance& measured);

}  // namespace libcoil
