#include "libcoil/models/turn_network.hpp"

#include <algorithm>
#include <cmath>

#include <Eigen/Dense>
#include <boost/math/quadrature/gauss_kronrod.hpp>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/axisymmetric_charge.hpp"
#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/models/shield.hpp"
#include "models/elliptic.hpp"
#include "models/recent_results.hpp"
#include "models/turn_filaments.hpp"

namespace libcoil {

namespace {

using Matrix = Eigen::MatrixXd;
using ComplexMatrix = Eigen::MatrixXcd;

// The potential at (rho, z) of a unit charge spread evenly round a ring of radius a at z = 0, V/C.
double ring_potential(double a, double rho, double z) {
    const double s2 = (a + rho) * (a + rho) + z * z;
    const double m = 4 * a * rho / s2;
    const double kc = std::sqrt(((a - rho) * (a - rho) + z * z) / s2);
    const double k = detail::elliptic_k_and_k_minus_e_over_m(kc, m).k;
    return 1 / (4 * pi * eps0) * (2 / pi) * k / std::sqrt(s2);
}

// A ring's potential on its own wire surface, averaged round the wire.
double own_potential(double a, double r) {
    constexpr int points = 16;
    double sum = 0;
    for (int i = 0; i < points; ++i) {
        const double t = 2 * pi * (i + 0.5) / points;
        sum += ring_potential(a, a + r * std::cos(t), r * std::sin(t));
    }
    return sum / points;
}

// The azimuth-average of 1 / R between two points of a cylinder of radius a an axial distance z apart, with
// the thin-wire reduced kernel (z^2 + r^2 for z^2): (2 / pi) K(m) / sqrt(4 a^2 + z^2), m = 4 a^2 / (4 a^2 + z^2).
double mean_inverse_distance(double a, double z, double r) {
    const double z2 = z * z + r * r, s2 = 4 * a * a + z2;
    const double k = detail::elliptic_k_and_k_minus_e_over_m(std::sqrt(z2 / s2), 4 * a * a / s2).k;
    return (2 / pi) * k / std::sqrt(s2);
}

// The partial mutual inductance of two axial current sheets on the cylinder (radius a), each `length` long
// with uniform current, their centres `offset` apart: mu0 / 4 pi times the double integral of the
// azimuth-averaged 1 / R, by Gauss-Legendre (16 points where they overlap or touch, else 8).
double axial_mutual(double a, double length, double offset, double r) {
    static constexpr double x8[] = {0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363};
    static constexpr double w8[] = {0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763};
    static constexpr double x16[] = {0.0950125098376374, 0.2816035507792589, 0.4580167776572274, 0.6178762444026438,
                                     0.7554044083550030, 0.8656312023878318, 0.9445750230732326, 0.9894009349916499};
    static constexpr double w16[] = {0.1894506104550685, 0.1826034150449236, 0.1691565193950025, 0.1495959888165767,
                                     0.1246289712555339, 0.0951585116824928, 0.0622535239386479, 0.0271524594117541};
    const bool near = std::fabs(offset) < 2.5 * length;
    const double* x = near ? x16 : x8;
    const double* w = near ? w16 : w8;
    const int half = near ? 8 : 4;
    double sum = 0;
    for (int i = 0; i < 2 * half; ++i) {
        const double xi = i < half ? -x[i] : x[i - half], wi = w[i < half ? i : i - half];
        for (int j = 0; j < 2 * half; ++j) {
            const double xj = j < half ? -x[j] : x[j - half], wj = w[j < half ? j : j - half];
            sum += wi * wj * mean_inverse_distance(a, offset + (xj - xi) * length / 2, r);
        }
    }
    return mu0 / (4 * pi) * sum * length * length / 4;
}

// The potential coefficient of the n-th harmonic of a ring's charge: the potential sin(n t) x H per unit
// density sin(n phi) (C/m) on a ring of radius a, seen on a ring an axial distance z away:
// H = (a / 4 pi eps0) integral_0^2pi cos(n psi) / R(psi) d psi, R^2 = 2 a^2 (1 - cos psi) + z^2 (+ r^2 on
// its own ring, the reduced kernel). Gauss-Kronrod, adaptive, over [0, pi] twice (the integrand is even).
double harmonic_potential(double a, double z, double r, int n) {
    const double z2 = z * z + r * r;
    const auto g = [&](double psi) { return std::cos(n * psi) / std::sqrt(2 * a * a * (1 - std::cos(psi)) + z2); };
    const double integral = 2 * boost::math::quadrature::gauss_kronrod<double, 31>::integrate(g, 0.0, pi, 12, 1e-11);
    return a / (4 * pi * eps0) * integral;
}

// How many harmonics of the charge along each turn the network holds beyond its mean (the turn's
// potential runs linearly from one end node to the other; its sawtooth's harmonics fall as 1 / n).
constexpr int charge_harmonics = 3;

// The wire-surface capacitance: sides of each wire's circle before refinement towards its neighbours, and
// the most turns it takes (its dense solve grows as the cube of the panels, about 40 a turn).
constexpr int wire_surface_sides = 16;
constexpr int max_wire_surface_turns = 120;
constexpr int section_turns = 7;  // the near-field correction's section

// The branches' impedance matrix at w: j w L, with the series R and L spread evenly over the turns.
ComplexMatrix branch_impedance(const Eigen::Map<const Matrix>& l, double w, double series_resistance, double series_inductance) {
    using C = std::complex<double>;
    const auto n = static_cast<double>(l.rows());
    ComplexMatrix zb = C(0, w) * l.cast<C>();
    zb.diagonal().array() += C(series_resistance / n, w * series_inductance / n);
    return zb;
}

Matrix incidence(int n) {  // branch k runs from node k to node k + 1
    Matrix b = Matrix::Zero(n, n + 1);
    for (int k = 0; k < n; ++k) {
        b(k, k) = 1;
        b(k, k + 1) = -1;
    }
    return b;
}

// The former as a dielectric body: a tube from the form radius inwards (a rod where the wall reaches the
// axis), `ends` beyond the winding; ribs as a tube of their averaged permittivity.
std::optional<DielectricBody> former_body(const Solenoid& coil, const TurnNetworkOptions& o, double z_first, double z_last,
                                         std::optional<double> plane) {
    const FormerDielectric& fd = o.former;
    if (!(fd.wall > 0)) return std::nullopt;
    require_at_least("former.relative_permittivity", fd.relative_permittivity, 1.0, "a relative permittivity");
    require_non_negative("former_ends", o.former_ends);
    const double fill = fd.fill > 0 ? std::min(1.0, fd.fill) : 1.0;
    const double eps = o.relative_permittivity + (fd.relative_permittivity - o.relative_permittivity) * fill;
    if (!(eps > o.relative_permittivity)) return std::nullopt;
    const double outer = coil.form_diameter() / 2, inner = std::max(0.0, outer - fd.wall);
    if (!(outer > 0)) return std::nullopt;
    const double half_pitch = 0.5 * coil.pitch();
    // Standing on a ground plane, the former stands on it.
    const double bottom = plane ? *plane : z_first - half_pitch - o.former_ends;
    return DielectricBody{tube_outline(inner, outer, bottom, z_last + half_pitch + o.former_ends), eps, {}};
}

// One turn's wire surface at height z (ring radius a, wire radius r, enamel to `coat`): its circle a conductor
// of group `group`, its enamel a dielectric shell, both refined towards the wires at `near`.
void add_wire_surface(ChargeScene& scene, double a, double z, double r, double coat, double enamel, int group,
                      const std::vector<std::array<double, 3>>& near, int sides) {
    const double embed = coat > r ? enamel : 0.0;
    scene.conductors.push_back({circle_outline(a, z, r, sides, near), true, group, embed, std::array<double, 3>{a, z, r}});
    if (coat > r) scene.dielectrics.push_back({circle_outline(a, z, coat, sides, near), enamel, std::array<double, 3>{a, z, coat}});
    scene.min_panel = 0.02 * r;
}

// The wire-surface scene of turns at heights `z`: each wire's circle a conductor of its own, its enamel a
// dielectric shell, refined towards its neighbours (and its image in a ground plane).
void add_wire_surfaces(ChargeScene& scene, const std::vector<double>& z, double a, double r, double coat, double enamel,
                       std::optional<double> plane, int sides) {
    const int n = static_cast<int>(z.size());
    for (int k = 0; k < n; ++k) {
        const double zk = z[static_cast<std::size_t>(k)];
        std::vector<std::array<double, 3>> near;
        for (int j : {k - 1, k + 1}) {
            if (j >= 0 && j < n) near.push_back({a, z[static_cast<std::size_t>(j)], coat});
        }
        if (plane) near.push_back({a, 2 * *plane - zk, coat});
        add_wire_surface(scene, a, zk, r, coat, enamel, k, near, sides);
    }
}

// The near-field correction: on a section of `section_turns` turns in free space, the wire-surface Maxwell
// matrix less the thin-wire one. The difference is local (the charge crowding towards the neighbours, the
// enamel between them) and falls off within a few turns.
Matrix solve_near_field_correction(double a, double r, double coat, double pitch, const TurnNetworkOptions& o, int section_turns) {
    // One turn, refined towards a neighbour on either side (the end turns too: their open side gets panels
    // it would not need, and every turn the same ones), repeated along the section, whose system then
    // depends only on the offset between turns (periodic_group_capacitance).
    ChargeScene cell;
    cell.background_permittivity = o.relative_permittivity;
    cell.max_panel = pitch;
    std::vector<std::array<double, 3>> near;
    if (section_turns > 1) near = {{a, -pitch, coat}, {a, pitch, coat}};
    // 16 sides as the reference: 12 or 8 save a quarter of the time and widen the error against the
    // reference to +0.6 or +1.2 % (measured).
    add_wire_surface(cell, a, 0, r, coat, o.enamel_permittivity, 0, near, wire_surface_sides);
    const std::vector<double> c = periodic_group_capacitance(cell, section_turns, pitch);
    Matrix thin(section_turns, section_turns);
    for (int i = 0; i < section_turns; ++i) {
        for (int j = 0; j < section_turns; ++j) {
            thin(i, j) = (i == j ? own_potential(a, r) : ring_potential(a, a, (i - j) * pitch)) / o.relative_permittivity;
        }
    }
    return Eigen::Map<const Matrix>(c.data(), section_turns, section_turns) - thin.llt().solve(Matrix::Identity(section_turns, section_turns));
}

// The same, remembered (recent_results.hpp): one analysis asks for the same section several times (the coil
// bare, in its shield, swept), and so does a search's confirmation.
Matrix near_field_correction(double a, double r, double coat, double pitch, const TurnNetworkOptions& o, int section_turns) {
    using Key = std::array<double, 7>;
    const Key key{a, r, coat, pitch, o.relative_permittivity, o.enamel_permittivity, static_cast<double>(section_turns)};
    thread_local detail::RecentResults<Key, Matrix> recent;
    if (const Matrix* m = recent.find(key)) return *m;
    Matrix m = solve_near_field_correction(a, r, coat, pitch, o, section_turns);
    recent.add(key, m);
    return m;
}

// The bodies' reaction on the rings (ring_potential_reaction), remembered: a design search confirms its chosen
// design on its former, with the build's spread, then analyses it and asks for the same coils on the same
// former again (2026-12-04: 7 of the dense grid's 70 reactions, about 20 ms). A reaction over 1 MB is not kept.
std::vector<double> remembered_reaction(const std::vector<ChargeRing>& rings, const ChargeScene& scene, int* panels) {
    using Key = std::pair<std::vector<ChargeRing>, ChargeScene>;
    using Value = std::pair<std::vector<double>, int>;  // the reaction and its panels
    thread_local detail::RecentResults<Key, Value> recent;
    Key key{rings, scene};
    Value found;
    if (const Value* kept = recent.find(key)) {
        found = *kept;
    } else {
        found.first = ring_potential_reaction(rings, scene, &found.second);
        if (found.first.size() * sizeof(double) <= (1u << 20)) recent.add(std::move(key), found);
    }
    if (panels) *panels = found.second;
    return std::move(found.first);
}

// A shield as a grounded conductor: its wall an open sheet at the inner radius (its two faces' charge
// together), with the end discs where it has them; centred on the winding less its axial offset.
ConductorBody shield_body(const ShieldSpec& s, const Solenoid& coil) {
    if (!(s.inner_diameter > coil.outer_diameter())) {
        throw InputError("shield.inner_diameter", "does not clear the winding");
    }
    require_positive("shield.length", s.length);
    const double b = s.inner_diameter / 2, lo = s.axial_offset - s.length / 2, hi = s.axial_offset + s.length / 2;
    ConductorBody c;
    c.closed = false;
    c.outline = s.end_discs ? Outline{{0, lo}, {b, lo}, {b, hi}, {0, hi}} : Outline{{b, lo}, {b, hi}};
    return c;
}

// The turns' Maxwell capacitance matrix: the thin-wire potential coefficients `p` (with the former's
// reaction added) inverted, with or without the near-field correction; or the whole wire-surface solution.
Matrix turn_capacitance_matrix(const Solenoid& coil, const TurnNetworkOptions& o, const detail::TurnFilaments& f, Matrix p,
                               double plane, bool grounded, int* panels) {
    const int n = static_cast<int>(f.z.size());
    const double a = f.radius, r = coil.wire().radius(), pitch = n > 1 ? f.z[1] - f.z[0] : coil.pitch();
    const double coat = coil.wire().insulated_diameter() / 2;
    ChargeScene scene;
    scene.background_permittivity = o.relative_permittivity;
    if (grounded) scene.ground_plane = plane;
    if (auto body = former_body(coil, o, f.z.front(), f.z.back(), scene.ground_plane)) scene.dielectrics.push_back(*body);
    if (o.shield) scene.conductors.push_back(shield_body(*o.shield, coil));
    scene.max_panel = std::max(pitch, coil.mean_diameter() / 8);
    if (o.capacitance != TurnCapacitance::wire_surface) {
        if (!scene.dielectrics.empty() || !scene.conductors.empty()) {
            std::vector<ChargeRing> rings;
            for (double z : f.z) rings.push_back({a, z, coat});
            // Measured: within 0.2 % of r / 10 on the SRF, at a twentieth of the cost. Not coarser: a panel
            // much longer than its distance to a wire that touches it integrates that wire's field badly
            // (a 400th of the winding for 600 turns put the SRF at 2.6 times its value).
            scene.min_panel = r;
            const std::vector<double> reaction = remembered_reaction(rings, scene, panels);
            p += Eigen::Map<const Matrix>(reaction.data(), n, n);
        }
        Matrix c = p.llt().solve(Matrix::Identity(n, n));
        if (o.capacitance == TurnCapacitance::near_field_corrected) {
            // Each turn takes the section's row of the turn in the same place: the first and last turns
            // the section's ends, the others its middle; offsets beyond the section's reach are left out.
            // A coil of up to 7 turns is its own section. The section's wires lie at the coil's pitch: the
            // rings of a fractional N lie closer (N / ceil N of it), where wires of the insulated diameter
            // would overlap, and the crowding between neighbours is the true winding's.
            const int m = std::min(n, section_turns), half = m / 2;
            const Matrix d = near_field_correction(a, r, coat, coil.pitch(), o, m);
            Matrix add = Matrix::Zero(n, n);
            for (int i = 0; i < n; ++i) {
                const int si = i < half ? i : (i >= n - half ? i - (n - m) : half);
                for (int sj = 0; sj < m; ++sj) {
                    const int j = i + (sj - si);
                    if (j >= 0 && j < n) add(i, j) = d(si, sj);
                }
            }
            c += 0.5 * (add + add.transpose());
        }
        return c;
    }
    if (!scene.dielectrics.empty() || !scene.conductors.empty()) {
        throw InputError("capacitance", "wire-surface with a former or a shield: the wires' contact with the former is not resolved; "
                                        "take near-field-corrected (the former on the thin wires)");
    }
    if (n > max_wire_surface_turns) {
        throw InputError("turns", std::to_string(n) + "; the wire-surface capacitance takes at most " + std::to_string(max_wire_surface_turns));
    }
    add_wire_surfaces(scene, f.z, a, r, coat, o.enamel_permittivity, grounded ? std::optional<double>(plane) : std::nullopt,
                      wire_surface_sides);
    const std::vector<double> c = group_capacitance(scene, n, panels);
    return Eigen::Map<const Matrix>(c.data(), n, n);
}

}  // namespace

double ring_capacitance(double a, double r) {
    require_positive("ring_radius", a);
    require_positive("wire_radius", r);
    if (!(r < a)) throw InputError("wire_radius", "must be below the ring's radius");
    return finite_result("ring capacitance", 1 / own_potential(a, r));
}

TurnNetwork::TurnNetwork(const Solenoid& coil, const TurnNetworkOptions& o) : mounting_(o.mounting) {
    require_at_least("relative_permittivity", o.relative_permittivity, 1.0, "a medium's relative permittivity is 1 or more");
    const detail::TurnFilaments f = detail::turn_filaments(coil);
    const double a = f.radius, r = coil.wire().radius(), w = f.weight;
    if (!(r < a)) throw InputError("wire.diameter", "the wire is wider than the coil's radius");
    n_ = static_cast<int>(f.z.size());
    if (n_ > 2000) throw InputError("turns", std::to_string(n_) + " turns; the turn network takes at most 2000");
    const bool grounded = o.mounting == Mounting::grounded_end;
    const bool plane_images = grounded && !o.shield;  // in a shield, the grounded end is on the shield
    const double base = o.base_height < 0 ? coil.pitch() / 2 : o.base_height;
    if (plane_images) require_positive("base_height", base);
    const double plane = f.z.front() - base;  // the ground plane's height
    // The rings are evenly spaced, so every term depends on the offset i - j (free space) or on i + j (the
    // images): each is computed once. A turn's current also advances along the axis by the pitch, an axial
    // sheet segment of the winding's length over the rings; it couples only to other axial segments.
    const double step = n_ > 1 ? f.z[1] - f.z[0] : coil.winding_length();
    const auto z_of = [&](int i) { return f.z[static_cast<std::size_t>(i)]; };
    std::vector<double> ring_l(static_cast<std::size_t>(n_)), axial_l(static_cast<std::size_t>(n_)), ring_p(static_cast<std::size_t>(n_));
    for (int k = 0; k < n_; ++k) {
        const double dz = k * step;
        ring_l[static_cast<std::size_t>(k)] = k == 0 ? mu0 * a * (std::log(8 * a / r) - 2) : coaxial_mutual_inductance(a, a, dz);
        ring_p[static_cast<std::size_t>(k)] = k == 0 ? own_potential(a, r) : ring_potential(a, a, dz);
        axial_l[static_cast<std::size_t>(k)] = axial_mutual(a, step, dz, r);
    }
    std::vector<double> image_ring_l, image_axial_l, image_p;  // by i + j
    if (plane_images) {
        for (int s2 = 0; s2 <= 2 * (n_ - 1); ++s2) {
            const double di = 2 * z_of(0) + s2 * step - 2 * plane;  // z_i + z_j - 2 plane
            // Horizontal (ring) currents image reversed, vertical (axial) ones in the same sense; charges reversed.
            image_ring_l.push_back(-coaxial_mutual_inductance(a, a, di));
            image_axial_l.push_back(axial_mutual(a, step, di, r));
            image_p.push_back(-ring_potential(a, a, di));
        }
    }
    Matrix l(n_, n_), p(n_, n_);
    for (int i = 0; i < n_; ++i) {
        for (int j = 0; j < n_; ++j) {
            const auto k = static_cast<std::size_t>(std::abs(i - j));
            double lij = w * w * ring_l[k] + axial_l[k], pij = ring_p[k];
            if (plane_images) {
                const auto s2 = static_cast<std::size_t>(i + j);
                lij += w * w * image_ring_l[s2] + image_axial_l[s2];
                pij += image_p[s2];
            }
            l(i, j) = lij;
            p(i, j) = pij / o.relative_permittivity;
        }
    }
    if (o.shield) {  // the wall's surface currents, as a perfect conductor
        const std::vector<double> dl = shield_turn_inductance_change(coil, *o.shield);
        l += Eigen::Map<const Matrix>(dl.data(), n_, n_);
    }
    const Matrix turn_c = turn_capacitance_matrix(coil, o, f, p, plane, plane_images, &panels_);
    turn_c_.assign(turn_c.data(), turn_c.data() + turn_c.size());
    Matrix avg = Matrix::Zero(n_, n_ + 1);  // a turn's potential: the mean of its end nodes'
    for (int k = 0; k < n_; ++k) avg(k, k) = avg(k, k + 1) = 0.5;
    Matrix cn = avg.transpose() * turn_c * avg;
    // The potential along a turn runs linearly between its end nodes: its sawtooth about the mean has the
    // harmonics -(V_k+1 - V_k) sin(n phi) / (n pi), and each raises the charge sin(n phi) H_n^-1 on the
    // turns. Their energy adds (a / (pi n^2)) B^T H_n^-1 B to the node capacitances.
    const Matrix b = incidence(n_);
    for (int h = 1; h <= charge_harmonics; ++h) {
        std::vector<double> by_offset(static_cast<std::size_t>(n_)), by_sum;
        for (int k = 0; k < n_; ++k) by_offset[static_cast<std::size_t>(k)] = harmonic_potential(a, k * step, k == 0 ? r : 0.0, h);
        if (plane_images) {
            for (int s2 = 0; s2 <= 2 * (n_ - 1); ++s2) by_sum.push_back(-harmonic_potential(a, 2 * z_of(0) + s2 * step - 2 * plane, 0.0, h));
        }
        Matrix hm(n_, n_);
        for (int i = 0; i < n_; ++i) {
            for (int j = 0; j < n_; ++j) {
                double v = by_offset[static_cast<std::size_t>(std::abs(i - j))];
                if (plane_images) v += by_sum[static_cast<std::size_t>(i + j)];
                hm(i, j) = v / o.relative_permittivity;
            }
        }
        cn += a / (pi * h * h) * b.transpose() * hm.llt().solve(b);
    }
    if (grounded) cn = cn.bottomRightCorner(n_, n_).eval();  // node 0 is ground
    require_non_negative("terminal_capacitance", o.terminal_capacitance);
    if (o.terminal_capacitance > 0) {
        const Eigen::Index last = cn.rows() - 1;
        cn(last, last) += o.terminal_capacitance;
        if (!grounded) {
            cn(0, 0) += o.terminal_capacitance;
            cn(0, last) -= o.terminal_capacitance;
            cn(last, 0) -= o.terminal_capacitance;
        }
    }
    l_.assign(l.data(), l.data() + l.size());
    c_.assign(cn.data(), cn.data() + cn.size());
}

double TurnNetwork::inductance() const {
    double sum = 0;
    for (double v : l_) sum += v;
    return sum;
}

std::vector<double> TurnNetwork::resonances(int count) const {
    const Eigen::Map<const Matrix> l(l_.data(), n_, n_);
    const int m = mounting_ == Mounting::grounded_end ? n_ : n_ + 1;
    const Eigen::Map<const Matrix> c(c_.data(), m, m);
    Matrix b = incidence(n_);
    if (mounting_ == Mounting::grounded_end) b = b.rightCols(n_).eval();
    Matrix k = b.transpose() * l.llt().solve(b);
    Matrix cm = c;
    if (mounting_ == Mounting::floating) {
        // The free coil's common mode (every node at one potential: K 1 = 0, the charge against infinity) is
        // no resonance: restrict the pencil to the vectors C-orthogonal to it, (C 1)^T v = 0, an orthonormal
        // basis of which is the Householder reflection of C 1 without its first column.
        const Eigen::VectorXd c1 = c * Eigen::VectorXd::Ones(m);
        const Eigen::HouseholderQR<Matrix> qr(c1);
        const Matrix q = qr.householderQ() * Matrix::Identity(m, m);
        const Matrix basis = q.rightCols(m - 1);
        k = (basis.transpose() * k * basis).eval();
        cm = (basis.transpose() * c * basis).eval();
    }
    // Scale K to C's size (w0 near the coil's own resonance), so that C + K' is well conditioned.
    const double w0_squared = k.trace() / cm.trace();
    const Matrix ks = k / w0_squared;
    Eigen::GeneralizedSelfAdjointEigenSolver<Matrix> es(ks, cm + ks, Eigen::EigenvaluesOnly);
    if (es.info() != Eigen::Success) throw DomainError("turn network: the eigenproblem did not converge");
    std::vector<double> f;
    for (int i = 0; i < es.eigenvalues().size() && static_cast<int>(f.size()) < count; ++i) {
        const double mu = es.eigenvalues()(i);
        if (!(mu > 0 && mu < 1 - 1e-9)) continue;  // the alternating mode (no capacitance) is at mu = 1
        f.push_back(std::sqrt(mu / (1 - mu) * w0_squared) / (2 * pi));
    }
    return f;
}

double TurnNetwork::first_resonance() const {
    const auto f = resonances(1);
    if (f.empty()) throw DomainError("turn network: no resonance between the terminals (a single turn, or no finite mode)");
    return f.front();
}

std::complex<double> TurnNetwork::impedance(double frequency, double series_resistance, double loss_tangent,
                                            double series_inductance) const {
    const auto v = node_voltages(frequency, series_resistance, loss_tangent, series_inductance);
    const bool grounded = mounting_ == Mounting::grounded_end;
    const std::complex<double> z = grounded ? v.back() : v.back() - v.front();
    if (!std::isfinite(z.real()) || !std::isfinite(z.imag())) throw DomainError("turn network: Z is not finite (an exact resonance)");
    return z;
}

std::vector<std::complex<double>> TurnNetwork::turn_currents(double frequency, double series_resistance, double loss_tangent,
                                                            double series_inductance) const {
    using C = std::complex<double>;
    const auto v = node_voltages(frequency, series_resistance, loss_tangent, series_inductance);
    const bool grounded = mounting_ == Mounting::grounded_end;
    Eigen::VectorXcd all(n_ + 1);  // every node, ground included
    if (grounded) {
        all(0) = 0;
        for (int k = 0; k < n_; ++k) all(k + 1) = v[static_cast<std::size_t>(k)];
    } else {
        for (int k = 0; k <= n_; ++k) all(k) = v[static_cast<std::size_t>(k)];
    }
    const double w = 2 * pi * frequency;
    const Eigen::Map<const Matrix> l(l_.data(), n_, n_);
    const ComplexMatrix zb = branch_impedance(l, w, series_resistance, series_inductance);
    // Branch k runs from node k to node k + 1, so its voltage drop is V_k - V_(k+1); 1 A flows into the far
    // terminal and out of the near one, so the turns' current runs from the last node to the first: report
    // it in that sense (positive at low frequency).
    const Eigen::VectorXcd drop = all.head(n_) - all.tail(n_);
    const Eigen::VectorXcd i = zb.partialPivLu().solve(drop);
    std::vector<C> out(static_cast<std::size_t>(n_));
    for (int k = 0; k < n_; ++k) {
        out[static_cast<std::size_t>(k)] = -i(k);
        if (!std::isfinite(i(k).real()) || !std::isfinite(i(k).imag())) throw DomainError("turn network: the currents are not finite (an exact resonance)");
    }
    return out;
}

std::vector<std::complex<double>> TurnNetwork::node_voltages(double frequency, double series_resistance, double loss_tangent,
                                                            double series_inductance) const {
    require_positive("frequency", frequency);
    require_non_negative("series_resistance", series_resistance);
    require_non_negative("loss_tangent", loss_tangent);
    require_finite("series_inductance", series_inductance);
    using C = std::complex<double>;
    const double w = 2 * pi * frequency;
    const Eigen::Map<const Matrix> l(l_.data(), n_, n_);
    const bool grounded = mounting_ == Mounting::grounded_end;
    const int m = grounded ? n_ : n_ + 1;
    const Eigen::Map<const Matrix> c(c_.data(), m, m);
    const ComplexMatrix zb = branch_impedance(l, w, series_resistance, series_inductance);
    Matrix b = incidence(n_);
    if (grounded) b = b.rightCols(n_).eval();
    const ComplexMatrix bc = b.cast<C>();
    ComplexMatrix y = bc.transpose() * zb.partialPivLu().solve(bc);
    y += C(0, w) * C(1, -loss_tangent) * c.cast<C>();
    Eigen::VectorXcd inject = Eigen::VectorXcd::Zero(m);
    inject(m - 1) = 1;  // into the far terminal; out of the near one, or of ground
    if (!grounded) inject(0) = -1;
    const Eigen::VectorXcd v = y.partialPivLu().solve(inject);
    return std::vector<C>(v.data(), v.data() + v.size());
}

}  // namespace libcoil
