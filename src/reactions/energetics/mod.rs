//! Reaction energetics from a reaction equation: dH, dS, dG and K at chosen temperatures, per
//! mole of reaction, per mole of a named reactant and per gram of reacting mass, and the strain
//! the reaction releases by every strain scheme.
//!
//! `dH(T) = sum(nu H(T))` with `H(T) = Hf298 + integral of Cp from 298.15 K` (Kirchhoff), likewise
//! `dS(T)`; `dG = dH - T dS`, `ln K = -dG / (R T)` (standard state 1 bar; for liquids the pure
//! liquid). Species values are taken as independent: uncertainties add in quadrature, each
//! scaled by its coefficient. Strain released is the strain of the reactants minus that of the
//! products (acyclic species have none), per scheme.
//!
//! ```
//! use ringheat::reactions::energetics::{reaction_energetics, EnergeticsData, EnergeticsOptions};
//! use ringheat::reactions::equation::ReactionEquation;
//! let data = EnergeticsData::bundled().unwrap();
//! let eq = ReactionEquation::parse("C1CC1.[H][H]>>CCC").unwrap();
//! let r = reaction_energetics(&eq, &data, &EnergeticsOptions::default()).unwrap();
//! // Measured Hf298 of cyclopropane and propane: about -158 kJ/mol (recalled from memory).
//! assert!((r.dh298_kj.value + 158.0).abs() < 2.0);
//! ```

pub mod small;
pub mod species;

use std::collections::BTreeMap;

use super::equation::{EquationError, ReactionEquation};
use crate::phase::Phase;
use crate::strain::analyse_strain;
use crate::thermo::Quantity;
use crate::units::{GAS_CONSTANT_J_PER_MOL_K as GAS_CONSTANT, T_REF_K};

pub use species::{EnergeticsData, SpeciesState, SpeciesThermo, SpeciesValues};

/// What to compute.
#[derive(Debug, Clone)]
pub struct EnergeticsOptions {
    /// Temperatures, K (298.15 K is always included first).
    pub temperatures_k: Vec<f64>,
    /// Phase of species without a phase mark.
    pub default_phase: Phase,
    /// SMILES of the reactant to express the heat per mole of, if any.
    pub per_reactant: Option<String>,
    /// User values by canonical SMILES.
    pub user_values: BTreeMap<String, SpeciesValues>,
    /// Whether to compute the strain released (it runs the strain schemes on every ring species).
    pub strain: bool,
    /// Whether measured Hf298 and dHvap values are used (false: estimates and user values only).
    pub use_measured: bool,
}

impl Default for EnergeticsOptions {
    fn default() -> EnergeticsOptions {
        EnergeticsOptions {
            temperatures_k: Vec::new(),
            default_phase: Phase::Gas,
            per_reactant: None,
            user_values: BTreeMap::new(),
            strain: true,
            use_measured: true,
        }
    }
}

/// Why a reaction's energetics could not be computed.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum EnergeticsError {
    /// The equation does not parse or balance.
    #[error(transparent)]
    Equation(#[from] EquationError),
    /// A species has no usable values.
    #[error("species {smiles}: {problem}")]
    Species {
        /// As written.
        smiles: String,
        /// Why.
        problem: String,
    },
    /// The reactant named for the per-mole figure is not a reactant.
    #[error("`{0}` is not a reactant of the reaction")]
    UnknownReactant(String),
}

/// Values at one temperature.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct TemperatureRow {
    /// Temperature, K.
    pub t_k: f64,
    /// dH, kJ/mol of reaction (absent when a species has no value there).
    pub dh_kj: Option<Quantity>,
    /// dS, J/(mol K).
    pub ds_j: Option<Quantity>,
    /// dG, kJ/mol.
    pub dg_kj: Option<Quantity>,
    /// log10 K with its uncertainty.
    pub log10_k: Option<Quantity>,
    /// Why some values are missing.
    pub note: Option<String>,
}

/// Strain released by one scheme.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct StrainRelease {
    /// The scheme's name.
    pub scheme: String,
    /// Strain of the reactants minus the products', kJ/mol of reaction.
    pub released_kj: Option<Quantity>,
    /// Why there is no value.
    pub unavailable: Option<String>,
}

/// One species with its signed coefficient.
#[derive(Debug, Clone, serde::Serialize)]
pub struct ReactionSpecies {
    /// As written.
    pub smiles: String,
    /// Products positive, reactants negative.
    pub coefficient: f64,
    /// Its values.
    pub thermo: SpeciesThermo,
}

/// The energetics of one reaction.
#[derive(Debug, Clone, serde::Serialize)]
pub struct ReactionEnergetics {
    /// The equation as read.
    pub equation: String,
    /// Every species, reactants first.
    pub species: Vec<ReactionSpecies>,
    /// dH at 298.15 K, kJ/mol of reaction.
    pub dh298_kj: Quantity,
    /// Values at 298.15 K and each asked temperature.
    pub rows: Vec<TemperatureRow>,
    /// Mass of the reactants per mole of reaction, g.
    pub reacting_mass_g: f64,
    /// dH298 per gram of reacting mass, J/g.
    pub dh298_j_per_g: Quantity,
    /// The named reactant, its coefficient and dH298 per mole of it, if one was named.
    pub per_reactant: Option<(String, f64, Quantity)>,
    /// Strain released per scheme.
    pub strain_released: Vec<StrainRelease>,
    /// Warnings from the species.
    pub flags: Vec<String>,
    /// Citations of the estimation methods the species' values used.
    pub methods: Vec<String>,
}

fn weighted_sum(items: impl Iterator<Item = (f64, Quantity)>) -> Quantity {
    let (mut v, mut var) = (0.0, 0.0);
    for (c, q) in items {
        v += c * q.value;
        var += (c * q.uncertainty).powi(2);
    }
    Quantity::new(v, var.sqrt())
}

/// Computes the energetics of `equation`; the equation must balance.
pub fn reaction_energetics(
    equation: &ReactionEquation,
    data: &EnergeticsData,
    options: &EnergeticsOptions,
) -> Result<ReactionEnergetics, EnergeticsError> {
    equation.check_balance()?;
    let mut species = Vec::new();
    let mut flags = Vec::new();
    for (term, coefficient) in equation.signed_terms() {
        let phase = term.phase.unwrap_or(options.default_phase);
        let values = options
            .user_values
            .get(&term.key)
            .copied()
            .unwrap_or_default();
        let thermo =
            SpeciesThermo::resolve_from(&term.molecule, phase, &values, data, options.use_measured)
                .map_err(|problem| EnergeticsError::Species {
                    smiles: term.smiles.clone(),
                    problem,
                })?;
        flags.extend(thermo.flags.iter().map(|f| format!("{}: {f}", term.smiles)));
        species.push(ReactionSpecies {
            smiles: term.smiles.clone(),
            coefficient,
            thermo,
        });
    }
    let dh298 = weighted_sum(species.iter().map(|s| (s.coefficient, s.thermo.hf298_kj)));
    let mut temperatures = vec![T_REF_K];
    for &t in &options.temperatures_k {
        if !temperatures.iter().any(|x| (x - t).abs() < 1e-6) {
            temperatures.push(t);
        }
    }
    let rows = temperatures
        .iter()
        .map(|&t| temperature_row(&species, t))
        .collect();
    let reacting_mass_g: f64 = species
        .iter()
        .filter(|s| s.coefficient < 0.0)
        .map(|s| -s.coefficient * s.thermo.molar_mass_g_mol)
        .sum();
    let per_reactant = match &options.per_reactant {
        None => None,
        Some(text) => {
            let key = crate::molecule::parse_smiles(text)
                .map(|m| crate::molecule::canonical_smiles(&m))
                .map_err(|_| EnergeticsError::UnknownReactant(text.clone()))?;
            match species
                .iter()
                .find(|s| s.coefficient < 0.0 && s.thermo.key == key)
            {
                Some(s) => {
                    let nu = -s.coefficient;
                    Some((s.smiles.clone(), nu, dh298.scaled(1.0 / nu)))
                }
                None => {
                    flags.push(format!("{text} is not a reactant: no heat per mole of it"));
                    None
                }
            }
        }
    };
    let strain_released = if options.strain {
        strain_release(equation, data, options)
    } else {
        Vec::new()
    };
    let mut methods = Vec::new();
    for s in &species {
        let Some(v) = &s.thermo.vaporisation else {
            continue;
        };
        let label = match &v.source {
            crate::phase::VaporisationSource::Estimated { .. } => {
                format!("dHvap estimates: {}", data.phase.method_label())
            }
            _ => continue,
        };
        if !methods.contains(&label) {
            methods.push(label);
        }
        let entropy = format!("dSvap: {}", v.entropy_source);
        if !methods.contains(&entropy) {
            methods.push(entropy);
        }
    }
    Ok(ReactionEnergetics {
        equation: equation.to_string(),
        methods,
        species,
        dh298_kj: dh298,
        rows,
        reacting_mass_g,
        dh298_j_per_g: dh298.scaled(1000.0 / reacting_mass_g),
        per_reactant,
        strain_released,
        flags,
    })
}

fn temperature_row(species: &[ReactionSpecies], t_k: f64) -> TemperatureRow {
    let mut states = Vec::new();
    let mut problems = Vec::new();
    for s in species {
        match s.thermo.state_at(t_k) {
            Ok(state) => states.push((s.coefficient, state)),
            Err(e) => problems.push(e),
        }
    }
    if !problems.is_empty() {
        return TemperatureRow {
            t_k,
            dh_kj: None,
            ds_j: None,
            dg_kj: None,
            log10_k: None,
            note: Some(problems.join("; ")),
        };
    }
    let dh = weighted_sum(states.iter().map(|(c, st)| (*c, st.h_kj)));
    let missing_s: Vec<&str> = species
        .iter()
        .zip(&states)
        .filter(|(_, (_, st))| st.s_j.is_none())
        .map(|(s, _)| s.smiles.as_str())
        .collect();
    if !missing_s.is_empty() {
        return TemperatureRow {
            t_k,
            dh_kj: Some(dh),
            ds_j: None,
            dg_kj: None,
            log10_k: None,
            note: Some(format!("no entropy for {}", missing_s.join(", "))),
        };
    }
    let ds = weighted_sum(
        states
            .iter()
            .map(|(c, st)| (*c, st.s_j.unwrap_or(Quantity::new(0.0, 0.0)))),
    );
    let dg = Quantity::new(
        dh.value - t_k * ds.value / 1000.0,
        dh.uncertainty.hypot(t_k * ds.uncertainty / 1000.0),
    );
    let ln10 = std::f64::consts::LN_10;
    let log10_k = dg.scaled(-1000.0 / (GAS_CONSTANT * t_k * ln10));
    TemperatureRow {
        t_k,
        dh_kj: Some(dh),
        ds_j: Some(ds),
        dg_kj: Some(dg),
        log10_k: Some(log10_k),
        note: None,
    }
}

/// Strain released per scheme: strain of the ring species on the left minus the right.
fn strain_release(
    equation: &ReactionEquation,
    data: &EnergeticsData,
    options: &EnergeticsOptions,
) -> Vec<StrainRelease> {
    // Scheme name -> (sum, variance, species lacking it).
    let mut schemes: Vec<(String, f64, f64, Vec<String>)> = Vec::new();
    let mut ring_species = 0;
    let mut failures: Vec<String> = Vec::new();
    for (term, coefficient) in equation.signed_terms() {
        if term.molecule.with_hydrogens_folded().cyclomatic_number() == 0 {
            continue;
        }
        ring_species += 1;
        let user = options
            .user_values
            .get(&term.key)
            .and_then(|v| v.hf298_gas_kj);
        let analysis = match analyse_strain(&term.molecule, &data.strain, user) {
            Ok(a) => a,
            Err(e) => {
                failures.push(format!("{}: {e}", term.smiles));
                continue;
            }
        };
        for scheme in &analysis.schemes {
            let idx = match schemes.iter().position(|s| s.0 == scheme.scheme) {
                Some(i) => i,
                None => {
                    schemes.push((scheme.scheme.clone(), 0.0, 0.0, Vec::new()));
                    schemes.len() - 1
                }
            };
            match scheme.strain_kj {
                // Released = -(sum of signed coefficient x strain).
                Some(q) => {
                    schemes[idx].1 -= coefficient * q.value;
                    schemes[idx].2 += (coefficient * q.uncertainty).powi(2);
                }
                None => schemes[idx].3.push(format!(
                    "{}: {}",
                    term.smiles,
                    scheme.unavailable.clone().unwrap_or_default()
                )),
            }
        }
    }
    if ring_species == 0 {
        return vec![StrainRelease {
            scheme: "every scheme".to_string(),
            released_kj: Some(Quantity::new(0.0, 0.0)),
            unavailable: Some("no ring species: no strain released".to_string()),
        }];
    }
    schemes
        .into_iter()
        .map(|(scheme, sum, var, mut lacking)| {
            lacking.extend(failures.iter().cloned());
            if lacking.is_empty() {
                StrainRelease {
                    scheme,
                    released_kj: Some(Quantity::new(sum, var.sqrt())),
                    unavailable: None,
                }
            } else {
                StrainRelease {
                    scheme,
                    released_kj: None,
                    unavailable: Some(lacking.join("; ")),
                }
            }
        })
        .collect()
}
