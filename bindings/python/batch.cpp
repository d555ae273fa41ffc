// libcoil.evaluate: many coils as numpy arrays (studies/batch.hpp). The arguments broadcast as numpy does;
// the figures come back in the broadcast shape, with a status per element (0 ok, 1 bad input, 2 outside the
// models' domain) and, on request, the messages of the bad ones. The work runs without the GIL.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#if __has_include(<sys/mman.h>)
#include <sys/mman.h>  // mmap and MADV_HUGEPAGE where the system has them (output_block)
#endif

#include <cstdint>
#include <map>
#include <memory>
#include <new>
#include <string>
#include <utility>
#include <vector>

#include "bindings.hpp"
#include "libcoil/libcoil.hpp"

namespace py = pybind11;
using namespace pybind11::literals;

namespace {

// The output's memory. Fresh pages cost a fault each on first touch, and on a virtual machine a fault of a
// 4 KiB page took 9 us (measured: 9.4 ms to touch 4 MB, as much as the light chain's work on its 1e5
// coils); the allocator returns large blocks to the system on every free, so every call paid that again.
// From 1 MiB up the block is mapped on its own, advised as huge pages (the same 4 MB: 0.14 ms), and when
// numpy lets go of the last array on it, kept for the next call (one block, at most 256 MiB; a larger one,
// or one more, is unmapped). Below 1 MiB, numpy's own allocation. `figures` is 5 x n float64, `status` n
// uint8.
#ifdef MADV_HUGEPAGE
struct Mapping {
    void* start = nullptr;
    std::size_t length = 0;
    char* data = nullptr;  // 2 MiB-aligned within
};
Mapping kept;  // the block kept for the next call; touched only with the GIL held
constexpr std::size_t huge_page = std::size_t{2} << 20, most_kept = std::size_t{256} << 20;

Mapping map_block(std::size_t bytes) {
    if (kept.start) {
        if (kept.length >= bytes + 2 * huge_page && kept.length <= 2 * bytes + 2 * huge_page) return std::exchange(kept, Mapping{});
        munmap(kept.start, kept.length);
        kept = Mapping{};
    }
    Mapping m;
    m.length = bytes + 2 * huge_page;
    m.start = mmap(nullptr, m.length, PROT_READ | PROT_WRITE, MAP_PRIVATE | MAP_ANONYMOUS, -1, 0);
    if (m.start == MAP_FAILED) throw std::bad_alloc();
    m.data = reinterpret_cast<char*>((reinterpret_cast<std::uintptr_t>(m.start) + huge_page - 1) & ~(huge_page - 1));
    madvise(m.data, (bytes + huge_page - 1) / huge_page * huge_page, MADV_HUGEPAGE);  // advice: where refused, small pages
    return m;
}

void release_block(void* p) {
    const Mapping m = *static_cast<Mapping*>(p);
    delete static_cast<Mapping*>(p);
    if (!kept.start && m.length <= most_kept) {
        kept = m;
    } else {
        munmap(m.start, m.length);
    }
}
#endif

void output_block(std::size_t n, py::array_t<double>& figures, py::array_t<std::uint8_t>& status) {
    const std::size_t bytes = 5 * n * sizeof(double) + n;
#ifdef MADV_HUGEPAGE
    if (bytes >= (std::size_t{1} << 20)) {
        const Mapping m = map_block(bytes);
        auto held = std::make_unique<Mapping>(m);
        py::capsule owner;
        try {
            owner = py::capsule(held.get(), release_block);
        } catch (...) {  // no capsule, so nothing will release the block
            munmap(m.start, m.length);
            throw;
        }
        held.release();  // the capsule's now
        const auto row = static_cast<py::ssize_t>(n * sizeof(double));
        figures = py::array_t<double>({py::ssize_t{5}, static_cast<py::ssize_t>(n)}, {row, py::ssize_t{sizeof(double)}},
                                      reinterpret_cast<double*>(m.data), owner);
        status = py::array_t<std::uint8_t>({static_cast<py::ssize_t>(n)}, {py::ssize_t{1}},
                                           reinterpret_cast<std::uint8_t*>(m.data + 5 * n * sizeof(double)), owner);
        return;
    }
#endif
    figures = py::array_t<double>({py::ssize_t{5}, static_cast<py::ssize_t>(n)});
    status = py::array_t<std::uint8_t>({static_cast<py::ssize_t>(n)});
}

}  // namespace

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
            // The five figures are rows of one block, the status after them (output_block).
            std::size_t n = 1;
            for (const auto& d : shape) n *= d.cast<std::size_t>();
            py::array_t<double> block;
            py::array_t<std::uint8_t> status;
            output_block(n, block, status);
            status = status.attr("reshape")(shape);
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
        "and proximity effect, the SRF's fast path (the sheath helix, +16 .. +47 % above NEC2 for free-standing coils: "
        "a screen, not the verdict; analyze() gives the recommended SRF, the turn network); 'light': Rosa's L, R_dc x "
        "the skin ratio, Medhurst's "
        "SRF. Runs without the GIL, on every core by default. The five figures are rows of one block of memory; "
        "from 1 MiB up that block is kept, once freed, for the next call (one block, at most 256 MiB).");
}
