//! Species and CBH fragments: trees grown from a centre atom or bond, capped with hydrogens.
//!
//! A fragment is a tree of copies of the target's heavy atoms. Each copy keeps the element,
//! charge, isotope and unpaired electrons of its original and the bond orders of the tree edges;
//! every other bond of the original (to an atom outside the fragment, or a ring bond that would
//! close a cycle inside it) becomes hydrogens, one per valence unit, so each copy keeps the total
//! valence of its original. A double bond to an outside atom thus becomes two hydrogens, as in the
//! CBH papers (R. O. Ramabhadran, K. Raghavachari, J. Chem. Theory Comput. 7 (2011) 2094), which
//! cap with hydrogens and keep multiple bonds only where both ends are inside the fragment.
//! Because fragments are trees, a ring atom reached along two paths appears twice and every
//! fragment is acyclic.
//!
//! Aromatic rings are fragmented in the Kekulé structure the parser chose: fragment bonds keep
//! their Kekulé order and lose the aromatic flag (an acyclic fragment cannot be aromatic). CBH-0
//! to CBH-2 fragment counts do not depend on the Kekulé structure for benzenoid carbon (each
//! aromatic carbon has exactly one double bond); CBH-3 fragments can (butadiene versus
//! 2-butene-type pieces), so a CBH-3 reaction of an aromatic molecule is one correct choice
//! among several.
//!
//! Charges and valences are kept as written: a nitro group written `[N+](=O)[O-]` gives ionic
//! pieces (`[OH-]`, `C[NH3+]`) at CBH-0 and CBH-1 and stays whole around N from CBH-2 on, and a
//! hypervalent atom gives a hypervalent hydride (`[SH4]` from a sulfoxide at CBH-0). Such pieces
//! have no reference values; pricing them needs a fallback or a higher rung.

use petgraph::graph::NodeIndex;
use petgraph::visit::EdgeRef;

use super::error::ReactionError;
use crate::molecule::canon::canonical_smiles;
use crate::molecule::{Atom, Bond, BondOrder, Element, Molecule};

/// A species of a reaction: a molecule and its canonical SMILES (the key that merges species).
/// Two species are equal when their keys are; serialized, a species is its key.
#[derive(Debug, Clone, serde::Serialize)]
pub struct Species {
    /// Canonical SMILES ([`canonical_smiles`]).
    pub smiles: String,
    /// The molecule (fragments hold their hydrogens as counts, not nodes).
    #[serde(skip)]
    pub molecule: Molecule,
}

impl Species {
    /// A species from a molecule; computes its canonical key.
    pub fn new(molecule: Molecule) -> Species {
        Species {
            smiles: canonical_smiles(&molecule),
            molecule,
        }
    }
}

impl PartialEq for Species {
    fn eq(&self, other: &Species) -> bool {
        self.smiles == other.smiles
    }
}

/// One atom of a fragment tree: the original atom and, except for the root, the position of its
/// parent in the tree list and the order of the bond to it.
#[derive(Debug, Clone, Copy)]
pub(crate) struct TreeAtom {
    pub original: NodeIndex,
    pub parent: Option<(usize, BondOrder)>,
}

/// The target reduced to what fragmentation needs: heavy atoms only (hydrogens folded into
/// counts), stereo marks dropped, one component.
#[derive(Debug, Clone)]
pub(crate) struct Skeleton {
    pub mol: Molecule,
}

impl Skeleton {
    /// Prepares `mol`; fails for a molecule without heavy atoms, with several components, or
    /// with hydrogen nodes that cannot be folded into counts.
    pub fn new(mol: &Molecule) -> Result<Skeleton, ReactionError> {
        let mut plain = mol.clone();
        plain.chiral_centres.clear();
        for e in plain.graph.edge_weights_mut() {
            e.direction = None;
        }
        let folded = plain.with_hydrogens_folded();
        let is_hydrogen = |i: NodeIndex| folded.atom(i).element == Element::H;
        if folded.atoms().all(is_hydrogen) {
            return Err(ReactionError::NoHeavyAtom);
        }
        if let Some(h) = folded.atoms().find(|&i| is_hydrogen(i)) {
            return Err(ReactionError::LabelledHydrogen { atom: h.index() });
        }
        let components = folded.component_count();
        if components > 1 {
            return Err(ReactionError::Disconnected { components });
        }
        Ok(Skeleton { mol: folded })
    }

    /// Heavy atoms.
    pub fn atoms(&self) -> Vec<NodeIndex> {
        self.mol.atoms().collect()
    }

    /// Heavy-atom bonds as (end, end, order).
    pub fn bonds(&self) -> Vec<(NodeIndex, NodeIndex, BondOrder)> {
        self.mol
            .graph
            .edge_references()
            .map(|e| (e.source(), e.target(), e.weight().order))
            .collect()
    }

    /// Number of heavy neighbours of `a`.
    pub fn degree(&self, a: NodeIndex) -> usize {
        self.mol.degree(a)
    }

    /// Sum of the heavy-atom bond orders (the H2 count of the CBH-0 reaction).
    pub fn bond_order_sum(&self) -> u32 {
        self.bonds().iter().map(|b| u32::from(b.2.valence())).sum()
    }

    /// Parent hydride of `a` (CBH-0 fragment).
    pub fn hydride(&self, a: NodeIndex) -> Result<Species, ReactionError> {
        self.fragment(&[root(a)])
    }

    /// The two ends of a bond (CBH-1 fragment).
    pub fn bond_fragment(
        &self,
        a: NodeIndex,
        b: NodeIndex,
        order: BondOrder,
    ) -> Result<Species, ReactionError> {
        self.fragment(&[root(a), child(b, 0, order)])
    }

    /// `a` with all its heavy neighbours (CBH-2 fragment).
    pub fn atom_centred(&self, a: NodeIndex) -> Result<Species, ReactionError> {
        let mut tree = vec![root(a)];
        tree.extend(
            self.mol
                .neighbours(a)
                .map(|(n, bond)| child(n, 0, bond.order)),
        );
        self.fragment(&tree)
    }

    /// The bond a-b with the heavy neighbours of both ends (CBH-3 fragment).
    pub fn bond_centred(
        &self,
        a: NodeIndex,
        b: NodeIndex,
        order: BondOrder,
    ) -> Result<Species, ReactionError> {
        let mut tree = vec![root(a), child(b, 0, order)];
        for (centre, pos, other) in [(a, 0, b), (b, 1, a)] {
            // The central bond is already in the tree; a molecular graph has no parallel bonds.
            for (n, bond) in self.mol.neighbours(centre).filter(|(n, _)| *n != other) {
                tree.push(child(n, pos, bond.order));
            }
        }
        self.fragment(&tree)
    }

    /// Builds the capped molecule of a tree.
    fn fragment(&self, tree: &[TreeAtom]) -> Result<Species, ReactionError> {
        let mut inside_valence = vec![0u32; tree.len()];
        for (pos, t) in tree.iter().enumerate() {
            if let Some((parent, order)) = t.parent {
                inside_valence[pos] += u32::from(order.valence());
                inside_valence[parent] += u32::from(order.valence());
            }
        }
        let mut out = Molecule::new();
        let mut nodes = Vec::with_capacity(tree.len());
        for (pos, t) in tree.iter().enumerate() {
            let original = self.mol.atom(t.original);
            let total = u32::from(original.hydrogens) + self.mol.bond_valence(t.original);
            let needed = total.saturating_sub(inside_valence[pos]);
            let hydrogens = u8::try_from(needed).map_err(|_| ReactionError::TooManyCaps {
                atom: t.original.index(),
                needed,
            })?;
            let atom = Atom {
                hydrogens,
                aromatic: false,
                atom_class: None,
                column: 0,
                ..original.clone()
            };
            let node = out.add_atom(atom);
            if let Some((parent, order)) = t.parent {
                out.add_bond(nodes[parent], node, Bond::new(order));
            }
            nodes.push(node);
        }
        Ok(Species::new(out))
    }
}

fn root(a: NodeIndex) -> TreeAtom {
    TreeAtom {
        original: a,
        parent: None,
    }
}

fn child(a: NodeIndex, parent: usize, order: BondOrder) -> TreeAtom {
    TreeAtom {
        original: a,
        parent: Some((parent, order)),
    }
}

/// Molecular hydrogen, the CBH-0 balancing species, in the form the SMILES `[HH]` reads to.
pub(crate) fn dihydrogen() -> Species {
    let mut mol = Molecule::new();
    mol.add_atom(Atom {
        hydrogens: 1,
        ..Atom::new(Element::H)
    });
    Species::new(mol)
}
