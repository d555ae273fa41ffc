// Touchstone 1.x and 2.0 reader (network_file.hpp).
#include <cmath>
#include <complex>
#include <string>
#include <vector>

#include "inputs/text_fields.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/inputs/network_file.hpp"

namespace libcoil {

namespace {

using detail::Field;

enum class Format { ri, ma, db };

struct Reader {
    std::string_view name;
    int version = 1, ports = 0;
    bool options_seen = false, in_network = false, in_noise = false, ended = false, order_21_12 = true, order_given = false;
    bool reading_reference = false;
    double unit = 1e9, r = 50;
    char parameter = 'S';
    Format format = Format::ma;
    long frequencies = -1;
    std::vector<double> reference;
    std::vector<Field> numbers;
    std::vector<std::string> notes;
    int last_line = 0;

    [[noreturn]] void fail(const Field& at, const std::string& what) const { detail::fail_at(name, at.line, at.column, what); }

    void options(const std::vector<Field>& words) {
        if (options_seen) {
            notes.push_back("line " + std::to_string(words[0].line) + ": a second option line, ignored as the standard says");
            return;
        }
        options_seen = true;
        for (std::size_t i = 1; i < words.size(); ++i) {
            const std::string w = detail::lower(words[i].text);
            if (w == "hz" || w == "khz" || w == "mhz" || w == "ghz") {
                unit = w == "hz" ? 1.0 : w == "khz" ? 1e3 : w == "mhz" ? 1e6 : 1e9;
            } else if (w == "s" || w == "y" || w == "z") {
                parameter = static_cast<char>(w[0] - 'a' + 'A');
            } else if (w == "g" || w == "h") {
                fail(words[i], "G and H parameters are not read; expected S, Y or Z");
            } else if (w == "ri" || w == "ma" || w == "db") {
                format = w == "ri" ? Format::ri : w == "ma" ? Format::ma : Format::db;
            } else if (w == "r") {
                if (i + 1 >= words.size()) fail(words[i], "R needs the reference resistance after it, e.g. R 50");
                r = detail::number(name, words[++i]);
                if (!(r > 0)) fail(words[i], "the reference resistance must be positive");
            } else {
                fail(words[i], "unknown option " + libcoil::quoted(words[i].text) + "; expected a unit (Hz, kHz, MHz, GHz), a parameter "
                               "(S, Y, Z), a format (RI, MA, DB) or R <ohm>");
            }
        }
    }

    void keyword(const Field& at, std::string_view line) {
        const std::size_t close = line.find(']');
        if (close == std::string_view::npos) fail(at, "a keyword needs its closing ']'");
        const std::string key = detail::lower(detail::trim(line.substr(1, close - 1)));
        const std::vector<Field> rest = detail::words(line.substr(close + 1), at.line, at.column + static_cast<int>(close) + 1);
        const auto one = [&]() -> const Field& {
            if (rest.size() != 1) fail(at, "[" + key + "] takes one value after it");
            return rest[0];
        };
        if (key == "version") {
            if (options_seen || !numbers.empty() || version == 2) fail(at, "[Version] must come first");
            if (one().text != "2.0" && one().text != "2.1") fail(one(), "expected version 2.0 or 2.1");
            version = 2;
            return;
        }
        if (version == 1) fail(at, "keyword [" + key + "] in a version 1 file ([Version] 2.0 must come first)");
        if (key == "number of ports") {
            const double n = detail::number(name, one());
            if (n != std::floor(n) || n < 1 || n > 99) fail(one(), "expected a whole number of ports, 1 .. 99");
            if (ports != 0 && ports != static_cast<int>(n)) {
                fail(one(), "the file states " + one().text + " ports, its extension " + std::to_string(ports));
            }
            ports = static_cast<int>(n);
        } else if (key == "two-port data order") {
            const std::string v = detail::lower(one().text);
            if (v != "12_21" && v != "21_12") fail(one(), "expected 12_21 or 21_12");
            order_21_12 = v == "21_12";
            order_given = true;
        } else if (key == "number of frequencies") {
            const double n = detail::number(name, one());
            if (n != std::floor(n) || n < 1 || n > 1e7) fail(one(), "expected a whole number of frequencies, 1 .. 10000000");
            frequencies = static_cast<long>(n);
        } else if (key == "number of noise frequencies") {
            notes.push_back("the noise data is left out");
        } else if (key == "reference") {
            if (ports == 0) fail(at, "[Reference] needs [Number of Ports] before it");
            reading_reference = true;
            add_reference(rest);
        } else if (key == "matrix format") {
            if (detail::lower(one().text) != "full") fail(one(), "only the Full matrix format is read");
        } else if (key == "network data") {
            if (!options_seen) fail(at, "[Network Data] needs the option line (#) before it");
            if (ports == 0) fail(at, "[Network Data] needs [Number of Ports] before it");
            if (ports == 2 && !order_given) fail(at, "a 2-port file needs [Two-Port Data Order] before [Network Data]");
            if (frequencies < 0) fail(at, "[Network Data] needs [Number of Frequencies] before it");
            if (reading_reference) fail(at, "[Reference] gives " + std::to_string(reference.size()) + " of " + std::to_string(ports) + " values");
            in_network = true;
        } else if (key == "noise data") {
            in_network = false;
            in_noise = true;
        } else if (key == "end") {
            ended = true;
        } else if (key == "begin information" || key == "end information") {
            notes.push_back("the information block is left out");
        } else {
            fail(at, "unknown keyword [" + key + "]");
        }
    }

    void add_reference(const std::vector<Field>& values) {
        for (const Field& f : values) {
            if (static_cast<int>(reference.size()) >= ports) fail(f, "[Reference] takes one value a port (" + std::to_string(ports) + ")");
            const double v = detail::number(name, f);
            if (!(v > 0)) fail(f, "a reference resistance must be positive");
            reference.push_back(v);
        }
        if (static_cast<int>(reference.size()) == ports) reading_reference = false;
    }

    void line(std::string_view raw, int number) {
        last_line = number;
        std::string_view text = raw.substr(0, raw.find('!'));
        const std::vector<Field> words = detail::words(text, number, 1);
        if (words.empty()) return;
        if (ended) fail(words[0], "nothing may follow [End]");
        if (words[0].text[0] == '[') {
            keyword(words[0], text.substr(static_cast<std::size_t>(words[0].column - 1)));
        } else if (words[0].text[0] == '#') {
            std::vector<Field> w = words;
            if (w[0].text.size() > 1) w.insert(w.begin() + 1, Field{w[0].text.substr(1), w[0].line, w[0].column + 1});
            options(w);
        } else if (reading_reference) {
            add_reference(words);
        } else if (in_noise) {
            return;
        } else {
            if (version == 1 && !options_seen) fail(words[0], "data before the option line (# Hz S RI R 50, say)");
            if (version == 2 && !in_network) fail(words[0], "data outside [Network Data]");
            for (const Field& w : words) numbers.push_back(w);
        }
    }

    std::complex<double> pair(const Field& a, const Field& b) const {
        const double x = detail::number(name, a), y = detail::number(name, b);
        const double angle = std::fmod(y, 360.0) * M_PI / 180;  // reduced first: a huge angle stays finite
        switch (format) {
            case Format::ri: return {x, y};
            case Format::ma:
                if (x < 0) fail(a, "a magnitude cannot be negative");
                return std::polar(x, angle);
            case Format::db: {
                const double m = std::pow(10.0, x / 20);
                if (!std::isfinite(m)) fail(a, "a magnitude of " + a.text + " dB is out of range");
                return std::polar(m, angle);
            }
        }
        return {};
    }

    NetworkData finish() {
        if (version == 2 && !ended) detail::fail_at(name, last_line, 1, "a version 2 file ends with [End]");
        if (ports == 0) detail::fail_at(name, last_line, 1, "the number of ports is unknown: [Number of Ports], or the extension .s1p / .s2p");
        NetworkData out;
        out.ports = ports;
        out.parameter = parameter;
        out.reference = reference.empty() ? std::vector<double>(static_cast<std::size_t>(ports), r) : reference;
        const std::size_t size = 1 + 2 * static_cast<std::size_t>(ports * ports);
        std::size_t i = 0;
        while (i < numbers.size()) {
            const double f = detail::number(name, numbers[i]) * unit;
            if (!std::isfinite(f)) fail(numbers[i], "the frequency " + numbers[i].text + " is out of range");
            if (version == 1 && ports == 2 && !out.frequency.empty() && f <= out.frequency.back()) {
                out.notes.push_back("line " + std::to_string(numbers[i].line) + " on: the noise data, left out");
                break;
            }
            if (!(f >= 0)) fail(numbers[i], "a frequency cannot be negative");
            if (!out.frequency.empty() && f <= out.frequency.back()) fail(numbers[i], "the frequencies must rise from row to row");
            if (i + size > numbers.size()) {
                fail(numbers.back(), "the record at " + numbers[i].text + " is cut short: " + std::to_string(size - 1) + " numbers expected after its frequency, " +
                                         std::to_string(numbers.size() - i - 1) + " found");
            }
            out.frequency.push_back(f);
            std::vector<std::complex<double>> m(static_cast<std::size_t>(ports * ports));
            for (int k = 0; k < ports * ports; ++k) {
                int row = k / ports, col = k % ports;
                if (ports == 2 && order_21_12 && (k == 1 || k == 2)) std::swap(row, col);
                std::complex<double> v = pair(numbers[i + 1 + 2 * static_cast<std::size_t>(k)], numbers[i + 2 + 2 * static_cast<std::size_t>(k)]);
                if (version == 1 && parameter == 'Z') v *= r;  // version 1 normalises Z and Y to R
                if (version == 1 && parameter == 'Y') v /= r;
                if (!std::isfinite(v.real()) || !std::isfinite(v.imag())) {
                    fail(numbers[i + 1 + 2 * static_cast<std::size_t>(k)], "the value is out of range once scaled by its reference");
                }
                m[static_cast<std::size_t>(row * ports + col)] = v;
            }
            out.values.insert(out.values.end(), m.begin(), m.end());
            i += size;
        }
        if (out.frequency.empty()) detail::fail_at(name, last_line, 1, "no network data");
        if (version == 2 && static_cast<long>(out.frequency.size()) != frequencies) {
            detail::fail_at(name, last_line, 1, "[Number of Frequencies] says " + std::to_string(frequencies) + ", the data holds " +
                                                    std::to_string(out.frequency.size()));
        }
        out.notes.insert(out.notes.begin(), notes.begin(), notes.end());
        return out;
    }
};

}  // namespace

NetworkData read_touchstone(std::string_view text, std::string_view name, int ports) {
    if (ports < 0 || ports > 99) throw InputError("ports", std::to_string(ports) + " is outside 0 .. 99");
    Reader r;
    r.name = name;
    r.ports = ports;
    int number = 0;
    for (std::string_view line : detail::lines(text)) r.line(line, ++number);
    return r.finish();
}

}  // namespace libcoil
