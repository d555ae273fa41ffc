// Internal: how far above the design screen's SRF the turn network's can lie (srf_screen_envelope.hpp, written
// by tools/srf_screen_envelope.py from random coils, bare and on formers). Measured bounds, not proven ones:
// tests/python/test_design_screen.py checks them on fresh coils, tests/cpp/test_design.cpp that these
// functions read the tables as the script does.
#pragma once

namespace libcoil::detail {

// A bare coil of p / d `spacing` (bare d), enamel thickness over d `coat`, l / D `length`, D / d `diameter`
// and N `turns`.
struct ScreenedCoil {
    double spacing, coat, length, diameter, turns;
    bool grounded;
};

// The bare turn network's SRF over the bare screen's (the sheath helix's where `by_helix`, else Medhurst's),
// at most: the envelope of its (p / d, l / D) bin, or the lesser of that and the fitted bound where the fit
// holds (inside its sample's range, by the helix).
double network_over_screen_bound(const ScreenedCoil& c, bool by_helix);

// On a former of relative permittivity `permittivity` (in air), wall over D `wall`, fill `fill`: the network's
// SRF on it over its bare SRF, divided by the same ratio of the sheath helix's, at most; 0 outside the fit's
// range (no bound).
double former_shift_bound(const ScreenedCoil& c, double permittivity, double wall, double fill);

// On such a former: the network's SRF over the sheath helix's, both on the former, at most; 0 outside the
// fit's range (the interior of the domain: the insulated gap 3 % of the insulated d or more, six turns or
// more, l / D 0.15 or more). Where it holds, one bound in place of the bare bound times the former's.
double network_over_mounted_bound(const ScreenedCoil& c, double permittivity, double wall, double fill);

}  // namespace libcoil::detail
