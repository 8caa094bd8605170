//! Double-bond geometry of fragments: which substituents of a parent double bond are cis.
//!
//! A double bond in a ring of 7 or fewer atoms is cis along the ring: its two ring neighbours
//! (one on each end) sit on the same side, since a trans double bond does not fit such a ring
//! (common practice; trans-cyclooctene is the smallest isolable trans cycloalkene). A fragment
//! that keeps both ring neighbours of such a bond is therefore the Z isomer (cyclopentene's CBH-3
//! piece is cis-2-butene, `C/C=C\C`). Any other double bond keeps the geometry written in the
//! parent's `/` `\` marks, if any; without marks the fragment has none either.
//!
//! Two substituents `x` (on `a`) and `y` (on `b`) are cis along a small ring when `x = y` (a
//! three-membered ring) or a path of at most 4 bonds joins them without passing through `a`
//! or `b`, so that `x-a=b-y` closes a ring of at most 7 atoms.

use std::collections::VecDeque;

use petgraph::graph::NodeIndex;
use petgraph::visit::EdgeRef;

use crate::molecule::{BondDirection, BondOrder, Molecule};

/// Largest ring (in atoms) whose double bonds are taken as cis along the ring.
const SMALL_RING: usize = 7;

/// Cis (`Some(true)`) or trans (`Some(false)`) relation of substituent `x` of `a` and `y` of
/// `b` across the parent's double bond `a=b`; `None` when the parent fixes no geometry.
pub(crate) fn relation(
    mol: &Molecule,
    a: NodeIndex,
    b: NodeIndex,
    x: NodeIndex,
    y: NodeIndex,
) -> Option<bool> {
    if in_small_ring(mol, a, b) {
        if ring_cis(mol, a, b, x, y) {
            return Some(true);
        }
        let other_x = substituents(mol, a, b).into_iter().find(|&s| s != x);
        let other_y = substituents(mol, b, a).into_iter().find(|&s| s != y);
        let opposite = other_x.is_some_and(|x2| ring_cis(mol, a, b, x2, y))
            || other_y.is_some_and(|y2| ring_cis(mol, a, b, x, y2));
        return opposite.then_some(false);
    }
    Some(written_side(mol, a, b, x)? == written_side(mol, b, a, y)?)
}

/// Heavy substituents of `end` other than `partner`.
fn substituents(mol: &Molecule, end: NodeIndex, partner: NodeIndex) -> Vec<NodeIndex> {
    mol.neighbours(end)
        .map(|(n, _)| n)
        .filter(|&n| n != partner)
        .collect()
}

/// Whether bond `a-b` lies in a ring of at most [`SMALL_RING`] atoms.
fn in_small_ring(mol: &Molecule, a: NodeIndex, b: NodeIndex) -> bool {
    // A path from a to b of at most SMALL_RING - 1 bonds that avoids the bond itself.
    let mut dist = vec![usize::MAX; mol.atom_count()];
    dist[a.index()] = 0;
    let mut queue = VecDeque::from([a]);
    while let Some(v) = queue.pop_front() {
        let d = dist[v.index()];
        if d + 1 > SMALL_RING - 1 {
            continue;
        }
        for (w, _) in mol.neighbours(v) {
            if v == a && w == b {
                continue;
            }
            if w == b {
                return true;
            }
            if dist[w.index()] == usize::MAX {
                dist[w.index()] = d + 1;
                queue.push_back(w);
            }
        }
    }
    false
}

/// Whether `x` (on `a`) and `y` (on `b`) close a ring of at most [`SMALL_RING`] atoms with
/// `a=b`: `x = y`, or a path of at most `SMALL_RING - 3` bonds avoiding `a` and `b`.
fn ring_cis(mol: &Molecule, a: NodeIndex, b: NodeIndex, x: NodeIndex, y: NodeIndex) -> bool {
    if x == y {
        return true;
    }
    let limit = SMALL_RING - 3;
    let mut dist = vec![usize::MAX; mol.atom_count()];
    dist[x.index()] = 0;
    let mut queue = VecDeque::from([x]);
    while let Some(v) = queue.pop_front() {
        let d = dist[v.index()];
        if d >= limit {
            continue;
        }
        for (w, _) in mol.neighbours(v) {
            if w == a || w == b || dist[w.index()] != usize::MAX {
                continue;
            }
            if w == y {
                return true;
            }
            dist[w.index()] = d + 1;
            queue.push_back(w);
        }
    }
    false
}

/// Side (-1 or +1) of substituent `s` of double-bond end `end` from the parent's marks: its
/// own mark, or the opposite of the other substituent's. `None` without a usable mark, or when
/// `end` has more than two substituents or a substituent bond that is not single.
fn written_side(mol: &Molecule, end: NodeIndex, partner: NodeIndex, s: NodeIndex) -> Option<i8> {
    let subs: Vec<_> = mol
        .graph
        .edges(end)
        .filter(|e| e.source() != partner && e.target() != partner)
        .collect();
    if subs.is_empty()
        || subs.len() > 2
        || subs.iter().any(|e| e.weight().order != BondOrder::Single)
    {
        return None;
    }
    let other_end = |e: &petgraph::graph::EdgeReference<'_, crate::molecule::Bond>| {
        if e.source() == end {
            e.target()
        } else {
            e.source()
        }
    };
    let own = subs.iter().find(|e| other_end(e) == s)?;
    if let Some(dir) = own.weight().direction {
        return Some(side(other_end(own), dir));
    }
    let other = subs.iter().find(|e| other_end(e) != s)?;
    let dir = other.weight().direction?;
    Some(-side(other_end(other), dir))
}

/// Side (-1 or +1) of substituent `s` implied by the mark `(from, dir)` on its bond: `/` read
/// from `s` towards the double-bond end puts `s` below (-1), `\` above (+1); read from the
/// other end the symbol swaps (the OpenSMILES reading, as the canonical writer uses it).
fn side(s: NodeIndex, (from, dir): (NodeIndex, BondDirection)) -> i8 {
    if (dir == BondDirection::Up) == (from == s) {
        -1
    } else {
        1
    }
}

/// The mark that puts substituent `s` on `side` (-1 or +1) of its double-bond end.
pub(crate) fn mark_for(s: NodeIndex, side: i8) -> (NodeIndex, BondDirection) {
    // See `side`: `/` read from `s` puts `s` below.
    let dir = if side < 0 {
        BondDirection::Up
    } else {
        BondDirection::Down
    };
    (s, dir)
}

/// Side of `s` implied by the mark `dir` on its bond (public form of [`side`] for fragments).
pub(crate) fn side_from_mark(s: NodeIndex, dir: (NodeIndex, BondDirection)) -> i8 {
    side(s, dir)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::molecule::parse_smiles;

    fn mol(s: &str) -> Molecule {
        parse_smiles(s)
            .expect("test SMILES parses")
            .with_hydrogens_folded()
    }

    #[test]
    fn small_ring_neighbours_are_cis() {
        // Cyclopentene C1=CCCC1: atoms 0=1, ring neighbours 4 (on 0) and 2 (on 1).
        let m = mol("C1=CCCC1");
        let n = NodeIndex::new;
        assert_eq!(relation(&m, n(0), n(1), n(4), n(2)), Some(true));
        // Cyclooctene without marks: no geometry.
        let m = mol("C1=CCCCCCC1");
        assert_eq!(relation(&m, n(0), n(1), n(7), n(2)), None);
        // Written geometry of an acyclic bond: trans-2-butene.
        let m = mol("C/C=C/C");
        assert_eq!(relation(&m, n(1), n(2), n(0), n(3)), Some(false));
        let m = mol("C/C=C\\C");
        assert_eq!(relation(&m, n(1), n(2), n(0), n(3)), Some(true));
    }
}
