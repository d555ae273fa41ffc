// Python bindings, the studies: each parses its choice words through the library's table (named by the
// option table's keys), runs a study with the GIL released, and returns its record (results.hpp).
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>
#include <pybind11/functional.h>
#include <pybind11/stl/filesystem.h>

#include <optional>

#include "libcoil/libcoil.hpp"
#include "option_table.hpp"
#include "bindings.hpp"
#include "results.hpp"

namespace py = pybind11;
using namespace pybind11::literals;
using libcoil::python::by_method;
using libcoil::python::record;


void bind_studies(py::module_& m) {
    // Design search.
    py::class_<libcoil::Requirement>(m, "Requirement")
        .def_readonly("name", &libcoil::Requirement::name)
        .def_readonly("inductance", &libcoil::Requirement::inductance)
        .def_readonly("tolerance", &libcoil::Requirement::tolerance)
        .def_readonly("notes", &libcoil::Requirement::notes);
    m.def("parse_requirement", &libcoil::parse_requirement, "yaml_text"_a, "source"_a = "requirement");
    m.def("load_requirement", &libcoil::load_requirement, "path"_a);
    m.def("design", [](const libcoil::Requirement& q, unsigned threads, std::size_t top, bool spread,
                       std::size_t samples, std::uint64_t seed,
                       const std::optional<std::function<void(std::size_t, std::size_t)>>& progress) {
        libcoil::DesignOptions o;
        o.threads = threads;
        o.top = top;
        o.spread = spread;
        o.samples = samples;
        o.seed = seed;
        // The screen reports (done, total) from the calling thread, about every 200 ms and once at its end
        // (total, total), before the ranked designs are confirmed. The callable runs under the GIL; what it
        // raises stops the reports and is raised again once the search has ended: an exception must not
        // leave the search's loop while its threads run.
        std::optional<py::error_already_set> raised;
        if (progress) {
            o.progress = [&](std::size_t done, std::size_t total) {
                py::gil_scoped_acquire acquire;
                if (raised) return;
                try {
                    (*progress)(done, total);
                } catch (py::error_already_set& e) {
                    raised = std::move(e);
                }
            };
        }
        libcoil::DesignResult r;
        {
            py::gil_scoped_release release;
            r = libcoil::design(q, o);
        }
        if (raised) throw std::move(*raised);
        return record("DesignResult", libcoil::python::design_dict(q, r));
    }, "requirement"_a, "threads"_a = 0, "top"_a = 10, "spread"_a = false, "samples"_a = 2000, "seed"_a = 1,
       "progress"_a = py::none(),
       "The ranked designs for a requirement: a DesignResult whose `designs` holds numpy arrays over the ranking. "
       "`progress`, if given, is called as progress(done, total) with the candidates screened, about every 0.2 s "
       "and once at the screen's end, before the best-ranked designs are confirmed.");
    m.def("design_array", [](const libcoil::Requirement& q, unsigned threads, std::size_t top) {
        libcoil::DesignOptions o;
        o.threads = threads;
        o.top = top;
        libcoil::DesignResult r;
        {
            py::gil_scoped_release release;
            r = libcoil::design(q, o);
        }
        const std::size_t n = std::min(top, r.pareto.size());
        std::vector<double> form(n), turns(n), pitch(n), ind(n), ft(n), ind_ft(n), srf(n), res(n), temp(n), vol(n), score(n);
        std::vector<long> wire(n);
        for (std::size_t i = 0; i < n; ++i) {
            const auto& d = r.pareto[i];
            wire[i] = static_cast<long>(d.wire_index);
            form[i] = d.form_diameter;
            turns[i] = d.turns;
            pitch[i] = d.pitch;
            ind[i] = d.inductance;
            ft[i] = d.target_frequency;
            ind_ft[i] = d.inductance_at_target;
            srf[i] = d.self_resonance;
            res[i] = d.resistance;
            temp[i] = d.temperature;
            vol[i] = d.volume;
            score[i] = d.score;
        }
        const auto np = py::module_::import("numpy");
        const auto arr = [&](const auto& v) { return np.attr("array")(py::cast(v)); };
        return np.attr("rec").attr("fromarrays")(
            py::make_tuple(arr(wire), arr(form), arr(turns), arr(pitch), arr(ind), arr(ft), arr(ind_ft), arr(srf), arr(res), arr(temp),
                           arr(vol), arr(score)),
            "names"_a = "wire_index,form_diameter,turns,pitch,inductance,target_frequency,inductance_at_target,self_resonance,"
                        "resistance,temperature,volume,score");
    }, "requirement"_a, "threads"_a = 0, "top"_a = 100,
       "The ranked designs as a numpy record array (SI), best first; wire_index refers to search.wires.");
    m.def("tolerance_spread", [](const libcoil::Solenoid& s, double target, double tolerance, double form_sd,
                                 double pitch_sd, double wire_sd, double turns_sd, std::size_t samples, std::uint64_t seed) {
        const auto r = libcoil::tolerance_spread(s, target, tolerance, {}, {},
                                                 libcoil::BuildTolerances{form_sd, pitch_sd, wire_sd, turns_sd}, samples, seed);
        py::dict sens;
        for (const auto& x : r.sensitivities) sens[py::str(x.input)] = py::make_tuple(x.inductance, x.self_resonance);
        const auto stat = [](const libcoil::SpreadStatistics& st) {
            return py::dict("nominal"_a = st.nominal, "mean"_a = st.mean, "sd"_a = st.standard_deviation,
                            "low"_a = st.low, "high"_a = st.high);
        };
        return py::dict("samples"_a = r.samples, "left_out"_a = r.left_out, "inductance"_a = stat(r.inductance),
                        "self_resonance"_a = stat(r.self_resonance), "within_tolerance"_a = r.within_tolerance,
                        "sensitivities"_a = sens, "first_order_inductance_sd"_a = r.first_order_inductance_deviation);
    }, "solenoid"_a, "target"_a, "tolerance"_a, "form_diameter_sd"_a = 0.1e-3, "pitch_sd"_a = 0.02e-3,
       "wire_diameter_sd"_a = 0.005, "turns_sd"_a = 0.1, "samples"_a = 2000, "seed"_a = 1);

    // Specs, analysis and reports.
    py::class_<libcoil::CoilSpec>(m, "CoilSpec")
        .def_readonly("name", &libcoil::CoilSpec::name)
        .def_readonly("description", &libcoil::CoilSpec::description)
        .def_readonly("solenoid", &libcoil::CoilSpec::solenoid)
        .def_readonly("conductor", &libcoil::CoilSpec::conductor)
        .def_readonly("notes", &libcoil::CoilSpec::notes)
        .def_property_readonly("mounting", [](const libcoil::CoilSpec& s) { return libcoil::choice_name(s.surroundings.mounting); })
        .def_property_readonly("has_shield", [](const libcoil::CoilSpec& s) { return s.shield.has_value(); })
        .def_property_readonly("has_band", [](const libcoil::CoilSpec& s) { return s.band.has_value(); })
        .def_property_readonly("operating", [](const libcoil::CoilSpec& s) {
            const libcoil::Operating& op = s.operating;
            return record("Record", py::dict("frequencies"_a = op.frequencies, "temperature"_a = op.temperature,
                                             "temperature_given"_a = op.temperature_given, "current"_a = op.current,
                                             "current_frequency"_a = op.current_frequency ? py::object(py::float_(*op.current_frequency))
                                                                                          : py::object(py::none()),
                                             "ambient"_a = op.ambient, "supply_voltage"_a = op.supply_voltage, "rf_power"_a = op.rf_power));
        })
        .def_readonly("enamel_class", &libcoil::CoilSpec::enamel_class);
    m.def("parse_coil_spec", &libcoil::parse_coil_spec, "yaml_text"_a, "source"_a = "spec");
    m.def("load_coil_spec", &libcoil::load_coil_spec, "path"_a);
    py::class_<libcoil::Analysis>(m, "Analysis")
        .def_readonly("spec", &libcoil::Analysis::spec)
        .def_readonly("inductance", &libcoil::Analysis::inductance)
        .def_readonly("dc_resistance", &libcoil::Analysis::dc_resistance)
        .def_property_readonly("loss_method", [](const libcoil::Analysis& a) { return libcoil::choice_name(a.loss_method); })
        .def_property_readonly("at_frequency", [](const libcoil::Analysis& a) {
            return record("Record", libcoil::python::at_frequency_dict(a.at_frequency));
        })
        .def_property_readonly("self_resonance", [](const libcoil::Analysis& a) {
            return record("Record", libcoil::python::self_resonance_dict(a.self_resonance));
        })
        .def_readonly("self_resonance_as_mounted", &libcoil::Analysis::self_resonance_as_mounted)
        .def_readonly("self_resonance_low_as_mounted", &libcoil::Analysis::self_resonance_low_as_mounted)
        .def_readonly("self_resonance_high_as_mounted", &libcoil::Analysis::self_resonance_high_as_mounted)
        .def_property_readonly("impedance", [](const libcoil::Analysis& a) { return record("Record", libcoil::python::impedance_dict(a.impedance)); })
        .def_property_readonly("band", [](const libcoil::Analysis& a) {
            const py::object b = libcoil::python::band_dict(a.band, a.band_srf_by_medhurst);
            return b.is_none() ? b : record("Record", b);
        })
        .def_property_readonly("thermal", [](const libcoil::Analysis& a) {
            const py::object t = libcoil::python::thermal_dict(a.thermal);
            return t.is_none() ? t : record("Record", t);
        })
        .def_property_readonly("shield", [](const libcoil::Analysis& a) {
            const py::object t = libcoil::python::shield_dict(a);
            return t.is_none() ? t : record("Record", t);
        })
        .def_readonly("cautions", &libcoil::Analysis::cautions)
        .def_readonly("warnings", &libcoil::Analysis::warnings)
        .def_readonly("notes", &libcoil::Analysis::notes)
        .def("to_dict", [](const libcoil::Analysis& a) {
            namespace lp = libcoil::python;
            const auto& ind = a.inductance;
            return py::dict("name"_a = a.spec.name, "inductance"_a = py::dict("recommended"_a = ind.recommended, "method"_a = ind.method,
                                                                           "nagaoka_coefficient"_a = ind.nagaoka_coefficient,
                                                                           "by_method"_a = by_method(ind.by_method)),
                            "dc_resistance"_a = a.dc_resistance, "temperature"_a = a.spec.operating.temperature,
                            "loss_method"_a = libcoil::choice_name(a.loss_method), "at_frequency"_a = lp::at_frequency_dict(a.at_frequency),
                            "self_resonance"_a = lp::self_resonance_dict(a.self_resonance),
                            "self_resonance_as_mounted"_a = a.self_resonance_as_mounted, "impedance"_a = lp::impedance_dict(a.impedance),
                            "band"_a = lp::band_dict(a.band, a.band_srf_by_medhurst), "thermal"_a = lp::thermal_dict(a.thermal),
                            "shield"_a = lp::shield_dict(a), "cautions"_a = a.cautions, "warnings"_a = a.warnings, "notes"_a = a.notes);
        }, "The analysis as plain dicts and numpy arrays (SI).");
    m.def("sweep", [](const libcoil::Analysis& a, std::vector<double> frequencies, const std::optional<std::string>& model,
                      const std::string& capacitance) {
        libcoil::SweepRequest q;
        q.frequencies = std::move(frequencies);
        if (model) q.model = libcoil::parse_choice<libcoil::ImpedanceModel>(*model, "model");
        q.capacitance = libcoil::parse_choice<libcoil::CapacitanceSource>(capacitance, "capacitance");
        libcoil::Sweep s;
        {
            py::gil_scoped_release release;
            s = libcoil::sweep_study(a, q);
        }
        return record("Sweep", libcoil::python::sweep_dict(s));
    }, "analysis"_a, "frequencies"_a, "model"_a = py::none(), "capacitance"_a = "helical-line",
       "Z(f) of an analysed coil as mounted (its shield, its mounting): a Sweep of numpy arrays (frequency, impedance, ...).\n"
       "model None: the recommended SRF's model (the turn network up to 150 turns without a shield, else helical-line).");
    m.def("compare", [](const libcoil::CoilSpec& spec, const py::object& measurement, bool fit, const std::string& arrangement,
                        const std::optional<std::string>& fixture, double fixture_inductance, double fixture_capacitance) {
        libcoil::Fixture fx;
        if (fixture) fx.network = libcoil::read_network_file(*fixture);
        fx.series_inductance = fixture_inductance;
        fx.shunt_capacitance = fixture_capacitance;
        const auto how = libcoil::parse_choice<libcoil::MeasurementArrangement>(arrangement, "arrangement");
        libcoil::MeasuredImpedance m;
        std::string source = "the measurement";
        if (py::isinstance<py::str>(measurement) || py::hasattr(measurement, "__fspath__")) {
            source = py::str(py::module_::import("os").attr("fspath")(measurement));
            m = libcoil::measured_impedance(libcoil::read_network_file(source), how, fx);
        } else {  // a read_measurement record (or anything with frequency, impedance and weight)
            if (!py::hasattr(measurement, "frequency") || !py::hasattr(measurement, "impedance")) {
                throw py::type_error("measurement: expected a path or a read_measurement() record (frequency, impedance), got " +
                                     std::string(py::str(py::type::of(measurement).attr("__name__"))));
            }
            m.frequency = measurement.attr("frequency").cast<std::vector<double>>();
            m.impedance = measurement.attr("impedance").cast<std::vector<std::complex<double>>>();
            m.weight = py::hasattr(measurement, "weight") ? measurement.attr("weight").cast<std::vector<double>>()
                                                          : std::vector<double>(m.frequency.size(), 1.0);
            if (m.impedance.size() != m.frequency.size()) throw libcoil::InputError("impedance", "one value a frequency");
            if (m.weight.size() != m.frequency.size()) throw libcoil::InputError("weight", "one value a frequency");
            m.relative_error.assign(m.frequency.size(), 0.0);
        }
        libcoil::Comparison c;
        {
            py::gil_scoped_release release;
            c = libcoil::compare_study(libcoil::analyze(spec), m, fit);
        }
        py::dict d = py::module_::import("json").attr("loads")(libcoil::comparison_json_report(c));
        const auto n = static_cast<py::ssize_t>(c.measured.frequency.size());
        for (const char* key : {"fitted", "residual_rms_before", "residual_rms_after", "correlation", "fitted_self_resonance_Hz"}) {
            if (!d.contains(key)) d[key] = py::none();
        }
        d["frequency"] = py::array_t<double>(n, c.measured.frequency.data());
        d["measured"] = py::array_t<std::complex<double>>(n, c.measured.impedance.data());
        d["predicted_impedance"] = py::array_t<std::complex<double>>(n, c.predicted.data());
        d["weight"] = py::array_t<double>(n, c.measured.weight.data());
        d["fitted_impedance"] = c.fit ? py::object(py::array_t<std::complex<double>>(n, c.fit->impedance.data())) : py::object(py::none());
        d["bench_yaml"] = c.fit ? py::object(py::str(libcoil::bench_yaml(c, source))) : py::object(py::none());
        d["text"] = libcoil::comparison_text_report(c);
        return record("Comparison", d);
    }, "spec"_a, "measurement"_a, "fit"_a = false, "arrangement"_a = "reflection", "fixture"_a = py::none(),
       "fixture_inductance"_a = 0.0, "fixture_capacitance"_a = 0.0,
       "The coil of a spec against a measurement of it (a file's path, or a read_measurement record): the figures read "
       "the same way from both (extracted, predicted, deviation), and with fit=True the bench fit (fitted: value and "
       "standard_error per parameter, residual_rms_before/after, correlation, fitted_impedance, bench_yaml).");
    m.def("fixture", [](const py::object& fixture, std::optional<std::vector<double>> frequencies, std::optional<double> from,
                        std::optional<double> to, std::optional<int> points) {
        libcoil::FixtureSpec fx = [&] {
            if (py::hasattr(fixture, "__fspath__")) return libcoil::load_fixture(py::str(py::module_::import("os").attr("fspath")(fixture)).cast<std::string>());
            if (!py::isinstance<py::str>(fixture)) {
                throw py::type_error("fixture: expected a path or the fixture's YAML text, got " + std::string(py::str(py::type::of(fixture).attr("__name__"))));
            }
            const std::string text = fixture.cast<std::string>();
            if (text.find('\n') == std::string::npos && text.find(':') == std::string::npos) return libcoil::load_fixture(text);
            return libcoil::parse_fixture(text, "fixture");
        }();
        libcoil::FixtureRequest q;
        if (frequencies) q.frequencies = *frequencies;
        q.from = from;
        q.to = to;
        q.points = points;
        libcoil::FixtureResult r;
        {
            py::gil_scoped_release release;
            r = libcoil::fixture_study(fx, q);
        }
        const auto n = static_cast<py::ssize_t>(r.frequency.size()), m = static_cast<py::ssize_t>(r.ports.size());
        py::array_t<std::complex<double>> z({n, m, m});
        auto* zp = z.mutable_data();
        for (const auto& row : r.impedance) zp = std::copy(row.begin(), row.end(), zp);
        py::array_t<std::complex<double>> s({n, m, m});
        auto* sp = s.mutable_data();
        for (std::size_t k = 0; k < r.frequency.size(); ++k) {
            const auto row = r.s_parameters(k);
            sp = std::copy(row.begin(), row.end(), sp);
        }
        py::dict d = py::module_::import("json").attr("loads")(libcoil::fixture_json_report(r));
        d["frequency"] = py::array_t<double>(n, r.frequency.data());
        d["impedance"] = z;
        d["s"] = s;
        d["reference_impedance"] = r.reference.empty() ? py::object(py::none())
                                                       : py::object(py::array_t<std::complex<double>>(n, r.reference.data()));
        d["deviation"] = r.deviation.empty() ? py::object(py::none()) : py::object(py::array_t<double>(n, r.deviation.data()));
        if (!d.contains("verdict")) d["verdict"] = py::none();
        d["text"] = libcoil::fixture_text_report(r);
        return record("Record", d);
    }, "fixture"_a, "frequencies"_a = py::none(), "from_"_a = py::none(), "to"_a = py::none(), "points"_a = py::none(),
       "A fixture's port impedance (a path, or the YAML text): frequency, impedance[k, i, j] (ohm) and s[k, i, j] as numpy "
       "arrays, with its reference, deviation and verdict where it has a reference.");
    m.def("export_circuit", [](const libcoil::CoilSpec& spec, std::optional<double> from, std::optional<double> to, std::optional<int> order,
                               const std::string& name) {
        libcoil::CircuitExportRequest q;
        q.from = from;
        q.to = to;
        q.order = order;
        libcoil::CircuitExport c;
        {
            py::gil_scoped_release release;
            c = libcoil::circuit_export(libcoil::analyze(spec), q);
        }
        const auto opt = [](const std::optional<double>& v) -> py::object { return v ? py::float_(*v) : py::object(py::none()); };
        return record("Record", py::dict("spice"_a = libcoil::spice_subcircuit(c, name), "text"_a = libcoil::circuit_export_text(c),
                                         "from_"_a = c.from, "to"_a = c.to, "pairs"_a = c.pairs,
                                         "max_magnitude_error"_a = c.max_magnitude_error, "max_phase_error"_a = c.max_phase_error,
                                         "least_real_part"_a = c.least_real_part, "meets_goals"_a = c.meets_goals,
                                         "model_self_resonance"_a = opt(c.model_self_resonance), "fitted_self_resonance"_a = opt(c.fitted_self_resonance),
                                         "model_second_resonance"_a = opt(c.model_second_resonance),
                                         "fitted_second_resonance"_a = opt(c.fitted_second_resonance), "notes"_a = c.notes));
    }, "spec"_a, "from_"_a = py::none(), "to"_a = py::none(), "order"_a = py::none(), "name"_a = "COIL",
       "The coil's equivalent circuit for a circuit simulator (a SPICE subcircuit, `spice`), with the fit's errors and "
       "the first two resonances of model and circuit.");
    m.def("frequency_grid", [](double start, double stop, int points, bool logarithmic) {
        return libcoil::frequency_grid(start, stop, points, logarithmic ? libcoil::Spacing::logarithmic : libcoil::Spacing::linear);
    }, "start"_a, "stop"_a, "points"_a, "logarithmic"_a = true);
    m.def("touchstone_s1p", [](const libcoil::Analysis& a, std::vector<double> f, const std::optional<std::string>& model) {
        libcoil::SweepRequest q;
        q.frequencies = std::move(f);
        if (model) q.model = libcoil::parse_choice<libcoil::ImpedanceModel>(*model, "model");
        return libcoil::touchstone_s1p(libcoil::sweep_study(a, q));
    }, "analysis"_a, "frequencies"_a, "model"_a = py::none(), "The Touchstone one-port text of the coil as mounted.");
    m.def("inductance_at_target", &libcoil::inductance_at_target, "analysis"_a, "frequency"_a,
          "The analysed coil's L at a frequency (0: its nominal one), in its shield if it has one: what a design meets its target with.");
    m.def("target_frequency", &libcoil::target_frequency, "requirement"_a);
    m.def("analyze", [](const libcoil::CoilSpec& spec, const std::string& solver, std::optional<int> layers, std::optional<int> sectors,
                        std::optional<libcoil::Subdivision> sub, unsigned threads) {
        libcoil::AnalysisOptions o;
        o.solver = libcoil::parse_choice<libcoil::LossSolver>(solver, "solver");
        o.threads = threads;
        if (sub) {
            o.auto_subdivision = false;
            o.subdivision = *sub;
        }
        if (layers) {
            o.auto_subdivision = false;
            o.subdivision.layers = *layers;
            o.subdivision.sectors = sectors.value_or(0);  // 0: the library's default
        } else if (sectors) {
            throw libcoil::InputError("sectors", "goes with layers");
        }
        py::gil_scoped_release release;
        return libcoil::analyze(spec, o);
    }, "spec"_a, "solver"_a = "harmonics", "layers"_a = py::none(), "sectors"_a = py::none(), "subdivision"_a = py::none(),
       "threads"_a = 1,
       "The analysis study of a coil spec. The filaments solver's subdivision follows the highest frequency unless layers "
       "(and sectors, default twice the layers) or a Subdivision are given. `threads`: the wire-harmonic solver's "
       "frequencies on this many threads (0: all cores); the figures are the same whatever the threads.");
    m.def("former", [](const libcoil::CoilSpec& spec, std::optional<std::string> out_dir, const std::string& stem,
                       std::optional<std::string> kind, std::optional<int> ribs, std::optional<double> rib_width,
                       std::optional<std::string> profile, std::optional<double> groove_depth, std::optional<double> clearance,
                       std::optional<std::pair<double, double>> flange, std::optional<double> ends,
                       std::optional<double> bore_oversize, double chord_tolerance, bool ascii) {
        libcoil::FormerOptions o;
        if (kind) o.kind = libcoil::parse_choice<libcoil::FormerKind>(*kind, "kind");
        if (profile) o.profile = libcoil::parse_choice<libcoil::GrooveProfile>(*profile, "profile");
        o.ribs = ribs;
        o.rib_width = rib_width;
        o.groove_depth = groove_depth;
        o.clearance = clearance;
        if (flange) o.flange = libcoil::FlangeSpec{flange->first, flange->second};
        o.ends = ends;
        o.bore_oversize = bore_oversize;
        o.chord_tolerance = chord_tolerance;
        libcoil::FormerBuild b;
        std::vector<std::string> files;
        {
            py::gil_scoped_release release;
            b = libcoil::build_former(spec, o);
            if (out_dir) {
                const libcoil::FileSet set = libcoil::former_files(b, *out_dir, stem, ascii);
                libcoil::write_file_set(set);
                for (const auto& [p, c] : set) files.push_back(p.string());
            }
        }
        return record("FormerResult", libcoil::python::former_dict(b, files));
    }, "spec"_a, "out_dir"_a = py::none(), "stem"_a = "former", "kind"_a = py::none(), "ribs"_a = py::none(),
       "rib_width"_a = py::none(), "profile"_a = py::none(), "groove_depth"_a = py::none(), "clearance"_a = py::none(),
       "flange"_a = py::none(), "ends"_a = py::none(), "bore_oversize"_a = py::none(), "chord_tolerance"_a = 0.01e-3, "ascii"_a = false,
       "The printable former of a coil spec: a FormerResult with its dimensions (SI), the mesh as numpy arrays, vertices "
       "(n, 3) in m and faces (m, 3) of vertex indices wound outward. With out_dir, also writes STEM.former.stl, .svg and "
       ".yaml there, all three or none.");
    m.def("couple", [](const libcoil::CoilSpec& a, const libcoil::CoilSpec& b, double distance, const std::string& arrangement,
                       double axial_offset, const std::vector<double>& frequencies, double source_resistance, double load_resistance,
                       const std::vector<double>& sweep_distances) {
        const libcoil::Arrangement arr = libcoil::parse_choice<libcoil::Arrangement>(arrangement, "arrangement");
        libcoil::CouplingStudy s;
        {
            py::gil_scoped_release release;
            s = libcoil::study_coupling(a, b, arr, distance, axial_offset, frequencies, source_resistance, load_resistance, sweep_distances);
        }
        return record("CouplingResult", libcoil::python::coupling_dict(s));
    }, "a"_a, "b"_a, "distance"_a, "arrangement"_a = "coaxial", "axial_offset"_a = 0.0, "frequencies"_a = std::vector<double>{},
       "source_resistance"_a = 50.0, "load_resistance"_a = 50.0, "sweep_distances"_a = std::vector<double>{},
       "M, k and crosstalk between two coil specs as mounted: a CouplingResult (SI, arrays over frequency and distance).");
    m.def("coil_mutual_inductance", [](const libcoil::Solenoid& a, const libcoil::Solenoid& b, double distance,
                                       const std::string& arrangement, double axial_offset) {
        return libcoil::coil_mutual_inductance(a, b, libcoil::parse_choice<libcoil::Arrangement>(arrangement, "arrangement"), distance,
                                               axial_offset);
    }, "a"_a, "b"_a, "distance"_a, "arrangement"_a = "coaxial", "axial_offset"_a = 0.0, "M in H between two solenoids.");
    m.def("parallel_filament_mutual_inductance", py::vectorize(&libcoil::parallel_filament_mutual_inductance), "radius_a"_a,
          "radius_b"_a, "distance"_a, "axial_offset"_a);
    m.def("sheet_in_long_shield_change", py::vectorize(&libcoil::sheet_in_long_shield_change), "mean_radius"_a, "length"_a,
          "turns"_a, "shield_radius"_a, "dL in H of a current sheet in an infinitely long perfectly conducting tube.");
    m.def("text_report", &libcoil::text_report, "analysis"_a);

    // The one option table the `coil` command is built from, and the choices behind its words.
    m.def("option_table", [] {
        py::list rows;
        for (const auto& o : libcoil::frontend::option_table()) {
            py::list choices;
            if (o.choices) {
                for (const auto& w : o.choices()) choices.append(w);
            }
            static const char* kinds[] = {"flag", "integer", "quantity", "choice", "text"};
            rows.append(py::dict("verb"_a = o.verb, "key"_a = o.key, "flag"_a = o.flag, "kind"_a = kinds[static_cast<int>(o.kind)],
                                 "choices"_a = choices, "default"_a = o.default_text, "python"_a = o.python, "help"_a = o.help));
        }
        return rows;
    }, "Every option of every `coil` verb: its flag, the Python keyword (key) and, for a choice, its words.");
    m.def("json_report", &libcoil::json_report, "analysis"_a);
}
