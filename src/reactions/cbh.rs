//! The connectivity-based hierarchy (CBH-0 to CBH-3): which fragments go on which side.
//!
//! After R. O. Ramabhadran and K. Raghavachari, J. Chem. Theory Comput. 7 (2011) 2094. With
//! `H(a)` the parent hydride of heavy atom `a`, `B(e)` the two-atom fragment of heavy-atom bond
//! `e`, `A(a)` atom `a` with its heavy neighbours and `T(e)` bond `e` with the heavy neighbours
//! of both ends (all grown as trees and capped with hydrogens, see [`super::fragment`]), and
//! `deg(a)` the number of heavy neighbours:
//!
//! | rung  | products    | reactants besides the target       |
//! | ----- | ----------- | ---------------------------------- |
//! | CBH-0 | sum_a H(a)  | H2 x (sum of heavy-atom bond orders) |
//! | CBH-1 | sum_e B(e)  | sum_a (deg(a) - 1) H(a)            |
//! | CBH-2 | sum_a A(a)  | sum_e B(e)                         |
//! | CBH-3 | sum_e T(e)  | sum_a (deg(a) - 1) A(a)            |
//!
//! Each reactant term removes what the products count twice: at CBH-2 the bond `e = a-b` sits
//! in both `A(a)` and `A(b)`; at CBH-3 the atom-centred piece `A(a)` sits in the `deg(a)` bond
//! pieces around `a`. Coefficients are summed per canonical SMILES, so a species on both sides
//! cancels; terminal atoms give `A(a) = B(e)` and drop out at CBH-2, as in the paper. A negative
//! coefficient (an isolated atom at CBH-1, `deg = 0`) moves the species to the other side.
//!
//! "Atom" here means a super-atom: a functional unit such as a nitro or sulfonyl group counts as
//! one atom at its centre and its bonds inside the unit are not CBH bonds (see
//! [`super::fragment`]). Nitromethane thus has a single CBH bond, C-N, and its CBH-1 and higher
//! reactions are empty, as those of ethane are.

use std::collections::BTreeMap;
use std::fmt;

use super::balance::check_conservation;
use super::error::ReactionError;
use super::fragment::{dihydrogen, Skeleton, Species};
use super::reaction::Reaction;
use super::validity::{abnormal_species, molecule_problem};
use crate::molecule::canon::canonical_smiles;
use crate::molecule::Molecule;

/// A rung of the connectivity-based hierarchy.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, serde::Serialize)]
pub enum Rung {
    /// Parent hydrides of the heavy atoms.
    Cbh0,
    /// Heavy-atom bonds.
    Cbh1,
    /// Heavy atoms with their heavy neighbours.
    Cbh2,
    /// Heavy-atom bonds with the neighbours of both ends.
    Cbh3,
}

impl Rung {
    /// All rungs, coarse to fine.
    pub const ALL: [Rung; 4] = [Rung::Cbh0, Rung::Cbh1, Rung::Cbh2, Rung::Cbh3];

    /// The rung number n of CBH-n.
    pub fn level(self) -> u8 {
        match self {
            Rung::Cbh0 => 0,
            Rung::Cbh1 => 1,
            Rung::Cbh2 => 2,
            Rung::Cbh3 => 3,
        }
    }

    /// The rung for CBH-n, if n is 0 to 3.
    pub fn from_level(n: u8) -> Option<Rung> {
        Rung::ALL.get(usize::from(n)).copied()
    }

    /// The classical reaction class the rung coincides with.
    ///
    /// Recalled from memory (Ramabhadran and Raghavachari 2011, with the classes of S. E.
    /// Wheeler, K. N. Houk, P. v. R. Schleyer, W. D. Allen, J. Am. Chem. Soc. 131 (2009) 2547,
    /// RC1 isodesmic, RC2 hypohomodesmotic, RC3 homodesmotic, RC4 hyperhomodesmotic):
    /// CBH-0 is isogyric (electron pairs conserved, atoms as parent hydrides); CBH-1 is the
    /// isodesmic bond-separation reaction (bond types conserved); CBH-2 conserves every heavy
    /// atom with its hydrogen count and the elements and bond orders of its neighbours, which
    /// for hydrocarbons meets the hypohomodesmotic (RC2) conditions, and for saturated rings
    /// gives the classical homodesmotic reaction (cyclopropane + 3 ethane -> 3 propane); CBH-3
    /// conserves each bond with the environments of both ends, the hyperhomodesmotic (RC4)
    /// conditions for hydrocarbons.
    pub fn reaction_class(self) -> &'static str {
        match self {
            Rung::Cbh0 => "isogyric (parent hydrides)",
            Rung::Cbh1 => "isodesmic (bond separation)",
            Rung::Cbh2 => "hypohomodesmotic for hydrocarbons (homodesmotic for saturated rings)",
            Rung::Cbh3 => "hyperhomodesmotic for hydrocarbons",
        }
    }
}

impl fmt::Display for Rung {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "CBH-{}", self.level())
    }
}

/// Signed coefficients per canonical key: products positive, reactants negative.
#[derive(Default)]
struct Tally {
    terms: BTreeMap<String, (Species, i64)>,
}

impl Tally {
    fn add(&mut self, species: Species, coefficient: i64) {
        if coefficient == 0 {
            return;
        }
        let key = species.smiles.clone();
        self.add_keyed(key, species, coefficient);
    }

    fn add_keyed(&mut self, key: String, species: Species, coefficient: i64) {
        self.terms.entry(key).or_insert((species, 0)).1 += coefficient;
    }
}

/// Builds the CBH reaction of `mol` at `rung`, checked for conservation before it is returned.
///
/// The target keeps its own molecule and key (stereo included); for cancelling against
/// fragments, which carry no stereo, it is compared by its stereo-free key. Fails for molecules
/// without heavy atoms, with several components or labelled hydrogen nodes, and (a builder
/// defect, never expected) when a check fails: conservation, or, for a target that is an
/// ordinary neutral molecule, the [`validity`](super::validity) of every species.
///
/// ```
/// use ringheat::molecule::parse_smiles;
/// use ringheat::reactions::{build_reaction, Rung};
/// let mol = parse_smiles("C1CC1").unwrap();
/// let r = build_reaction(&mol, Rung::Cbh2).unwrap();
/// assert_eq!(r.to_string(), "C1CC1 + 3 CC -> 3 CCC");
/// ```
pub fn build_reaction(mol: &Molecule, rung: Rung) -> Result<Reaction, ReactionError> {
    let skeleton = Skeleton::new(mol)?;
    let target = Species::new(mol.clone());
    let target_key = canonical_smiles(&skeleton.mol);
    let mut tally = Tally::default();
    tally.add_keyed(target_key.clone(), target.clone(), -1);
    let degree = |a| i64::try_from(skeleton.degree(a)).unwrap_or(i64::MAX);
    match rung {
        Rung::Cbh0 => {
            for a in skeleton.atoms() {
                tally.add(skeleton.hydride(a)?, 1);
            }
            tally.add(dihydrogen(), -i64::from(skeleton.bond_order_sum()));
        }
        Rung::Cbh1 => {
            for (a, b, order) in skeleton.bonds() {
                tally.add(skeleton.bond_fragment(a, b, order)?, 1);
            }
            for a in skeleton.atoms() {
                tally.add(skeleton.hydride(a)?, 1 - degree(a));
            }
        }
        Rung::Cbh2 => {
            for a in skeleton.atoms() {
                tally.add(skeleton.atom_centred(a)?, 1);
            }
            for (a, b, order) in skeleton.bonds() {
                tally.add(skeleton.bond_fragment(a, b, order)?, -1);
            }
        }
        Rung::Cbh3 => {
            for (a, b, order) in skeleton.bonds() {
                tally.add(skeleton.bond_centred(a, b, order)?, 1);
            }
            for a in skeleton.atoms() {
                tally.add(skeleton.atom_centred(a)?, 1 - degree(a));
            }
        }
    }
    let target_net = tally.terms.get(&target_key).map_or(0, |t| t.1);
    if target_net != -1 && target_net != 0 {
        return Err(ReactionError::TargetCoefficient {
            rung,
            coefficient: target_net,
        });
    }
    let mut reactants = Vec::new();
    let mut products = Vec::new();
    if target_net == -1 {
        tally.terms.remove(&target_key);
        reactants.push((target.clone(), 1));
    }
    for (_, (species, net)) in tally.terms {
        let count = u32::try_from(net.unsigned_abs()).unwrap_or(u32::MAX);
        match net.signum() {
            1 => products.push((species, count)),
            -1 => reactants.push((species, count)),
            _ => {}
        }
    }
    let reaction = Reaction {
        rung,
        target,
        reactants,
        products,
    };
    check_conservation(&reaction)?;
    if molecule_problem(&skeleton.mol).is_none() {
        if let Some((species, problem)) = abnormal_species(&reaction).into_iter().next() {
            return Err(ReactionError::AbnormalSpecies {
                rung,
                smiles: species.smiles.clone(),
                problem,
            });
        }
    }
    Ok(reaction)
}

/// Builds CBH-0 to CBH-3 of `mol`; each rung succeeds or fails on its own.
pub fn build_hierarchy(mol: &Molecule) -> Vec<Result<Reaction, ReactionError>> {
    Rung::ALL
        .iter()
        .map(|&rung| build_reaction(mol, rung))
        .collect()
}
