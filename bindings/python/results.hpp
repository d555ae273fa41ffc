// Python bindings: the study records as Python dicts of numbers and numpy arrays, which the package wraps
// in its result classes (libcoil/_records.py). Conversion only: every number comes from a study.
#pragma once

#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>

#include "libcoil/libcoil.hpp"

namespace libcoil::python {

namespace py = pybind11;

// A record class of the package (Record, Sweep, DesignResult, ...) around a dict.
py::object record(const char* kind, py::dict fields);

py::dict by_method(const InductanceByMethod& m);

py::dict self_resonance_dict(const SelfResonance& r);
py::dict impedance_dict(const std::vector<ImpedancePoint>& points);  // arrays over frequency
py::dict at_frequency_dict(const std::vector<CoilAtFrequency>& points);
py::object band_dict(const std::optional<BandCheck>& band, const std::optional<CriterionResult>& by_medhurst);
py::object thermal_dict(const std::optional<ThermalEstimate>& thermal);
py::object shield_dict(const Analysis& a);
py::dict sweep_dict(const Sweep& s);
py::dict design_dict(const Requirement& q, const DesignResult& r);
py::dict former_dict(const FormerBuild& b, const std::vector<std::string>& files);
py::dict coupling_dict(const CouplingStudy& s);

}  // namespace libcoil::python
