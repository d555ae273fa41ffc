#include "libcoil/spec/spec.hpp"

#include <algorithm>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/models/wire.hpp"
#include "spec/spec_sections.hpp"
#include "spec/yaml_reader.hpp"

namespace libcoil {

namespace {

Wire read_wire(const detail::YamlMap& w, std::vector<std::string>& notes) {
    w.allow_only({"diameter", "gauge", "insulation", "enamel"});
    WireChoice c;
    if (w.one_of("diameter", "gauge") == "gauge") {
        c.gauge = parse_awg(w.text("gauge"), w.path_of("gauge"));
    } else {
        c.diameter = w.positive_quantity("diameter", Dimension::length);
    }
    w.at_most_one_of("insulation", "enamel");
    if (w.has("insulation")) {
        c.insulation = w.non_negative_quantity("insulation", Dimension::length);
    } else if (w.has("enamel")) {
        c.enamel_grade = parse_enamel_grade(w.text("enamel"), w.path_of("enamel"));
    } else {
        notes.push_back("no insulation given: the wire is taken as bare (" + w.path_of("insulation") + " = 0)");
    }
    return make_wire(c, w.path_of(""));
}

// The bounds beyond which no model of the library means anything (core/error.hpp), said in the spec's words.
void check_operating_bounds(const detail::YamlMap& m, const Operating& op) {
    const auto bound = [&](const std::string& field, const std::string& text, double v, double limit, const char* what) {
        if (v > limit) throw InputError(field, "\"" + text + "\" is beyond " + what);
    };
    for (std::size_t i = 0; i < op.frequencies.size(); ++i) {
        bound(m.path_of("frequencies") + "[" + std::to_string(i) + "]", format_value(op.frequencies[i]) + " Hz", op.frequencies[i], max_model_frequency,
              "100 GHz, where no model of a wound coil holds");
    }
    if (m.has("current_frequency")) bound(m.path_of("current_frequency"), m.text("current_frequency"), *op.current_frequency, max_model_frequency, "100 GHz");
    if (m.has("current")) bound(m.path_of("current"), m.text("current"), op.current, max_model_current, "10 kA, which no single-layer air coil carries");
    for (const char* k : {"temperature", "ambient"}) {
        if (m.has(k)) bound(m.path_of(k), m.text(k), k[0] == 't' ? op.temperature : op.ambient, max_model_temperature, "1000 degC (copper melts at 1085 degC)");
    }
}

Operating read_operating(const detail::YamlMap& m, std::vector<std::string>& notes) {
    m.allow_only({"frequencies", "temperature", "current", "current_frequency", "ambient", "supply_voltage", "rf_power"});
    Operating op;
    if (m.has("frequencies")) {
        op.frequencies = m.positive_quantity_list("frequencies", Dimension::frequency, "(the DC resistance is reported anyway)");
        // Each operating frequency runs the loss solver (seconds apiece for the cross-section solver); a
        // frequency response is the sweep's work.
        if (op.frequencies.size() > max_operating_frequencies) {
            throw InputError(m.path_of("frequencies"), std::to_string(op.frequencies.size()) + " frequencies; expected at most " +
                                                           std::to_string(max_operating_frequencies) + " (a sweep gives the response over a range)");
        }
    }
    if (m.has("current")) op.current = m.non_negative_quantity("current", Dimension::current);
    if (m.has("current_frequency")) op.current_frequency = m.non_negative_quantity("current_frequency", Dimension::frequency);
    // A temperature at or below absolute zero is said so, in the spec's words.
    const auto above_absolute_zero = [&](const char* key) {
        const double t = m.quantity(key, Dimension::temperature);
        if (!(t > 0)) throw InputError(m.path_of(key), "\"" + m.text(key) + "\" is at or below absolute zero");
        return t;
    };
    if (m.has("ambient")) op.ambient = above_absolute_zero("ambient");
    if (m.has("supply_voltage")) op.supply_voltage = m.non_negative_quantity("supply_voltage", Dimension::voltage);
    if (m.has("rf_power")) op.rf_power = m.non_negative_quantity("rf_power", Dimension::power);
    if (m.has("temperature")) {
        op.temperature = above_absolute_zero("temperature");
        op.temperature_given = true;
    }
    check_operating_bounds(m, op);
    if (!op.temperature_given && op.current > 0) {
        notes.push_back("no operating.temperature given: the wire is taken at the thermal estimate for the current");
    } else if (!op.temperature_given) {
        notes.push_back("no operating.temperature given: the wire is taken at 20 degC");
    }
    return op;
}

// Re-labels a geometry error with the YAML path the user actually wrote.
InputError relabel(const InputError& e, const std::string& diameter_key, const std::string& pitch_key) {
    std::string f = e.field(), detail = e.detail();
    if (f == "mean_diameter" && diameter_key != f) {
        f = diameter_key;
        detail += " (mean diameter = form diameter + insulated wire diameter)";
    }
    if (f == "pitch" && pitch_key != f) {
        f = pitch_key;
        detail += " (pitch = winding_length / turns)";
    }
    return InputError(f, detail).within("coil");
}

CoilSpec read_spec(const YAML::Node& root, const std::filesystem::path& base) {
    if (!root || root.IsNull()) {
        throw InputError("spec", "the spec is empty; expected a mapping with a \"coil:\" section");
    }
    const detail::YamlMap top(root, "");
    top.allow_only({"name", "description", "coil", "operating", "former", "surroundings", "band", "shield", "limits", "tolerances", "bench"});
    std::vector<std::string> notes;
    std::string name = top.optional_text("name").value_or("");
    std::string description = top.optional_text("description").value_or("");

    const detail::YamlMap c = top.map("coil");
    c.allow_only({"form_diameter", "mean_diameter", "turns", "pitch", "winding_length", "lead_length", "wire",
                  "conductor"});
    const Wire wire = read_wire(c.map("wire"), notes);

    const double turns = c.quantity("turns", Dimension::dimensionless);
    const std::string diameter_key(c.one_of("form_diameter", "mean_diameter"));
    const double diameter = c.positive_quantity(diameter_key, Dimension::length);
    const std::string pitch_key(c.one_of("pitch", "winding_length"));
    double pitch = c.positive_quantity(pitch_key, Dimension::length);
    if (pitch_key == "winding_length") {
        require_at_least(c.path_of("turns"), turns, 1.0, "a coil needs at least one turn");
        pitch /= turns;
    }
    const double leads = c.has("lead_length") ? c.non_negative_quantity("lead_length", Dimension::length) : 0.0;

    std::string conductor_name = "copper";
    if (auto t = c.optional_text("conductor")) {
        conductor_name = *t;
    } else {
        notes.push_back("no conductor given: copper assumed");
    }
    const Conductor& cond = conductor(conductor_name, c.path_of("conductor"));

    Operating op;
    if (top.has("operating")) op = read_operating(top.map("operating"), notes);

    std::optional<BenchCorrections> bench;
    if (top.has("bench")) bench = detail::read_bench(top, base);

    try {
        const double mean = diameter_key == "mean_diameter" ? diameter : diameter + wire.insulated_diameter();
        Solenoid s(Solenoid::Params{mean, turns, pitch, wire, leads});
        CoilSpec spec{std::move(name), std::move(description), s, cond, op, {}, {}, {}, {}, {}};
        if (top.has("former")) spec.former = detail::read_former(top.map("former"), s.form_diameter(), notes);
        if (bench) {
            const BenchCorrections& b = *bench;
            for (const auto& [value, key] : {std::pair{b.former_permittivity, "former_permittivity"}, std::pair{b.former_loss_tangent, "former_loss_tangent"}}) {
                if (value && !spec.former) throw InputError(std::string("bench.") + key, "the spec has no former for it to apply to");
            }
            if (b.former_permittivity) spec.former->material.relative_permittivity = *b.former_permittivity;
            if (b.former_loss_tangent) spec.former->material.loss_tangent = *b.former_loss_tangent;
            spec.bench = b;
        }
        if (top.has("surroundings")) spec.surroundings = detail::read_surroundings(top.map("surroundings"));
        if (top.has("band")) spec.band = detail::read_band(top.map("band"));
        if (top.has("tolerances")) {
            spec.tolerances = detail::read_tolerances(top.map("tolerances"));
            validate_tolerances(spec.tolerances, spec.solenoid);
            spec.tolerances_given = true;
        }
        if (top.has("limits")) {
            const detail::YamlMap lim = top.map("limits");
            lim.allow_only({"enamel_class"});
            if (lim.has("enamel_class")) spec.enamel_class = detail::read_enamel_class(lim);
        }
        if (top.has("shield")) {
            const detail::YamlMap sh = top.map("shield");
            const ShieldSpec x = detail::read_shield(sh);
            if (!(x.inner_diameter > s.outer_diameter())) {
                throw InputError(sh.path_of("inner_diameter"), "\"" + sh.text("inner_diameter") + "\" does not clear the winding (outer diameter " +
                                                                   format_quantity(s.outer_diameter(), Dimension::length) + ")");
            }
            spec.shield = x;
        }
        spec.notes = std::move(notes);
        return spec;
    } catch (const InputError& e) {
        if (e.field().rfind("band", 0) == 0 || e.field().rfind("bench", 0) == 0 || e.field().rfind("former", 0) == 0 || e.field().rfind("shield", 0) == 0 ||
            e.field().rfind("surroundings", 0) == 0 || e.field().rfind("limits", 0) == 0 || e.field().rfind("tolerances", 0) == 0) {
            throw;
        }
        throw relabel(e, diameter_key, pitch_key);
    }
}

}  // namespace

namespace detail {

BuildTolerances read_tolerances(const YamlMap& tol) {
    BuildTolerances t;
    tol.allow_only({"form_diameter", "pitch", "wire_diameter", "turns"});
    if (tol.has("form_diameter")) t.form_diameter = tol.non_negative_quantity("form_diameter", Dimension::length);
    if (tol.has("pitch")) t.pitch = tol.non_negative_quantity("pitch", Dimension::length);
    if (tol.has("wire_diameter")) {
        if (tol.text("wire_diameter").find('%') == std::string::npos) {
            throw InputError(tol.path_of("wire_diameter"), "\"" + tol.text("wire_diameter") + "\"; expected a percentage such as \"0.5 %\"");
        }
        t.wire_diameter = tol.non_negative_quantity("wire_diameter", Dimension::dimensionless);
    }
    if (tol.has("turns")) t.turns = tol.non_negative_quantity("turns", Dimension::dimensionless);
    return t;
}

ShieldSpec read_shield(const YamlMap& sh) {
    sh.allow_only({"inner_diameter", "length", "thickness", "material", "end_discs", "axial_offset"});
    ShieldSpec x;
    x.inner_diameter = sh.positive_quantity("inner_diameter", Dimension::length);
    x.length = sh.positive_quantity("length", Dimension::length);
    x.thickness = sh.positive_quantity("thickness", Dimension::length);
    x.material = conductor(sh.text("material"), sh.path_of("material"));
    if (auto e = sh.optional_choice("end_discs", {"false", "true"})) x.end_discs = *e == 1;
    if (sh.has("axial_offset")) x.axial_offset = sh.quantity("axial_offset", Dimension::length);
    return x;
}

FormerSpec read_former(const YamlMap& m, double form_diameter, std::vector<std::string>& notes) {
    m.allow_only({"material", "kind", "wall", "ribs", "rib_width", "ends", "groove", "flange", "hub_wall", "min_wall", "bore_oversize"});
    FormerSpec f;
    f.material = former_material(m.text("material"), m.path_of("material"));
    if (auto k = m.optional_choice_of<FormerKind>("kind")) f.kind = *k;
    const double form_radius = form_diameter / 2;
    if (m.has("wall")) {
        f.wall = m.positive_quantity("wall", Dimension::length);
        if (f.wall > form_radius) {
            throw InputError(m.path_of("wall"), "\"" + m.text("wall") + "\" is thicker than the former's radius (" +
                                                    format_quantity(form_radius, Dimension::length) + ")");
        }
    } else {
        f.wall = std::min(3e-3, form_radius);
        notes.push_back("no former.wall given: " + format_quantity(f.wall, Dimension::length) +
                        " of solid under the winding assumed");
    }
    if (f.kind == FormerKind::ribbed) {
        const double ribs = m.quantity("ribs", Dimension::dimensionless);
        if (!(ribs >= 3) || ribs != std::floor(ribs) || ribs > 360) {
            throw InputError(m.path_of("ribs"), "\"" + m.text("ribs") + "\"; expected a whole number of ribs, 3 or more");
        }
        f.ribs = static_cast<int>(ribs);
        f.rib_width = m.positive_quantity("rib_width", Dimension::length);
        const double fill = f.ribs * f.rib_width / (pi * form_diameter);
        if (!(fill < 1)) {
            throw InputError(m.path_of("rib_width"), std::to_string(f.ribs) + " ribs of " + m.text("rib_width") +
                                                         " cover the whole circumference of the former (" +
                                                         format_quantity(pi * form_diameter, Dimension::length) +
                                                         "); expected gaps between the ribs");
        }
    } else if (m.has("ribs") || m.has("rib_width") || m.has("hub_wall")) {
        const char* key = m.has("ribs") ? "ribs" : m.has("rib_width") ? "rib_width" : "hub_wall";
        throw InputError(m.path_of(key), "applies to kind: ribbed only");
    }
    if (m.has("ends")) f.ends = m.non_negative_quantity("ends", Dimension::length);
    if (m.has("hub_wall")) f.hub_wall = m.positive_quantity("hub_wall", Dimension::length);
    if (m.has("min_wall")) f.min_wall = m.positive_quantity("min_wall", Dimension::length);
    if (m.has("bore_oversize")) f.bore_oversize = m.non_negative_quantity("bore_oversize", Dimension::length);
    if (m.has("groove")) {
        const YamlMap g = m.map("groove");
        g.allow_only({"profile", "depth", "clearance", "angle_deg"});
        if (auto k = g.optional_choice_of<GrooveProfile>("profile")) f.groove.profile = *k;
        if (g.has("depth")) f.groove.depth = g.positive_quantity("depth", Dimension::length);
        if (g.has("clearance")) f.groove.clearance = g.non_negative_quantity("clearance", Dimension::length);
        if (g.has("angle_deg")) {
            if (f.groove.profile != GrooveProfile::vee) throw InputError(g.path_of("angle_deg"), "applies to profile: vee only");
            const double a = g.quantity("angle_deg", Dimension::dimensionless);
            if (!(a >= 30 && a <= 150)) {
                throw InputError(g.path_of("angle_deg"), "\"" + g.text("angle_deg") + "\"; expected a vee's included angle in degrees, 30 to 150");
            }
            f.groove.angle = a * pi / 180;
        }
    }
    if (m.has("flange")) {
        const YamlMap fl = m.map("flange");
        fl.allow_only({"diameter", "thickness"});
        f.flange = FlangeSpec{fl.positive_quantity("diameter", Dimension::length), fl.positive_quantity("thickness", Dimension::length)};
    }
    return f;
}

Surroundings read_surroundings(const YamlMap& m) {
    m.allow_only({"relative_permittivity", "mounting"});
    Surroundings s;
    if (m.has("relative_permittivity")) {
        s.relative_permittivity = m.quantity("relative_permittivity", Dimension::dimensionless);
        if (!(s.relative_permittivity >= 1)) {
            throw InputError(m.path_of("relative_permittivity"),
                             "\"" + m.text("relative_permittivity") + "\"; expected a relative permittivity of 1 or more");
        }
    }
    if (auto k = m.optional_choice_of<Mounting>("mounting")) s.mounting = *k;
    return s;
}

double read_enamel_class(const YamlMap& lim) {
    const double c = lim.quantity("enamel_class", Dimension::dimensionless);
    static const double classes[] = {105, 120, 130, 155, 180, 200, 220, 240};
    if (std::find(std::begin(classes), std::end(classes), c) == std::end(classes)) {
        throw InputError(lim.path_of("enamel_class"), "\"" + lim.text("enamel_class") +
                                                          "\"; expected an IEC 60317 thermal class: 105, 120, 130, "
                                                          "155, 180, 200, 220 or 240");
    }
    return c + zero_celsius;
}

BandSpec read_band(const YamlMap& m) {
    m.allow_only({"low", "ceiling", "srf_margin", "max_deviation", "min_impedance"});
    BandSpec b;
    b.low = m.positive_quantity("low", Dimension::frequency);
    b.ceiling = m.positive_quantity("ceiling", Dimension::frequency);
    if (m.has("srf_margin")) b.srf_margin = m.quantity("srf_margin", Dimension::dimensionless);
    if (m.has("max_deviation")) {
        if (m.text("max_deviation").find('%') == std::string::npos) {
            throw InputError(m.path_of("max_deviation"),
                             "\"" + m.text("max_deviation") + "\"; expected a percentage such as \"10 %\"");
        }
        b.max_deviation = m.quantity("max_deviation", Dimension::dimensionless);
    }
    if (m.has("min_impedance")) b.min_impedance = m.quantity("min_impedance", Dimension::resistance);
    validate_band(b);
    return b;
}

CoilSpec read_coil_spec(const YAML::Node& root, const std::filesystem::path& base) { return read_spec(root, base); }
}  // namespace detail

CoilSpec parse_coil_spec(std::string_view yaml_text, std::string_view source) {
    return read_spec(detail::load_yaml(yaml_text, source), std::filesystem::path(source).parent_path());
}

CoilSpec load_coil_spec(const std::filesystem::path& path) {
    return parse_coil_spec(detail::read_text_file(path, "spec file"), path.string());
}

}  // namespace libcoil
