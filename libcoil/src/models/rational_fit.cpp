#include "libcoil/models/rational_fit.hpp"

#include <algorithm>
#include <cmath>

#include <Eigen/Dense>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"

namespace libcoil {

namespace {

using cd = std::complex<double>;

// The basis of the poles at s: for a real pole 1 / (s - a); for a pair (a, conj a) the two real-valued
// functions 1 / (s - a) + 1 / (s - conj a) and j / (s - a) - j / (s - conj a).
std::vector<cd> basis(const std::vector<cd>& poles, cd s) {
    std::vector<cd> out;
    for (std::size_t n = 0; n < poles.size(); ++n) {
        const cd a = poles[n];
        if (a.imag() == 0) {
            out.push_back(1.0 / (s - a));
        } else {
            out.push_back(1.0 / (s - a) + 1.0 / (s - std::conj(a)));
            out.push_back(cd(0, 1) / (s - a) - cd(0, 1) / (s - std::conj(a)));
            ++n;
        }
    }
    return out;
}

// Residues from the real-valued coefficients of basis().
std::vector<cd> residues_of(const std::vector<cd>& poles, const Eigen::VectorXd& x) {
    std::vector<cd> r;
    Eigen::Index k = 0;
    for (std::size_t n = 0; n < poles.size(); ++n) {
        if (poles[n].imag() == 0) {
            r.push_back(x[k++]);
        } else {
            const cd c(x[k], x[k + 1]);
            r.push_back(c);
            r.push_back(std::conj(c));
            k += 2;
            ++n;
        }
    }
    return r;
}

// The weighted real-valued least squares for fixed poles: [basis(poles), 1, s] x = f at s = j 2 pi f, each row
// over |f| (a relative fit), real and imaginary parts as rows of their own.
void residue_system(const std::vector<cd>& poles, const std::vector<double>& f, const std::vector<cd>& v, Eigen::MatrixXd& m,
                    Eigen::VectorXd& rhs) {
    const auto cols = static_cast<Eigen::Index>(basis(poles, cd(0, 1)).size() + 2);
    m.resize(static_cast<Eigen::Index>(2 * f.size()), cols);
    rhs.resize(static_cast<Eigen::Index>(2 * f.size()));
    for (std::size_t k = 0; k < f.size(); ++k) {
        const cd s(0, 2 * pi * f[k]);
        const double w = 1 / std::abs(v[k]);
        std::vector<cd> row = basis(poles, s);
        row.push_back(1);
        row.push_back(s);
        for (Eigen::Index c = 0; c < cols; ++c) {
            m(static_cast<Eigen::Index>(2 * k), c) = w * row[static_cast<std::size_t>(c)].real();
            m(static_cast<Eigen::Index>(2 * k + 1), c) = w * row[static_cast<std::size_t>(c)].imag();
        }
        rhs[static_cast<Eigen::Index>(2 * k)] = w * v[k].real();
        rhs[static_cast<Eigen::Index>(2 * k + 1)] = w * v[k].imag();
    }
}

// Column norms, to scale a system that spans decades of frequency (1 for a zero column).
Eigen::VectorXd column_scale(const Eigen::MatrixXd& m) {
    Eigen::VectorXd scale = m.colwise().norm().transpose();
    for (Eigen::Index c = 0; c < scale.size(); ++c) {
        if (scale[c] == 0) scale[c] = 1;
    }
    return scale;
}

// The fit's errors against the samples, relative.
void measure(RationalFit& out, const std::vector<double>& f, const std::vector<cd>& v) {
    double sum = 0;
    out.max_relative_error = 0;
    for (std::size_t k = 0; k < f.size(); ++k) {
        const double e = std::abs(out(cd(0, 2 * pi * f[k])) - v[k]) / std::abs(v[k]);
        sum += e * e;
        out.max_relative_error = std::max(out.max_relative_error, e);
    }
    out.rms_relative_error = std::sqrt(sum / static_cast<double>(f.size()));
}

}  // namespace

cd RationalFit::operator()(cd s) const {
    cd v = constant + s * proportional;
    for (std::size_t n = 0; n < poles.size(); ++n) v += residues[n] / (s - poles[n]);
    return v;
}

RationalFit vector_fit(const std::vector<double>& f, const std::vector<cd>& v, int order, int iterations) {
    if (f.size() != v.size()) throw InputError("values", "one value a frequency");
    if (order < 1 || order > 60) throw InputError("order", std::to_string(order) + "; expected 1 .. 60");
    if (f.size() < static_cast<std::size_t>(2 * order + 4)) throw InputError("frequencies", "too few points for order " + std::to_string(order));
    for (std::size_t k = 0; k < f.size(); ++k) {
        require_positive("frequencies", f[k]);
        if (!std::isfinite(v[k].real()) || !std::isfinite(v[k].imag()) || std::abs(v[k]) == 0) throw InputError("values", "not finite or zero at index " + std::to_string(k));
    }
    const double w_lo = 2 * pi * f.front(), w_hi = 2 * pi * f.back();
    // Starting poles: complex pairs spread logarithmically over the band, lightly damped; a real pole at the
    // band's bottom for an odd order.
    std::vector<cd> poles;
    const int pairs = order / 2;
    if (order % 2) poles.push_back(-w_lo);
    for (int k = 0; k < pairs; ++k) {
        const double b = w_lo * std::pow(w_hi / w_lo, pairs == 1 ? 0.5 : static_cast<double>(k) / (pairs - 1));
        poles.push_back(cd(-b / 100, b));
        poles.push_back(cd(-b / 100, -b));
    }
    const auto rows = static_cast<Eigen::Index>(2 * f.size());
    const auto n = static_cast<Eigen::Index>(poles.size());
    for (int it = 0; it < iterations; ++it) {
        // [basis, 1, s, -f basis] x = f, weighted by 1 / |f|.
        Eigen::MatrixXd m(rows, 2 * n + 2);
        Eigen::VectorXd rhs(rows);
        for (std::size_t k = 0; k < f.size(); ++k) {
            const cd s(0, 2 * pi * f[k]);
            const double w = 1 / std::abs(v[k]);
            const std::vector<cd> b = basis(poles, s);
            std::vector<cd> row;
            for (const cd& x : b) row.push_back(x);
            row.push_back(1);
            row.push_back(s);
            for (const cd& x : b) row.push_back(-v[k] * x);
            for (Eigen::Index c = 0; c < 2 * n + 2; ++c) {
                m(static_cast<Eigen::Index>(2 * k), c) = w * row[static_cast<std::size_t>(c)].real();
                m(static_cast<Eigen::Index>(2 * k + 1), c) = w * row[static_cast<std::size_t>(c)].imag();
            }
            rhs[static_cast<Eigen::Index>(2 * k)] = w * v[k].real();
            rhs[static_cast<Eigen::Index>(2 * k + 1)] = w * v[k].imag();
        }
        // Column scaling keeps the problem well conditioned over decades of frequency.
        Eigen::VectorXd scale = m.colwise().norm().transpose();
        for (Eigen::Index c = 0; c < scale.size(); ++c) {
            if (scale[c] == 0) scale[c] = 1;
        }
        const Eigen::VectorXd x = (m * scale.cwiseInverse().asDiagonal()).colPivHouseholderQr().solve(rhs).cwiseQuotient(scale);
        const Eigen::VectorXd ct = x.tail(n);
        // The zeros of sigma: eigenvalues of A - b ct^T in real form.
        Eigen::MatrixXd a = Eigen::MatrixXd::Zero(n, n);
        Eigen::VectorXd bv = Eigen::VectorXd::Zero(n);
        for (Eigen::Index k = 0; k < n; ++k) {
            const cd p = poles[static_cast<std::size_t>(k)];
            if (p.imag() == 0) {
                a(k, k) = p.real();
                bv[k] = 1;
            } else {
                a(k, k) = p.real();
                a(k, k + 1) = p.imag();
                a(k + 1, k) = -p.imag();
                a(k + 1, k + 1) = p.real();
                bv[k] = 2;
                ++k;
            }
        }
        const Eigen::VectorXcd z = (a - bv * ct.transpose()).eigenvalues();
        std::vector<cd> next;
        std::vector<cd> sorted(z.data(), z.data() + z.size());
        std::sort(sorted.begin(), sorted.end(), [](cd p, cd q) { return std::pair(p.imag(), p.real()) < std::pair(q.imag(), q.real()); });
        for (const cd& p0 : sorted) {
            cd p(p0.real() > 0 ? -p0.real() : p0.real(), p0.imag());  // reflect the unstable
            if (p.real() == 0) p = cd(-1e-6 * std::abs(p.imag()) - 1e-300, p.imag());
            if (std::fabs(p.imag()) < 1e-9 * std::abs(p)) {
                next.push_back(cd(p.real(), 0));
            } else if (p.imag() > 0) {
                next.push_back(p);
                next.push_back(std::conj(p));
            }
        }
        if (static_cast<Eigen::Index>(next.size()) != n) break;  // a pair split into two reals: keep the last poles
        poles = next;
    }
    // The residues with the poles fixed.
    Eigen::MatrixXd m;
    Eigen::VectorXd rhs;
    residue_system(poles, f, v, m, rhs);
    const Eigen::VectorXd scale = column_scale(m);
    const Eigen::VectorXd x = (m * scale.cwiseInverse().asDiagonal()).colPivHouseholderQr().solve(rhs).cwiseQuotient(scale);
    RationalFit out;
    out.poles = poles;
    out.residues = residues_of(poles, x.head(n));
    out.constant = x[n];
    out.proportional = x[n + 1];
    measure(out, f, v);
    return out;
}

namespace {

// min |A x - b| with x_i >= 0 where `bounded`, by Lawson and Hanson's active set; A's columns pre-scaled.
Eigen::VectorXd bounded_least_squares(const Eigen::MatrixXd& a, const Eigen::VectorXd& b, const std::vector<bool>& bounded) {
    const auto n = a.cols();
    std::vector<bool> passive(static_cast<std::size_t>(n));
    for (Eigen::Index j = 0; j < n; ++j) passive[static_cast<std::size_t>(j)] = !bounded[static_cast<std::size_t>(j)];
    const auto solve_on = [&](const std::vector<bool>& set) {
        std::vector<Eigen::Index> cols;
        for (Eigen::Index j = 0; j < n; ++j) {
            if (set[static_cast<std::size_t>(j)]) cols.push_back(j);
        }
        Eigen::VectorXd x = Eigen::VectorXd::Zero(n);
        if (cols.empty()) return x;
        Eigen::MatrixXd sub(a.rows(), static_cast<Eigen::Index>(cols.size()));
        for (std::size_t c = 0; c < cols.size(); ++c) sub.col(static_cast<Eigen::Index>(c)) = a.col(cols[c]);
        const Eigen::VectorXd z = sub.colPivHouseholderQr().solve(b);
        for (std::size_t c = 0; c < cols.size(); ++c) x[cols[c]] = z[static_cast<Eigen::Index>(c)];
        return x;
    };
    Eigen::VectorXd x = solve_on(passive);
    for (int outer = 0; outer < 3 * n + 10; ++outer) {
        const Eigen::VectorXd w = a.transpose() * (b - a * x);
        Eigen::Index best = -1;
        for (Eigen::Index j = 0; j < n; ++j) {
            if (!passive[static_cast<std::size_t>(j)] && w[j] > 1e-12 * (1 + b.norm()) && (best < 0 || w[j] > w[best])) best = j;
        }
        if (best < 0) break;
        passive[static_cast<std::size_t>(best)] = true;
        for (int inner = 0; inner < 3 * n + 10; ++inner) {
            const Eigen::VectorXd s = solve_on(passive);
            double step = 1;
            Eigen::Index hit = -1;
            for (Eigen::Index j = 0; j < n; ++j) {
                if (bounded[static_cast<std::size_t>(j)] && passive[static_cast<std::size_t>(j)] && s[j] <= 0) {
                    const double t = x[j] / (x[j] - s[j]);
                    if (t < step) {
                        step = t;
                        hit = j;
                    }
                }
            }
            if (hit < 0) {
                x = s;
                break;
            }
            x += step * (s - x);
            for (Eigen::Index j = 0; j < n; ++j) {
                if (bounded[static_cast<std::size_t>(j)] && passive[static_cast<std::size_t>(j)] && x[j] <= 1e-15 * (1 + std::fabs(x[j]))) {
                    passive[static_cast<std::size_t>(j)] = false;
                    x[j] = 0;
                }
            }
            passive[static_cast<std::size_t>(hit)] = false;
            x[hit] = 0;
        }
    }
    return x;
}

}  // namespace

RationalFit passive_fit(const std::vector<double>& f, const std::vector<cd>& v, int pairs, double per_decade) {
    if (pairs < 1 || pairs > 30) throw InputError("order", std::to_string(pairs) + " pole pairs; expected 1 .. 30");
    require_positive("per_decade", per_decade);
    const RationalFit first = vector_fit(f, v, 2 * pairs);
    std::vector<cd> poles;
    const double lo = 2 * pi * f.front() / 1000, hi = 2 * pi * f.back();
    const int reals = std::max(1, static_cast<int>(std::ceil(per_decade * std::log10(hi / lo))));
    for (int k = 0; k < reals; ++k) poles.push_back(-lo * std::pow(hi / lo, reals == 1 ? 0.0 : static_cast<double>(k) / (reals - 1)));
    for (const cd& p : first.poles) {
        if (p.imag() != 0) poles.push_back(p);
    }
    const auto n = static_cast<Eigen::Index>(poles.size());
    Eigen::MatrixXd m;
    Eigen::VectorXd rhs;
    residue_system(poles, f, v, m, rhs);
    const Eigen::VectorXd scale = column_scale(m);
    std::vector<bool> bounded(static_cast<std::size_t>(n + 2), false);
    for (int k = 0; k < reals; ++k) bounded[static_cast<std::size_t>(k)] = true;
    bounded[static_cast<std::size_t>(n)] = bounded[static_cast<std::size_t>(n + 1)] = true;
    const Eigen::VectorXd x = bounded_least_squares(m * scale.cwiseInverse().asDiagonal(), rhs, bounded).cwiseQuotient(scale);
    RationalFit out;
    // Real poles whose residue came out 0 carry nothing: left out.
    std::vector<cd> kept_poles, kept_residues;
    const std::vector<cd> r = residues_of(poles, x.head(n));
    for (std::size_t k = 0; k < poles.size(); ++k) {
        if (poles[k].imag() == 0 && r[k] == 0.0) continue;
        kept_poles.push_back(poles[k]);
        kept_residues.push_back(r[k]);
    }
    out.poles = kept_poles;
    out.residues = kept_residues;
    out.constant = x[n];
    out.proportional = x[n + 1];
    measure(out, f, v);
    return out;
}

FosterAdmittance foster_admittance(const RationalFit& y) {
    FosterAdmittance out;
    out.conductance = y.constant;
    out.capacitance = y.proportional;
    const auto refuse = [&](const std::string& why) {
        if (out.realisable) out.reason = why;
        out.realisable = false;
    };
    if (out.conductance < 0) refuse("a negative conductance across the terminals");
    if (out.capacitance < 0) refuse("a negative capacitance across the terminals");
    for (std::size_t n = 0; n < y.poles.size(); ++n) {
        const cd a = y.poles[n], c = y.residues[n];
        FosterBranch b;
        if (a.imag() == 0) {
            b.inductance = 1 / c.real();
            b.resistance = -a.real() / c.real();
        } else {
            const double alpha = -2 * a.real(), beta = -2 * (c.real() * a.real() + c.imag() * a.imag()), gamma = std::norm(a);
            b.inductance = 1 / (2 * c.real());
            b.resistance = b.inductance * (alpha - beta * b.inductance);
            b.capacitance = 1 / (b.inductance * (gamma - b.resistance * beta));
            b.conductance = beta * b.inductance * b.capacitance;
            ++n;
        }
        if (!(b.inductance > 0) || b.resistance < 0 || b.capacitance < 0 || b.conductance < 0 || !std::isfinite(b.capacitance)) {
            refuse("branch " + std::to_string(out.branches.size() + 1) + " would need a negative element");
        }
        out.branches.push_back(b);
    }
    return out;
}

double least_real_part(const RationalFit& y, double from, double to) {
    require_positive("from", from);
    require_positive("to", to);
    double least = y(cd(0, 0)).real() / std::max(1e-300, std::abs(y(cd(0, 0))));
    const int n = 4000;
    for (int k = 0; k < n; ++k) {
        const cd v = y(cd(0, 2 * pi * from * std::pow(to / from, k / (n - 1.0))));
        least = std::min(least, v.real() / std::abs(v));
    }
    return least;
}

}  // namespace libcoil
