//! Wilhoit limits against equipartition, Wilhoit extrapolation against TRC heat-capacity
//! correlations, and the NASA-7 fits of the round-trip species (fit quality, exact anchors and
//! joins), with the error rows of species the tables cannot price.

mod common;

use std::collections::HashMap;
use std::path::PathBuf;

use common::Table;
use ringheat::input::read_records;
use ringheat::molecule::PerceivedMolecule;
use ringheat::report::cantera_yaml::CanteraYamlWriter;
use ringheat::report::polynomials::PolynomialJob;
use ringheat::thermo::modes::ModeCounts;
use ringheat::thermo::polynomials::{PolynomialOptions, PoorFit};
use ringheat::thermo::wilhoit::Wilhoit;
use ringheat::thermo::{EstimateOptions, GroupAdditivity};
use ringheat::units::{GAS_CONSTANT_J_PER_MOL_K as R, T_REF_K};

fn modes(smiles: &str) -> ModeCounts {
    match PerceivedMolecule::from_smiles(smiles) {
        Ok(p) => ModeCounts::of(&p),
        Err(e) => panic!("{smiles}: {e}"),
    }
}

/// Cp(0) and Cp(infinity) against the equipartition values worked by hand: Cv = R/2 per
/// translational and rotational degree of freedom, R per vibration, R/2 per free internal
/// rotor in place of its torsion; Cp = Cv + R (textbook statistical mechanics, recalled from
/// memory).
#[test]
fn limits_match_equipartition() {
    // (SMILES, Cp0/R, Cpinf/R)
    let cases = [
        // methane: 5 atoms, 9 vibrations: Cv(inf) = 3 + 9 = 12, Cp = 13.
        ("C", 4.0, 13.0),
        // acetylene, linear: 4 atoms, 7 vibrations: Cv(inf) = 2.5 + 7 = 9.5, Cp = 10.5.
        ("C#C", 3.5, 10.5),
        // carbon dioxide, linear: 3 atoms, 4 vibrations: Cp(inf) = 1 + 2.5 + 4 = 7.5.
        ("O=C=O", 3.5, 7.5),
        // ethane: 8 atoms, 18 modes of which 1 torsion -> rotor: Cp = 1 + 3 + 17 + 0.5.
        ("CC", 4.0, 21.5),
        // cyclopropane: 9 atoms, 21 vibrations, no rotor: Cp = 1 + 3 + 21.
        ("C1CC1", 4.0, 25.0),
        // ethanol: 9 atoms, 21 modes, 2 rotors (C-C, C-O): Cp = 1 + 3 + 19 + 1.
        ("CCO", 4.0, 24.0),
        // benzene: 12 atoms, 30 vibrations: Cp = 34.
        ("c1ccccc1", 4.0, 34.0),
    ];
    for (smiles, cp0, cp_inf) in cases {
        let m = modes(smiles);
        assert!((m.cp0_j() / R - cp0).abs() < 1e-12, "{smiles} Cp0");
        assert!((m.cp_inf_j() / R - cp_inf).abs() < 1e-12, "{smiles} Cpinf");
    }
}

/// A Wilhoit curve fitted to estimated Cp tends to the equipartition limits at both ends.
#[test]
fn fitted_curves_reach_their_limits() {
    let engine = GroupAdditivity::bundled().expect("bundled tables");
    for smiles in ["C1CC1", "CCO", "c1ccccc1", "ClCCl"] {
        let p = PerceivedMolecule::from_smiles(smiles).expect("test SMILES");
        let e = engine
            .estimate(&p, &EstimateOptions::default())
            .expect("estimate");
        let cp: Vec<(f64, f64)> = ringheat::thermo::estimate::CP_TEMPERATURES
            .iter()
            .zip(e.cp_j.expect("Cp").iter())
            .map(|(&t, q)| (t, q.value))
            .collect();
        let m = ModeCounts::of(&p);
        let w = Wilhoit::fit(&cp, m.cp0_j(), m.cp_inf_j(), (200.0, 3000.0)).expect("fit");
        assert!((w.cp_j(1e-3) - m.cp0_j()).abs() < 1e-3, "{smiles} at 0 K");
        assert!(
            (w.cp_j(1e9) - m.cp_inf_j()).abs() < 1e-2,
            "{smiles} at 1e9 K"
        );
    }
}

/// Wilhoit extrapolation on measured data: fitted to TRC correlation values at 300-1000 K only,
/// how far is it from the correlation at 1500 K? (TRC values as shipped in the chemicals
/// package, tests/reference/trc_heat_capacity.tsv.)
#[test]
fn extrapolation_against_trc_correlations() {
    let trc = Table::read("trc_heat_capacity.tsv");
    let thermo = Table::read("thermo_reference.tsv");
    let smiles_of: HashMap<String, String> = thermo
        .rows
        .iter()
        .map(|r| {
            (
                r.get(thermo.column("cas")).to_string(),
                r.get(thermo.column("smiles")).to_string(),
            )
        })
        .collect();
    let temps = [300.0, 400.0, 500.0, 600.0, 800.0, 1000.0];
    let cols: Vec<usize> = [
        "cp300_j", "cp400_j", "cp500_j", "cp600_j", "cp800_j", "cp1000_j",
    ]
    .iter()
    .map(|c| trc.column(c))
    .collect();
    let mut errors: Vec<(f64, String)> = Vec::new();
    for row in &trc.rows {
        let Some(smiles) = smiles_of.get(row.get(trc.column("cas"))) else {
            continue;
        };
        let Ok(cp1500) = row.get(trc.column("cp1500_j")).parse::<f64>() else {
            continue;
        };
        let points: Option<Vec<(f64, f64)>> = temps
            .iter()
            .zip(cols.iter())
            .map(|(&t, &c)| row.get(c).parse::<f64>().ok().map(|v| (t, v)))
            .collect();
        let (Some(points), Ok(p)) = (points, PerceivedMolecule::from_smiles(smiles)) else {
            continue;
        };
        let m = ModeCounts::of(&p);
        if let Ok(w) = Wilhoit::fit(&points, m.cp0_j(), m.cp_inf_j(), (200.0, 3000.0)) {
            errors.push((100.0 * (w.cp_j(1500.0) - cp1500) / cp1500, smiles.clone()));
        }
    }
    let mut abs: Vec<f64> = errors.iter().map(|e| e.0.abs()).collect();
    abs.sort_by(f64::total_cmp);
    let n = abs.len();
    let median = abs[n / 2];
    let p90 = abs[(n * 9) / 10];
    let mean_signed = errors.iter().map(|e| e.0).sum::<f64>() / n as f64;
    println!(
        "Wilhoit from 300-1000 K to 1500 K against TRC, {n} species: median |error| {median:.2} \
         %, 90th percentile {p90:.2} %, mean signed {mean_signed:+.2} %"
    );
    errors.sort_by(|a, b| b.0.abs().total_cmp(&a.0.abs()));
    for (e, s) in errors.iter().take(5) {
        println!("  {e:+.2} %  {s}");
    }
    assert!(n >= 100, "only {n} species with TRC data to 1500 K");
    // Regression floors a little above the figures measured on 2026-12-02 (printed above).
    assert!(median < 1.5, "median {median:.2} %");
    assert!(p90 < 4.0, "90th percentile {p90:.2} %");
}

/// The export job with default options, keeping poor fits (flagged) so that they are measured.
fn flagging_job(engine: &GroupAdditivity) -> PolynomialJob<'_> {
    PolynomialJob {
        engine,
        estimate: EstimateOptions::default(),
        fit: PolynomialOptions {
            poor_fit: PoorFit::Flag,
            ..PolynomialOptions::default()
        },
    }
}

fn species_file() -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("tools/cantera_round_trip_species.smi")
}

/// The round-trip species: each is exported with a NASA-7 Cp within 0.5 % of the group values
/// at the tabulated temperatures, Hf298 and S298 exact, and the joins continuous; or it is an
/// error row because the tables lack a property.
#[test]
fn round_trip_species_fit_well() {
    let engine = GroupAdditivity::bundled().expect("bundled tables");
    let file = std::fs::File::open(species_file()).expect("species file");
    let records = read_records(std::io::BufReader::new(file), "species").expect("read");
    let job = flagging_job(&engine);
    let mut exported = 0;
    let mut over: Vec<String> = Vec::new();
    let mut worst: f64 = 0.0;
    let mut yaml = CanteraYamlWriter::new(Vec::new(), None);
    println!("species                 NASA-7 Cp dev % (at K)  Wilhoit dev %  H, S dev % vs curve 300-1500 K");
    for r in &records {
        let outcome = job.run(r);
        yaml.write_record(
            &r.place,
            &r.smiles,
            outcome.as_ref().map_err(|e| e.as_str()),
        )
        .expect("write");
        let s = match outcome {
            Ok(s) => s,
            Err(e) => {
                println!("{:<23} error: {e}", r.smiles);
                assert!(
                    e.contains("no heat capacity") || e.contains("no entropy"),
                    "{e}"
                );
                continue;
            }
        };
        let f = &s.fit;
        exported += 1;
        worst = worst.max(f.cp_deviation_pct);
        let (mut dh, mut ds): (f64, f64) = (0.0, 0.0);
        for t in [300.0, 500.0, 1000.0, 1500.0] {
            let c = f.curve_at(t);
            let h_scale = c.h_kj.abs().max(c.cp_j * t / 1000.0);
            dh = dh.max(100.0 * (f.nasa.h_kj(t) - c.h_kj).abs() / h_scale);
            ds = ds.max(100.0 * (f.nasa.s_j(t) - c.s_j).abs() / c.s_j);
        }
        println!(
            "{:<23} {:>6.3} ({:>4.0})            {:>6.3}         {dh:.4}, {ds:.4}",
            r.smiles, f.cp_deviation_pct, f.cp_deviation_at_k, f.wilhoit_cp_deviation_pct
        );
        if f.cp_deviation_pct >= 0.5 {
            over.push(format!("{} {:.3} %", r.smiles, f.cp_deviation_pct));
        }
        assert!(dh < 0.1 && ds < 0.1, "{}: H or S off the curve", r.smiles);
        assert!(f.join_mismatch < 1e-12, "{}: join", r.smiles);
        assert!((f.nasa.h_kj(T_REF_K) - f.tabulated.hf298_kj).abs() < 1e-9);
        assert!((f.nasa.s_j(T_REF_K) - f.tabulated.s298_j).abs() < 1e-9);
    }
    yaml.finish().expect("finish");
    println!(
        "{exported} of {} exported; worst NASA-7 Cp deviation {worst:.3} %",
        records.len()
    );
    assert!(exported >= 30);
    // Measured 2026-12-02: propylene oxide 0.551 % and epichlorohydrin 0.520 % pass 0.5 %;
    // their group-sum Cp bends sharply between 500 and 600 K (slope 19.5 then 14.7 J/(mol K)
    // per 100 K for propylene oxide), which no smooth curve follows: the Wilhoit curve itself
    // misses those points by 0.48 % and 0.45 %. Every other species is below 0.5 %.
    println!("past 0.5 %: {}", over.join(", "));
    assert!(over.len() <= 2, "fits past 0.5 %: {}", over.join(", "));
    assert!(worst < 0.6, "worst fit {worst:.3} %");
    let text = String::from_utf8(yaml_bytes(yaml)).expect("utf-8");
    let entries = text.lines().filter(|l| l.starts_with("- name: ")).count();
    let errors = text
        .lines()
        .filter(|l| l.starts_with("# not exported: "))
        .count();
    assert_eq!(entries, exported);
    assert_eq!(entries + errors, records.len());
}

fn yaml_bytes(w: CanteraYamlWriter<Vec<u8>>) -> Vec<u8> {
    w.into_inner()
}

/// Over every species of the reference set the tables can price, how many fits pass the
/// default threshold (printed; a regression floor below the figure of 2026-12-02).
#[test]
fn fit_quality_over_the_reference_set() {
    let engine = GroupAdditivity::bundled().expect("bundled tables");
    let thermo = Table::read("thermo_reference.tsv");
    let job = flagging_job(&engine);
    let mut devs = Vec::new();
    for row in &thermo.rows {
        let smiles = row.get(thermo.column("smiles"));
        let record = ringheat::input::records_from_arguments(&[smiles.to_string()]).remove(0);
        if let Ok(s) = job.run(&record) {
            devs.push(s.fit.cp_deviation_pct);
        }
    }
    devs.sort_by(f64::total_cmp);
    let n = devs.len();
    let within = |limit: f64| devs.iter().filter(|d| **d <= limit).count();
    println!(
        "NASA-7 fits of {n} species: median largest Cp deviation {:.3} %, within 0.5 %: {}, \
         within 1 % (the default threshold): {}",
        devs[n / 2],
        within(0.5),
        within(1.0)
    );
    assert!(n > 600);
    assert!(within(1.0) as f64 >= 0.97 * n as f64);
}
