//! Errors of the reaction layer: building a CBH reaction and pricing it (reference-species files
//! report through the data layer's error, [`crate::data::DataError`]).

use super::cbh::Rung;

/// Why a reaction could not be built or priced.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum ReactionError {
    /// The molecule has no heavy atom (for example `[H][H]`): there is nothing to fragment.
    #[error("the molecule has no heavy atom; a CBH reaction needs at least one")]
    NoHeavyAtom,
    /// The input holds more than one component (`.`); each component needs its own reaction.
    #[error("the molecule has {components} separate components; build one reaction per component")]
    Disconnected {
        /// Number of connected components.
        components: usize,
    },
    /// A hydrogen stays a node of its own after folding (isotope, charge, atom class or a bond
    /// to another hydrogen), so it cannot become a hydrogen cap.
    #[error("hydrogen atom {atom} (0-based node) is labelled or bonded to hydrogen; CBH fragments need plain hydrogens")]
    LabelledHydrogen {
        /// Node index of the hydrogen in the folded molecule.
        atom: usize,
    },
    /// Capping a fragment atom needs more hydrogens than an atom can hold.
    #[error(
        "atom {atom} (0-based node) would need {needed} hydrogen caps, more than an atom holds"
    )]
    TooManyCaps {
        /// Node index of the atom.
        atom: usize,
        /// Hydrogens the cap would need.
        needed: u32,
    },
    /// A built reaction failed one of the rung's conservation checks (a defect of the builder,
    /// reported rather than returned as a wrong reaction).
    #[error("{rung} reaction fails its check on {quantity}: {detail}")]
    Unbalanced {
        /// The rung.
        rung: Rung,
        /// What is conserved (`elements`, `charge`, `heavy-atom bond types`, ...).
        quantity: &'static str,
        /// The first difference found.
        detail: String,
    },
    /// A species of the reaction is not an ordinary neutral molecule although the target is
    /// (see [`super::validity`]); a defect of the builder, reported rather than returned.
    #[error("{rung} reaction holds {smiles}, which is not an ordinary molecule: {problem}")]
    AbnormalSpecies {
        /// The rung.
        rung: Rung,
        /// Canonical SMILES of the species.
        smiles: String,
        /// What is wrong with it.
        problem: String,
    },
    /// The target ended up with a coefficient other than 1 on the reactant side or 0 (cancelled).
    #[error("{rung} reaction gives the target a net coefficient of {coefficient}")]
    TargetCoefficient {
        /// The rung.
        rung: Rung,
        /// Net coefficient (products minus reactants).
        coefficient: i64,
    },
    /// No heat of formation is known for a species of the reaction.
    #[error("no heat of formation for {smiles}: not in the reference table and no fallback value")]
    MissingHeat {
        /// Canonical SMILES of the species.
        smiles: String,
    },
}
