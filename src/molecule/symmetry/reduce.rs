//! Folding interchangeable terminal atoms into their neighbour before the search.
//!
//! `k` terminal vertices of one colour on the same atom `c` (the hydrogens of a methyl, the
//! fluorines of CF3, the methyls of a tert-butyl once their hydrogens are folded) can be
//! permuted in `k!` ways, each a graph automorphism. When `c` carries a stereo unit and
//! `k >= 2`, swapping two of them flips the handedness at `c`, so whatever the rest of an
//! automorphism does, exactly half of the permutations at `c` make it a rotation there: the
//! unit is "free", it multiplies the group order by (product of `k!`) / 2 and constrains
//! nothing else. When `c` carries no unit the factor is the full product of `k!`. The
//! terminals are then removed and `c` is recoloured by what it lost. Repeating this folds
//! methyl hydrogens, then methyls, then tert-butyls, so neopentane or tetra-tert-butylmethane
//! collapse to one vertex and the search has nothing left to do.

use std::collections::HashMap;

use super::labelled::LabelledGraph;

/// A graph with its foldable terminals removed, and the group-order factor they carried.
#[derive(Debug, Clone)]
pub(crate) struct Folded {
    pub graph: LabelledGraph,
    /// Product over the folded sets of k!, halved once per freed stereo unit.
    pub factor: u128,
}

/// A folded vertex's new colour is keyed by its old colour and the terminal sets it lost.
type FoldKey = (u32, Vec<(u32, u8, u32)>);

fn factorial(k: u32) -> u128 {
    (1..=k as u128).fold(1u128, |acc, x| acc.saturating_mul(x))
}

/// Terminal neighbours of `c` grouped by (colour, bond colour), with their counts.
fn terminal_sets(g: &LabelledGraph, c: u32) -> Vec<(u32, u8, u32)> {
    let mut sets: Vec<(u32, u8, u32)> = Vec::new();
    for &(t, bond) in &g.adj[c as usize] {
        if g.degree(t) != 1 {
            continue;
        }
        let colour = g.colour[t as usize];
        match sets.iter_mut().find(|s| s.0 == colour && s.1 == bond) {
            Some(s) => s.2 += 1,
            None => sets.push((colour, bond, 1)),
        }
    }
    sets.sort_unstable();
    sets
}

/// Folds terminal sets repeatedly until none is left to fold.
pub(crate) fn fold_terminals(g: &LabelledGraph) -> Folded {
    let mut g = g.clone();
    let mut factor: u128 = 1;
    let mut next_colour = g.colour.iter().max().map_or(0, |m| m + 1);
    let mut interned: HashMap<FoldKey, u32> = HashMap::new();
    loop {
        let n = g.len() as u32;
        let sets: Vec<Vec<(u32, u8, u32)>> = (0..n)
            .map(|c| {
                if g.degree(c) >= 2 {
                    terminal_sets(&g, c)
                } else {
                    Vec::new()
                }
            })
            .collect();
        let mut freed = vec![false; g.units.len()];
        for c in 0..n {
            if let Some(u) = g.unit_at[c as usize] {
                if sets[c as usize].iter().any(|s| s.2 >= 2) {
                    freed[u as usize] = true;
                }
            }
        }
        let mut removed = vec![false; n as usize];
        let mut halved = vec![false; g.units.len()];
        let mut changed = false;
        for c in 0..n {
            let set = &sets[c as usize];
            let foldable = match g.unit_at[c as usize] {
                None => true,
                Some(u) => freed[u as usize],
            };
            if set.is_empty() || !foldable {
                continue;
            }
            for &(t, _) in &g.adj[c as usize] {
                if g.degree(t) == 1 {
                    removed[t as usize] = true;
                }
            }
            // k! per set, halved at once for a freed unit (k! / 2 is whole for k >= 2), so a
            // saturated product is never divided afterwards (that gave sigma 0 for long chains).
            let mut here: u128 = set
                .iter()
                .fold(1, |acc, s| acc.saturating_mul(factorial(s.2)));
            // Once per freed unit (a double-bond unit has two centres), at a centre whose own
            // product is even.
            if let Some(u) = g.unit_at[c as usize].filter(|&u| freed[u as usize]) {
                if !halved[u as usize] && set.iter().any(|s| s.2 >= 2) {
                    here /= 2;
                    halved[u as usize] = true;
                }
            }
            factor = factor.saturating_mul(here);
            let key = (g.colour[c as usize], set.clone());
            let colour = *interned.entry(key).or_insert_with(|| {
                next_colour += 1;
                next_colour - 1
            });
            g.colour[c as usize] = colour;
            changed = true;
        }
        if !changed {
            break;
        }
        let mut index = 0;
        g.units.retain(|_| {
            index += 1;
            !freed[index - 1]
        });
        let keep: Vec<u32> = (0..n).filter(|&v| !removed[v as usize]).collect();
        g = g.induced(&keep);
    }
    Folded { graph: g, factor }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::molecule::symmetry::labelled::{Anchor, StereoUnit, UnitKind};

    /// Methane as a centre with four hydrogens: 4!/2 = 12 (common practice).
    #[test]
    fn methane_folds_to_one_vertex() {
        let mut g = LabelledGraph::default();
        let c = g.add_vertex(6);
        for _ in 0..4 {
            let h = g.add_vertex(1);
            g.add_edge(c, h, 1);
        }
        g.units.push(StereoUnit {
            anchor: Anchor::Atom(c),
            refs: vec![1, 2, 3, 4],
            kind: UnitKind::Tetrahedral,
            specified: false,
        });
        g.finish();
        let folded = fold_terminals(&g);
        assert_eq!(folded.graph.len(), 1);
        assert_eq!(folded.factor, 12);
    }
}
