//! Group additivity against measured gas-phase data (CRC Handbook and ATcT 1.112 values carried by
//! the `chemicals` package; see tests/reference/thermo_reference.tsv for provenance).
//!
//! Prints coverage and mean absolute errors by class (acyclic, monocyclic, polycyclic, aromatic,
//! halogenated, N, S), the fraction of species within one and two reported uncertainties, the
//! worst species and every species not estimated with its reason, and asserts the targets that
//! are met. Entropies are checked against the CRC S298 and, where CRC has none, against the S298
//! of the species' TRC ideal-gas correlation (tests/reference/trc_heat_capacity.tsv; a species
//! whose two values differ by more than [`S_SOURCES_DISAGREE_J`] is left out of the S statistics). Species that a table entry was derived from
//! (`derived_from` names their CAS number and the properties) are left out of the error
//! statistics of those properties (of every property when `hf` is among them), since their
//! error is zero by construction.

mod common;

use common::Table;
use ringheat::data::Property;
use ringheat::molecule::PerceivedMolecule;
use ringheat::thermo::estimate::{EstimateOptions, GroupAdditivity};
use ringheat::thermo::uncertainty;

const KJ_PER_KCAL: f64 = 4.184;
/// CRC and TRC S298 further apart than this (J/(mol K)) leave the species out of the S
/// statistics: the same tolerance tools/make_reference.py uses against JANAF and Yaws.
const S_SOURCES_DISAGREE_J: f64 = 10.0;
/// Uncertainty of a CRC Hf298 without a stated one (kJ/mol), as the reference tables assume.
const CRC_HF_UNC_KJ: f64 = 2.0;
/// Uncertainty of a reference S298 (J/(mol K)): our choice (CRC and TRC agree within 1 on average).
const REF_S_UNC_J: f64 = 2.0;
/// Entropy error (cal/(mol K)) beyond which a species must carry a flag saying why (issue 8).
const S_FLAG_LIMIT_CAL: f64 = 8.0;

struct Outcome {
    cas: String,
    name: String,
    class: String,
    hetero: bool,
    cho_only: bool,
    elements: String,
    hf_err_kcal: f64,
    /// |error| / combined uncertainty (estimate and reference) of Hf298 and S298.
    hf_z: f64,
    s_z: Option<f64>,
    s_err_cal: Option<f64>,
    cp_err_cal: Option<f64>,
    flagged: bool,
    detail: String,
    /// Rows for tools/calibrate_uncertainty.py (target/tmp/uncertainty_terms.tsv).
    calibration: String,
}

fn mae(values: impl Iterator<Item = f64>) -> (f64, usize) {
    let (sum, n) = values.fold((0.0, 0usize), |(s, n), v| (s + v.abs(), n + 1));
    (if n == 0 { 0.0 } else { sum / n as f64 }, n)
}

/// Fractions of values whose |error| is within one and within two combined uncertainties.
fn within(z: impl Iterator<Item = f64>) -> (f64, f64) {
    let z: Vec<f64> = z.collect();
    let n = z.len().max(1) as f64;
    (
        z.iter().filter(|&&v| v <= 1.0).count() as f64 / n,
        z.iter().filter(|&&v| v <= 2.0).count() as f64 / n,
    )
}

/// Figures of one validation run.
#[derive(Clone, Copy)]
struct Figures {
    coverage: f64,
    hf_all: f64,
    hf_cho: f64,
    s_all: f64,
    s_halogenated: f64,
    cp_all: f64,
    hf_within: (f64, f64),
    s_within: (f64, f64),
    s_off_unflagged: usize,
}

fn halogenated(o: &Outcome) -> bool {
    ["F", "Cl", "Br", "I"]
        .iter()
        .any(|x| o.elements.contains(x))
}

/// The targets that are met: coverage >= 90 %, Hf298 MAE <= 1.5 kcal/mol over all species, S298
/// MAE <= 1.5 cal/(mol K) overall and <= 2.0 for halogenated species (issue 8), Cp298 MAE <= 1.0
/// cal/(mol K).
#[test]
fn group_additivity_meets_the_issue_targets() {
    let f = validate();
    assert!(
        f.coverage >= 0.90,
        "coverage {:.1} % < 90 %",
        100.0 * f.coverage
    );
    assert!(f.hf_all <= 1.5, "Hf298 MAE {:.2} > 1.5 kcal/mol", f.hf_all);
    assert!(f.s_all <= 1.5, "S298 MAE {:.2} > 1.5 cal/(mol K)", f.s_all);
    assert!(
        f.s_halogenated <= 2.0,
        "S298 MAE of halogenated species {:.2} > 2.0 cal/(mol K)",
        f.s_halogenated
    );
    assert!(
        f.cp_all <= 1.0,
        "Cp298 MAE {:.2} > 1.0 cal/(mol K)",
        f.cp_all
    );
}

/// Regression floors a little above the figures of 2026-12-02 (after the halogen entropy
/// review: coverage 90.8 %, Hf298 MAE 1.39 overall and 1.18 for C/H/O kcal/mol, S298 1.00
/// overall and 1.05 halogenated, Cp298 0.60 cal/(mol K)), so that a table or code change that
/// loses accuracy fails CI even while the targets still hold.
#[test]
fn group_additivity_does_not_regress() {
    let f = validate();
    let floors = [
        ("coverage", -f.coverage, -0.905),
        ("Hf298 MAE, all", f.hf_all, 1.42),
        ("Hf298 MAE, C/H/O", f.hf_cho, 1.20),
        ("S298 MAE", f.s_all, 1.05),
        ("S298 MAE, halogenated", f.s_halogenated, 1.15),
        ("Cp298 MAE", f.cp_all, 0.63),
    ];
    for (what, value, floor) in floors {
        assert!(
            value <= floor,
            "{what}: {:.3} is past its floor {:.3}",
            value.abs(),
            floor.abs()
        );
    }
}

/// Issue 8's Hf298 targets (1.0 kcal/mol for C/H/O, 1.3 overall). Not met on 2026-12-02: 1.18
/// and 1.39. For scale, tools/additivity_floor.py refits every term to this set: below 0.8 on
/// the species fitted, but about 1.3 on species left out of the fit (10-fold), worse than the
/// tables. Run with `cargo test --release --test thermo_validation -- --ignored --nocapture`.
#[test]
#[ignore = "the Hf298 targets (1.0 C/H/O, 1.3 overall) are not reached; see the README"]
fn group_additivity_meets_the_hf_targets() {
    let f = validate();
    assert!(
        f.hf_cho <= 1.0,
        "C/H/O Hf298 MAE {:.2} > 1.0 kcal/mol",
        f.hf_cho
    );
    assert!(f.hf_all <= 1.3, "Hf298 MAE {:.2} > 1.3 kcal/mol", f.hf_all);
}

/// Issue 8's uncertainty targets: >= 60 % of species within one reported uncertainty and >= 90 %
/// within two, for Hf298 and S298 each (the reference's own uncertainty combined in). The
/// method term per family (src/thermo/uncertainty.rs) is fitted to these species; the
/// cross-fitted figure (tools/calibrate_uncertainty.py: 81 % / 94 % and 88 % / 95 %) is in the
/// README.
#[test]
fn reported_uncertainties_cover_the_errors() {
    let f = validate();
    for (what, (one, two)) in [("Hf298", f.hf_within), ("S298", f.s_within)] {
        assert!(
            one >= 0.60 && two >= 0.90,
            "{what}: {:.0} % within 1 u, {:.0} % within 2 u",
            100.0 * one,
            100.0 * two
        );
    }
}

/// Issue 8: no species off by more than 8 cal/(mol K) in S298 without a flag saying why.
#[test]
#[ignore = "some species are still off by more than 8 cal/(mol K) without a flag; the test prints them"]
fn large_entropy_errors_carry_a_flag() {
    let f = validate();
    assert_eq!(
        f.s_off_unflagged, 0,
        "{} species off by more than {S_FLAG_LIMIT_CAL} cal/(mol K) without a flag",
        f.s_off_unflagged
    );
}

/// The figures, computed (and the report printed) once for all tests of this file.
fn validate() -> Figures {
    static FIGURES: std::sync::OnceLock<Figures> = std::sync::OnceLock::new();
    *FIGURES.get_or_init(run_validation)
}

/// Runs the comparison, prints the report and returns the figures.
fn run_validation() -> Figures {
    let engine = GroupAdditivity::bundled().expect("bundled tables load");
    // CAS numbers that table values were derived from: Hf298 (the species is then left out),
    // or S298 or Cp only.
    let t = &engine.tables;
    let mut derived = t.derived_cas(Property::Hf298);
    let mut s_derived = t.derived_cas(Property::S298);
    let mut cp_derived = t.derived_cas(Property::Cp);
    // Measured values judged unreliable (group-tables/reference/unreliable-species.toml) are no
    // check either: they are left out the same way.
    let unreliable = ringheat::data::UnreliableList::bundled().expect("unreliable list loads");
    for e in unreliable.iter() {
        for (p, set) in [
            (Property::Hf298, &mut derived),
            (Property::S298, &mut s_derived),
            (Property::Cp, &mut cp_derived),
        ] {
            if e.properties.contains(&p) {
                set.insert(e.cas.to_string());
            }
        }
    }

    let table = Table::read("thermo_reference.tsv");
    let trc = Table::read("trc_heat_capacity.tsv");
    let (t_cas, t_s) = (trc.column("cas"), trc.column("s298_j"));
    let trc_s: std::collections::HashMap<String, f64> = trc
        .rows
        .iter()
        .filter_map(|r| Some((r.get(t_cas).to_string(), r.get(t_s).parse().ok()?)))
        .collect();
    let col = |n: &str| table.column(n);
    let (c_cas, c_name, c_smiles, c_hf, c_s, c_cp, c_class, c_het, c_el, c_unc) = (
        col("cas"),
        col("name"),
        col("smiles"),
        col("hf298_kj"),
        col("s298_j"),
        col("cp298_j"),
        col("class"),
        col("hetero"),
        col("elements"),
        col("hf298_unc_kj"),
    );
    let mut outcomes = Vec::new();
    let mut failures: Vec<(String, String)> = Vec::new();
    let mut derived_rows = 0;
    for row in &table.rows {
        let cas = row.get(c_cas).to_string();
        if derived.contains(&cas) {
            derived_rows += 1;
            continue;
        }
        let name = row.get(c_name).to_string();
        let p = match PerceivedMolecule::from_smiles(row.get(c_smiles)) {
            Ok(p) => p,
            Err(e) => {
                failures.push((name, format!("parse: {e}")));
                continue;
            }
        };
        let est = match engine.estimate(&p, &EstimateOptions::default()) {
            Ok(e) => e,
            Err(e) => {
                failures.push((name, e.to_string()));
                continue;
            }
        };
        let measured = |c: usize| row.get(c).parse::<f64>().ok();
        let Some(hf) = measured(c_hf) else { continue };
        let Some(est_hf) = est.hf298_kj else {
            failures.push((name, "no Hf298 estimate".to_string()));
            continue;
        };
        // S298: CRC, else TRC; neither when the two disagree.
        let s_ref = match (measured(c_s), trc_s.get(&cas)) {
            (Some(c), Some(t)) if (c - t).abs() > S_SOURCES_DISAGREE_J => None,
            (Some(c), _) => Some(c),
            (None, t) => t.copied(),
        };
        let s_pair = s_ref.filter(|_| !s_derived.contains(&cas)).zip(est.s298_j);
        let s_err = s_pair.map(|(m, e)| (e.value - m) / KJ_PER_KCAL);
        let s_z = s_pair.map(|(m, e)| (e.value - m).abs() / e.uncertainty.hypot(REF_S_UNC_J));
        let hf_unc_ref = measured(c_unc).unwrap_or(CRC_HF_UNC_KJ);
        // The tables' own uncertainty (no method term) and the term families, for the
        // calibration of the method uncertainty (tools/calibrate_uncertainty.py).
        let table_unc = |pick: fn(&ringheat::groups::table::ThermoIncrement) -> f64| {
            est.terms
                .iter()
                .map(|t| (f64::from(t.count) * pick(&t.per_unit)).powi(2))
                .sum::<f64>()
                .sqrt()
        };
        let mut families: std::collections::BTreeMap<&str, u32> = Default::default();
        for t in &est.terms {
            for f in uncertainty::families(t) {
                *families.entry(f.label()).or_default() += t.count;
            }
        }
        let families: String = families
            .iter()
            .map(|(f, n)| format!("{f}:{n}"))
            .collect::<Vec<_>>()
            .join(" ");
        let cp_err = measured(c_cp)
            .filter(|_| !cp_derived.contains(&cas))
            .zip(est.cp298_j())
            .map(|(m, e)| (e.value - m) / KJ_PER_KCAL);
        outcomes.push(Outcome {
            cas,
            name,
            class: row.get(c_class).to_string(),
            hetero: row.get(c_het) == "1",
            cho_only: row.get(c_el).chars().all(|c| "CHO".contains(c)),
            elements: row.get(c_el).to_string(),
            hf_err_kcal: (est_hf.value - hf) / KJ_PER_KCAL,
            hf_z: (est_hf.value - hf).abs() / est_hf.uncertainty.hypot(hf_unc_ref),
            s_z,
            calibration: {
                let mut rows = format!(
                    "{}\thf\t{:.3}\t{:.3}\t{hf_unc_ref:.3}\t{families}\n",
                    row.get(c_cas),
                    est_hf.value - hf,
                    table_unc(|v| v.unc_hf_kj)
                );
                if let Some((m, e)) = s_pair {
                    rows.push_str(&format!(
                        "{}\ts\t{:.3}\t{:.3}\t{REF_S_UNC_J:.3}\t{families}\n",
                        row.get(c_cas),
                        e.value - m,
                        table_unc(|v| v.unc_s_j)
                    ));
                }
                rows
            },
            s_err_cal: s_err,
            cp_err_cal: cp_err,
            flagged: !est.flags.is_empty(),
            detail: format!(
                "{}\t{:.2}\t{:.2}\t{}\t{}",
                row.get(c_smiles),
                est_hf.value,
                hf,
                est.terms
                    .iter()
                    .map(|t| format!("{}x{}", t.count, t.label))
                    .collect::<Vec<_>>()
                    .join(" "),
                ringheat::thermo::flags::joined(&est.flags)
            ),
        });
    }
    // Per-species details for whoever improves the tables (not part of the assertions).
    let dump: String = outcomes
        .iter()
        .map(|o| {
            format!(
                "{}\t{}\t{}\t{:+.2}\t{}\n",
                o.cas, o.name, o.class, o.hf_err_kcal, o.detail
            )
        })
        .chain(
            failures
                .iter()
                .map(|(n, why)| format!("-\t{n}\t-\t-\t{why}\n")),
        )
        .collect();
    let calibration: String =
        std::iter::once("cas\tprop\terr\tu_tab\tu_ref\tfamilies\n".to_string())
            .chain(outcomes.iter().map(|o| o.calibration.clone()))
            .collect();
    let calibration_path =
        std::path::Path::new(env!("CARGO_TARGET_TMPDIR")).join("uncertainty_terms.tsv");
    if let Err(e) = std::fs::write(&calibration_path, calibration) {
        println!("could not write {}: {e}", calibration_path.display());
    }
    let dump_path = std::path::Path::new(env!("CARGO_TARGET_TMPDIR")).join("thermo_validation.tsv");
    if let Err(e) = std::fs::write(&dump_path, dump) {
        println!("could not write {}: {e}", dump_path.display());
    } else {
        println!("per-species details: {}", dump_path.display());
    }
    let total = outcomes.len() + failures.len();
    let coverage = outcomes.len() as f64 / total as f64;
    println!(
        "reference species: {} ({} more left out: table values were derived from them)",
        total, derived_rows
    );
    println!(
        "estimated: {} ({:.1} %), flagged estimates among them: {}",
        outcomes.len(),
        100.0 * coverage,
        outcomes.iter().filter(|o| o.flagged).count()
    );
    let report = |label: &str, pick: &dyn Fn(&Outcome) -> bool| {
        let sel: Vec<&Outcome> = outcomes.iter().filter(|o| pick(o)).collect();
        let (hf, n) = mae(sel.iter().map(|o| o.hf_err_kcal));
        let (s, ns) = mae(sel.iter().filter_map(|o| o.s_err_cal));
        let (cp, nc) = mae(sel.iter().filter_map(|o| o.cp_err_cal));
        println!(
            "  {label:<12} Hf298 MAE {hf:5.2} kcal/mol (n={n:4})  S298 MAE {s:5.2} cal/(mol K) \
             (n={ns:4})  Cp298 MAE {cp:5.2} cal/(mol K) (n={nc:4})"
        );
        (hf, s, cp)
    };
    let (hf_all, s_all, cp_all) = report("all", &|_| true);
    let (hf_cho, _, _) = report("C/H/O only", &|o| o.cho_only);
    report("acyclic", &|o| o.class == "acyclic");
    report("monocyclic", &|o| o.class == "monocyclic");
    report("polycyclic", &|o| o.class == "polycyclic");
    report("aromatic", &|o| o.class == "aromatic");
    report("heteroatom", &|o| o.hetero);
    let (_, s_halogenated, _) = report("halogenated", &halogenated);
    report("with N", &|o| o.elements.contains('N'));
    report("with S", &|o| o.elements.replace("Cl", "").contains('S'));
    report("unflagged", &|o| !o.flagged);
    let hf_within = within(outcomes.iter().map(|o| o.hf_z));
    let s_within = within(outcomes.iter().filter_map(|o| o.s_z));
    println!(
        "within 1 and 2 reported uncertainties (reference uncertainty combined in): Hf298 \
         {:.0} % / {:.0} %, S298 {:.0} % / {:.0} %",
        100.0 * hf_within.0,
        100.0 * hf_within.1,
        100.0 * s_within.0,
        100.0 * s_within.1
    );
    let s_off: Vec<&Outcome> = outcomes
        .iter()
        .filter(|o| !o.flagged && o.s_err_cal.is_some_and(|e| e.abs() > S_FLAG_LIMIT_CAL))
        .collect();
    println!(
        "S298 off by more than {S_FLAG_LIMIT_CAL} cal/(mol K) without a flag: {}",
        s_off
            .iter()
            .map(|o| format!("{} ({:+.1})", o.name, o.s_err_cal.unwrap_or(0.0)))
            .collect::<Vec<_>>()
            .join(", ")
    );

    let mut worst: Vec<&Outcome> = outcomes.iter().collect();
    worst.sort_by(|a, b| b.hf_err_kcal.abs().total_cmp(&a.hf_err_kcal.abs()));
    println!("15 largest Hf298 errors (estimate - measured, kcal/mol):");
    for o in worst.iter().take(15) {
        println!(
            "  {:>+7.2}  {} ({}, {})",
            o.hf_err_kcal, o.name, o.cas, o.class
        );
    }
    let mut worst_s: Vec<&Outcome> = outcomes.iter().filter(|o| o.s_err_cal.is_some()).collect();
    worst_s.sort_by(|a, b| {
        let key = |o: &Outcome| o.s_err_cal.map_or(0.0, f64::abs);
        key(b).total_cmp(&key(a))
    });
    println!("10 largest S298 errors (estimate - measured, cal/(mol K)):");
    for o in worst_s.iter().take(10) {
        println!(
            "  {:>+7.2}  {} ({}, {})",
            o.s_err_cal.unwrap_or(0.0),
            o.name,
            o.cas,
            o.class
        );
    }
    let mut reasons: std::collections::BTreeMap<String, usize> = Default::default();
    for (_, why) in &failures {
        let key: String = why.chars().take(60).collect();
        *reasons.entry(key).or_default() += 1;
    }
    let mut reasons: Vec<(String, usize)> = reasons.into_iter().collect();
    reasons.sort_by_key(|r| std::cmp::Reverse(r.1));
    println!("most common reasons for no estimate:");
    for (why, n) in reasons.iter().take(25) {
        println!("  {n:4}  {why}");
    }
    println!("every species not estimated, with its reason:");
    for (name, why) in &failures {
        println!("  {name}: {why}");
    }

    Figures {
        coverage,
        hf_all,
        hf_cho,
        s_all,
        s_halogenated,
        cp_all,
        hf_within,
        s_within,
        s_off_unflagged: s_off.len(),
    }
}
