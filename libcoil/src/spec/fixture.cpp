#include "libcoil/spec/fixture.hpp"

#include <algorithm>
#include <cmath>
#include <set>

#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "spec/spec_sections.hpp"

namespace libcoil {

namespace {

constexpr std::size_t max_parts = 1000;

std::string item(const std::string& list, std::size_t i) { return list + "[" + std::to_string(i) + "]"; }

// A node pair: between: [a, b], two different names.
std::pair<std::string, std::string> between(const YAML::Node& n, const std::string& where) {
    const YAML::Node b = n["between"];
    const std::string field = where + ".between";
    if (!b) throw InputError(field, "missing; expected two node names, as [line, ground]");
    if (!b.IsSequence() || b.size() != 2 || !b[0].IsScalar() || !b[1].IsScalar()) {
        throw InputError(field, "expected two node names, as [line, ground]; got " + detail::describe(b));
    }
    const std::string a = b[0].Scalar(), c = b[1].Scalar();
    if (a.empty() || c.empty()) throw InputError(field, "a node name is empty");
    if (a == c) throw InputError(field, "both ends are node \"" + a + "\": the part would be shorted on itself");
    return {a, c};
}

// A coupling: the two coil parts it joins (checked against the parts once all are read), where they sit.
FixturePart read_coupling(const detail::YamlMap& m, const YAML::Node& n, FixturePart p) {
    m.allow_only({"name", "kind", "coils", "arrangement", "distance", "axial_offset"});
    const YAML::Node c = n["coils"];
    const std::string field = m.path_of("coils");
    if (!c || !c.IsSequence() || c.size() != 2 || !c[0].IsScalar() || !c[1].IsScalar()) {
        throw InputError(field, "expected the names of two coil parts, as [L1, L2]");
    }
    p.from = c[0].Scalar();
    p.to = c[1].Scalar();
    if (p.from == p.to) throw InputError(field, "both are \"" + p.from + "\"; a coupling joins two different coils");
    p.arrangement = parse_choice<Arrangement>(m.text("arrangement"), m.path_of("arrangement"));
    p.distance = m.positive_quantity("distance", Dimension::length);
    if (m.has("axial_offset")) p.axial_offset = m.quantity("axial_offset", Dimension::length);
    return p;
}

FixturePart read_part(const YAML::Node& n, const std::string& where, const std::filesystem::path& base, std::string_view designed) {
    if (!n.IsMap()) throw InputError(where, "expected a mapping (name, kind, between, ...), got " + detail::describe(n));
    const detail::YamlMap m(n, where);
    FixturePart p;
    p.name = m.text("name");
    const auto kind = m.optional_choice("kind", {"coil", "resistor", "capacitor", "inductor", "coupling"});
    if (!kind) throw InputError(m.path_of("kind"), "missing; expected coil, resistor, capacitor, inductor or coupling");
    p.kind = static_cast<FixturePartKind>(*kind);
    if (p.kind == FixturePartKind::coupling) return read_coupling(m, n, p);
    m.allow_only({"name", "kind", "between", "value", "esr", "esl", "parallel_resistance", "parallel_capacitance", "spec", "coil", "touchstone"});
    std::tie(p.from, p.to) = between(n, where);
    if (p.kind == FixturePartKind::coil) {
        for (const char* k : {"value", "esr", "esl", "parallel_resistance", "parallel_capacitance", "touchstone"}) {
            if (m.has(k)) throw InputError(m.path_of(k), "a coil's impedance comes from its spec; give its strays there (bench:)");
        }
        m.at_most_one_of("spec", "coil");
        if (!designed.empty() && p.name == designed) {
            p.source = "the design";  // the search supplies it; a spec given here is not read
            return p;
        }
        if (m.has("coil")) {
            try {
                p.coil = detail::read_coil_spec(n["coil"], base);
            } catch (const InputError& e) {
                throw e.within(m.path_of("coil"));
            }
            p.source = "inline";
        } else {
            std::filesystem::path file(m.text("spec"));
            if (file.is_relative()) file = base / file;
            try {
                p.coil = load_coil_spec(file);
            } catch (const InputError& e) {
                throw e.within(m.path_of("spec") + " (" + file.string() + ")");
            }
            p.source = file.string();
        }
        return p;
    }
    static const Dimension unit_of[] = {Dimension::inductance, Dimension::resistance, Dimension::capacitance, Dimension::inductance};
    if (m.has("touchstone")) {
        if (m.has("value")) throw InputError(m.path_of("value"), "give either value or touchstone, not both");
        std::filesystem::path file(m.text("touchstone"));
        if (file.is_relative()) file = base / file;
        p.touchstone = file;
        p.source = file.string();
    } else {
        p.value = m.positive_quantity("value", unit_of[static_cast<int>(p.kind)]);
    }
    if (m.has("esr")) p.esr = m.non_negative_quantity("esr", Dimension::resistance);
    if (m.has("esl")) p.esl = m.non_negative_quantity("esl", Dimension::inductance);
    if (m.has("parallel_resistance")) p.parallel_resistance = m.positive_quantity("parallel_resistance", Dimension::resistance);
    if (m.has("parallel_capacitance")) p.parallel_capacitance = m.non_negative_quantity("parallel_capacitance", Dimension::capacitance);
    return p;
}

FixtureReference read_reference(const detail::YamlMap& m, const std::filesystem::path& base) {
    m.allow_only({"ideal", "table", "tolerance", "band"});
    FixtureReference r;
    m.at_most_one_of("ideal", "table");
    if (m.has("table")) {
        std::filesystem::path file(m.text("table"));
        if (file.is_relative()) file = base / file;
        r.table = file;
        r.ideal = false;
    } else if (auto i = m.optional_choice("ideal", {"false", "true"})) {
        if (*i == 0) throw InputError(m.path_of("ideal"), "false; give a table instead, or leave the reference out");
    }
    const std::string tol = m.text("tolerance");
    if (tol.find("dB") != std::string::npos || tol.find("db") != std::string::npos) {
        std::string number = tol.substr(0, tol.find_first_of("dD"));
        r.tolerance = parse_quantity(number, Dimension::dimensionless, m.path_of("tolerance"));
        r.in_db = true;
    } else {
        if (tol.find('%') == std::string::npos) throw InputError(m.path_of("tolerance"), "\"" + tol + "\"; expected a percentage (\"20 %\") or decibels (\"1.5 dB\")");
        r.tolerance = m.quantity("tolerance", Dimension::dimensionless);
    }
    if (!(r.tolerance > 0)) throw InputError(m.path_of("tolerance"), "\"" + tol + "\" must be greater than zero");
    const detail::YamlMap b = m.map("band");
    b.allow_only({"low", "high"});
    r.band_low = b.positive_quantity("low", Dimension::frequency);
    r.band_high = b.positive_quantity("high", Dimension::frequency);
    if (!(r.band_high > r.band_low)) throw InputError(b.path_of("high"), "\"" + b.text("high") + "\" is not above band.low");
    return r;
}

// A coupling joins two coil parts, each in one coupling at most (the pair's M is then one number); the
// designed coil (which the search varies) in none.
void check_couplings(const FixtureSpec& f, std::string_view designed) {
    std::set<std::string> coupled;
    for (std::size_t i = 0; i < f.parts.size(); ++i) {
        const FixturePart& k = f.parts[i];
        if (k.kind != FixturePartKind::coupling) continue;
        for (const std::string& c : {k.from, k.to}) {
            const auto it = std::find_if(f.parts.begin(), f.parts.end(), [&](const FixturePart& p) { return p.name == c; });
            if (it == f.parts.end() || it->kind != FixturePartKind::coil) {
                throw InputError(item("parts", i) + ".coils", "\"" + c + "\" is not a coil part of this fixture");
            }
            if (!designed.empty() && c == designed) {
                throw InputError(item("parts", i) + ".coils", "\"" + c + "\" is the designed coil; a search cannot vary a coupled pair "
                                 "(design it alone, then check the pair with the fixture study)");
            }
            if (!coupled.insert(c).second) throw InputError(item("parts", i) + ".coils", "\"" + c + "\" is in another coupling already");
        }
    }
    if (!designed.empty()) {
        const auto it = std::find_if(f.parts.begin(), f.parts.end(), [&](const FixturePart& p) { return p.name == designed; });
        if (it == f.parts.end()) throw InputError("coil", "\"" + std::string(designed) + "\" names no part of the fixture");
        if (it->kind != FixturePartKind::coil) throw InputError("coil", "\"" + std::string(designed) + "\" is a " + std::string(fixture_part_kind_name(it->kind)) + ", not a coil");
    }
}

// Every node must reach the ground through parts; a port's nodes must be nodes of the parts.
void check_topology(const FixtureSpec& f) {
    std::set<std::string> nodes{f.ground};
    for (const auto& p : f.parts) {
        if (p.kind == FixturePartKind::coupling) continue;
        nodes.insert(p.from);
        nodes.insert(p.to);
    }
    std::set<std::string> reached{f.ground};
    for (bool grew = true; grew;) {
        grew = false;
        for (const auto& p : f.parts) {
            if (p.kind == FixturePartKind::coupling) continue;
            const bool a = reached.count(p.from) > 0, b = reached.count(p.to) > 0;
            if (a != b) {
                reached.insert(a ? p.to : p.from);
                grew = true;
            }
        }
    }
    for (std::size_t i = 0; i < f.parts.size(); ++i) {
        const auto& p = f.parts[i];
        if (p.kind == FixturePartKind::coupling) continue;
        if (!reached.count(p.from) || !reached.count(p.to)) {
            throw InputError(item("parts", i) + ".between", "node \"" + (reached.count(p.from) ? p.to : p.from) + "\" has no path through the parts to " + f.ground);
        }
    }
    for (std::size_t i = 0; i < f.ports.size(); ++i) {
        for (const std::string& n : {f.ports[i].from, f.ports[i].to}) {
            if (!nodes.count(n)) throw InputError(item("ports", i) + ".between", "node \"" + n + "\" is on no part");
        }
    }
}

}  // namespace

namespace detail {

FixtureSpec read_fixture(const YAML::Node& root, const std::filesystem::path& base, std::string_view designed) {
    if (!root || !root.IsMap()) throw InputError("fixture", "expected a mapping with \"parts:\" and \"ports:\"");
    const detail::YamlMap top(root, "");
    top.allow_only({"name", "description", "ground", "parts", "ports", "reference", "sweep"});
    FixtureSpec f;
    f.name = top.optional_text("name").value_or("");
    f.description = top.optional_text("description").value_or("");
    if (auto g = top.optional_text("ground")) f.ground = *g;
    const YAML::Node parts = root["parts"];
    if (!parts || !parts.IsSequence() || parts.size() == 0) throw InputError("parts", "expected a list of parts (name, kind, between, value)");
    if (parts.size() > max_parts) throw InputError("parts", std::to_string(parts.size()) + " parts; at most " + std::to_string(max_parts));
    std::set<std::string> names;
    for (std::size_t i = 0; i < parts.size(); ++i) {
        FixturePart p = read_part(parts[i], item("parts", i), base, designed);
        if (!names.insert(p.name).second) throw InputError(item("parts", i) + ".name", "\"" + p.name + "\" names another part already");
        f.parts.push_back(std::move(p));
    }
    const YAML::Node ports = root["ports"];
    if (!ports || !ports.IsSequence() || ports.size() == 0 || ports.size() > 2) {
        throw InputError("ports", "expected a list of one or two ports (name, between, reference)");
    }
    for (std::size_t i = 0; i < ports.size(); ++i) {
        const std::string where = item("ports", i);
        if (!ports[i].IsMap()) throw InputError(where, "expected a mapping (name, between, reference)");
        const detail::YamlMap m(ports[i], where);
        m.allow_only({"name", "between", "reference"});
        FixturePort p;
        p.name = m.text("name");
        std::tie(p.from, p.to) = between(ports[i], where);
        if (m.has("reference")) p.reference = m.positive_quantity("reference", Dimension::resistance);
        f.ports.push_back(p);
    }
    if (top.has("reference")) f.reference = read_reference(top.map("reference"), base);
    if (top.has("sweep")) {
        const detail::YamlMap s = top.map("sweep");
        s.allow_only({"from", "to", "points"});
        if (s.has("from")) f.from = s.positive_quantity("from", Dimension::frequency);
        if (s.has("to")) f.to = s.positive_quantity("to", Dimension::frequency);
        if (s.has("points")) {
            const double n = s.quantity("points", Dimension::dimensionless);
            if (n != std::floor(n) || n < 2 || n > 100000) throw InputError(s.path_of("points"), "\"" + s.text("points") + "\"; expected a whole number 2 .. 100000");
            f.points = static_cast<int>(n);
        }
    }
    check_couplings(f, designed);
    check_topology(f);
    return f;
}

}  // namespace detail

std::string_view fixture_part_kind_name(FixturePartKind k) {
    static const char* names[] = {"coil", "resistor", "capacitor", "inductor", "coupling"};
    return names[static_cast<int>(k)];
}

FixtureSpec parse_fixture(std::string_view yaml_text, std::string_view source, std::string_view designed) {
    return detail::read_fixture(detail::load_yaml(yaml_text, source), std::filesystem::path(source).parent_path(), designed);
}

FixtureSpec load_fixture(const std::filesystem::path& path, std::string_view designed) {
    return parse_fixture(detail::read_text_file(path, "fixture file"), path.string(), designed);
}

FixtureSpec with_coil(FixtureSpec f, std::string_view part, const CoilSpec& coil) {
    for (auto& p : f.parts) {
        if (p.name == part && p.kind == FixturePartKind::coil) {
            p.coil = coil;
            return f;
        }
    }
    throw InputError("coil", "\"" + std::string(part) + "\" names no coil part of the fixture");
}

}  // namespace libcoil
