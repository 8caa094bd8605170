//! A representative configuration for unwritten ring stereocentres, from oriented ring faces.
//!
//! When the input leaves the configuration of equivalent ring centres open (the bridgeheads
//! of cubane or adamantane, which the cage forces, or the substituents of
//! 1,3,5-trimethylcyclohexane, which it does not), the tool must still give each centre a
//! handedness, and these must be mutually consistent or a symmetric molecule loses its
//! symmetry. The rings of each ring system are oriented coherently, like the faces of a
//! surface (a bond shared by two rings is walked in opposite directions). Seen from "above"
//! (the side of the first exocyclic neighbour), a ring atom's ring neighbours then follow the
//! faces anticlockwise, which puts every exocyclic substituent of the same kind on the same
//! face: all outward in a cage, all cis in a flat ring. A ring system whose rings cannot be
//! oriented coherently is left out.

use std::collections::{HashMap, VecDeque};

/// For each atom, the (previous, next) ring neighbours along each oriented ring through it.
pub(crate) fn oriented_ring_steps(rings: &[Vec<u32>], atoms: usize) -> Vec<Vec<(u32, u32)>> {
    let mut by_bond: HashMap<(u32, u32), Vec<usize>> = HashMap::new();
    for (i, ring) in rings.iter().enumerate() {
        for k in 0..ring.len() {
            let (a, b) = (ring[k], ring[(k + 1) % ring.len()]);
            by_bond.entry((a.min(b), a.max(b))).or_default().push(i);
        }
    }
    // Whether ring i walks the bond a -> b as stored.
    let walks = |i: usize, a: u32, b: u32| -> bool {
        let r = &rings[i];
        (0..r.len()).any(|k| r[k] == a && r[(k + 1) % r.len()] == b)
    };
    let mut forward: Vec<Option<bool>> = vec![None; rings.len()];
    let mut system: Vec<usize> = vec![usize::MAX; rings.len()];
    let mut broken: Vec<bool> = Vec::new();
    for start in 0..rings.len() {
        if forward[start].is_some() {
            continue;
        }
        let id = broken.len();
        broken.push(false);
        forward[start] = Some(true);
        system[start] = id;
        let mut queue = VecDeque::from([start]);
        while let Some(i) = queue.pop_front() {
            let r = &rings[i];
            let fwd = forward[i].unwrap_or(true);
            for k in 0..r.len() {
                let (mut a, mut b) = (r[k], r[(k + 1) % r.len()]);
                if !fwd {
                    std::mem::swap(&mut a, &mut b);
                }
                for &j in by_bond.get(&(a.min(b), a.max(b))).into_iter().flatten() {
                    if j == i {
                        continue;
                    }
                    // Ring j must walk b -> a.
                    let wanted = walks(j, b, a);
                    match forward[j] {
                        None => {
                            forward[j] = Some(wanted);
                            system[j] = id;
                            queue.push_back(j);
                        }
                        Some(f) if f != wanted => broken[id] = true,
                        Some(_) => {}
                    }
                }
            }
        }
    }
    let mut steps = vec![Vec::new(); atoms];
    for (i, ring) in rings.iter().enumerate() {
        if broken[system[i]] {
            continue;
        }
        let len = ring.len();
        for k in 0..len {
            let (prev, here, next) = (ring[(k + len - 1) % len], ring[k], ring[(k + 1) % len]);
            let step = if forward[i] == Some(false) {
                (next, prev)
            } else {
                (prev, next)
            };
            steps[here as usize].push(step);
        }
    }
    steps
}

/// References of a ring centre in SMILES `@` order (seen from the first, the rest
/// anticlockwise), from its oriented ring steps and its exocyclic neighbours in preference
/// order; `None` when the faces do not fix an order.
pub(crate) fn ring_centre_refs(steps: &[(u32, u32)], exocyclic: &[u32]) -> Option<Vec<u32>> {
    let succ = |x: u32| -> Option<u32> {
        let mut found = steps.iter().filter(|s| s.0 == x).map(|s| s.1);
        let first = found.next()?;
        found.all(|y| y == first).then_some(first)
    };
    let mut ring: Vec<u32> = steps.iter().flat_map(|s| [s.0, s.1]).collect();
    ring.sort_unstable();
    ring.dedup();
    match (ring.len(), exocyclic) {
        (3, &[x]) => {
            let a = steps[0].0;
            let b = succ(a)?;
            let c = ring.iter().copied().find(|&y| y != a && y != b)?;
            if succ(b).is_some_and(|y| y != c) || succ(c).is_some_and(|y| y != a) {
                return None;
            }
            Some(vec![x, a, b, c])
        }
        (2, &[x, y]) => {
            let (p, n) = steps[0];
            steps.iter().all(|&s| s == (p, n)).then(|| vec![x, p, n, y])
        }
        _ => None,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Two squares sharing the bond 1-2 are walked in opposite directions across it.
    #[test]
    fn fused_rings_orient_coherently() {
        let rings = vec![vec![0, 1, 2, 3], vec![1, 4, 5, 2]];
        let steps = oriented_ring_steps(&rings, 6);
        // Ring 0 walks 1 -> 2, so ring 1 must walk 2 -> 1: at atom 1, previous is 2.
        assert!(steps[1].contains(&(0, 2)));
        assert!(steps[1].contains(&(2, 4)));
    }
}
