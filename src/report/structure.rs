//! Structure report: canonical SMILES, formula, molar mass, rings and ring systems.

use comfy_table::{presets::UTF8_FULL_CONDENSED, Table};

use super::{cell, write_csv, Row, RowError};
use crate::input::InputRecord;
use crate::molecule::canon::canonical_smiles;
use crate::molecule::formula::Formula;
use crate::molecule::rings::{RingInfo, RingSystemKind};
use crate::molecule::{parse_smiles, Molecule};

/// One ring system, for display.
#[derive(Debug, Clone, serde::Serialize)]
pub struct RingSystemSummary {
    /// Isolated, fused, bridged or spiro.
    pub kind: String,
    /// Sizes of its SSSR rings, ascending.
    pub ring_sizes: Vec<usize>,
    /// Number of atoms in the system.
    pub atoms: usize,
}

/// The structure facts of one molecule.
#[derive(Debug, Clone, serde::Serialize)]
pub struct StructureSummary {
    /// The input SMILES.
    pub input: String,
    /// The name given after the SMILES, if any.
    pub name: Option<String>,
    /// Canonical SMILES (the species key).
    pub canonical_smiles: String,
    /// Molecular formula, Hill order.
    pub formula: String,
    /// Molar mass, g/mol.
    pub molar_mass: f64,
    /// Heavy (non-hydrogen) atoms.
    pub heavy_atoms: u32,
    /// Hydrogen atoms.
    pub hydrogens: u32,
    /// Number of independent rings (cyclomatic number).
    pub rings: usize,
    /// SSSR ring sizes, ascending.
    pub ring_sizes: Vec<usize>,
    /// Ring systems.
    pub ring_systems: Vec<RingSystemSummary>,
}

fn kind_word(kind: RingSystemKind, spiro: bool) -> String {
    let base = match kind {
        RingSystemKind::Isolated => "isolated",
        RingSystemKind::Fused => "fused",
        RingSystemKind::Bridged => "bridged",
        RingSystemKind::Spiro => "spiro",
    };
    if spiro && kind != RingSystemKind::Spiro {
        format!("{base}+spiro")
    } else {
        base.to_string()
    }
}

/// Summarises a parsed molecule.
pub fn summarize(mol: &Molecule, input: &str, name: Option<String>) -> StructureSummary {
    let formula = Formula::of(mol);
    let rings = RingInfo::perceive(mol);
    let ring_systems = rings
        .systems
        .iter()
        .map(|s| {
            let mut sizes: Vec<usize> = s.rings.iter().map(|&r| rings.rings[r].size()).collect();
            sizes.sort_unstable();
            RingSystemSummary {
                kind: kind_word(s.kind, s.has_spiro_junction),
                ring_sizes: sizes,
                atoms: s.atoms.len(),
            }
        })
        .collect();
    StructureSummary {
        input: input.to_string(),
        name,
        canonical_smiles: canonical_smiles(mol),
        formula: formula.hill(),
        molar_mass: formula.molar_mass(),
        heavy_atoms: formula.heavy_atoms(),
        hydrogens: formula.hydrogens(),
        rings: mol.cyclomatic_number(),
        ring_sizes: rings.ring_sizes(),
        ring_systems,
    }
}

/// Parses and summarises every record; a bad record becomes an error row.
pub fn structure_rows(records: &[InputRecord]) -> Vec<Row<StructureSummary>> {
    records
        .iter()
        .map(|r| match parse_smiles(&r.smiles) {
            Ok(mol) => Row::Done(summarize(&mol, &r.smiles, r.name.clone())),
            Err(e) => Row::Failed {
                error: RowError {
                    place: r.place.clone(),
                    input: r.smiles.clone(),
                    message: e.to_string(),
                },
            },
        })
        .collect()
}

fn systems_text(s: &StructureSummary) -> String {
    if s.ring_systems.is_empty() {
        return "none".to_string();
    }
    s.ring_systems
        .iter()
        .map(|r| {
            let sizes: Vec<String> = r.ring_sizes.iter().map(|x| x.to_string()).collect();
            format!("{} [{}]", r.kind, sizes.join(","))
        })
        .collect::<Vec<_>>()
        .join("; ")
}

/// Human-readable report: one small table per molecule.
pub fn render_table(rows: &[Row<StructureSummary>]) -> String {
    let mut out = String::new();
    for row in rows {
        match row {
            Row::Done(s) => {
                let mut t = Table::new();
                t.load_preset(UTF8_FULL_CONDENSED);
                let title = match &s.name {
                    Some(n) => format!("{} ({n})", s.input),
                    None => s.input.clone(),
                };
                t.set_header(vec!["structure", title.as_str()]);
                let sizes: Vec<String> = s.ring_sizes.iter().map(|x| x.to_string()).collect();
                t.add_row(vec![
                    "canonical SMILES".to_string(),
                    s.canonical_smiles.clone(),
                ]);
                t.add_row(vec!["formula".to_string(), s.formula.clone()]);
                t.add_row(vec![
                    "molar mass, g/mol".to_string(),
                    cell(Some(s.molar_mass), 3),
                ]);
                t.add_row(vec![
                    "heavy atoms / H".to_string(),
                    format!("{} / {}", s.heavy_atoms, s.hydrogens),
                ]);
                t.add_row(vec![
                    "rings (sizes)".to_string(),
                    format!("{} ({})", s.rings, sizes.join(",")),
                ]);
                t.add_row(vec!["ring systems".to_string(), systems_text(s)]);
                out.push_str(&t.to_string());
                out.push('\n');
            }
            Row::Failed { error } => {
                out.push_str(&format!("{}: error: {}\n", error.place, error.message));
            }
        }
    }
    out
}

/// CSV report: one line per record, errors in the last column.
pub fn render_csv(rows: &[Row<StructureSummary>]) -> String {
    let header = [
        "input",
        "name",
        "canonical_smiles",
        "formula",
        "molar_mass_g_per_mol",
        "heavy_atoms",
        "hydrogens",
        "rings",
        "ring_sizes",
        "ring_systems",
        "error",
    ];
    let rows: Vec<Vec<String>> = rows
        .iter()
        .map(|row| match row {
            Row::Done(s) => vec![
                s.input.clone(),
                s.name.clone().unwrap_or_default(),
                s.canonical_smiles.clone(),
                s.formula.clone(),
                cell(Some(s.molar_mass), 4),
                s.heavy_atoms.to_string(),
                s.hydrogens.to_string(),
                s.rings.to_string(),
                s.ring_sizes
                    .iter()
                    .map(|x| x.to_string())
                    .collect::<Vec<_>>()
                    .join(" "),
                systems_text(s),
                String::new(),
            ],
            Row::Failed { error } => error.csv_cells(header.len()),
        })
        .collect();
    write_csv(&header, &rows)
}
