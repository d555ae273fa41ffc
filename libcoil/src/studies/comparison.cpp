#include "libcoil/studies/comparison.hpp"

#include "libcoil/core/error.hpp"
#include "libcoil/studies/sweep.hpp"

namespace libcoil {

Comparison compare_study(const Analysis& a, const MeasuredImpedance& m, bool fit) {
    if (m.frequency.empty()) throw InputError("measurement", "no points");
    Comparison out;
    out.title = a.spec.name;
    out.measured = m;
    SweepRequest q;
    q.frequencies = m.frequency;
    const Sweep s = sweep_study(a, q);
    out.model = s.model;
    for (const auto& p : s.points) out.predicted.push_back(p.impedance);
    out.extracted = measured_figures(m);
    MeasuredImpedance p = m;
    p.impedance = out.predicted;
    out.from_prediction = measured_figures(p);
    if (fit) {
        out.fit = fit_measurement(a, m);
        p.impedance = out.fit->impedance;
        out.from_fit = measured_figures(p);
    }
    return out;
}

}  // namespace libcoil
