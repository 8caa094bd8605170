//! Report of a computed-enthalpy check: the species with their enthalpies and reference values,
//! the derived Hf298, the strain energy, and the comparison with group additivity.

use comfy_table::{presets::UTF8_FULL_CONDENSED, Table};

use super::pm;
use super::{cell, write_csv, SAFETY_NOTE};
use crate::computed::ComputedCheck;
use crate::reactions::SourceTag;
use crate::thermo::Quantity;
use crate::units::EnergyUnit;

/// A check with what it was run on.
#[derive(Debug, Clone, serde::Serialize)]
pub struct CheckReport {
    /// The target as given.
    pub input: String,
    /// The energies file.
    pub energies_file: String,
    /// The unit of the file.
    pub energies_unit: String,
    /// Measured Hf298 of the target from the reference table (name and source), if any.
    pub measured_hf_kj: Option<(Quantity, String)>,
    /// The check.
    pub check: ComputedCheck,
}

fn source_text(source: &Option<SourceTag>) -> String {
    match source {
        None => "target".to_string(),
        Some(SourceTag::Reference { source }) => source.clone(),
        Some(SourceTag::Fallback { method }) => format!("stand-in: {method}"),
        Some(SourceTag::Target { note }) => note.clone(),
    }
}

/// The table view.
pub fn render_table(r: &CheckReport, unit: EnergyUnit) -> String {
    let f = unit.factor();
    let u = unit.energy_label();
    let c = &r.check;
    let mut out = format!(
        "{}  {}: {}\nenergies: {} ({})\n",
        r.input, c.rung, c.reaction, r.energies_file, r.energies_unit
    );
    let mut t = Table::new();
    t.load_preset(UTF8_FULL_CONDENSED);
    t.set_header(vec![
        "species".to_string(),
        "coefficient".to_string(),
        "line".to_string(),
        "computed kJ/mol".to_string(),
        format!("Hf298 {u}"),
        "source of Hf298".to_string(),
    ]);
    for s in &c.species {
        t.add_row(vec![
            s.smiles.clone(),
            s.coefficient.to_string(),
            s.line.to_string(),
            cell(Some(s.computed_kj), 2),
            match s.hf298_kj {
                Some(q) => pm(Some(q), f, 2),
                None => "(derived)".to_string(),
            },
            source_text(&s.source),
        ]);
    }
    out.push_str(&t.to_string());
    out.push('\n');
    out.push_str(&format!(
        "reaction enthalpy from the computed enthalpies: {} {u}\n",
        cell(Some(c.dh_computed_kj * f), 2)
    ));
    out.push_str(&format!(
        "Hf298 of {} through {}: {} {u}  (reference uncertainties propagated{})\n",
        r.input,
        c.rung,
        pm(Some(c.hf298_kj), f, 2),
        if c.strain_kj.uncertainty > 0.0 {
            ", with the method uncertainty"
        } else {
            "; no method uncertainty given"
        }
    ));
    out.push_str(&format!(
        "strain energy (-dH of the {} reaction, computed): {} {u}\n",
        c.rung,
        pm(Some(c.strain_kj), f, 2)
    ));
    if let Some((q, name)) = &r.measured_hf_kj {
        out.push_str(&format!(
            "measured Hf298 ({name}): {} {u}; derived minus measured: {} {u}\n",
            pm(Some(*q), f, 2),
            cell(Some((c.hf298_kj.value - q.value) * f), 2)
        ));
    }
    match (c.group_additivity_hf_kj, c.difference_kj) {
        (Some(g), Some(d)) => out.push_str(&format!(
            "group additivity: {} {u}; derived minus group additivity: {} {u} ({} the tolerance of {} {u})\n",
            pm(Some(g), f, 2),
            cell(Some(d * f), 2),
            if c.flagged { "OUTSIDE" } else { "within" },
            cell(Some(c.tolerance_kj * f), 1)
        )),
        _ => out.push_str("group additivity: not available, no comparison made\n"),
    }
    for flag in &c.flags {
        out.push_str(&format!("  flag: {flag}\n"));
    }
    out.push_str(SAFETY_NOTE);
    out.push('\n');
    out
}

/// CSV: one summary line.
pub fn render_csv(r: &CheckReport, unit: EnergyUnit) -> String {
    let f = unit.factor();
    let eu = if unit == EnergyUnit::KiloJoule {
        "kj"
    } else {
        "kcal"
    };
    let c = &r.check;
    let header = [
        "input".to_string(),
        "rung".to_string(),
        "reaction".to_string(),
        format!("dh_computed_{eu}_per_mol"),
        format!("hf298_{eu}_per_mol"),
        format!("hf298_unc_{eu}_per_mol"),
        format!("strain_{eu}_per_mol"),
        format!("group_additivity_hf298_{eu}_per_mol"),
        format!("difference_{eu}_per_mol"),
        format!("tolerance_{eu}_per_mol"),
        "flagged".to_string(),
        "flags".to_string(),
    ];
    let line = vec![
        r.input.clone(),
        c.rung.to_string(),
        c.reaction.clone(),
        cell(Some(c.dh_computed_kj * f), 3),
        cell(Some(c.hf298_kj.value * f), 3),
        cell(Some(c.hf298_kj.uncertainty * f), 3),
        cell(Some(c.strain_kj.value * f), 3),
        cell(c.group_additivity_hf_kj.map(|q| q.value * f), 3),
        cell(c.difference_kj.map(|d| d * f), 3),
        cell(Some(c.tolerance_kj * f), 3),
        c.flagged.to_string(),
        c.flags.join(" | "),
    ];
    let refs: Vec<&str> = header.iter().map(String::as_str).collect();
    write_csv(&refs, &[line])
}
