// libcoil.evaluate: many coils as numpy arrays (studies/batch.hpp). The arguments broadcast as numpy does;
// the figures come back in the broadcast shape, with a status per element (0 ok, 1 bad input, 2 outside the
// models' domain) and, on request, the messages of the bad ones. The work runs without the GIL.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <map>
#include <string>
#include <vector>

#include "bindings.hpp"
#include "libcoil/libcoil.hpp"

namespace py = pybind11;
using namespace pybind11::literals;

void bind_batch(py::module_& m) {
    m.def(
        "evaluate",
        [](py::object mean_diameter, py::object turns, py::object pitch, py::object wire_diameter, py::object frequency,
           py::object temperature, py::object conductor, py::object insulation, const std::string& chain, unsigned threads, bool messages) {
            const py::module_ np = py::module_::import("numpy");
            // Conductor names to indices into one table (a name, or an array of names).
            std::vector<libcoil::Conductor> table;
            std::map<std::string, std::uint16_t> index;
            const auto index_of = [&](const std::string& name) {
                auto it = index.find(name);
                if (it != index.end()) return it->second;
                table.push_back(libcoil::conductor(name, "conductor"));
                return index.emplace(name, static_cast<std::uint16_t>(table.size() - 1)).first->second;
            };
            py::object conductor_array;
            if (py::isinstance<py::str>(conductor)) {
                conductor_array = py::int_(index_of(conductor.cast<std::string>()));
            } else {
                py::array names = np.attr("asarray")(conductor, "dtype"_a = "object");
                py::array idx = np.attr("empty")(names.attr("shape"), "dtype"_a = "uint16");
                auto flat_names = names.attr("ravel")();
                auto* out = static_cast<std::uint16_t*>(idx.mutable_data());
                for (py::ssize_t i = 0; i < names.size(); ++i) out[i] = index_of(py::str(flat_names[py::int_(i)]).cast<std::string>());
                conductor_array = idx;
            }
            // Broadcast as numpy does without copying what need not be: an array of the full shape (C order)
            // is read in place, one value is passed as one, anything else is broadcast into a copy.
            std::vector<py::array> args;
            for (py::object a : {mean_diameter, turns, pitch, wire_diameter, insulation, temperature, frequency}) {
                args.push_back(np.attr("asarray")(a, "dtype"_a = "float64"));
            }
            args.push_back(np.attr("asarray")(conductor_array, "dtype"_a = "uint16"));
            py::list all;
            for (const auto& a : args) all.append(a);
            const py::tuple shape = np.attr("broadcast")(*all).attr("shape");
            std::vector<py::array> flat;
            for (const auto& a : args) {
                if (a.size() == 1) {
                    flat.push_back(np.attr("ascontiguousarray")(a.attr("ravel")()));
                } else if (py::tuple(a.attr("shape")).equal(shape) && py::bool_(a.attr("flags")["C_CONTIGUOUS"])) {
                    flat.push_back(a);
                } else {
                    flat.push_back(np.attr("ascontiguousarray")(np.attr("broadcast_to")(a, shape)));
                }
            }
            const auto span = [&](int k) {
                const auto& a = flat[static_cast<std::size_t>(k)];
                return std::span<const double>(static_cast<const double*>(a.data()), static_cast<std::size_t>(a.size()));
            };
            libcoil::BatchInput in;
            in.mean_diameter = span(0);
            in.turns = span(1);
            in.pitch = span(2);
            in.wire_diameter = span(3);
            in.insulation = span(4);
            in.temperature = span(5);
            in.frequency = span(6);
            in.conductor = std::span<const std::uint16_t>(static_cast<const std::uint16_t*>(flat[7].data()), static_cast<std::size_t>(flat[7].size()));
            in.conductors = table;
            const libcoil::BatchChain c = chain == "light" ? libcoil::BatchChain::light : libcoil::BatchChain::full;
            if (chain != "light" && chain != "full") throw libcoil::InputError("chain", "\"" + chain + "\"; expected full or light");
            // The five figures are rows of one block: one allocation, which the allocator keeps mapped between
            // calls (five separate arrays of 1e5 coils were unmapped on every free, and touching their fresh
            // pages again cost 100 ns a coil, as much as the work).
            py::array_t<std::uint8_t> status = np.attr("empty")(shape, "dtype"_a = "uint8");
            const std::size_t n = static_cast<std::size_t>(status.size());
            py::array_t<double> block = np.attr("empty")(py::make_tuple(5, n), "dtype"_a = "float64");
            double* rows = block.mutable_data();
            const auto row = [&](std::size_t k) { return std::span<double>(rows + k * n, n); };
            const libcoil::BatchOutputView view{row(0), row(1), row(2), row(3), row(4),
                                                std::span<libcoil::BatchStatus>(reinterpret_cast<libcoil::BatchStatus*>(status.mutable_data()), n)};
            const auto figure = [&](std::size_t k) { return block[py::int_(k)].attr("reshape")(shape); };
            py::object l = figure(0), rdc = figure(1), r = figure(2), q = figure(3), srf = figure(4);
            {
                py::gil_scoped_release release;
                libcoil::evaluate_batch(in, view, c, threads);
            }
            py::dict d("inductance"_a = l, "dc_resistance"_a = rdc, "resistance"_a = r, "q_factor"_a = q, "self_resonance"_a = srf,
                       "status"_a = status);
            if (messages) {
                py::dict bad;
                for (std::size_t i = 0; i < n; ++i) {
                    if (view.status[i] != libcoil::BatchStatus::ok) bad[py::int_(i)] = libcoil::batch_message(in, i, c);
                }
                d["messages"] = bad;
            }
            return d;
        },
        "mean_diameter"_a, "turns"_a, "pitch"_a, "wire_diameter"_a, "frequency"_a = 0.0, "temperature"_a = 293.15, "conductor"_a = "copper",
        "insulation"_a = 0.0, "chain"_a = "full", "threads"_a = 0, "messages"_a = false,
        "Many coils at once (arrays broadcast as numpy does; SI): inductance, dc_resistance, resistance, q_factor, "
        "self_resonance and status (0 ok, 1 bad input, 2 outside the models' domain; NaN figures there), with "
        "messages={flat index: text} of the bad elements when asked. chain 'full': the recommended L, R_ac with skin "
        "and proximity effect, the recommended SRF's fast path; 'light': Rosa's L, R_dc x the skin ratio, Medhurst's "
        "SRF. Runs without the GIL, on every core by default.");
}
