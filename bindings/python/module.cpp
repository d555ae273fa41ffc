// Python bindings: a thin layer over libcoil. SI arguments; functions of a ratio or a geometry accept
// numpy arrays; studies return result records. libcoil::InputError arrives as libcoil.InputError (a
// ValueError) with the same message, DomainError as libcoil.DomainError.
#include <pybind11/pybind11.h>

#include "bindings.hpp"
#include "libcoil/libcoil.hpp"

namespace py = pybind11;

PYBIND11_MODULE(_core, m) {
    m.doc() = "libcoil: design of single-layer air-core coils (compiled core)";
    m.attr("__version__") = libcoil::version;

    py::register_exception<libcoil::InputError>(m, "InputError", PyExc_ValueError);
    py::register_exception<libcoil::DomainError>(m, "DomainError", PyExc_ValueError);

    m.attr("mu0") = libcoil::mu0;
    m.attr("eps0") = libcoil::eps0;
    m.attr("speed_of_light") = libcoil::speed_of_light;

    bind_models(m);
    bind_studies(m);
    bind_batch(m);
}
