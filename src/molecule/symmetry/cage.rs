//! Orientation of closed polyhedral cages (fullerenes) from the graph alone.
//!
//! In a cage where every atom has three neighbours, a mirror image permutes the atoms in a
//! way no rotation does, yet nothing tetrahedral tells them apart. What does is the cyclic
//! order of the three neighbours seen from outside. Faces are traced as in a rotation system:
//! arriving at `w` from `v`, a face leaves `w` towards the neighbour after `v` in `w`'s cyclic
//! order. Starting from an arbitrary order at one atom, the face through `u -> v -> w` is
//! taken to be the shortest cycle through that path (true for fullerenes, whose only 5- and
//! 6-cycles are faces); its next vertex fixes the order at `w`. Orders are propagated
//! breadth first and checked for consistency; an inconsistent cage yields no orientation.

use std::collections::VecDeque;

use super::labelled::LabelledGraph;

/// The vertex after `w` on a shortest path from `w` to `u` that avoids `v`.
fn step_towards(g: &LabelledGraph, w: u32, u: u32, v: u32) -> Option<u32> {
    let n = g.len();
    let mut parent = vec![u32::MAX; n];
    let mut queue = VecDeque::from([u]);
    parent[u as usize] = u;
    parent[v as usize] = v;
    while let Some(x) = queue.pop_front() {
        for &(y, _) in &g.adj[x as usize] {
            if parent[y as usize] == u32::MAX {
                parent[y as usize] = x;
                if y == w {
                    return Some(x);
                }
                queue.push_back(y);
            }
        }
    }
    None
}

/// Whether `(a, b, c)` is a cyclic rotation of `order`.
fn same_cycle(order: [u32; 3], a: u32, b: u32) -> bool {
    (0..3).any(|i| order[i] == a && order[(i + 1) % 3] == b)
}

/// Cyclic neighbour orders for the component of `start`, in which every vertex has degree 3;
/// `None` if the faces found do not fit together into an oriented surface.
pub(crate) fn orient_cage(g: &LabelledGraph, start: u32) -> Option<Vec<(u32, [u32; 3])>> {
    let mut rotation: Vec<Option<[u32; 3]>> = vec![None; g.len()];
    let first = &g.adj[start as usize];
    rotation[start as usize] = Some([first[0].0, first[1].0, first[2].0]);
    let mut queue = VecDeque::from([start]);
    let mut found = Vec::new();
    while let Some(v) = queue.pop_front() {
        let order = rotation[v as usize]?;
        found.push((v, order));
        for i in 0..3 {
            let (u, w) = (order[(i + 2) % 3], order[i]);
            let x = step_towards(g, w, u, v)?;
            let others: Vec<u32> = g.adj[w as usize]
                .iter()
                .map(|e| e.0)
                .filter(|&y| y != v && y != x)
                .collect();
            let [third] = others[..] else {
                return None;
            };
            let wanted = [v, x, third];
            match rotation[w as usize] {
                None => {
                    rotation[w as usize] = Some(wanted);
                    queue.push_back(w);
                }
                Some(existing) => {
                    if !same_cycle(existing, v, x) {
                        return None;
                    }
                }
            }
        }
    }
    Some(found)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The cube graph (three-connected, all degree 3) orients consistently.
    #[test]
    fn cube_orients() {
        let mut g = LabelledGraph::default();
        for _ in 0..8 {
            g.add_vertex(0);
        }
        for v in 0..8u32 {
            for bit in [1, 2, 4] {
                let w = v ^ bit;
                if v < w {
                    g.add_edge(v, w, 1);
                }
            }
        }
        g.finish();
        let found = orient_cage(&g, 0).map(|f| f.len());
        assert_eq!(found, Some(8));
    }
}
