//! One molecule's strain by every scheme, with the spread between them.

use super::flags::StrainFlag;
use super::increments::IncrementSet;
use super::systems::{ring_correction_sum, ring_system_strain, RingSystemStrain};
use super::target::{resolve_target_hf, TargetHf};
use crate::molecule::canon::canonical_smiles;
use crate::molecule::formula::Formula;
use crate::molecule::{Molecule, PerceivedMolecule};
use crate::reactions::{
    build_reaction, group_additivity_fallback, lookup_with_fallback, ReactionHeat, ReferenceTable,
    Rung, SourceTag,
};
use crate::thermo::estimate::SetupError;
use crate::thermo::{EstimateOptions, GroupAdditivity, Property, Quantity, ThermoEstimate};

/// How reference species missing from the table are priced, as reports name it.
pub const FALLBACK_METHOD: &str = "Benson group additivity";

/// Everything the strain schemes read: group tables, reference species, increment sets.
#[derive(Debug, Clone)]
pub struct StrainData {
    /// Group additivity (Benson's strain-free sum, ring corrections, fallback values).
    pub engine: GroupAdditivity,
    /// Measured Hf298 of reference species and ring compounds.
    pub references: ReferenceTable,
    /// Strain-free increment sets besides Benson's.
    pub increment_sets: Vec<IncrementSet>,
}

/// Why the bundled data could not be loaded.
#[derive(Debug, thiserror::Error)]
pub enum DataError {
    /// Group tables.
    #[error(transparent)]
    Groups(#[from] SetupError),
    /// Reference table or increment sets.
    #[error(transparent)]
    Files(#[from] crate::data::DataError),
}

impl StrainData {
    /// The bundled tables.
    pub fn bundled() -> Result<StrainData, DataError> {
        Ok(StrainData {
            engine: GroupAdditivity::bundled()?,
            references: ReferenceTable::bundled()?,
            increment_sets: IncrementSet::bundled()?,
        })
    }
}

/// The strain energy by one scheme, or why the scheme gives none.
#[derive(Debug, Clone, serde::Serialize)]
pub struct SchemeStrain {
    /// Name of the scheme.
    pub scheme: String,
    /// Strain energy, kJ/mol, when the scheme applies.
    pub strain_kj: Option<Quantity>,
    /// The strain-free reference: the increment sum, or for a reaction the Hf298 the products
    /// minus the co-reactants give the target, kJ/mol.
    pub strain_free_hf_kj: Option<Quantity>,
    /// The reaction, for the reaction schemes.
    pub reaction: Option<String>,
    /// Reference species priced by the fallback instead of a measured value.
    pub fallback_species: Vec<String>,
    /// Why the scheme gives no value (`not applicable: ...`), if it gives none.
    pub unavailable: Option<String>,
    /// Where the scheme's numbers come from.
    pub source: String,
}

/// A molecule's strain by every scheme.
#[derive(Debug, Clone, serde::Serialize)]
pub struct StrainAnalysis {
    /// Canonical SMILES.
    pub canonical_smiles: String,
    /// Hill formula.
    pub formula: String,
    /// The target's Hf298 used by every scheme.
    pub target_hf: TargetHf,
    /// The group-additivity Hf298 (with ring corrections), when it could be estimated.
    pub group_additivity_hf_kj: Option<Quantity>,
    /// Group, increment-set and reaction schemes, in that order.
    pub schemes: Vec<SchemeStrain>,
    /// Largest minus smallest strain over the schemes that gave one, kJ/mol.
    pub spread_kj: Option<f64>,
    /// One entry per ring system that takes a ring correction.
    pub ring_systems: Vec<RingSystemStrain>,
    /// Group strain not assigned to any ring system (measured minus estimated Hf298), kJ/mol.
    pub unassigned_kj: Option<Quantity>,
    /// Warnings: circular target value, fallbacks, stand-ins of the estimate.
    pub flags: Vec<StrainFlag>,
}

impl StrainAnalysis {
    /// The first scheme whose name contains `word`.
    pub fn scheme(&self, word: &str) -> Option<&SchemeStrain> {
        self.schemes.iter().find(|s| s.scheme.contains(word))
    }
}

/// Why a molecule's strain could not be computed at all.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum StrainError {
    /// No user value, no measured value and no group-additivity estimate.
    #[error("no Hf298 for the molecule: no value given, none measured in the reference table, and group additivity fails ({0})")]
    NoTargetHf(String),
}

fn in_quadrature(a: Quantity, b: Quantity) -> f64 {
    a.uncertainty.hypot(b.uncertainty)
}

/// Strain of `mol` by every scheme. `user_hf_kj` is the user's Hf298 of the molecule (kJ/mol),
/// which overrides the reference table.
pub fn analyse_strain(
    mol: &Molecule,
    data: &StrainData,
    user_hf_kj: Option<Quantity>,
) -> Result<StrainAnalysis, StrainError> {
    let perceived = PerceivedMolecule::new(mol);
    let key = canonical_smiles(mol);
    let estimate = data
        .engine
        .estimate(&perceived, &EstimateOptions::default());
    let estimate_ok = estimate.as_ref().ok();
    let target =
        resolve_target_hf(&key, user_hf_kj, &data.references, estimate_ok).ok_or_else(|| {
            StrainError::NoTargetHf(match &estimate {
                Err(e) => e.to_string(),
                Ok(_) => "no finite Hf298".to_string(),
            })
        })?;
    let t = target.hf298_kj;
    let mut flags = Vec::new();
    if target.is_circular() {
        flags.push(StrainFlag::CircularTarget);
    }
    let mut schemes = Vec::new();
    schemes.push(benson_scheme(&estimate, &target));
    for set in &data.increment_sets {
        let s = match set.strain_free_hf(mol) {
            Ok(sum) => SchemeStrain {
                scheme: format!("{} increments", set.name),
                strain_kj: Some(Quantity::new(t.value - sum.value, in_quadrature(t, sum))),
                strain_free_hf_kj: Some(sum),
                reaction: None,
                fallback_species: Vec::new(),
                unavailable: None,
                source: set.source.clone(),
            },
            Err(why) => unavailable(format!("{} increments", set.name), why),
        };
        schemes.push(s);
    }
    let fallback = group_additivity_fallback(&data.engine);
    let lookup = lookup_with_fallback(&data.references, &fallback, FALLBACK_METHOD);
    for rung in [Rung::Cbh2, Rung::Cbh3] {
        let name = format!("{rung} reaction");
        let reaction = match build_reaction(mol, rung) {
            Ok(r) => r,
            Err(e) => {
                schemes.push(unavailable(name, format!("no reaction: {e}")));
                continue;
            }
        };
        let tag = SourceTag::Target {
            note: target.describe(),
        };
        match ReactionHeat::of(&reaction, (t, tag), &lookup) {
            Ok(heat) => {
                let fallbacks: Vec<String> = heat
                    .fallback_species()
                    .into_iter()
                    .map(str::to_string)
                    .collect();
                if !fallbacks.is_empty() {
                    flags.push(StrainFlag::ReferencesByFallback {
                        rung,
                        species: fallbacks.clone(),
                        method: FALLBACK_METHOD,
                    });
                }
                let se = Quantity::new(-heat.dh298_kj.value, heat.dh298_kj.uncertainty);
                // Hf the reaction gives a strain-free target: Hf(target) + dH.
                let free = Quantity::new(
                    t.value + heat.dh298_kj.value,
                    (heat.dh298_kj.uncertainty.powi(2) - t.uncertainty.powi(2))
                        .max(0.0)
                        .sqrt(),
                );
                schemes.push(SchemeStrain {
                    scheme: name,
                    strain_kj: Some(se),
                    strain_free_hf_kj: (!reaction.target_cancelled()).then_some(free),
                    reaction: Some(reaction.to_string()),
                    fallback_species: fallbacks,
                    unavailable: None,
                    source: format!(
                        "{}; R. O. Ramabhadran, K. Raghavachari, J. Chem. Theory Comput. 7 \
                         (2011) 2094; reference Hf298 from the reference table",
                        rung.reaction_class()
                    ),
                });
            }
            Err(e) => schemes.push(unavailable(name, format!("cannot price: {e}"))),
        }
    }
    let values: Vec<f64> = schemes
        .iter()
        .filter_map(|s| s.strain_kj.map(|q| q.value))
        .collect();
    let spread_kj = (values.len() > 1).then(|| {
        let max = values.iter().cloned().fold(f64::NEG_INFINITY, f64::max);
        let min = values.iter().cloned().fold(f64::INFINITY, f64::min);
        max - min
    });
    let (ring_systems, unassigned_kj, ga_hf) = match &estimate {
        Ok(e) => {
            // Entropy and heat-capacity remarks of the estimate do not bear on a strain energy.
            flags.extend(
                e.flags
                    .iter()
                    .filter(|f| {
                        !matches!(f.missing_property(), Some(Property::S298 | Property::Cp))
                    })
                    .map(|f| StrainFlag::GroupAdditivity(f.clone())),
            );
            let systems = ring_system_strain(&perceived, &data.engine, e);
            let residual = e
                .hf298_kj
                .filter(|_| !target.is_circular())
                .map(|hf| Quantity::new(t.value - hf.value, in_quadrature(t, hf)));
            (systems, residual, e.hf298_kj)
        }
        Err(_) => (Vec::new(), None, None),
    };
    Ok(StrainAnalysis {
        canonical_smiles: key,
        formula: Formula::of(mol).hill(),
        target_hf: target,
        group_additivity_hf_kj: ga_hf,
        schemes,
        spread_kj,
        ring_systems,
        unassigned_kj,
        flags,
    })
}

fn unavailable(scheme: String, why: String) -> SchemeStrain {
    SchemeStrain {
        scheme,
        strain_kj: None,
        strain_free_hf_kj: None,
        reaction: None,
        fallback_species: Vec::new(),
        unavailable: Some(why),
        source: String::new(),
    }
}

/// Benson's scheme: Hf298(target) minus the group sum without ring corrections. With the
/// estimate as the target's value this is exactly the ring corrections, so their own
/// uncertainty is used (not the group sum's twice).
fn benson_scheme(
    estimate: &Result<ThermoEstimate, crate::thermo::EstimateError>,
    target: &TargetHf,
) -> SchemeStrain {
    let name = "Benson group increments".to_string();
    let e = match estimate {
        Ok(e) => e,
        Err(err) => return unavailable(name, format!("group additivity fails: {err}")),
    };
    let Some(free) = e.strain_free_hf298_kj else {
        return unavailable(
            name,
            "the strain-free group sum is not available".to_string(),
        );
    };
    let t = target.hf298_kj;
    let strain = if target.is_circular() {
        ring_correction_sum(e)
    } else {
        Quantity::new(t.value - free.value, in_quadrature(t, free))
    };
    SchemeStrain {
        scheme: name,
        strain_kj: Some(strain),
        strain_free_hf_kj: Some(free),
        reaction: None,
        fallback_species: Vec::new(),
        unavailable: None,
        source: "S. W. Benson, Thermochemical Kinetics, 2nd ed., Wiley 1976: group values of \
                 the bundled tables without ring corrections"
            .to_string(),
    }
}
