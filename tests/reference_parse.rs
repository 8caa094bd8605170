//! The SMILES parser against RDKit on thousands of PubChem structures: formula, heavy atoms,
//! hydrogens, cyclomatic number and ring sizes for every row of
//! `tests/reference/smiles_structures.tsv` (built by `tools/make_reference.py` from the
//! `chemicals` and `rdkit` packages; see the file's header).
//!
//! Known differences that are explained live in `tests/reference/smiles_disagreements.tsv`;
//! any other difference fails, and the thresholds below hold whatever that file says.
//! Run with `cargo test --test reference_parse -- --nocapture` to see the summary.

mod common;

use std::collections::{BTreeMap, HashMap, HashSet};

use common::{catch, one_line, Table};
use ringheat::molecule::formula::Formula;
use ringheat::molecule::parse_smiles;
use ringheat::molecule::rings::RingInfo;

/// Share of rows the parser must accept (the brief of this test).
const MIN_ACCEPTED: f64 = 0.99;
/// Share of accepted rows that must agree with RDKit on every compared field.
const MIN_AGREEING: f64 = 0.999;
/// Fields a disagreement can name.
const FIELDS: [&str; 6] = [
    "parse",
    "formula",
    "heavy_atoms",
    "hydrogens",
    "rings",
    "ring_sizes",
];
/// How many disagreement lines the summary prints in full.
const LIST_LIMIT: usize = 200;

/// One field on which ringheat and RDKit differ for one row.
struct Difference {
    id: String,
    smiles: String,
    field: &'static str,
    ours: String,
    rdkit: String,
}

/// What happened to one row.
enum Outcome {
    /// The parser returned an error (RDKit accepted every row of the file).
    Rejected(String),
    /// The parser or a later step panicked: always a failure.
    Panicked(String),
    /// Parsed; the fields that differ (empty when all agree).
    Accepted(Vec<Difference>),
}

/// The reference values of one row.
struct Expected<'a> {
    id: &'a str,
    smiles: &'a str,
    formula: &'a str,
    heavy_atoms: &'a str,
    hydrogens: &'a str,
    rings: &'a str,
    ring_sizes: &'a str,
    ring_sizes_comparable: bool,
}

fn check_row(e: &Expected) -> Outcome {
    let mol = match catch(|| parse_smiles(e.smiles)) {
        Err(p) => return Outcome::Panicked(p),
        Ok(Err(err)) => return Outcome::Rejected(one_line(&err.to_string())),
        Ok(Ok(mol)) => mol,
    };
    let ours = catch(|| {
        let formula = Formula::of(&mol);
        let mut fields: Vec<(&'static str, String, &str)> = vec![
            ("formula", formula.hill(), e.formula),
            (
                "heavy_atoms",
                formula.heavy_atoms().to_string(),
                e.heavy_atoms,
            ),
            ("hydrogens", formula.hydrogens().to_string(), e.hydrogens),
            ("rings", mol.cyclomatic_number().to_string(), e.rings),
        ];
        if e.ring_sizes_comparable {
            let sizes = RingInfo::perceive(&mol).ring_sizes();
            let text: Vec<String> = sizes.iter().map(usize::to_string).collect();
            fields.push(("ring_sizes", text.join(","), e.ring_sizes));
        }
        fields
            .into_iter()
            .filter(|(_, ours, rdkit)| ours != rdkit)
            .map(|(field, ours, rdkit)| Difference {
                id: e.id.to_string(),
                smiles: e.smiles.to_string(),
                field,
                ours,
                rdkit: rdkit.to_string(),
            })
            .collect::<Vec<_>>()
    });
    match ours {
        Ok(diffs) => Outcome::Accepted(diffs),
        Err(p) => Outcome::Panicked(p),
    }
}

/// (id, field) -> reason, from the hand-written file of explained differences.
fn explained() -> HashMap<(String, String), String> {
    let table = Table::read("smiles_disagreements.tsv");
    let (id, field, reason) = (
        table.column("id"),
        table.column("field"),
        table.column("reason"),
    );
    table
        .rows
        .iter()
        .map(|r| {
            (
                (r.get(id).to_string(), r.get(field).to_string()),
                r.get(reason).to_string(),
            )
        })
        .collect()
}

fn pct(part: usize, whole: usize) -> f64 {
    if whole == 0 {
        0.0
    } else {
        100.0 * part as f64 / whole as f64
    }
}

#[test]
fn parser_agrees_with_rdkit_on_pubchem_structures() {
    let table = Table::read("smiles_structures.tsv");
    let col = |name: &str| table.column(name);
    let (c_id, c_smiles, c_formula, c_heavy, c_h, c_rings, c_sizes, c_comp) = (
        col("pubchem_cid"),
        col("smiles"),
        col("formula"),
        col("heavy_atoms"),
        col("hydrogens"),
        col("rings"),
        col("ring_sizes"),
        col("ring_sizes_comparable"),
    );
    let known = explained();

    let mut accepted = 0usize;
    let mut agreeing = 0usize;
    let mut rejected: Vec<Difference> = Vec::new();
    let mut panicked: Vec<(String, String, String)> = Vec::new();
    let mut differences: Vec<Difference> = Vec::new();
    for row in &table.rows {
        let e = Expected {
            id: row.get(c_id),
            smiles: row.get(c_smiles),
            formula: row.get(c_formula),
            heavy_atoms: row.get(c_heavy),
            hydrogens: row.get(c_h),
            rings: row.get(c_rings),
            ring_sizes: row.get(c_sizes),
            ring_sizes_comparable: row.get(c_comp) == "1",
        };
        match check_row(&e) {
            Outcome::Rejected(err) => rejected.push(Difference {
                id: e.id.to_string(),
                smiles: e.smiles.to_string(),
                field: "parse",
                ours: err,
                rdkit: "parsed".to_string(),
            }),
            Outcome::Panicked(msg) => {
                panicked.push((e.id.to_string(), e.smiles.to_string(), one_line(&msg)))
            }
            Outcome::Accepted(diffs) => {
                accepted += 1;
                if diffs.is_empty() {
                    agreeing += 1;
                }
                differences.extend(diffs);
            }
        }
    }

    let rows = table.rows.len();
    let reason_of = |d: &Difference| known.get(&(d.id.clone(), d.field.to_string())).cloned();
    let all: Vec<&Difference> = rejected.iter().chain(differences.iter()).collect();
    let unexplained: Vec<&Difference> = all
        .iter()
        .copied()
        .filter(|d| reason_of(d).is_none())
        .collect();

    // Summary.
    println!("reference_parse: smiles_structures.tsv");
    println!("  rows                {rows}");
    println!(
        "  accepted            {accepted} ({:.2} %, need >= {:.2} %)",
        pct(accepted, rows),
        100.0 * MIN_ACCEPTED
    );
    println!("  rejected            {}", rejected.len());
    println!("  panicked            {}", panicked.len());
    println!(
        "  agreeing on all     {agreeing} of {accepted} accepted ({:.3} %, need >= {:.1} %)",
        pct(agreeing, accepted),
        100.0 * MIN_AGREEING
    );
    let mut by_field: BTreeMap<&str, (usize, usize)> = BTreeMap::new();
    for d in &all {
        let entry = by_field.entry(d.field).or_default();
        entry.0 += 1;
        if reason_of(d).is_some() {
            entry.1 += 1;
        }
    }
    for (field, (n, ok)) in &by_field {
        println!("  differ on {field:<12} {n} ({ok} explained)");
    }
    for (i, d) in all.iter().enumerate() {
        if i == LIST_LIMIT {
            println!("  ... and {} more", all.len() - LIST_LIMIT);
            break;
        }
        let reason = reason_of(d).unwrap_or_else(|| "UNEXPLAINED".to_string());
        println!(
            "  {} {} {}: ours {} rdkit {} [{}]",
            d.id, d.smiles, d.field, d.ours, d.rdkit, reason
        );
    }
    for (id, smiles, msg) in &panicked {
        println!("  {id} {smiles} PANIC: {msg}");
    }
    let seen: HashSet<(String, String)> = all
        .iter()
        .map(|d| (d.id.clone(), d.field.to_string()))
        .collect();
    for (id, field) in known.keys() {
        if !seen.contains(&(id.clone(), field.clone())) {
            println!("  note: smiles_disagreements.tsv lists {id} {field}, which now agrees");
        }
    }

    // Verdict: every failed condition is named, with the worst rows.
    let mut failures: Vec<String> = Vec::new();
    if (accepted as f64) < MIN_ACCEPTED * rows as f64 {
        failures.push(format!(
            "only {accepted} of {rows} rows accepted ({:.2} % < {:.2} %)",
            pct(accepted, rows),
            100.0 * MIN_ACCEPTED
        ));
    }
    if (agreeing as f64) < MIN_AGREEING * accepted as f64 {
        failures.push(format!(
            "only {agreeing} of {accepted} accepted rows agree with RDKit ({:.3} % < {:.1} %)",
            pct(agreeing, accepted),
            100.0 * MIN_AGREEING
        ));
    }
    if !panicked.is_empty() {
        let list: Vec<String> = panicked
            .iter()
            .take(20)
            .map(|(id, smiles, msg)| format!("    {id} {smiles}: {msg}"))
            .collect();
        failures.push(format!(
            "{} rows panicked (library code must return errors):\n{}",
            panicked.len(),
            list.join("\n")
        ));
    }
    if !unexplained.is_empty() {
        // Worst rows first: the rows with the most differing fields.
        let mut per_row: HashMap<&str, usize> = HashMap::new();
        for d in &unexplained {
            *per_row.entry(d.id.as_str()).or_default() += 1;
        }
        let mut worst = unexplained.clone();
        worst.sort_by_key(|d| std::cmp::Reverse(per_row[d.id.as_str()]));
        let list: Vec<String> = worst
            .iter()
            .take(30)
            .map(|d| {
                format!(
                    "    {} {} {}: ours {} rdkit {}",
                    d.id, d.smiles, d.field, d.ours, d.rdkit
                )
            })
            .collect();
        failures.push(format!(
            "{} differences not explained in tests/reference/smiles_disagreements.tsv \
             (fix the parser, or add `id<TAB>field<TAB>ours<TAB>rdkit<TAB>reason`):\n{}",
            unexplained.len(),
            list.join("\n")
        ));
    }
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}

#[test]
fn disagreement_file_names_known_rows_and_fields() {
    let structures = Table::read("smiles_structures.tsv");
    let c_id = structures.column("pubchem_cid");
    let ids: HashSet<&str> = structures.rows.iter().map(|r| r.get(c_id)).collect();
    let known = Table::read("smiles_disagreements.tsv");
    let (id, field, reason) = (
        known.column("id"),
        known.column("field"),
        known.column("reason"),
    );
    let mut problems = Vec::new();
    for row in &known.rows {
        if !ids.contains(row.get(id)) {
            problems.push(format!(
                "line {}: id {} is not a row",
                row.line,
                row.get(id)
            ));
        }
        if !FIELDS.contains(&row.get(field)) {
            problems.push(format!(
                "line {}: unknown field {}",
                row.line,
                row.get(field)
            ));
        }
        if row.get(reason).trim().is_empty() {
            problems.push(format!("line {}: no reason given", row.line));
        }
    }
    assert!(
        structures.rows.len() >= 5000,
        "smiles_structures.tsv has only {} rows",
        structures.rows.len()
    );
    assert!(
        problems.is_empty(),
        "smiles_disagreements.tsv:\n{}",
        problems.join("\n")
    );
}
