// Internal: a YAML mapping with its path, for reading specs with clear errors.
#pragma once

#include "libcoil/spec/choices.hpp"

#include <initializer_list>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <yaml-cpp/yaml.h>

#include "libcoil/core/units.hpp"

namespace libcoil::detail {

class YamlMap {
public:
    // `path` is the YAML path of this mapping ("coil", "coil.wire"); empty for the document root.
    YamlMap(const YAML::Node& node, std::string path);

    std::string path_of(std::string_view key) const;
    bool has(std::string_view key) const;
    bool has_map(std::string_view key) const;  // present and a mapping

    // Throws InputError for any key outside `allowed`, with a "did you mean" hint.
    void allow_only(std::initializer_list<std::string_view> allowed) const;
    // Exactly one of two alternative keys must be present.
    std::string_view one_of(std::string_view a, std::string_view b) const;
    void at_most_one_of(std::string_view a, std::string_view b) const;

    YamlMap map(std::string_view key) const;  // required nested mapping
    std::string text(std::string_view key) const;  // required scalar, as written
    std::optional<std::string> optional_text(std::string_view key) const;
    double quantity(std::string_view key, Dimension d) const;  // required, SI
    // A required quantity that must be > 0 (or >= 0); the error quotes the value as written.
    double positive_quantity(std::string_view key, Dimension d) const;
    // A list of quantities (a single value counts as a list of one); errors name the element, key[i].
    std::vector<double> quantity_list(std::string_view key, Dimension d) const;
    // The same, each > 0; the error quotes the element as written, followed by `why` where given.
    std::vector<double> positive_quantity_list(std::string_view key, Dimension d, std::string_view why = {}) const;
    double non_negative_quantity(std::string_view key, Dimension d) const;
    // An optional word from a fixed list: its index, or nullopt when the key is absent. Any other word is
    // an InputError listing the choices.
    std::optional<std::size_t> optional_choice(std::string_view key, std::initializer_list<std::string_view> words) const;
    // A word of the choices table (choices.hpp), or nothing when the key is absent.
    template <class E>
    std::optional<E> optional_choice_of(std::string_view key) const {
        const auto t = optional_text(key);
        if (!t) return std::nullopt;
        return parse_choice<E>(*t, path_of(key));
    }

private:
    YAML::Node scalar(std::string_view key) const;
    YAML::Node node_;
    std::string path_;
};

// What a YAML node is, for messages: "a list", "a mapping", "an empty value".
std::string describe(const YAML::Node& n);

}  // namespace libcoil::detail
