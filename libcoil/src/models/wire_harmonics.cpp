#include "libcoil/models/wire_harmonics.hpp"

#include <algorithm>
#include <cmath>
#include <complex>
#include <exception>
#include <numeric>
#include <optional>
#include <thread>
#include <utility>

#include <Eigen/Dense>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/models/shield.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "models/elliptic.hpp"
#include "models/solve_in_place.hpp"

namespace libcoil {

namespace {

using cd = std::complex<double>;

// s_m = J_{m+1}(z) / (z J_m(z)) for m = 0 .. M, by the backward recurrence s_{m-1} = 1 / (2m - z^2 s_m),
// which follows the minimal (regular) solution; s_m -> 1 / (2 (m + 1)) as z -> 0.
std::vector<cd> bessel_ratios(cd z, int M) {
    const int top = M + static_cast<int>(std::abs(z)) + 40;
    const cd z2 = z * z;
    cd s = 1.0 / (2.0 * (top + 1));
    std::vector<cd> out(static_cast<std::size_t>(M) + 1);
    for (int m = top; m >= 1; --m) {
        if (m <= M) out[static_cast<std::size_t>(m)] = s;
        s = 1.0 / (2.0 * m - z2 * s);
    }
    out[0] = s;
    return out;
}

}  // namespace

int harmonics_for(double pitch_to_wire, double d_over_delta) {
    require_positive("pitch_to_wire", pitch_to_wire);
    require_non_negative("d_over_delta", d_over_delta);
    // Measured (tests/cpp/test_wire_harmonics.cpp, six turns against 96 harmonics): the error falls
    // geometrically with M, more slowly the thinner the gap and the skin depth: 0.1 % needs M = 24 at
    // p/d 1.01 and d/delta 100, 12 at p/d 1.05, 6 at d/delta 10 for any pitch, 4 at d/delta 3.
    const double gap = std::max(pitch_to_wire - 1, 1e-4);
    const double m = 4 + 2 * std::sqrt(d_over_delta) * std::min(1.0, 0.1 / std::sqrt(gap));
    return static_cast<int>(std::clamp(std::ceil(m), 4.0, 64.0));
}

std::size_t wire_harmonic_unknowns(const Solenoid& coil, double resistivity, double frequency) {
    require_positive("resistivity", resistivity);
    require_non_negative("frequency", frequency);
    const double d = coil.wire().bare_diameter;
    return harmonic_unknowns_for(coil.turns(), coil.pitch_to_wire(), frequency > 0 ? d / skin_depth(resistivity, frequency) : 0.0);
}

std::size_t harmonic_unknowns_for(double turns, double pitch_to_wire, double d_over_delta) {
    const long n = std::max(1L, std::lround(turns));
    const int m = harmonics_for(n > 1 ? pitch_to_wire : 1e3, d_over_delta);
    return static_cast<std::size_t>((n + 1) / 2) * static_cast<std::size_t>(2 * m + 2);
}

bool wire_harmonics_apply(const Solenoid& coil, const Conductor& conductor, double temperature, double highest_frequency,
                          std::size_t max_unknowns) {
    return conductor.relative_permeability == 1 && !fat_wire(coil) &&
           wire_harmonic_unknowns(coil, conductor.resistivity_at(temperature), highest_frequency) <= max_unknowns;
}

WireHarmonicSolver::WireHarmonicSolver(const Solenoid& coil, double resistivity, int harmonics, std::optional<ShieldSpec> shield)
    : WireHarmonicSolver(coil_ring_centres(coil), coil.wire().radius(), resistivity, harmonics, std::move(shield)) {}

WireHarmonicSolver::WireHarmonicSolver(std::vector<std::pair<double, double>> rings, double wire_radius, double resistivity,
                                       int harmonics, std::optional<ShieldSpec> shield)
    : rings_(std::move(rings)), wire_radius_(wire_radius), resistivity_(resistivity), harmonics_(harmonics), shield_(std::move(shield)) {
    require_positive("wire_radius", wire_radius);
    require_positive("resistivity", resistivity);
    if (rings_.empty()) throw InputError("rings", "at least one ring is needed");
    if (harmonics < 0 || harmonics > 200) throw InputError("harmonics", std::to_string(harmonics) + " is outside 0 .. 200");
    min_gap_ = 1e300;
    for (std::size_t i = 0; i < rings_.size(); ++i) {
        require_positive("ring radius", rings_[i].first);
        require_finite("ring position", rings_[i].second);
        if (rings_[i].first <= wire_radius) throw InputError("ring radius", "must exceed the wire radius");
        for (std::size_t j = 0; j < i; ++j) {
            const double d = std::hypot(rings_[i].first - rings_[j].first, rings_[i].second - rings_[j].second) / (2 * wire_radius);
            if (d < 1) throw InputError("rings", "wires overlap: centre distance " + format_value(d) + " wire diameters, at least 1 expected");
            min_gap_ = std::min(min_gap_, d);
        }
    }
    // The mirror symmetry z -> -z, if the rings and the shield have it: then the cos harmonics of mirror
    // turns are equal, the sin harmonics opposite, and only one turn of each pair is solved for.
    partner_.assign(rings_.size(), -1);
    bool symmetric = !shield_ || shield_->axial_offset == 0;
    for (std::size_t i = 0; i < rings_.size() && symmetric; ++i) {
        for (std::size_t j = 0; j < rings_.size(); ++j) {
            if (std::fabs(rings_[j].first - rings_[i].first) <= 1e-12 * rings_[i].first &&
                std::fabs(rings_[j].second + rings_[i].second) <= 1e-12 * rings_[i].first) {
                partner_[i] = static_cast<int>(j);
            }
        }
        if (partner_[i] < 0) symmetric = false;
    }
    if (!symmetric) std::iota(partner_.begin(), partner_.end(), 0), mirror_ = false;
    else mirror_ = true;
}

namespace {

// Projections onto the harmonics on a circle of Q = 4M + 4 collocation points: rows 0, (1c, 1s), (2c, 2s), ...
Eigen::MatrixXd projections(int Q) {
    const int M = Q / 4 - 1;
    Eigen::MatrixXd P(2 * M + 1, Q);
    for (int q = 0; q < Q; ++q) {
        const double th = 2 * pi * q / Q;
        P(0, q) = 1.0 / Q;
        for (int m = 1; m <= M; ++m) {
            P(2 * m - 1, q) = 2.0 / Q * std::cos(m * th);
            P(2 * m, q) = 2.0 / Q * std::sin(m * th);
        }
    }
    return P;
}

// The gradient in the source centre (R, Z) of the smooth part of Maxwell's kernel at (r, z),
// S = M / (mu0 sqrt(r R)) + ln|x - x'|: M / (mu0 sqrt(r R)) = g(k) = (2/k - k) K - (2/k) E with
// g'(k) = (K - (2 - m) (K - E) / m) / k'^2 (from DLMF 19.4.1), m = k^2 = 4 r R / D, k'^2 = |x - x'|^2 / D,
// D = (r + R)^2 + (z - Z)^2. The logarithm's gradient cancels g's leading part near the source. Measured
// against mpmath's (40 digits, numerical derivative of S) on a wire's surface and two to six radii off it,
// at R / a = 6, 20 and 100: within 3e-13 of the gradient's scale, where the central difference it replaced
// (steps of 1e-4 a, four more evaluations of Maxwell's formula) erred by up to 5e-6 at R / a = 100.
std::pair<double, double> smooth_gradient(double r, double z, double R, double Z) {
    const double zeta = z - Z, D = (r + R) * (r + R) + zeta * zeta, rho2 = (r - R) * (r - R) + zeta * zeta;
    const double m = 4 * r * R / D, mc = rho2 / D, k = std::sqrt(m);
    const detail::EllipticPair e = detail::elliptic_k_and_k_minus_e_over_m(std::sqrt(mc), m);
    const double slope = (e.k - (2 - m) * e.k_minus_e_over_m) / mc / (2 * k);  // dg/dm
    const double dm_dR = 4 * r * (r * r - R * R + zeta * zeta) / (D * D), dm_dZ = 8 * r * R * zeta / (D * D);
    return {slope * dm_dR - (r - R) / rho2, slope * dm_dZ - zeta / rho2};
}

}  // namespace

// For each solved turn i (a representative) and each turn j: the field that j's unknowns (c_0, c_1c, c_1s, ...)
// produce at i's collocation points, projected onto i's harmonics, without the factors that depend on the
// frequency (j w and the Bessel ratio s_m of each harmonic's column, applied in the solve). A real B x U block
// per pair, at index (i * N + j) * B * U: Maxwell's M(r, R_j, z - z_j) a^2 / r for the net current, the
// multipoles' offsets (a / (x - x_j))^m and the dipoles' curvature term from the smooth kernel's gradient.
// About 16 bytes per element of the system matrix, as much as the matrix itself: 16 MB at the analysis's
// largest system (1000 unknowns, wire_harmonics_apply), freed when the call returns.
struct WireHarmonicSolver::Kernel {
    int points = 0;
    std::vector<double> projected;
};

const WireHarmonicSolver::Kernel& WireHarmonicSolver::kernel(const std::vector<double>& cth, const std::vector<double>& sth,
                                                             std::vector<Kernel>& kept, const std::vector<int>& reps) const {
    const int Q = static_cast<int>(cth.size()), N = static_cast<int>(rings_.size());
    for (const Kernel& k : kept) {
        if (k.points == Q) return k;
    }
    const int M = Q / 4 - 1, B = 2 * M + 1, U = B + 1;
    const double a = wire_radius_;
    const Eigen::MatrixXd P = projections(Q);
    Eigen::MatrixXd F(Q, U);
    Kernel k;
    k.points = Q;
    k.projected.resize(reps.size() * static_cast<std::size_t>(N) * static_cast<std::size_t>(B * U));
    std::size_t at = 0;
    for (const int i : reps) {
        const auto [Ri, zi] = rings_[static_cast<std::size_t>(i)];
        for (int j = 0; j < N; ++j, at += static_cast<std::size_t>(B * U)) {
            const auto [Rj, zj] = rings_[static_cast<std::size_t>(j)];
            F.setZero();
            for (int q = 0; q < Q; ++q) {
                const double r = Ri + a * cth[static_cast<std::size_t>(q)], z = zi + a * sth[static_cast<std::size_t>(q)];
                F(q, 1) = coaxial_mutual_inductance(r, Rj, z - zj) * a * a / r;
                const cd u = a / cd(r - Rj, z - zj);
                const double curv = std::sqrt(Rj / r);
                cd um = 1;
                for (int m = 1; m <= M; ++m) {
                    um *= u;
                    const double strength = mu0 * a * a / (2.0 * m) * curv;
                    F(q, 2 * m) = strength * um.real();
                    F(q, 2 * m + 1) = -strength * um.imag();
                }
                // The dipoles' curvature term: the smooth kernel's gradient at the source centre.
                const double dip = mu0 / (2 * pi) * curv * pi * a * a * a;
                const auto [grad_r, grad_z] = smooth_gradient(r, z, Rj, zj);
                F(q, 2) += dip * grad_r;
                F(q, 3) += dip * grad_z;
            }
            Eigen::Map<Eigen::MatrixXd>(k.projected.data() + at, B, U).noalias() = P * F;
        }
    }
    kept.push_back(std::move(k));
    return kept.back();
}

RingImpedance WireHarmonicSolver::solve(double frequency) const {
    std::vector<Kernel> kept;
    return solve(frequency, kept);
}

std::vector<RingImpedance> WireHarmonicSolver::solve(const std::vector<double>& frequencies, unsigned threads) const {
    for (const double f : frequencies) require_non_negative("frequency", f);
    const std::size_t count = frequencies.size();
    if (threads == 0) threads = std::max(1u, std::thread::hardware_concurrency());
    threads = static_cast<unsigned>(std::min<std::size_t>(threads, count));
    std::vector<RingImpedance> out(count);
    // Runs of neighbouring frequencies (which mostly share their count of harmonics, and so a kernel) of
    // about equal cost, a solve's growing as the cube of its unknowns: run k ends where the cost so far
    // passes (k + 1) / threads of the whole.
    std::vector<double> cost(count + 1, 0.0);
    for (std::size_t i = 0; i < count; ++i) cost[i + 1] = cost[i] + std::pow(2.0 * harmonics_at(frequencies[i]) + 2, 3);
    std::vector<std::size_t> start(threads + 1, count);
    start[0] = 0;
    for (unsigned k = 1; k < threads; ++k) {
        start[k] = static_cast<std::size_t>(std::lower_bound(cost.begin(), cost.end(), cost[count] * k / threads) - cost.begin());
        start[k] = std::clamp(start[k], start[k - 1], count);
    }
    std::vector<std::exception_ptr> failed(threads);
    const auto run = [&](unsigned k) {
        try {
            std::vector<Kernel> kept;
            for (std::size_t i = start[k]; i < start[k + 1]; ++i) out[i] = solve(frequencies[i], kept);
        } catch (...) {
            failed[k] = std::current_exception();
        }
    };
    std::vector<std::thread> pool;
    for (unsigned k = 1; k < threads; ++k) pool.emplace_back(run, k);
    if (threads > 0) run(0);
    for (auto& t : pool) t.join();
    for (const auto& e : failed) {
        if (e) std::rethrow_exception(e);
    }
    return out;
}

double WireHarmonicSolver::solved_frequency(double frequency) const {
    // DC as the limit: a frequency whose skin depth is 30 wire radii (R within 1e-7 of DC).
    return frequency > 0 ? frequency : resistivity_ / (pi * mu0 * 900 * wire_radius_ * wire_radius_);
}

int WireHarmonicSolver::harmonics_at(double frequency) const {
    const double d_over_delta = 2 * wire_radius_ / skin_depth(resistivity_, solved_frequency(frequency));
    return harmonics_ > 0 ? harmonics_ : harmonics_for(rings_.size() > 1 ? min_gap_ : 1e3, d_over_delta);
}

RingImpedance WireHarmonicSolver::solve(double frequency, std::vector<Kernel>& kept) const {
    require_non_negative("frequency", frequency);
    const double a = wire_radius_, sigma = 1 / resistivity_;
    const double f = solved_frequency(frequency);
    const double delta = skin_depth(resistivity_, f);
    const double omega = 2 * pi * f;
    const int M = harmonics_at(frequency);
    const int Q = 4 * M + 4;
    const int B = 2 * M + 1;  // unknowns and equations per turn
    const int N = static_cast<int>(rings_.size());

    const cd kappa_a = cd(1, -1) * (a / delta);
    const std::vector<cd> s = bessel_ratios(kappa_a, M);

    const Eigen::MatrixXd P = projections(Q);
    std::vector<double> cth(Q), sth(Q);
    for (int q = 0; q < Q; ++q) {
        cth[q] = std::cos(2 * pi * q / Q);
        sth[q] = std::sin(2 * pi * q / Q);
    }

    // Per turn: unknowns V, c_0, c_1c, c_1s, ..., c_Mc, c_Ms; equations: the 2M + 1 surface harmonics and
    // the turn's net current. With the mirror symmetry only the representative of each pair (the lower
    // index) is solved for; a partner's column enters its representative's with the sin harmonics negated.
    std::vector<int> reduced(static_cast<std::size_t>(N), -1), reps;
    for (int i = 0; i < N; ++i) {
        if (!mirror_ || i <= partner_[static_cast<std::size_t>(i)]) {
            reduced[static_cast<std::size_t>(i)] = static_cast<int>(reps.size());
            reps.push_back(i);
        }
    }
    for (int i = 0; i < N; ++i) {
        if (reduced[static_cast<std::size_t>(i)] < 0) reduced[static_cast<std::size_t>(i)] = reduced[static_cast<std::size_t>(partner_[static_cast<std::size_t>(i)])];
    }
    const int U = B + 1;
    const int H = static_cast<int>(reps.size());
    const Eigen::Index n = static_cast<Eigen::Index>(H) * U;
    struct System {};  // solve_in_place.hpp's storage, kept for this thread's next solve
    std::vector<cd> once;
    Eigen::Map<Eigen::MatrixXcd> A = detail::kept_matrix<cd, System>(n, once);
    A.setZero();
    Eigen::VectorXcd rhs = Eigen::VectorXcd::Zero(n);
    const cd jw(0, omega);
    Eigen::MatrixXd S(Q, U);
    Eigen::VectorXd g(Q);
    const Kernel& kern = kernel(cth, sth, kept, reps);
    // A shield's wall currents, driven by the turns' net currents (the harmonics' own fields reach the
    // wall as multipoles of order (wire radius / distance)^m and are left out).
    // Then (below) with the wall driven by the turns' dipoles too, in passes whose sources reach the same
    // radius each time (the outermost turn's plus half a wire radius): one wall, built and factored once,
    // takes them all, the filaments' own where it has the same rings.
    std::vector<WallRingCurrent> wall;
    std::optional<ShieldWall> filament_wall, dipole_wall;
    const ShieldWall* pass_wall = nullptr;
    const double hd = a / 2;  // the dipoles' half spacing
    if (shield_ && frequency > 0) {
        // Both walls span the wires' whole sections along the axis, so that the one serves the other where
        // only the radius differs.
        std::vector<WallRingCurrent> turns;
        for (const auto& [r, z] : rings_) turns.push_back({r, z, 1.0});
        const SourceReach filaments = reach_of_wires(rings_, 0, a);
        filament_wall.emplace(*shield_, filaments, f);
        wall = shield_wall_currents(*filament_wall, turns);
        SourceReach dipoles = filaments;
        dipoles.radius += hd;
        pass_wall = filament_wall->serves(dipoles) ? &*filament_wall : &dipole_wall.emplace(*shield_, dipoles, f);
    }
    // The mutual inductance of each wall ring with each collocation point (every solved wire's in turn, its
    // points in turn, the rings in turn).
    const auto for_each_mutual = [&](const std::vector<WallRingCurrent>& currents, const auto& take) {
        for (int ri = 0; ri < H; ++ri) {
            const auto [Ri, zi] = rings_[static_cast<std::size_t>(reps[static_cast<std::size_t>(ri)])];
            for (int q = 0; q < Q; ++q) {
                const double r = Ri + a * cth[q];
                for (const auto& ring : currents) take(coaxial_mutual_inductance(r, ring.radius, zi + a * sth[q] - ring.z));
            }
        }
    };
    // The wall's field projected on every wire's harmonics: the right-hand side it adds. `mutuals`, where
    // given, holds for_each_mutual's values for these rings (the passes below drive the same rings again).
    const auto wall_rhs = [&](const std::vector<WallRingCurrent>& currents, const std::vector<double>* mutuals) {
        std::vector<cd> flux(static_cast<std::size_t>(H) * static_cast<std::size_t>(Q), 0.0);
        std::size_t at = 0;
        const auto add = [&](double m) {
            flux[at / currents.size()] += currents[at % currents.size()].current * m;
            ++at;
        };
        if (mutuals) {
            for (const double m : *mutuals) add(m);
        } else {
            for_each_mutual(currents, add);
        }
        Eigen::VectorXcd out = Eigen::VectorXcd::Zero(n), field(Q);
        for (int ri = 0; ri < H; ++ri) {
            const double Ri = rings_[static_cast<std::size_t>(reps[static_cast<std::size_t>(ri)])].first;
            for (int q = 0; q < Q; ++q) field(q) = flux[static_cast<std::size_t>(ri * Q + q)] / (2 * pi * (Ri + a * cth[q]));
            out.segment(static_cast<Eigen::Index>(ri) * U, B) = -jw * (P.cast<cd>() * field);
        }
        return out;
    };
    for (int ri = 0; ri < H; ++ri) {
        const int i = reps[static_cast<std::size_t>(ri)];
        const auto [Ri, zi] = rings_[static_cast<std::size_t>(i)];
        const Eigen::Index row = static_cast<Eigen::Index>(ri) * U;
        // The surface current sqrt(R / r) sum c_k trig_k and the drive 1 / (2 pi r) on this wire's circle.
        S.setZero();
        for (int q = 0; q < Q; ++q) {
            const double r = Ri + a * cth[q];
            const double w = std::sqrt(Ri / r);
            S(q, 1) = w;
            for (int m = 1; m <= M; ++m) {
                S(q, 2 * m) = w * P(2 * m - 1, q) * Q / 2.0;
                S(q, 2 * m + 1) = w * P(2 * m, q) * Q / 2.0;
            }
            g(q) = 1 / (2 * pi * r);
        }
        const Eigen::VectorXd pg = P * g;
        A.block(row, row, B, U) += (P * S / sigma).cast<cd>();
        for (int k = 0; k < B; ++k) A(row + k, row) = -pg(k);
        // Net current: int sqrt(R / r) u_k dA to second order in (wire radius / ring radius).
        const double e2 = 3.0 / (8 * Ri * Ri);
        A(row + B, row + 1) = 2 * pi * a * a * s[0] + e2 * pi * std::pow(a, 4) * s[0] * (1.0 - 2.0 * s[1]);
        A(row + B, row + 2) = -pi * std::pow(a, 3) * s[1] / (2 * Ri);
        if (M >= 2) A(row + B, row + 4) = e2 * pi / 2 * std::pow(a, 4) * s[2];
        rhs(row + B) = 1.0;
        for (int j = 0; j < N; ++j) {
            const std::size_t at = (static_cast<std::size_t>(ri) * static_cast<std::size_t>(N) + static_cast<std::size_t>(j)) * static_cast<std::size_t>(B * U);
            const Eigen::Map<const Eigen::MatrixXd> pf(kern.projected.data() + at, B, U);
            // A mirror partner's sin harmonics are its representative's negated.
            const double mirrored = reps[static_cast<std::size_t>(reduced[static_cast<std::size_t>(j)])] != j ? -1.0 : 1.0;
            auto block = A.block(row, static_cast<Eigen::Index>(reduced[static_cast<std::size_t>(j)]) * U, B, U);
            block.col(1) += (jw * s[0]) * pf.col(1);
            for (int m = 1; m <= M; ++m) {
                const cd c = jw * s[static_cast<std::size_t>(m)];
                block.col(2 * m) += c * pf.col(2 * m);
                block.col(2 * m + 1) += (mirrored * c) * pf.col(2 * m + 1);
            }
        }
    }
    // A turn on the mirror plane has no sin harmonics: its sin equations and unknowns are 0 = 0, replaced by c = 0.
    for (int ri = 0; ri < H; ++ri) {
        const int i = reps[static_cast<std::size_t>(ri)];
        if (!mirror_ || partner_[static_cast<std::size_t>(i)] != i) continue;
        const Eigen::Index row = static_cast<Eigen::Index>(ri) * U;
        for (int m = 1; m <= M; ++m) {
            A.row(row + 2 * m).setZero();
            A.col(row + 2 * m + 1).setZero();
            A(row + 2 * m, row + 2 * m + 1) = 1.0;
            rhs(row + 2 * m) = 0.0;
        }
    }
    // The pass wall's rings' mutual inductances with the collocation points, taken once (where they fit in
    // 16 MB; the field's sums are the same to the bit).
    std::vector<double> pass_mutuals;
    if (pass_wall && static_cast<std::size_t>(H) * static_cast<std::size_t>(Q) * pass_wall->rings().size() <= (std::size_t{1} << 21)) {
        std::vector<WallRingCurrent> rings;
        for (const auto& [r, z] : pass_wall->rings()) rings.push_back({r, z, 0.0});
        for_each_mutual(rings, [&](double m) { pass_mutuals.push_back(m); });
    }
    const std::vector<double>* kept_mutuals = pass_mutuals.empty() ? nullptr : &pass_mutuals;
    const Eigen::PartialPivLU<Eigen::Ref<Eigen::MatrixXcd>> lu(A);  // in place
    Eigen::VectorXcd x = lu.solve(wall.empty() ? rhs : Eigen::VectorXcd(rhs + wall_rhs(wall, filament_wall && pass_wall == &*filament_wall ? kept_mutuals : nullptr)));
    const std::vector<WallRingCurrent> wall_by_filaments = wall;
    // Then with the wall driven by the turns' dipoles too: the proximity currents shift each turn's current
    // across its wire, and the flux that shift sends to the wall halved the wires' loss change in the tube
    // against the finite-element reference (left out, the shielded R read 2 % high). Each dipole as two
    // rings half a wire radius apart; repeated until the coil's Z settles to 1e-9 (three or four passes).
    cd last = 0;
    for (int pass = 0; pass < 8 && !wall.empty(); ++pass) {
        cd z = 0;
        for (int ri = 0; ri < H; ++ri) {
            const int i = reps[static_cast<std::size_t>(ri)];
            z += (partner_[static_cast<std::size_t>(i)] == i ? 1.0 : 2.0) * x(static_cast<Eigen::Index>(ri) * U);
        }
        if (pass > 0 && std::abs(z - last) <= 1e-9 * std::abs(z)) break;
        last = z;
        std::vector<WallRingCurrent> sources;
        for (int j = 0; j < N; ++j) {
            const auto [Rj, zj] = rings_[static_cast<std::size_t>(j)];
            const int rj = reduced[static_cast<std::size_t>(j)];
            const double sign = reps[static_cast<std::size_t>(rj)] == j ? 1.0 : -1.0;
            const Eigen::Index base = static_cast<Eigen::Index>(rj) * U;
            const cd pr = pi * a * a * a * s[1] * x(base + 2), pz = sign * pi * a * a * a * s[1] * x(base + 3);
            sources.push_back({Rj, zj, 1.0});
            sources.push_back({Rj + hd, zj, pr / (2 * hd)});
            sources.push_back({Rj - hd, zj, -pr / (2 * hd)});
            sources.push_back({Rj, zj + hd, pz / (2 * hd)});
            sources.push_back({Rj, zj - hd, -pz / (2 * hd)});
        }
        wall = shield_wall_currents(*pass_wall, sources);
        x = lu.solve(rhs + wall_rhs(wall, kept_mutuals));
    }
    cd total = 0;
    for (int ri = 0; ri < H; ++ri) {
        const int i = reps[static_cast<std::size_t>(ri)];
        total += (partner_[static_cast<std::size_t>(i)] == i ? 1.0 : 2.0) * x(static_cast<Eigen::Index>(ri) * U);
    }
    RingImpedance out;
    out.frequency = frequency;
    if (!wall.empty()) {
        // The wall's share as the shield ring model gives it (its currents driven by the turns' net currents):
        // j w sum_k M(wall ring k, turns) I_k per ampere. The rest of Z is the wires' own in the shield.
        cd dz = 0;
        for (const auto& ring : wall_by_filaments) {
            double m = 0;
            for (const auto& t : rings_) m += coaxial_mutual_inductance(ring.radius, t.first, ring.z - t.second);
            dz += jw * m * ring.current;
        }
        out.wall_resistance = finite_result("wire-harmonic solver", dz.real());
        out.wall_inductance = finite_result("wire-harmonic solver", dz.imag() / omega);
    }
    out.resistance = finite_result("wire-harmonic solver", total.real());
    out.inductance = finite_result("wire-harmonic solver", total.imag() / omega);
    return out;
}

}  // namespace libcoil
