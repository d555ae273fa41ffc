#include "spec/yaml_reader.hpp"

#include <vector>

#include "libcoil/core/error.hpp"
#include "core/suggest.hpp"

namespace libcoil::detail {

std::string describe(const YAML::Node& n) {
    switch (n.Type()) {
        case YAML::NodeType::Null: return "an empty value";
        case YAML::NodeType::Scalar: return "\"" + n.Scalar() + "\"";
        case YAML::NodeType::Sequence: return "a list";
        case YAML::NodeType::Map: return "a mapping";
        default: return "nothing";
    }
}

YamlMap::YamlMap(const YAML::Node& node, std::string path) : node_(node), path_(std::move(path)) {
    if (!node_.IsMap()) {
        throw InputError(path_.empty() ? "spec" : path_, "expected a mapping of keys to values, got " + describe(node_));
    }
}

std::string YamlMap::path_of(std::string_view key) const {
    return path_.empty() ? std::string(key) : path_ + "." + std::string(key);
}

bool YamlMap::has(std::string_view key) const { return static_cast<bool>(node_[std::string(key)]); }

bool YamlMap::has_map(std::string_view key) const { return has(key) && node_[std::string(key)].IsMap(); }

void YamlMap::allow_only(std::initializer_list<std::string_view> allowed) const {
    std::vector<std::string> names(allowed.begin(), allowed.end());
    for (const auto& kv : node_) {
        if (!kv.first.IsScalar()) throw InputError(path_.empty() ? "spec" : path_, "a key must be a plain word");
        const std::string key = kv.first.Scalar();
        bool ok = false;
        for (const auto& a : allowed) ok = ok || key == a;
        if (!ok) {
            throw InputError(path_of(key), "unknown key" + did_you_mean(key, names) + " (allowed here: " + join(names) + ")");
        }
    }
}

std::string_view YamlMap::one_of(std::string_view a, std::string_view b) const {
    const bool ha = has(a), hb = has(b);
    if (ha && hb) {
        throw InputError(path_of(a), "give either " + std::string(a) + " or " + std::string(b) + ", not both");
    }
    if (!ha && !hb) {
        throw InputError(path_of(a), "missing; give " + std::string(a) + " or " + std::string(b));
    }
    return ha ? a : b;
}

void YamlMap::at_most_one_of(std::string_view a, std::string_view b) const {
    if (has(a) && has(b)) {
        throw InputError(path_of(a), "give either " + std::string(a) + " or " + std::string(b) + ", not both");
    }
}

YamlMap YamlMap::map(std::string_view key) const {
    const YAML::Node n = node_[std::string(key)];
    if (!n) {
        // A quote left open swallows the lines after it into one text: say so where the section's name is
        // found inside another value.
        for (const auto& kv : node_) {
            if (kv.second.IsScalar() && kv.second.Scalar().find(std::string(key) + ":") != std::string::npos) {
                throw InputError(path_of(key), "missing; the text of " + path_of(kv.first.Scalar()) + " holds \"" + std::string(key) +
                                                   ":\" (is a quote left open there?)");
            }
        }
        throw InputError(path_of(key), "missing; this section is required");
    }
    return YamlMap(n, path_of(key));
}

YAML::Node YamlMap::scalar(std::string_view key) const {
    const YAML::Node n = node_[std::string(key)];
    if (!n) throw InputError(path_of(key), "missing; this value is required");
    if (!n.IsScalar()) throw InputError(path_of(key), "expected a single value, got " + describe(n));
    return n;
}

std::string YamlMap::text(std::string_view key) const { return scalar(key).Scalar(); }

std::optional<std::string> YamlMap::optional_text(std::string_view key) const {
    if (!has(key)) return std::nullopt;
    return text(key);
}

double YamlMap::quantity(std::string_view key, Dimension d) const {
    return parse_quantity(text(key), d, path_of(key));
}

std::vector<double> YamlMap::quantity_list(std::string_view key, Dimension d) const {
    const YAML::Node n = node_[std::string(key)];
    if (!n) throw InputError(path_of(key), "missing; this value is required");
    if (n.IsScalar()) return {parse_quantity(n.Scalar(), d, path_of(key))};
    if (!n.IsSequence()) throw InputError(path_of(key), "expected a list of values, got " + describe(n));
    std::vector<double> out;
    for (std::size_t i = 0; i < n.size(); ++i) {
        const std::string where = path_of(key) + "[" + std::to_string(i) + "]";
        if (!n[i].IsScalar()) throw InputError(where, "expected a single value, got " + describe(n[i]));
        out.push_back(parse_quantity(n[i].Scalar(), d, where));
    }
    if (out.empty()) throw InputError(path_of(key), "the list is empty");
    return out;
}

std::optional<std::size_t> YamlMap::optional_choice(std::string_view key,
                                                    std::initializer_list<std::string_view> words) const {
    const auto t = optional_text(key);
    if (!t) return std::nullopt;
    std::string expected;
    std::size_t i = 0;
    for (auto w : words) {
        if (*t == w) return i;
        expected += (i == 0 ? "" : i + 1 == words.size() ? " or " : ", ") + std::string(w);
        ++i;
    }
    throw InputError(path_of(key), "\"" + *t + "\"; expected " + expected);
}

std::vector<double> YamlMap::positive_quantity_list(std::string_view key, Dimension d, std::string_view why) const {
    std::vector<double> out = quantity_list(key, d);
    const YAML::Node n = node_[std::string(key)];
    for (std::size_t i = 0; i < out.size(); ++i) {
        if (out[i] > 0) continue;
        const bool list = n.IsSequence();
        throw InputError(list ? path_of(key) + "[" + std::to_string(i) + "]" : path_of(key),
                         "\"" + (list ? n[i].Scalar() : n.Scalar()) + "\" must be greater than zero" + (why.empty() ? "" : " " + std::string(why)));
    }
    return out;
}

double YamlMap::positive_quantity(std::string_view key, Dimension d) const {
    const double v = quantity(key, d);
    if (!(v > 0)) throw InputError(path_of(key), "\"" + text(key) + "\" must be greater than zero");
    return v;
}

double YamlMap::non_negative_quantity(std::string_view key, Dimension d) const {
    const double v = quantity(key, d);
    if (v < 0) throw InputError(path_of(key), "\"" + text(key) + "\" must not be negative");
    return v;
}


}  // namespace libcoil::detail
