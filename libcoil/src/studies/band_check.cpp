#include "libcoil/studies/band_check.hpp"

#include <cmath>
#include <functional>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"

namespace libcoil {

namespace {

constexpr int scan_points = 512;

// The lowest frequency in [lo, hi] where `fails` holds, given that it does not at lo and does at hi.
double bisect_failure(const std::function<bool(double)>& fails, double lo, double hi) {
    for (int i = 0; i < 200 && hi - lo > 1e-9 * hi; ++i) {
        const double mid = std::sqrt(lo * hi);
        (fails(mid) ? hi : lo) = mid;
    }
    return hi;
}

// Scans [low, ceiling]; `value(f)` is the quantity, `fails(v)` the verdict. Returns the first failure.
struct Scan {
    double worst = 0, worst_frequency = 0;
    std::optional<double> first_failure;
};

Scan scan(const BandSpec& b, const std::function<double(double)>& value, const std::function<bool(double)>& fails,
          const std::function<bool(double, double)>& worse) {
    Scan s;
    double previous = 0;
    for (int i = 0; i < scan_points; ++i) {
        const double f = b.low * std::pow(b.ceiling / b.low, static_cast<double>(i) / (scan_points - 1));
        const double v = value(f);
        if (i == 0 || worse(v, s.worst)) {
            s.worst = v;
            s.worst_frequency = f;
        }
        if (!s.first_failure && fails(v)) {
            s.first_failure = i == 0 ? f : bisect_failure([&](double x) { return fails(value(x)); }, previous, f);
        }
        previous = f;
    }
    return s;
}

}  // namespace

double required_srf_margin(const BandSpec& b) {
    const bool none = !b.srf_margin && !b.max_deviation && !b.min_impedance;
    return b.srf_margin.value_or(none ? default_srf_margin : 0);
}

double impedance_deviation(const ImpedancePoint& p, double nominal_inductance) {
    return p.magnitude() / (2 * pi * p.frequency * nominal_inductance) - 1;
}

std::optional<BandMiss> screen_srf_margin(const BandSpec& b, double srf) {
    if (const double k = required_srf_margin(b); k > 0 && srf < k * b.ceiling) return BandMiss{"srf_margin", k * b.ceiling / srf, srf, srf};
    return std::nullopt;
}

std::optional<BandMiss> screen_band(const BandSpec& b, const CoilImpedance& zc, int points) {
    if (auto miss = screen_srf_margin(b, zc.resonance_low())) return miss;
    if (!b.max_deviation && !b.min_impedance) return std::nullopt;
    std::vector<double> f(static_cast<std::size_t>(points));
    for (int i = 0; i < points; ++i) f[static_cast<std::size_t>(i)] = b.low * std::pow(b.ceiling / b.low, i / (points - 1.0));
    const double l = zc.nominal_inductance();
    for (const auto& p : zc.sweep(f)) {
        if (b.max_deviation) {
            const double dev = std::fabs(impedance_deviation(p, l));
            if (dev > *b.max_deviation) return BandMiss{"max_deviation", dev / *b.max_deviation, p.frequency, dev};
        }
        if (b.min_impedance && p.magnitude() < *b.min_impedance) {
            return BandMiss{"min_impedance", *b.min_impedance / p.magnitude(), p.frequency, p.magnitude()};
        }
    }
    return std::nullopt;
}

CriterionResult check_srf_margin(double srf, double ceiling, double margin) {
    CriterionResult r;
    r.name = "srf_margin";
    r.required = margin;
    r.worst = srf;
    r.worst_frequency = srf;
    r.margin = srf / (margin * ceiling);
    r.pass = r.margin >= 1;
    if (!r.pass) r.first_failure = srf / margin;  // the band may reach only this far
    return r;
}

BandCheck check_band(const BandSpec& b, const CoilImpedance& zc) {
    validate_band(b);
    BandCheck out;
    out.low = b.low;
    out.ceiling = b.ceiling;
    if (const double k = required_srf_margin(b); k > 0) {
        auto r = check_srf_margin(zc.resonance_low(), b.ceiling, k);
        r.defaulted = !b.srf_margin;
        out.criteria.push_back(r);
    }
    const double L = zc.nominal_inductance();
    if (b.max_deviation) {
        const double x = *b.max_deviation;
        const auto dev = [&](double f) { return impedance_deviation(zc.at(f), L); };
        const auto s = scan(b, dev, [&](double v) { return std::fabs(v) > x; },
                            [](double v, double w) { return std::fabs(v) > std::fabs(w); });
        CriterionResult r{"max_deviation", x, !s.first_failure, x - std::fabs(s.worst), s.worst, s.worst_frequency,
                          s.first_failure, false};
        out.criteria.push_back(r);
    }
    if (b.min_impedance) {
        const double zmin = *b.min_impedance;
        const auto mag = [&](double f) { return zc.at(f).magnitude(); };
        const auto s = scan(b, mag, [&](double v) { return v < zmin; }, [](double v, double w) { return v < w; });
        CriterionResult r{"min_impedance", zmin, !s.first_failure, s.worst / zmin, s.worst, s.worst_frequency,
                          s.first_failure, false};
        out.criteria.push_back(r);
    }
    out.pass = true;
    for (const auto& c : out.criteria) out.pass = out.pass && c.pass;
    return out;
}

}  // namespace libcoil
