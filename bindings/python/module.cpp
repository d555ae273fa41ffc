// Python bindings: a thin layer over libcoil. SI arguments; functions of a ratio or a geometry accept
// numpy arrays. libcoil::InputError arrives as libcoil.InputError (a ValueError) with the same message.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>
#include <pybind11/functional.h>
#include <pybind11/stl/filesystem.h>

#include <optional>

#include "libcoil/libcoil.hpp"
#include "option_table.hpp"
#include "results.hpp"

namespace py = pybind11;
using namespace pybind11::literals;
using libcoil::python::record;

namespace {

libcoil::Dimension dimension_from_name(const std::string& name) {
    using D = libcoil::Dimension;
    static const std::pair<const char*, D> names[] = {
        {"dimensionless", D::dimensionless}, {"length", D::length},       {"inductance", D::inductance},
        {"capacitance", D::capacitance},     {"frequency", D::frequency}, {"current", D::current},
        {"voltage", D::voltage},             {"resistance", D::resistance}, {"power", D::power},
        {"temperature", D::temperature},     {"time", D::time},
    };
    for (const auto& [n, d] : names) {
        if (name == n) return d;
    }
    throw libcoil::InputError("dimension", "\"" + name + "\" is not a known dimension such as \"length\"");
}

libcoil::Wire make_wire(std::optional<double> diameter, std::optional<std::string> gauge, double insulation,
                        std::optional<int> enamel_grade) {
    libcoil::WireChoice c;
    c.diameter = diameter;
    if (gauge) c.gauge = libcoil::parse_awg(*gauge, "gauge");
    if (enamel_grade) c.enamel_grade = enamel_grade; else c.insulation = insulation;
    return libcoil::make_wire(c, "");
}

py::dict by_method(const libcoil::InductanceByMethod& m) {
    return py::dict("wheeler"_a = m.wheeler, "nagaoka"_a = m.nagaoka, "lundin"_a = m.lundin, "rosa"_a = m.rosa,
                    "filament"_a = m.filament);
}

}  // namespace

PYBIND11_MODULE(_core, m) {
    m.doc() = "libcoil: design of single-layer air-core coils (compiled core)";
    m.attr("__version__") = libcoil::version;

    py::register_exception<libcoil::InputError>(m, "InputError", PyExc_ValueError);
    py::register_exception<libcoil::DomainError>(m, "DomainError", PyExc_ValueError);

    m.attr("mu0") = libcoil::mu0;
    m.attr("eps0") = libcoil::eps0;
    m.attr("speed_of_light") = libcoil::speed_of_light;

    // Units, at the edge.
    m.def("parse_quantity", [](const std::string& text, const std::string& dimension, const std::string& field) {
        return libcoil::parse_quantity(text, dimension_from_name(dimension), field);
    }, "text"_a, "dimension"_a, "field"_a = "value", "Parse '25 mm', '1.2 uH', '25 degC' into SI.");
    m.def("format_quantity", [](double v, const std::string& dimension, int digits) {
        return libcoil::format_quantity(v, dimension_from_name(dimension), digits);
    }, "value"_a, "dimension"_a, "digits"_a = 4);

    // Wire.
    m.def("parse_awg", [](const std::string& t) { return libcoil::parse_awg(t, "gauge"); }, "text"_a);
    m.def("awg_diameter", py::vectorize(&libcoil::awg_diameter), "gauge"_a, "Bare diameter in m (ASTM B258).");
    m.def("enamel_build", [](double d, int grade) { return libcoil::enamel_build(d, grade, "grade"); },
          "bare_diameter"_a, "grade"_a, "Radial enamel build in m, IEC 60317 grade 1-3.");
    m.def("metric_wire_diameters", &libcoil::metric_wire_diameters);

    // Inductance models.
    m.def("nagaoka_coefficient", py::vectorize(&libcoil::nagaoka_coefficient), "diameter_to_length"_a,
          "Nagaoka's coefficient K(D/l), exact.");
    m.def("nagaoka_slope", py::vectorize([](double rho) { return libcoil::nagaoka_coefficient_and_slope(rho).slope; }),
          "diameter_to_length"_a, "dK/d(D/l), the derivative of Nagaoka's coefficient.");
    m.def("wheeler_coefficient", py::vectorize(&libcoil::wheeler_coefficient), "diameter_to_length"_a);
    m.def("lundin_coefficient", py::vectorize(&libcoil::lundin_coefficient), "diameter_to_length"_a);
    m.def("current_sheet_inductance", py::vectorize(&libcoil::current_sheet_inductance), "mean_diameter"_a,
          "length"_a, "turns"_a);
    m.def("wheeler_inductance", py::vectorize(&libcoil::wheeler_inductance), "mean_diameter"_a, "length"_a, "turns"_a);
    m.def("lundin_inductance", py::vectorize(&libcoil::lundin_inductance), "mean_diameter"_a, "length"_a, "turns"_a);
    m.def("rosa_self_correction", py::vectorize(&libcoil::rosa_self_correction), "pitch_to_wire"_a);
    m.def("rosa_mutual_correction", py::vectorize(&libcoil::rosa_mutual_correction), "turns"_a);
    m.def("rosa_inductance", py::vectorize(&libcoil::rosa_inductance), "mean_diameter"_a, "turns"_a, "pitch"_a,
          "wire_diameter"_a);
    m.def("filament_inductance", py::vectorize(&libcoil::filament_inductance), "mean_diameter"_a, "turns"_a,
          "pitch"_a, "wire_diameter"_a);
    m.def("coaxial_mutual_inductance", py::vectorize(&libcoil::coaxial_mutual_inductance), "radius_a"_a,
          "radius_b"_a, "axial_distance"_a, "Maxwell's mutual inductance of coaxial circles, H.");
    m.def("ring_self_inductance", py::vectorize(&libcoil::ring_self_inductance), "ring_radius"_a, "wire_radius"_a);

    // Losses.
    m.def("kelvin", [](double x) {
        const auto k = libcoil::kelvin(x);
        return py::make_tuple(k.ber, k.bei, k.ber_prime, k.bei_prime);
    }, "x"_a, "(ber, bei, ber', bei') at x.");
    m.def("ber", py::vectorize([](double x) { return libcoil::kelvin(x).ber; }), "x"_a);
    m.def("bei", py::vectorize([](double x) { return libcoil::kelvin(x).bei; }), "x"_a);
    m.def("berp", py::vectorize([](double x) { return libcoil::kelvin(x).ber_prime; }), "x"_a);
    m.def("beip", py::vectorize([](double x) { return libcoil::kelvin(x).bei_prime; }), "x"_a);
    m.def("skin_depth", py::vectorize(&libcoil::skin_depth), "resistivity"_a, "frequency"_a,
          "relative_permeability"_a = 1.0);
    m.def("skin_resistance_ratio", py::vectorize([](double x) { return libcoil::skin_ratios(x).resistance; }), "x"_a,
          "R_ac / R_dc of an isolated round wire, x = sqrt(2) r / delta.");
    m.def("skin_inductance_ratio", py::vectorize([](double x) { return libcoil::skin_ratios(x).internal_inductance; }),
          "x"_a, "L_int(f) / L_int(0) of an isolated round wire.");
    m.def("dc_resistance", [](const libcoil::Conductor& c, double d, double length, double t) {
        return libcoil::dc_resistance(c, d, length, t);
    }, "conductor"_a, "diameter"_a, "length"_a, "temperature"_a);

    m.def("coil_at_frequencies", [](const libcoil::Solenoid& s, const libcoil::Conductor& c, double t,
                                     py::array_t<double, py::array::c_style | py::array::forcecast> f) {
        const std::vector<double> fs(f.data(), f.data() + f.size());
        const auto pts = libcoil::coil_at_frequencies(s, c, t, libcoil::recommended_inductance(s), fs);
        py::array_t<double> r(f.request().shape), l(f.request().shape), q(f.request().shape), skin(f.request().shape),
            prox(f.request().shape);
        for (std::size_t i = 0; i < pts.size(); ++i) {
            r.mutable_data()[i] = pts[i].resistance;
            l.mutable_data()[i] = pts[i].inductance;
            q.mutable_data()[i] = pts[i].q_factor;
            skin.mutable_data()[i] = pts[i].skin_ratio;
            prox.mutable_data()[i] = pts[i].proximity_ratio;
        }
        return py::dict("resistance"_a = r, "inductance"_a = l, "q_factor"_a = q, "skin_ratio"_a = skin,
                        "proximity_ratio"_a = prox);
    }, "solenoid"_a, "conductor"_a, "temperature"_a, "frequency"_a,
       "Closed-form R(f), L(f), Q(f) over an array of frequencies (arrays of the same shape).");
    m.def("proximity_loss_function", py::vectorize(&libcoil::proximity_loss_function), "x"_a);
    m.def("mean_square_field_per_ampere", &libcoil::mean_square_field_per_ampere, "solenoid"_a);
    m.def("ac_resistance", [](const libcoil::Solenoid& s, const libcoil::Conductor& c, double t, double f) {
        const auto r = libcoil::ac_resistance(s, c, t, f);
        return py::dict("frequency"_a = r.frequency, "dc"_a = r.dc, "skin_ratio"_a = r.skin_ratio,
                        "proximity_ratio"_a = r.proximity_ratio, "resistance"_a = r.resistance,
                        "internal_inductance_ratio"_a = r.internal_inductance_ratio);
    }, "solenoid"_a, "conductor"_a, "temperature"_a, "frequency"_a);
    py::class_<libcoil::Subdivision>(m, "Subdivision")
        .def(py::init([](int layers, double grading, int sectors) { return libcoil::Subdivision{layers, grading, sectors}; }),
             "layers"_a = 8, "grading"_a = 1.3, "sectors"_a = 16)
        .def_readwrite("layers", &libcoil::Subdivision::layers)
        .def_readwrite("grading", &libcoil::Subdivision::grading)
        .def_readwrite("sectors", &libcoil::Subdivision::sectors);
    m.def("subdivision_for", &libcoil::subdivision_for, "wire_radius"_a, "skin_depth"_a);
    py::class_<libcoil::CrossSectionSolver>(m, "CrossSectionSolver")
        .def(py::init<const libcoil::Solenoid&, double, libcoil::Subdivision>(), "solenoid"_a, "resistivity"_a,
             "subdivision"_a = libcoil::Subdivision{})
        .def(py::init<std::vector<std::pair<double, double>>, double, double, libcoil::Subdivision>(), "rings"_a,
             "wire_radius"_a, "resistivity"_a, "subdivision"_a = libcoil::Subdivision{})
        .def("solve", [](const libcoil::CrossSectionSolver& s, double f) {
            const auto r = s.solve(f);
            return py::dict("frequency"_a = r.frequency, "resistance"_a = r.resistance, "inductance"_a = r.inductance,
                            "resolved"_a = r.resolved);
        }, "frequency"_a, "R and L (H) of the coil at one frequency, skin and proximity effect together.")
        .def_property_readonly("filaments", &libcoil::CrossSectionSolver::filaments)
        .def_property_readonly("unknowns", &libcoil::CrossSectionSolver::unknowns);

    // Materials.
    py::class_<libcoil::Conductor>(m, "Conductor")
        .def_readonly("name", &libcoil::Conductor::name)
        .def_readonly("resistivity_20", &libcoil::Conductor::resistivity_20)
        .def_readonly("temperature_coefficient", &libcoil::Conductor::temperature_coefficient)
        .def_readonly("relative_permeability", &libcoil::Conductor::relative_permeability)
        .def_readonly("source", &libcoil::Conductor::source)
        .def("resistivity_at", &libcoil::Conductor::resistivity_at, "temperature"_a);
    py::class_<libcoil::FormerMaterial>(m, "FormerMaterial")
        .def_readonly("name", &libcoil::FormerMaterial::name)
        .def_readonly("relative_permittivity", &libcoil::FormerMaterial::relative_permittivity)
        .def_readonly("loss_tangent", &libcoil::FormerMaterial::loss_tangent)
        .def_readonly("max_service_temperature", &libcoil::FormerMaterial::max_service_temperature)
        .def_readonly("source", &libcoil::FormerMaterial::source);
    m.def("conductor", [](const std::string& n) { return libcoil::conductor(n); }, "name"_a);
    m.def("former_material", [](const std::string& n) { return libcoil::former_material(n); }, "name"_a);
    m.def("conductor_names", &libcoil::conductor_names);
    m.def("former_material_names", &libcoil::former_material_names);
    m.def("data_directory", &libcoil::data_directory);

    // Geometry.
    py::class_<libcoil::Wire>(m, "Wire")
        .def(py::init(&make_wire), py::kw_only(), "diameter"_a = py::none(), "gauge"_a = py::none(),
             "insulation"_a = 0.0, "enamel_grade"_a = py::none())
        .def_readonly("bare_diameter", &libcoil::Wire::bare_diameter)
        .def_readonly("insulation", &libcoil::Wire::insulation)
        .def_readonly("label", &libcoil::Wire::label)
        .def_property_readonly("insulated_diameter", &libcoil::Wire::insulated_diameter)
        .def("__repr__", [](const libcoil::Wire& w) {
            return "Wire(" + w.label + ", bare " + libcoil::format_quantity(w.bare_diameter, libcoil::Dimension::length) +
                   ", insulated " + libcoil::format_quantity(w.insulated_diameter(), libcoil::Dimension::length) + ")";
        });

    py::class_<libcoil::Solenoid>(m, "Solenoid")
        .def(py::init([](double turns, double pitch, const libcoil::Wire& wire, std::optional<double> mean_diameter,
                         std::optional<double> form_diameter, double lead_length) {
                 if (mean_diameter.has_value() == form_diameter.has_value()) {
                     throw libcoil::InputError("mean_diameter", "give either mean_diameter or form_diameter");
                 }
                 if (form_diameter) return libcoil::Solenoid::on_form(*form_diameter, turns, pitch, wire, lead_length);
                 return libcoil::Solenoid(libcoil::Solenoid::Params{*mean_diameter, turns, pitch, wire, lead_length});
             }),
             py::kw_only(), "turns"_a, "pitch"_a, "wire"_a, "mean_diameter"_a = py::none(),
             "form_diameter"_a = py::none(), "lead_length"_a = 0.0)
        .def_property_readonly("mean_diameter", &libcoil::Solenoid::mean_diameter)
        .def_property_readonly("mean_radius", &libcoil::Solenoid::mean_radius)
        .def_property_readonly("turns", &libcoil::Solenoid::turns)
        .def_property_readonly("pitch", &libcoil::Solenoid::pitch)
        .def_property_readonly("wire", &libcoil::Solenoid::wire)
        .def_property_readonly("lead_length", &libcoil::Solenoid::lead_length)
        .def_property_readonly("form_diameter", &libcoil::Solenoid::form_diameter)
        .def_property_readonly("outer_diameter", &libcoil::Solenoid::outer_diameter)
        .def_property_readonly("winding_length", &libcoil::Solenoid::winding_length)
        .def_property_readonly("overall_length", &libcoil::Solenoid::overall_length)
        .def_property_readonly("diameter_to_length", &libcoil::Solenoid::diameter_to_length)
        .def_property_readonly("pitch_angle", &libcoil::Solenoid::pitch_angle)
        .def_property_readonly("helix_length", &libcoil::Solenoid::helix_length)
        .def_property_readonly("wire_length", &libcoil::Solenoid::wire_length)
        .def("inductance", [](const libcoil::Solenoid& s) { return libcoil::recommended_inductance(s); },
             "The recommended inductance in H (Rosa-corrected Nagaoka, or the filament sum at wide pitch).")
        .def("__repr__", [](const libcoil::Solenoid& s) {
            using libcoil::Dimension;
            return "Solenoid(turns " + libcoil::format_quantity(s.turns(), Dimension::dimensionless, 6) + ", mean diameter " +
                   libcoil::format_quantity(s.mean_diameter(), Dimension::length) + ", pitch " +
                   libcoil::format_quantity(s.pitch(), Dimension::length) + ", " + s.wire().label + ")";
        });

    py::class_<libcoil::InductanceResult>(m, "InductanceResult")
        .def_readonly("nagaoka_coefficient", &libcoil::InductanceResult::nagaoka_coefficient)
        .def_readonly("recommended", &libcoil::InductanceResult::recommended)
        .def_readonly("warnings", &libcoil::InductanceResult::warnings)
        .def_property_readonly("by_method", [](const libcoil::InductanceResult& r) { return by_method(r.by_method); });
    m.def("inductance", &libcoil::inductance, "solenoid"_a, "Every inductance model and the recommended value.");

    // Self-capacitance, self-resonance and impedance.
    m.def("medhurst_h", py::vectorize(&libcoil::medhurst_h), "length_to_diameter"_a,
          "Medhurst's H (pF per cm of diameter), interpolated in his table.");
    m.def("medhurst_h_formula", py::vectorize(&libcoil::medhurst_h_formula), "length_to_diameter"_a);
    m.def("medhurst_capacitance", py::vectorize(&libcoil::medhurst_capacitance), "mean_diameter"_a, "winding_length"_a);
    m.def("kandoian_sichak_velocity_factor", py::vectorize(&libcoil::kandoian_sichak_velocity_factor), "diameter"_a,
          "pitch"_a, "wavelength"_a);
    py::class_<libcoil::SheathHelix>(m, "SheathHelix")
        .def(py::init([](double a, double psi, double inner, double outer) {
                 return libcoil::SheathHelix(a, psi, libcoil::HelixMedium{inner, outer});
             }),
             "radius"_a, "pitch_angle"_a, "inner_permittivity"_a = 1.0, "outer_permittivity"_a = 1.0)
        .def("dispersion", &libcoil::SheathHelix::dispersion, "beta"_a, "k"_a)
        .def("wavenumber_for", py::overload_cast<double>(&libcoil::SheathHelix::wavenumber_for, py::const_), "beta"_a)
        .def("axial_wavenumber", &libcoil::SheathHelix::axial_wavenumber, "k"_a)
        .def("phase_velocity", &libcoil::SheathHelix::phase_velocity, "beta"_a);
    m.def("sheath_inner_energy_share", &libcoil::sheath_inner_energy_share, "a"_a, "r_in"_a, "r_out"_a, "gamma"_a,
          "beta"_a);
    m.def("self_resonance", [](const libcoil::Solenoid& s, double inductance, double former_permittivity,
                               double former_wall, double former_fill, double surroundings_permittivity,
                               const std::string& mounting) {
        return record("Record", libcoil::python::self_resonance_dict(libcoil::self_resonance(
            s, inductance, libcoil::FormerDielectric{former_permittivity, former_wall, former_fill},
            libcoil::Surroundings{surroundings_permittivity, libcoil::parse_choice<libcoil::Mounting>(mounting, "mounting")})));
    }, "solenoid"_a, "inductance"_a, "former_permittivity"_a = 1.0, "former_wall"_a = 0.0, "former_fill"_a = 0.0,
       "surroundings_permittivity"_a = 1.0, "mounting"_a = "floating",
       "Self-resonance by each model (dict); former_* describe the dielectric shell under the winding.");
    m.def("lumped_impedance", py::vectorize(&libcoil::lumped_impedance), "angular_frequency"_a, "resistance"_a,
          "inductance"_a, "capacitance"_a);
    m.def("line_impedance", [](double w, double r, double l, double v, double len, const std::string& mounting) {
        return libcoil::line_impedance(w, r, l, v, len, libcoil::parse_choice<libcoil::Mounting>(mounting, "mounting"));
    }, "angular_frequency"_a, "resistance"_a, "inductance"_a, "phase_velocity"_a, "length"_a, "mounting"_a = "floating");

    // Thermal estimate.
    m.def("churchill_chu_horizontal", py::vectorize(&libcoil::churchill_chu_horizontal), "rayleigh"_a, "prandtl"_a);
    m.def("churchill_chu_vertical", py::vectorize(&libcoil::churchill_chu_vertical), "rayleigh"_a, "prandtl"_a);
    m.def("winding_temperature", [](const std::function<double(double)>& power, double outer_diameter, double length,
                                    double ambient, double emissivity, bool vertical) {
        const auto r = libcoil::winding_temperature(
            power, libcoil::ThermalSurface{outer_diameter, length, emissivity,
                                           vertical ? libcoil::CoilAxis::vertical : libcoil::CoilAxis::horizontal},
            ambient);
        return py::dict("temperature"_a = r.temperature, "rise"_a = r.rise, "power"_a = r.power,
                        "convection"_a = r.convection, "radiation"_a = r.radiation,
                        "convection_coefficient"_a = r.convection_coefficient, "rayleigh"_a = r.rayleigh);
    }, "power"_a, "outer_diameter"_a, "length"_a, "ambient"_a, "emissivity"_a = 0.85, "vertical"_a = false,
       "Steady winding temperature (K) for a loss power(T) in W.");

    // Design search.
    py::class_<libcoil::Requirement>(m, "Requirement")
        .def_readonly("name", &libcoil::Requirement::name)
        .def_readonly("inductance", &libcoil::Requirement::inductance)
        .def_readonly("tolerance", &libcoil::Requirement::tolerance)
        .def_readonly("notes", &libcoil::Requirement::notes);
    m.def("parse_requirement", &libcoil::parse_requirement, "yaml_text"_a, "source"_a = "requirement");
    m.def("load_requirement", &libcoil::load_requirement, "path"_a);
    m.def("design", [](const libcoil::Requirement& q, unsigned threads, std::size_t top, bool spread,
                       std::size_t samples, std::uint64_t seed) {
        libcoil::DesignOptions o;
        o.threads = threads;
        o.top = top;
        o.spread = spread;
        o.samples = samples;
        o.seed = seed;
        libcoil::DesignResult r;
        {
            py::gil_scoped_release release;
            r = libcoil::design(q, o);
        }
        return record("DesignResult", libcoil::python::design_dict(q, r));
    }, "requirement"_a, "threads"_a = 0, "top"_a = 10, "spread"_a = false, "samples"_a = 2000, "seed"_a = 1,
       "The ranked designs for a requirement: a DesignResult whose `designs` holds numpy arrays over the ranking.");
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
        std::vector<double> form(n), turns(n), pitch(n), ind(n), srf(n), res(n), temp(n), vol(n), score(n);
        std::vector<long> wire(n);
        for (std::size_t i = 0; i < n; ++i) {
            const auto& d = r.pareto[i];
            wire[i] = static_cast<long>(d.wire_index);
            form[i] = d.form_diameter;
            turns[i] = d.turns;
            pitch[i] = d.pitch;
            ind[i] = d.inductance;
            srf[i] = d.self_resonance;
            res[i] = d.resistance;
            temp[i] = d.temperature;
            vol[i] = d.volume;
            score[i] = d.score;
        }
        const auto np = py::module_::import("numpy");
        const auto arr = [&](const auto& v) { return np.attr("array")(py::cast(v)); };
        return np.attr("rec").attr("fromarrays")(
            py::make_tuple(arr(wire), arr(form), arr(turns), arr(pitch), arr(ind), arr(srf), arr(res), arr(temp), arr(vol),
                           arr(score)),
            "names"_a = "wire_index,form_diameter,turns,pitch,inductance,self_resonance,resistance,temperature,volume,score");
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
    m.def("sweep", [](const libcoil::Analysis& a, std::vector<double> frequencies, const std::string& model, const std::string& capacitance) {
        libcoil::SweepRequest q;
        q.frequencies = std::move(frequencies);
        q.model = libcoil::parse_choice<libcoil::ImpedanceModel>(model, "model");
        q.capacitance = libcoil::parse_choice<libcoil::CapacitanceSource>(capacitance, "capacitance");
        libcoil::Sweep s;
        {
            py::gil_scoped_release release;
            s = libcoil::sweep_study(a, q);
        }
        return record("Sweep", libcoil::python::sweep_dict(s));
    }, "analysis"_a, "frequencies"_a, "model"_a = "helical-line", "capacitance"_a = "helical-line",
       "Z(f) of an analysed coil as mounted (its shield, its mounting): a Sweep of numpy arrays (frequency, impedance, ...).");
    m.def("frequency_grid", [](double start, double stop, int points, bool logarithmic) {
        return libcoil::frequency_grid(start, stop, points, logarithmic ? libcoil::Spacing::logarithmic : libcoil::Spacing::linear);
    }, "start"_a, "stop"_a, "points"_a, "logarithmic"_a = true);
    m.def("touchstone_s1p", [](const libcoil::Analysis& a, std::vector<double> f, const std::string& model) {
        libcoil::SweepRequest q;
        q.frequencies = std::move(f);
        q.model = libcoil::parse_choice<libcoil::ImpedanceModel>(model, "model");
        return libcoil::touchstone_s1p(libcoil::sweep_study(a, q));
    }, "analysis"_a, "frequencies"_a, "model"_a = "helical-line", "The Touchstone one-port text of the coil as mounted.");
    m.def("analyze", [](const libcoil::CoilSpec& spec, const std::string& solver, std::optional<int> layers, std::optional<int> sectors,
                        std::optional<libcoil::Subdivision> sub) {
        libcoil::AnalysisOptions o;
        o.solver = libcoil::parse_choice<libcoil::LossSolver>(solver, "solver");
        if (sub) {
            o.auto_subdivision = false;
            o.subdivision = *sub;
        }
        if (layers) {
            o.auto_subdivision = false;
            o.subdivision.layers = *layers;
            o.subdivision.sectors = sectors.value_or(2 * *layers);
        } else if (sectors) {
            throw libcoil::InputError("sectors", "goes with layers");
        }
        py::gil_scoped_release release;
        return libcoil::analyze(spec, o);
    }, "spec"_a, "solver"_a = "closed-form", "layers"_a = py::none(), "sectors"_a = py::none(), "subdivision"_a = py::none(),
       "The analysis study of a coil spec. The filaments solver's subdivision follows the highest frequency unless layers "
       "(and sectors, default twice the layers) or a Subdivision are given.");
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
