//! Cis/trans and cumulene stereo units, with configurations read from `/` and `\` bonds.
//!
//! A unit lists the two other neighbours of each end, the first of each end on the same side
//! ("up"). Written bond directions decide which is up; otherwise neighbours are ordered by
//! their stereo-free equivalence class, which picks a representative arrangement.

use petgraph::graph::NodeIndex;

use super::labelled::{Anchor, LabelledGraph, StereoUnit, UnitKind};
use crate::molecule::graph::{BondDirection, Molecule};

/// Which neighbour of `x` (among `pair`) is drawn "up" by `/` and `\` bonds, if written.
fn up_neighbour(mol: &Molecule, x: u32, pair: [u32; 2]) -> Option<[u32; 2]> {
    let n0 = mol.atom_count() as u32;
    for (i, &p) in pair.iter().enumerate() {
        if p >= n0 || x >= n0 {
            continue;
        }
        let e = mol
            .graph
            .find_edge(NodeIndex::new(x as usize), NodeIndex::new(p as usize))?;
        if let Some((from, d)) = mol.graph[e].direction {
            let up = (d == BondDirection::Up) == (from.index() as u32 == x);
            let other = pair[1 - i];
            return Some(if up { [p, other] } else { [other, p] });
        }
    }
    None
}

/// Adds a unit for every non-aromatic double bond or cumulene whose two ends have three
/// neighbours each (lone pairs included), except inside cages.
pub(crate) fn double_bond_units(
    mol: &Molecule,
    g: &mut LabelledGraph,
    cage: &[bool],
    by_cell: &dyn Fn(&mut Vec<u32>),
) {
    let n0 = mol.atom_count() as u32;
    let double_to = |g: &LabelledGraph, x: u32| -> Vec<u32> {
        g.adj[x as usize]
            .iter()
            .filter(|e| e.1 == 2)
            .map(|e| e.0)
            .collect()
    };
    let mut units = Vec::new();
    for x in 0..n0 {
        let dx = double_to(g, x);
        if g.degree(x) != 3 || dx.len() != 1 || cage[x as usize] {
            continue;
        }
        let (mut prev, mut cur) = (x, dx[0]);
        let mut steps = 0;
        while g.degree(cur) == 2 && double_to(g, cur).len() == 2 && steps < n0 {
            let next = g.adj[cur as usize]
                .iter()
                .map(|e| e.0)
                .find(|&w| w != prev)
                .unwrap_or(prev);
            prev = cur;
            cur = next;
            steps += 1;
        }
        let z = cur;
        if z <= x || g.degree(z) != 3 || double_to(g, z).len() != 1 || cage[z as usize] {
            continue;
        }
        let side = |end: u32, towards: u32| -> Vec<u32> {
            let mut s: Vec<u32> = g.adj[end as usize]
                .iter()
                .map(|e| e.0)
                .filter(|&w| w != towards)
                .collect();
            by_cell(&mut s);
            s
        };
        let (sx, sz) = (side(x, dx[0]), side(z, prev));
        let (Ok(px), Ok(pz)) = (<[u32; 2]>::try_from(sx), <[u32; 2]>::try_from(sz)) else {
            continue;
        };
        let written = (steps % 2 == 0)
            .then(|| Some((up_neighbour(mol, x, px)?, up_neighbour(mol, z, pz)?)))
            .flatten();
        let ((a, b), specified) = match written {
            Some(w) => (w, true),
            None => ((px, pz), false),
        };
        units.push(StereoUnit {
            anchor: Anchor::Bond(x, z),
            refs: vec![a[0], a[1], b[0], b[1]],
            kind: if steps % 2 == 0 {
                UnitKind::DoubleBond
            } else {
                UnitKind::Axial
            },
            specified,
        });
    }
    g.units.extend(units);
}
