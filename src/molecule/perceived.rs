//! A molecule made ready for thermochemistry: hydrogens folded, atoms in canonical order, a
//! canonical Kekulé structure, rings and aromaticity perceived.
//!
//! Everything computed from a perceived molecule (groups, corrections, ring corrections,
//! symmetry) must not depend on how the SMILES was written. So the graph is rebuilt in the
//! canonical atom order of [`crate::molecule::canon`] (bonds sorted by their canonical ends),
//! and the bonds whose order differs between Kekulé structures (the resonant bonds, found by
//! the canonical key's own rule) are given their double bonds afresh by a matching taken in
//! that order. Two spellings of one molecule then give the same graph, atom for atom and bond
//! for bond, and every deterministic rule downstream gives them the same answer.

use petgraph::graph::{EdgeIndex, NodeIndex};
use petgraph::visit::EdgeRef;

use super::aromaticity::perceive_aromaticity;
use super::canon::CanonicalForm;
use super::graph::{ChiralCentre, Molecule, StereoNeighbour};
use super::kekulize::rematch_double_bonds;
use super::rings::RingInfo;
use super::smiles::{parse_smiles, SmilesError};

/// A molecule with its rings and aromaticity perceived, the input of group assignment,
/// symmetry and reaction building. Plain hydrogen nodes are folded into hydrogen counts, and
/// the atoms are in canonical order (see the module documentation).
#[derive(Debug, Clone)]
pub struct PerceivedMolecule {
    /// The graph (Kekulé bond orders; `aromatic` flags as perceived).
    pub mol: Molecule,
    /// Smallest set of smallest rings and ring systems.
    pub rings: RingInfo,
    /// For each atom of `mol`, its 1-based atom number in the molecule it was made from, for
    /// messages that point into the input.
    pub input_atom: Vec<usize>,
}

impl PerceivedMolecule {
    /// Folds hydrogens, puts the atoms in canonical order, and perceives rings and
    /// aromaticity.
    pub fn new(mol: &Molecule) -> PerceivedMolecule {
        let (mut mol, input_atom) = canonical_order(mol);
        let rings = RingInfo::perceive(&mol);
        perceive_aromaticity(&mut mol, &rings);
        PerceivedMolecule {
            mol,
            rings,
            input_atom,
        }
    }

    /// Parses a SMILES and perceives it.
    pub fn from_smiles(smiles: &str) -> Result<PerceivedMolecule, SmilesError> {
        Ok(PerceivedMolecule::new(&parse_smiles(smiles)?))
    }

    /// The 1-based input atom number of atom `a` (for messages).
    pub fn input_atom_number(&self, a: NodeIndex) -> usize {
        self.input_atom
            .get(a.index())
            .copied()
            .unwrap_or(a.index() + 1)
    }
}

/// The hydrogen-folded molecule rebuilt in canonical atom order with a canonical Kekulé
/// structure, and the 1-based input atom number of each of its atoms.
fn canonical_order(mol: &Molecule) -> (Molecule, Vec<usize>) {
    if mol.atom_count() == 0 {
        return (Molecule::new(), Vec::new());
    }
    let form = CanonicalForm::of(mol);
    let folded = &form.prepared.folded;
    let n = folded.atom_count();
    // new index of old atom i = its rank
    let new_of = |i: NodeIndex| NodeIndex::new(form.ranks[i.index()] as usize);
    let mut old_of = vec![NodeIndex::new(0); n];
    for i in folded.atoms() {
        old_of[new_of(i).index()] = i;
    }
    let mut out = Molecule::new();
    for &old in &old_of {
        out.add_atom(folded.atom(old).clone());
    }
    let mut edges: Vec<(usize, usize, EdgeIndex)> = folded
        .graph
        .edge_references()
        .map(|e| {
            let (a, b) = (new_of(e.source()).index(), new_of(e.target()).index());
            (a.min(b), a.max(b), e.id())
        })
        .collect();
    edges.sort_unstable();
    let mut resonant = Vec::new();
    for &(a, b, old) in &edges {
        let mut bond = folded.graph[old].clone();
        bond.direction = bond.direction.map(|(from, d)| (new_of(from), d));
        let e = out.add_bond(NodeIndex::new(a), NodeIndex::new(b), bond);
        if form.prepared.bonds[old.index()].resonant {
            resonant.push(e);
        }
    }
    // Marks that make no stereoisomer (`C[C@H](C)O`) are left out, as the canonical key does.
    let stereogenic = |c: &ChiralCentre| {
        form.stereo
            .tetra
            .iter()
            .any(|t| t.active && t.centre == c.atom.index())
    };
    let mut centres: Vec<ChiralCentre> = folded
        .chiral_centres
        .iter()
        .filter(|c| stereogenic(c))
        .map(|c| ChiralCentre {
            atom: new_of(c.atom),
            tag: c.tag,
            neighbours: c
                .neighbours
                .iter()
                .map(|s| match s {
                    StereoNeighbour::Atom(a) => StereoNeighbour::Atom(new_of(*a)),
                    StereoNeighbour::ImplicitHydrogen => StereoNeighbour::ImplicitHydrogen,
                })
                .collect(),
        })
        .collect();
    centres.sort_by_key(|c| c.atom);
    out.chiral_centres = centres;
    rematch_double_bonds(&mut out, &resonant);
    let mut input_atom = vec![0usize; n];
    for (input, folded_atom) in form.prepared.from_input.iter().enumerate() {
        if let Some(f) = folded_atom {
            input_atom[new_of(*f).index()] = input + 1;
        }
    }
    (out, input_atom)
}
