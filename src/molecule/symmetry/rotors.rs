//! Internal rotors: which part of sigma comes from rotation about single acyclic bonds.
//!
//! A rotor is one side of a single, acyclic (bridge) bond `a-b` whose both ends carry more
//! than one neighbour. Its symmetry is the orbit size, under the proper automorphisms that fix
//! the other side pointwise, of a neighbour of `b`: 3 for a methyl, CF3, NH3+ or tert-butyl
//! (whose own methyls are rotors of their own), 2 for a phenyl or a nitro group, 1 for a
//! hydroxyl. The two sides of one bond describe the same relative rotation, so a bond counts
//! once, with the larger of its two orbit sizes: ethane gets one rotor of 3 and an external
//! D3d (6); toluene a rotor of 3 and an external 2; phenol a rotor of 2 and an external 1.
//! Rotors on one axis through sp atoms (the two methyls of 2-butyne) are counted separately,
//! although a rigid rotation turns both; the external part then comes out too small there.

use super::labelled::LabelledGraph;
use super::partition::Partition;
use super::reduce::fold_terminals;
use super::search::{proper_group_order, SearchLimit};

/// Bridges of `g` as (a, b) pairs with a < b, found by an iterative depth-first search.
fn bridges(g: &LabelledGraph) -> Vec<(u32, u32)> {
    let n = g.len();
    let mut disc = vec![u32::MAX; n];
    let mut low = vec![0u32; n];
    let mut out = Vec::new();
    let mut time = 0u32;
    for root in 0..n {
        if disc[root] != u32::MAX {
            continue;
        }
        // (vertex, parent, next neighbour index)
        let mut stack: Vec<(u32, u32, usize)> = vec![(root as u32, u32::MAX, 0)];
        disc[root] = time;
        low[root] = time;
        time += 1;
        while let Some(top) = stack.last_mut() {
            let (v, parent, i) = *top;
            if let Some(&(w, _)) = g.adj[v as usize].get(i) {
                top.2 += 1;
                if w == parent {
                    continue;
                }
                if disc[w as usize] == u32::MAX {
                    disc[w as usize] = time;
                    low[w as usize] = time;
                    time += 1;
                    stack.push((w, v, 0));
                } else {
                    low[v as usize] = low[v as usize].min(disc[w as usize]);
                }
            } else {
                stack.pop();
                if parent != u32::MAX {
                    low[parent as usize] = low[parent as usize].min(low[v as usize]);
                    if low[v as usize] > disc[parent as usize] {
                        out.push((parent.min(v), parent.max(v)));
                    }
                }
            }
        }
    }
    out
}

/// Vertices reachable from `start` without crossing the edge `start-block`.
fn side(g: &LabelledGraph, start: u32, block: u32) -> Vec<u32> {
    let mut seen = vec![false; g.len()];
    seen[start as usize] = true;
    seen[block as usize] = true;
    let mut stack = vec![start];
    let mut out = Vec::new();
    while let Some(v) = stack.pop() {
        out.push(v);
        for &(w, _) in &g.adj[v as usize] {
            if !seen[w as usize] {
                seen[w as usize] = true;
                stack.push(w);
            }
        }
    }
    out
}

/// Proper group order of `g` with the listed vertices given colours of their own.
fn order_with_fixed(g: &LabelledGraph, fixed: &[u32]) -> Result<u128, SearchLimit> {
    let mut g = g.clone();
    let fresh = g.colour.iter().max().map_or(0, |m| m + 1);
    for (i, &v) in fixed.iter().enumerate() {
        g.colour[v as usize] = fresh + i as u32;
    }
    let folded = fold_terminals(&g);
    Ok(proper_group_order(&folded.graph)?.saturating_mul(folded.factor))
}

/// Orbit size of a neighbour of `b = rotor[0]` (other than `a`) under the proper
/// automorphisms that fix the `a` side of the bond pointwise.
fn rotor_orbit(g: &LabelledGraph, a: u32, rotor: &[u32]) -> Result<u128, SearchLimit> {
    let mut keep = rotor.to_vec();
    keep.push(a);
    let frag = g.induced(&keep);
    let (fa, fb) = ((keep.len() - 1) as u32, 0u32);
    let Some(&(n, _)) = frag.adj[fb as usize].iter().find(|e| e.0 != fa) else {
        return Ok(1);
    };
    let whole = order_with_fixed(&frag, &[fa])?;
    let stabilizer = order_with_fixed(&frag, &[fa, n])?;
    Ok(whole.checked_div(stabilizer).unwrap_or(1))
}

/// A rotor found: the bond and its symmetry number.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) struct Rotor {
    pub a: u32,
    pub b: u32,
    pub symmetry: u128,
}

/// Whether the rotor on the `b` side of the bond a-b can be more than 1, judged from the
/// equitable partition `cell_of` of the whole graph (orbits lie inside its cells). The proper
/// rotations about the bond that fix the `a` side act on the other neighbours of `b`: for two
/// neighbours, or three around a stereo unit (a cyclic group), the action is transitive or
/// trivial, so neighbours in different cells mean a rotor of 1. Other cases are searched.
fn may_rotate(g: &LabelledGraph, cell_of: &[u32], a: u32, b: u32) -> bool {
    let others: Vec<u32> = g.adj[b as usize]
        .iter()
        .map(|e| e.0)
        .filter(|&w| w != a)
        .collect();
    match others.len() {
        0 | 1 => false,
        2 => cell_of[others[0] as usize] == cell_of[others[1] as usize],
        3 if g.unit_at[b as usize].is_some() => others
            .iter()
            .all(|&w| cell_of[w as usize] == cell_of[others[0] as usize]),
        _ => true,
    }
}

/// The rotor of the `b` side without a search when every other neighbour of `b` is a terminal
/// atom of one colour on bonds of one colour (methyl, CF3, NH3+): those terminals are permuted
/// freely, so the rotor is their number, or 3 for three of them around a stereo unit (the
/// proper rotations of a tetrahedral centre that fix `a` form a cyclic group of order 3).
fn terminal_rotor(g: &LabelledGraph, a: u32, b: u32) -> Option<u128> {
    let others: Vec<(u32, u8)> = g.adj[b as usize]
        .iter()
        .copied()
        .filter(|e| e.0 != a)
        .collect();
    let (first, bond) = *others.first()?;
    let alike = others.iter().all(|&(w, c)| {
        g.degree(w) == 1 && c == bond && g.colour[w as usize] == g.colour[first as usize]
    });
    if !alike {
        return None;
    }
    match (g.unit_at[b as usize].is_some(), others.len()) {
        (false, k) => Some(k as u128),
        (true, 3) => Some(3),
        _ => None,
    }
}

/// The rotors of `g` with a symmetry number above 1.
pub(crate) fn rotors(g: &LabelledGraph) -> Result<Vec<Rotor>, SearchLimit> {
    let mut partition = Partition::by_colour(g);
    partition.refine(g);
    let cell_of = &partition.cell_of;
    let mut out = Vec::new();
    for (a, b) in bridges(g) {
        if g.bond(a, b) != Some(1) || g.degree(a) < 2 || g.degree(b) < 2 {
            continue;
        }
        let (rotate_b, rotate_a) = (may_rotate(g, cell_of, a, b), may_rotate(g, cell_of, b, a));
        if !rotate_a && !rotate_b {
            continue;
        }
        let side_b = side(g, b, a);
        let side_a = side(g, a, b);
        // Each side that may rotate is searched, the smaller first; the larger orbit counts.
        let mut sides = vec![(a, side_b, rotate_b), (b, side_a, rotate_a)];
        sides.sort_by_key(|s| s.1.len());
        let mut best = 1u128;
        for (anchor, rotor, may) in &sides {
            if *may && best < (g.degree(rotor[0]) as u128).saturating_sub(1) {
                let orbit = match terminal_rotor(g, *anchor, rotor[0]) {
                    Some(k) => k,
                    None => rotor_orbit(g, *anchor, rotor)?,
                };
                best = best.max(orbit);
            }
        }
        if best > 1 {
            out.push(Rotor {
                a,
                b,
                symmetry: best,
            });
        }
    }
    Ok(out)
}
