//! Conservation checks of a built reaction, one more per rung.
//!
//! Every rung: element counts and net charge (from [`Formula`]). CBH-1 and above: heavy-atom bond
//! types (the two elements and the Kekulé order). CBH-2 and above: heavy-atom environments
//! (element, charge, unpaired electrons, hydrogen count, and the element and bond order of each
//! heavy neighbour). CBH-3: bond environments (the order and the environments of both ends).
//! The construction guarantees all of these; the checks catch builder defects.

use std::collections::BTreeMap;

use petgraph::graph::NodeIndex;
use petgraph::visit::EdgeRef;

use super::error::ReactionError;
use super::reaction::Reaction;
use crate::molecule::formula::Formula;
use crate::molecule::{Element, Molecule};

/// Checks the reaction's conservation rules for its rung; the first failure is returned.
pub(crate) fn check_conservation(reaction: &Reaction) -> Result<(), ReactionError> {
    let level = reaction.rung.level();
    let mut checks: Vec<(&'static str, Labeller)> = vec![("elements and charge", element_labels)];
    if level >= 1 {
        checks.push(("heavy-atom bond types", bond_type_labels));
    }
    if level >= 2 {
        checks.push(("heavy-atom environments", atom_environment_labels));
    }
    if level >= 3 {
        checks.push(("bond environments", bond_environment_labels));
    }
    for (quantity, labeller) in checks {
        let mut net: BTreeMap<String, i64> = BTreeMap::new();
        for (species, coefficient) in reaction.signed_terms() {
            let mol = species.molecule.with_hydrogens_folded();
            for (label, count) in labeller(&mol) {
                *net.entry(label).or_insert(0) += coefficient * count;
            }
        }
        if let Some((label, n)) = net.iter().find(|(_, n)| **n != 0) {
            return Err(ReactionError::Unbalanced {
                rung: reaction.rung,
                quantity,
                detail: format!("{label} differs by {n} (products minus reactants)"),
            });
        }
    }
    Ok(())
}

type Labeller = fn(&Molecule) -> Vec<(String, i64)>;

fn element_labels(mol: &Molecule) -> Vec<(String, i64)> {
    let formula = Formula::of(mol);
    let mut elements: Vec<Element> = mol.atoms().map(|i| mol.atom(i).element).collect();
    elements.push(Element::H);
    elements.sort();
    elements.dedup();
    let mut out: Vec<(String, i64)> = elements
        .into_iter()
        .map(|e| (e.symbol().to_string(), i64::from(formula.count(e))))
        .collect();
    out.push(("charge".to_string(), i64::from(formula.charge())));
    out
}

fn heavy(mol: &Molecule, i: NodeIndex) -> bool {
    mol.atom(i).element != Element::H
}

fn bond_type_labels(mol: &Molecule) -> Vec<(String, i64)> {
    mol.graph
        .edge_references()
        .filter(|e| heavy(mol, e.source()) && heavy(mol, e.target()))
        .map(|e| {
            let mut ends = [mol.atom(e.source()).element, mol.atom(e.target()).element];
            ends.sort();
            let label = format!("{}{}{}", ends[0], e.weight().order.valence(), ends[1]);
            (label, 1)
        })
        .collect()
}

/// Environment of heavy atom `i`: its own state and its heavy neighbours with bond orders.
fn environment(mol: &Molecule, i: NodeIndex) -> String {
    let atom = mol.atom(i);
    let mut neighbours: Vec<String> = mol
        .neighbours(i)
        .filter(|(n, _)| heavy(mol, *n))
        .map(|(n, b)| format!("{}{}", b.order.valence(), mol.atom(n).element))
        .collect();
    neighbours.sort();
    format!(
        "{}(q{},r{},H{})[{}]",
        atom.element,
        atom.charge,
        atom.radical_electrons,
        mol.total_hydrogens(i),
        neighbours.join(",")
    )
}

fn atom_environment_labels(mol: &Molecule) -> Vec<(String, i64)> {
    mol.atoms()
        .filter(|&i| heavy(mol, i))
        .map(|i| (environment(mol, i), 1))
        .collect()
}

fn bond_environment_labels(mol: &Molecule) -> Vec<(String, i64)> {
    mol.graph
        .edge_references()
        .filter(|e| heavy(mol, e.source()) && heavy(mol, e.target()))
        .map(|e| {
            let mut ends = [environment(mol, e.source()), environment(mol, e.target())];
            ends.sort();
            let label = format!("{} ~{}~ {}", ends[0], e.weight().order.valence(), ends[1]);
            (label, 1)
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::molecule::parse_smiles;
    use crate::reactions::{Rung, Species};

    fn species(smiles: &str) -> Species {
        Species::new(parse_smiles(smiles).expect("test SMILES parses"))
    }

    fn reaction(rung: Rung, left: &[(&str, u32)], right: &[(&str, u32)]) -> Reaction {
        let side = |t: &[(&str, u32)]| t.iter().map(|(s, n)| (species(s), *n)).collect();
        Reaction {
            rung,
            target: species(left[0].0),
            reactants: side(left),
            products: side(right),
        }
    }

    #[test]
    fn element_imbalance_is_caught() {
        let r = reaction(Rung::Cbh0, &[("C1CC1", 1), ("[HH]", 2)], &[("C", 3)]);
        let err = check_conservation(&r).err();
        assert!(
            matches!(err, Some(ReactionError::Unbalanced { quantity, .. }) if quantity == "elements and charge")
        );
    }

    #[test]
    fn bond_types_checked_from_cbh1() {
        // Propene + ethane -> propane + ethylene keeps the bond types; cyclopropane + H2 ->
        // propane balances atoms but turns a C-C bond into two C-H bonds.
        let fine = reaction(
            Rung::Cbh1,
            &[("C=CC", 1), ("CC", 1)],
            &[("CCC", 1), ("C=C", 1)],
        );
        assert!(check_conservation(&fine).is_ok());
        let opened = reaction(Rung::Cbh1, &[("C1CC1", 1), ("[HH]", 1)], &[("CCC", 1)]);
        assert!(check_conservation(&opened).is_err());
        // The same reaction passes at CBH-0, where only elements count.
        let coarse = Reaction {
            rung: Rung::Cbh0,
            ..opened
        };
        assert!(check_conservation(&coarse).is_ok());
    }

    #[test]
    fn atom_environments_checked_from_cbh2() {
        // Isobutane + ethane -> 2 propane keeps the C-C bond count (4) but not the carbon
        // environments (CH and 5 CH3 against 2 CH2 and 4 CH3).
        let r = reaction(Rung::Cbh2, &[("CC(C)C", 1), ("CC", 1)], &[("CCC", 2)]);
        assert!(check_conservation(&Reaction {
            rung: Rung::Cbh1,
            ..r.clone()
        })
        .is_ok());
        assert!(check_conservation(&r).is_err());
    }
}
