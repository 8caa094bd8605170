//! Whether a species is an ordinary neutral closed-shell molecule, so that a reaction never
//! asks for the heat of formation of a non-molecule such as `[SH6]` or `[NH4+]`.
//!
//! A species is normal when
//! - its net charge is zero and no atom has unpaired electrons;
//! - every charged atom belongs to a charge-separated unit of total charge zero (a connected
//!   set of bonded charged atoms, as the `[N+]` and `[O-]` of a nitro group);
//! - every heavy atom's valence (bond orders plus hydrogens) is one that
//!   [`allowed_valences`] gives for its element and charge;
//! - an atom above its lowest allowed valence (sulfur in a sulfone, phosphorus in a phosphine
//!   oxide) spends at most that lowest valence on hydrogens and single bonds, the rest on
//!   multiple bonds: `CS(C)(=O)=O` and `O=[SH2]=O` pass, `[SH4]` and `C[SH5]` do not.
//!
//! The last rule is our own (common practice for closed-shell main-group compounds; it also
//! turns away SF6-type halides, which a CBH fragment of an ordinary organic molecule never is).
//! Atoms whose element [`allowed_valences`] does not cover are not checked.

use super::fragment::Species;
use super::reaction::Reaction;
use crate::molecule::smiles::allowed_valences;
use crate::molecule::{BondOrder, Element, Molecule};

/// The first reason `mol` is not a normal neutral closed-shell molecule, or `None`.
pub fn molecule_problem(mol: &Molecule) -> Option<String> {
    let mol = mol.with_hydrogens_folded();
    let net: i32 = mol.atoms().map(|i| i32::from(mol.atom(i).charge)).sum();
    if net != 0 {
        return Some(format!("net charge {net:+}"));
    }
    for i in mol.atoms() {
        let atom = mol.atom(i);
        let symbol = atom.element.symbol();
        if atom.radical_electrons != 0 {
            return Some(format!(
                "{symbol} (atom {}) has {} unpaired electrons",
                i.index(),
                atom.radical_electrons
            ));
        }
        if atom.charge != 0 {
            let unit = charged_unit_charge(&mol, i);
            if unit != 0 {
                return Some(format!(
                    "charged {symbol} (atom {}) is not in a charge-separated unit of charge zero",
                    i.index()
                ));
            }
        }
        if atom.element == Element::H {
            continue;
        }
        let Some(valences) = allowed_valences(atom.element, atom.charge) else {
            continue;
        };
        let hydrogens = mol.total_hydrogens(i);
        let valence = hydrogens + mol.bond_valence(i);
        if !valences.iter().any(|&v| u32::from(v) == valence) {
            return Some(format!(
                "{symbol} (atom {}) has valence {valence}, allowed {valences:?}",
                i.index()
            ));
        }
        let lowest = valences.first().map_or(0, |&v| u32::from(v));
        let singles = mol
            .graph
            .edges(i)
            .filter(|e| e.weight().order == BondOrder::Single)
            .count();
        let plain = hydrogens + u32::try_from(singles).unwrap_or(u32::MAX);
        if valence > lowest && plain > lowest {
            return Some(format!(
                "{symbol} (atom {}) is hypervalent ({valence}) with {plain} hydrogens and single bonds",
                i.index()
            ));
        }
    }
    None
}

/// Total charge of the connected set of charged atoms that holds charged atom `start`.
fn charged_unit_charge(mol: &Molecule, start: petgraph::graph::NodeIndex) -> i32 {
    let mut seen = vec![start];
    let mut stack = vec![start];
    let mut total = 0i32;
    while let Some(a) = stack.pop() {
        total += i32::from(mol.atom(a).charge);
        for (n, _) in mol.neighbours(a) {
            if mol.atom(n).charge != 0 && !seen.contains(&n) {
                seen.push(n);
                stack.push(n);
            }
        }
    }
    total
}

/// Species of `reaction` (target included) that are not normal molecules, each with the
/// reason ([`molecule_problem`]).
pub fn abnormal_species(reaction: &Reaction) -> Vec<(&Species, String)> {
    reaction
        .signed_terms()
        .filter_map(|(s, _)| molecule_problem(&s.molecule).map(|p| (s, p)))
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::molecule::parse_smiles;

    fn problem(smiles: &str) -> Option<String> {
        molecule_problem(&parse_smiles(smiles).expect("test SMILES parses"))
    }

    #[test]
    fn ordinary_molecules_pass() {
        for s in [
            "C",
            "[HH]",
            "C=O",
            "CC#N",
            "C[N+](=O)[O-]",
            "CN(=O)=O",
            "CS(C)=O",
            "C[S+](C)[O-]",
            "CS(C)(=O)=O",
            "O=[SH2]=O",
            "O=[NH]=O",
            "COP(=O)(OC)OC",
            "c1ccccc1",
            "[O-][n+]1ccccc1",
            "CN=[N+]=[N-]",
        ] {
            assert_eq!(problem(s), None, "{s}");
        }
    }

    #[test]
    fn non_molecules_fail() {
        // The pieces a nitro group and sulfolane gave before units were kept whole.
        for s in [
            "[NH4+]",
            "[OH-]",
            "[NH2+]=O",
            "[SH6]",
            "C[SH5]",
            "O=[SH4]",
            "[SH4]",
            "[CH3]",
            "C[N+](C)(C)CC(=O)[O-]",
        ] {
            assert!(problem(s).is_some(), "{s}");
        }
    }
}
