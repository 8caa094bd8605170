//! Reaction heats and strain energies from species heats of formation, with uncertainties.
//!
//! The heat of a reaction at 298.15 K is `dH = sum(products) - sum(reactants)` of the species'
//! Hf298. Species uncertainties are taken as independent and added in quadrature, each scaled by
//! its coefficient (species are merged, so a repeated species counts once with its full
//! coefficient, as it should for a fully correlated value). Strain energy of the target is
//! `SE = -dH`: opening the rings into strain-free pieces releases the strain.

use super::cbh::Rung;
use super::error::ReactionError;
use super::fragment::Species;
use super::reaction::Reaction;
use crate::thermo::Quantity;

/// Where a species' heat of formation came from.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub enum SourceTag {
    /// The caller's value for the target (user, measured or estimated: the caller says).
    Target {
        /// The caller's description.
        note: String,
    },
    /// A measured value from the reference-species table.
    Reference {
        /// The entry's source text.
        source: String,
    },
    /// A stand-in value, for example a group-additivity estimate; flagged in reports.
    Fallback {
        /// How the value was obtained.
        method: String,
    },
}

impl SourceTag {
    /// True for stand-in values that should be flagged.
    pub fn is_fallback(&self) -> bool {
        matches!(self, SourceTag::Fallback { .. })
    }
}

/// One species' share of a reaction heat.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct SpeciesHeat {
    /// Canonical SMILES.
    pub smiles: String,
    /// Signed coefficient: products positive, reactants negative.
    pub coefficient: i64,
    /// Hf298 of the species, kJ/mol.
    pub hf298_kj: Quantity,
    /// Where the value came from.
    pub source: SourceTag,
}

/// The heat of one reaction with the values it was summed from.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct ReactionHeat {
    /// The rung of the reaction.
    pub rung: Rung,
    /// Heat of reaction at 298.15 K, kJ/mol.
    pub dh298_kj: Quantity,
    /// Every species, reactants first.
    pub terms: Vec<SpeciesHeat>,
}

impl ReactionHeat {
    /// Sums the heat of `reaction`. The target's value is `target`; every other species is asked
    /// of `lookup`, which answers with a value and its source, or `None` (an error naming it).
    pub fn of(
        reaction: &Reaction,
        target: (Quantity, SourceTag),
        lookup: &dyn Fn(&Species) -> Option<(Quantity, SourceTag)>,
    ) -> Result<ReactionHeat, ReactionError> {
        let mut terms = Vec::new();
        let mut value = 0.0;
        let mut variance = 0.0;
        for (species, coefficient) in reaction.signed_terms() {
            let (hf, source) = if species.smiles == reaction.target.smiles {
                target.clone()
            } else {
                lookup(species).ok_or_else(|| ReactionError::MissingHeat {
                    smiles: species.smiles.clone(),
                })?
            };
            let c = coefficient as f64;
            value += c * hf.value;
            variance += (c * hf.uncertainty).powi(2);
            terms.push(SpeciesHeat {
                smiles: species.smiles.clone(),
                coefficient,
                hf298_kj: hf,
                source,
            });
        }
        Ok(ReactionHeat {
            rung: reaction.rung,
            dh298_kj: Quantity::new(value, variance.sqrt()),
            terms,
        })
    }

    /// True when any species value is a stand-in ([`SourceTag::Fallback`]).
    pub fn uses_fallback(&self) -> bool {
        self.terms.iter().any(|t| t.source.is_fallback())
    }

    /// Canonical SMILES of the species whose values are stand-ins.
    pub fn fallback_species(&self) -> Vec<&str> {
        self.terms
            .iter()
            .filter(|t| t.source.is_fallback())
            .map(|t| t.smiles.as_str())
            .collect()
    }
}

/// A strain energy from one rung of the hierarchy.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct StrainEstimate {
    /// The rung.
    pub rung: Rung,
    /// Strain energy, kJ/mol (minus the reaction heat).
    pub strain_kj: Quantity,
    /// The reaction heat it came from.
    pub heat: ReactionHeat,
}

/// Strain energy of the target of `reaction`: `-(dH)` with the target's Hf298 `target_hf_kj`
/// (kJ/mol; the caller's user value, measurement or estimate) and the other species from
/// `lookup`. A reaction whose target cancelled gives the heat of what is left (normally zero).
pub fn strain_from_reaction(
    reaction: &Reaction,
    target_hf_kj: Quantity,
    lookup: &dyn Fn(&Species) -> Option<(Quantity, SourceTag)>,
) -> Result<StrainEstimate, ReactionError> {
    let target = (
        target_hf_kj,
        SourceTag::Target {
            note: "supplied by the caller".to_string(),
        },
    );
    let heat = ReactionHeat::of(reaction, target, lookup)?;
    Ok(StrainEstimate {
        rung: reaction.rung,
        strain_kj: Quantity::new(-heat.dh298_kj.value, heat.dh298_kj.uncertainty),
        heat,
    })
}
