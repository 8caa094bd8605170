//! Typed flags of a strain analysis (printed through `Display`, matched by variant).

use std::fmt;

use crate::reactions::Rung;
use crate::thermo::Flag;

/// One visible warning of a strain analysis.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum StrainFlag {
    /// The target's Hf298 is the group-additivity estimate itself.
    CircularTarget,
    /// Reference species of a reaction priced by the fallback method.
    ReferencesByFallback {
        /// The rung of the reaction.
        rung: Rung,
        /// Canonical SMILES of the species priced by the fallback.
        species: Vec<String>,
        /// The fallback method, as reports name it.
        method: &'static str,
    },
    /// A flag of the group-additivity estimate of the molecule.
    GroupAdditivity(Flag),
}

impl fmt::Display for StrainFlag {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            StrainFlag::CircularTarget => f.write_str(
                "the target's Hf298 is the group-additivity estimate (no measured value known): \
                 the Benson group strain is then just the tables' ring correction, and the other \
                 schemes inherit the estimate's error",
            ),
            StrainFlag::ReferencesByFallback {
                rung,
                species,
                method,
            } => write!(
                f,
                "{rung}: {} priced by {method} (not in the reference table)",
                species.join(", ")
            ),
            StrainFlag::GroupAdditivity(flag) => write!(f, "group additivity: {flag}"),
        }
    }
}
