"""Checks ringheat's Cantera YAML export with Cantera (run by tools/cantera_round_trip.sh).

Arguments: the YAML written by `ringheat polynomials` and the JSON of the same run with
`--format json --at 300,500,1000,1500,2500`. Checks, each printed with its largest figure:

1. Cantera loads every exported species (and builds an ideal-gas phase of them); every input
   line is an entry or a `# not exported:` comment, and at least 30 species are exported.
2. Cantera's Cp, H and S equal ringheat's own polynomial values at 300, 500, 1000, 1500 and
   2500 K within 0.1 % (H relative to |H| or Cp*T, whichever is larger, since H on the
   formation scale can be near zero).
3. Cp, H and S are continuous across the common temperature of the two ranges: Cantera's
   values 1e-10 relative below and above it agree within 1e-6 relative (H as in 2).
4. Over 300-1500 K Cantera's H and S are within 0.1 % of ringheat's curve (the Wilhoit
   curve through the group values and its integrals from Hf298 and S298), and the fit quality
   (largest Cp deviation from the tabulated group values, 300-1500 K) is printed for every
   species, with those past the 0.5 % target named. At 2500 K the curve is an extrapolation;
   the differences are printed.
"""

import json
import sys

import cantera as ct

TEMPS = [300.0, 500.0, 1000.0, 1500.0, 2500.0]
TABULATED = (300.0, 1500.0)


def rel(a, b, scale=None):
    return abs(a - b) / (abs(b) if scale is None else scale)


def main(yaml_path, json_path):
    failures = []
    species = {s.name: s for s in ct.Species.list_from_file(yaml_path)}
    gas = ct.Solution(thermo="ideal-gas", species=list(species.values()))
    rows = json.load(open(json_path))
    with open(yaml_path) as f:
        comments = sum(1 for line in f if line.startswith("# not exported: "))
    exported = [r for r in rows if "error" not in r]
    errors = [r for r in rows if "error" in r]
    print(f"Cantera {ct.__version__}: {len(species)} species loaded, ideal-gas phase of "
          f"{gas.n_species} species; {len(errors)} input lines are error rows")
    for r in errors:
        print(f"  not exported: {r['input']}: {r['error']}")
    if len(species) != len(exported) or comments != len(errors):
        failures.append("entries or error comments do not match the input lines")
    if len(exported) < 30:
        failures.append(f"only {len(exported)} species exported")

    worst_poly = worst_join = worst_curve = 0.0
    past_target = []
    print(f"{'species':<24}{'name':<22}{'fit Cp dev %':>13}{'dH %':>9}{'dS %':>9}"
          f"{'dCp 2500 %':>12}")
    for r in exported:
        sp = species[r["cantera_name"]]
        th = sp.thermo
        curve_h = curve_s = 0.0
        for st in r["states"]:
            t = st["t_k"]
            cp = th.cp(t) / 1000.0  # J/(kmol K) -> J/(mol K)
            h = th.h(t) / 1e6  # J/kmol -> kJ/mol
            s = th.s(t) / 1000.0
            h_scale = max(abs(st["nasa_h_kj"]), st["nasa_cp_j"] * t / 1000.0)
            worst_poly = max(worst_poly, rel(cp, st["nasa_cp_j"]),
                             rel(h, st["nasa_h_kj"], h_scale), rel(s, st["nasa_s_j"]))
            if TABULATED[0] <= t <= TABULATED[1]:
                c_scale = max(abs(st["curve_h_kj"]), st["curve_cp_j"] * t / 1000.0)
                curve_h = max(curve_h, rel(h, st["curve_h_kj"], c_scale))
                curve_s = max(curve_s, rel(s, st["curve_s_j"]))
            else:
                dcp_2500 = 100.0 * (cp - st["curve_cp_j"]) / st["curve_cp_j"]
        worst_curve = max(worst_curve, curve_h, curve_s)
        t_mid = sp.input_data["thermo"]["temperature-ranges"][1]
        below, above = t_mid * (1 - 1e-10), t_mid * (1 + 1e-10)
        h_scale = max(abs(th.h(below)), th.cp(below) * t_mid)
        for f, scale in ((th.cp, abs(th.cp(below))), (th.h, h_scale), (th.s, abs(th.s(below)))):
            worst_join = max(worst_join, abs(f(below) - f(above)) / scale)
        fit = r["fit"]["cp_deviation_pct"]
        if fit >= 0.5:
            past_target.append(f"{r['input']} {fit:.3f} %")
        print(f"{r['input']:<24}{r['cantera_name']:<22}{fit:>13.3f}{100 * curve_h:>9.4f}"
              f"{100 * curve_s:>9.4f}{dcp_2500:>12.4f}")

    print(f"2. Cantera vs ringheat's polynomial values, 300-2500 K: largest {worst_poly:.2e} "
          f"relative (limit 1e-3)")
    print(f"3. continuity at the common temperature in Cantera: largest {worst_join:.2e} "
          f"relative (limit 1e-6)")
    print(f"4. Cantera H, S vs ringheat's curve, 300-1500 K: largest {100 * worst_curve:.4f} % "
          f"(limit 0.1 %)")
    fits = sorted(r["fit"]["cp_deviation_pct"] for r in exported)
    print(f"   fit quality: median {fits[len(fits) // 2]:.3f} %, largest {fits[-1]:.3f} %; "
          f"past the 0.5 % target: {', '.join(past_target) or 'none'}")
    if worst_poly > 1e-3:
        failures.append("Cantera differs from ringheat's polynomial values")
    if worst_join > 1e-6:
        failures.append("discontinuity at the common temperature")
    if worst_curve > 1e-3:
        failures.append("H or S off ringheat's curve by more than 0.1 %")
    if failures:
        print("Cantera round trip FAILED: " + "; ".join(failures))
        return 1
    print("Cantera round trip passed")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1], sys.argv[2]))
