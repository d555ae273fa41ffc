#include "libcoil/studies/fixture_study.hpp"

#include <algorithm>
#include <cmath>
#include <map>

#include <Eigen/Dense>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/inputs/network_file.hpp"
#include "libcoil/models/coupling.hpp"
#include "libcoil/studies/analysis.hpp"
#include "libcoil/studies/coupling_study.hpp"
#include "libcoil/studies/measurement.hpp"
#include "libcoil/studies/sweep.hpp"

namespace libcoil {

namespace {

using cd = std::complex<double>;

std::string part_field(std::size_t i, const char* key) { return "parts[" + std::to_string(i) + "]." + key; }

// A one-port file's Z at the frequencies (S, Y or Z as the file holds it, by measurement.hpp's reflection
// reading), interpolated linearly in its real and imaginary parts.
std::vector<cd> table_impedance(const std::filesystem::path& file, const std::vector<double>& f, const std::string& field) {
    NetworkData d;
    try {
        d = read_network_file(file.string());
    } catch (const InputError& e) {
        throw e.within(field);
    }
    if (d.ports != 1) throw InputError(field, file.string() + " has " + std::to_string(d.ports) + " ports; expected a one-port file");
    d.values = measured_impedance(d, MeasurementArrangement::reflection).impedance;
    d.parameter = 'Z';
    std::vector<cd> out;
    for (double x : f) out.push_back(matrix_at(d, x, field)[0]);
    return out;
}

class Network {
public:
    // Every part's Z at the frequencies `f`, each coil by its full analysis and sweep; a coil part without a
    // spec (the designed one) is given later by set_coil().
    Network(const FixtureSpec& fx, const std::vector<double>& f, FixtureResult* result) : fx_(fx), f_(f) {
        for (const auto& p : fx.parts) {
            if (p.kind == FixturePartKind::coupling) continue;
            for (const std::string& n : {p.from, p.to}) {
                if (n != fx.ground && !index_.count(n)) index_.emplace(n, static_cast<int>(index_.size()));
            }
        }
        for (std::size_t i = 0; i < fx.parts.size(); ++i) {
            const FixturePart& p = fx.parts[i];
            if (p.kind == FixturePartKind::coil && p.coil) {
                const Analysis a = [&] {
                    try {
                        return analyze(*p.coil);
                    } catch (const InputError& e) {
                        throw e.within(part_field(i, "coil"));
                    }
                }();
                SweepRequest q;
                q.frequencies = f;
                const Sweep s = sweep_study(a, q);
                std::vector<cd> z;
                for (const auto& pt : s.points) z.push_back(pt.impedance);
                set_coil(i, std::move(z), s.nominal_inductance);
                if (result) {
                    result->coils.push_back({p.name, p.source, s.nominal_inductance, s.self_resonance, std::string(choice_name(s.model))});
                    for (const auto& c : a.cautions) result->notes.push_back(p.name + ": " + c);
                }
            } else if (p.touchstone) {
                given_.emplace(i, table_impedance(*p.touchstone, f, part_field(i, "touchstone")));
            }
        }
        // Each coupling's M at each frequency: the bare coils' M less both shields' credited shielding.
        for (std::size_t i = 0; i < fx.parts.size(); ++i) {
            const FixturePart& k = fx.parts[i];
            if (k.kind != FixturePartKind::coupling) continue;
            const std::size_t a = part_index(k.from), b = part_index(k.to);
            if (!fx.parts[a].coil || !fx.parts[b].coil) throw InputError(part_field(i, "coils"), "a coupled coil has no spec");
            const CoilSpec &sa = *fx.parts[a].coil, &sb = *fx.parts[b].coil;
            double bare = 0;
            try {
                bare = coil_mutual_inductance(sa.solenoid, sb.solenoid, k.arrangement, k.distance, k.axial_offset);
            } catch (const InputError& e) {
                throw e.within("parts[" + std::to_string(i) + "]");
            }
            std::vector<double> m;
            for (double x : f) m.push_back(bare * std::pow(10.0, -credited_pair_shielding_db(sa, sb, k.distance, x) / 20));
            couplings_.push_back({i, a, b, std::move(m)});
            if (result) {
                result->notes.push_back(k.name + ": M between " + k.from + " and " + k.to + " " + format_quantity(bare, Dimension::inductance) +
                                        " bare (the coupling study's filament sum), less the shields' credited shielding; it acts "
                                        "on the coils' series branches, which holds well below their resonances");
            }
        }
    }

    void set_coil(std::size_t i, std::vector<cd> z, double nominal) {
        given_[i] = std::move(z);
        nominal_[i] = nominal;
    }

    // The part's Z at frequency index k, ideal or as built.
    cd part(std::size_t i, std::size_t k, bool ideal) const {
        const FixturePart& p = fx_.parts[i];
        const double w = 2 * pi * f_[k];
        if (p.kind == FixturePartKind::coil) return ideal ? cd(0, w * nominal_.at(i)) : given_.at(i)[k];
        if (p.touchstone) return given_.at(i)[k];
        cd z;
        switch (p.kind) {
            case FixturePartKind::resistor: z = p.value; break;
            case FixturePartKind::capacitor: z = 1.0 / cd(0, w * p.value); break;
            default: z = cd(0, w * p.value); break;
        }
        if (ideal) return z;
        z += cd(p.esr, w * p.esl);
        cd y = 1.0 / z;
        if (p.parallel_resistance) y += 1.0 / *p.parallel_resistance;
        if (p.parallel_capacitance) y += cd(0, w * *p.parallel_capacitance);
        return 1.0 / y;
    }

    // The ports' Z matrix at frequency index k; `ideal_all` makes every part ideal (a coupling: none),
    // `ideal_one` just that one; `free` replaces the part `free->first`'s Z by `free->second`.
    std::vector<cd> ports(std::size_t k, bool ideal_all, std::optional<std::size_t> ideal_one = std::nullopt,
                          std::optional<std::pair<std::size_t, cd>> free = std::nullopt) const {
        const auto n = static_cast<Eigen::Index>(index_.size());
        Eigen::MatrixXcd y = Eigen::MatrixXcd::Zero(n, n);
        // Stamp an admittance a between the branches' nodes (u1, v1) and (u2, v2): the current into u1 per volt
        // across (u2, v2).
        const auto stamp = [&](const FixturePart& p, const FixturePart& q, cd a) {
            const int u[2] = {node(p.from), node(p.to)}, v[2] = {node(q.from), node(q.to)};
            for (int r = 0; r < 2; ++r) {
                for (int c = 0; c < 2; ++c) {
                    if (u[r] >= 0 && v[c] >= 0) y(u[r], v[c]) += (r == c ? 1.0 : -1.0) * a;
                }
            }
        };
        const auto z_of = [&](std::size_t i) {
            if (free && free->first == i) return free->second;
            return part(i, k, ideal_all || ideal_one == i);
        };
        std::vector<bool> done(fx_.parts.size(), false);
        // A coupled pair: its branch impedance matrix [[Za, jwM], [jwM, Zb]] inverted and stamped whole.
        for (const auto& c : couplings_) {
            const bool off = ideal_all || ideal_one == c.part;
            const cd za = z_of(c.a), zb = z_of(c.b), zm(0, off ? 0.0 : 2 * pi * f_[k] * c.mutual[k]);
            const cd det = za * zb - zm * zm;
            stamp(fx_.parts[c.a], fx_.parts[c.a], zb / det);
            stamp(fx_.parts[c.b], fx_.parts[c.b], za / det);
            stamp(fx_.parts[c.a], fx_.parts[c.b], -zm / det);
            stamp(fx_.parts[c.b], fx_.parts[c.a], -zm / det);
            done[c.a] = done[c.b] = done[c.part] = true;
        }
        for (std::size_t i = 0; i < fx_.parts.size(); ++i) {
            if (done[i] || fx_.parts[i].kind == FixturePartKind::coupling) continue;
            stamp(fx_.parts[i], fx_.parts[i], 1.0 / z_of(i));
        }
        const auto m = static_cast<Eigen::Index>(fx_.ports.size());
        Eigen::MatrixXcd e = Eigen::MatrixXcd::Zero(n, m);
        for (Eigen::Index j = 0; j < m; ++j) {
            const FixturePort& p = fx_.ports[static_cast<std::size_t>(j)];
            if (node(p.from) >= 0) e(node(p.from), j) = 1;
            if (node(p.to) >= 0) e(node(p.to), j) = -1;
        }
        const Eigen::MatrixXcd z = e.transpose() * y.partialPivLu().solve(e);
        std::vector<cd> out;
        for (Eigen::Index r = 0; r < m; ++r) {
            for (Eigen::Index c = 0; c < m; ++c) {
                const cd v = z(r, c);
                if (!std::isfinite(v.real()) || !std::isfinite(v.imag())) {
                    throw DomainError("fixture: the port impedance at " + format_quantity(f_[k], Dimension::frequency) + " is not finite (an ideal resonance)");
                }
                out.push_back(v);
            }
        }
        return out;
    }

    std::size_t part_index(const std::string& name) const {
        for (std::size_t i = 0; i < fx_.parts.size(); ++i) {
            if (fx_.parts[i].name == name) return i;
        }
        throw InputError("parts", "no part named \"" + name + "\"");
    }

private:
    struct Coupled {
        std::size_t part, a, b;
        std::vector<double> mutual;  // H at each frequency
    };
    int node(const std::string& name) const { return name == fx_.ground ? -1 : index_.at(name); }
    const FixtureSpec& fx_;
    const std::vector<double>& f_;
    std::map<std::string, int> index_;
    std::map<std::size_t, std::vector<cd>> given_;
    std::map<std::size_t, double> nominal_;
    std::vector<Coupled> couplings_;
};

double deviation_of(cd z, cd ref, bool in_db) {
    const double ratio = std::abs(z) / std::abs(ref);
    return in_db ? 20 * std::log10(ratio) : ratio - 1;
}

std::vector<double> frequencies_of(const FixtureSpec& fx, const FixtureRequest& q) {
    if (!q.frequencies.empty()) {
        if (q.frequencies.size() > 1000000) throw InputError("frequencies", "at most 1000000");
        for (std::size_t i = 0; i < q.frequencies.size(); ++i) {
            require_positive("frequencies", q.frequencies[i]);
            if (i > 0 && !(q.frequencies[i] > q.frequencies[i - 1])) throw InputError("frequencies", "not rising at index " + std::to_string(i));
        }
        return q.frequencies;
    }
    const auto& r = fx.reference;
    const double from = q.from.value_or(fx.from.value_or(r ? r->band_low / 2 : 10e3));
    const double to = q.to.value_or(fx.to.value_or(r ? 2 * r->band_high : 300e6));
    return frequency_grid(from, to, q.points.value_or(fx.points), Spacing::logarithmic);
}

}  // namespace

std::complex<double> PortResponse::port_impedance(std::size_t k, std::complex<double> z) const {
    const auto& c = coefficients[k];
    return (c[0] * z + c[1]) / (c[2] * z + c[3]);
}

double PortResponse::deviation(std::size_t k, std::complex<double> z) const {
    return deviation_of(port_impedance(k, z), reference[k], criterion.in_db);
}

PortResponse port_response(const FixtureSpec& fx, std::string_view part, double nominal_inductance, const std::vector<double>& f) {
    if (!fx.reference) throw InputError("reference", "missing; a fixture criterion needs the reference's tolerance and band");
    require_positive("nominal_inductance", nominal_inductance);
    PortResponse out;
    out.criterion = *fx.reference;
    out.frequency = f;
    Network net(fx, out.frequency, nullptr);
    const std::size_t i = net.part_index(std::string(part));
    if (fx.parts[i].kind != FixturePartKind::coil) throw InputError("coil", "\"" + std::string(part) + "\" is not a coil part");
    net.set_coil(i, std::vector<cd>(f.size()), nominal_inductance);
    for (std::size_t k = 0; k < f.size(); ++k) {
        const double x = 2 * pi * f[k] * nominal_inductance;
        const cd z[3] = {cd(0, x), cd(0, 4 * x), cd(x, x / 4)};
        Eigen::Matrix<cd, 3, 4> m;
        for (int r = 0; r < 3; ++r) {
            const cd p = net.ports(k, false, std::nullopt, std::pair{i, z[r]})[0];
            m.row(r) << z[r], 1.0, -z[r] * p, -p;
        }
        Eigen::Vector4d scale;
        for (int c = 0; c < 4; ++c) scale(c) = std::max(m.col(c).norm(), 1e-300);
        const Eigen::Matrix<cd, 3, 4> ms = m * scale.cwiseInverse().asDiagonal();
        Eigen::JacobiSVD<Eigen::Matrix<cd, 3, 4>> svd(ms, Eigen::ComputeFullV);
        const Eigen::Matrix<cd, 4, 1> v = svd.matrixV().col(3).cwiseQuotient(scale.cast<cd>());
        out.coefficients.push_back({v(0), v(1), v(2), v(3)});
        if (fx.reference->table) continue;
        out.reference.push_back(net.ports(k, true)[0]);
    }
    if (fx.reference->table) out.reference = table_impedance(*fx.reference->table, f, "reference.table");
    return out;
}

std::vector<std::complex<double>> FixtureResult::s_parameters(std::size_t k) const {
    const auto m = static_cast<Eigen::Index>(ports.size());
    Eigen::MatrixXcd z(m, m), g = Eigen::MatrixXcd::Zero(m, m);
    for (Eigen::Index r = 0; r < m; ++r) {
        g(r, r) = ports[static_cast<std::size_t>(r)].reference;
        for (Eigen::Index c = 0; c < m; ++c) z(r, c) = impedance[k][static_cast<std::size_t>(r * m + c)];
    }
    const Eigen::MatrixXcd s = (z - g) * (z + g).inverse();
    std::vector<std::complex<double>> out;
    for (Eigen::Index r = 0; r < m; ++r) {
        for (Eigen::Index c = 0; c < m; ++c) out.push_back(s(r, c));
    }
    return out;
}

FixtureResult fixture_study(const FixtureSpec& fx, const FixtureRequest& q) {
    FixtureResult out;
    out.title = fx.name;
    out.description = fx.description;
    out.ports = fx.ports;
    out.notes = fx.notes;
    out.frequency = frequencies_of(fx, q);
    for (std::size_t i = 0; i < fx.parts.size(); ++i) {
        if (fx.parts[i].kind == FixturePartKind::coil && !fx.parts[i].coil) throw InputError(part_field(i, "spec"), "missing; the coil part needs a spec");
    }
    const Network net(fx, out.frequency, &out);
    for (std::size_t k = 0; k < out.frequency.size(); ++k) out.impedance.push_back(net.ports(k, false));
    if (!fx.reference) return out;

    const FixtureReference& r = *fx.reference;
    if (r.table) {
        out.reference = table_impedance(*r.table, out.frequency, "reference.table");
    } else {
        for (std::size_t k = 0; k < out.frequency.size(); ++k) out.reference.push_back(net.ports(k, true)[0]);
        for (const auto& p : fx.parts) {
            if (p.touchstone) out.notes.push_back("the ideal reference keeps " + p.name + " as its file gives it (a file has no ideal form)");
        }
    }
    FixtureVerdict v;
    v.band_low = r.band_low;
    v.band_high = r.band_high;
    v.tolerance = r.tolerance;
    v.in_db = r.in_db;
    v.pass = true;
    std::optional<std::size_t> worst;
    for (std::size_t k = 0; k < out.frequency.size(); ++k) {
        const double d = deviation_of(out.impedance[k][0], out.reference[k], r.in_db);
        out.deviation.push_back(finite_result("fixture deviation", d));
        const double f = out.frequency[k];
        if (f < r.band_low * (1 - 1e-12) || f > r.band_high * (1 + 1e-12)) continue;
        if (!worst || std::fabs(d) > std::fabs(v.worst_deviation)) {
            worst = k;
            v.worst_deviation = d;
            v.worst_frequency = f;
        }
        if (std::fabs(d) > r.tolerance && v.pass) {
            v.pass = false;
            v.first_failure = f;
        }
    }
    if (!worst) throw InputError("reference.band", "no frequency of the sweep lies in the band; widen the sweep");
    if (v.worst_deviation != 0) {
        const std::size_t k = *worst;
        for (std::size_t i = 0; i < fx.parts.size(); ++i) {
            const FixturePart& p = fx.parts[i];
            if (p.ideal() || p.touchstone) continue;
            const double d = deviation_of(net.ports(k, false, i)[0], out.reference[k], r.in_db);
            const double share = (std::fabs(v.worst_deviation) - std::fabs(d)) / std::fabs(v.worst_deviation);
            if (v.dominant_part.empty() || share > v.dominant_share) {
                v.dominant_part = p.name;
                v.dominant_share = share;
            }
        }
    }
    out.verdict = v;
    return out;
}

}  // namespace libcoil
