#include "libcoil/studies/measurement_fit.hpp"

#include <algorithm>
#include <array>
#include <cmath>

#include <Eigen/Dense>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "studies/mounted_network.hpp"

namespace libcoil {

namespace {

using cd = std::complex<double>;
constexpr int n_par = 5;
enum { eps_i, tan_i, cap_i, lead_i, scale_i };

struct Bounds {
    double low, high;
};

detail::NetworkTerms terms_of(const Eigen::Matrix<double, n_par, 1>& p) {
    return {p[eps_i], p[tan_i], p[cap_i], p[lead_i], p[scale_i]};
}

class Problem {
public:
    Problem(const Analysis& a, const MeasuredImpedance& m) : net_(a, m.frequency), m_(m) {
        for (std::size_t i = 0; i < m.frequency.size(); ++i) {
            if (m.weight[i] > 0 && m.frequency[i] > 0 && std::abs(m.impedance[i]) > 0) use_.push_back(i);
        }
    }
    std::vector<cd> impedance(const Eigen::Matrix<double, n_par, 1>& p) {
        std::vector<cd> z;
        for (const ImpedancePoint& q : net_.points(terms_of(p))) z.push_back(q.impedance);
        return z;
    }
    Eigen::VectorXd residual(const Eigen::Matrix<double, n_par, 1>& p) {
        const std::vector<cd> z = impedance(p);
        Eigen::VectorXd r(2 * use_.size());
        for (std::size_t k = 0; k < use_.size(); ++k) {
            const std::size_t i = use_[k];
            cd e;
            if (m_.measured_as) {  // in the measured S parameter, where the trace noise is
                const MeasurementArrangement how = *m_.measured_as;
                e = (measured_quantity(how, z[i], m_.reference) - measured_quantity(how, m_.impedance[i], m_.reference)) / trace_error;
            } else {
                e = (z[i] - m_.impedance[i]) / (std::abs(m_.impedance[i]) * sigma(i));
            }
            r[2 * k] = e.real();
            r[2 * k + 1] = e.imag();
        }
        return r;
    }
    // The misfit as a user reads it: the weighted rms of |Z - Z_i| / |Z_i|.
    double rms(const Eigen::Matrix<double, n_par, 1>& p) {
        const std::vector<cd> z = impedance(p);
        double w = 0, sum = 0;
        for (std::size_t i : use_) {
            w += m_.weight[i];
            sum += m_.weight[i] * std::norm((z[i] - m_.impedance[i]) / std::abs(m_.impedance[i]));
        }
        return std::sqrt(sum / w);
    }
    double self_resonance(const Eigen::Matrix<double, n_par, 1>& p) { return net_.self_resonance(terms_of(p)); }
    std::size_t points() const { return use_.size(); }

private:
    // Each point's relative standard deviation (each of the real and imaginary parts): the arrangement's
    // error for its trace noise where the measurement states it, else 1 % over the square root of its weight.
    double sigma(std::size_t i) const {
        const double e = i < m_.relative_error.size() ? m_.relative_error[i] : 0.0;
        return e > 0 ? e : 0.01 / std::sqrt(m_.weight[i]);
    }
    detail::MountedNetwork net_;
    const MeasuredImpedance& m_;
    std::vector<std::size_t> use_;
};

// The permittivity that puts the model's first resonance at the measured one: 1 / f^2 is nearly linear in
// it (the capacitance is), so a few secant steps on that.
double permittivity_for(Problem& pr, Eigen::Matrix<double, n_par, 1> p, double target, const Bounds& b) {
    const auto g = [&](double eps) {
        p[eps_i] = eps;
        const double f = pr.self_resonance(p);
        return 1 / (f * f) - 1 / (target * target);
    };
    double x0 = p[eps_i], g0 = g(x0);
    double x1 = std::clamp(x0 * 1.2, b.low, b.high);
    if (x1 == x0) x1 = std::clamp(x0 / 1.2, b.low, b.high);
    double g1 = g(x1);
    for (int k = 0; k < 8 && g1 != g0; ++k) {
        const double x2 = std::clamp(x1 - g1 * (x1 - x0) / (g1 - g0), b.low, b.high);
        if (std::fabs(x2 - x1) < 1e-6 * x1) return x2;
        x0 = x1;
        g0 = g1;
        x1 = x2;
        g1 = g(x1);
    }
    return x1;
}

}  // namespace

MeasurementFit fit_measurement(const Analysis& a, const MeasuredImpedance& m) {
    if (!a.self_resonance.network.available) throw InputError("fit", "the bench fit needs the turn network, which is not built for this coil (over 600 turns)");
    Problem pr(a, m);
    if (pr.points() < 3) throw InputError("fit", std::to_string(pr.points()) + " weighted points above 0 Hz; the fit needs at least 3");

    MeasurementFit out;
    const detail::NetworkTerms own = detail::spec_terms(a.spec);
    Eigen::Matrix<double, n_par, 1> p;
    p << own.former_permittivity, own.former_loss_tangent, own.stray_capacitance, own.lead_inductance, own.resistance_scale;
    const Eigen::Matrix<double, n_par, 1> typical = (Eigen::Matrix<double, n_par, 1>() << 0.3, 0.005, 0.3e-12, 5e-9, 0.05).finished();
    const double eps_low = std::max(1.0, a.spec.surroundings.relative_permittivity);
    const Bounds bounds[n_par] = {{eps_low, 30}, {0, 1}, {0, 1e-9}, {-1e-6, 1e-6}, {0.05, 20}};
    const char* names[n_par] = {"former_permittivity", "former_loss_tangent", "stray_capacitance", "lead_inductance", "resistance_scale"};
    const Dimension dims[n_par] = {Dimension::dimensionless, Dimension::dimensionless, Dimension::capacitance, Dimension::inductance,
                                   Dimension::dimensionless};
    std::array<bool, n_par> varied{};
    varied.fill(true);
    std::array<std::string, n_par> notes;
    if (!a.spec.former) {
        varied[eps_i] = varied[tan_i] = false;
        notes[eps_i] = notes[tan_i] = "held: the coil has no former";
    }

    Eigen::VectorXd r = pr.residual(p);
    out.residual_rms_before = pr.rms(p);
    out.points = static_cast<int>(pr.points());

    // The start, from the figures read the same way from the measurement and from the model: the leads'
    // inductance and the R factor from the low-frequency L and R, then the first resonance put where it was
    // measured by the stray capacitance (the lumped estimate C (f0^2 / f^2 - 1), C = 1 / (w0^2 L)), or, where
    // the model resonates too low already, by the former's permittivity.
    const MeasuredFigures seen = measured_figures(m);
    MeasuredImpedance model_view = m;
    model_view.impedance = pr.impedance(p);
    const MeasuredFigures own_figures = measured_figures(model_view);
    if (seen.reference_frequency == own_figures.reference_frequency) {
        p[lead_i] = std::clamp(p[lead_i] + seen.inductance - own_figures.inductance, bounds[lead_i].low, bounds[lead_i].high);
        if (own_figures.resistance > 0 && seen.resistance > 0) {
            p[scale_i] = std::clamp(p[scale_i] * seen.resistance / own_figures.resistance, bounds[scale_i].low, bounds[scale_i].high);
        }
    }
    if (seen.self_resonance) {
        const double f0 = pr.self_resonance(p), f1 = *seen.self_resonance;
        if (f0 > f1) {
            const double c = 1 / (std::pow(2 * pi * f0, 2) * a.inductance.recommended);
            p[cap_i] = std::clamp(p[cap_i] + c * (std::pow(f0 / f1, 2) - 1), bounds[cap_i].low, bounds[cap_i].high);
        } else if (varied[eps_i]) {
            p[eps_i] = permittivity_for(pr, p, f1, bounds[eps_i]);
        }
    } else {
        out.notes.push_back("the measurement does not reach the first self-resonance: the capacitances are fitted from its approach only");
    }
    r = pr.residual(p);

    // Levenberg-Marquardt in the scaled parameters x = p / typical.
    const auto jacobian = [&](const Eigen::Matrix<double, n_par, 1>& at, const Eigen::VectorXd& r0) {
        Eigen::MatrixXd j = Eigen::MatrixXd::Zero(r0.size(), n_par);
        // The network is rebuilt for a new permittivity: its column last, so that the others reuse it.
        for (int k : {tan_i, cap_i, lead_i, scale_i, eps_i}) {
            if (!varied[k]) continue;
            Eigen::Matrix<double, n_par, 1> q = at;
            double h = 1e-6 * std::max(std::fabs(at[k]), typical[k]);
            if (q[k] + h > bounds[k].high) h = -h;
            q[k] += h;
            j.col(k) = (pr.residual(q) - r0) * (typical[k] / h);
        }
        return j;
    };
    double cost = r.squaredNorm(), lambda = 1e-3;
    Eigen::MatrixXd j = jacobian(p, r);
    for (int k = 0; k < n_par; ++k) {
        if (varied[k] && j.col(k).norm() < 1e-9 * std::max(1.0, j.norm())) {
            varied[k] = false;
            j.col(k).setZero();
            notes[k] = "held: no effect on the measured impedance";
        }
    }
    for (out.iterations = 0; out.iterations < 100; ++out.iterations) {
        const Eigen::MatrixXd jtj = j.transpose() * j;
        const Eigen::VectorXd g = j.transpose() * r;
        bool stepped = false;
        for (int tries = 0; tries < 12 && !stepped; ++tries) {
            Eigen::MatrixXd lhs = jtj;
            for (int k = 0; k < n_par; ++k) lhs(k, k) = varied[k] ? jtj(k, k) * (1 + lambda) + 1e-12 : 1;
            const Eigen::VectorXd dx = lhs.ldlt().solve(-g);
            Eigen::Matrix<double, n_par, 1> q = p;
            for (int k = 0; k < n_par; ++k) {
                if (varied[k]) q[k] = std::clamp(p[k] + dx[k] * typical[k], bounds[k].low, bounds[k].high);
            }
            const Eigen::VectorXd rq = pr.residual(q);
            const double cq = rq.squaredNorm();
            if (cq < cost) {
                const double gain = (cost - cq) / cost;
                p = q;
                r = rq;
                cost = cq;
                lambda = std::max(lambda / 3, 1e-9);
                stepped = true;
                if (gain < 1e-10) out.converged = true;
            } else {
                lambda *= 4;
            }
        }
        if (!stepped) {
            out.converged = true;  // no step lowers the misfit: a minimum to the Jacobian's precision
            break;
        }
        if (out.converged) break;
        j = jacobian(p, r);
    }
    if (!out.converged) out.notes.push_back("the fit stopped after 100 iterations without settling; the values are its last");

    // Standard errors and correlation over the parameters the data can separate.
    j = jacobian(p, r);
    std::vector<int> free;
    for (int k = 0; k < n_par; ++k) {
        if (varied[k]) free.push_back(k);
    }
    Eigen::MatrixXd jf(j.rows(), static_cast<Eigen::Index>(free.size()));
    for (std::size_t c = 0; c < free.size(); ++c) jf.col(static_cast<Eigen::Index>(c)) = j.col(free[c]);
    Eigen::ColPivHouseholderQR<Eigen::MatrixXd> qr(jf);
    qr.setThreshold(1e-8);
    const Eigen::Index rank = qr.rank();
    if (rank < static_cast<Eigen::Index>(free.size())) {
        std::vector<int> kept;
        for (Eigen::Index c = 0; c < static_cast<Eigen::Index>(free.size()); ++c) {
            const int k = free[static_cast<std::size_t>(qr.colsPermutation().indices()[c])];
            if (c < rank) {
                kept.push_back(k);
            } else {
                varied[k] = false;
                notes[k] = "held: the data cannot separate it from the others";
            }
        }
        std::sort(kept.begin(), kept.end());
        free = kept;
        jf.resize(j.rows(), static_cast<Eigen::Index>(free.size()));
        for (std::size_t c = 0; c < free.size(); ++c) jf.col(static_cast<Eigen::Index>(c)) = j.col(free[c]);
    }
    const double dof = std::max(1.0, static_cast<double>(r.size()) - static_cast<double>(free.size()));
    const double s2 = cost / dof;
    const Eigen::MatrixXd cov = free.empty() ? Eigen::MatrixXd() : Eigen::MatrixXd((jf.transpose() * jf).inverse() * s2);

    out.parameters.resize(n_par);
    for (int k = 0; k < n_par; ++k) {
        FittedParameter& fp = out.parameters[static_cast<std::size_t>(k)];
        fp.name = names[k];
        fp.dimension = dims[k];
        fp.typical = typical[k];
        fp.value = finite_result("bench fit", p[k]);
        fp.varied = varied[k];
        fp.note = notes[k];
    }
    out.parameters[eps_i].start = own.former_permittivity;
    out.parameters[tan_i].start = own.former_loss_tangent;
    out.parameters[cap_i].start = own.stray_capacitance;
    out.parameters[lead_i].start = own.lead_inductance;
    out.parameters[scale_i].start = own.resistance_scale;
    for (std::size_t c = 0; c < free.size(); ++c) {
        FittedParameter& fp = out.parameters[static_cast<std::size_t>(free[c])];
        const auto ci = static_cast<Eigen::Index>(c);
        fp.standard_error = finite_result("bench fit", std::sqrt(std::max(0.0, cov(ci, ci))) * typical[free[c]]);
        fp.determined = fp.standard_error < fp.typical;
        if (!fp.determined) fp.note = "not determined: its standard error passes " + format_quantity(fp.typical, fp.dimension, 2);
        out.varied.push_back(fp.name);
        std::vector<double> row;
        for (std::size_t d = 0; d < free.size(); ++d) {
            const auto di = static_cast<Eigen::Index>(d);
            row.push_back(finite_result("bench fit", cov(ci, di) / std::sqrt(cov(ci, ci) * cov(di, di))));
        }
        out.correlation.push_back(row);
    }
    out.residual_rms_after = pr.rms(p);
    out.impedance = pr.impedance(p);
    out.self_resonance = pr.self_resonance(p);
    BenchCorrections& bc = out.corrections;
    if (a.spec.former) {
        bc.former_permittivity = p[eps_i];
        bc.former_loss_tangent = p[tan_i];
    }
    bc.stray_capacitance = p[cap_i];
    bc.lead_inductance = p[lead_i];
    bc.resistance_scale = p[scale_i];
    return out;
}

}  // namespace libcoil
