//! The polynomial export of one record: parse, estimate by group additivity, extend Cp(T) by
//! Wilhoit's form, fit NASA-7 polynomials; and the fit-quality views (table, CSV, JSON).

use comfy_table::{presets::UTF8_FULL_CONDENSED, ContentArrangement, Table};

use super::{cell, write_csv};
use crate::input::{InputRecord, Place};
use crate::molecule::canon::canonical_smiles;
use crate::molecule::formula::Formula;
use crate::molecule::{parse_smiles, Element, PerceivedMolecule};
use crate::thermo::estimate::{EstimateOptions, GroupAdditivity, ThermoEstimate};
use crate::thermo::modes::ModeCounts;
use crate::thermo::polynomials::{
    fit_polynomials, PolynomialFit, PolynomialOptions, TabulatedThermo,
};

/// A species ready to export: its input, structure, estimate and fit.
#[derive(Debug, Clone, serde::Serialize)]
pub struct ExportedSpecies {
    /// The input SMILES.
    pub input: String,
    /// The name given after the SMILES, if any.
    pub requested_name: Option<String>,
    /// Canonical SMILES.
    pub canonical_smiles: String,
    /// Hill formula.
    pub formula: String,
    /// Element counts in Hill order.
    pub composition: Vec<(String, u32)>,
    /// The group-additivity estimate.
    pub estimate: ThermoEstimate,
    /// The Wilhoit curve and the NASA-7 pair with their quality figures.
    pub fit: PolynomialFit,
}

/// Element counts of every atom, implicit hydrogens included, in Hill order (C, H, then the
/// others by symbol).
pub fn composition(mol: &crate::molecule::Molecule) -> Vec<(String, u32)> {
    let mut counts: Vec<(String, u32)> = Vec::new();
    let mut add = |symbol: &str, n: u32| match counts.iter_mut().find(|(s, _)| s == symbol) {
        Some((_, c)) => *c += n,
        None => counts.push((symbol.to_string(), n)),
    };
    for i in mol.atoms() {
        let atom = mol.atom(i);
        add(atom.element.symbol(), 1);
        if atom.hydrogens > 0 {
            add(Element::H.symbol(), u32::from(atom.hydrogens));
        }
    }
    let rank = |s: &str| match s {
        "C" => 0,
        "H" => 1,
        _ => 2,
    };
    counts.sort_by(|a, b| rank(&a.0).cmp(&rank(&b.0)).then(a.0.cmp(&b.0)));
    counts
}

/// The work of the export command on one record.
#[derive(Debug, Clone)]
pub struct PolynomialJob<'a> {
    /// The estimator.
    pub engine: &'a GroupAdditivity,
    /// Estimate options (a record's `sigma=` replaces the symmetry).
    pub estimate: EstimateOptions,
    /// Fit options.
    pub fit: PolynomialOptions,
}

impl PolynomialJob<'_> {
    /// The exported species of `record`, or why there is none.
    pub fn run(&self, record: &InputRecord) -> Result<ExportedSpecies, String> {
        if let Some(problem) = &record.problem {
            return Err(problem.clone());
        }
        let mol = parse_smiles(&record.smiles).map_err(|e| e.to_string())?;
        let formula = Formula::of(&mol);
        if formula.charge() != 0 {
            return Err(format!(
                "net charge {}: only neutral species are exported",
                formula.charge()
            ));
        }
        let perceived = PerceivedMolecule::new(&mol);
        let mut options = self.estimate;
        if record.symmetry.is_some() {
            options.symmetry_override = record.symmetry;
        }
        let estimate = self
            .engine
            .estimate(&perceived, &options)
            .map_err(|e| format!("cannot estimate: {e}"))?;
        let tabulated = TabulatedThermo::from_estimate(&estimate).map_err(|e| e.to_string())?;
        let fit = fit_polynomials(&tabulated, &ModeCounts::of(&perceived), &self.fit)
            .map_err(|e| e.to_string())?;
        Ok(ExportedSpecies {
            input: record.smiles.clone(),
            requested_name: record.name.clone(),
            canonical_smiles: canonical_smiles(&mol),
            formula: formula.hill(),
            composition: composition(&mol),
            estimate,
            fit,
        })
    }
}

/// One record's outcome as the views see it.
pub type Outcome<'a> = (&'a Place, &'a str, Result<&'a ExportedSpecies, &'a str>);

/// Header of the fit-quality CSV.
pub const FIT_CSV_HEADER: [&str; 14] = [
    "input",
    "formula",
    "atoms",
    "linear",
    "rotors",
    "cp0_j_per_mol_k",
    "cp_inf_j_per_mol_k",
    "wilhoit_b_k",
    "wilhoit_terms",
    "wilhoit_max_cp_dev_pct",
    "nasa_max_cp_dev_pct",
    "nasa_max_cp_dev_at_k",
    "flags",
    "error",
];

fn fit_cells(s: &ExportedSpecies) -> Vec<String> {
    let f = &s.fit;
    vec![
        s.input.clone(),
        s.formula.clone(),
        f.modes.atoms.to_string(),
        f.modes.linear.to_string(),
        f.modes.rotors.to_string(),
        cell(Some(f.wilhoit.cp0_j), 3),
        cell(Some(f.wilhoit.cp_inf_j), 3),
        cell(Some(f.wilhoit.b_k), 1),
        f.wilhoit.terms.to_string(),
        cell(Some(f.wilhoit_cp_deviation_pct), 3),
        cell(Some(f.cp_deviation_pct), 3),
        cell(Some(f.cp_deviation_at_k), 0),
        f.flags
            .iter()
            .map(|x| x.to_string())
            .collect::<Vec<_>>()
            .join(" | "),
        String::new(),
    ]
}

/// The fit-quality CSV of a run.
pub fn render_fit_csv(rows: &[Outcome<'_>]) -> String {
    let lines: Vec<Vec<String>> = rows
        .iter()
        .map(|(place, input, outcome)| match outcome {
            Ok(s) => fit_cells(s),
            Err(e) => {
                let mut v = vec![input.to_string()];
                v.extend(std::iter::repeat_n(String::new(), FIT_CSV_HEADER.len() - 2));
                v.push(format!("{place}: {}", e.replace('\n', " | ")));
                v
            }
        })
        .collect();
    write_csv(&FIT_CSV_HEADER, &lines)
}

/// The fit-quality table of a run: limits, Wilhoit and NASA-7 deviations, flags and errors.
pub fn render_fit_table(rows: &[Outcome<'_>]) -> String {
    let mut table = Table::new();
    table
        .load_preset(UTF8_FULL_CONDENSED)
        .set_content_arrangement(ContentArrangement::Dynamic)
        .set_width(150)
        .set_header(vec![
            "input",
            "formula",
            "Cp0 / Cp∞ J/(mol K)",
            "atoms, rotors",
            "Wilhoit B K (terms)",
            "Wilhoit dev %",
            "NASA-7 Cp dev % (at K)",
            "flags or error",
        ]);
    for (place, input, outcome) in rows {
        match outcome {
            Ok(s) => {
                let f = &s.fit;
                table.add_row(vec![
                    input.to_string(),
                    s.formula.clone(),
                    format!("{:.2} / {:.2}", f.wilhoit.cp0_j, f.wilhoit.cp_inf_j),
                    format!(
                        "{}{}, {}",
                        f.modes.atoms,
                        if f.modes.linear { " linear" } else { "" },
                        f.modes.rotors
                    ),
                    format!("{:.0} ({})", f.wilhoit.b_k, f.wilhoit.terms),
                    format!("{:.3}", f.wilhoit_cp_deviation_pct),
                    format!("{:.3} ({:.0})", f.cp_deviation_pct, f.cp_deviation_at_k),
                    f.flags
                        .iter()
                        .map(|x| x.to_string())
                        .collect::<Vec<_>>()
                        .join("; "),
                ]);
            }
            Err(e) => {
                table.add_row(vec![
                    input.to_string(),
                    String::new(),
                    String::new(),
                    String::new(),
                    String::new(),
                    String::new(),
                    String::new(),
                    format!("error ({place}): {}", e.replace('\n', " | ")),
                ]);
            }
        }
    }
    format!(
        "{table}\nDeviations: largest over the tabulated temperatures (300-1500 K) of the Wilhoit \
         curve and of the NASA-7 Cp from the group-additivity Cp.\n{}\n",
        super::SAFETY_NOTE
    )
}

/// Cp, H and S at one temperature from the NASA-7 pair and from ringheat's curve (the Wilhoit
/// curve and its integrals), with the tabulated group Cp where the temperature is a table one.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct PolynomialState {
    /// Temperature, K.
    pub t_k: f64,
    /// NASA-7 Cp, J/(mol K).
    pub nasa_cp_j: f64,
    /// NASA-7 H (formation scale), kJ/mol.
    pub nasa_h_kj: f64,
    /// NASA-7 S, J/(mol K).
    pub nasa_s_j: f64,
    /// Curve Cp, J/(mol K).
    pub curve_cp_j: f64,
    /// Curve H (formation scale), kJ/mol.
    pub curve_h_kj: f64,
    /// Curve S, J/(mol K).
    pub curve_s_j: f64,
    /// Group-additivity Cp at a table temperature, J/(mol K).
    pub tabulated_cp_j: Option<f64>,
}

/// The states of `s` at `temps`.
pub fn states_at(s: &ExportedSpecies, temps: &[f64]) -> Vec<PolynomialState> {
    let f = &s.fit;
    temps
        .iter()
        .map(|&t| {
            let c = f.curve_at(t);
            PolynomialState {
                t_k: t,
                nasa_cp_j: f.nasa.cp_j(t),
                nasa_h_kj: f.nasa.h_kj(t),
                nasa_s_j: f.nasa.s_j(t),
                curve_cp_j: c.cp_j,
                curve_h_kj: c.h_kj,
                curve_s_j: c.s_j,
                tabulated_cp_j: f
                    .tabulated
                    .cp_points
                    .iter()
                    .find(|(tt, _)| (tt - t).abs() < 1e-9)
                    .map(|p| p.1),
            }
        })
        .collect()
}

/// The JSON object of one record: the species with its Cantera name, fit and states at
/// `temps`, or the error.
pub fn json_row(
    outcome: &Outcome<'_>,
    cantera_name: Option<&str>,
    temps: &[f64],
) -> serde_json::Value {
    let (place, input, result) = outcome;
    match result {
        Ok(s) => serde_json::json!({
            "input": input,
            "cantera_name": cantera_name,
            "requested_name": s.requested_name,
            "canonical_smiles": s.canonical_smiles,
            "formula": s.formula,
            "composition": s.composition,
            "hf298_kj_per_mol": s.estimate.hf298_kj,
            "s298_j_per_mol_k": s.estimate.s298_j,
            "fit": s.fit,
            "flags": s.estimate.flags.iter().map(|f| f.to_string())
                .chain(s.fit.flags.iter().map(|f| f.to_string())).collect::<Vec<_>>(),
            "states": states_at(s, temps),
        }),
        Err(e) => serde_json::json!({
            "input": input,
            "place": place.to_string(),
            "error": e,
        }),
    }
}
