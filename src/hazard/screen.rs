//! Screening of a job: for every step the heat per mole and per gram, the heat of the batch,
//! the adiabatic temperature rise, the maximum temperature from the process temperature, the
//! severity class, the 500 J/g line and the oxygen balance, each with its source and the
//! uncertainty carried through.
//!
//! `Q = -dH x n x conversion` (kJ, n moles of the key reactant or monomer charged),
//! `dT_ad = Q / (m_batch cp)` (the whole charge reacting with no heat removed, the usual worst
//! case), `T_max = T_process + dT_ad`. Relative uncertainties of dH, n, m and cp combine in
//! quadrature. For a polymerisation the ceiling temperature at the stated monomer concentration
//! is compared with `T_max`.

use super::job::{CompoundSpec, Job, JobError, StepKind, StepSpec};
use super::oxygen::oxygen_balance_percent;
use super::quantity::Amount;
use super::severity::{screening_line, severity, ScreeningLine, Severity};
use crate::molecule::formula::Formula;
use crate::polymer::{polymerisation, LimitKind, PolymerisationOptions};
use crate::reactions::energetics::{
    reaction_energetics, EnergeticsData, EnergeticsOptions, SpeciesThermo,
};
use crate::strain::analyse_strain;
use crate::thermo::Quantity;

/// One compound's row.
#[derive(Debug, Clone, serde::Serialize)]
pub struct CompoundRow {
    /// Its id.
    pub id: String,
    /// Its name.
    pub name: String,
    /// SMILES as written.
    pub smiles: String,
    /// Hill formula.
    pub formula: String,
    /// Molar mass, g/mol.
    pub molar_mass_g_mol: f64,
    /// Gas Hf298, kJ/mol.
    pub hf298_kj: Option<Quantity>,
    /// Its source (or why there is none).
    pub hf_source: String,
    /// Strain energy by the CBH-2 reaction scheme (or the first scheme that gives one), kJ/mol.
    pub strain_kj: Option<Quantity>,
    /// The scheme of `strain_kj`.
    pub strain_scheme: Option<String>,
    /// Oxygen balance, %.
    pub oxygen_balance_percent: Option<f64>,
}

/// One screened step.
#[derive(Debug, Clone, serde::Serialize)]
pub struct StepResult {
    /// Name.
    pub name: String,
    /// Line in the job file.
    pub line: usize,
    /// `reaction` or `polymerisation`.
    pub kind: String,
    /// The reaction, or the monomer and the bond opened.
    pub description: String,
    /// States of the numbers.
    pub states: String,
    /// The key reactant (or monomer).
    pub key_species: String,
    /// dH per mole of the key reactant, kJ/mol.
    pub dh_kj_per_mol: Quantity,
    /// Heat released per gram of reacting mass, J/g (positive: heat given out).
    pub heat_j_per_g: Quantity,
    /// Moles of the key reactant that react.
    pub reacting_mol: Quantity,
    /// Heat released by the batch, kJ.
    pub heat_kj: Quantity,
    /// Heat released per gram of batch, J/g.
    pub heat_j_per_g_batch: Quantity,
    /// Adiabatic temperature rise, K.
    pub adiabatic_rise_k: Quantity,
    /// Process temperature, K.
    pub process_t_k: Quantity,
    /// Maximum temperature, K.
    pub max_t_k: Quantity,
    /// Severity class on the published bands.
    pub severity: Severity,
    /// Against the 500 J/g line.
    pub screening_line: ScreeningLine,
    /// Oxygen balance of the key reactant, %.
    pub oxygen_balance_percent: Option<f64>,
    /// Ceiling temperature at the stated concentration, K (polymerisation only).
    pub ceiling_k: Option<Quantity>,
    /// Monomer concentration used for the ceiling, mol/L, and whether it was the default.
    pub concentration: Option<(f64, bool)>,
    /// Sources of the values, one line each.
    pub sources: Vec<String>,
    /// Warnings.
    pub flags: Vec<String>,
}

/// A step's outcome.
#[derive(Debug, Clone, serde::Serialize)]
pub struct StepOutcome {
    /// Name.
    pub name: String,
    /// Line of its table.
    pub line: usize,
    /// The result, or its errors (each with file, line and key).
    pub result: Result<StepResult, Vec<String>>,
}

/// The whole screening.
#[derive(Debug, Clone, serde::Serialize)]
pub struct Screening {
    /// Job file.
    pub file: String,
    /// Title.
    pub title: String,
    /// Whether the job says its scenario is invented.
    pub invented: bool,
    /// Free text.
    pub note: Option<String>,
    /// Compounds.
    pub compounds: Vec<CompoundRow>,
    /// Steps in file order.
    pub steps: Vec<StepOutcome>,
    /// Problems outside the steps.
    pub problems: Vec<JobError>,
}

impl Screening {
    /// Number of steps that failed.
    pub fn failed_steps(&self) -> usize {
        self.steps.iter().filter(|s| s.result.is_err()).count()
    }
}

fn compound_row(c: &CompoundSpec, data: &EnergeticsData) -> CompoundRow {
    let formula = Formula::of(&c.molecule);
    let thermo = SpeciesThermo::resolve(&c.molecule, crate::phase::Phase::Gas, &c.values, data);
    let (hf, hf_source) = match &thermo {
        Ok(t) => (
            Some(t.hf298_kj).filter(|q| q.value.is_finite()),
            t.hf_source(),
        ),
        Err(e) => (None, e.clone()),
    };
    let (strain_kj, strain_scheme) = if c.molecule.with_hydrogens_folded().cyclomatic_number() > 0 {
        match analyse_strain(&c.molecule, &data.strain, c.values.hf298_gas_kj) {
            Ok(a) => {
                let pick = a
                    .scheme("CBH-2")
                    .filter(|s| s.strain_kj.is_some())
                    .or_else(|| a.schemes.iter().find(|s| s.strain_kj.is_some()));
                (
                    pick.and_then(|s| s.strain_kj),
                    pick.map(|s| s.scheme.clone()),
                )
            }
            Err(_) => (None, None),
        }
    } else {
        (Some(Quantity::new(0.0, 0.0)), Some("acyclic".to_string()))
    };
    CompoundRow {
        id: c.id.clone(),
        name: c.name.clone(),
        smiles: c.smiles.clone(),
        formula: formula.hill(),
        molar_mass_g_mol: formula.molar_mass(),
        hf298_kj: hf,
        hf_source,
        strain_kj,
        strain_scheme,
        oxygen_balance_percent: oxygen_balance_percent(&formula).ok(),
    }
}

fn relative(q: Quantity) -> f64 {
    if q.value == 0.0 {
        0.0
    } else {
        q.uncertainty / q.value.abs()
    }
}

/// The per-step heat chain from dH per mole of the key species.
struct Heat {
    dh_kj_per_mol: Quantity,
    molar_mass_g: f64,
    reacting_mass_per_mol_key_g: f64,
}

fn finish(
    step: &StepSpec,
    heat: Heat,
    kind: &str,
    description: String,
    states: String,
    key_species: String,
    oxygen: Option<f64>,
) -> StepResult {
    let moles = match step.amount {
        Amount::Moles(q) => q,
        Amount::Grams(q) => q.scaled(1.0 / heat.molar_mass_g),
    };
    let reacting = moles.scaled(step.conversion);
    let q_value = -heat.dh_kj_per_mol.value * reacting.value;
    let q_rel = relative(heat.dh_kj_per_mol).hypot(relative(reacting));
    let heat_kj = Quantity::new(q_value, q_value.abs() * q_rel);
    let per_g = heat
        .dh_kj_per_mol
        .scaled(-1000.0 / heat.reacting_mass_per_mol_key_g);
    let batch = step.batch_mass_g;
    let per_g_batch = Quantity::new(
        q_value * 1000.0 / batch.value,
        (q_value * 1000.0 / batch.value).abs() * q_rel.hypot(relative(batch)),
    );
    let rise_value = q_value * 1000.0 / (batch.value * step.cp_j_per_g_k.value);
    let rise_rel = q_rel
        .hypot(relative(batch))
        .hypot(relative(step.cp_j_per_g_k));
    let rise = Quantity::new(rise_value, rise_value.abs() * rise_rel);
    let max_t = Quantity::new(
        step.process_t_k.value + rise.value,
        step.process_t_k.uncertainty.hypot(rise.uncertainty),
    );
    StepResult {
        name: step.name.clone(),
        line: step.line,
        kind: kind.to_string(),
        description,
        states,
        key_species,
        dh_kj_per_mol: heat.dh_kj_per_mol,
        heat_j_per_g: per_g,
        reacting_mol: reacting,
        heat_kj,
        heat_j_per_g_batch: per_g_batch,
        severity: severity(rise),
        screening_line: screening_line(per_g),
        adiabatic_rise_k: rise,
        process_t_k: step.process_t_k,
        max_t_k: max_t,
        oxygen_balance_percent: oxygen,
        ceiling_k: None,
        concentration: None,
        sources: Vec::new(),
        flags: Vec::new(),
    }
}

fn screen_step(job: &Job, step: &StepSpec, data: &EnergeticsData) -> Result<StepResult, String> {
    let mut user_values = std::collections::BTreeMap::new();
    for c in &job.compounds {
        user_values.insert(c.key.clone(), c.values);
    }
    match &step.kind {
        StepKind::Reaction {
            equation,
            key_reactant,
            phase,
        } => {
            let options = EnergeticsOptions {
                default_phase: *phase,
                user_values,
                strain: false,
                ..EnergeticsOptions::default()
            };
            let e = reaction_energetics(equation, data, &options).map_err(|e| e.to_string())?;
            let key = e
                .species
                .iter()
                .find(|s| s.coefficient < 0.0 && &s.thermo.key == key_reactant)
                .ok_or("the key reactant is not a reactant")?;
            let nu = -key.coefficient;
            let name = job
                .compounds
                .iter()
                .find(|c| &c.key == key_reactant)
                .map_or(key.smiles.clone(), |c| c.name.clone());
            let heat = Heat {
                dh_kj_per_mol: e.dh298_kj.scaled(1.0 / nu),
                molar_mass_g: key.thermo.molar_mass_g_mol,
                reacting_mass_per_mol_key_g: e.reacting_mass_g / nu,
            };
            let oxygen = equation
                .reactants
                .iter()
                .find(|t| &t.key == key_reactant)
                .and_then(|t| oxygen_balance_percent(&Formula::of(&t.molecule)).ok());
            let phases: Vec<&str> = e.species.iter().map(|s| s.thermo.phase.name()).collect();
            let states = if phases.iter().all(|p| *p == phases[0]) {
                format!("all species {}, 298.15 K", phases[0])
            } else {
                "mixed phases as marked, 298.15 K".to_string()
            };
            let mut r = finish(
                step,
                heat,
                "reaction",
                e.equation.clone(),
                states,
                name,
                oxygen,
            );
            for s in &e.species {
                r.sources
                    .push(format!("{}: {}", s.smiles, s.thermo.hf_source()));
            }
            r.sources.extend(e.methods.iter().cloned());
            r.flags.extend(e.flags.iter().cloned());
            Ok(r)
        }
        StepKind::Polymerisation {
            monomer,
            open_bond,
            state,
            concentration_mol_l,
        } => {
            let c = &job.compounds[*monomer];
            let options = PolymerisationOptions {
                bond: *open_bond,
                concentration_mol_l: *concentration_mol_l,
                temperature_k: Some(step.process_t_k.value),
                state: *state,
                monomer_values: c.values,
                unit_dhvap_kj: None,
            };
            let p = polymerisation(&c.molecule, data, &options).map_err(|e| e.to_string())?;
            let m = Formula::of(&c.molecule).molar_mass();
            let heat = Heat {
                dh_kj_per_mol: p.dh_p_kj,
                molar_mass_g: m,
                reacting_mass_per_mol_key_g: m,
            };
            let oxygen = oxygen_balance_percent(&Formula::of(&c.molecule)).ok();
            let description = format!("{} ({}) opened at {}", c.name, c.smiles, p.opened_bond);
            let mut r = finish(
                step,
                heat,
                "polymerisation",
                description,
                p.state.describe().to_string(),
                c.name.clone(),
                oxygen,
            );
            r.sources
                .push(format!("monomer Hf298: {}", p.monomer_gas.hf_source()));
            if let Some((_, source)) = &p.monomer_dhvap {
                r.sources.push(format!("monomer dHvap: {source}"));
            }
            r.sources.push(
                "repeat unit: Benson group additivity as the middle unit of a long chain"
                    .to_string(),
            );
            r.concentration = Some((p.concentration_mol_l, p.concentration_defaulted));
            if p.limit_kind == Some(LimitKind::Ceiling) {
                r.ceiling_k = p.limit_k;
                if let Some(tc) = p.limit_k {
                    if r.max_t_k.value > tc.value {
                        r.flags.push(format!(
                            "the maximum temperature {:.0} K passes the ceiling temperature {:.0} K: \
                             above it the polymer is not stable and the heat release stops short \
                             of full conversion; do not count on this as a safeguard",
                            r.max_t_k.value, tc.value
                        ));
                    }
                }
            }
            r.flags.extend(p.flags.iter().cloned());
            Ok(r)
        }
    }
}

/// Screens every step of `job`; a step that cannot be screened keeps its errors.
pub fn screen(job: &Job, data: &EnergeticsData) -> Screening {
    let compounds = job
        .compounds
        .iter()
        .map(|c| compound_row(c, data))
        .collect();
    let steps = job
        .steps
        .iter()
        .map(|entry| StepOutcome {
            name: entry.name.clone(),
            line: entry.line,
            result: match &entry.spec {
                Err(errors) => Err(errors.iter().map(|e| e.to_string()).collect()),
                Ok(step) => screen_step(job, step, data).map_err(|e| {
                    vec![format!(
                        "{}:{}: step `{}`: {e}",
                        job.file, step.line, step.name
                    )]
                }),
            },
        })
        .collect();
    Screening {
        file: job.file.clone(),
        title: job.title.clone(),
        invented: job.invented,
        note: job.note.clone(),
        compounds,
        steps,
        problems: job.problems.clone(),
    }
}
