//! From a [`Molecule`] to the hydrogen-explicit labelled graph with lone pairs and stereo units.
//!
//! Implicit hydrogens become vertices. A lone pair becomes a vertex of its own on atoms whose
//! shape it decides: pyramidal three-connected N, P, As, O+, S+ (so ammonia is C3v, not D3h),
//! sulfoxide-type S and Se, and two-connected imine-type N and P (so that the lone pair takes
//! a place in the cis/trans unit of `C=N`). Bond colours are the Kekulé order, or one shared
//! colour for aromatic bonds (as written or as perceived), so benzene keeps its six-fold axis,
//! and one colour for the bonds of resonance-equivalent terminal atoms (the two oxygens of a
//! nitro group or a carboxylate), so nitromethane gets 6.

use petgraph::graph::NodeIndex;
use std::collections::HashMap;

use super::cage::orient_cage;
use super::double_bonds::double_bond_units;
use super::faces::{oriented_ring_steps, ring_centre_refs};
use super::labelled::{Anchor, LabelledGraph, StereoUnit, UnitKind};
use super::partition::Partition;
use crate::molecule::aromaticity::perceive_aromaticity;
use crate::molecule::graph::{ChiralTag, Molecule, StereoNeighbour};
use crate::molecule::rings::RingInfo;

/// Bond colour shared by all aromatic bonds.
const AROMATIC: u8 = 5;

/// The labelled graph of a molecule and what was noticed while building it.
#[derive(Debug, Clone)]
pub(crate) struct Built {
    pub graph: LabelledGraph,
    pub notes: Vec<String>,
    /// Whether some ring of four or more atoms holds an sp3 (four-connected) atom, so that
    /// the real ring may pucker below the flat-graph symmetry.
    pub puckerable_ring: bool,
    /// Unwritten tetrahedral or double-bond units whose references are all inequivalent in
    /// the stereo-free graph: places where the tool had to pick a configuration.
    pub open_stereocentres: usize,
}

/// Bond colour shared by the bonds of resonance-equivalent terminal atoms (nitro, carboxylate).
const RESONANT: u8 = 6;

/// Terminal atoms that resonance makes equivalent: on one centre, two or more degree-one atoms
/// of one element, some double-bonded and neutral, some single-bonded with charge -1 (the two
/// oxygens of `[N+](=O)[O-]` or `C(=O)[O-]`). Returns the flag per atom and per bond.
fn resonant_terminals(mol: &Molecule) -> (Vec<bool>, Vec<bool>) {
    let mut atoms = vec![false; mol.atom_count()];
    let mut bonds = vec![false; mol.bond_count()];
    for centre in mol.atoms() {
        let mut by_element: HashMap<u8, Vec<(NodeIndex, petgraph::graph::EdgeIndex)>> =
            HashMap::new();
        for e in mol.graph.edges(centre) {
            use petgraph::visit::EdgeRef;
            let t = if e.source() == centre {
                e.target()
            } else {
                e.source()
            };
            let a = mol.atom(t);
            if mol.degree(t) == 1 && a.hydrogens == 0 && a.isotope.is_none() {
                by_element
                    .entry(a.element.atomic_number())
                    .or_default()
                    .push((t, e.id()));
            }
        }
        for list in by_element.values() {
            let double_neutral = list
                .iter()
                .any(|&(t, e)| mol.graph[e].order.valence() == 2 && mol.atom(t).charge == 0);
            let single_anion = list
                .iter()
                .any(|&(t, e)| mol.graph[e].order.valence() == 1 && mol.atom(t).charge == -1);
            if list.len() >= 2 && double_neutral && single_anion {
                for &(t, e) in list {
                    atoms[t.index()] = true;
                    bonds[e.index()] = true;
                }
            }
        }
    }
    (atoms, bonds)
}

/// Elements whose four-connected atoms are treated as tetrahedral (main-group B to Te).
fn tetrahedral_element(z: u8) -> bool {
    matches!(z, 5..=8 | 14..=16 | 32..=34 | 50..=52)
}

/// The lone-pair kind an atom gets, if any: (kind for a four-reference unit, or none when the
/// lone pair only completes a double-bond end).
fn lone_pair(z: u8, charge: i8, degree: usize, doubles: usize, aromatic: bool) -> Option<bool> {
    if aromatic {
        return None;
    }
    match (z, charge, degree, doubles) {
        (7 | 15 | 33, 0, 3, 0) | (8 | 16 | 34, 1, 3, 0) | (16 | 34, 0, 3, 1) => Some(true),
        (7 | 15, 0, 2, 1) => Some(false),
        _ => None,
    }
}

/// Builds the labelled graph of `mol`.
pub(crate) fn build(mol: &Molecule) -> Built {
    let mut notes = Vec::new();
    let mut perceived = mol.clone();
    let rings = RingInfo::perceive(mol);
    perceive_aromaticity(&mut perceived, &rings);
    let puckerable_ring = rings.rings.iter().any(|r| {
        r.size() >= 4
            && r.atoms
                .iter()
                .any(|&a| mol.degree(a) + mol.atom(a).hydrogens as usize == 4)
    });
    let n0 = mol.atom_count();
    let (resonant_atom, resonant_bond) = resonant_terminals(mol);
    // Bonds whose order differs between Kekulé structures share the aromatic colour, so the
    // symmetry does not follow the Kekulé form given (C70 keeps its ten rotations).
    let kekule_resonant = crate::molecule::canon::resonance::resonant_bonds_of(mol);
    let mut colours: HashMap<(u8, i8, u16, u8), u32> = HashMap::new();
    let mut colour_of = |key: (u8, i8, u16, u8)| {
        let next = colours.len() as u32;
        *colours.entry(key).or_insert(next)
    };
    let mut g = LabelledGraph::default();
    for v in mol.atoms() {
        let a = mol.atom(v);
        // Resonance-equivalent terminals share one colour whatever their written charge.
        let charge = if resonant_atom[v.index()] {
            i8::MIN
        } else {
            a.charge
        };
        let key = (
            a.element.atomic_number(),
            charge,
            a.isotope.unwrap_or(0),
            a.radical_electrons,
        );
        g.add_vertex(colour_of(key));
    }
    let mut doubles = vec![0usize; n0];
    for e in mol.graph.edge_indices() {
        let Some((a, b)) = mol.graph.edge_endpoints(e) else {
            continue;
        };
        let bond = &mol.graph[e];
        let aromatic = bond.aromatic || perceived.graph[e].aromatic || kekule_resonant[e.index()];
        let colour = if resonant_bond[e.index()] {
            RESONANT
        } else if aromatic {
            AROMATIC
        } else {
            bond.order.valence()
        };
        if bond.order.valence() == 2 && !aromatic {
            doubles[a.index()] += 1;
            doubles[b.index()] += 1;
        }
        g.add_edge(a.index() as u32, b.index() as u32, colour);
    }
    let hydrogen = colour_of((1, 0, 0, 0));
    let lone_pair_colour = colour_of((0, 0, 0, 0));
    let mut first_h = vec![None; n0];
    let mut pyramid = vec![None; n0];
    for v in mol.atoms() {
        let a = mol.atom(v);
        for j in 0..a.hydrogens {
            let h = g.add_vertex(hydrogen);
            g.add_edge(v.index() as u32, h, 1);
            if j == 0 {
                first_h[v.index()] = Some(h);
            }
        }
        let degree = g.adj[v.index()].len();
        let aromatic = a.aromatic || perceived.atom(v).aromatic;
        let z = a.element.atomic_number();
        if let Some(four) = lone_pair(z, a.charge, degree, doubles[v.index()], aromatic) {
            let lp = g.add_vertex(lone_pair_colour);
            g.add_edge(v.index() as u32, lp, 0);
            if four {
                let inverts = z == 7 || (z == 8 && a.charge == 1);
                pyramid[v.index()] = Some((lp, inverts));
            }
        }
    }
    g.finish();
    let mut root = Partition::by_colour(&g);
    root.refine(&g);
    let by_cell = |list: &mut Vec<u32>| list.sort_by_key(|&x| (root.cell_of[x as usize], x));

    let cage = cage_vertices(&g);
    let mut cage_failed = false;
    for &start in &cage.starts {
        match orient_cage(&g, start) {
            Some(found) => g
                .units
                .extend(found.into_iter().map(|(v, order)| StereoUnit {
                    anchor: Anchor::Atom(v),
                    refs: order.to_vec(),
                    kind: UnitKind::Cage,
                    specified: false,
                })),
            None => cage_failed = true,
        }
    }
    if cage_failed {
        notes.push(
            "a closed three-connected cage could not be oriented; its mirror images are \
             counted as rotations, so sigma may be twice too large"
                .to_string(),
        );
    }
    let ring_cycles: Vec<Vec<u32>> = rings
        .rings
        .iter()
        .map(|r| r.atoms.iter().map(|a| a.index() as u32).collect())
        .collect();
    let steps = oriented_ring_steps(&ring_cycles, g.len());
    let mut hypervalent = false;
    for v in 0..n0 {
        let degree = g.adj[v].len();
        let z = mol.atom(NodeIndex::new(v)).element.atomic_number();
        if degree > 4 {
            hypervalent = true;
        }
        if degree != 4 || !tetrahedral_element(z) {
            continue;
        }
        let mut refs: Vec<u32> = g.adj[v].iter().map(|e| e.0).collect();
        by_cell(&mut refs);
        let mut exocyclic: Vec<u32> = refs
            .iter()
            .copied()
            .filter(|&r| !steps[v].iter().any(|s| s.0 == r || s.1 == r))
            .collect();
        by_cell(&mut exocyclic);
        if let Some(from_faces) = ring_centre_refs(&steps[v], &exocyclic) {
            refs = from_faces;
        }
        let kind = match pyramid[v] {
            Some((_, true)) => UnitKind::InvertingPyramid,
            Some((_, false)) => UnitKind::StablePyramid,
            None => UnitKind::Tetrahedral,
        };
        let written = written_centre(mol, v, &first_h, pyramid[v].map(|p| p.0));
        let specified = written.as_ref().is_some_and(|w| {
            let mut a = w.clone();
            let mut b = refs.clone();
            a.sort_unstable();
            b.sort_unstable();
            a == b
        });
        g.units.push(StereoUnit {
            anchor: Anchor::Atom(v as u32),
            refs: if specified {
                written.unwrap_or(refs)
            } else {
                refs
            },
            kind,
            specified,
        });
    }
    if hypervalent {
        notes.push(
            "atoms with five or more neighbours are not given a shape; rotations that the \
             real geometry forbids may be counted there"
                .to_string(),
        );
    }
    double_bond_units(mol, &mut g, &cage.member, &by_cell);
    g.finish();
    let open_stereocentres = g
        .units
        .iter()
        .filter(|u| !u.specified && u.kind != UnitKind::Cage)
        .filter(|u| match u.anchor {
            // A double bond inside a ring has its arrangement fixed by the ring.
            Anchor::Bond(x, z) => mol
                .graph
                .find_edge(NodeIndex::new(x as usize), NodeIndex::new(z as usize))
                .is_none_or(|e| !rings.is_ring_bond(e)),
            Anchor::Atom(_) => true,
        })
        .filter(|u| {
            let mut cells: Vec<u32> = u.refs.iter().map(|&r| root.cell_of[r as usize]).collect();
            cells.sort_unstable();
            cells.windows(2).all(|w| w[0] != w[1])
        })
        .count();
    Built {
        graph: g,
        notes,
        puckerable_ring,
        open_stereocentres,
    }
}

/// Vertices of components in which every vertex has degree 3.
struct Cages {
    member: Vec<bool>,
    starts: Vec<u32>,
}

fn cage_vertices(g: &LabelledGraph) -> Cages {
    let n = g.len();
    let mut seen = vec![false; n];
    let mut member = vec![false; n];
    let mut starts = Vec::new();
    for s in 0..n {
        if seen[s] {
            continue;
        }
        let mut stack = vec![s as u32];
        let mut comp = Vec::new();
        seen[s] = true;
        while let Some(v) = stack.pop() {
            comp.push(v);
            for &(w, _) in &g.adj[v as usize] {
                if !seen[w as usize] {
                    seen[w as usize] = true;
                    stack.push(w);
                }
            }
        }
        if comp.len() >= 4 && comp.iter().all(|&v| g.degree(v) == 3) {
            for &v in &comp {
                member[v as usize] = true;
            }
            starts.push(s as u32);
        }
    }
    Cages { member, starts }
}

/// The references of a chiral centre as written, reordered so that an even permutation
/// means the same handedness as SMILES `@` (anticlockwise seen from the first).
fn written_centre(
    mol: &Molecule,
    v: usize,
    first_h: &[Option<u32>],
    lone_pair: Option<u32>,
) -> Option<Vec<u32>> {
    let centre = mol.chiral_centres.iter().find(|c| c.atom.index() == v)?;
    let clockwise = match centre.tag {
        ChiralTag::Anticlockwise => false,
        ChiralTag::Clockwise => true,
        ChiralTag::Other { class, number } if &class == b"TH" && number <= 2 => number == 2,
        ChiralTag::Other { .. } => return None,
    };
    let mut refs = Vec::with_capacity(4);
    for n in &centre.neighbours {
        refs.push(match n {
            StereoNeighbour::Atom(a) => a.index() as u32,
            StereoNeighbour::ImplicitHydrogen => first_h[v]?,
        });
    }
    if refs.len() == 3 {
        // OpenSMILES: a lone pair stands where an implicit hydrogen would, right after the
        // atom written before the centre (or first when nothing precedes it).
        let lp = lone_pair?;
        let column = mol.atom(NodeIndex::new(v)).column;
        let preceded = (refs[0] as usize) < mol.atom_count()
            && mol.atom(NodeIndex::new(refs[0] as usize)).column < column;
        refs.insert(usize::from(preceded), lp);
    }
    if refs.len() != 4 {
        return None;
    }
    if clockwise {
        refs.swap(2, 3);
    }
    Some(refs)
}
