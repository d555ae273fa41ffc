#include "libcoil/spec/requirement.hpp"

#include <algorithm>
#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "spec/spec_sections.hpp"
#include "spec/yaml_reader.hpp"

namespace libcoil {

std::vector<double> SearchRange::values() const {
    std::vector<double> v;
    if (max == min) return {min};
    const auto n = static_cast<long>(std::floor((max - min) / step * (1 + 1e-12))) + 1;
    for (long i = 0; i < n; ++i) v.push_back(min + static_cast<double>(i) * step);
    return v;
}

namespace {

SearchRange read_range(const YAML::Node& node, const std::string& path, Dimension d, double smallest) {
    SearchRange r;
    if (!node) throw InputError(path, "missing; give {min: ..., max: ..., step: ...} or one value");
    if (node.IsScalar()) {
        r.min = r.max = parse_quantity(node.Scalar(), d, path);
    } else {
        const detail::YamlMap m(node, path);
        m.allow_only({"min", "max", "step"});
        r.min = m.quantity("min", d);
        r.max = m.quantity("max", d);
        if (!(r.max >= r.min)) throw InputError(m.path_of("max"), "\"" + m.text("max") + "\" is below min");
        if (r.max > r.min) {
            if (!m.has("step")) throw InputError(m.path_of("step"), "missing; a range needs a step");
            r.step = m.positive_quantity("step", d);
            if ((r.max - r.min) / r.step > 1e6) {
                throw InputError(m.path_of("step"), "\"" + m.text("step") + "\" makes more than a million values");
            }
        }
    }
    if (!(r.min >= smallest) || !std::isfinite(r.max)) {
        throw InputError(path, format_value(r.min) + " is too small; expected at least " + format_value(smallest));
    }
    return r;
}

WireOption read_wire_option(const std::string& text, const std::string& field) {
    WireOption o;
    std::string name = text;
    const auto g = text.find("grade");
    if (g != std::string::npos) {
        o.choice.enamel_grade = parse_enamel_grade(text.substr(g), field);
        name = text.substr(0, g);
        while (!name.empty() && (name.back() == ' ' || name.back() == ',')) name.pop_back();
    } else {
        o.choice.enamel_grade = 1;
    }
    if (name.find("AWG") != std::string::npos || name.find("awg") != std::string::npos) {
        o.choice.gauge = parse_awg(name, field);
    } else {
        o.choice.diameter = parse_quantity(name, Dimension::length, field);
    }
    o.wire = make_wire(o.choice, field + ".");
    return o;
}

// fixture: {file: F, coil: L1} or {coil: L1, parts: ..., ports: ..., reference: ...}; the reference is
// required (the criterion is its tolerance over its band).
void read_fixture_criterion(const YAML::Node& node, const std::filesystem::path& base, Requirement& q) {
    if (!node.IsMap()) throw InputError("fixture", "expected a mapping: {file: ..., coil: ...}, or the fixture's keys and coil:");
    const detail::YamlMap m(node, "fixture");
    q.fixture_part = m.text("coil");
    if (m.has("file")) {
        m.allow_only({"file", "coil"});
        std::filesystem::path file(m.text("file"));
        if (file.is_relative()) file = base / file;
        try {
            q.fixture = load_fixture(file, q.fixture_part);
        } catch (const InputError& e) {
            throw e.within("fixture.file (" + file.string() + ")");
        }
        q.fixture_source = file.string();
    } else {
        YAML::Node inline_fixture = YAML::Clone(node);
        inline_fixture.remove("coil");
        try {
            q.fixture = detail::read_fixture(inline_fixture, base, q.fixture_part);
        } catch (const InputError& e) {
            throw e.within("fixture");
        }
        q.fixture_source = "inline";
    }
    if (!q.fixture->reference) throw InputError("fixture.reference", "missing; the criterion needs the reference's tolerance and band");
}

Requirement read_requirement(const YAML::Node& root, const std::filesystem::path& base) {
    if (!root || root.IsNull()) throw InputError("requirement", "the requirement is empty; expected a mapping with \"target:\"");
    const detail::YamlMap top(root, "");
    top.allow_only({"name", "description", "target", "band", "operating", "limits", "search", "objective", "former", "shield",
                    "surroundings", "conductor", "tolerances", "fixture"});
    Requirement q;
    q.name = top.optional_text("name").value_or("");
    q.description = top.optional_text("description").value_or("");

    const detail::YamlMap t = top.map("target");
    t.allow_only({"inductance", "tolerance", "frequency"});
    q.inductance = t.positive_quantity("inductance", Dimension::inductance);
    if (t.has("frequency")) q.inductance_frequency = t.positive_quantity("frequency", Dimension::frequency);
    q.tolerance = t.positive_quantity("tolerance", Dimension::dimensionless);
    if (q.tolerance >= 0.5) throw InputError(t.path_of("tolerance"), "\"" + t.text("tolerance") + "\"; expected below 50 %");

    if (top.has("band")) q.band = detail::read_band(top.map("band"));

    const detail::YamlMap op = top.map("operating");
    op.allow_only({"current", "frequency", "ambient", "supply_voltage", "rf_power"});
    q.current = op.non_negative_quantity("current", Dimension::current);
    if (op.has("frequency")) q.current_frequency = op.non_negative_quantity("frequency", Dimension::frequency);
    if (op.has("ambient")) {
        q.ambient = op.positive_quantity("ambient", Dimension::temperature);
    } else {
        q.notes.push_back("no operating.ambient given: 25 degC still air assumed");
    }
    // The same bounds as a coil spec's operating section (spec.cpp): 10 kA, 100 GHz, 1000 degC.
    if (q.current > max_model_current) throw InputError(op.path_of("current"), "\"" + op.text("current") + "\" is beyond 10 kA, which no single-layer air coil carries");
    if (q.current_frequency && *q.current_frequency > max_model_frequency) throw InputError(op.path_of("frequency"), "\"" + op.text("frequency") + "\" is beyond 100 GHz");
    if (q.ambient > max_model_temperature) throw InputError(op.path_of("ambient"), "\"" + op.text("ambient") + "\" is beyond 1000 degC");
    if (op.has("supply_voltage")) q.supply_voltage = std::fabs(op.quantity("supply_voltage", Dimension::voltage));
    if (op.has("rf_power")) q.rf_power = op.non_negative_quantity("rf_power", Dimension::power);

    const detail::YamlMap lim = top.map("limits");
    lim.allow_only({"max_outer_diameter", "max_length", "former_ends", "max_wire_length", "enamel_class"});
    q.max_outer_diameter = lim.positive_quantity("max_outer_diameter", Dimension::length);
    q.max_length = lim.positive_quantity("max_length", Dimension::length);
    if (lim.has("former_ends")) {
        q.former_ends = lim.non_negative_quantity("former_ends", Dimension::length);
    } else {
        q.notes.push_back("no limits.former_ends given: 5 mm of former at each end assumed");
    }
    if (lim.has("max_wire_length")) q.max_wire_length = lim.positive_quantity("max_wire_length", Dimension::length);
    if (lim.has("enamel_class")) {
        q.enamel_class = detail::read_enamel_class(lim);
    } else {
        q.notes.push_back("no limits.enamel_class given: thermal class 155 assumed (common for polyurethane and polyester enamels)");
    }

    const detail::YamlMap se = top.map("search");
    se.allow_only({"wires", "form_diameter", "pitch_ratio", "turns", "turns_step", "lead_length"});
    if (!se.has("wires")) throw InputError(se.path_of("wires"), "missing; give a list such as [AWG 16, 1.2 mm]");
    const YAML::Node wires = root["search"]["wires"];
    if (!wires.IsSequence() || wires.size() == 0) {
        throw InputError(se.path_of("wires"), "expected a non-empty list such as [AWG 16, 1.2 mm]");
    }
    for (std::size_t i = 0; i < wires.size(); ++i) {
        const std::string field = se.path_of("wires") + "[" + std::to_string(i) + "]";
        if (!wires[i].IsScalar()) throw InputError(field, "expected a wire such as \"AWG 18\" or \"1.2 mm grade 2\"");
        q.wires.push_back(read_wire_option(wires[i].Scalar(), field));
    }
    q.form_diameter = read_range(root["search"]["form_diameter"], se.path_of("form_diameter"), Dimension::length, 1e-4);
    q.pitch_ratio = read_range(root["search"]["pitch_ratio"], se.path_of("pitch_ratio"), Dimension::dimensionless, 1.0);
    if (se.has("turns")) {
        q.turns = se.quantity("turns", Dimension::dimensionless);
        require_at_least(se.path_of("turns"), *q.turns, 1.0, "a coil needs at least one turn");
    }
    if (se.has("turns_step")) q.turns_step = se.positive_quantity("turns_step", Dimension::dimensionless);
    if (se.has("lead_length")) q.lead_length = se.non_negative_quantity("lead_length", Dimension::length);

    if (top.has("objective")) {
        const detail::YamlMap ob = top.map("objective");
        ob.allow_only({"loss", "size", "srf"});
        if (ob.has("loss")) q.objective.loss = ob.non_negative_quantity("loss", Dimension::dimensionless);
        if (ob.has("size")) q.objective.size = ob.non_negative_quantity("size", Dimension::dimensionless);
        if (ob.has("srf")) q.objective.srf = ob.non_negative_quantity("srf", Dimension::dimensionless);
        if (q.objective.loss + q.objective.size + q.objective.srf <= 0) {
            throw InputError(ob.path_of("loss"), "all objective weights are zero; give at least one above zero");
        }
    }
    if (top.has("former")) {
        const detail::YamlMap fm = top.map("former");
        if (fm.has("ends")) {
            throw InputError(fm.path_of("ends"), "a requirement gives the former's ends as limits.former_ends, which the length limit counts");
        }
        q.former = detail::read_former(fm, q.form_diameter.min, q.notes);
        q.former->ends = q.former_ends;
    }
    if (top.has("surroundings")) q.surroundings = detail::read_surroundings(top.map("surroundings"));
    if (top.has("shield")) q.shield = detail::read_shield(top.map("shield"));
    q.conductor = conductor(top.optional_text("conductor").value_or("copper"), "conductor");
    if (top.has("tolerances")) {
        q.tolerances = detail::read_tolerances(top.map("tolerances"));
        q.tolerances_given = true;
    }
    if (top.has("fixture")) read_fixture_criterion(root["fixture"], base, q);
    return q;
}

}  // namespace

Requirement parse_requirement(std::string_view yaml_text, std::string_view source) {
    return read_requirement(detail::load_yaml(yaml_text, source), std::filesystem::path(source).parent_path());
}

Requirement load_requirement(const std::filesystem::path& path) {
    return parse_requirement(detail::read_text_file(path, "requirement file"), path.string());
}

double target_frequency(const Requirement& q) {
    if (q.inductance_frequency) return *q.inductance_frequency;
    if (q.band) return q.band->low;
    if (q.fixture) return q.fixture->reference->band_low;
    return q.current_frequency.value_or(0.0);
}

}  // namespace libcoil
