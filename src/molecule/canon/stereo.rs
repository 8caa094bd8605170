//! Stereo elements (tetrahedral centres, double-bond geometry) read from the input and
//! re-expressed against atom ranks, so that the key does not depend on input order.

use super::prepare::{side_of, Prepared};
use crate::molecule::graph::{BondOrder, ChiralTag, Molecule, StereoNeighbour};

/// A tetrahedral centre: its neighbours in the order its mark refers to (`None` is the
/// implicit hydrogen or lone pair) and whether that order turns clockwise (`@@`).
#[derive(Debug, Clone)]
pub(crate) struct Tetrahedral {
    pub centre: usize,
    pub around: Vec<Option<usize>>,
    pub clockwise: bool,
    pub active: bool,
}

/// A double bond a=b with known geometry: substituents `x` on `a` and `y` on `b` are cis or not.
#[derive(Debug, Clone)]
pub(crate) struct DoubleBondStereo {
    pub a: usize,
    pub b: usize,
    pub x: usize,
    pub y: usize,
    pub cis: bool,
    pub active: bool,
}

/// All stereo elements of a molecule.
#[derive(Debug, Clone, Default)]
pub(crate) struct StereoSet {
    pub tetra: Vec<Tetrahedral>,
    pub double: Vec<DoubleBondStereo>,
}

/// One stereo element, by kind and position in its list.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum ElementId {
    Tetra(usize),
    Double(usize),
}

impl StereoSet {
    /// Inverts one element (the other configuration of a centre, or cis for trans).
    pub fn flip(&mut self, id: ElementId) {
        match id {
            ElementId::Tetra(i) => self.tetra[i].clockwise = !self.tetra[i].clockwise,
            ElementId::Double(i) => self.double[i].cis = !self.double[i].cis,
        }
    }

    /// Leaves one element out of the key.
    pub fn drop_element(&mut self, id: ElementId) {
        match id {
            ElementId::Tetra(i) => self.tetra[i].active = false,
            ElementId::Double(i) => self.double[i].active = false,
        }
    }

    /// Whether any element is active.
    pub fn is_empty(&self) -> bool {
        !self.tetra.iter().any(|t| t.active) && !self.double.iter().any(|d| d.active)
    }
}

/// Parity (true = odd) of the permutation that sorts `keys` ascending; `None` if two are equal.
pub(crate) fn sort_parity(keys: &[u32]) -> Option<bool> {
    let mut odd = false;
    for i in 0..keys.len() {
        for j in i + 1..keys.len() {
            if keys[i] == keys[j] {
                return None;
            }
            odd ^= keys[i] > keys[j];
        }
    }
    Some(odd)
}

/// Sort key of a centre's neighbour: the implicit hydrogen or lone pair first, then by rank.
pub(crate) fn neighbour_key(n: Option<usize>, ranks: &[u32]) -> u32 {
    n.map_or(0, |a| ranks[a] + 1)
}

/// Configuration of a centre against ranks: 1 when the neighbours in ascending key order turn
/// anticlockwise, 2 when clockwise; `None` while two neighbours share a rank.
pub(crate) fn tetra_value(t: &Tetrahedral, ranks: &[u32]) -> Option<u8> {
    let keys: Vec<u32> = t.around.iter().map(|&n| neighbour_key(n, ranks)).collect();
    let odd = sort_parity(&keys)?;
    Some(if t.clockwise != odd { 2 } else { 1 })
}

/// The substituent of double-bond end `end` (other than `partner`) with the highest rank;
/// `None` while two substituents share a rank.
pub(crate) fn reference_substituent(
    p: &Prepared,
    end: usize,
    partner: usize,
    ranks: &[u32],
) -> Option<usize> {
    let subs: Vec<usize> = p.adj[end]
        .iter()
        .map(|&(n, _)| n)
        .filter(|&n| n != partner)
        .collect();
    match subs.as_slice() {
        [s] => Some(*s),
        [s, t] if ranks[*s] != ranks[*t] => Some(if ranks[*s] > ranks[*t] { *s } else { *t }),
        _ => None,
    }
}

/// Geometry against ranks: 1 when the reference substituents are cis, 2 when trans.
pub(crate) fn double_value(p: &Prepared, d: &DoubleBondStereo, ranks: &[u32]) -> Option<u8> {
    let ra = reference_substituent(p, d.a, d.b, ranks)?;
    let rb = reference_substituent(p, d.b, d.a, ranks)?;
    let cis = d.cis ^ (ra != d.x) ^ (rb != d.y);
    Some(if cis { 1 } else { 2 })
}

/// Reads tetrahedral centres; marks that cannot describe a tetrahedral centre of this graph
/// (wrong neighbour count, other chirality classes) are left out.
pub(crate) fn read_tetrahedral(mol: &Molecule, p: &Prepared) -> Vec<Tetrahedral> {
    let mut out = Vec::new();
    for c in &mol.chiral_centres {
        let centre = c.atom.index();
        let clockwise = match c.tag {
            ChiralTag::Anticlockwise => false,
            ChiralTag::Clockwise => true,
            ChiralTag::Other { class, number } if &class == b"TH" && number == 1 => false,
            ChiralTag::Other { class, number } if &class == b"TH" && number == 2 => true,
            ChiralTag::Other { .. } => continue,
        };
        let mut around: Vec<Option<usize>> = c
            .neighbours
            .iter()
            .map(|n| match n {
                StereoNeighbour::Atom(a) => Some(a.index()),
                StereoNeighbour::ImplicitHydrogen => None,
            })
            .collect();
        let degree = p.adj[centre].len();
        let hydrogens = usize::from(p.atoms[centre].hydrogens);
        let listed = around.iter().filter(|n| n.is_some()).count();
        if listed != degree
            || around
                .iter()
                .flatten()
                .any(|&a| p.bond_between(centre, a).is_none())
        {
            continue;
        }
        if around.len() == 3 && degree + hydrogens <= 3 {
            // A lone pair (or an unlisted hydrogen) takes the second place (common practice;
            // RDKit reads three-neighbour centres this way).
            around.insert(1, None);
        }
        let implicit = around.iter().filter(|n| n.is_none()).count();
        if around.len() != 4 || implicit > 1 || degree + hydrogens > 4 {
            continue;
        }
        out.push(Tetrahedral {
            centre,
            around,
            clockwise,
            active: true,
        });
    }
    out
}

/// Whether the bond between `a` and `b` (index `bond`) closes a ring of fewer than 8 atoms,
/// where a double bond cannot be trans and its geometry is not kept (common practice).
fn in_small_ring(p: &Prepared, bond: usize, a: usize, b: usize) -> bool {
    if !p.bonds[bond].ring {
        return false;
    }
    let mut dist = std::collections::HashMap::new();
    dist.insert(a, 0usize);
    let mut frontier = vec![a];
    for depth in 1..=6 {
        let mut next = Vec::new();
        for &v in &frontier {
            for &(w, e) in &p.adj[v] {
                if e == bond || dist.contains_key(&w) {
                    continue;
                }
                if w == b {
                    return true;
                }
                dist.insert(w, depth);
                next.push(w);
            }
        }
        frontier = next;
    }
    false
}

/// Reads double-bond geometry from `/` `\` marks on both ends.
pub(crate) fn read_double_bonds(p: &Prepared) -> Vec<DoubleBondStereo> {
    let mut out = Vec::new();
    for (i, bond) in p.bonds.iter().enumerate() {
        if bond.order != BondOrder::Double || bond.resonant {
            continue;
        }
        let (a, b) = (bond.a, bond.b);
        let (Some((x, sx)), Some((y, sy))) = (marked_side(p, a, b), marked_side(p, b, a)) else {
            continue;
        };
        if in_small_ring(p, i, a, b) {
            continue;
        }
        out.push(DoubleBondStereo {
            a,
            b,
            x,
            y,
            cis: sx == sy,
            active: true,
        });
    }
    out
}

/// For double-bond end `end`: a substituent and its side, from the first direction mark found.
/// `None` if the end has no substituent, a non-single substituent bond, or no mark.
fn marked_side(p: &Prepared, end: usize, partner: usize) -> Option<(usize, i8)> {
    let subs: Vec<(usize, usize)> = p.adj[end]
        .iter()
        .copied()
        .filter(|&(n, _)| n != partner)
        .collect();
    if subs.is_empty()
        || subs.len() > 2
        || subs
            .iter()
            .any(|&(_, e)| p.bonds[e].order != BondOrder::Single)
    {
        return None;
    }
    subs.iter().find_map(|&(s, e)| {
        let dir = p.bonds[e].direction?;
        Some((s, side_of(s, dir)))
    })
}
