// Python bindings, the models: each a thin wrapper over one libcoil model. SI arguments; functions of a ratio
// or a geometry accept numpy arrays.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>
#include <pybind11/functional.h>
#include <pybind11/stl/filesystem.h>

#include <algorithm>
#include <complex>
#include <optional>

#include "libcoil/libcoil.hpp"
#include "bindings.hpp"
#include "results.hpp"

namespace py = pybind11;
using namespace pybind11::literals;
using libcoil::python::by_method;
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


}  // namespace

void bind_models(py::module_& m) {
    // Units, at the edge.
    m.def("parse_quantity", [](const std::string& text, const std::string& dimension, const std::string& field) {
        return libcoil::parse_quantity(text, dimension_from_name(dimension), field);
    }, "text"_a, "dimension"_a, "field"_a = "value", "Parse '25 mm', '1.2 uH', '25 degC' into SI.");
    m.def("format_quantity", [](double v, const std::string& dimension, int digits) {
        return libcoil::format_quantity(v, dimension_from_name(dimension), digits);
    }, "value"_a, "dimension"_a, "digits"_a = 4);

    // Measurement files in.
    m.def("read_network", [](const std::string& path) {
        const libcoil::NetworkData d = libcoil::read_network_file(path);
        const auto n = static_cast<py::ssize_t>(d.frequency.size()), p = static_cast<py::ssize_t>(d.ports);
        py::array_t<std::complex<double>> values({n, p, p});
        std::copy(d.values.begin(), d.values.end(), values.mutable_data());
        return record("Record", py::dict("frequency"_a = py::array_t<double>(n, d.frequency.data()), "matrix"_a = values,
                                         "ports"_a = d.ports, "parameter"_a = std::string(1, d.parameter),
                                         "reference"_a = d.reference, "notes"_a = d.notes));
    }, "path"_a, "A Touchstone (.s1p, .s2p, .ts) or CSV measurement: frequency (Hz) and the port matrices "
                 "as the file holds them (S, Y or Z): matrix[k, i, j].");

    m.def("read_measurement", [](const std::string& path, const std::string& arrangement) {
        const libcoil::MeasuredImpedance z = libcoil::measured_impedance(
            libcoil::read_network_file(path), libcoil::parse_choice<libcoil::MeasurementArrangement>(arrangement, "arrangement"));
        return record("Record", py::dict("frequency"_a = py::array_t<double>(static_cast<py::ssize_t>(z.frequency.size()), z.frequency.data()),
                                         "impedance"_a = py::array_t<std::complex<double>>(static_cast<py::ssize_t>(z.impedance.size()), z.impedance.data()),
                                         "relative_error"_a = py::array_t<double>(static_cast<py::ssize_t>(z.relative_error.size()), z.relative_error.data()),
                                         "weight"_a = py::array_t<double>(static_cast<py::ssize_t>(z.weight.size()), z.weight.data()),
                                         "notes"_a = z.notes));
    }, "path"_a, "arrangement"_a = "reflection",
       "The coil's measured Z (ohm) at each frequency (Hz) by the arrangement it was measured in, with each point's "
       "relative error for a trace error of 0.001 and its weight.");
    m.def("measured_figures", [](std::vector<double> f, std::vector<std::complex<double>> z, std::optional<std::vector<double>> weight) {
        libcoil::MeasuredImpedance m;
        m.frequency = std::move(f);
        m.impedance = std::move(z);
        if (m.impedance.size() != m.frequency.size()) throw libcoil::InputError("impedance", "one value a frequency");
        m.weight = weight ? *weight : std::vector<double>(m.frequency.size(), 1.0);
        if (m.weight.size() != m.frequency.size()) throw libcoil::InputError("weight", "one value a frequency");
        m.relative_error.assign(m.frequency.size(), 0.0);
        const libcoil::MeasuredFigures r = libcoil::measured_figures(m);
        const auto opt = [](const std::optional<double>& v) -> py::object { return v ? py::float_(*v) : py::object(py::none()); };
        return record("Record", py::dict("reference_frequency"_a = r.reference_frequency, "inductance"_a = r.inductance,
                                         "resistance"_a = r.resistance, "self_resonance"_a = opt(r.self_resonance),
                                         "self_capacitance"_a = opt(r.self_capacitance),
                                         "impedance_at_resonance"_a = opt(r.impedance_at_resonance),
                                         "q_at_resonance"_a = opt(r.q_at_resonance), "second_resonance"_a = opt(r.second_resonance),
                                         "q_factor"_a = py::array_t<double>(static_cast<py::ssize_t>(r.q_factor.size()), r.q_factor.data())));
    }, "frequency"_a, "impedance"_a, "weight"_a = py::none(),
       "L and R at the lowest well-measured frequency, the SRF, the self-capacitance, |Z| and Q at the SRF, the second "
       "resonance and Q(f), read straight from a measured Z.");

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
    m.def("skin_ratios_series", [](double x) {
        const auto r = libcoil::skin_ratios_series(x);
        return py::make_tuple(r.resistance, r.internal_inductance);
    }, "x"_a, "(R_ac / R_dc, L_int(f) / L_int(0)) from the Kelvin functions' series: the tables' reference.");
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
    m.def("proximity_loss_function_series", &libcoil::proximity_loss_function_series, "x"_a,
          "G(x) from the Kelvin functions: the tables' reference.");
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
    // A shield as a dict: inner_diameter, length, thickness (m), material (a conductor name, default copper).
    const auto shield_of = [](const std::optional<py::dict>& d) -> std::optional<libcoil::ShieldSpec> {
        if (!d) return std::nullopt;
        libcoil::ShieldSpec s;
        s.inner_diameter = (*d)["inner_diameter"].cast<double>();
        s.length = (*d)["length"].cast<double>();
        s.thickness = (*d)["thickness"].cast<double>();
        s.material = libcoil::conductor(d->contains("material") ? (*d)["material"].cast<std::string>() : std::string("copper"));
        return s;
    };
    py::class_<libcoil::CrossSectionSolver>(m, "CrossSectionSolver")
        .def(py::init([shield_of](const libcoil::Solenoid& c, double rho, libcoil::Subdivision sub, std::optional<py::dict> shield) {
                 return libcoil::CrossSectionSolver(c, rho, sub, shield_of(shield));
             }), "solenoid"_a, "resistivity"_a, "subdivision"_a = libcoil::Subdivision{}, "shield"_a = py::none())
        .def(py::init([shield_of](std::vector<std::pair<double, double>> rings, double r, double rho, libcoil::Subdivision sub,
                                  std::optional<py::dict> shield) {
                 return libcoil::CrossSectionSolver(std::move(rings), r, rho, sub, shield_of(shield));
             }), "rings"_a, "wire_radius"_a, "resistivity"_a, "subdivision"_a = libcoil::Subdivision{}, "shield"_a = py::none())
        .def("solve", [](const libcoil::CrossSectionSolver& s, double f) {
            const auto r = s.solve(f);
            return py::dict("frequency"_a = r.frequency, "resistance"_a = r.resistance, "inductance"_a = r.inductance,
                            "resolved"_a = r.resolved, "wall_resistance"_a = r.wall_resistance,
                            "wall_inductance"_a = r.wall_inductance);
        }, "frequency"_a, "R and L (H) of the coil at one frequency, skin and proximity effect together; in a shield, "
                          "the wall's share too.")
        .def_property_readonly("filaments", &libcoil::CrossSectionSolver::filaments)
        .def_property_readonly("unknowns", &libcoil::CrossSectionSolver::unknowns);
    m.def("harmonics_for", &libcoil::harmonics_for, "pitch_to_wire"_a, "d_over_delta"_a);
    m.def("wire_harmonic_unknowns", &libcoil::wire_harmonic_unknowns, "solenoid"_a, "resistivity"_a, "frequency"_a,
          "The wire-harmonic solver's unknowns for the coil at the frequency (the analysis takes it up to 1000).");
    m.attr("min_harmonic_diameter_ratio") = libcoil::min_harmonic_diameter_ratio;
    py::class_<libcoil::WireHarmonicSolver>(m, "WireHarmonicSolver")
        .def(py::init([shield_of](const libcoil::Solenoid& c, double rho, int harmonics, std::optional<py::dict> shield) {
                 return libcoil::WireHarmonicSolver(c, rho, harmonics, shield_of(shield));
             }), "solenoid"_a, "resistivity"_a, "harmonics"_a = 0, "shield"_a = py::none())
        .def(py::init([shield_of](std::vector<std::pair<double, double>> rings, double r, double rho, int harmonics,
                                  std::optional<py::dict> shield) {
                 return libcoil::WireHarmonicSolver(std::move(rings), r, rho, harmonics, shield_of(shield));
             }), "rings"_a, "wire_radius"_a, "resistivity"_a, "harmonics"_a = 0, "shield"_a = py::none())
        .def("solve", [](const libcoil::WireHarmonicSolver& s, double f) {
            const auto r = s.solve(f);
            return py::dict("frequency"_a = r.frequency, "resistance"_a = r.resistance, "inductance"_a = r.inductance,
                            "wall_resistance"_a = r.wall_resistance, "wall_inductance"_a = r.wall_inductance);
        }, "frequency"_a, "R and L (H) of the rings in series at one frequency by Bessel harmonics of each wire's current; "
                          "in a shield, the wall's share too.")
        .def_property_readonly("turns", &libcoil::WireHarmonicSolver::turns);

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
        .def("wavenumber_for", py::overload_cast<double, double, double>(&libcoil::SheathHelix::wavenumber_for, py::const_), "beta"_a,
             "guess"_a = 0.0, "tolerance"_a = libcoil::SheathHelix::default_tolerance,
             "Free-space wavenumber k (rad/m) of the slow wave with axial wavenumber beta, to a relative tolerance; "
             "guess 0 for none.")
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
          "inductance"_a, "capacitance"_a, "loss_tangent"_a = 0.0);
    m.def("line_impedance", [](double w, double r, double l, double v, double len, const std::string& mounting, double loss_tangent) {
        return libcoil::line_impedance(w, r, l, v, len, libcoil::parse_choice<libcoil::Mounting>(mounting, "mounting"), loss_tangent);
    }, "angular_frequency"_a, "resistance"_a, "inductance"_a, "phase_velocity"_a, "length"_a, "mounting"_a = "floating",
       "loss_tangent"_a = 0.0);

    // The turn network (PEEC).
    m.def("ring_capacitance", py::vectorize(&libcoil::ring_capacitance), "ring_radius"_a, "wire_radius"_a,
          "Capacitance of an isolated ring of round wire, F (the network's potential coefficient).");
    py::class_<libcoil::TurnNetwork>(m, "TurnNetwork")
        .def(py::init([](const libcoil::Solenoid& s, const std::string& mounting, double base_height, double permittivity,
                         const std::string& capacitance, double former_permittivity, double former_wall, double former_fill,
                         double former_ends, double enamel_permittivity, double terminal_capacitance) {
                 libcoil::TurnNetworkOptions o;
                 o.mounting = libcoil::parse_choice<libcoil::Mounting>(mounting, "mounting");
                 o.base_height = base_height;
                 o.relative_permittivity = permittivity;
                 o.capacitance = libcoil::parse_choice<libcoil::TurnCapacitance>(capacitance, "capacitance");
                 o.former = libcoil::FormerDielectric{former_permittivity, former_wall, former_fill};
                 o.former_ends = former_ends;
                 o.enamel_permittivity = enamel_permittivity;
                 o.terminal_capacitance = terminal_capacitance;
                 return libcoil::TurnNetwork(s, o);
             }),
             "solenoid"_a, "mounting"_a = "floating", "base_height"_a = -1.0, "relative_permittivity"_a = 1.0,
             "capacitance"_a = "near-field-corrected", "former_permittivity"_a = 1.0, "former_wall"_a = 0.0,
             "former_fill"_a = 1.0, "former_ends"_a = 5e-3, "enamel_permittivity"_a = 3.5, "terminal_capacitance"_a = 0.0,
             "The winding as coupled turns (PEEC). A former is a tube of `former_wall` under the winding (a rod where it\n"
             "reaches the axis); `terminal_capacitance` a capacitor across the terminals (far end to ground if grounded).")
        .def("resonances", &libcoil::TurnNetwork::resonances, "count"_a = 3, "The lowest natural frequencies, Hz.")
        .def("impedance", [](const libcoil::TurnNetwork& n, py::array_t<double, py::array::c_style | py::array::forcecast> f,
                             double r, double tan_d) {
                 py::array_t<std::complex<double>> z(f.request().shape);
                 for (py::ssize_t i = 0; i < f.size(); ++i) z.mutable_data()[i] = n.impedance(f.data()[i], r, tan_d);
                 return z;
             }, "frequency"_a, "series_resistance"_a = 0.0, "loss_tangent"_a = 0.0,
             "Z between the terminals (ohm) over an array of frequencies.")
        .def("turn_currents", [](const libcoil::TurnNetwork& n, double f, double r, double tan_d, double l) {
                 const auto i = n.turn_currents(f, r, tan_d, l);
                 py::array_t<std::complex<double>> out(static_cast<py::ssize_t>(i.size()));
                 std::copy(i.begin(), i.end(), out.mutable_data());
                 return out;
             }, "frequency"_a, "series_resistance"_a = 0.0,
             "loss_tangent"_a = 0.0, "series_inductance"_a = 0.0,
             "The current in each turn (A, complex, first to last) with 1 A driven into the terminals at `frequency`.")
        .def_property_readonly("inductance", &libcoil::TurnNetwork::inductance)
        .def_property_readonly("elements", &libcoil::TurnNetwork::elements)
        .def_property_readonly("panels", &libcoil::TurnNetwork::panels)
        .def_property_readonly("turn_capacitance", [](const libcoil::TurnNetwork& n) {
            const auto& c = n.turn_capacitance();
            py::array_t<double> out({n.elements(), n.elements()});
            std::copy(c.begin(), c.end(), out.mutable_data());
            return out;
        }, "The turns' Maxwell capacitance matrix, F (N x N).");

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

}
