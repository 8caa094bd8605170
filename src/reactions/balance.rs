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
