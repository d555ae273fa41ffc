#include "libcoil/models/cross_section.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <complex>
#include <map>

#include <Eigen/Dense>

#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/ring_inductance.hpp"
#include "libcoil/models/skin_effect.hpp"

namespace libcoil {

namespace {

// Gauss-Legendre nodes and weights on [0, 1]: 4 points across a cell's thickness, 8 along its arc (the
// graded cells are long and thin).
constexpr double gl_x[4] = {0.0694318442029737, 0.3300094782075719, 0.6699905217924281, 0.9305681557970263};
constexpr double gl_w[4] = {0.1739274225687269, 0.3260725774312731, 0.3260725774312731, 0.1739274225687269};
constexpr double gl8_x[8] = {0.0198550717512319, 0.1016667612931866, 0.2372337950418355, 0.4082826787521751,
                             0.5917173212478249, 0.7627662049581645, 0.8983332387068134, 0.9801449282487681};
constexpr double gl8_w[8] = {0.0506142681451881, 0.1111905172266872, 0.1568533229389436, 0.1813418916891810,
                             0.1813418916891810, 0.1568533229389436, 0.1111905172266872, 0.0506142681451881};
constexpr int samples_per_cell = 32;

}  // namespace

std::vector<std::pair<double, double>> coil_ring_centres(const Solenoid& c) {
    const int n = std::max(1, static_cast<int>(std::lround(c.turns())));
    std::vector<std::pair<double, double>> rings;
    for (int t = 0; t < n; ++t) rings.emplace_back(c.mean_radius(), (t - (n - 1) / 2.0) * c.pitch());
    return rings;
}

Subdivision subdivision_for(double wire_radius, double skin_depth) {
    require_positive("wire_radius", wire_radius);
    require_positive("skin_depth", skin_depth);
    Subdivision s{8, 1.3, 16};
    while (s.layers < 24 && wire_radius * (s.grading - 1) / (std::pow(s.grading, s.layers) - 1) > skin_depth / 3) ++s.layers;
    s.sectors = 2 * s.layers;
    return s;
}

CrossSectionSolver::CrossSectionSolver(const Solenoid& coil, double resistivity, Subdivision sub)
    : CrossSectionSolver(coil_ring_centres(coil), coil.wire().radius(), resistivity, sub) {}

CrossSectionSolver::CrossSectionSolver(std::vector<std::pair<double, double>> ring_centres, double wire_radius,
                                       double resistivity, Subdivision sub)
    : rings_(std::move(ring_centres)), wire_radius_(wire_radius), resistivity_(resistivity) {
    require_positive("wire_radius", wire_radius);
    require_positive("resistivity", resistivity);
    if (rings_.empty()) throw InputError("rings", "at least one ring is needed");
    for (const auto& [a, z] : rings_) {
        require_positive("ring radius", a);
        require_finite("ring position", z);
        if (a <= wire_radius) throw InputError("ring radius", "must exceed the wire radius");
    }
    if (sub.layers < 1 || sub.layers > 60) throw InputError("subdivision.layers", std::to_string(sub.layers) + " is outside 1 .. 60");
    if (sub.sectors < 1 || sub.sectors > 400) throw InputError("subdivision.sectors", std::to_string(sub.sectors) + " is outside 1 .. 400");
    if (!(sub.grading >= 1.0 && sub.grading <= 3.0)) throw InputError("subdivision.grading", format_value(sub.grading) + " is outside 1 .. 3");
    build(sub);
}

void CrossSectionSolver::build(const Subdivision& sub) {
    // Layer boundaries: thickness t1 g^(k-1) from the surface inward, summing to the wire radius.
    const int L = sub.layers;
    const double g = sub.grading;
    const double t1 = g == 1.0 ? wire_radius_ / L : wire_radius_ * (g - 1) / (std::pow(g, L) - 1);
    outer_layer_ = t1;
    std::vector<double> bound{wire_radius_};
    for (int k = 0; k < L; ++k) bound.push_back(std::max(0.0, bound.back() - t1 * std::pow(g, k)));
    bound.back() = 0.0;
    std::reverse(bound.begin(), bound.end());  // 0 = centre ... wire_radius

    // Cells are annular sectors of the wire's cross-section (the centre a whole disc). Each carries 32
    // Gauss sample points (area-weighted) for the geometric mean distances between near cells.
    struct Offset {
        double dr, dz, area, req, size;  // size: the cell's largest dimension
        std::array<std::array<double, 3>, samples_per_cell> samples;  // dr, dz, weight (summing to 1)
    };
    const auto sector = [](double r0, double r1, double phi0, double phi1) {
        Offset o{};
        o.area = (phi1 - phi0) / 2 * (r1 * r1 - r0 * r0);
        double cr = 0, cz = 0;
        int n = 0;
        for (int i = 0; i < 4; ++i) {
            const double rho = r0 + (r1 - r0) * gl_x[i];
            for (int j = 0; j < 8; ++j) {
                const double phi = phi0 + (phi1 - phi0) * gl8_x[j];
                const double w = gl_w[i] * gl8_w[j] * rho * (r1 - r0) * (phi1 - phi0) / o.area;
                o.samples[n++] = {rho * std::cos(phi), rho * std::sin(phi), w};
                cr += w * rho * std::cos(phi);
                cz += w * rho * std::sin(phi);
            }
        }
        o.dr = cr;
        o.dz = cz;
        return o;
    };
    std::vector<Offset> tmpl;
    {
        Offset disc = sector(0.0, bound[1], 0.0, 2 * pi);
        disc.dr = disc.dz = 0;
        disc.req = bound[1];  // a disc's GMD is r e^(-1/4): the ring formula's own round wire
        disc.size = 2 * bound[1];
        tmpl.push_back(disc);
    }
    for (int k = 1; k < L; ++k) {
        const double r0 = bound[k], r1 = bound[k + 1], rm = (r0 + r1) / 2;
        const int S = sub.sectors;
        for (int s = 0; s < S; ++s) {
            Offset o = sector(r0, r1, 2 * pi * s / S, 2 * pi * (s + 1) / S);
            // The ring formula takes the round-wire radius of the same GMD, r = g e^(1/4).
            o.req = rectangle_gmd(r1 - r0, 2 * pi * rm / S) * std::exp(0.25);
            o.size = std::max(r1 - r0, 2 * pi * r1 / S);
            tmpl.push_back(o);
        }
    }

    cells_.clear();
    self_.clear();
    for (int t = 0; t < static_cast<int>(rings_.size()); ++t) {
        const auto [a, z] = rings_[t];
        for (std::size_t q = 0; q < tmpl.size(); ++q) {
            const auto& o = tmpl[q];
            cells_.push_back({a + o.dr, z + o.dz, o.area, t, static_cast<int>(q)});
            self_.push_back(ring_self_inductance(a + o.dr, o.req));
        }
    }

    // Mirror symmetry z -> -z, if the rings are symmetric.
    const auto key = [](double r, double z) { return std::make_pair(std::llround(r * 1e12), std::llround(z * 1e12)); };
    std::map<std::pair<long long, long long>, int> index;
    for (int k = 0; k < static_cast<int>(cells_.size()); ++k) index[key(cells_[k].r, cells_[k].z)] = k;
    std::vector<int> mirror(cells_.size(), -1);
    bool symmetric = true;
    for (int k = 0; k < static_cast<int>(cells_.size()) && symmetric; ++k) {
        const auto it = index.find(key(cells_[k].r, -cells_[k].z));
        if (it == index.end()) symmetric = false; else mirror[k] = it->second;
    }
    orbits_.clear();
    std::vector<int> orbit_of(cells_.size(), -1);
    for (int k = 0; k < static_cast<int>(cells_.size()); ++k) {
        if (orbit_of[k] >= 0) continue;
        std::vector<int> o{k};
        if (symmetric && mirror[k] != k) o.push_back(mirror[k]);
        for (int m : o) orbit_of[m] = static_cast<int>(orbits_.size());
        orbits_.push_back(o);
    }
    // Turn orbits.
    turn_orbit_of_turn_.assign(rings_.size(), -1);
    turn_orbit_multiplicity_.clear();
    for (int t = 0; t < static_cast<int>(rings_.size()); ++t) {
        if (turn_orbit_of_turn_[t] >= 0) continue;
        int partner = t;
        if (symmetric) {
            for (int u = 0; u < static_cast<int>(rings_.size()); ++u) {
                if (std::fabs(rings_[u].first - rings_[t].first) < 1e-12 && std::fabs(rings_[u].second + rings_[t].second) < 1e-12) partner = u;
            }
        }
        const int id = static_cast<int>(turn_orbit_multiplicity_.size());
        turn_orbit_of_turn_[t] = id;
        turn_orbit_of_turn_[partner] = id;
        turn_orbit_multiplicity_.push_back(partner == t ? 1 : 2);
    }

    // Mutual inductance of two cells: Maxwell's formula between their centroid rings, except that near
    // cells (centroids closer than twice the sum of their sizes) are placed at their geometric mean
    // distance, found by averaging ln(distance) over both cells' Gauss samples.
    const auto mutual = [&](int k, int l) {
        const Cell& ck = cells_[k];
        const Cell& cl = cells_[l];
        const double dr = cl.r - ck.r, dz = cl.z - ck.z, d = std::hypot(dr, dz);
        if (d > 2 * (tmpl[ck.shape].size + tmpl[cl.shape].size)) return coaxial_mutual_inductance(ck.r, cl.r, dz);
        const auto& sk = tmpl[ck.shape].samples;
        const auto& sl = tmpl[cl.shape].samples;
        const double ox = rings_[cl.turn].first - rings_[ck.turn].first, oz = rings_[cl.turn].second - rings_[ck.turn].second;
        double lng = 0;
        for (const auto& p : sk) {
            for (const auto& q : sl) lng += p[2] * q[2] * 0.5 * std::log((ox + q[0] - p[0]) * (ox + q[0] - p[0]) + (oz + q[1] - p[1]) * (oz + q[1] - p[1]));
        }
        const double g = std::exp(lng), s = g / d, rm = (ck.r + cl.r) / 2;
        return coaxial_mutual_inductance(rm - dr * s / 2, rm + dr * s / 2, dz * s);
    };

    // Reduced mutual matrix: row = an orbit's representative cell, column = sum over the column orbit.
    const std::size_t n = orbits_.size();
    mutual_reduced_.assign(n * n, 0.0);
    for (std::size_t i = 0; i < n; ++i) {
        for (std::size_t j = 0; j < n; ++j) {
            double m = 0;
            for (int k : orbits_[j]) {
                m += (k == orbits_[i][0]) ? self_[k] : mutual(orbits_[i][0], k);
            }
            mutual_reduced_[i * n + j] = m;
        }
    }
}

RingImpedance CrossSectionSolver::solve(double frequency) const {
    require_non_negative("frequency", frequency);
    const std::size_t n = orbits_.size(), nt = turn_orbit_multiplicity_.size();
    const double omega = 2 * pi * frequency;
    RingImpedance out;
    out.frequency = frequency;
    if (frequency > 0) {
        out.resolved = outer_layer_ <= skin_depth(resistivity_, frequency) / 3;
    }

    using cd = std::complex<double>;
    // Resistance of each orbit's representative cell.
    std::vector<double> res(n);
    for (std::size_t i = 0; i < n; ++i) {
        const Cell& c = cells_[orbits_[i][0]];
        res[i] = resistivity_ * 2 * pi * c.r / c.area;
    }
    // E: orbit -> turn orbit of its representative; C: how many cells of orbit j lie in the
    // representative turn of each turn orbit.
    Eigen::MatrixXcd E = Eigen::MatrixXcd::Zero(static_cast<Eigen::Index>(n), static_cast<Eigen::Index>(nt));
    Eigen::MatrixXcd C = Eigen::MatrixXcd::Zero(static_cast<Eigen::Index>(nt), static_cast<Eigen::Index>(n));
    std::vector<int> rep_turn(nt, -1);
    for (int t = 0; t < static_cast<int>(rings_.size()); ++t) {
        if (rep_turn[turn_orbit_of_turn_[t]] < 0) rep_turn[turn_orbit_of_turn_[t]] = t;
    }
    for (std::size_t i = 0; i < n; ++i) {
        E(static_cast<Eigen::Index>(i), turn_orbit_of_turn_[cells_[orbits_[i][0]].turn]) = 1.0;
        for (int k : orbits_[i]) {
            const int tor = turn_orbit_of_turn_[cells_[k].turn];
            if (cells_[k].turn == rep_turn[tor]) C(tor, static_cast<Eigen::Index>(i)) += 1.0;
        }
    }

    Eigen::VectorXcd V;
    Eigen::VectorXcd currents;
    if (frequency == 0) {
        // DC: cells of a turn in parallel, i_k = V_t / R_k.
        Eigen::VectorXcd inv_r(static_cast<Eigen::Index>(n));
        for (std::size_t i = 0; i < n; ++i) inv_r(static_cast<Eigen::Index>(i)) = 1.0 / res[i];
        // C diag(1/R) E V = 1  ->  V
        const Eigen::MatrixXcd S = C * inv_r.asDiagonal() * E;
        V = S.partialPivLu().solve(Eigen::VectorXcd::Ones(static_cast<Eigen::Index>(nt)));
        currents = inv_r.asDiagonal() * (E * V);
    } else {
        Eigen::MatrixXcd Z(static_cast<Eigen::Index>(n), static_cast<Eigen::Index>(n));
        for (std::size_t i = 0; i < n; ++i) {
            for (std::size_t j = 0; j < n; ++j) {
                Z(static_cast<Eigen::Index>(i), static_cast<Eigen::Index>(j)) = cd(0.0, omega * mutual_reduced_[i * n + j]);
            }
            Z(static_cast<Eigen::Index>(i), static_cast<Eigen::Index>(i)) += res[i];
        }
        const auto lu = Z.partialPivLu();
        const Eigen::MatrixXcd ZiE = lu.solve(E);
        const Eigen::MatrixXcd S = C * ZiE;
        V = S.partialPivLu().solve(Eigen::VectorXcd::Ones(static_cast<Eigen::Index>(nt)));
        currents = ZiE * V;
    }
    // Coil impedance per ampere: the sum of the turn voltages.
    cd total = 0;
    for (std::size_t t = 0; t < nt; ++t) total += static_cast<double>(turn_orbit_multiplicity_[t]) * V(static_cast<Eigen::Index>(t));
    out.resistance = finite_result("cross-section solver", total.real());
    if (frequency > 0) {
        out.inductance = finite_result("cross-section solver", total.imag() / omega);
    } else {
        // Energy: L = sum_k i_k * (sum over all cells l of M_kl i_l), with i_l shared within an orbit.
        double energy = 0;
        for (std::size_t i = 0; i < n; ++i) {
            double row = 0;
            for (std::size_t j = 0; j < n; ++j) row += mutual_reduced_[i * n + j] * currents(static_cast<Eigen::Index>(j)).real();
            energy += static_cast<double>(orbits_[i].size()) * currents(static_cast<Eigen::Index>(i)).real() * row;
        }
        out.inductance = finite_result("cross-section solver", energy);
    }
    return out;
}

}  // namespace libcoil
