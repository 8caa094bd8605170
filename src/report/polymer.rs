//! Polymerisation report: one block per monomer (bond opened, the chain built, the values with
//! their sources in the stated states, the ceiling temperature and the verdict), or JSON, or CSV.

use comfy_table::{presets::UTF8_FULL_CONDENSED, Table};

use super::{pm, quantity_cells, write_csv, Row, RowError, SAFETY_NOTE};
use crate::input::InputRecord;
use crate::molecule::parse_smiles;
use crate::polymer::thermo::gas_standard_state_shift_j;
use crate::polymer::{
    polymerisation, Favourability, LimitKind, PolymerState, Polymerisation, PolymerisationOptions,
};
use crate::reactions::energetics::EnergeticsData;
use crate::units::T_REF_K;

/// One monomer's result.
#[derive(Debug, Clone, serde::Serialize)]
pub struct PolymerRow {
    /// The input SMILES.
    pub input: String,
    /// Its name.
    pub name: Option<String>,
    /// The result.
    pub polymerisation: Polymerisation,
}

/// Computes every record.
pub fn polymer_rows(
    records: &[InputRecord],
    data: &EnergeticsData,
    options: &PolymerisationOptions,
) -> Vec<Row<PolymerRow>> {
    records
        .iter()
        .map(|r| {
            let result = parse_smiles(&r.smiles)
                .map_err(|e| e.to_string())
                .and_then(|m| polymerisation(&m, data, options).map_err(|e| e.to_string()));
            match result {
                Ok(p) => Row::Done(PolymerRow {
                    input: r.smiles.clone(),
                    name: r.name.clone(),
                    polymerisation: p,
                }),
                Err(message) => Row::Failed {
                    error: RowError {
                        place: r.place.clone(),
                        input: r.smiles.clone(),
                        message,
                    },
                },
            }
        })
        .collect()
}

/// The verdict in words.
pub fn verdict_text(p: &Polymerisation) -> String {
    let conditions = format!(
        "at {:.2} K and {} mol/L monomer{}",
        p.temperature_k,
        p.concentration_mol_l,
        if p.concentration_defaulted {
            " (default, not given)"
        } else {
            ""
        }
    );
    let margin = if p.verdict_within_uncertainty {
        " (marginal: zero lies within the uncertainty, so the verdict could go either way)"
    } else {
        ""
    };
    match p.favourability {
        Favourability::Favoured => format!("favoured {conditions}{margin}"),
        Favourability::NotFavoured => format!("not favoured {conditions}{margin}"),
        Favourability::Unknown => format!("not judged {conditions}: no entropy of polymerisation"),
    }
}

/// The limiting temperature in words.
pub fn limit_text(p: &Polymerisation) -> String {
    match (p.limit_kind, p.limit_k) {
        (Some(LimitKind::Ceiling), Some(t)) => format!(
            "ceiling temperature {} K ({:.0} degC)",
            pm(Some(t), 1.0, 0),
            t.value - 273.15
        ),
        (Some(LimitKind::Floor), Some(t)) => format!(
            "floor temperature {} K ({:.0} degC): favoured above it",
            pm(Some(t), 1.0, 0),
            t.value - 273.15
        ),
        (Some(LimitKind::None), _) => "no ceiling: favoured at every temperature".to_string(),
        (Some(LimitKind::Never), _) => {
            "no ceiling: dH_p > 0 and dS_p + R ln[M] < 0, never favoured".to_string()
        }
        _ => "no ceiling temperature (no entropy)".to_string(),
    }
}

/// The table view.
pub fn render_table(rows: &[Row<PolymerRow>]) -> String {
    let mut out = String::new();
    for row in rows {
        let r = match row {
            Row::Done(r) => r,
            Row::Failed { error } => {
                out.push_str(&super::failed_block(error));
                continue;
            }
        };
        let p = &r.polymerisation;
        out.push_str(&format!(
            "{}  [{}]\n",
            super::record_title(&r.input, r.name.as_deref()),
            p.monomer_gas.formula
        ));
        out.push_str(&format!("opened: {}\n", p.opened_bond));
        out.push_str(&format!(
            "chain of three units (methyl caps): {}\n",
            p.unit.trimer_smiles
        ));
        out.push_str(&format!("states: {}\n", p.state.describe()));
        let mut t = Table::new();
        t.load_preset(UTF8_FULL_CONDENSED).set_header(vec![
            "quantity",
            "value",
            "source or remark",
        ]);
        t.add_row(vec![
            "monomer Hf298 (gas), kJ/mol".to_string(),
            pm(Some(p.monomer_gas.hf298_kj), 1.0, 2),
            p.monomer_gas.hf_source(),
        ]);
        t.add_row(vec![
            "repeat unit Hf298 (gas, middle of a long chain), kJ/mol".to_string(),
            pm(Some(p.unit.hf298_kj), 1.0, 2),
            "Benson group additivity, no ring term of the opened ring".to_string(),
        ]);
        t.add_row(vec![
            "dH_p gas to gas, kJ/mol".to_string(),
            pm(Some(p.dh_p_gg_kj), 1.0, 2),
            String::new(),
        ]);
        if p.state == PolymerState::LiquidCondensed {
            if let Some((q, source)) = &p.monomer_dhvap {
                t.add_row(vec![
                    "monomer dHvap(298.15 K), kJ/mol".to_string(),
                    pm(Some(*q), 1.0, 2),
                    source.clone(),
                ]);
            }
            t.add_row(vec![
                "dH_p liquid to condensed, kJ/mol".to_string(),
                pm(Some(p.dh_p_kj), 1.0, 2),
                "dH_p(gg) + dHvap(monomer) - dHvap share of the unit".to_string(),
            ]);
        }
        t.add_row(vec![
            "dS_p gas to gas at 1 bar, J/(mol K)".to_string(),
            pm(p.ds_p_gg_1bar_j, 1.0, 1),
            format!(
                "unit rotor symmetry term {:+.1} J/(mol K) included",
                p.unit.symmetry_entropy_j
            ),
        ]);
        t.add_row(vec![
            "dS_p° (monomer at 1 mol/L), J/(mol K)".to_string(),
            pm(p.ds_p_j, 1.0, 1),
            format!(
                "+{:.1} J/(mol K) from 1 bar to 1 mol/L{}",
                gas_standard_state_shift_j(T_REF_K),
                if p.state == PolymerState::LiquidCondensed {
                    "; monomer solvation and polymer condensation entropies taken to cancel"
                } else {
                    ""
                }
            ),
        ]);
        t.add_row(vec![
            format!(
                "dG_p at {:.2} K and {} mol/L, kJ/mol",
                p.temperature_k, p.concentration_mol_l
            ),
            pm(p.dg_p_kj, 1.0, 2),
            "dH_p - T (dS_p° + R ln[M])".to_string(),
        ]);
        out.push_str(&t.to_string());
        out.push('\n');
        out.push_str(&format!("{}\n", limit_text(p)));
        out.push_str(&format!("verdict: {}\n", verdict_text(p)));
        for f in &p.flags {
            out.push_str(&format!("  flag: {f}\n"));
        }
        out.push('\n');
    }
    out.push_str(
        "Ceiling temperature by Dainton-Ivin: T_c = dH_p / (dS_p° + R ln[M]), [M] in mol/L \
         (F. S. Dainton, K. J. Ivin, Q. Rev. Chem. Soc. 12 (1958) 61). The repeat unit is the \
         middle unit of a long chain by group additivity; the chain's stereo configurations are \
         not counted.\n",
    );
    out.push_str(SAFETY_NOTE);
    out.push('\n');
    out
}

/// CSV: one line per monomer.
pub fn render_csv(rows: &[Row<PolymerRow>]) -> String {
    let header = [
        "monomer",
        "name",
        "state",
        "dh_p_kj",
        "dh_p_unc_kj",
        "ds_p_j",
        "ds_p_unc_j",
        "concentration_mol_l",
        "t_k",
        "dg_p_kj",
        "dg_p_unc_kj",
        "limit",
        "limit_k",
        "limit_unc_k",
        "verdict",
    ];
    let mut lines = Vec::new();
    for row in rows {
        match row {
            Row::Done(r) => {
                let p = &r.polymerisation;
                let q = quantity_cells;
                let marginal = if p.verdict_within_uncertainty {
                    " (marginal)"
                } else {
                    ""
                };
                lines.push(
                    [
                        vec![
                            r.input.clone(),
                            r.name.clone().unwrap_or_default(),
                            format!("{:?}", p.state),
                        ],
                        q(Some(p.dh_p_kj), 2).to_vec(),
                        q(p.ds_p_j, 1).to_vec(),
                        vec![
                            format!("{}", p.concentration_mol_l),
                            format!("{:.2}", p.temperature_k),
                        ],
                        q(p.dg_p_kj, 2).to_vec(),
                        vec![p.limit_kind.map(|k| format!("{k:?}")).unwrap_or_default()],
                        q(p.limit_k, 1).to_vec(),
                        vec![format!("{:?}{marginal}", p.favourability)],
                    ]
                    .concat(),
                );
            }
            Row::Failed { error } => lines.push(error.csv_cells(header.len())),
        }
    }
    write_csv(&header, &lines)
}
