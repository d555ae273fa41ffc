#include "libcoil/outputs/former_files.hpp"

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <sstream>

#include <nlohmann/json.hpp>

#include "outputs/json_text.hpp"

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/outputs/files.hpp"
#include "libcoil/outputs/stl.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/version.hpp"
#include "core/text_format.hpp"

namespace libcoil {

namespace {

using detail::fixed;
using detail::xml_escape;

std::string mm(double m, int decimals = 3) { return fixed(m * 1e3, decimals); }
std::string q(double m) { return format_quantity(m, Dimension::length); }
const char* kind_words(FormerKind k) { return k == FormerKind::ribbed ? "ribbed former" : "grooved tube"; }

}  // namespace

std::string former_dimensions_yaml(const FormerBuild& b) {
    const FormerGeometry& g = b.geometry;
    std::ostringstream o;
    o << "# libcoil " << version << ": dimensions of the printed former, in mm unless stated.\n";
    o << "name: \"" << b.name << "\"\n";
    o << "kind: " << former_kind_name(g.kind) << "\nmaterial: " << b.material << "\n";
    o << "turns: " << detail::significant(g.turns, 12) << "\npitch: " << mm(g.pitch, 6) << "\n";
    o << "outer_diameter: " << mm(2 * g.outer_radius, 4) << "\nroot_diameter: " << mm(2 * g.root_radius, 4)
      << "\nwire_centre_diameter: " << mm(2 * g.seat_radius, 4) << "\nbore_diameter: " << mm(2 * g.bore_radius, 4) << "   # as printed, with bore_oversize: " << mm(g.bore_oversize, 4) << "\n";
    o << "groove:\n  profile: " << choice_name(g.profile) << "\n  depth: " << mm(g.groove_depth(), 4) << "\n  width_at_wire_centre: "
      << mm(2 * g.groove_radius, 4) << "\n  clearance: " << mm(g.clearance, 4) << "\n  width_at_surface: " << mm(std::min(2 * g.half_width, g.pitch), 4) << "\n";
    if (g.profile == GrooveProfile::vee) o << "  angle_deg: " << detail::significant(2 * g.vee_half_angle * 180 / pi, 6) << "\n";
    o << "length: " << mm(g.length, 4) << "\nends: " << mm(g.ends, 4) << "\nwinding_length: " << mm(g.length - 2 * g.ends, 4) << "\n";
    if (g.flange_thickness > 0) o << "flange: {diameter: " << mm(2 * g.flange_radius, 4) << ", thickness: " << mm(g.flange_thickness, 4) << "}\n";
    if (g.kind == FormerKind::ribbed) {
        o << "ribs: {count: " << g.ribs << ", width_at_root: " << mm(g.rib_angle * g.root_radius, 4) << ", hub_diameter: " << mm(2 * g.hub_radius, 4)
          << ", from_z: " << mm(g.rib_zone_low, 4) << ", to_z: " << mm(g.rib_zone_high, 4) << "}\n";
    }
    o << "wire_cut_length: " << mm(g.wire_cut_length, 1) << "   # the winding plus the spec's leads\n";
    o << "volume_mm3: " << detail::significant(b.volume * 1e9, 7) << "\n";
    o << "mesh: {triangles: " << b.check.triangles << ", chord_tolerance: " << mm(b.chord_tolerance, 4)
      << ", volume_mm3: " << detail::significant(b.check.volume * 1e9, 7) << "}\n";
    if (!g.notes.empty()) {
        o << "notes:\n";
        for (const auto& n : g.notes) o << "  - \"" << n << "\"\n";
    }
    return o.str();
}

namespace {

// Drawing helpers in page pixels. A dimension: a line with arrow heads between two points, extension
// lines from the part, and the text at its middle.
struct Page {
    std::ostringstream o;
    void line(double x1, double y1, double x2, double y2, const char* style) {
        o << "<line x1=\"" << fixed(x1, 2) << "\" y1=\"" << fixed(y1, 2) << "\" x2=\"" << fixed(x2, 2) << "\" y2=\"" << fixed(y2, 2)
          << "\" " << style << "/>\n";
    }
    void text(double x, double y, const std::string& s, const char* extra = "") {
        o << "<text x=\"" << fixed(x, 2) << "\" y=\"" << fixed(y, 2) << "\" " << extra << ">" << xml_escape(s) << "</text>\n";
    }
    void dim(double x1, double y1, double x2, double y2, const std::string& label, const char* id, double value_mm, bool vertical_text = false) {
        o << "<g id=\"" << id << "\" data-value-mm=\"" << detail::significant(value_mm, 9) << "\">\n";
        line(x1, y1, x2, y2, "class=\"dim\" marker-start=\"url(#arrow)\" marker-end=\"url(#arrow)\"");
        const double mx = (x1 + x2) / 2, my = (y1 + y2) / 2;
        if (vertical_text) {
            o << "<text x=\"" << fixed(mx - 6, 2) << "\" y=\"" << fixed(my, 2) << "\" text-anchor=\"middle\" transform=\"rotate(-90 "
              << fixed(mx - 6, 2) << " " << fixed(my, 2) << ")\">" << xml_escape(label) << "</text>\n";
        } else {
            text(mx, my - 5, label, "text-anchor=\"middle\"");
        }
        o << "</g>\n";
    }
};

}  // namespace

std::string former_sheet_svg(const FormerBuild& b) {
    const FormerGeometry& g = b.geometry;
    const double W = 960, H = 600;
    // Section view: z to the right, r up and down from the axis.
    const double r_max = std::max(g.outer_radius, g.flange_radius);
    const double view_w = 520, view_h = 300;
    const double s = std::min(view_w / g.length, view_h / (2 * r_max));  // px per m
    const double x0 = 60, yc = 100 + view_h / 2;
    const auto X = [&](double z) { return x0 + s * z; };
    const auto Y = [&](double r) { return yc - s * r; };
    // The lower half through the rib (or the tube) half a turn on.
    double theta_low = pi;
    if (g.kind == FormerKind::ribbed) theta_low = 2 * pi * std::round(g.ribs / 2.0) / g.ribs;
    const auto upper = former_outline(g, 0, b.chord_tolerance);
    const auto lower = former_outline(g, theta_low, b.chord_tolerance);
    Page p;
    auto& o = p.o;
    o << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << W << "\" height=\"" << H << "\" viewBox=\"0 0 " << W << " " << H
      << "\" font-family=\"sans-serif\" font-size=\"12\" data-pitch-mm=\"" << detail::significant(g.pitch * 1e3, 9)
      << "\" data-outer-diameter-mm=\"" << detail::significant(2e3 * g.outer_radius, 9) << "\" data-root-diameter-mm=\""
      << detail::significant(2e3 * g.root_radius, 9) << "\" data-turns=\"" << detail::significant(g.turns, 12) << "\">\n";
    o << "<title>" << xml_escape(b.name) << ": former dimensions</title>\n";
    o << "<defs><marker id=\"arrow\" viewBox=\"0 0 10 10\" refX=\"5\" refY=\"5\" markerWidth=\"7\" markerHeight=\"7\" orient=\"auto-start-reverse\">"
         "<path d=\"M 0 1 L 9 5 L 0 9 z\" fill=\"#222\"/></marker>\n"
         "<style>.dim{stroke:#222;stroke-width:0.8} .ext{stroke:#777;stroke-width:0.5} .axis{stroke:#555;stroke-width:0.7;stroke-dasharray:12 3 2 3}"
         " .bore{stroke:#333;stroke-width:0.9;stroke-dasharray:5 3} .solid{fill:#e9dcc4;stroke:#333;stroke-width:0.9} .wire{fill:#c87533;stroke:#6b3b12;stroke-width:0.6}</style></defs>\n";
    o << "<rect width=\"" << W << "\" height=\"" << H << "\" fill=\"white\"/>\n";
    p.text(x0, 32, b.name, "font-size=\"16\" font-weight=\"bold\"");
    p.text(x0, 52, std::string(kind_words(g.kind)) + " of " + b.material + ", " + choice_name(g.profile) + " groove, " +
                       detail::significant(g.turns, 6) + " turns at " + mm(g.pitch, 4) + " mm pitch; dimensions in mm");

    // The section: solid between the outline and the bore (or the axis) on each side.
    const auto half = [&](const std::vector<OutlinePoint>& pts, double sign, const char* id) {
        o << "<path id=\"" << id << "\" class=\"solid\" d=\"M " << fixed(X(0), 2) << " " << fixed(yc - sign * s * g.bore_radius, 2);
        for (const auto& pt : pts) o << " L " << fixed(X(pt.z), 2) << " " << fixed(yc - sign * s * pt.r, 2);
        o << " L " << fixed(X(g.length), 2) << " " << fixed(yc - sign * s * g.bore_radius, 2) << " Z\"/>\n";
    };
    o << "<g id=\"section\">\n";
    half(upper, 1, "section-upper");
    half(lower, -1, "section-lower");
    if (g.kind == FormerKind::ribbed) {  // the hub between the ribs, seen beyond the section
        p.line(X(g.rib_zone_low), Y(g.hub_radius), X(g.rib_zone_high), Y(g.hub_radius), "class=\"bore\"");
        p.line(X(g.rib_zone_low), Y(-g.hub_radius), X(g.rib_zone_high), Y(-g.hub_radius), "class=\"bore\"");
    }
    if (g.bore_radius > 0) {
        p.line(X(0), Y(g.bore_radius), X(g.length), Y(g.bore_radius), "class=\"bore\"");
        p.line(X(0), Y(-g.bore_radius), X(g.length), Y(-g.bore_radius), "class=\"bore\"");
    }
    p.line(X(0) - 15, yc, X(g.length) + 15, yc, "class=\"axis\"");
    o << "</g>\n";

    // Dimensions: lengths below, diameters to the right, the pitch above.
    const double below = Y(-r_max) + 30;
    const double z_w0 = g.ends, z_w1 = g.length - g.ends;
    p.line(X(0), Y(-r_max) + 4, X(0), below + 22, "class=\"ext\"");
    p.line(X(g.length), Y(-r_max) + 4, X(g.length), below + 22, "class=\"ext\"");
    p.dim(X(0), below + 18, X(g.length), below + 18, "length " + mm(g.length, 2), "dim-length", g.length * 1e3);
    p.line(X(z_w0), Y(-g.outer_radius) + 4, X(z_w0), below + 2, "class=\"ext\"");
    p.line(X(z_w1), Y(-g.outer_radius) + 4, X(z_w1), below + 2, "class=\"ext\"");
    p.dim(X(z_w0), below, X(z_w1), below, "winding " + mm(z_w1 - z_w0, 2), "dim-winding", (z_w1 - z_w0) * 1e3);
    double xr = X(g.length) + 40;
    const auto diameter = [&](double r, const std::string& what, const char* id) {
        p.line(X(g.length) + 4, Y(r), xr + 4, Y(r), "class=\"ext\"");
        p.line(X(g.length) + 4, Y(-r), xr + 4, Y(-r), "class=\"ext\"");
        p.dim(xr, Y(r), xr, Y(-r), what + " \u2300" + mm(2 * r, 2), id, 2e3 * r, true);
        xr += 34;
    };
    if (g.bore_radius > 0) diameter(g.bore_radius, "bore", "dim-bore");
    diameter(g.root_radius, "root", "dim-root");
    diameter(g.outer_radius, "outer", "dim-outer");
    if (g.flange_thickness > 0) diameter(g.flange_radius, "flange", "dim-flange");
    {  // the pitch between the first two groove centres on the upper side
        const double z1 = g.groove_start, z2 = g.groove_start + g.pitch, y = Y(r_max) - 22;
        p.line(X(z1), Y(g.root_radius), X(z1), y - 4, "class=\"ext\"");
        p.line(X(z2), Y(g.root_radius), X(z2), y - 4, "class=\"ext\"");
        p.dim(X(z1), y, X(z2), y, "", "dim-pitch", g.pitch * 1e3);
        p.text(X(z2) + 6, y + 4, "pitch " + mm(g.pitch, 4));
    }

    // Detail: one groove and half of each neighbour, magnified, with the wire seated.
    const double dx0 = 690, dy0 = 120, dw = 210;
    const double zc = g.groove_start + g.pitch * std::floor(g.turns / 2);
    const double r_lo = g.root_radius - 0.6 * g.wire_diameter, r_hi = g.outer_radius + 1.2 * g.wire_diameter;
    const double sd = dw / (2 * g.pitch);
    const auto DX = [&](double z) { return dx0 + dw / 2 + sd * (z - zc); };
    const auto DY = [&](double r) { return dy0 + sd * (r_hi - r); };
    const auto radius_at = [&](double z) {  // the outline, interpolated
        for (std::size_t i = 1; i < upper.size(); ++i) {
            if (upper[i].z >= z && upper[i - 1].z <= z && upper[i].z > upper[i - 1].z) {
                const double t = (z - upper[i - 1].z) / (upper[i].z - upper[i - 1].z);
                return upper[i - 1].r + t * (upper[i].r - upper[i - 1].r);
            }
        }
        return g.outer_radius;
    };
    o << "<g id=\"detail\">\n";
    p.text(dx0, dy0 - 12, "detail: one groove (x" + detail::significant(sd / s, 3) + ")", "font-weight=\"bold\"");
    o << "<clipPath id=\"detail-window\"><rect x=\"" << fixed(dx0, 2) << "\" y=\"" << fixed(dy0, 2) << "\" width=\"" << dw << "\" height=\""
      << fixed(DY(r_lo) - dy0, 2) << "\"/></clipPath>\n<g clip-path=\"url(#detail-window)\">\n";
    o << "<path class=\"solid\" d=\"M " << fixed(DX(zc - g.pitch), 2) << " " << fixed(DY(r_lo), 2) << " L " << fixed(DX(zc - g.pitch), 2) << " "
      << fixed(DY(radius_at(zc - g.pitch)), 2);
    for (const auto& pt : upper) {
        if (pt.z > zc - g.pitch && pt.z < zc + g.pitch) o << " L " << fixed(DX(pt.z), 2) << " " << fixed(DY(pt.r), 2);
    }
    o << " L " << fixed(DX(zc + g.pitch), 2) << " " << fixed(DY(radius_at(zc + g.pitch)), 2) << " L " << fixed(DX(zc + g.pitch), 2) << " "
      << fixed(DY(r_lo), 2) << " Z\"/>\n";
    for (int k = -1; k <= 1; ++k) {
        o << "<circle class=\"wire\" cx=\"" << fixed(DX(zc + k * g.pitch), 2) << "\" cy=\"" << fixed(DY(g.seat_radius), 2) << "\" r=\""
          << fixed(sd * g.wire_diameter / 2, 2) << "\"/>\n";
    }
    o << "</g>\n";
    const double xd = dx0 + dw + 12;
    p.line(DX(zc), DY(g.outer_radius), xd + 4, DY(g.outer_radius), "class=\"ext\"");
    p.line(DX(zc), DY(g.root_radius), xd + 4, DY(g.root_radius), "class=\"ext\"");
    p.dim(xd, DY(g.outer_radius), xd, DY(g.root_radius), "", "dim-depth", g.groove_depth() * 1e3);
    p.text(xd + 8, (DY(g.outer_radius) + DY(g.root_radius)) / 2 + 4, "depth");
    double ty = DY(r_lo) + 22;
    p.text(dx0, ty, "depth " + mm(g.groove_depth(), 3) + ", clearance " + mm(g.clearance, 3));
    p.text(dx0, ty += 16, "width at the wire's centre " + mm(2 * g.groove_radius, 3));
    p.text(dx0, ty += 16, "insulated wire " + mm(g.wire_diameter, 3) + ", centre \u2300" + mm(2 * g.seat_radius, 3));
    o << "</g>\n";

    // Notes block.
    double ny = below + 64;
    p.text(x0, ny, "wire to cut: " + mm(g.wire_cut_length, 0) + " mm (the winding and the spec's leads)");
    p.text(x0, ny += 16, "volume " + detail::significant(b.volume * 1e9, 5) + " mm\u00b3; mesh " + std::to_string(b.check.triangles) +
                             " triangles at " + mm(b.chord_tolerance, 3) + " mm chord tolerance");
    if (g.kind == FormerKind::ribbed) {
        p.text(x0, ny += 16, std::to_string(g.ribs) + " ribs, " + mm(g.rib_angle * g.root_radius, 2) + " wide at the root, hub \u2300" +
                                 mm(2 * g.hub_radius, 2) + "; lower half drawn through the rib opposite");
    }
    p.text(x0, ny += 16, "libcoil " + std::string(version) + ". Print a test piece and measure the pitch and root diameter before winding.",
           "fill=\"#555\"");
    o << "</svg>\n";
    return o.str();
}

std::string former_text_report(const FormerBuild& b, const std::vector<std::string>& files) {
    const FormerGeometry& g = b.geometry;
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 coil former\n" << b.name << "\n\n";
    o << "Former: " << kind_words(g.kind) << " of " << b.material << ", " << choice_name(g.profile) << " groove\n";
    o << "  " << detail::significant(g.turns, 6) << " turns at " << q(g.pitch) << " pitch\n";
    o << "  outer diameter " << q(2 * g.outer_radius) << ", groove root " << q(2 * g.root_radius) << " (wire centre "
      << q(2 * g.seat_radius) << ")";
    o << (g.bore_radius > 0 ? ", bore " + q(2 * g.bore_radius) : std::string(", solid")) << "\n";
    o << "  groove depth " << q(g.groove_depth()) << ", " << q(2 * g.groove_radius) << " wide at the wire's centre (clearance "
      << q(g.clearance) << ")\n";
    if (g.kind == FormerKind::ribbed) {
        o << "  " << g.ribs << " ribs, " << q(g.rib_angle * g.root_radius) << " wide at the root, on a hub of " << q(2 * g.hub_radius) << "\n";
    }
    if (g.flange_thickness > 0) o << "  flanges " << q(2 * g.flange_radius) << " x " << q(g.flange_thickness) << " at both ends\n";
    o << "  length " << q(g.length) << ": winding " << q(g.length - 2 * g.ends) << ", plain ends " << q(g.ends) << "\n";
    o << "  wire to cut " << detail::fixed(g.wire_cut_length, 3) << " m (the winding and the spec's leads)\n";
    const double v = b.volume;
    o << "  volume " << detail::significant(v * 1e6, 4) << " cm\u00b3 (the mesh's is " << detail::significant(100 * (b.check.volume / v - 1), 2)
      << " % from the closed form)\n";
    o << "Mesh: " << b.check.triangles << " triangles at " << q(b.chord_tolerance)
      << " chord tolerance; closed, 2-manifold, outward, no degenerate triangle (checked)\n";
    detail::list_section(o, "Cautions", b.cautions, "!");
    detail::list_section(o, "Notes", g.notes, "-");
    detail::written_section(o, files);
    return o.str();
}

std::string former_json_report(const FormerBuild& b, const std::vector<std::string>& files) {
    const FormerGeometry& g = b.geometry;
    nlohmann::ordered_json j;
    j["name"] = b.name;
    j["kind"] = former_kind_name(g.kind);
    j["material"] = b.material;
    j["triangles"] = b.check.triangles;
    j["volume_mm3"] = b.volume * 1e9;
    j["mesh_volume_mm3"] = b.check.volume * 1e9;
    j["outer_diameter_mm"] = 2e3 * g.outer_radius;
    j["root_diameter_mm"] = 2e3 * g.root_radius;
    j["wire_centre_diameter_mm"] = 2e3 * g.seat_radius;
    j["bore_diameter_mm"] = 2e3 * g.bore_radius;
    j["bore_oversize_mm"] = 1e3 * g.bore_oversize;
    j["pitch_mm"] = 1e3 * g.pitch;
    j["turns"] = g.turns;
    j["groove"] = {{"profile", choice_name(g.profile)}, {"depth_mm", 1e3 * g.groove_depth()}, {"clearance_mm", 1e3 * g.clearance},
                   {"width_at_wire_centre_mm", 2e3 * g.groove_radius}};
    j["length_mm"] = 1e3 * g.length;
    j["ends_mm"] = 1e3 * g.ends;
    if (g.flange_thickness > 0) j["flange"] = {{"diameter_mm", 2e3 * g.flange_radius}, {"thickness_mm", 1e3 * g.flange_thickness}};
    if (g.kind == FormerKind::ribbed) {
        j["ribs"] = {{"count", g.ribs}, {"width_at_root_mm", 1e3 * g.rib_angle * g.root_radius}, {"hub_diameter_mm", 2e3 * g.hub_radius}};
    }
    j["wire_cut_length_m"] = g.wire_cut_length;
    j["chord_tolerance_mm"] = 1e3 * b.chord_tolerance;
    j["mesh_check"] = {{"boundary_edges", b.check.boundary_edges}, {"overshared_edges", b.check.overshared_edges},
                       {"misoriented_edges", b.check.misoriented_edges}, {"nonmanifold_vertices", b.check.nonmanifold_vertices},
                       {"degenerate_triangles", b.check.degenerate_triangles}, {"sound", b.check.sound()}};
    j["files"] = files;
    j["cautions"] = b.cautions;
    j["notes"] = g.notes;
    return detail::json_text(j, 2);
}

std::vector<std::string> former_file_paths(const std::string& dir, const std::string& stem) {
    const std::filesystem::path d(dir);
    return {(d / (stem + ".former.stl")).string(), (d / (stem + ".former.svg")).string(), (d / (stem + ".former.yaml")).string()};
}

FileSet former_files(const FormerBuild& b, const std::string& dir, const std::string& stem, bool ascii_stl) {
    const auto paths = former_file_paths(dir, stem);
    return {{paths[0], ascii_stl ? stl_ascii(b.mesh, "libcoil_former") : stl_binary(b.mesh, "libcoil former, mm: " + b.name)},
            {paths[1], former_sheet_svg(b)},
            {paths[2], former_dimensions_yaml(b)}};
}

}  // namespace libcoil
