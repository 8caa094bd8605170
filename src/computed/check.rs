//! The target's Hf298 from a CBH reaction and the user's computed enthalpies.

use super::energies::{EnergiesError, EnergiesErrors, EnergiesFile};
use crate::reactions::{Reaction, ReactionError, Rung, SourceTag, Species};
use crate::thermo::Quantity;

/// Options of a check.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct CheckOptions {
    /// A derived Hf298 further than this from the group-additivity estimate is flagged, kJ/mol.
    pub tolerance_kj: f64,
    /// Uncertainty the user assigns to the computed reaction enthalpy (method error), kJ/mol;
    /// added in quadrature to the reference uncertainties.
    pub method_uncertainty_kj: f64,
}

impl Default for CheckOptions {
    /// Tolerance 10 kJ/mol: our choice, about two to three times the usual group-additivity
    /// error for molecules whose groups are all tabulated (S. W. Benson, Thermochemical Kinetics,
    /// 2nd ed., Wiley 1976: a few kJ/mol; recalled from memory);
    /// no method uncertainty.
    fn default() -> CheckOptions {
        CheckOptions {
            tolerance_kj: 10.0,
            method_uncertainty_kj: 0.0,
        }
    }
}

/// One species of the checked reaction.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct SpeciesEnergy {
    /// Canonical SMILES.
    pub smiles: String,
    /// Signed coefficient: products positive, reactants negative.
    pub coefficient: i64,
    /// Line of the energies file.
    pub line: usize,
    /// The user's enthalpy converted to kJ/mol.
    pub computed_kj: f64,
    /// Hf298 of a reference species (none for the target), kJ/mol.
    pub hf298_kj: Option<Quantity>,
    /// Where that Hf298 came from.
    pub source: Option<SourceTag>,
}

/// The result of a check.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct ComputedCheck {
    /// The rung.
    pub rung: Rung,
    /// The reaction as text.
    pub reaction: String,
    /// Reaction enthalpy from the computed enthalpies, kJ/mol.
    pub dh_computed_kj: f64,
    /// The target's Hf298 through the reaction, kJ/mol, with the reference (and method)
    /// uncertainties propagated.
    pub hf298_kj: Quantity,
    /// Strain energy `-dH(computed)`, kJ/mol (the reference values cancel; only the method
    /// uncertainty remains).
    pub strain_kj: Quantity,
    /// Group-additivity Hf298 of the target, when known.
    pub group_additivity_hf_kj: Option<Quantity>,
    /// Derived minus group-additivity Hf298, kJ/mol.
    pub difference_kj: Option<f64>,
    /// The tolerance used, kJ/mol.
    pub tolerance_kj: f64,
    /// True when the difference exceeds the tolerance.
    pub flagged: bool,
    /// Every species with its computed enthalpy and (for references) Hf298.
    pub species: Vec<SpeciesEnergy>,
    /// Warnings: fallback reference values, the tolerance flag.
    pub flags: Vec<String>,
}

/// Why a check could not be made.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum CheckError {
    /// Problems with the energies file (all of them).
    #[error("{0}")]
    Energies(EnergiesErrors),
    /// The target cancels at this rung: the reaction says nothing about it.
    #[error("the target cancels in its {rung} reaction (an acyclic molecule at a high rung); choose a lower rung")]
    TargetCancelled {
        /// The rung.
        rung: Rung,
    },
    /// A reference species without Hf298.
    #[error(transparent)]
    Reference(#[from] ReactionError),
}

fn role(reaction: &Reaction, species: &Species, coefficient: i64) -> String {
    if species.smiles == reaction.target.smiles {
        "target".to_string()
    } else if coefficient < 0 {
        format!("co-reactant x {}", -coefficient)
    } else {
        format!("product x {coefficient}")
    }
}

/// Derives the target's Hf298 from `reaction` and the `energies`; reference Hf298 come from
/// `lookup`. `group_additivity_hf_kj` (the target's estimate) is compared with the result.
pub fn check_computed(
    reaction: &Reaction,
    energies: &EnergiesFile,
    lookup: &dyn Fn(&Species) -> Option<(Quantity, SourceTag)>,
    group_additivity_hf_kj: Option<Quantity>,
    options: &CheckOptions,
) -> Result<ComputedCheck, CheckError> {
    if reaction.target_cancelled() {
        return Err(CheckError::TargetCancelled {
            rung: reaction.rung,
        });
    }
    let mut problems = Vec::new();
    let mut matched = Vec::new();
    for (species, coefficient) in reaction.signed_terms() {
        match energies.get(&species.smiles) {
            Some(line) => matched.push((species, coefficient, line)),
            None => problems.push(EnergiesError::Missing {
                file: energies.file.clone(),
                key: species.smiles.clone(),
                role: role(reaction, species, coefficient),
            }),
        }
    }
    for line in &energies.entries {
        if !reaction.signed_terms().any(|(s, _)| s.smiles == line.key) {
            problems.push(EnergiesError::NotInReaction {
                file: energies.file.clone(),
                line: line.line,
                smiles: line.smiles.clone(),
                reaction: reaction.to_string(),
            });
        }
    }
    if !problems.is_empty() {
        return Err(CheckError::Energies(EnergiesErrors(problems)));
    }
    let to_kj = energies.unit.to_kj();
    let mut dh_computed = 0.0;
    let mut references = 0.0;
    let mut variance = options.method_uncertainty_kj.powi(2);
    let mut species = Vec::new();
    let mut flags = Vec::new();
    for (s, coefficient, line) in matched {
        let c = coefficient as f64;
        let computed_kj = line.value * to_kj;
        dh_computed += c * computed_kj;
        let (hf, source) = if s.smiles == reaction.target.smiles {
            (None, None)
        } else {
            let (hf, source) = lookup(s).ok_or_else(|| ReactionError::MissingHeat {
                smiles: s.smiles.clone(),
            })?;
            if source.is_fallback() {
                flags.push(format!(
                    "reference {} has no measured Hf298: a stand-in value is used",
                    s.smiles
                ));
            }
            references += c * hf.value;
            variance += (c * hf.uncertainty).powi(2);
            (Some(hf), Some(source))
        };
        species.push(SpeciesEnergy {
            smiles: s.smiles.clone(),
            coefficient,
            line: line.line,
            computed_kj,
            hf298_kj: hf,
            source,
        });
    }
    // The target's coefficient is -1: dH = refs - Hf(target)  =>  Hf(target) = refs - dH.
    let hf298 = Quantity::new(references - dh_computed, variance.sqrt());
    let difference = group_additivity_hf_kj.map(|g| hf298.value - g.value);
    let flagged = difference.is_some_and(|d| d.abs() > options.tolerance_kj);
    if flagged {
        flags.push(format!(
            "the derived Hf298 differs from group additivity by {:.1} kJ/mol, more than the \
             tolerance of {:.1} kJ/mol: check the computed enthalpies (and the estimate)",
            difference.unwrap_or(f64::NAN),
            options.tolerance_kj
        ));
    }
    Ok(ComputedCheck {
        rung: reaction.rung,
        reaction: reaction.to_string(),
        dh_computed_kj: dh_computed,
        hf298_kj: hf298,
        strain_kj: Quantity::new(-dh_computed, options.method_uncertainty_kj),
        group_additivity_hf_kj,
        difference_kj: difference,
        tolerance_kj: options.tolerance_kj,
        flagged,
        species,
        flags,
    })
}
