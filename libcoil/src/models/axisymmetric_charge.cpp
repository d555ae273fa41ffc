#include "libcoil/models/axisymmetric_charge.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <optional>
#include <string>

#include <Eigen/Dense>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "models/axisymmetric_panels.hpp"
#include "models/elliptic.hpp"
#include "models/solve_in_place.hpp"

namespace libcoil {

namespace {

using Matrix = Eigen::MatrixXd;
using detail::Panel, detail::panels_of, detail::shifted, detail::gauss_x, detail::gauss_w, detail::far_w;

// The potential and field at (rho, z) of a unit charge spread round a ring of radius a at height zs, times
// 4 pi eps0 (the header's formulas).
struct RingField {
    double phi, e_rho, e_z;
};

RingField ring_field(double a, double zs, double rho, double z) {
    const double dz = z - zs;
    const double s2 = (a + rho) * (a + rho) + dz * dz, d2 = (a - rho) * (a - rho) + dz * dz;
    const double m = 4 * a * rho / s2;
    const detail::EllipticPair p = detail::elliptic_k_and_k_minus_e_over_m(std::sqrt(d2 / s2), m);
    const double k = p.k, e = p.k - m * p.k_minus_e_over_m, s = std::sqrt(s2);
    RingField f;
    f.phi = (2 / pi) * k / s;
    f.e_z = d2 > 0 ? (2 / pi) * dz * e / (d2 * s) : 0;
    // Near the axis K - E (a^2 - rho^2 + dz^2) / d^2 cancels to O(rho): there E_rho is rho times a finite
    // slope, negligible below 1e-9 of the distance.
    f.e_rho = rho > 1e-9 * (a + std::fabs(dz)) && d2 > 0 ? (k - (a * a - rho * rho + dz * dz) / d2 * e) / (pi * rho * s) : 0;
    return f;
}

// The same at one point (rho, z) for n source rings (a[j], zs[j]) at once: their elliptic integrals
// interleave (elliptic.hpp), and the arithmetic around them is ring_field's with the divisions shared (three
// a ring here, six there; the results agree to an ulp or two).
template <int n>
void ring_fields(const double* a, const double* zs, double rho, double z, RingField* out) {
    double dz[n], d2[n], m[n], inv_m[n], kc[n], inv_s[n];
    for (int j = 0; j < n; ++j) {
        dz[j] = z - zs[j];
        const double s2 = (a[j] + rho) * (a[j] + rho) + dz[j] * dz[j];
        d2[j] = (a[j] - rho) * (a[j] - rho) + dz[j] * dz[j];
        inv_s[j] = 1 / std::sqrt(s2);
        m[j] = 4 * a[j] * rho * inv_s[j] * inv_s[j];
        inv_m[j] = s2 / (4 * a[j] * rho);  // infinite on the axis, where elliptic_pairs takes m's series instead
        kc[j] = std::sqrt(d2[j]) * inv_s[j];
    }
    detail::EllipticPair p[n];
    detail::elliptic_pairs<n>(kc, m, p, inv_m);
    const double inv_pi_rho = rho > 0 ? 1 / (pi * rho) : 0;
    for (int j = 0; j < n; ++j) {
        const double k = p[j].k, e = p[j].k - m[j] * p[j].k_minus_e_over_m;
        const double inv_d2 = d2[j] > 0 ? 1 / d2[j] : 0;
        out[j].phi = (2 / pi) * k * inv_s[j];
        out[j].e_z = (2 / pi) * dz[j] * e * inv_d2 * inv_s[j];
        out[j].e_rho = rho > 1e-9 * (a[j] + std::fabs(dz[j])) && d2[j] > 0
                           ? (k - (a[j] * a[j] - rho * rho + dz[j] * dz[j]) * inv_d2 * e) * inv_s[j] * inv_pi_rho
                           : 0;
    }
}

struct Kernel {
    double phi = 0, e_n = 0;
};

// The kernel summed over n source points of a panel, w[g] the weight of point g along it (its length
// included): the fields of the rings there, less their images in the ground plane where there is one. All
// n points' elliptic integrals interleave (ring_fields).
template <int n>
Kernel quadrature_sums(const double* a, const double* zs, const double* w, double rho, double z, double nr, double nz,
                       const std::optional<double>& plane) {
    RingField f[n];
    ring_fields<n>(a, zs, rho, z, f);
    if (plane) {
        double image[n];
        for (int g = 0; g < n; ++g) image[g] = 2 * *plane - zs[g];
        RingField i[n];
        ring_fields<n>(a, image, rho, z, i);
        for (int g = 0; g < n; ++g) {
            f[g].phi -= i[g].phi;
            f[g].e_rho -= i[g].e_rho;
            f[g].e_z -= i[g].e_z;
        }
    }
    Kernel k;
    for (int g = 0; g < n; ++g) {
        const double weight = w[g] * 2 * pi * a[g];
        k.phi += weight * f[g].phi;
        k.e_n += weight * (f[g].e_rho * nr + f[g].e_z * nz);
    }
    return k;
}

// The integral over the part u0 .. u1 of a panel (unit surface charge) of the potential and the field
// along (nr, nz) at (rho, z), times 4 pi eps0; the ground plane's image included where `plane` is given.
Kernel piece_integral(const Panel& p, double u0, double u1, double rho, double z, double nr, double nz,
                      const std::optional<double>& plane) {
    const double half = 0.5 * (u1 - u0) * p.length;
    double a[8], zs[8];
    if (u0 == 0 && u1 == 1 && p.gauss_r[0] > 0) {  // the whole panel: its points are kept
        for (int g = 0; g < 8; ++g) {
            a[g] = p.gauss_r[static_cast<std::size_t>(g)];
            zs[g] = p.gauss_z[static_cast<std::size_t>(g)];
        }
    } else {
        for (int g = 0; g < 8; ++g) {
            const auto x = p.at(u0 + 0.5 * (1 + gauss_x[g]) * (u1 - u0));
            a[g] = x[0];
            zs[g] = x[1];
        }
    }
    double w[8];
    for (int g = 0; g < 8; ++g) w[g] = gauss_w[g] * half;
    return quadrature_sums<8>(a, zs, w, rho, z, nr, nz, plane);
}

// The distance from a panel's middle to the point (rho, z): a plain root of the sum of squares (std::hypot's
// care for overflow cost 6 % of a design search here).
double distance(const Panel& p, double rho, double z) { return std::sqrt((rho - p.rc) * (rho - p.rc) + (z - p.zc) * (z - p.zc)); }

// Whether panel_integral takes far_integral for a point `ratio` panel lengths from the panel's middle.
bool is_far(double ratio) { return ratio > detail::far_lengths; }

// The n-point rule over the whole panel (the elliptic integrals go in pairs: an odd n takes one more point of weight 0).
template <int n>
Kernel far_rule(const Panel& p, double rho, double z, double nr, double nz, const std::optional<double>& plane) {
    constexpr int first = detail::far_first(n), lanes = n + n % 2;
    double a[lanes], zs[lanes], w[lanes];
    for (int g = 0; g < lanes; ++g) {
        const int k = first + std::min(g, n - 1);
        a[g] = p.far_r[static_cast<std::size_t>(k)];
        zs[g] = p.far_z[static_cast<std::size_t>(k)];
        w[g] = g < n ? far_w[k] * 0.5 * p.length : 0.0;
    }
    return quadrature_sums<lanes>(a, zs, w, rho, z, nr, nz, plane);
}

// The whole panel from a point beyond three panel lengths, by far_points' rule.
Kernel far_integral(const Panel& p, double rho, double z, double nr, double nz, const std::optional<double>& plane) {
    switch (detail::far_points(distance(p, rho, z) / p.length)) {
        case 2: return far_rule<2>(p, rho, z, nr, nz, plane);
        case 3: return far_rule<3>(p, rho, z, nr, nz, plane);
        default: return far_rule<4>(p, rho, z, nr, nz, plane);
    }
}

// The same over a whole panel: split in four where the point is near, in halves about the middle on the
// panel itself (the potential's logarithm taken out and integrated exactly there).
Kernel panel_integral(const Panel& p, double rho, double z, double nr, double nz, const std::optional<double>& plane,
                      bool own) {
    if (own) {
        Kernel k = piece_integral(p, 0, 0.5, rho, z, nr, nz, std::nullopt);
        const Kernel k2 = piece_integral(p, 0.5, 1, rho, z, nr, nz, std::nullopt);
        k.phi += k2.phi;
        k.e_n += k2.e_n;
        // 2 pi rho phi ~ -2 ln|t| near t = 0 (t the distance along the panel): add 2 ln|t| under the
        // integral (at the same points), subtract its exact integral, 2 x 2 h (ln h - 1), h = L / 2.
        const double h = 0.5 * p.length;
        double log_sum = 0;
        for (int g = 0; g < 8; ++g) log_sum += gauss_w[g] * std::log(h * 0.5 * (1 + gauss_x[g]));
        k.phi += 2 * 2 * (0.5 * h) * log_sum - 2 * 2 * h * (std::log(h) - 1);
        if (plane) {
            Panel image = p;
            image.z0 = 2 * *plane - p.z0;
            image.z1 = 2 * *plane - p.z1;
            image.cz = 2 * *plane - p.cz;
            image.t0 = -p.t0;
            image.gauss_r = {};  // its points are the mirror of the kept ones: taken afresh
            image.t1 = -p.t1;
            const Kernel i = piece_integral(image, 0, 1, rho, z, nr, nz, std::nullopt);
            k.phi -= i.phi;
            k.e_n -= i.e_n;
        }
        return k;
    }
    if (is_far(distance(p, rho, z) / p.length)) return far_integral(p, rho, z, nr, nz, plane);
    if (distance(p, rho, z) > 1.5 * p.length) return piece_integral(p, 0, 1, rho, z, nr, nz, plane);
    Kernel k;
    for (int s = 0; s < 4; ++s) {
        const Kernel ks = piece_integral(p, s / 4.0, (s + 1) / 4.0, rho, z, nr, nz, plane);
        k.phi += ks.phi;
        k.e_n += ks.e_n;
    }
    return k;
}

// The panel's area, 2 pi integral rho dl (exact for a straight panel, Gauss-Legendre on an arc).
double piece_integral_area(const Panel& p) {
    double sum = 0;
    for (int g = 0; g < 8; ++g) sum += gauss_w[g] * p.at(0.5 * (1 + gauss_x[g]))[0];
    return 2 * pi * 0.5 * p.length * sum;
}

// The factor a dielectric face's entry takes of the normal field (entry_of).
double field_scale(const Panel& t) { return -t.lambda / (2 * pi); }

// An entry of the system's matrix, panel `t`'s row and panel `s`'s column: conductor rows give the
// potential (times 4 pi eps0), dielectric rows sigma - (lambda / 2 pi) E_n (times 4 pi eps0).
double entry_of(const Panel& t, const Kernel& k, bool own) {
    return t.dielectric ? (own ? 1.0 : 0.0) + field_scale(t) * k.e_n : k.phi;
}

double system_entry(const Panel& t, const Panel& s, bool own, const std::optional<double>& plane) {
    return entry_of(t, panel_integral(s, t.rc, t.zc, t.nr, t.nz, plane, own), own);
}

// Panel t's row against the panels s[0 .. n) (s[own] t itself, if own < n): system_entry's figures. Without a
// ground plane the far panels' points (far_points' rule for each) are streamed through ring_fields eight at
// a time, whichever panels they belong to, so that the elliptic integrals of eight rings interleave.
template <class Row>
void system_row(const Panel& t, const Panel* s, Eigen::Index n, Eigen::Index own, const std::optional<double>& plane, Row&& row) {
    double a[8], zs[8], w[8];
    Eigen::Index column[8];
    int queued = 0;
    // An entry is linear in its kernel (entry_of): each point adds its share to its panel's entry.
    const double scale = t.dielectric ? field_scale(t) : 0.0;
    const auto flush = [&] {
        for (int g = queued; g < 8; ++g) a[g] = a[0], zs[g] = zs[0], w[g] = 0, column[g] = column[0];  // padding, weight 0
        RingField f[8];
        ring_fields<8>(a, zs, t.rc, t.zc, f);
        for (int g = 0; g < 8; ++g) {
            const double weight = w[g] * 2 * pi * a[g];
            row(column[g]) += weight * (t.dielectric ? scale * (f[g].e_rho * t.nr + f[g].e_z * t.nz) : f[g].phi);
        }
        queued = 0;
    };
    for (Eigen::Index j = 0; j < n; ++j) {
        const Panel& q = s[j];
        const double ratio = distance(q, t.rc, t.zc) / q.length;
        if (plane || j == own || !is_far(ratio)) {
            row(j) = system_entry(t, q, j == own, plane);
            continue;
        }
        row(j) = 0;
        const int points = detail::far_points(ratio), first = detail::far_first(points);
        for (int g = 0; g < points; ++g) {
            a[queued] = q.far_r[static_cast<std::size_t>(first + g)];
            zs[queued] = q.far_z[static_cast<std::size_t>(first + g)];
            w[queued] = far_w[first + g] * 0.5 * q.length;
            column[queued] = j;
            if (++queued == 8) flush();
        }
    }
    if (queued > 0) flush();
}

// The block of the periodic row's system for cells d apart: the cell's panels (rows) against its own moved
// by d periods (columns).
void row_block(const std::vector<Panel>& one, int d, double period, Matrix& block) {
    const auto p = static_cast<Eigen::Index>(one.size());
    std::vector<Panel> moved(one.size());
    for (std::size_t j = 0; j < one.size(); ++j) moved[j] = shifted(one[j], d * period);
    for (Eigen::Index i = 0; i < p; ++i) {
        system_row(one[static_cast<std::size_t>(i)], moved.data(), p, d == 0 ? i : p, std::nullopt, [&](Eigen::Index j) -> double& { return block(i, j); });
    }
}

// The periodic row's system solved where the cell mirrors about its middle (`image`: each panel's mirror
// image): the row then mirrors about its own, cell k and panel i onto cell n - 1 - k and panel image[i],
// and the system commutes with that exchange. Split into the parts even and odd under it, it is two systems
// of half the size (an eighth of the factoring each), and the blocks for negative offsets are the positive
// ones' mirror images (half the integration): B_-d(i, j) = B_d(image[i], image[j]).
Matrix solve_mirrored_row(const std::vector<Panel>& one, const std::vector<std::size_t>& image, int cells, double period, const Matrix& rhs) {
    const auto p = static_cast<Eigen::Index>(one.size()), m = p * cells, h = m / 2;
    std::vector<Matrix> blocks(static_cast<std::size_t>(cells), Matrix(p, p));
    for (int d = 0; d < cells; ++d) row_block(one, d, period, blocks[static_cast<std::size_t>(d)]);
    const auto cell_of = [&](Eigen::Index u) { return u / p; };
    const auto panel_of = [&](Eigen::Index u) { return static_cast<std::size_t>(u % p); };
    const auto mirror = [&](Eigen::Index u) { return (cells - 1 - cell_of(u)) * p + static_cast<Eigen::Index>(image[panel_of(u)]); };
    const auto entry = [&](Eigen::Index u, Eigen::Index v) {
        const Eigen::Index d = cell_of(v) - cell_of(u);
        const Matrix& b = blocks[static_cast<std::size_t>(std::abs(d))];
        return d >= 0 ? b(static_cast<Eigen::Index>(panel_of(u)), static_cast<Eigen::Index>(panel_of(v)))
                      : b(static_cast<Eigen::Index>(image[panel_of(u)]), static_cast<Eigen::Index>(image[panel_of(v)]));
    };
    // One unknown of each mirror pair (no panel is its own image, so they pair off).
    std::vector<Eigen::Index> kept;
    for (Eigen::Index u = 0; u < m; ++u) {
        if (u < mirror(u)) kept.push_back(u);
    }
    std::vector<double> once_even, once_odd;
    struct Even;
    struct Odd;
    Eigen::Map<Matrix> even = detail::kept_matrix<double, Even>(h, once_even), odd = detail::kept_matrix<double, Odd>(h, once_odd);
    Matrix b_even(h, rhs.cols()), b_odd(h, rhs.cols());
    for (Eigen::Index a = 0; a < h; ++a) {
        const Eigen::Index u = kept[static_cast<std::size_t>(a)];
        for (Eigen::Index b = 0; b < h; ++b) {
            const Eigen::Index v = kept[static_cast<std::size_t>(b)];
            const double direct = entry(u, v), across = entry(u, mirror(v));
            even(a, b) = direct + across;
            odd(a, b) = direct - across;
        }
        b_even.row(a) = rhs.row(u) + rhs.row(mirror(u));
        b_odd.row(a) = rhs.row(u) - rhs.row(mirror(u));
    }
    const Matrix s = Eigen::PartialPivLU<Eigen::Ref<Matrix>>(even).solve(b_even);
    const Matrix t = Eigen::PartialPivLU<Eigen::Ref<Matrix>>(odd).solve(b_odd);
    Matrix sigma(m, rhs.cols());
    for (Eigen::Index a = 0; a < h; ++a) {
        const Eigen::Index u = kept[static_cast<std::size_t>(a)];
        sigma.row(u) = 0.5 * (s.row(a) + t.row(a));
        sigma.row(mirror(u)) = 0.5 * (s.row(a) - t.row(a));
    }
    return sigma;
}

Matrix solve_system(const std::vector<Panel>& panels, const std::optional<double>& plane, const Matrix& rhs) {
    const auto m = static_cast<Eigen::Index>(panels.size());
    return detail::solve_in_place(m, rhs, [&](Eigen::Map<Matrix>& a) {
        for (Eigen::Index i = 0; i < m; ++i) {
            system_row(panels[static_cast<std::size_t>(i)], panels.data(), m, i, plane, [&](Eigen::Index j) -> double& { return a(i, j); });
        }
    });
}

// The free charge on the conductor groups (each panel's `group`) from the panels' solved densities (rows of
// sigma), symmetrised.
std::vector<double> charge_matrix(const std::vector<Panel>& panels, const Matrix& sigma, int groups) {
    Matrix c = Matrix::Zero(groups, groups);
    for (std::size_t i = 0; i < panels.size(); ++i) {
        const Panel& p = panels[i];
        if (p.dielectric || p.group < 0) continue;
        c.row(p.group) += p.charge_scale * piece_integral_area(p) * sigma.row(static_cast<Eigen::Index>(i));
    }
    c = (0.5 * (c + c.transpose())).eval();
    std::vector<double> out(static_cast<std::size_t>(groups * groups));
    for (int i = 0; i < groups; ++i) {
        for (int j = 0; j < groups; ++j) out[static_cast<std::size_t>(i * groups + j)] = finite_result("group capacitance", c(i, j));
    }
    return out;
}

}  // namespace

std::vector<double> ring_potential_reaction(const std::vector<ChargeRing>& rings, const ChargeScene& scene, int* count) {
    for (const DielectricBody& d : scene.dielectrics) {
        for (const ChargeRing& r : rings) {
            if (inside(d.outline, r.radius, r.z)) {
                throw InputError("rings", "a ring at radius " + std::to_string(r.radius) + " m, height " + std::to_string(r.z) +
                                              " m lies inside a dielectric; rings must lie in the background");
            }
        }
    }
    for (const ConductorBody& c : scene.conductors) {
        if (c.group != -1) throw InputError("conductors.group", std::to_string(c.group) + "; around rings every conductor is grounded (-1)");
    }
    const std::vector<Panel> panels = panels_of(scene, rings);
    if (count) *count = static_cast<int>(panels.size());
    const auto n = static_cast<Eigen::Index>(rings.size());
    std::vector<double> out(static_cast<std::size_t>(n * n), 0.0);
    if (panels.empty()) return out;
    const auto m = static_cast<Eigen::Index>(panels.size());
    const std::optional<double>& plane = scene.ground_plane;
    // Right-hand sides: each ring's potential (conductor rows, moved across) or normal field (dielectric
    // rows) at the panels, and the panels' potential at each ring's centre.
    Matrix rhs(m, n), back(n, m);
    for (Eigen::Index i = 0; i < m; ++i) {
        const Panel& t = panels[static_cast<std::size_t>(i)];
        for (Eigen::Index k = 0; k < n; ++k) {
            const ChargeRing& r = rings[static_cast<std::size_t>(k)];
            RingField f = ring_field(r.radius, r.z, t.rc, t.zc);
            if (plane) {
                const RingField g = ring_field(r.radius, 2 * *plane - r.z, t.rc, t.zc);
                f.phi -= g.phi;
                f.e_rho -= g.e_rho;
                f.e_z -= g.e_z;
            }
            rhs(i, k) = t.dielectric ? t.lambda / (2 * pi) * (f.e_rho * t.nr + f.e_z * t.nz) : -f.phi;
            back(k, i) = panel_integral(t, r.radius, r.z, 0, 0, plane, false).phi;
        }
    }
    const Matrix sigma = solve_system(panels, plane, rhs);
    Matrix reaction = back * sigma / (4 * pi * eps0 * scene.background_permittivity);
    reaction = (0.5 * (reaction + reaction.transpose())).eval();  // reciprocal up to the discretisation
    for (Eigen::Index i = 0; i < n; ++i) {
        for (Eigen::Index j = 0; j < n; ++j) out[static_cast<std::size_t>(i * n + j)] = finite_result("ring potential reaction", reaction(i, j));
    }
    return out;
}

std::vector<double> group_capacitance(const ChargeScene& scene, int groups, int* count) {
    if (groups < 1) throw InputError("groups", std::to_string(groups) + "; expected 1 or more");
    const std::vector<Panel> panels = panels_of(scene, {});
    if (count) *count = static_cast<int>(panels.size());
    const auto m = static_cast<Eigen::Index>(panels.size());
    Matrix rhs = Matrix::Zero(m, groups);
    std::vector<bool> seen(static_cast<std::size_t>(groups), false);
    for (Eigen::Index i = 0; i < m; ++i) {
        const Panel& p = panels[static_cast<std::size_t>(i)];
        if (p.dielectric || p.group < 0) continue;
        if (p.group >= groups) throw InputError("conductors.group", std::to_string(p.group) + "; expected below " + std::to_string(groups));
        rhs(i, p.group) = 4 * pi * eps0;  // 1 V
        seen[static_cast<std::size_t>(p.group)] = true;
    }
    for (int g = 0; g < groups; ++g) {
        if (!seen[static_cast<std::size_t>(g)]) throw InputError("conductors.group", std::to_string(g) + " has no conductor");
    }
    const Matrix sigma = solve_system(panels, scene.ground_plane, rhs);
    return charge_matrix(panels, sigma, groups);
}

std::vector<double> periodic_group_capacitance(const ChargeScene& cell, int cells, double period, int* count) {
    if (cells < 1) throw InputError("cells", std::to_string(cells) + "; expected 1 or more");
    require_positive("period", period);
    if (cell.ground_plane) throw InputError("ground_plane", "a periodic row lies in free space");
    if (cell.conductors.empty()) throw InputError("conductors", "the cell has no conductor");
    for (const ConductorBody& c : cell.conductors) {
        if (c.group != 0) throw InputError("conductors.group", std::to_string(c.group) + "; a cell's conductors are its group 0");
    }
    // The copies may touch, not overlap: the cell's height is at most the period.
    double low = std::numeric_limits<double>::infinity(), high = -low;
    const auto extent = [&](const Outline& o) {
        for (const auto& v : o) {
            low = std::min(low, v[1]);
            high = std::max(high, v[1]);
        }
    };
    for (const ConductorBody& c : cell.conductors) extent(c.outline);
    for (const DielectricBody& d : cell.dielectrics) extent(d.outline);
    if (high - low > period * (1 + 1e-12)) {
        throw InputError("period", std::to_string(period) + " m is less than the cell's height " + std::to_string(high - low) + " m: the copies would overlap");
    }
    const std::vector<Panel> one = panels_of(cell, {});
    const auto p = static_cast<Eigen::Index>(one.size()), m = p * cells;
    if (m > 20000) throw InputError("panels", std::to_string(m) + "; the charge solver takes at most 20000");
    if (count) *count = static_cast<int>(m);
    std::vector<Panel> panels;  // the whole row, cell k's conductors group k
    panels.reserve(static_cast<std::size_t>(m));
    Matrix rhs = Matrix::Zero(m, cells);
    for (int k = 0; k < cells; ++k) {
        for (const Panel& q : one) {
            Panel& copy = panels.emplace_back(shifted(q, k * period));
            if (q.dielectric) continue;
            copy.group = k;
            rhs(static_cast<Eigen::Index>(panels.size()) - 1, k) = 4 * pi * eps0;  // 1 V on cell k
        }
    }
    const std::optional<std::vector<std::size_t>> image = detail::mirror_images(one);
    const Matrix sigma = image ? solve_mirrored_row(one, *image, cells, period, rhs) : detail::solve_in_place(m, rhs, [&](Eigen::Map<Matrix>& a) {
        // Cell k's row against cell k + d's column: the cell's panels against its own moved by d periods.
        Matrix block(p, p);
        for (int d = 1 - cells; d < cells; ++d) {
            row_block(one, d, period, block);
            for (int k = std::max(0, -d); k < cells && k + d < cells; ++k) a.block(k * p, (k + d) * p, p, p) = block;
        }
    });
    return charge_matrix(panels, sigma, cells);
}

}  // namespace libcoil
