// The comparison study: the prediction beside the measurement (`coil compare`), and on request the bench fit
// of what the model cannot know (measurement_fit.hpp).
#pragma once

#include <complex>
#include <optional>
#include <string>
#include <vector>

#include "libcoil/studies/analysis.hpp"
#include "libcoil/studies/measurement.hpp"
#include "libcoil/studies/measurement_fit.hpp"

namespace libcoil {

// The analysed coil's Z as mounted (sweep_study's default model) at the measurement's frequencies, and the
// same figures read the same way from both; with a fit, the fitted model and its figures too.
struct Comparison {
    std::string title;                              // the spec's name
    MeasuredImpedance measured;
    std::vector<std::complex<double>> predicted;    // ohm, at measured.frequency
    ImpedanceModel model = ImpedanceModel::network;
    MeasuredFigures extracted, from_prediction;
    std::optional<MeasurementFit> fit;
    std::optional<MeasuredFigures> from_fit;
};

Comparison compare_study(const Analysis& analysis, const MeasuredImpedance& measured, bool fit = false);

}  // namespace libcoil
