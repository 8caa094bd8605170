//! Reactions report: the CBH reactions of each molecule with their species, where each
//! species' Hf298 would come from, and (for one rung) the fill-in template of computed
//! enthalpies.

use comfy_table::{presets::UTF8_FULL_CONDENSED, Table};

use super::pm;
use super::{write_csv, Row, RowError};
use crate::computed::energies::{template, InputUnit};
use crate::input::InputRecord;
use crate::molecule::parse_smiles;
use crate::reactions::{build_reaction, Reaction, Rung, SourceTag, Species};
use crate::thermo::Quantity;
use crate::units::EnergyUnit;

/// One species of a reaction with its role and reference value.
#[derive(Debug, Clone, serde::Serialize)]
pub struct ReactionSpecies {
    /// Canonical SMILES.
    pub smiles: String,
    /// Signed coefficient: products positive, reactants negative.
    pub coefficient: i64,
    /// `target`, `co-reactant` or `product`.
    pub role: &'static str,
    /// Hf298 of a reference species, kJ/mol, if known.
    pub hf298_kj: Option<Quantity>,
    /// Where it comes from.
    pub source: Option<SourceTag>,
}

/// One reaction of one molecule.
#[derive(Debug, Clone, serde::Serialize)]
pub struct ReactionRow {
    /// The input SMILES.
    pub input: String,
    /// Name given after the SMILES.
    pub name: Option<String>,
    /// The rung.
    pub rung: Rung,
    /// The classical class the rung matches.
    pub reaction_class: &'static str,
    /// The reaction as text.
    pub reaction: String,
    /// As reaction SMILES.
    pub reaction_smiles: String,
    /// True when the target cancels (nothing to learn from this rung).
    pub target_cancelled: bool,
    /// Every species.
    pub species: Vec<ReactionSpecies>,
    /// The fill-in template of computed enthalpies (when one rung was asked for).
    pub template: Option<String>,
}

/// Builds the reactions of every record at `rungs`; a template is added when `template_unit`
/// is given. Failures (parse or build) become error rows, one per record and rung.
pub fn reaction_rows(
    records: &[InputRecord],
    rungs: &[Rung],
    lookup: &dyn Fn(&Species) -> Option<(Quantity, SourceTag)>,
    template_unit: Option<InputUnit>,
) -> Vec<Row<ReactionRow>> {
    let mut rows = Vec::new();
    for r in records {
        let fail = |message: String| Row::Failed {
            error: RowError {
                place: r.place.clone(),
                input: r.smiles.clone(),
                message,
            },
        };
        let mol = match parse_smiles(&r.smiles) {
            Ok(m) => m,
            Err(e) => {
                rows.push(fail(e.to_string()));
                continue;
            }
        };
        for &rung in rungs {
            match build_reaction(&mol, rung) {
                Ok(reaction) => rows.push(Row::Done(row_of(r, &reaction, lookup, template_unit))),
                Err(e) => rows.push(fail(format!("{rung}: {e}"))),
            }
        }
    }
    rows
}

fn row_of(
    r: &InputRecord,
    reaction: &Reaction,
    lookup: &dyn Fn(&Species) -> Option<(Quantity, SourceTag)>,
    template_unit: Option<InputUnit>,
) -> ReactionRow {
    let species = reaction
        .signed_terms()
        .map(|(s, c)| {
            let is_target = s.smiles == reaction.target.smiles;
            let (hf, source) = if is_target {
                (None, None)
            } else {
                lookup(s).map_or((None, None), |(q, t)| (Some(q), Some(t)))
            };
            ReactionSpecies {
                smiles: s.smiles.clone(),
                coefficient: c,
                role: match (is_target, c < 0) {
                    (true, _) => "target",
                    (false, true) => "co-reactant",
                    (false, false) => "product",
                },
                hf298_kj: hf,
                source,
            }
        })
        .collect();
    ReactionRow {
        input: r.smiles.clone(),
        name: r.name.clone(),
        rung: reaction.rung,
        reaction_class: reaction.rung.reaction_class(),
        reaction: reaction.to_string(),
        reaction_smiles: reaction.reaction_smiles(),
        target_cancelled: reaction.target_cancelled(),
        species,
        template: template_unit
            .filter(|_| !reaction.target_cancelled())
            .map(|u| template(reaction, u)),
    }
}

fn source_text(source: &Option<SourceTag>) -> String {
    match source {
        None => String::new(),
        Some(SourceTag::Reference { source }) => source.clone(),
        Some(SourceTag::Fallback { method }) => format!("stand-in: {method}"),
        Some(SourceTag::Target { note }) => note.clone(),
    }
}

/// The table view: each reaction with its species, then the template if any.
pub fn render_table(rows: &[Row<ReactionRow>], unit: EnergyUnit) -> String {
    let f = unit.factor();
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
        let title = r
            .name
            .as_ref()
            .map_or(r.input.clone(), |n| format!("{} ({n})", r.input));
        out.push_str(&format!(
            "{title}  {}: {}\n  class: {}\n  reaction SMILES: {}\n",
            r.rung, r.reaction, r.reaction_class, r.reaction_smiles
        ));
        if r.target_cancelled {
            out.push_str(
                "  the target cancels at this rung: its reaction heat is zero by construction\n\n",
            );
            continue;
        }
        let mut t = Table::new();
        t.load_preset(UTF8_FULL_CONDENSED);
        t.set_header(vec![
            "species".to_string(),
            "role".to_string(),
            "coefficient".to_string(),
            format!("Hf298 {}", unit.energy_label()),
            "source".to_string(),
        ]);
        for s in &r.species {
            t.add_row(vec![
                s.smiles.clone(),
                s.role.to_string(),
                s.coefficient.to_string(),
                if s.role == "target" {
                    String::new()
                } else {
                    pm(s.hf298_kj, f, 2)
                },
                source_text(&s.source),
            ]);
        }
        out.push_str(&t.to_string());
        out.push('\n');
        if let Some(tpl) = &r.template {
            out.push_str("\nTemplate of computed enthalpies (save, fill in, pass to check-computed --energies):\n");
            out.push_str(tpl);
        }
        out.push('\n');
    }
    out
}

/// CSV: one line per reaction species.
pub fn render_csv(rows: &[Row<ReactionRow>], unit: EnergyUnit) -> String {
    let f = unit.factor();
    let eu = if unit == EnergyUnit::KiloJoule {
        "kj"
    } else {
        "kcal"
    };
    let header = [
        "input".to_string(),
        "rung".to_string(),
        "reaction".to_string(),
        "species".to_string(),
        "role".to_string(),
        "coefficient".to_string(),
        format!("hf298_{eu}_per_mol"),
        format!("hf298_unc_{eu}_per_mol"),
        "source".to_string(),
        "error".to_string(),
    ];
    let mut lines = Vec::new();
    for row in rows {
        match row {
            Row::Done(r) => {
                for s in &r.species {
                    lines.push(vec![
                        r.input.clone(),
                        r.rung.to_string(),
                        r.reaction.clone(),
                        s.smiles.clone(),
                        s.role.to_string(),
                        s.coefficient.to_string(),
                        super::cell(s.hf298_kj.map(|q| q.value * f), 3),
                        super::cell(s.hf298_kj.map(|q| q.uncertainty * f), 3),
                        source_text(&s.source),
                        String::new(),
                    ]);
                }
            }
            Row::Failed { error } => {
                lines.push(error.csv_cells(header.len()));
            }
        }
    }
    let refs: Vec<&str> = header.iter().map(String::as_str).collect();
    write_csv(&refs, &lines)
}
