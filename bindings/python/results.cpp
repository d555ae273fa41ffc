#include "results.hpp"

#include <pybind11/stl.h>

#include <algorithm>

namespace libcoil::python {

using namespace pybind11::literals;

namespace {

// A numpy array of one field over a list of records.
template <class T, class F>
py::array_t<double> column(const std::vector<T>& rows, F field) {
    py::array_t<double> a(static_cast<py::ssize_t>(rows.size()));
    auto* p = a.mutable_data();
    for (std::size_t i = 0; i < rows.size(); ++i) p[i] = field(rows[i]);
    return a;
}

py::dict method_dict(const SelfResonanceMethod& m) {
    return py::dict("available"_a = m.available, "frequency"_a = m.frequency, "capacitance"_a = m.capacitance,
                    "error_low"_a = m.error_low, "error_high"_a = m.error_high);
}

py::dict criterion_dict(const CriterionResult& c) {
    return py::dict("name"_a = c.name, "required"_a = c.required, "pass"_a = c.pass, "margin"_a = c.margin, "worst"_a = c.worst,
                    "worst_frequency"_a = c.worst_frequency,
                    "first_failure"_a = c.first_failure ? py::object(py::float_(*c.first_failure)) : py::object(py::none()),
                    "default"_a = c.defaulted);
}

py::object optional_float(const std::optional<double>& v) { return v ? py::object(py::float_(*v)) : py::object(py::none()); }

}  // namespace

py::dict by_method(const InductanceByMethod& m) {
    return py::dict("wheeler"_a = m.wheeler, "nagaoka"_a = m.nagaoka, "lundin"_a = m.lundin, "rosa"_a = m.rosa, "filament"_a = m.filament);
}

py::object record(const char* kind, py::dict fields) { return py::module_::import("libcoil._records").attr(kind)(fields); }

py::dict self_resonance_dict(const SelfResonance& r) {
    return py::dict("frequency"_a = r.frequency, "frequency_low"_a = r.frequency_low, "frequency_high"_a = r.frequency_high,
                    "network_modes"_a = r.network_modes,
                    "band_reasons"_a = r.band_reasons, "capacitance"_a = r.capacitance, "method"_a = r.method,
                    "network"_a = method_dict(r.network), "helical_line"_a = method_dict(r.helical_line), "kandoian_sichak"_a = method_dict(r.kandoian_sichak),
                    "medhurst"_a = method_dict(r.medhurst), "low_frequency_capacitance"_a = r.low_frequency_capacitance,
                    "inductance"_a = r.inductance, "winding_length"_a = r.winding_length,
                    "resonance_wavenumber"_a = r.resonance_wavenumber, "phase_velocity"_a = r.phase_velocity,
                    "pitch_angle"_a = r.pitch_angle, "radius"_a = r.radius, "inner_permittivity"_a = r.medium.inner,
                    "outer_permittivity"_a = r.medium.outer, "mounting"_a = choice_name(r.mounting),
                    "half_wave_wire_frequency"_a = r.half_wave_wire_frequency, "warnings"_a = r.warnings, "notes"_a = r.notes);
}

py::dict impedance_dict(const std::vector<ImpedancePoint>& pts) {
    py::array_t<std::complex<double>> z(static_cast<py::ssize_t>(pts.size()));
    for (std::size_t i = 0; i < pts.size(); ++i) z.mutable_data()[i] = pts[i].impedance;
    return py::dict("frequency"_a = column(pts, [](const auto& p) { return p.frequency; }), "impedance"_a = z,
                    "wire_resistance"_a = column(pts, [](const auto& p) { return p.wire_resistance; }),
                    "wire_inductance"_a = column(pts, [](const auto& p) { return p.wire_inductance; }),
                    "apparent_inductance"_a = column(pts, [](const auto& p) { return p.apparent_inductance; }),
                    "q_factor"_a = column(pts, [](const auto& p) { return p.q_factor; }));
}

py::dict at_frequency_dict(const std::vector<CoilAtFrequency>& pts) {
    py::array_t<bool> numerical(static_cast<py::ssize_t>(pts.size())), resolved(static_cast<py::ssize_t>(pts.size()));
    for (std::size_t i = 0; i < pts.size(); ++i) {
        numerical.mutable_data()[i] = pts[i].numerical;
        resolved.mutable_data()[i] = pts[i].resolved;
    }
    return py::dict("frequency"_a = column(pts, [](const auto& p) { return p.frequency; }),
                    "resistance"_a = column(pts, [](const auto& p) { return p.resistance; }),
                    "skin_ratio"_a = column(pts, [](const auto& p) { return p.skin_ratio; }),
                    "proximity_ratio"_a = column(pts, [](const auto& p) { return p.proximity_ratio; }),
                    "inductance"_a = column(pts, [](const auto& p) { return p.inductance; }),
                    "q_factor"_a = column(pts, [](const auto& p) { return p.q_factor; }), "numerical"_a = numerical,
                    "resolved"_a = resolved);
}

py::object band_dict(const std::optional<BandCheck>& band, const std::optional<CriterionResult>& by_medhurst) {
    if (!band) return py::none();
    py::list criteria;
    for (const auto& c : band->criteria) criteria.append(criterion_dict(c));
    return py::dict("low"_a = band->low, "ceiling"_a = band->ceiling, "pass"_a = band->pass, "criteria"_a = criteria,
                    "srf_margin_by_medhurst"_a = by_medhurst ? py::object(criterion_dict(*by_medhurst)) : py::object(py::none()));
}

py::object thermal_dict(const std::optional<ThermalEstimate>& t) {
    if (!t) return py::none();
    return py::dict("current"_a = t->current, "current_frequency"_a = optional_float(t->current_frequency), "ambient"_a = t->ambient,
                    "temperature"_a = t->temperature, "rise"_a = t->rise, "power"_a = t->power, "limit"_a = t->limit,
                    "limit_source"_a = t->limit_source, "over_limit"_a = t->over_limit, "runaway"_a = t->runaway,
                    "sets_wire_temperature"_a = t->sets_wire_temperature);
}

py::object shield_dict(const Analysis& a) {
    if (!a.shield) return py::none();
    const auto& r = a.shield->result;
    return py::dict("frequency"_a = column(r.points, [](const auto& p) { return p.frequency; }),
                    "inductance"_a = column(r.points, [](const auto& p) { return p.inductance; }),
                    "added_resistance"_a = column(r.points, [](const auto& p) { return p.added_resistance; }),
                    "skin_depth"_a = column(r.points, [](const auto& p) { return p.skin_depth; }),
                    "high_frequency_inductance"_a = r.perfect_conductor, "closed_form"_a = r.closed_form,
                    "long_coil_limit"_a = r.long_coil_limit, "capacitance_to_shield"_a = r.capacitance_to_shield,
                    "terminal_capacitance"_a = a.shield->terminal_capacitance, "self_resonance"_a = a.shield->self_resonance,
                    "by_network"_a = a.shield->by_network,
                    "rings"_a = r.rings);
}

py::dict sweep_dict(const Sweep& s) {
    py::dict d = impedance_dict(s.points);
    d["model"] = choice_name(s.model);
    d["capacitance"] = choice_name(s.capacitance);
    d["mounting"] = choice_name(s.mounting);
    d["nominal_inductance"] = s.nominal_inductance;
    d["self_resonance"] = s.self_resonance;
    d["temperature"] = s.temperature;
    d["band_low"] = optional_float(s.band_low);
    d["band_ceiling"] = optional_float(s.band_ceiling);
    d["shield"] = s.shield ? py::object(py::str(*s.shield)) : py::object(py::none());
    return d;
}

py::dict design_dict(const Requirement& q, const DesignResult& r) {
    const std::size_t n = std::min(r.specs.size(), r.pareto.size());
    const std::vector<DesignFigures> top(r.pareto.begin(), r.pareto.begin() + static_cast<std::ptrdiff_t>(n));
    py::list wires, specs;
    py::array_t<long> wire_index(static_cast<py::ssize_t>(n));
    for (std::size_t i = 0; i < n; ++i) {
        wires.append(top[i].wire_label);
        wire_index.mutable_data()[i] = static_cast<long>(top[i].wire_index);
        specs.append(coil_spec_yaml(r.specs[i], q.wires[top[i].wire_index].choice));
    }
    const auto col = [&](double DesignFigures::*f) { return column(top, [f](const DesignFigures& d) { return d.*f; }); };
    py::dict designs("wire"_a = wires, "wire_index"_a = wire_index, "form_diameter"_a = col(&DesignFigures::form_diameter),
                     "mean_diameter"_a = col(&DesignFigures::mean_diameter), "outer_diameter"_a = col(&DesignFigures::outer_diameter),
                     "turns"_a = col(&DesignFigures::turns), "turns_solved"_a = col(&DesignFigures::turns_solved),
                     "pitch"_a = col(&DesignFigures::pitch), "pitch_before_trim"_a = col(&DesignFigures::pitch_before_trim),
                     "pitch_ratio"_a = col(&DesignFigures::pitch_ratio), "winding_length"_a = col(&DesignFigures::winding_length),
                     "length_with_ends"_a = col(&DesignFigures::length_with_ends), "wire_length"_a = col(&DesignFigures::wire_length),
                     "inductance"_a = col(&DesignFigures::inductance), "target_frequency"_a = col(&DesignFigures::target_frequency),
                     "inductance_at_target"_a = col(&DesignFigures::inductance_at_target),
                     "self_resonance"_a = col(&DesignFigures::self_resonance),
                     "srf_margin"_a = col(&DesignFigures::srf_margin), "dc_resistance"_a = col(&DesignFigures::dc_resistance),
                     "reference_frequency"_a = col(&DesignFigures::reference_frequency), "resistance"_a = col(&DesignFigures::resistance),
                     "q_factor"_a = col(&DesignFigures::q_factor), "temperature"_a = col(&DesignFigures::temperature),
                     "temperature_rise"_a = col(&DesignFigures::rise), "temperature_limit"_a = col(&DesignFigures::temperature_limit),
                     "volume"_a = col(&DesignFigures::volume), "score"_a = col(&DesignFigures::score), "spec"_a = specs);
    py::dict rejected;
    for (const auto& [k, v] : r.rejected_by_reason) rejected[py::str(k)] = v;
    py::object closest = py::none();
    if (r.closest) closest = py::dict("reason"_a = r.closest->reason, "excess"_a = r.closest->excess, "detail"_a = r.closest->detail);
    py::object spread = py::none();
    if (r.spread) {
        const Spread& s = *r.spread;
        const auto stat = [](const SpreadStatistics& st) {
            return py::dict("nominal"_a = st.nominal, "mean"_a = st.mean, "standard_deviation"_a = st.standard_deviation, "low"_a = st.low,
                            "high"_a = st.high);
        };
        py::dict sens;
        for (const auto& x : s.sensitivities) sens[py::str(x.input)] = py::dict("inductance"_a = x.inductance, "self_resonance"_a = x.self_resonance);
        spread = py::dict("samples"_a = s.samples, "left_out"_a = s.left_out, "seed"_a = s.seed, "inductance"_a = stat(s.inductance),
                          "self_resonance"_a = stat(s.self_resonance), "within_tolerance"_a = s.within_tolerance, "sensitivities"_a = sens,
                          "first_order_inductance_sd"_a = s.first_order_inductance_deviation);
    }
    py::object fixture_check = py::none();
    if (r.fixture_check) {
        const FixtureVerdict& v = *r.fixture_check->verdict;
        fixture_check = py::dict("pass"_a = v.pass, "tolerance"_a = v.tolerance, "in_db"_a = v.in_db, "band_low"_a = v.band_low,
                                 "band_high"_a = v.band_high, "worst_deviation"_a = v.worst_deviation, "worst_frequency"_a = v.worst_frequency,
                                 "first_failure"_a = v.first_failure ? py::object(py::float_(*v.first_failure)) : py::object(py::none()),
                                 "dominant_part"_a = v.dominant_part, "words"_a = r.fixture_words);
    }
    return py::dict("candidates_evaluated"_a = r.candidates_evaluated, "feasible"_a = r.feasible, "pareto_size"_a = r.front_size,
                    "fixture_check"_a = fixture_check, "one_change"_a = r.one_change.empty() ? py::object(py::none()) : py::object(py::str(r.one_change)),
                    "rejected_by_reason"_a = rejected, "designs"_a = designs,
                    "chosen"_a = r.chosen ? py::object(py::int_(*r.chosen)) : py::object(py::none()), "why_chosen"_a = r.why_chosen,
                    "binding"_a = r.binding, "closest"_a = closest, "spread"_a = spread,
                    "chosen_analysis"_a = r.chosen_analysis ? py::cast(*r.chosen_analysis) : py::object(py::none()),
                    "cautions"_a = r.cautions, "warnings"_a = r.warnings, "notes"_a = r.notes);
}

py::dict former_dict(const FormerBuild& b, const std::vector<std::string>& files) {
    const FormerGeometry& g = b.geometry;
    py::array_t<double> v({b.mesh.vertices.size(), std::size_t{3}});
    if (!b.mesh.vertices.empty()) std::copy_n(&b.mesh.vertices[0][0], 3 * b.mesh.vertices.size(), v.mutable_data());
    py::array_t<std::uint32_t> f({b.mesh.triangles.size(), std::size_t{3}});
    if (!b.mesh.triangles.empty()) std::copy_n(&b.mesh.triangles[0][0], 3 * b.mesh.triangles.size(), f.mutable_data());
    const MeshCheck& c = b.check;
    py::object ribs = py::none(), flange = py::none();
    if (g.kind == FormerKind::ribbed) {
        ribs = py::dict("count"_a = g.ribs, "width_at_root"_a = g.rib_angle * g.root_radius, "hub_diameter"_a = 2 * g.hub_radius);
    }
    if (g.flange_thickness > 0) flange = py::dict("diameter"_a = 2 * g.flange_radius, "thickness"_a = g.flange_thickness);
    return py::dict("name"_a = b.name, "kind"_a = choice_name(g.kind), "material"_a = b.material, "turns"_a = g.turns, "pitch"_a = g.pitch,
                    "outer_diameter"_a = 2 * g.outer_radius, "root_diameter"_a = 2 * g.root_radius,
                    "wire_centre_diameter"_a = 2 * g.seat_radius, "bore_diameter"_a = 2 * g.bore_radius, "bore_oversize"_a = g.bore_oversize,
                    "groove"_a = py::dict("profile"_a = choice_name(g.profile), "depth"_a = g.groove_depth(), "clearance"_a = g.clearance,
                                          "width_at_wire_centre"_a = 2 * g.groove_radius),
                    "length"_a = g.length, "ends"_a = g.ends, "ribs"_a = ribs, "flange"_a = flange, "wire_cut_length"_a = g.wire_cut_length,
                    "volume"_a = b.volume, "mesh_volume"_a = c.volume, "triangles"_a = c.triangles, "chord_tolerance"_a = b.chord_tolerance,
                    "mesh_check"_a = py::dict("boundary_edges"_a = c.boundary_edges, "overshared_edges"_a = c.overshared_edges,
                                              "misoriented_edges"_a = c.misoriented_edges, "nonmanifold_vertices"_a = c.nonmanifold_vertices,
                                              "degenerate_triangles"_a = c.degenerate_triangles, "sound"_a = c.sound()),
                    "files"_a = files, "cautions"_a = b.cautions, "notes"_a = g.notes, "vertices"_a = v, "faces"_a = f);
}

py::dict coupling_dict(const CouplingStudy& s) {
    const auto& x = s.at_frequency;
    py::dict crosstalk("frequency"_a = column(x, [](const auto& r) { return r.crosstalk.frequency; }),
                       "transfer_impedance"_a = column(x, [](const auto& r) { return r.crosstalk.transfer_impedance; }),
                       "transfer_db"_a = column(x, [](const auto& r) { return r.crosstalk.transfer_db; }),
                       "shielding_db"_a = column(x, [](const auto& r) { return r.shielding_db; }),
                       "theoretical_shielding_db"_a = column(x, [](const auto& r) { return r.theoretical_shielding_db; }),
                       "unshielded_db"_a = column(x, [](const auto& r) { return r.unshielded_db; }),
                       "resistance_a"_a = column(x, [](const auto& r) { return r.resistance_a; }),
                       "inductance_a"_a = column(x, [](const auto& r) { return r.inductance_a; }),
                       "resistance_b"_a = column(x, [](const auto& r) { return r.resistance_b; }),
                       "inductance_b"_a = column(x, [](const auto& r) { return r.inductance_b; }));
    py::dict sweep("distance"_a = column(s.sweep, [](const auto& p) { return p.distance; }),
                   "mutual_inductance"_a = column(s.sweep, [](const auto& p) { return p.mutual; }),
                   "coupling_coefficient"_a = column(s.sweep, [](const auto& p) { return p.coefficient; }),
                   "dipole_coupling_coefficient"_a = column(s.sweep, [](const auto& p) { return p.dipole_coefficient; }));
    const auto shield = [](const std::string& w) { return w.empty() ? py::object(py::none()) : py::object(py::str(w)); };
    return py::dict("coil_a"_a = s.name_a, "coil_b"_a = s.name_b, "arrangement"_a = choice_name(s.arrangement), "distance"_a = s.distance,
                    "axial_offset"_a = s.axial_offset, "mutual_inductance"_a = s.at.mutual, "inductance_a"_a = s.at.inductance_a,
                    "inductance_b"_a = s.at.inductance_b, "coupling_coefficient"_a = s.at.coefficient,
                    "dipole_mutual_inductance"_a = s.dipole_mutual, "source_resistance"_a = s.source_resistance,
                    "load_resistance"_a = s.load_resistance, "shield_a"_a = shield(s.shield_a), "shield_b"_a = shield(s.shield_b),
                    "mounted_inductance_a"_a = s.mounted_inductance_a, "mounted_inductance_b"_a = s.mounted_inductance_b,
                    "crosstalk"_a = crosstalk, "sweep"_a = sweep, "notes"_a = s.notes);
}

}  // namespace libcoil::python
