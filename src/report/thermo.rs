//! Thermochemistry report: Hf298, S298, Cp(T) per molecule, the explain view of every term with
//! its source, and states at chosen temperatures.

use comfy_table::{presets::UTF8_FULL_CONDENSED, ContentArrangement, Table};

/// Width in characters of the explain table (sources wrap inside it).
const EXPLAIN_WIDTH: u16 = 160;

use super::{cell, pm, write_csv, Row, RowError};
use crate::input::InputRecord;
use crate::molecule::canon::canonical_smiles;
use crate::molecule::formula::Formula;
use crate::molecule::{parse_smiles, PerceivedMolecule};
use crate::thermo::estimate::{EstimateOptions, GroupAdditivity, ThermoEstimate};
use crate::thermo::quantity::Quantity;
use crate::thermo::temperature::StateAt;
use crate::units::EnergyUnit;

/// One estimated molecule.
#[derive(Debug, Clone, serde::Serialize)]
pub struct EstimateRow {
    /// The input SMILES.
    pub input: String,
    /// Name given after the SMILES.
    pub name: Option<String>,
    /// Canonical SMILES.
    pub canonical_smiles: String,
    /// Formula.
    pub formula: String,
    /// The estimate with all its terms (SI units).
    pub estimate: ThermoEstimate,
    /// Cp at 298.15 K, J/(mol K).
    pub cp298_j: Option<Quantity>,
    /// States at the requested temperatures.
    pub states: Vec<StateAt>,
}

/// Estimates every record; parse and estimate failures become error rows.
pub fn estimate_rows(
    records: &[InputRecord],
    engine: &GroupAdditivity,
    options: &EstimateOptions,
    temperatures: &[f64],
) -> Vec<Row<EstimateRow>> {
    records
        .iter()
        .map(|r| {
            let fail = |message: String| Row::Failed {
                error: RowError {
                    place: r.place.clone(),
                    input: r.smiles.clone(),
                    message,
                },
            };
            if let Some(problem) = &r.problem {
                return fail(problem.clone());
            }
            let mol = match parse_smiles(&r.smiles) {
                Ok(m) => m,
                Err(e) => return fail(e.to_string()),
            };
            let perceived = PerceivedMolecule::new(&mol);
            let mut options = *options;
            if r.symmetry.is_some() {
                options.symmetry_override = r.symmetry;
            }
            match engine.estimate(&perceived, &options) {
                Ok(estimate) => {
                    let states = temperatures
                        .iter()
                        .filter_map(|&t| estimate.state_at(t))
                        .collect();
                    Row::Done(EstimateRow {
                        input: r.smiles.clone(),
                        name: r.name.clone(),
                        canonical_smiles: canonical_smiles(&mol),
                        formula: Formula::of(&mol).hill(),
                        cp298_j: estimate.cp298_j(),
                        estimate,
                        states,
                    })
                }
                Err(e) => fail(format!("cannot estimate: {e}")),
            }
        })
        .collect()
}

fn title(r: &EstimateRow) -> String {
    super::record_title(&r.input, r.name.as_deref())
}

/// The summary table: one line per molecule, then errors and flags underneath.
pub fn render_table(rows: &[Row<EstimateRow>], unit: EnergyUnit) -> String {
    let f = unit.factor();
    let mut t = Table::new();
    t.load_preset(UTF8_FULL_CONDENSED);
    t.set_header(vec![
        "#".to_string(),
        "molecule".to_string(),
        "formula".to_string(),
        format!("Hf298 {}", unit.energy_label()),
        format!("S298 {}", unit.entropy_label()),
        format!("Cp298 {}", unit.entropy_label()),
        "sigma".to_string(),
        "flags".to_string(),
    ]);
    let mut notes = String::new();
    for (i, row) in rows.iter().enumerate() {
        match row {
            Row::Done(r) => {
                let e = &r.estimate;
                t.add_row(vec![
                    (i + 1).to_string(),
                    title(r),
                    r.formula.clone(),
                    pm(e.hf298_kj, f, 1),
                    pm(e.s298_j, f, 1),
                    pm(r.cp298_j, f, 1),
                    e.symmetry.total.to_string(),
                    e.flags.len().to_string(),
                ]);
                for flag in &e.flags {
                    notes.push_str(&format!("  [{}] {}\n", i + 1, flag));
                }
            }
            Row::Failed { error } => {
                t.add_row(vec![
                    (i + 1).to_string(),
                    error.input.clone(),
                    "error".to_string(),
                    String::new(),
                    String::new(),
                    String::new(),
                    String::new(),
                    String::new(),
                ]);
                notes.push_str(&format!(
                    "  [{}] {}: error: {}\n",
                    i + 1,
                    error.place,
                    error.message.replace('\n', "\n      ")
                ));
            }
        }
    }
    let mut out = t.to_string();
    out.push('\n');
    if !notes.is_empty() {
        out.push_str("Flags and errors:\n");
        out.push_str(&notes);
    }
    out.push_str(&temperature_tables(rows, unit));
    out.push_str(
        "Gas phase, ideal gas at 1 bar. Uncertainties combine the table uncertainties of the \
         terms and the method's scatter per term family (src/thermo/uncertainty.rs).\n",
    );
    out
}

fn temperature_tables(rows: &[Row<EstimateRow>], unit: EnergyUnit) -> String {
    let f = unit.factor();
    let mut out = String::new();
    for row in rows {
        let Row::Done(r) = row else { continue };
        if r.states.is_empty() {
            continue;
        }
        let mut t = Table::new();
        t.load_preset(UTF8_FULL_CONDENSED);
        t.set_header(vec![
            "T K".to_string(),
            format!("Cp {}", unit.entropy_label()),
            format!("H-H298 {}", unit.energy_label()),
            format!("S {}", unit.entropy_label()),
            format!("G {}", unit.energy_label()),
        ]);
        for s in &r.states {
            t.add_row(vec![
                cell(Some(s.t_k), 2),
                pm(Some(Quantity::new(s.cp_j, s.cp_unc_j)), f, 2),
                cell(Some(s.dh_kj * f), 3),
                pm(Some(Quantity::new(s.s_j, s.s_unc_j)), f, 2),
                pm(Some(Quantity::new(s.g_kj, s.g_unc_kj)), f, 2),
            ]);
        }
        out.push_str(&format!("{}\n{t}\n", title(r)));
    }
    out
}

/// The explain view: every term with its count, values and source, then symmetry and flags.
pub fn render_explain(rows: &[Row<EstimateRow>], unit: EnergyUnit) -> String {
    let f = unit.factor();
    let mut out = String::new();
    for row in rows {
        let r = match row {
            Row::Done(r) => r,
            Row::Failed { error } => {
                out.push_str(&format!("{}: error: {}\n\n", error.place, error.message));
                continue;
            }
        };
        let e = &r.estimate;
        out.push_str(&format!(
            "{}  [{}]  canonical {}\n",
            title(r),
            r.formula,
            r.canonical_smiles
        ));
        let mut t = Table::new();
        t.load_preset(UTF8_FULL_CONDENSED);
        // Long source texts wrap instead of stretching the table across the screen.
        t.set_content_arrangement(ContentArrangement::Dynamic);
        t.set_width(EXPLAIN_WIDTH);
        t.set_header(vec![
            "kind".to_string(),
            "term".to_string(),
            "n".to_string(),
            format!("Hf {}", unit.energy_label()),
            format!("S {}", unit.entropy_label()),
            format!("Cp300 {}", unit.entropy_label()),
            "source".to_string(),
        ]);
        for term in &e.terms {
            let v = &term.per_unit;
            let kind = term.kind.to_string();
            let mut source = term.source.clone();
            if let Some(n) = term.notes_text() {
                source = format!("{n}; {source}");
            }
            t.add_row(vec![
                kind,
                term.label.clone(),
                term.count.to_string(),
                pm(Some(Quantity::new(v.hf_kj, v.unc_hf_kj)), f, 2),
                pm(v.known.s.then(|| Quantity::new(v.s_j, v.unc_s_j)), f, 2),
                pm(
                    v.known.cp.then(|| Quantity::new(v.cp_j[0], v.unc_cp_j)),
                    f,
                    2,
                ),
                source,
            ]);
        }
        out.push_str(&t.to_string());
        out.push('\n');
        let sym = &e.symmetry;
        out.push_str(&format!(
            "symmetry number {} (external {} x internal {}), optical isomers {}{}\n",
            sym.total,
            sym.external,
            sym.internal,
            sym.optical_isomers,
            if e.symmetry_overridden {
                " (given by the user)"
            } else {
                ""
            }
        ));
        for n in &sym.notes {
            out.push_str(&format!("  symmetry: {n}\n"));
        }
        out.push_str(&format!(
            "Hf298 = {} {}   (strain-free sum without ring corrections {})\n",
            pm(e.hf298_kj, f, 2),
            unit.energy_label(),
            pm(e.strain_free_hf298_kj, f, 2)
        ));
        out.push_str(&format!(
            "S298  = {} {}   (includes -R ln sigma + R ln n)\n",
            pm(e.s298_j, f, 2),
            unit.entropy_label()
        ));
        out.push_str(&format!(
            "Cp298 = {} {}\n",
            pm(r.cp298_j, f, 2),
            unit.entropy_label()
        ));
        for flag in &e.flags {
            out.push_str(&format!("  flag: {flag}\n"));
        }
        out.push('\n');
    }
    out
}

/// CSV: one line per record with Hf, S, Cp at every table temperature, sigma, flags, error.
/// With `temperatures` (the `--at` list) it adds Cp, H-H298, S and G columns for each.
pub fn render_csv(rows: &[Row<EstimateRow>], unit: EnergyUnit, temperatures: &[f64]) -> String {
    let f = unit.factor();
    let (eu, su) = (
        if unit == EnergyUnit::KiloJoule {
            "kj"
        } else {
            "kcal"
        },
        if unit == EnergyUnit::KiloJoule {
            "j"
        } else {
            "cal"
        },
    );
    let temps = crate::thermo::estimate::CP_TEMPERATURES;
    let mut header: Vec<String> = vec![
        "input".into(),
        "name".into(),
        "canonical_smiles".into(),
        "formula".into(),
        format!("hf298_{eu}_per_mol"),
        format!("hf298_unc_{eu}_per_mol"),
        format!("s298_{su}_per_mol_k"),
        format!("s298_unc_{su}_per_mol_k"),
        format!("cp298_{su}_per_mol_k"),
    ];
    header.extend(temps.iter().map(|t| format!("cp{t:.0}_{su}_per_mol_k")));
    for t in temperatures {
        header.extend([
            format!("at{t}_cp_{su}_per_mol_k"),
            format!("at{t}_h_minus_h298_{eu}_per_mol"),
            format!("at{t}_s_{su}_per_mol_k"),
            format!("at{t}_g_{eu}_per_mol"),
        ]);
    }
    header.extend([
        "sigma".into(),
        "optical_isomers".into(),
        "flags".into(),
        "error".into(),
    ]);
    let width = header.len();
    let rows: Vec<Vec<String>> = rows
        .iter()
        .map(|row| match row {
            Row::Done(r) => {
                let e = &r.estimate;
                let mut v = vec![
                    r.input.clone(),
                    r.name.clone().unwrap_or_default(),
                    r.canonical_smiles.clone(),
                    r.formula.clone(),
                    cell(e.hf298_kj.map(|q| q.value * f), 3),
                    cell(e.hf298_kj.map(|q| q.uncertainty * f), 3),
                    cell(e.s298_j.map(|q| q.value * f), 3),
                    cell(e.s298_j.map(|q| q.uncertainty * f), 3),
                    cell(r.cp298_j.map(|q| q.value * f), 3),
                ];
                for k in 0..temps.len() {
                    v.push(cell(e.cp_j.map(|c| c[k].value * f), 3));
                }
                for t in temperatures {
                    let at = r.states.iter().find(|s| (s.t_k - t).abs() < 1e-9);
                    v.push(cell(at.map(|s| s.cp_j * f), 3));
                    v.push(cell(at.map(|s| s.dh_kj * f), 4));
                    v.push(cell(at.map(|s| s.s_j * f), 3));
                    v.push(cell(at.map(|s| s.g_kj * f), 4));
                }
                v.push(e.symmetry.total.to_string());
                v.push(e.symmetry.optical_isomers.to_string());
                v.push(crate::thermo::flags::joined(&e.flags));
                v.push(String::new());
                v
            }
            Row::Failed { error } => error.csv_cells(width),
        })
        .collect();
    let header_refs: Vec<&str> = header.iter().map(|s| s.as_str()).collect();
    write_csv(&header_refs, &rows)
}
