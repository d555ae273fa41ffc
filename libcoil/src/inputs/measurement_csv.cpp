// The CSV measurement reader and the reader by file extension (network_file.hpp).
#include <cmath>
#include <complex>
#include <string>
#include <vector>

#include "core/text_file.hpp"
#include "inputs/text_fields.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/inputs/network_file.hpp"

namespace libcoil {

namespace {

using detail::Field;

// Comma-separated cells of a line with their columns.
std::vector<Field> cells(std::string_view line, int number) {
    std::vector<Field> out;
    std::size_t start = 0;
    for (std::size_t i = 0; i <= line.size(); ++i) {
        if (i == line.size() || line[i] == ',') {
            const std::string_view raw = line.substr(start, i - start);
            const std::string_view t = detail::trim(raw);
            const std::size_t lead = t.empty() ? 0 : static_cast<std::size_t>(t.data() - raw.data());
            out.push_back({std::string(t), number, static_cast<int>(start + lead) + 1});
            start = i + 1;
        }
    }
    return out;
}

// A header cell "name [unit]": the name and the unit, lower-case.
std::pair<std::string, std::string> name_and_unit(const Field& f, std::string_view file) {
    const std::string t = detail::lower(f.text);
    const std::size_t open = t.find('[');
    if (open == std::string::npos) return {std::string(detail::trim(t)), ""};
    const std::size_t close = t.find(']', open);
    if (close == std::string::npos || close + 1 != t.size()) detail::fail_at(file, f.line, f.column, "a unit is written in brackets at the end: name [unit]");
    return {std::string(detail::trim(std::string_view(t).substr(0, open))), std::string(detail::trim(std::string_view(t).substr(open + 1, close - open - 1)))};
}

}  // namespace

NetworkData read_measurement_csv(std::string_view text, std::string_view name) {
    NetworkData out;
    out.ports = 1;
    double reference = 50;
    std::vector<Field> header;
    int freq = -1, a = -1, b = -1;
    double unit = 1, angle = 1;
    bool polar = false;
    int number = 0;
    for (std::string_view line : detail::lines(text)) {
        ++number;
        const std::string_view t = detail::trim(line);
        if (t.empty()) continue;
        if (t[0] == '!' || t[0] == '#') {
            const std::vector<Field> w = detail::words(t.substr(1), number, 2);
            if (header.empty() && w.size() >= 1 && detail::lower(w[0].text) == "reference") {
                if (w.size() != 3 || detail::lower(w[2].text) != "ohm") {
                    detail::fail_at(name, number, 1, "expected \"# reference <value> ohm\"");
                }
                reference = detail::number(name, w[1]);
                if (!(reference > 0)) detail::fail_at(name, w[1].line, w[1].column, "the reference resistance must be positive");
            }
            continue;
        }
        const std::vector<Field> row = cells(line, number);
        if (header.empty()) {
            header = row;
            for (int i = 0; i < static_cast<int>(row.size()); ++i) {
                const auto [n, u] = name_and_unit(row[static_cast<std::size_t>(i)], name);
                const Field& f = row[static_cast<std::size_t>(i)];
                const auto take = [&](int& slot) {
                    if (slot >= 0) detail::fail_at(name, f.line, f.column, "a second column " + libcoil::quoted(f.text));
                    slot = i;
                };
                if (n == "frequency") {
                    if (u != "hz" && u != "khz" && u != "mhz" && u != "ghz") {
                        detail::fail_at(name, f.line, f.column, "the frequency column names its unit: frequency [Hz], [kHz], [MHz] or [GHz]");
                    }
                    unit = u == "hz" ? 1.0 : u == "khz" ? 1e3 : u == "mhz" ? 1e6 : 1e9;
                    take(freq);
                } else if ((n == "z real" || n == "z imag" || n == "z magnitude") && !u.empty() && u != "ohm") {
                    detail::fail_at(name, f.line, f.column, "an impedance column is in ohm");
                } else if (n == "z real" || n == "s11 real") {
                    out.parameter = n[0] == 'z' ? 'Z' : 'S';
                    take(a);
                } else if (n == "z imag" || n == "s11 imag") {
                    if ((n[0] == 'z') != (out.parameter == 'Z') && a >= 0) detail::fail_at(name, f.line, f.column, "Z and S columns mixed");
                    take(b);
                } else if (n == "z magnitude") {
                    out.parameter = 'Z';
                    polar = true;
                    take(a);
                } else if (n == "z phase") {
                    if (u != "deg" && u != "rad") detail::fail_at(name, f.line, f.column, "the phase column names its unit: z phase [deg] or [rad]");
                    angle = u == "deg" ? M_PI / 180 : 1.0;
                    polar = true;
                    take(b);
                } else {
                    detail::fail_at(name, f.line, f.column, "unknown column " + libcoil::quoted(f.text) + "; expected frequency [Hz], Z real [ohm], "
                                                            "Z imag [ohm], Z magnitude [ohm], Z phase [deg], S11 real or S11 imag");
                }
            }
            if (freq < 0 || a < 0 || b < 0) {
                detail::fail_at(name, number, 1, "the header needs a frequency column and a pair: Z real and Z imag, Z magnitude and "
                                                 "Z phase, or S11 real and S11 imag");
            }
            continue;
        }
        if (row.size() != header.size()) {
            detail::fail_at(name, number, row.back().column, "expected " + std::to_string(header.size()) + " cells as in the header, found " +
                                                                  std::to_string(row.size()));
        }
        const double f = detail::number(name, row[static_cast<std::size_t>(freq)]) * unit;
        if (!std::isfinite(f)) detail::fail_at(name, number, row[static_cast<std::size_t>(freq)].column, "the frequency is out of range");
        if (!(f >= 0)) detail::fail_at(name, number, row[static_cast<std::size_t>(freq)].column, "a frequency cannot be negative");
        if (!out.frequency.empty() && f <= out.frequency.back()) {
            detail::fail_at(name, number, row[static_cast<std::size_t>(freq)].column, "the frequencies must rise from row to row");
        }
        const double x = detail::number(name, row[static_cast<std::size_t>(a)]), y = detail::number(name, row[static_cast<std::size_t>(b)]);
        if (polar && x < 0) detail::fail_at(name, number, row[static_cast<std::size_t>(a)].column, "a magnitude cannot be negative");
        out.frequency.push_back(f);
        out.values.push_back(polar ? std::polar(x, angle == 1.0 ? std::fmod(y, 2 * M_PI) : std::fmod(y, 360.0) * angle) : std::complex<double>(x, y));
    }
    if (header.empty()) detail::fail_at(name, number, 1, "no header row");
    if (out.frequency.empty()) detail::fail_at(name, number, 1, "no data rows after the header");
    out.reference = {reference};
    return out;
}

NetworkData read_network_file(const std::string& path) {
    const std::string text = detail::read_text_file(path, "measurement file");
    const std::string name = path.substr(path.find_last_of('/') == std::string::npos ? 0 : path.find_last_of('/') + 1);
    const std::size_t dot = name.find_last_of('.');
    const std::string ext = dot == std::string::npos ? "" : detail::lower(std::string_view(name).substr(dot + 1));
    // Errors name the path as given, FILE:LINE:COLUMN, as the YAML readers' do.
    if (ext == "csv") return read_measurement_csv(text, path);
    if (ext == "ts") return read_touchstone(text, path, 0);
    if (ext.size() >= 3 && ext.front() == 's' && ext.back() == 'p') {
        const std::string digits = ext.substr(1, ext.size() - 2);
        if (!digits.empty() && digits.size() <= 2 && digits.find_first_not_of("0123456789") == std::string::npos) {
            return read_touchstone(text, path, std::stoi(digits));
        }
    }
    throw InputError("measurement", libcoil::quoted(name) + ": expected a .s1p, .s2p, .ts or .csv file");
}

}  // namespace libcoil
