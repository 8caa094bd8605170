//! A balanced reaction of the hierarchy: the target, its co-reactants and the products.

use std::fmt;

use super::cbh::Rung;
use super::fragment::Species;

/// A CBH reaction with positive integer coefficients, species merged by canonical SMILES.
///
/// Normally the target is the first reactant, with coefficient 1. When the rung's fragments
/// rebuild the target (acyclic molecules at the higher rungs), the target cancels: it is then
/// absent from `reactants` ([`Reaction::target_cancelled`]), and the reaction is usually empty
/// (heat zero). The target is also kept in `target` either way.
#[derive(Debug, Clone, serde::Serialize)]
pub struct Reaction {
    /// The rung that built it.
    pub rung: Rung,
    /// The molecule the reaction was built for.
    pub target: Species,
    /// Left side: the target first (unless cancelled), then the co-reactants by canonical key.
    pub reactants: Vec<(Species, u32)>,
    /// Right side, by canonical key.
    pub products: Vec<(Species, u32)>,
}

impl Reaction {
    /// True when the target cancelled against a product fragment.
    pub fn target_cancelled(&self) -> bool {
        self.reactants
            .first()
            .is_none_or(|(s, _)| s.smiles != self.target.smiles)
    }

    /// True when nothing is left on either side.
    pub fn is_empty(&self) -> bool {
        self.reactants.is_empty() && self.products.is_empty()
    }

    /// Every species with a signed coefficient: reactants negative, products positive.
    pub fn signed_terms(&self) -> impl Iterator<Item = (&Species, i64)> + '_ {
        let left = self.reactants.iter().map(|(s, n)| (s, -i64::from(*n)));
        let right = self.products.iter().map(|(s, n)| (s, i64::from(*n)));
        left.chain(right)
    }

    /// The reaction as reaction SMILES (`reactants>>products`), each species repeated as many
    /// times as its coefficient, since reaction SMILES has no coefficients.
    pub fn reaction_smiles(&self) -> String {
        let side = |terms: &[(Species, u32)]| {
            terms
                .iter()
                .flat_map(|(s, n)| std::iter::repeat_n(s.smiles.as_str(), *n as usize))
                .collect::<Vec<_>>()
                .join(".")
        };
        format!("{}>>{}", side(&self.reactants), side(&self.products))
    }
}

/// `C1CC1 + 3 CC -> 3 CCC`; an empty side prints as `0`.
impl fmt::Display for Reaction {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let side = |terms: &[(Species, u32)]| {
            if terms.is_empty() {
                return "0".to_string();
            }
            terms
                .iter()
                .map(|(s, n)| match n {
                    1 => s.smiles.clone(),
                    n => format!("{n} {}", s.smiles),
                })
                .collect::<Vec<_>>()
                .join(" + ")
        };
        write!(f, "{} -> {}", side(&self.reactants), side(&self.products))
    }
}
