// The coil as a helical transmission line: the sheath-helix dispersion, and Kandoian & Sichak's
// empirical helix velocity as a cross-check.
//
// Method:  the winding is replaced by a sheath helix of radius a (to the wire centre) that conducts only
//          along the wire direction, at pitch angle psi = atan(p / (pi D)). Fields ~ exp(j(wt - beta z)),
//          axisymmetric, with I0/K0 inside and outside, relative permittivity e1 inside and e2 outside.
//          The boundary conditions (E along the wire zero; tangential E, and H along the wire, continuous)
//          give, with x_i = a sqrt(beta^2 - e_i k^2) and k = w / c,
//              tan^2(psi) [x1 I0/I1 (x1) + x2 K0/K1 (x2)] = (k a)^2 [e1 I1/I0 (x1) / x1 + e2 K1/K0 (x2) / x2],
//          which for e1 = e2 = 1 is the familiar (x)^2 I0 K0 / (I1 K1) = (k a cot psi)^2. The derivation
//          is in docs/models.md. A former is a dielectric shell inside the helix: its permittivity enters
//          e1 weighted by the share of the mode's inner electric energy that lies in the shell (first-
//          order perturbation), times its fill (1 for a solid tube, the rib share for a ribbed former).
// Source:  the sheath helix of Ollendorff (1926) and Schelkunoff; the dispersion in this form as in
//          J. R. Pierce, "Traveling-Wave Tubes" (1950), ch. 3, and S. Sensiper (MIT thesis, 1951), from
//          memory. Its use for the self-resonance of coils: D. W. Knight (2010-2016). Kandoian & Sichak,
//          Electrical Communication 30 (1953): velocity factor 1 / sqrt(1 + 20 (D/p)^2.5 (D/lambda)^0.5),
//          quoted from memory.
// Domain:  slow waves (beta > k sqrt(max(e1, e2))) on a helix of many turns per wavelength; the wire's
//          own size, the turn-to-turn capacitance and radiation are outside the model.
// Accuracy: the dispersion is solved to 1e-13 relative by default (Newton's steps with the exact slope
//          from the slow-wave estimate, TOMS 748 as the fallback); an independent scipy implementation agrees to
//          1e-9 (tests/python/test_self_resonance.py). Limits: e1 = e2 = e scales every frequency by
//          1/sqrt(e) exactly; for large beta a the wave runs along the wire at c; for small beta a it
//          follows tan(psi) sqrt(2 (ln(2 / (beta a)) - gamma_E)) (tests/cpp/test_self_capacitance.cpp).
#pragma once

#include <cmath>
#include <span>
#include <utility>

namespace libcoil {

struct HelixMedium {
    double inner = 1;  // relative permittivity inside the sheath (effective, with any former)
    double outer = 1;  // relative permittivity outside
};

class SheathHelix {
public:
    // radius a (m, to the wire centre), pitch angle psi (rad, 0 < psi < pi/2). Throws InputError.
    SheathHelix(double radius, double pitch_angle, HelixMedium medium = {});
    // The same from tan(psi) = p / (pi D), which a coil has without trigonometry. Throws InputError.
    static SheathHelix with_pitch_tangent(double radius, double tangent, HelixMedium medium = {});

    // The dispersion function; zero on the mode. Requires beta > k sqrt(e) in both regions.
    double dispersion(double beta, double k) const;
    // Free-space wavenumber k (rad/m) at which the slow wave has axial wavenumber beta (rad/m).
    // Throws DomainError when no slow wave exists there.
    double wavenumber_for(double beta) const;
    // The same, starting from a nearby solution `guess` (a warm start; 0 for none, when the slow-wave estimate
    // serves; falls back to the full bracket), to a relative `tolerance` (the default is the one
    // wavenumber_for(beta) uses). In a uniform medium (inner = outer) both solve the tabulated dispersion
    // instead (no guess needed), where x = a sqrt(beta^2 - e k^2) lies in 2^-10 .. 64.
    double wavenumber_for(double beta, double guess, double tolerance = default_tolerance) const;
    // Several helices at once, each at its own beta: k where the tabulated dispersion of a uniform medium
    // finds it, the value wavenumber_for gives, to the bit; NaN elsewhere (a medium of two permittivities, a
    // root off the tables, a beta or k out of range), where the caller asks wavenumber_for, which says why.
    // Their Newton steps run side by side. InputError only for a bad tolerance or arrays of other lengths.
    static void tabulated_wavenumbers(std::span<const SheathHelix> helices, std::span<const double> beta, double tolerance,
                                      std::span<double> k);

    static constexpr double default_tolerance = 5.7e-14;  // 2^-44
    // The explicit estimate of k for beta with gamma = beta in both regions; its error is O((v/c)^2).
    double slow_wave_estimate(double beta) const;
    // Axial wavenumber beta of the slow wave at free-space wavenumber k.
    double axial_wavenumber(double k) const;
    // Phase velocity omega / beta (m/s) of the wave with axial wavenumber beta.
    double phase_velocity(double beta) const;

    double radius() const { return a_; }
    double pitch_angle() const { return std::atan(tan_); }
    const HelixMedium& medium() const { return m_; }

private:
    double full_bracket(double beta) const;
    double uniform_wavenumber(double x, double q) const;  // k from the tabulated root (x, Q(x)), unchecked
    // The dispersion and its derivative with respect to k, for Newton's steps.
    std::pair<double, double> dispersion_and_slope(double beta, double k) const;
    SheathHelix(double radius, double tangent, HelixMedium medium, int);  // tan(psi) given, checked by the callers
    double a_, tan_, tan2_;
    HelixMedium m_;
};

// Share of the electric energy inside the sheath (radius a) of the mode with inner radial wavenumber
// gamma and axial wavenumber beta that lies in the shell r_in <= r <= r_out (<= a). Ez ~ I0(gamma r),
// Er ~ (beta / gamma) I1(gamma r). In 0 .. 1.
double sheath_inner_energy_share(double a, double r_in, double r_out, double gamma, double beta);

// Kandoian & Sichak 1953: axial velocity factor v / c of a helix of diameter D and pitch p (m) at
// free-space wavelength lambda (m). Empirical, for air.
double kandoian_sichak_velocity_factor(double diameter, double pitch, double wavelength);

}  // namespace libcoil
