#include "libcoil/models/shield.hpp"

#include <algorithm>
#include <cmath>
#include <complex>

#include <Eigen/Dense>
#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <boost/math/special_functions/bessel.hpp>

#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/ring_inductance.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "libcoil/core/units.hpp"
#include "models/turn_filaments.hpp"

namespace libcoil {

namespace {

struct Ring {
    double r, z, dr, dz;  // centre radius and height, radial and axial extent
    bool disc = false;    // in an end disc: long along r, thin along z (in the wall: long along z)
};

// Geometric mean distance between two parallel line segments a distance s apart, [a0, a1] and [b0, b1]
// along them: ln g = (1 / (la lb)) (P(a1 - b0) - P(a0 - b0) - P(a1 - b1) + P(a0 - b1)) with
// P''(u) = ln(u^2 + s^2) / 2, P(u) = (u^2 - s^2) / 4 ln(u^2 + s^2) - 3 u^2 / 4 + s u atan(u / s)
// (the double integral of ln r, done by hand; at s = 0 and b = a it gives the segment's own l e^(-3/2)).
double segments_gmd(double a0, double a1, double b0, double b1, double s) {
    const auto P = [s](double u) {
        const double q = u * u + s * s;
        const double log_term = q > 0 ? (u * u - s * s) / 4 * std::log(q) : 0;
        return log_term - 0.75 * u * u + (s > 0 ? s * u * std::atan(u / s) : 0);
    };
    const double j = P(a1 - b0) - P(a0 - b0) - P(a1 - b1) + P(a0 - b1);
    return std::exp(j / ((a1 - a0) * (b1 - b0)));
}

// Rings close against their long side: Maxwell's formula at the geometric mean distance of their
// sections (thin strips as segments), which a filament pair at the centres would overestimate badly for
// layers thinner than they are long.
double ring_mutual(const Ring& a, const Ring& c) {
    if (a.disc == c.disc) {
        const double la = a.disc ? a.dr : a.dz, lc = c.disc ? c.dr : c.dz;
        const double along_a = a.disc ? a.r : a.z, along_c = c.disc ? c.r : c.z;
        const double across = a.disc ? std::fabs(a.z - c.z) : std::fabs(a.r - c.r);
        const double reach = 3 * std::max(la, lc);
        if (std::fabs(along_a - along_c) <= reach && across <= reach) {
            const double g = segments_gmd(along_a - la / 2, along_a + la / 2, along_c - lc / 2, along_c + lc / 2, across);
            const double rm = 0.5 * (a.r + c.r);
            return coaxial_mutual_inductance(rm, rm, g);
        }
    }
    return coaxial_mutual_inductance(a.r, c.r, a.z - c.z);
}

// Layer boundaries through a wall of thickness t from its inner surface: uniform when the wall is thin
// against the skin depth, else graded from a first layer of delta / 3.
std::vector<double> layers(double t, double delta, int max_layers) {
    const int n = std::clamp(static_cast<int>(std::ceil(t / (delta / 2))), 1, max_layers);
    std::vector<double> edge(1, 0.0);
    if (n < max_layers || delta / 3 * n >= t) {
        for (int i = 1; i <= n; ++i) edge.push_back(t * i / n);
        return edge;
    }
    const double h0 = delta / 3;
    double lo = 1, hi = 100;  // ratio q with h0 (q^n - 1) / (q - 1) = t
    for (int it = 0; it < 200; ++it) {
        const double q = 0.5 * (lo + hi);
        ((h0 * (std::pow(q, n) - 1) / (q - 1)) > t ? hi : lo) = q;
    }
    const double q = 0.5 * (lo + hi);
    double h = h0, x = 0;
    for (int i = 1; i < n; ++i, h *= q) edge.push_back(x += h);
    edge.push_back(t);
    return edge;
}

// The winding's turns as the ring model takes them (turn_filaments: on the mean radius, over the winding).
SourceReach winding_reach(const Solenoid& coil) { return {coil.mean_radius(), -coil.winding_length() / 2, coil.winding_length() / 2}; }

SourceReach reach_of(const std::vector<WallRingCurrent>& sources) {
    std::vector<std::pair<double, double>> centres;
    for (const auto& t : sources) centres.emplace_back(t.radius, t.z);
    return reach_of_wires(centres, 0, 0);
}

// The wall's rings: the tube's, and the end discs' where it has them; within wall_reach_radii of the
// sources along the axis (shield.hpp), the rest left out.
std::vector<Ring> shield_rings(const ShieldSpec& s, const SourceReach& sources, double delta) {
    const double b = s.inner_diameter / 2, t = s.thickness, len = s.length, coil_radius = sources.radius;
    const double from = sources.z_low - wall_reach_radii * b, to = sources.z_high + wall_reach_radii * b;
    std::vector<Ring> rings;
    const auto through = layers(t, delta, 6);
    // Along the wall: fine enough for the field's scale (the gap to the coil and the coil's radius).
    const double step = std::min({(b - coil_radius) / 1.5, coil_radius / 3, len / 24});
    const int nz = std::clamp(static_cast<int>(std::ceil(len / step)), 24, 240);
    for (int i = 0; i < nz; ++i) {
        const double z = s.axial_offset - len / 2 + (i + 0.5) * len / nz;
        if (z < from || z > to) continue;
        for (std::size_t k = 1; k < through.size(); ++k) {
            rings.push_back({b + 0.5 * (through[k - 1] + through[k]), z, through[k] - through[k - 1], len / nz});
        }
    }
    if (s.end_discs) {
        const int nr = std::clamp(static_cast<int>(std::ceil((b + t) / step)), 8, 60);
        for (double side : {-1.0, 1.0}) {
            if (const double end = s.axial_offset + side * len / 2; end < from || end > to) continue;
            for (int i = 0; i < nr; ++i) {
                const double r = (i + 0.5) * (b + t) / nr;
                for (std::size_t k = 1; k < through.size(); ++k) {
                    const double z = s.axial_offset + side * (len / 2 + 0.5 * (through[k - 1] + through[k]));
                    rings.push_back({r, z, (b + t) / nr, through[k] - through[k - 1], true});
                }
            }
        }
    }
    return rings;
}

// A shield of positive size that clears the winding, or an InputError naming the field.
void require_around(const Solenoid& coil, const ShieldSpec& s) {
    require_positive("shield.inner_diameter", s.inner_diameter);
    require_positive("shield.length", s.length);
    require_positive("shield.thickness", s.thickness);
    require_finite("shield.axial_offset", s.axial_offset);
    if (!(s.inner_diameter > coil.outer_diameter())) {
        throw InputError("shield.inner_diameter", format_quantity(s.inner_diameter, Dimension::length) +
                                                      " does not clear the winding (outer diameter " +
                                                      format_quantity(coil.outer_diameter(), Dimension::length) + ")");
    }
}

struct System {
    Eigen::MatrixXd m;   // ring-ring mutual and self inductances
    Eigen::VectorXd mc;  // ring-coil mutuals (per ampere of coil current)
    Eigen::VectorXd r;   // ring resistances
};

System assemble(const std::vector<Ring>& rings, const Solenoid& coil, double rho) {
    const auto n = static_cast<Eigen::Index>(rings.size());
    System s{Eigen::MatrixXd(n, n), Eigen::VectorXd(n), Eigen::VectorXd(n)};
    const detail::TurnFilaments turns = detail::turn_filaments(coil);
    for (Eigen::Index i = 0; i < n; ++i) {
        const Ring& a = rings[static_cast<std::size_t>(i)];
        s.m(i, i) = ring_self_inductance(a.r, rectangle_gmd(a.dr, a.dz) * std::exp(0.25));
        for (Eigen::Index j = 0; j < i; ++j) {
            const Ring& c = rings[static_cast<std::size_t>(j)];
            s.m(i, j) = s.m(j, i) = ring_mutual(a, c);
        }
        double sum = 0;
        for (double z : turns.z) sum += coaxial_mutual_inductance(a.r, turns.radius, a.z - z);
        s.mc(i) = turns.weight * sum;
        s.r(i) = rho * 2 * pi * a.r / (a.dr * a.dz);
    }
    return s;
}

// dZ per ampere at angular frequency w (w = INFINITY: the perfect conductor, returns j-less dL).
std::complex<double> added_impedance(const System& s, double w) {
    using C = std::complex<double>;
    const auto n = s.r.size();
    Eigen::MatrixXcd a(n, n);
    a = (C(0, w) * s.m.cast<C>());
    a.diagonal() += s.r.cast<C>();
    const Eigen::VectorXcd rhs = C(0, -w) * s.mc.cast<C>();
    const Eigen::VectorXcd x = a.partialPivLu().solve(rhs);
    return C(0, w) * s.mc.cast<C>().dot(x);  // dot conjugates its first argument, real here
}

}  // namespace

ShieldingEffectiveness magnetic_shielding(const ShieldSpec& s, double f, double r) {
    require_positive("frequency", f);
    require_positive("source_distance", r);
    require_positive("shield.thickness", s.thickness);
    using C = std::complex<double>;
    const double rho = s.material.resistivity_at(s.temperature);
    const double delta = skin_depth(rho, f, s.material.relative_permeability), w = 2 * pi * f;
    const C zs = C(1, 1) * rho / delta, zw = C(0, w * mu0 * r);
    ShieldingEffectiveness e;
    e.absorption_db = 20 / std::log(10.0) * s.thickness / delta;  // 8.686 t / delta
    e.reflection_db = 20 * std::log10(std::abs((zs + zw) * (zs + zw) / (4.0 * zs * zw)));
    const C g = (zs - zw) / (zs + zw);
    e.multiple_reflection_db = 20 * std::log10(std::abs(1.0 - g * g * std::exp(-2.0 * C(1, 1) * s.thickness / delta)));
    e.total_db = std::max(0.0, e.absorption_db + e.reflection_db + e.multiple_reflection_db);
    return e;
}

double sheet_in_long_shield_change(double a, double l, double n, double b) {
    require_positive("mean_radius", a);
    require_positive("length", l);
    require_positive("turns", n);
    require_positive("shield_radius", b);
    if (!(b > a)) throw InputError("shield_radius", "must exceed the coil's radius");
    namespace bm = boost::math;
    // I1(x)^2 K1(y) / I1(y) ~ exp(2x - 2y): past 2 k (b - a) = 80 nothing is left; below k b = 600 no
    // Bessel function overflows. Their product is taken as I1(ka) / I1(kb) times I1(ka) K1(kb), each at
    // most about 1: the square of I1(ka) alone overflows from ka = 356 on, which a tube within a fifteenth
    // of its radius of the winding reaches before k b = 600 (the analysis of a coil 0.2 mm inside its can
    // had stopped there).
    const double k_max = std::min(40 / (b - a), 600 / b);
    const auto shield_kernel = [&](double k) {  // G(k) = I1(ka)^2 K1(kb) / I1(kb)
        const double i_a = bm::cyl_bessel_i(1, k * a);
        return i_a / bm::cyl_bessel_i(1, k * b) * (i_a * bm::cyl_bessel_k(1, k * b));
    };
    const auto g = [&](double k) {
        if (k <= 0) return l * l / 4 * a * a / (2 * b * b);  // the limit of sin^2 / k^2 times G
        const double s = std::sin(k * l / 2) / k;
        return s * s * shield_kernel(k);
    };
    // The integrand oscillates with period 2 pi / l: integrate piece by piece, the first 2000 periods; beyond,
    // where G changes little over a period, sin^2 takes its mean 1/2 (a coil thousands of times longer than
    // the shield's gap, where this loop would otherwise run without bound).
    const double period = 2 * pi / l;
    const double k_pieces = std::min(k_max, 2000 * period);
    double sum = 0;
    for (double k0 = 0; k0 < k_pieces; k0 += period) {
        sum += bm::quadrature::gauss_kronrod<double, 31>::integrate(g, k0, std::min(k_pieces, k0 + period), 8, 1e-12);
    }
    if (k_pieces < k_max) {
        const auto mean = [&](double k) { return 0.5 / (k * k) * shield_kernel(k); };
        sum += bm::quadrature::gauss_kronrod<double, 31>::integrate(mean, k_pieces, k_max, 15, 1e-12);
    }
    return finite_result("sheet_in_long_shield_change", -8 * mu0 * a * a * n * n / (l * l) * sum);
}

std::vector<WallRingCurrent> shield_wall_currents(const std::vector<std::pair<double, double>>& turns, const ShieldSpec& s,
                                                  double f) {
    std::vector<WallRingCurrent> sources;
    for (const auto& t : turns) sources.push_back({t.first, t.second, 1.0});
    return shield_wall_currents(sources, s, f);
}

struct ShieldWall::Factor {
    Eigen::PartialPivLU<Eigen::MatrixXcd> lu;
};

SourceReach reach_of_wires(const std::vector<std::pair<double, double>>& centres, double radial, double axial) {
    if (centres.empty()) return {};
    SourceReach out{0, INFINITY, -INFINITY};
    for (const auto& [r, z] : centres) out = {std::max(out.radius, r + radial), std::min(out.z_low, z - axial), std::max(out.z_high, z + axial)};
    return out;
}

ShieldWall::ShieldWall(const ShieldSpec& s, const SourceReach& sources, double f) : shield_(s), omega_(2 * pi * f) {
    require_positive("frequency", f);
    require_positive("shield.inner_diameter", s.inner_diameter);
    require_positive("shield.length", s.length);
    require_positive("shield.thickness", s.thickness);
    if (!(s.inner_diameter / 2 > sources.radius)) throw InputError("shield.inner_diameter", "does not clear the turns");
    if (!(sources.z_low <= sources.z_high)) {
        throw InputError("sources.z_low", format_quantity(sources.z_low, Dimension::length) + " is above sources.z_high, " +
                                              format_quantity(sources.z_high, Dimension::length) + "; expected z_low <= z_high");
    }
    const double rho = s.material.resistivity_at(s.temperature);
    delta_ = skin_depth(rho, f, s.material.relative_permeability);
    const auto rings = shield_rings(s, sources, delta_);
    const auto n = static_cast<Eigen::Index>(rings.size());
    using C = std::complex<double>;
    Eigen::MatrixXcd a(n, n);
    for (Eigen::Index i = 0; i < n; ++i) {
        const Ring& r = rings[static_cast<std::size_t>(i)];
        a(i, i) = C(rho * 2 * pi * r.r / (r.dr * r.dz), omega_ * ring_self_inductance(r.r, rectangle_gmd(r.dr, r.dz) * std::exp(0.25)));
        for (Eigen::Index j = 0; j < i; ++j) a(i, j) = a(j, i) = C(0, omega_ * ring_mutual(r, rings[static_cast<std::size_t>(j)]));
        rings_.emplace_back(r.r, r.z);
    }
    factor_ = std::make_shared<const Factor>(Factor{a.partialPivLu()});
}

bool ShieldWall::serves(const SourceReach& sources) const {
    if (!(shield_.inner_diameter / 2 > sources.radius)) return false;
    const auto rings = shield_rings(shield_, sources, delta_);
    if (rings.size() != rings_.size()) return false;
    for (std::size_t i = 0; i < rings.size(); ++i) {
        if (rings[i].r != rings_[i].first || rings[i].z != rings_[i].second) return false;
    }
    return true;
}

void ShieldWall::currents(std::complex<double>* flux, std::size_t columns) const {
    const auto n = static_cast<Eigen::Index>(rings_.size());
    Eigen::Map<Eigen::MatrixXcd> b(flux, n, static_cast<Eigen::Index>(columns));
    const Eigen::MatrixXcd rhs = std::complex<double>(0, -omega_) * b;  // not in place: the LU's row permutation would alias
    b = factor_->lu.solve(rhs);
}

std::vector<WallRingCurrent> shield_wall_currents(const std::vector<WallRingCurrent>& turns, const ShieldSpec& s, double f) {
    return shield_wall_currents(ShieldWall(s, reach_of(turns), f), turns);
}

std::vector<WallRingCurrent> shield_wall_currents(const ShieldWall& wall, const std::vector<WallRingCurrent>& turns) {
    std::vector<std::complex<double>> x;
    for (const auto& [r, z] : wall.rings()) {
        std::complex<double> sum = 0;
        for (const auto& t : turns) sum += t.current * coaxial_mutual_inductance(r, t.radius, z - t.z);
        x.push_back(sum);
    }
    wall.currents(x.data(), 1);
    std::vector<WallRingCurrent> out;
    for (std::size_t i = 0; i < x.size(); ++i) out.push_back({wall.rings()[i].first, wall.rings()[i].second, x[i]});
    return out;
}

double shield_inductance_change(const Solenoid& coil, const ShieldSpec& s) {
    require_around(coil, s);
    // The current of a perfect conductor is a sheet on the inner surface: one thin layer.
    ShieldSpec sheet = s;
    sheet.thickness = std::min(s.thickness, 1e-3 * s.inner_diameter / 2);
    const System sys = assemble(shield_rings(sheet, winding_reach(coil), INFINITY), coil, 1.0);
    const Eigen::VectorXd x = sys.m.ldlt().solve(-sys.mc);
    return finite_result("shield", sys.mc.dot(x));
}

std::vector<double> shield_turn_inductance_change(const Solenoid& coil, const ShieldSpec& s) {
    require_around(coil, s);
    ShieldSpec sheet = s;
    sheet.thickness = std::min(s.thickness, 1e-3 * s.inner_diameter / 2);
    const std::vector<Ring> rings = shield_rings(sheet, winding_reach(coil), INFINITY);
    const System sys = assemble(rings, coil, 1.0);
    const detail::TurnFilaments turns = detail::turn_filaments(coil);
    const auto n = static_cast<Eigen::Index>(turns.z.size()), m = static_cast<Eigen::Index>(rings.size());
    Eigen::MatrixXd mst(m, n);  // wall ring k against turn i
    for (Eigen::Index k = 0; k < m; ++k) {
        for (Eigen::Index i = 0; i < n; ++i) {
            mst(k, i) = turns.weight * coaxial_mutual_inductance(rings[static_cast<std::size_t>(k)].r, turns.radius,
                                                                 rings[static_cast<std::size_t>(k)].z - turns.z[static_cast<std::size_t>(i)]);
        }
    }
    const Eigen::MatrixXd change = -mst.transpose() * sys.m.ldlt().solve(mst);
    std::vector<double> out(static_cast<std::size_t>(n * n));
    for (Eigen::Index i = 0; i < n; ++i) {
        for (Eigen::Index j = 0; j < n; ++j) out[static_cast<std::size_t>(i * n + j)] = finite_result("shield", 0.5 * (change(i, j) + change(j, i)));
    }
    return out;
}

double open_end_leakage_db(const ShieldSpec& s, double winding_length) {
    require_positive("winding_length", winding_length);
    if (s.end_discs) return INFINITY;
    const double e = std::max(0.0, s.length / 2 - std::fabs(s.axial_offset) - winding_length / 2);
    constexpr double j1_first_zero = 3.8317059702075123;
    return 20 / std::log(10.0) * j1_first_zero * e / (s.inner_diameter / 2);
}

double credited_magnetic_shielding_db(const ShieldSpec& s, double f, double r, double winding_length) {
    return std::min({magnetic_shielding(s, f, r).total_db, max_wall_db, open_end_leakage_db(s, winding_length)});
}

namespace {

// The part of the winding a shield covers, in m from the winding's start (its low end, which a grounded
// mounting grounds): from <= to, both within 0 .. l; from == to where the shield lies beside the winding.
struct Covered {
    double from, to;
};
Covered covered_winding(const Solenoid& coil, const ShieldSpec& s) {
    const double l = coil.winding_length();  // the winding from -l/2 to l/2, the shield about its axial offset
    const double from = std::clamp(s.axial_offset - s.length / 2 + l / 2, 0.0, l);
    return {from, std::max(from, std::clamp(s.axial_offset + s.length / 2 + l / 2, 0.0, l))};
}

// The coaxial capacitance per metre of winding, F/m.
double capacitance_per_length(const Solenoid& coil, const ShieldSpec& s) {
    return 2 * pi * eps0 / std::log(s.inner_diameter / coil.outer_diameter());
}

}  // namespace

double shield_radius_ratio(const Solenoid& coil, const ShieldSpec& s) { return s.inner_diameter / coil.mean_diameter(); }

double shield_capacitance(const Solenoid& coil, const ShieldSpec& s) {
    require_around(coil, s);
    const Covered c = covered_winding(coil, s);
    return capacitance_per_length(coil, s) * (c.to - c.from);
}

double shielded_self_resonance(double f0, double l0, double l_shielded, double c_terminal) {
    require_positive("bare_self_resonance", f0);
    require_positive("bare_inductance", l0);
    require_positive("shielded_inductance", l_shielded);
    require_non_negative("terminal_capacitance", c_terminal);
    const double c_self = 1 / (std::pow(2 * pi * f0, 2) * l0);
    return finite_result("shielded_self_resonance", 1 / (2 * pi * std::sqrt(l_shielded * (c_self + c_terminal))));
}

double shield_terminal_capacitance(const Solenoid& coil, const ShieldSpec& s, bool grounded_end) {
    require_around(coil, s);
    const Covered c = covered_winding(coil, s);
    const double l = coil.winding_length(), per_m = capacitance_per_length(coil, s);
    if (grounded_end) return per_m * (c.to * c.to * c.to - c.from * c.from * c.from) / (3 * l * l);
    const double covered = c.to - c.from;
    return per_m * covered * covered * covered / (12 * l * l);
}

ShieldResult shielded_coil(const Solenoid& coil, double inductance, const ShieldSpec& s, const std::vector<double>& frequencies) {
    require_positive("inductance", inductance);
    require_around(coil, s);
    const double b = s.inner_diameter / 2, a = coil.mean_radius();
    const double rho = s.material.resistivity_at(s.temperature);
    ShieldResult out;
    out.unshielded_inductance = inductance;
    out.long_coil_limit = inductance * (1 - a * a / (b * b));
    out.closed_form = inductance + sheet_in_long_shield_change(a, coil.winding_length(), coil.turns(), b);
    out.capacitance_to_shield = shield_capacitance(coil, s);
    out.perfect_conductor = finite_result("shield", inductance + shield_inductance_change(coil, s));
    for (double f : frequencies) {
        require_positive("frequency", f);
        const double delta = skin_depth(rho, f, s.material.relative_permeability);
        const auto rings = shield_rings(s, winding_reach(coil), delta);
        const System sys = assemble(rings, coil, rho);
        const double w = 2 * pi * f;
        const std::complex<double> dz = added_impedance(sys, w);
        ShieldPoint p;
        p.frequency = f;
        p.skin_depth = delta;
        p.inductance = finite_result("shield", inductance + dz.imag() / w);
        p.added_resistance = finite_result("shield", dz.real());
        out.points.push_back(p);
        out.rings = static_cast<int>(rings.size());
    }
    return out;
}

ShieldTable::ShieldTable(const Solenoid& coil, double inductance, const ShieldSpec& shield, double low, double high, int per_decade) {
    require_positive("low", low);
    require_positive("high", high);
    high = std::max(high, 1.01 * low);  // a grid of one frequency still needs two points
    if (per_decade < 1 || per_decade > 100) throw InputError("per_decade", std::to_string(per_decade) + "; expected 1 .. 100");
    const double decades = std::max(std::log10(high / low), 0.0);
    const int n = std::max(2, static_cast<int>(std::ceil(decades * per_decade)) + 1);
    if (n > 2000) throw InputError("high", "the shield's table would span " + format_value(decades) + " decades; expected at most 300");
    std::vector<double> f(static_cast<std::size_t>(n));
    for (int i = 0; i < n; ++i) f[static_cast<std::size_t>(i)] = low * std::pow(high / low, static_cast<double>(i) / (n - 1));
    const ShieldResult r = shielded_coil(coil, inductance, shield, f);
    for (const ShieldPoint& p : r.points) {
        f_.push_back(p.frequency);
        dl_.push_back(p.inductance - inductance);
        r_.push_back(std::max(p.added_resistance, 1e-300));
    }
}

ShieldTable ShieldTable::perfect(double inductance_change) {
    ShieldTable t;
    t.constant_change_ = finite_result("shield", inductance_change);
    return t;
}

namespace {

// Where f falls in the grid: the index i of [f_i, f_i+1] and the fraction t in log f.
std::pair<std::size_t, double> locate(const std::vector<double>& grid, double f) {
    const auto it = std::upper_bound(grid.begin(), grid.end(), f);
    std::size_t i = it == grid.begin() ? 0 : static_cast<std::size_t>(it - grid.begin()) - 1;
    i = std::min(i, grid.size() - 2);
    return {i, std::log(f / grid[i]) / std::log(grid[i + 1] / grid[i])};
}

}  // namespace

double ShieldTable::inductance_change(double f) const {
    if (f_.empty()) return constant_change_;
    if (!(f > 0)) return 0;
    if (f < f_.front()) return dl_.front() * (f / f_.front()) * (f / f_.front());
    if (f >= f_.back()) return dl_.back();
    const auto [i, t] = locate(f_, f);
    return dl_[i] + t * (dl_[i + 1] - dl_[i]);
}

double ShieldTable::added_resistance(double f) const {
    if (f_.empty() || !(f > 0)) return 0;
    if (f < f_.front()) return r_.front() * (f / f_.front()) * (f / f_.front());
    if (f >= f_.back()) return r_.back() * std::sqrt(f / f_.back());
    const auto [i, t] = locate(f_, f);
    return std::exp(std::log(r_[i]) + t * std::log(r_[i + 1] / r_[i]));
}

}  // namespace libcoil
