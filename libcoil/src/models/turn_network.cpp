#include "libcoil/models/turn_network.hpp"

#include <algorithm>
#include <cmath>

#include <Eigen/Dense>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/coaxial_mutual.hpp"
#include "models/elliptic.hpp"
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

Matrix incidence(int n) {  // branch k runs from node k to node k + 1
    Matrix b = Matrix::Zero(n, n + 1);
    for (int k = 0; k < n; ++k) {
        b(k, k) = 1;
        b(k, k + 1) = -1;
    }
    return b;
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
    const double base = o.base_height < 0 ? coil.pitch() / 2 : o.base_height;
    if (grounded) require_positive("base_height", base);
    const double plane = f.z.front() - base;  // the ground plane's height
    Matrix l(n_, n_), p(n_, n_);
    const double self_l = mu0 * a * (std::log(8 * a / r) - 2), self_p = own_potential(a, r);
    for (int i = 0; i < n_; ++i) {
        for (int j = 0; j <= i; ++j) {
            const double dz = std::fabs(f.z[static_cast<std::size_t>(i)] - f.z[static_cast<std::size_t>(j)]);
            double lij = i == j ? self_l : coaxial_mutual_inductance(a, a, dz);
            double pij = i == j ? self_p : ring_potential(a, a, dz);
            if (grounded) {  // the images: charge of opposite sign, horizontal current reversed
                const double di = f.z[static_cast<std::size_t>(i)] + f.z[static_cast<std::size_t>(j)] - 2 * plane;
                lij -= coaxial_mutual_inductance(a, a, di);
                pij -= ring_potential(a, a, di);
            }
            l(i, j) = l(j, i) = w * w * lij;
            p(i, j) = p(j, i) = pij / o.relative_permittivity;
        }
    }
    Matrix avg = Matrix::Zero(n_, n_ + 1);  // a turn's potential: the mean of its end nodes'
    for (int k = 0; k < n_; ++k) avg(k, k) = avg(k, k + 1) = 0.5;
    Matrix cn = avg.transpose() * p.llt().solve(avg);
    if (grounded) cn = cn.bottomRightCorner(n_, n_).eval();  // node 0 is ground
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
    const Matrix k = b.transpose() * l.llt().solve(b);
    // Scale K to C's size: w0 about the coil's own resonance, so that C + K' is well conditioned.
    const double w0_squared = 1 / (l.sum() * c.trace());
    const Matrix ks = k / w0_squared;
    Eigen::GeneralizedSelfAdjointEigenSolver<Matrix> es(ks, c + ks, Eigen::EigenvaluesOnly);
    if (es.info() != Eigen::Success) throw DomainError("turn network: the eigenproblem did not converge");
    std::vector<double> f;
    for (int i = 0; i < m && static_cast<int>(f.size()) < count; ++i) {
        const double mu = es.eigenvalues()(i);
        if (!(mu > 1e-10 && mu < 1 - 1e-9)) continue;  // the common mode (0) and the alternating one (infinite)
        f.push_back(std::sqrt(mu / (1 - mu) * w0_squared) / (2 * pi));
    }
    return f;
}

std::complex<double> TurnNetwork::impedance(double frequency, double series_resistance, double loss_tangent) const {
    require_positive("frequency", frequency);
    require_non_negative("series_resistance", series_resistance);
    require_non_negative("loss_tangent", loss_tangent);
    using C = std::complex<double>;
    const double w = 2 * pi * frequency;
    const Eigen::Map<const Matrix> l(l_.data(), n_, n_);
    const bool grounded = mounting_ == Mounting::grounded_end;
    const int m = grounded ? n_ : n_ + 1;
    const Eigen::Map<const Matrix> c(c_.data(), m, m);
    ComplexMatrix zb = C(0, w) * l.cast<C>();
    zb.diagonal().array() += series_resistance / n_;
    Matrix b = incidence(n_);
    if (grounded) b = b.rightCols(n_).eval();
    const ComplexMatrix bc = b.cast<C>();
    ComplexMatrix y = bc.transpose() * zb.partialPivLu().solve(bc);
    y += C(0, w) * C(1, -loss_tangent) * c.cast<C>();
    Eigen::VectorXcd inject = Eigen::VectorXcd::Zero(m);
    inject(m - 1) = 1;  // into the far terminal; out of the near one, or of ground
    if (!grounded) inject(0) = -1;
    const Eigen::VectorXcd v = y.partialPivLu().solve(inject);
    const C z = grounded ? v(m - 1) : v(m - 1) - v(0);
    if (!std::isfinite(z.real()) || !std::isfinite(z.imag())) throw DomainError("turn network: Z is not finite (an exact resonance)");
    return z;
}

}  // namespace libcoil
