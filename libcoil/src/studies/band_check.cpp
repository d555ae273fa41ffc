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

void validate_band(const BandSpec& b) {
    require_positive("band.low", b.low);
    require_positive("band.ceiling", b.ceiling);
    if (!(b.ceiling > b.low)) {
        throw InputError("band.ceiling", format_quantity(b.ceiling, Dimension::frequency) + " is not above band.low (" +
                                             format_quantity(b.low, Dimension::frequency) + "); expected the top of the band");
    }
    if (b.srf_margin) {
        require_finite("band.srf_margin", *b.srf_margin);
        require_at_least("band.srf_margin", *b.srf_margin, 1.0,
                         "the self-resonance must lie at least at the ceiling (a factor >= 1)");
    }
    if (b.max_deviation) require_positive("band.max_deviation", *b.max_deviation);
    if (b.min_impedance) require_positive("band.min_impedance", *b.min_impedance);
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
    const bool none = !b.srf_margin && !b.max_deviation && !b.min_impedance;
    if (b.srf_margin || none) {
        auto r = check_srf_margin(zc.self_resonance().frequency, b.ceiling, b.srf_margin.value_or(default_srf_margin));
        r.defaulted = none;
        out.criteria.push_back(r);
    }
    const double L = zc.dc_inductance();
    if (b.max_deviation) {
        const double x = *b.max_deviation;
        const auto dev = [&](double f) { return zc.at(f).magnitude() / (2 * pi * f * L) - 1; };
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
