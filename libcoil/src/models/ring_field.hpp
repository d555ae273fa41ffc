// Internal: the field per ampere of a circular turn of radius b at a point of the same radius an axial
// distance z away, the term the proximity field sum (proximity.cpp) adds for every turn offset. In units of
// 1 / b and as functions of s = z / (2 b) alone:
//   b H_z = (K - E) / (4 pi sqrt(1 + s^2)),
//   b H_r = s / (2 pi sqrt(1 + s^2)) (-K + (1 + 2 s^2) / (2 s^2) E),  k^2 = 1 / (1 + s^2)
// (Smythe, "Static and Dynamic Electricity" (1950) 7.10; Jackson 5.37). ring_field takes them from tables
// that tools/ring_field_tables.py fits to mpmath (ring_field_tables.hpp: within 6.3e-16 of mpmath for
// s >= 2^-10, measured there) at about a tenth of the cost of the elliptic integrals; ring_fields_exact
// computes them by the arithmetic-geometric mean (elliptic.hpp), for the closest turns below the tables and as
// the tables' reference in the tests (tests/cpp/test_numerics.cpp).
#pragma once

#include <cmath>
#include <cstddef>

#include "libcoil/core/constants.hpp"
#include "models/elliptic.hpp"
#include "models/polynomial.hpp"
#include "models/ring_field_tables.hpp"

namespace libcoil::detail {

struct RingField {
    double z = 0, r = 0;  // b H_z and b H_r per ampere
};

// Where the tables begin and where their far-field tail begins.
inline constexpr double ring_table_low = power_of_two(ring_field_tables::low_octave);
inline constexpr double ring_table_high = power_of_two(ring_field_tables::high_octave);

// s >= ring_table_low (not checked: the caller sorts its offsets).
inline RingField ring_field(double s) {
    namespace t = ring_field_tables;
    if (s < ring_table_high) {
        const OctavePlace at = octave_place<t::low_octave, t::parts>(s);
        const PolynomialPair v = estrin_pair(t::body[at.index], at.w);
        return {v.first, v.second};
    }
    // The tail: the dipole forms times polynomials in t = (2^high / s)^2.
    const double q = ring_table_high / s, tt = q * q;
    const double inv_s3 = q * tt / (ring_table_high * ring_table_high * ring_table_high);
    const PolynomialPair v = estrin_pair(t::tail, 2 * tt - 1);
    return {v.first * inv_s3 / 16, v.second * inv_s3 / s * 3 / 64};
}

// The fields of the turns at offsets k = first .. n-1 (all at s = k sigma >= ring_table_low) from the
// tables, as running sums continued from (run_z, run_r) and stored in sz[k], sr[k]. Two offsets to an AVX
// instruction where the processor has AVX (ring_field.cpp), one otherwise: the same operations lane by lane,
// so the same bits on every x86-64 (tests/cpp/test_numerics.cpp compares the two).
void ring_field_running_sums(double sigma, long first, long n, double& run_z, double& run_r, double* sz, double* sr);

// The same by the elliptic integrals, for `lanes` offsets s[j] > 0 at once (their AGMs interleave). Written
// to spare divisions, which cost more here than the square roots.
template <std::size_t lanes>
void ring_fields_exact(const double* s, RingField* out) {
    double inv_root[lanes], kc[lanes], m[lanes], inv_m[lanes];
    for (std::size_t j = 0; j < lanes; ++j) {
        const double q = 1 + s[j] * s[j];
        inv_root[j] = 1 / std::sqrt(q);
        m[j] = inv_root[j] * inv_root[j];  // k^2
        inv_m[j] = q;
        kc[j] = s[j] * inv_root[j];  // k'
    }
    EllipticPair e[lanes];
    elliptic_pairs<lanes>(kc, m, e, inv_m);
    for (std::size_t j = 0; j < lanes; ++j) {
        const double kme = m[j] * e[j].k_minus_e_over_m;  // K - E
        const double E = e[j].k - kme;
        out[j].z = kme * inv_root[j] / (4 * pi);
        out[j].r = kc[j] / (2 * pi) * (-e[j].k + (1 + 1 / (2 * s[j] * s[j])) * E);
    }
}

}  // namespace libcoil::detail
