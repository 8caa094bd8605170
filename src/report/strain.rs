//! Strain report: one block per molecule with every scheme side by side, the spread, the ring
//! systems, the flags, and the safety note underneath; or JSON, or CSV (one line per molecule).

use comfy_table::{presets::UTF8_FULL_CONDENSED, Table};

use super::{cell, pm, write_csv, Row, RowError, SAFETY_NOTE};
use crate::input::InputRecord;
use crate::molecule::parse_smiles;
use crate::strain::{analyse_strain, StrainAnalysis, StrainData};
use crate::thermo::Quantity;
use crate::units::EnergyUnit;

/// One analysed molecule.
#[derive(Debug, Clone, serde::Serialize)]
pub struct StrainRow {
    /// The input SMILES.
    pub input: String,
    /// Name given after the SMILES.
    pub name: Option<String>,
    /// The analysis (kJ/mol).
    pub analysis: StrainAnalysis,
}

/// Analyses every record; `user_hf_kj` applies to every record (the command allows it for one).
pub fn strain_rows(
    records: &[InputRecord],
    data: &StrainData,
    user_hf_kj: Option<Quantity>,
) -> Vec<Row<StrainRow>> {
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
            let mol = match parse_smiles(&r.smiles) {
                Ok(m) => m,
                Err(e) => return fail(e.to_string()),
            };
            match analyse_strain(&mol, data, user_hf_kj) {
                Ok(analysis) => Row::Done(StrainRow {
                    input: r.smiles.clone(),
                    name: r.name.clone(),
                    analysis,
                }),
                Err(e) => fail(e.to_string()),
            }
        })
        .collect()
}

fn title(r: &StrainRow) -> String {
    super::record_title(&r.input, r.name.as_deref())
}

/// The table view: a block per molecule, then the safety note.
pub fn render_table(rows: &[Row<StrainRow>], unit: EnergyUnit) -> String {
    let f = unit.factor();
    let u = unit.energy_label();
    let mut out = String::new();
    for row in rows {
        let r = match row {
            Row::Done(r) => r,
            Row::Failed { error } => {
                out.push_str(&format!(
                    "{}: error: {}\n\n",
                    error.place,
                    error.message.replace('\n', "\n  ")
                ));
                continue;
            }
        };
        let a = &r.analysis;
        out.push_str(&format!(
            "{}  [{}]  canonical {}\n",
            title(r),
            a.formula,
            a.canonical_smiles
        ));
        out.push_str(&format!(
            "Hf298 of the molecule: {} {u}  ({})\n",
            pm(Some(a.target_hf.hf298_kj), f, 2),
            a.target_hf.describe()
        ));
        out.push_str(&format!(
            "Hf298 by group additivity: {} {u}\n",
            pm(a.group_additivity_hf_kj, f, 2)
        ));
        let mut t = Table::new();
        t.load_preset(UTF8_FULL_CONDENSED);
        t.set_header(vec![
            "scheme".to_string(),
            format!("strain {u}"),
            format!("strain-free Hf298 {u}"),
            "reaction or remark".to_string(),
        ]);
        for s in &a.schemes {
            let remark = match (&s.reaction, &s.unavailable) {
                (_, Some(why)) => why.clone(),
                (Some(reaction), None) if !s.fallback_species.is_empty() => format!(
                    "{reaction}\nstand-in Hf298: {}",
                    s.fallback_species.join(", ")
                ),
                (Some(reaction), None) => reaction.clone(),
                (None, None) => "Hf298 minus the strain-free increment sum".to_string(),
            };
            t.add_row(vec![
                s.scheme.clone(),
                pm(s.strain_kj, f, 2),
                pm(s.strain_free_hf_kj, f, 2),
                remark,
            ]);
        }
        out.push_str(&t.to_string());
        out.push('\n');
        for s in a.schemes.iter().filter(|s| !s.source.is_empty()) {
            out.push_str(&format!("  {}: {}\n", s.scheme, s.source));
        }
        if let Some(spread) = a.spread_kj {
            out.push_str(&format!(
                "spread between schemes (largest minus smallest): {} {u}\n",
                cell(Some(spread * f), 2)
            ));
        }
        if !a.ring_systems.is_empty() {
            let mut t = Table::new();
            t.load_preset(UTF8_FULL_CONDENSED);
            t.set_header(vec![
                "ring system".to_string(),
                "ring atoms".to_string(),
                "ring sizes".to_string(),
                "ring correction(s)".to_string(),
                format!("strain {u}"),
            ]);
            for s in &a.ring_systems {
                let mut names = s.corrections.join(" + ");
                if s.stand_in.is_some() {
                    names.push_str(" (stand-in)");
                }
                t.add_row(vec![
                    s.number.to_string(),
                    join(&s.atoms),
                    join(&s.ring_sizes),
                    names,
                    pm(Some(s.strain_kj), f, 2),
                ]);
            }
            out.push_str("Strain per ring system (from the ring corrections):\n");
            out.push_str(&t.to_string());
            out.push('\n');
            if let Some(q) = a.unassigned_kj {
                out.push_str(&format!(
                    "not assigned to a ring system (Hf298 used minus group additivity): {} {u}\n",
                    pm(Some(q), f, 2)
                ));
            }
        }
        for flag in &a.flags {
            out.push_str(&format!("  flag: {flag}\n"));
        }
        out.push('\n');
    }
    out.push_str(
        "Strain energy: Hf298 of the molecule minus a strain-free reference (group schemes), or \
         minus the heat of the CBH reaction that opens its rings (reaction schemes). \
         Uncertainties combine the tabulated ones; they do not include the methods' own error.\n",
    );
    out.push_str(SAFETY_NOTE);
    out.push('\n');
    out
}

fn join(v: &[usize]) -> String {
    v.iter()
        .map(ToString::to_string)
        .collect::<Vec<_>>()
        .join(",")
}

fn slug(name: &str) -> String {
    let lower = name.to_ascii_lowercase();
    if lower.contains("benson") {
        "benson".to_string()
    } else if let Some(pos) = lower.find("cbh-") {
        lower[pos..pos + 5].replace('-', "")
    } else {
        lower
            .split(|c: char| !c.is_ascii_alphanumeric())
            .find(|w| !w.is_empty() && *w != "group" && *w != "strain")
            .unwrap_or("scheme")
            .to_string()
    }
}

/// CSV: one line per molecule; two columns (value, uncertainty) per scheme.
pub fn render_csv(rows: &[Row<StrainRow>], unit: EnergyUnit) -> String {
    let f = unit.factor();
    let eu = if unit == EnergyUnit::KiloJoule {
        "kj"
    } else {
        "kcal"
    };
    let schemes: Vec<String> = rows
        .iter()
        .find_map(|r| match r {
            Row::Done(r) => Some(r.analysis.schemes.iter().map(|s| slug(&s.scheme)).collect()),
            Row::Failed { .. } => None,
        })
        .unwrap_or_default();
    let mut header: Vec<String> = vec![
        "input".into(),
        "name".into(),
        "canonical_smiles".into(),
        "formula".into(),
        format!("hf298_{eu}_per_mol"),
        format!("hf298_unc_{eu}_per_mol"),
        "hf298_origin".into(),
    ];
    for s in &schemes {
        header.push(format!("strain_{s}_{eu}_per_mol"));
        header.push(format!("strain_{s}_unc_{eu}_per_mol"));
    }
    header.extend([
        format!("spread_{eu}_per_mol"),
        "ring_systems".into(),
        "flags".into(),
        "error".into(),
    ]);
    let width = header.len();
    let lines: Vec<Vec<String>> = rows
        .iter()
        .map(|row| match row {
            Row::Done(r) => {
                let a = &r.analysis;
                let mut v = vec![
                    r.input.clone(),
                    r.name.clone().unwrap_or_default(),
                    a.canonical_smiles.clone(),
                    a.formula.clone(),
                    cell(Some(a.target_hf.hf298_kj.value * f), 3),
                    cell(Some(a.target_hf.hf298_kj.uncertainty * f), 3),
                    a.target_hf.describe(),
                ];
                for k in 0..schemes.len() {
                    let q = a.schemes.get(k).and_then(|s| s.strain_kj);
                    v.push(cell(q.map(|q| q.value * f), 3));
                    v.push(cell(q.map(|q| q.uncertainty * f), 3));
                }
                v.push(cell(a.spread_kj.map(|s| s * f), 3));
                let systems: Vec<String> = a
                    .ring_systems
                    .iter()
                    .map(|s| {
                        format!(
                            "{}:{}",
                            join(&s.ring_sizes),
                            cell(Some(s.strain_kj.value * f), 3)
                        )
                    })
                    .collect();
                v.push(systems.join(" "));
                v.push(crate::thermo::flags::joined(&a.flags));
                v.push(String::new());
                v
            }
            Row::Failed { error } => error.csv_cells(width),
        })
        .collect();
    let refs: Vec<&str> = header.iter().map(String::as_str).collect();
    write_csv(&refs, &lines)
}
