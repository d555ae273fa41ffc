// Measurement files in: Touchstone 1.x and 2.0 (.s1p, .s2p, .ts) and CSV, read into one record of
// frequencies and each frequency's port matrix, as the file holds them (S, Y or Z).
//
// Touchstone: the option line `# <unit> <parameter> <format> R <ohm>` (defaults GHz S MA R 50), comments
// after `!`, any whitespace, records that may wrap over lines; version 1 pairs in the 2-port order
// 11 21 12 22 and normalises Y and Z to R; version 2 keywords [Version], [Number of Ports],
// [Two-Port Data Order], [Number of Frequencies], [Reference], [Matrix Format] (Full), [Network Data],
// [Noise Data], [End]. A 2-port file's noise block (version 1: where the frequency falls back) is left out
// with a note. The format is the open Touchstone standard (IBIS Open Forum, version 2.0, 2009).
//
// CSV (this project's own layout): a header row naming the columns, then one row a frequency. The
// frequency column is `frequency [Hz]` (or kHz, MHz, GHz); then either `Z real [ohm]` and `Z imag [ohm]`,
// or `Z magnitude [ohm]` and `Z phase [deg]` (or rad), or `S11 real` and `S11 imag` (one port, with an
// optional `# reference 50 ohm` line before the header; 50 ohm otherwise). Names are case-insensitive;
// `!` or `#` starts a comment line.
//
// Every malformed file is an InputError naming the file, the line and the column, and what was expected;
// nothing is half-read: the record is returned whole or not at all.
#pragma once

#include <complex>
#include <cstddef>
#include <string>
#include <string_view>
#include <vector>

namespace libcoil {

struct NetworkData {
    int ports = 1;
    char parameter = 'S';                      // 'S', 'Y' or 'Z', as the file holds them (Y and Z in S and ohm)
    std::vector<double> reference;             // ohm, one per port
    std::vector<double> frequency;             // Hz, strictly increasing
    std::vector<std::complex<double>> values;  // frequency after frequency, each ports x ports row-major
    std::vector<std::string> notes;            // what the reader left out or assumed

    std::complex<double> at(std::size_t k, int row, int column) const {
        return values[k * static_cast<std::size_t>(ports * ports) + static_cast<std::size_t>(row * ports + column)];
    }
};

// The port matrix at f (Hz), ports x ports row-major, interpolated linearly in its real and imaginary parts
// between the file's points. InputError naming `field` where f lies outside the file's frequencies.
std::vector<std::complex<double>> matrix_at(const NetworkData& d, double f, const std::string& field);

// `name` is the file's name for messages; `ports` the port count its extension gives (.s1p: 1), or 0 for
// a version 2 file that states it.
NetworkData read_touchstone(std::string_view text, std::string_view name, int ports);
NetworkData read_measurement_csv(std::string_view text, std::string_view name);
// By the extension: .s1p, .s2p, .ts (Touchstone 2.0 with [Number of Ports]) or .csv.
NetworkData read_network_file(const std::string& path);

}  // namespace libcoil
