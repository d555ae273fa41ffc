#include "libcoil/studies/former_study.hpp"

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"

namespace libcoil {

FormerBuild build_former(const CoilSpec& spec, const FormerOptions& o) {
    FormerBuild b;
    b.name = spec.name.empty() ? "former" : spec.name;
    b.geometry = former_geometry(spec, o);
    b.chord_tolerance = o.chord_tolerance;
    const FormerMaterial material = spec.former ? spec.former->material : former_material("PETG");
    b.material = material.name;
    b.mesh = former_mesh(b.geometry, o.chord_tolerance);
    b.check = check_mesh(b.mesh);
    b.volume = b.geometry.volume();
    if (!b.check.sound()) throw DomainError("the former's mesh failed its own check; please report this spec");
    const Operating& op = spec.operating;
    if (op.temperature_given && material.max_service_temperature > 0) {
        const double t = op.temperature, limit = material.max_service_temperature;
        const std::string at = format_value(t - zero_celsius) + " \u00b0C";
        const std::string lim = format_value(limit - zero_celsius) + " \u00b0C";
        if (t > limit) {
            b.cautions.push_back("The winding runs at " + at + ", above " + b.material + "'s service temperature (" + lim +
                                 "): the former will soften and the pitch creep. Choose a material rated higher, or lower the current.");
        } else if (t > limit - 10) {
            b.cautions.push_back("The winding runs at " + at + ", within 10 K of " + b.material + "'s service temperature (" + lim +
                                 "). The estimate is for still air; measure the part under load before relying on it.");
        }
    }
    return b;
}

}  // namespace libcoil
