#include "libcoil/studies/circuit_export.hpp"

#include <algorithm>
#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/studies/measurement.hpp"
#include "libcoil/studies/sweep.hpp"

namespace libcoil {

namespace {

using cd = std::complex<double>;

// The first two resonances read as a measurement's are (measurement.hpp), on a fine grid of the impedance.
MeasuredFigures resonances(const std::vector<double>& f, const std::vector<cd>& z) {
    MeasuredImpedance m;
    m.frequency = f;
    m.impedance = z;
    m.weight.assign(f.size(), 1.0);
    m.relative_error.assign(f.size(), 0.0);
    return measured_figures(m);
}

}  // namespace

CircuitExport circuit_export(const Analysis& a, const CircuitExportRequest& q) {
    CircuitExport out;
    out.name = a.spec.name;
    out.from = q.from.value_or(a.self_resonance_as_mounted / 1000);
    out.to = q.to.value_or(2.5 * a.self_resonance_as_mounted);
    require_positive("from", out.from);
    require_frequency("to", out.to);
    if (!(out.to > out.from)) throw InputError("to", format_quantity(out.to, Dimension::frequency) + " is not above from");
    if (q.points < 20 || q.points > 5000) throw InputError("points", std::to_string(q.points) + "; expected 20 .. 5000");
    if (q.order && (*q.order < 1 || *q.order > 30)) throw InputError("order", std::to_string(*q.order) + " pole pairs; expected 1 .. 30");
    SweepRequest s;
    s.frequencies = frequency_grid(out.from, out.to, q.points, Spacing::logarithmic);
    const Sweep sw = sweep_study(a, s);
    std::vector<cd> y, z;
    for (const auto& p : sw.points) {
        z.push_back(p.impedance);
        y.push_back(1.0 / p.impedance);
    }
    const auto judge = [&](int pairs) {
        CircuitExport c = out;
        c.pairs = pairs;
        c.fit = passive_fit(s.frequencies, y, pairs);
        c.circuit = foster_admittance(c.fit);
        for (std::size_t k = 0; k < z.size(); ++k) {
            const cd zf = 1.0 / c.fit(cd(0, 2 * pi * s.frequencies[k]));
            c.max_magnitude_error = std::max(c.max_magnitude_error, std::fabs(std::abs(zf) / std::abs(z[k]) - 1));
            c.max_phase_error = std::max(c.max_phase_error, std::fabs(std::arg(zf / z[k])) * 180 / pi);
        }
        c.least_real_part = least_real_part(c.fit, out.from / 1000, 100 * out.to);
        c.meets_goals = c.max_magnitude_error <= 0.01 && c.max_phase_error <= 1 && c.least_real_part >= 0;
        return c;
    };
    if (q.order) {
        out = judge(*q.order);
    } else {
        std::optional<CircuitExport> best;
        for (int pairs = 2; pairs <= 10; ++pairs) {
            CircuitExport c = judge(pairs);
            if (c.meets_goals) {
                best = c;
                break;
            }
            if (!best || (c.least_real_part >= 0 && c.max_magnitude_error < best->max_magnitude_error)) best = c;
        }
        out = *best;
    }
    if (!out.meets_goals) {
        out.notes.push_back("the fit misses its goals (1 % in |Z|, 1 degree, passive): " + format_value(100 * out.max_magnitude_error) +
                            " %, " + format_value(out.max_phase_error) + " degrees, least Re Y / |Y| " + format_value(out.least_real_part) +
                            "; try another --order or a narrower range");
    }
    // The resonances of model and fit, read the same way on a fine grid.
    const std::vector<double> fine = frequency_grid(out.from, out.to, 4000, Spacing::logarithmic);
    SweepRequest sf;
    sf.frequencies = fine;
    std::vector<cd> zm, zf;
    for (const auto& p : sweep_study(a, sf).points) zm.push_back(p.impedance);
    for (double f : fine) zf.push_back(1.0 / out.fit(cd(0, 2 * pi * f)));
    const MeasuredFigures rm = resonances(fine, zm), rf = resonances(fine, zf);
    out.model_self_resonance = rm.self_resonance;
    out.fitted_self_resonance = rf.self_resonance;
    out.model_second_resonance = rm.second_resonance;
    out.fitted_second_resonance = rf.second_resonance;
    if (!out.circuit.realisable) out.notes.push_back("some branch elements are negative (" + out.circuit.reason + "); the whole stays passive");
    return out;
}

}  // namespace libcoil
