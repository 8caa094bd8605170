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
//! Functional units that cannot be cut into ordinary molecules (nitro, sulfonyl, sulfinyl,
//! phosphoryl, isocyanide, N-oxide: a centre with its terminal charge-separated or multiply
//! bonded O, S, Se or N, see the `units` module) are single super-atoms: every fragment that holds
//! the centre holds the whole unit, hydrogen caps go on the centre's bonds to atoms outside the
//! unit only, and the unit's terminal atoms are never a hydride, bond or atom fragment of their
//! own. Nitromethane's CBH-0 pieces are methane and `O=[NH+][O-]` (not `[NH4+]` and `[OH-]`);
//! sulfolane's sulfonyl unit gives `O=[SH2]=O` at CBH-0 and `CS(C)(=O)=O` at CBH-2 (not `[SH6]`).
//! Atoms and bonds in the rung formulas of [`super::cbh`] are then super-atoms and the bonds
//! between them. Other charged atoms (an ammonium ion) keep their charge in every piece, as the
//! target is itself an ion.
//!
//! Double bonds keep their geometry where the parent fixes it (the `geometry` module): a double
//! bond in a ring of 7 or fewer atoms whose fragment holds a ring neighbour on each end is
//! written Z along the ring (cyclopentene's CBH-3 piece is `C/C=C\C`, cis-2-butene); other
//! double bonds keep the parent's `/` `\` marks, if any. [`validity`](super::validity) checks
//! that every species of a built reaction is an ordinary neutral molecule.

use petgraph::graph::NodeIndex;
use petgraph::visit::EdgeRef;

use super::error::ReactionError;
use super::geometry::{mark_for, relation, side_from_mark};
use super::units::Units;
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
/// counts), chiral marks dropped (double-bond marks kept), one component, and its units.
#[derive(Debug, Clone)]
pub(crate) struct Skeleton {
    pub mol: Molecule,
    units: Units,
}

impl Skeleton {
    /// Prepares `mol`; fails for a molecule without heavy atoms, with several components, or
    /// with hydrogen nodes that cannot be folded into counts.
    pub fn new(mol: &Molecule) -> Result<Skeleton, ReactionError> {
        let mut plain = mol.clone();
        plain.chiral_centres.clear();
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
        let units = Units::find(&folded);
        Ok(Skeleton { mol: folded, units })
    }

    /// Super-atoms: heavy atoms that are not terminal members of a unit (a unit by its centre).
    pub fn atoms(&self) -> Vec<NodeIndex> {
        self.mol
            .atoms()
            .filter(|&a| !self.units.is_absorbed(a))
            .collect()
    }

    /// Bonds between super-atoms as (end, end, order); bonds inside a unit are not listed.
    pub fn bonds(&self) -> Vec<(NodeIndex, NodeIndex, BondOrder)> {
        self.mol
            .graph
            .edge_references()
            .filter(|e| !self.units.is_absorbed(e.source()) && !self.units.is_absorbed(e.target()))
            .map(|e| (e.source(), e.target(), e.weight().order))
            .collect()
    }

    /// Super-atom neighbours of `a` with the bond to each.
    fn neighbours(&self, a: NodeIndex) -> impl Iterator<Item = (NodeIndex, &Bond)> + '_ {
        self.mol
            .neighbours(a)
            .filter(|(n, _)| !self.units.is_absorbed(*n))
    }

    /// Number of super-atom neighbours of `a`.
    pub fn degree(&self, a: NodeIndex) -> usize {
        self.neighbours(a).count()
    }

    /// Sum of the orders of bonds between super-atoms (the H2 count of the CBH-0 reaction).
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
        tree.extend(self.neighbours(a).map(|(n, bond)| child(n, 0, bond.order)));
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
            for (n, bond) in self.neighbours(centre).filter(|(n, _)| *n != other) {
                tree.push(child(n, pos, bond.order));
            }
        }
        self.fragment(&tree)
    }

    /// Builds the capped molecule of a tree of super-atoms: each unit centre brings its
    /// terminal members, then open valences are capped and double-bond geometry is written.
    fn fragment(&self, centres: &[TreeAtom]) -> Result<Species, ReactionError> {
        let mut tree = centres.to_vec();
        for (pos, t) in centres.iter().enumerate() {
            for &(m, order) in self.units.members_of(t.original) {
                tree.push(child(m, pos, order));
            }
        }
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
        self.write_geometry(&tree, &nodes, &mut out);
        Ok(Species::new(out))
    }

    /// Writes `/` `\` marks on the fragment `out` (tree `tree`, nodes `nodes`) for every double
    /// bond whose parent fixes the relation of a fragment substituent on each end.
    fn write_geometry(&self, tree: &[TreeAtom], nodes: &[NodeIndex], out: &mut Molecule) {
        // Tree neighbours of every position joined by a single bond.
        let mut single: Vec<Vec<usize>> = vec![Vec::new(); tree.len()];
        for (pos, t) in tree.iter().enumerate() {
            if let Some((parent, BondOrder::Single)) = t.parent {
                single[pos].push(parent);
                single[parent].push(pos);
            }
        }
        for (pb, t) in tree.iter().enumerate() {
            let Some((pa, BondOrder::Double)) = t.parent else {
                continue;
            };
            let (a, b) = (tree[pa].original, t.original);
            let pair = single[pa].iter().find_map(|&u| {
                single[pb].iter().find_map(|&v| {
                    relation(&self.mol, a, b, tree[u].original, tree[v].original)
                        .map(|cis| (u, v, cis))
                })
            });
            if let Some((u, v, cis)) = pair {
                mark_pair(out, nodes, (pa, &single[pa], u), (pb, &single[pb], v), cis);
            }
        }
    }
}

/// Marks substituent `u` of end `pa` and `v` of end `pb` as cis or trans, reusing a mark that a
/// substituent bond already carries (a conjugated chain) and leaving the bond unmarked when the
/// marks already there contradict the wanted relation.
fn mark_pair(
    out: &mut Molecule,
    nodes: &[NodeIndex],
    (pa, subs_a, u): (usize, &[usize], usize),
    (pb, subs_b, v): (usize, &[usize], usize),
    cis: bool,
) {
    // Side of `want` at `end` from an existing mark on one of its substituent bonds.
    let existing = |out: &Molecule, end: usize, subs: &[usize], want: usize| -> Option<i8> {
        subs.iter().find_map(|&s| {
            let edge = out.graph.find_edge(nodes[end], nodes[s])?;
            let dir = out.graph[edge].direction?;
            let side = side_from_mark(nodes[s], dir);
            Some(if s == want { side } else { -side })
        })
    };
    let set = |out: &mut Molecule, end: usize, s: usize, side: i8| {
        if let Some(edge) = out.graph.find_edge(nodes[end], nodes[s]) {
            out.graph[edge].direction = Some(mark_for(nodes[s], side));
        }
    };
    let side_u = match existing(out, pa, subs_a, u) {
        Some(side) => side,
        None => {
            set(out, pa, u, -1);
            -1
        }
    };
    let side_v = if cis { side_u } else { -side_u };
    match existing(out, pb, subs_b, v) {
        Some(side) if side != side_v => {
            // Contradicting marks from a neighbouring double bond: leave this one unmarked.
        }
        Some(_) => {}
        None => set(out, pb, v, side_v),
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
