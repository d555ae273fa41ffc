// Links against the installed libcoil and checks one published value: Nagaoka's K(1) = 0.6884
// (Nagaoka 1909 / Grover 1946 table, quoted from memory).
#include <cmath>
#include <cstdio>

#include <libcoil/libcoil.hpp>

int main() {
    const double k = libcoil::nagaoka_coefficient(1.0);
    std::printf("libcoil %s: K(1) = %.6f, data in %s\n", libcoil::version, k, libcoil::data_directory().c_str());
    return std::fabs(k - 0.6884) < 1e-4 ? 0 : 1;
}
