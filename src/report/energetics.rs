//! Reaction-energetics report: one block per reaction (species with their sources, values per
//! temperature, per-mole and per-gram heats, strain released), or JSON, or CSV with one line per
//! reaction and temperature.

use comfy_table::{presets::UTF8_FULL_CONDENSED, Table};

use super::{pm, quantity_cells, write_csv, Row, RowError, SAFETY_NOTE};
use crate::input::Place;
use crate::reactions::energetics::{
    reaction_energetics, EnergeticsData, EnergeticsOptions, ReactionEnergetics,
};
use crate::reactions::equation::ReactionEquation;

/// One reaction record: where it came from, its text and name.
#[derive(Debug, Clone, serde::Serialize)]
pub struct ReactionRecord {
    /// Where it came from.
    pub place: Place,
    /// The equation as written.
    pub text: String,
    /// Optional name.
    pub name: Option<String>,
}

/// One computed reaction.
#[derive(Debug, Clone, serde::Serialize)]
pub struct EnergeticsRow {
    /// The equation as written.
    pub input: String,
    /// Its name.
    pub name: Option<String>,
    /// The results.
    pub energetics: ReactionEnergetics,
}

/// Computes every record; a bad record becomes an error row.
pub fn energetics_rows(
    records: &[ReactionRecord],
    data: &EnergeticsData,
    options: &EnergeticsOptions,
) -> Vec<Row<EnergeticsRow>> {
    records
        .iter()
        .map(|r| {
            let result = ReactionEquation::parse(&r.text)
                .map_err(|e| e.to_string())
                .and_then(|eq| reaction_energetics(&eq, data, options).map_err(|e| e.to_string()));
            match result {
                Ok(energetics) => Row::Done(EnergeticsRow {
                    input: r.text.clone(),
                    name: r.name.clone(),
                    energetics,
                }),
                Err(message) => Row::Failed {
                    error: RowError {
                        place: r.place.clone(),
                        input: r.text.clone(),
                        message,
                    },
                },
            }
        })
        .collect()
}

fn coefficient_text(c: f64) -> String {
    if (c - c.round()).abs() < 1e-9 {
        format!("{}", c.round() as i64)
    } else {
        format!("{c:.3}")
    }
}

/// The table view.
pub fn render_table(rows: &[Row<EnergeticsRow>]) -> String {
    let mut out = String::new();
    let mut liquid = false;
    for row in rows {
        let r = match row {
            Row::Done(r) => r,
            Row::Failed { error } => {
                out.push_str(&super::failed_block(error));
                continue;
            }
        };
        let e = &r.energetics;
        out.push_str(&super::record_title(&e.equation, r.name.as_deref()));
        out.push('\n');
        let mut species = Table::new();
        species.load_preset(UTF8_FULL_CONDENSED).set_header(vec![
            "species",
            "coefficient",
            "phase",
            "M g/mol",
            "Hf298 kJ/mol",
            "S298 J/(mol K)",
            "source of Hf298",
        ]);
        for s in &e.species {
            liquid |= s.thermo.phase == crate::phase::Phase::Liquid;
            species.add_row(vec![
                s.smiles.clone(),
                coefficient_text(s.coefficient),
                s.thermo.phase.name().to_string(),
                format!("{:.2}", s.thermo.molar_mass_g_mol),
                pm(Some(s.thermo.hf298_kj), 1.0, 2),
                pm(s.thermo.s298_j, 1.0, 1),
                s.thermo.hf_source(),
            ]);
        }
        out.push_str(&species.to_string());
        out.push('\n');
        let mut temps = Table::new();
        temps.load_preset(UTF8_FULL_CONDENSED).set_header(vec![
            "T K",
            "dH kJ/mol",
            "dS J/(mol K)",
            "dG kJ/mol",
            "log10 K",
            "remark",
        ]);
        for t in &e.rows {
            temps.add_row(vec![
                format!("{:.2}", t.t_k),
                pm(t.dh_kj, 1.0, 2),
                pm(t.ds_j, 1.0, 1),
                pm(t.dg_kj, 1.0, 2),
                pm(t.log10_k, 1.0, 2),
                t.note.clone().unwrap_or_default(),
            ]);
        }
        out.push_str(&temps.to_string());
        out.push('\n');
        out.push_str(&format!(
            "heat of reaction at 298.15 K: {} kJ/mol of reaction; {} J/g of reacting mass ({:.2} g per mole of reaction)\n",
            pm(Some(e.dh298_kj), 1.0, 2),
            pm(Some(e.dh298_j_per_g), 1.0, 0),
            e.reacting_mass_g
        ));
        if let Some((smiles, nu, q)) = &e.per_reactant {
            out.push_str(&format!(
                "per mole of {smiles} (coefficient {}): {} kJ/mol\n",
                coefficient_text(*nu),
                pm(Some(*q), 1.0, 2)
            ));
        }
        if !e.strain_released.is_empty() {
            out.push_str("strain released (strain of the reactants minus the products'):\n");
            for s in &e.strain_released {
                match (&s.released_kj, &s.unavailable) {
                    (Some(q), None) => out.push_str(&format!(
                        "  {}: {} kJ/mol\n",
                        s.scheme,
                        pm(Some(*q), 1.0, 2)
                    )),
                    (Some(q), Some(why)) => out.push_str(&format!(
                        "  {}: {} kJ/mol ({why})\n",
                        s.scheme,
                        pm(Some(*q), 1.0, 2)
                    )),
                    (None, why) => out.push_str(&format!(
                        "  {}: n/a ({})\n",
                        s.scheme,
                        why.clone().unwrap_or_default()
                    )),
                }
            }
        }
        for f in &e.flags {
            out.push_str(&format!("  flag: {f}\n"));
        }
        for m in &e.methods {
            out.push_str(&format!("  {m}\n"));
        }
        out.push('\n');
    }
    out.push_str(
        "dH, dS, dG per mole of reaction as written; K for standard states of 1 bar (gas) or the \
         pure liquid. Values above 298.15 K integrate the gas heat capacities (Kirchhoff); liquid \
         species have values at 298.15 K only. Uncertainties combine the species' ones in \
         quadrature.\n",
    );
    if liquid {
        out.push_str(
            "Liquid values: Hf298(liquid) = Hf298(gas) - dHvap; S298(liquid) = S298(gas) - dSvap.\n",
        );
    }
    out.push_str(SAFETY_NOTE);
    out.push('\n');
    out
}

/// CSV: one line per reaction and temperature; failed records get one line with the error.
pub fn render_csv(rows: &[Row<EnergeticsRow>]) -> String {
    let header = [
        "reaction",
        "name",
        "t_k",
        "dh_kj",
        "dh_unc_kj",
        "ds_j",
        "ds_unc_j",
        "dg_kj",
        "dg_unc_kj",
        "log10_k",
        "log10_k_unc",
        "dh298_j_per_g",
        "dh298_j_per_g_unc",
        "remark",
    ];
    let mut lines = Vec::new();
    for row in rows {
        match row {
            Row::Done(r) => {
                let e = &r.energetics;
                for t in &e.rows {
                    let q = quantity_cells;
                    lines.push(
                        [
                            vec![
                                e.equation.clone(),
                                r.name.clone().unwrap_or_default(),
                                format!("{:.2}", t.t_k),
                            ],
                            q(t.dh_kj, 3).to_vec(),
                            q(t.ds_j, 3).to_vec(),
                            q(t.dg_kj, 3).to_vec(),
                            q(t.log10_k, 3).to_vec(),
                            q(Some(e.dh298_j_per_g), 1).to_vec(),
                            vec![t.note.clone().unwrap_or_default()],
                        ]
                        .concat(),
                    );
                }
            }
            Row::Failed { error } => lines.push(error.csv_cells(header.len())),
        }
    }
    write_csv(&header, &lines)
}
