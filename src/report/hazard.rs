//! Hazard-screening report as a terminal table, CSV or Markdown; the HTML page is in
//! [`super::html`]. Every view carries the cautions, the sources and the steps that could not
//! be screened with their file, line and key.

use comfy_table::{presets::UTF8_FULL_CONDENSED, Table};

use super::{cell, pm, write_csv};
use crate::hazard::oxygen::OXYGEN_BALANCE_SOURCE;
use crate::hazard::screen::{CompoundRow, Screening, StepResult};
use crate::hazard::severity::{ScreeningLine, SCREENING_LINE_SOURCE, SEVERITY_SOURCE};
use crate::hazard::CAUTIONS;

/// Column headings of the step table.
pub const STEP_HEADER: [&str; 10] = [
    "step",
    "kind",
    "dH kJ/mol",
    "heat J/g",
    "500 J/g line",
    "batch heat kJ",
    "dT_ad K",
    "T_process -> T_max",
    "severity",
    "ceiling T_c",
];

/// Column headings of the compound table.
pub const COMPOUND_HEADER: [&str; 7] = [
    "compound",
    "SMILES",
    "formula",
    "Hf298 gas kJ/mol",
    "strain kJ/mol",
    "strain J/g",
    "oxygen balance %",
];

/// Words for the screening line.
pub fn line_text(l: ScreeningLine) -> &'static str {
    match l {
        ScreeningLine::Above => "above",
        ScreeningLine::Below => "below",
        ScreeningLine::WithinUncertainty => "within uncertainty",
    }
}

fn kelvin_and_celsius(t: f64) -> String {
    format!("{t:.0} K ({:.0} degC)", t - 273.15)
}

/// The step table's cells for one step.
pub fn step_cells(r: &StepResult) -> Vec<String> {
    vec![
        r.name.clone(),
        r.kind.clone(),
        pm(Some(r.dh_kj_per_mol), 1.0, 1),
        pm(Some(r.heat_j_per_g), 1.0, 0),
        line_text(r.screening_line).to_string(),
        pm(Some(r.heat_kj), 1.0, 0),
        pm(Some(r.adiabatic_rise_k), 1.0, 0),
        format!(
            "{} -> {}",
            kelvin_and_celsius(r.process_t_k.value),
            kelvin_and_celsius(r.max_t_k.value)
        ),
        r.severity.describe(),
        match (r.ceiling_k, r.concentration) {
            (Some(t), Some((c, default))) => format!(
                "{} K at {c} mol/L{}",
                pm(Some(t), 1.0, 0),
                if default { " (default)" } else { "" }
            ),
            (None, Some(_)) => "none".to_string(),
            _ => String::new(),
        },
    ]
}

/// The step table's rows: a screened step's cells, or its name marked not screened.
pub fn step_rows(s: &Screening) -> Vec<Vec<String>> {
    s.steps
        .iter()
        .map(|step| match &step.result {
            Ok(r) => step_cells(r),
            Err(_) => {
                let mut row = vec![step.name.clone(), "not screened (see errors)".to_string()];
                row.extend(std::iter::repeat_n(String::new(), STEP_HEADER.len() - 2));
                row
            }
        })
        .collect()
}

/// The compound table's cells for one compound.
pub fn compound_cells(c: &CompoundRow) -> Vec<String> {
    let strain_per_g = c.strain_kj.map(|q| q.scaled(1000.0 / c.molar_mass_g_mol));
    vec![
        format!("{} ({})", c.name, c.id),
        c.smiles.clone(),
        c.formula.clone(),
        pm(c.hf298_kj, 1.0, 1),
        match (&c.strain_kj, &c.strain_scheme) {
            (Some(q), Some(s)) => format!("{} ({s})", pm(Some(*q), 1.0, 1)),
            _ => "n/a".to_string(),
        },
        pm(strain_per_g, 1.0, 0),
        cell(c.oxygen_balance_percent, 1),
    ]
}

/// The lines that say where the numbers come from.
pub fn method_lines() -> Vec<String> {
    vec![
        "Heat: Q = -dH x n x conversion for the amount charged; dT_ad = Q / (batch mass x mixture cp), no heat removed; T_max = T_process + dT_ad.".to_string(),
        format!("Severity classes: {SEVERITY_SOURCE}."),
        format!("Screening line: {SCREENING_LINE_SOURCE}."),
        format!("Oxygen balance: {OXYGEN_BALANCE_SOURCE}."),
        "Polymerisation: dH_p of monomer to repeat unit (the middle unit of a long chain, Benson group additivity); ceiling temperature by Dainton-Ivin at the stated monomer concentration.".to_string(),
        "Uncertainties: those of the heats of formation and vaporisation enthalpies, propagated with those given for the process data.".to_string(),
    ]
}

/// The heading lines: title, the invented-scenario note, the file.
pub fn heading_lines(s: &Screening) -> Vec<String> {
    let mut out = vec![s.title.clone()];
    if s.invented {
        out.push(
            "Invented scenario: the plant, batches and loads are invented for illustration; the molecules are real."
                .to_string(),
        );
    }
    if let Some(n) = &s.note {
        out.push(n.clone());
    }
    out.push(format!("job file: {}", s.file));
    out
}

/// Every error of the job: problems outside steps, then failed steps.
pub fn error_lines(s: &Screening) -> Vec<String> {
    let mut out: Vec<String> = s.problems.iter().map(|p| p.to_string()).collect();
    for step in &s.steps {
        if let Err(errors) = &step.result {
            out.push(format!(
                "step `{}` (line {}) not screened:",
                step.name, step.line
            ));
            out.extend(errors.iter().map(|e| format!("  {e}")));
        }
    }
    out
}

/// The terminal view.
pub fn render_table(s: &Screening) -> String {
    let mut out = String::new();
    for l in heading_lines(s) {
        out.push_str(&l);
        out.push('\n');
    }
    out.push('\n');
    let mut compounds = Table::new();
    compounds
        .load_preset(UTF8_FULL_CONDENSED)
        .set_header(COMPOUND_HEADER.to_vec());
    for c in &s.compounds {
        compounds.add_row(compound_cells(c));
    }
    out.push_str(&compounds.to_string());
    out.push('\n');
    let mut steps = Table::new();
    steps
        .load_preset(UTF8_FULL_CONDENSED)
        .set_header(STEP_HEADER.to_vec());
    for row in step_rows(s) {
        steps.add_row(row);
    }
    out.push_str(&steps.to_string());
    out.push('\n');
    for step in &s.steps {
        let Ok(r) = &step.result else { continue };
        out.push_str(&format!(
            "{} (line {}): {}\n",
            r.name, r.line, r.description
        ));
        out.push_str(&format!(
            "  states: {}; per mole of {}; {} mol react\n",
            r.states,
            r.key_species,
            pm(Some(r.reacting_mol), 1.0, 1)
        ));
        for src in &r.sources {
            out.push_str(&format!("  source: {src}\n"));
        }
        for f in &r.flags {
            out.push_str(&format!("  flag: {f}\n"));
        }
        if let Some(ob) = r.oxygen_balance_percent {
            out.push_str(&format!(
                "  oxygen balance of {}: {ob:.1} %\n",
                r.key_species
            ));
        }
    }
    let errors = error_lines(s);
    if !errors.is_empty() {
        out.push_str("\nErrors in the job file (the other steps are reported above):\n");
        for e in errors {
            out.push_str(&format!("  {e}\n"));
        }
    }
    out.push('\n');
    for m in method_lines() {
        out.push_str(&m);
        out.push('\n');
    }
    out.push_str("\nCautions:\n");
    for c in CAUTIONS {
        out.push_str(&format!("  - {c}\n"));
    }
    out
}

/// CSV: one line per step (failed steps with their errors in the last column).
pub fn render_csv(s: &Screening) -> String {
    let header = [
        "step",
        "line",
        "kind",
        "dh_kj_per_mol",
        "dh_unc_kj_per_mol",
        "heat_j_per_g",
        "heat_unc_j_per_g",
        "screening_line_500_j_per_g",
        "batch_heat_kj",
        "batch_heat_unc_kj",
        "adiabatic_rise_k",
        "adiabatic_rise_unc_k",
        "process_t_k",
        "max_t_k",
        "max_t_unc_k",
        "severity",
        "severity_low",
        "severity_high",
        "ceiling_k",
        "oxygen_balance_percent",
        "errors",
    ];
    let mut rows = Vec::new();
    for step in &s.steps {
        match &step.result {
            Ok(r) => rows.push(vec![
                r.name.clone(),
                r.line.to_string(),
                r.kind.clone(),
                cell(Some(r.dh_kj_per_mol.value), 2),
                cell(Some(r.dh_kj_per_mol.uncertainty), 2),
                cell(Some(r.heat_j_per_g.value), 1),
                cell(Some(r.heat_j_per_g.uncertainty), 1),
                line_text(r.screening_line).to_string(),
                cell(Some(r.heat_kj.value), 0),
                cell(Some(r.heat_kj.uncertainty), 0),
                cell(Some(r.adiabatic_rise_k.value), 1),
                cell(Some(r.adiabatic_rise_k.uncertainty), 1),
                cell(Some(r.process_t_k.value), 2),
                cell(Some(r.max_t_k.value), 1),
                cell(Some(r.max_t_k.uncertainty), 1),
                r.severity.class.to_string(),
                r.severity.class_low.to_string(),
                r.severity.class_high.to_string(),
                cell(r.ceiling_k.map(|q| q.value), 1),
                cell(r.oxygen_balance_percent, 1),
                String::new(),
            ]),
            Err(errors) => {
                let mut row = vec![step.name.clone(), step.line.to_string()];
                row.extend(std::iter::repeat_n(String::new(), header.len() - 3));
                row.push(errors.join(" | "));
                rows.push(row);
            }
        }
    }
    let mut out = write_csv(&header, &rows);
    for l in heading_lines(s) {
        out.push_str(&format!("# {l}\n"));
    }
    for p in &s.problems {
        out.push_str(&format!("# {p}\n"));
    }
    for c in CAUTIONS {
        out.push_str(&format!("# {c}\n"));
    }
    out
}

fn md_escape(text: &str) -> String {
    text.replace('|', "\\|")
}

fn md_table(header: &[&str], rows: &[Vec<String>]) -> String {
    let mut out = format!("| {} |\n", header.join(" | "));
    out.push_str(&format!("|{}\n", " --- |".repeat(header.len())));
    for r in rows {
        let cells: Vec<String> = r.iter().map(|c| md_escape(c)).collect();
        out.push_str(&format!("| {} |\n", cells.join(" | ")));
    }
    out
}

/// Markdown.
pub fn render_markdown(s: &Screening) -> String {
    let heading = heading_lines(s);
    let mut out = format!("# {}\n\n", md_escape(&heading[0]));
    for l in &heading[1..] {
        out.push_str(&format!("{}\n\n", md_escape(l)));
    }
    out.push_str("> **Cautions.**");
    for c in CAUTIONS {
        out.push_str(&format!(" {c}"));
    }
    out.push_str("\n\n## Compounds\n\n");
    let rows: Vec<Vec<String>> = s.compounds.iter().map(compound_cells).collect();
    out.push_str(&md_table(&COMPOUND_HEADER, &rows));
    out.push_str("\n## Steps\n\n");
    let rows = step_rows(s);
    out.push_str(&md_table(&STEP_HEADER, &rows));
    for step in &s.steps {
        let Ok(r) = &step.result else { continue };
        out.push_str(&format!(
            "\n### {} (line {})\n\n{}\n\nStates: {}; per mole of {}.\n\n",
            md_escape(&r.name),
            r.line,
            md_escape(&r.description),
            r.states,
            md_escape(&r.key_species)
        ));
        for src in &r.sources {
            out.push_str(&format!("- source: {}\n", md_escape(src)));
        }
        for f in &r.flags {
            out.push_str(&format!("- flag: {}\n", md_escape(f)));
        }
    }
    let errors = error_lines(s);
    if !errors.is_empty() {
        out.push_str("\n## Errors in the job file\n\n```\n");
        for e in errors {
            out.push_str(&format!("{e}\n"));
        }
        out.push_str("```\n");
    }
    out.push_str("\n## Methods and sources\n\n");
    for m in method_lines() {
        out.push_str(&format!("- {}\n", md_escape(&m)));
    }
    out.push_str("\n## Cautions\n\n");
    for c in CAUTIONS {
        out.push_str(&format!("- {c}\n"));
    }
    out
}
