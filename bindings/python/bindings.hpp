// Python bindings: the parts of the module, each in its own file.
#pragma once

#include <pybind11/pybind11.h>

namespace py = pybind11;

void bind_models(py::module_& m);   // models.cpp: one wrapper per model
void bind_studies(py::module_& m);  // studies.cpp: specs, studies and their records, the option table
void bind_batch(py::module_& m);    // batch.cpp: evaluate, many coils as arrays
