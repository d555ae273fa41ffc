// YAML text to one document's node, for every reader of the library (coil spec, requirement, fixture, bench
// file): the text checked first (UTF-8, no control bytes), exactly one document, no key given twice in a
// mapping, nesting bounded. Malformed YAML is an InputError naming source:line:column.
#include <yaml-cpp/eventhandler.h>
#include <yaml-cpp/yaml.h>

#include <algorithm>
#include <sstream>
#include <string>
#include <vector>

#include "libcoil/core/error.hpp"
#include "core/utf8.hpp"
#include "spec/spec_sections.hpp"

namespace libcoil::detail {

namespace {

// source:line:column of byte `at` in `text`.
std::string place(std::string_view text, std::size_t at, std::string_view source) {
    const std::size_t line = static_cast<std::size_t>(std::count(text.begin(), text.begin() + static_cast<std::ptrdiff_t>(at), '\n')) + 1;
    const std::size_t start = text.rfind('\n', at == 0 ? 0 : at - 1);
    const std::size_t column = at - (start == std::string_view::npos || at == 0 ? 0 : start + 1) + 1;
    return std::string(source) + ":" + std::to_string(line) + ":" + std::to_string(column);
}

std::string place(const YAML::Mark& mark, std::string_view source) {
    std::ostringstream where;
    where << source;
    if (!mark.is_null()) where << ":" << mark.line + 1 << ":" << mark.column + 1;
    return where.str();
}

// A control character a value may not hold: any but tab and line feed (the raw text may also hold carriage
// returns, which end its lines).
bool control_character(unsigned char c) { return (c < 0x20 && c != '\t' && c != '\n') || c == 0x7f; }

// The text must be UTF-8 without control characters other than tab, line feed and carriage return: names
// and descriptions reach reports, JSON and terminals.
void check_text(std::string_view text, std::string_view source) {
    for (std::size_t i = 0; i < text.size();) {
        const auto c = static_cast<unsigned char>(text[i]);
        if (c < 0x80) {
            if (c != '\r' && control_character(c)) {
                throw InputError(place(text, i, source), "a control character (byte " + std::to_string(c) + ") in the text; expected printable UTF-8");
            }
            ++i;
            continue;
        }
        const std::size_t n = utf8_length(text, i);
        if (n == 0) throw InputError(place(text, i, source), "not valid UTF-8 (byte " + std::to_string(c) + "); save the file as UTF-8");
        i += n;
    }
}

// Where each document's first node starts; nothing else of the events is kept.
class DocumentStarts : public YAML::EventHandler {
public:
    std::vector<YAML::Mark> starts;

    void OnDocumentStart(const YAML::Mark&) override { first_ = true; }
    void OnDocumentEnd() override {}
    void OnNull(const YAML::Mark& m, YAML::anchor_t) override { node(m); }
    void OnAlias(const YAML::Mark& m, YAML::anchor_t) override { node(m); }
    void OnScalar(const YAML::Mark& m, const std::string&, YAML::anchor_t, const std::string&) override { node(m); }
    void OnSequenceStart(const YAML::Mark& m, const std::string&, YAML::anchor_t, YAML::EmitterStyle::value) override { node(m); }
    void OnSequenceEnd() override {}
    void OnMapStart(const YAML::Mark& m, const std::string&, YAML::anchor_t, YAML::EmitterStyle::value) override { node(m); }
    void OnMapEnd() override {}

private:
    bool first_ = false;
    void node(const YAML::Mark& m) {
        if (first_) starts.push_back(m);
        first_ = false;
    }
};

// Exactly one document. Debian's yaml-cpp 0.7 reads a token that no node can begin with (a "," outside any
// [ ] or { } after a document's value: ",", "\"a\", b", "[a], b", "- a\n,") as the start of a new, empty
// document, without consuming it: YAML::LoadAll then collects empty documents until memory runs out (found
// by tests/fuzz, fuzz_spec; 50 bytes took the machine's memory). So the documents are counted here, one at a
// time and no further than the text's document markers allow: a document beyond the first needs a line
// that begins with "---" or "..." before it, so one more than those lines means such a token.
void check_one_document(const std::string& text, std::string_view source) {
    std::size_t markers = 0;
    for (std::size_t i = 0; i < text.size(); i = text.find('\n', i) == std::string::npos ? text.size() : text.find('\n', i) + 1) {
        if (text.compare(i, 3, "---") == 0 || text.compare(i, 3, "...") == 0) ++markers;
    }
    std::istringstream in(text);
    YAML::Parser parser(in);
    DocumentStarts documents;
    std::size_t count = 0;
    try {
        while (count <= markers + 1 && parser.HandleNextDocument(documents)) ++count;
    } catch (const YAML::Exception& e) {
        throw InputError(place(e.mark, source), "malformed YAML: " + e.msg);
    }
    if (count > markers + 1) {
        const YAML::Mark at = documents.starts.at(markers + 1);
        const bool comma = at.pos >= 0 && static_cast<std::size_t>(at.pos) < text.size() && text[static_cast<std::size_t>(at.pos)] == ',';
        throw InputError(place(at, source), comma ? "malformed YAML: a ',' outside any [ ] or { }, where no value can go on"
                                                  : "malformed YAML: text that belongs to no node, after the document's value");
    }
    if (count > 1) throw InputError(std::string(source), "holds " + std::to_string(count) + " YAML documents; expected one");
}

// A key given twice in one mapping (YAML forbids it; the parser would keep the first silently), nesting
// beyond any spec's, and a value that a YAML escape ("\e", "\x1b", "\uD800") made a control character or
// text that is not UTF-8, which the check of the raw text cannot see (found by tests/fuzz, fuzz_spec: an
// escape in a name reached the spec's write-back, and would reach a terminal).
void check_keys(const YAML::Node& node, const std::string& path, int depth) {
    if (depth > 32) throw InputError(path.empty() ? "spec" : path, "nested deeper than 32 levels");
    if (node.IsScalar()) {
        const std::string& v = node.Scalar();
        for (std::size_t i = 0; i < v.size();) {
            const auto c = static_cast<unsigned char>(v[i]);
            const std::size_t n = utf8_length(v, i);
            if (n == 0 || control_character(c)) {
                throw InputError(path.empty() ? "spec" : path, "a control character or a byte that is not UTF-8 (byte " + std::to_string(c) +
                                                                   ", from an escape); expected printable text");
            }
            i += n;
        }
    }
    if (node.IsMap()) {
        std::vector<std::string> seen;
        for (const auto& kv : node) {
            const std::string key = kv.first.IsScalar() ? kv.first.Scalar() : "";
            const std::string here = path.empty() ? key : path + "." + key;
            if (!key.empty() && std::find(seen.begin(), seen.end(), key) != seen.end()) {
                throw InputError(here, "given twice in the same mapping; give it once");
            }
            seen.push_back(key);
            check_keys(kv.second, here, depth + 1);
        }
    } else if (node.IsSequence()) {
        for (std::size_t i = 0; i < node.size(); ++i) check_keys(node[i], path + "[" + std::to_string(i) + "]", depth + 1);
    }
}

}  // namespace

YAML::Node load_yaml(std::string_view text, std::string_view source) {
    check_text(text, source);
    const std::string whole(text);
    check_one_document(whole, source);
    YAML::Node root;
    try {
        root = YAML::Load(whole);  // the first (and only) document
    } catch (const YAML::Exception& e) {
        throw InputError(place(e.mark, source), "malformed YAML: " + e.msg);
    }
    check_keys(root, "", 0);
    return root;
}

}  // namespace libcoil::detail
