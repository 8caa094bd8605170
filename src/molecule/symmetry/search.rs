//! Order of the proper-rotation automorphism group by individualization and refinement.
//!
//! The first path of the search tree individualizes, level by level, the first vertex of the
//! first non-singleton cell until the partition is discrete; those vertices are the base
//! `b1, b2, ...`. Working from the deepest level up, the orbit of `b(k+1)` under the
//! stabilizer of `b1..bk` is found: a vertex `w` of the same cell is in the orbit if some leaf
//! below "individualize `w` instead" matches the first leaf by a proper automorphism. Vertices
//! already joined to the base point by automorphisms found so far are skipped (they are in the
//! orbit), as are vertices joined to one already shown not to be. The group order is the
//! product of the orbit sizes (orbit-stabilizer theorem along the stabilizer chain), so the
//! automorphisms are never listed one by one.

use super::labelled::LabelledGraph;
use super::partition::Partition;

/// Refinement calls allowed in one search before it gives up.
const NODE_BUDGET: usize = 200_000;

/// The search ran out of its budget.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) struct SearchLimit;

/// Union-find over vertices for the orbits of the automorphisms found so far.
struct Orbits {
    parent: Vec<u32>,
}

impl Orbits {
    fn new(n: usize) -> Orbits {
        Orbits {
            parent: (0..n as u32).collect(),
        }
    }

    fn find(&mut self, mut v: u32) -> u32 {
        while self.parent[v as usize] != v {
            let up = self.parent[self.parent[v as usize] as usize];
            self.parent[v as usize] = up;
            v = up;
        }
        v
    }

    fn join_by(&mut self, map: &[u32]) {
        for (v, &w) in map.iter().enumerate() {
            let (a, b) = (self.find(v as u32), self.find(w));
            if a != b {
                self.parent[a.max(b) as usize] = a.min(b);
            }
        }
    }
}

/// State shared by the subtree searches of one group-order computation.
struct Search<'a> {
    g: &'a LabelledGraph,
    /// Trace hash of each node of the first path.
    traces: Vec<u64>,
    first_leaf: Vec<u32>,
    calls: usize,
}

impl Search<'_> {
    fn refine(&mut self, p: &mut Partition) -> Result<u64, SearchLimit> {
        self.calls += 1;
        if self.calls > NODE_BUDGET {
            return Err(SearchLimit);
        }
        Ok(p.refine(self.g))
    }

    /// Looks below `node` (at depth `level`) with `w` individualized for a leaf that the first
    /// leaf maps onto by a proper automorphism; returns that automorphism.
    fn find_automorphism(
        &mut self,
        node: &Partition,
        level: usize,
        w: u32,
    ) -> Result<Option<Vec<u32>>, SearchLimit> {
        let mut child = node.clone();
        child.individualize(w);
        let trace = self.refine(&mut child)?;
        if trace != self.traces[level + 1] {
            return Ok(None);
        }
        if child.is_discrete() {
            let mut map = vec![0u32; child.order.len()];
            for (i, &v) in self.first_leaf.iter().enumerate() {
                map[v as usize] = child.order[i];
            }
            let ok = self.g.is_automorphism(&map) && self.g.is_proper(&map);
            return Ok(ok.then_some(map));
        }
        let Some(target) = child.first_nonsingleton() else {
            return Ok(None);
        };
        if level + 2 >= self.traces.len() {
            return Ok(None);
        }
        let candidates = child.cell(target).to_vec();
        for u in candidates {
            if let Some(map) = self.find_automorphism(&child, level + 1, u)? {
                return Ok(Some(map));
            }
        }
        Ok(None)
    }
}

/// Order of the group of automorphisms of `g` that are proper rotations at every stereo
/// unit (saturating at `u128::MAX`).
pub(crate) fn proper_group_order(g: &LabelledGraph) -> Result<u128, SearchLimit> {
    if g.len() == 0 {
        return Ok(1);
    }
    let mut search = Search {
        g,
        traces: Vec::new(),
        first_leaf: Vec::new(),
        calls: 0,
    };
    let mut root = Partition::by_colour(g);
    let t = search.refine(&mut root)?;
    search.traces.push(t);
    let mut path = vec![root];
    let mut base = Vec::new();
    while let Some(target) = path[path.len() - 1].first_nonsingleton() {
        let mut child = path[path.len() - 1].clone();
        let v = child.cell(target)[0];
        child.individualize(v);
        let t = search.refine(&mut child)?;
        search.traces.push(t);
        base.push((v, target));
        path.push(child);
    }
    search.first_leaf = path[path.len() - 1].order.clone();

    let mut orbits = Orbits::new(g.len());
    let mut order: u128 = 1;
    for level in (0..base.len()).rev() {
        let (b, target) = base[level];
        let cell = path[level].cell(target).to_vec();
        let mut failed: Vec<u32> = Vec::new();
        for &w in &cell {
            if w == b || orbits.find(w) == orbits.find(b) {
                continue;
            }
            let root_w = orbits.find(w);
            if failed.iter().any(|&f| orbits.find(f) == root_w) {
                continue;
            }
            match search.find_automorphism(&path[level], level, w)? {
                Some(map) => orbits.join_by(&map),
                None => failed.push(w),
            }
        }
        let root_b = orbits.find(b);
        let size = cell.iter().filter(|&&w| orbits.find(w) == root_b).count();
        order = order.saturating_mul(size as u128);
    }
    Ok(order)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn cycle(n: u32) -> LabelledGraph {
        let mut g = LabelledGraph::default();
        for _ in 0..n {
            g.add_vertex(0);
        }
        for i in 0..n {
            g.add_edge(i, (i + 1) % n, 1);
        }
        g.finish();
        g
    }

    /// The dihedral group of an n-cycle has order 2n (common practice).
    #[test]
    fn cycles_have_dihedral_groups() {
        for n in 3..9 {
            assert_eq!(proper_group_order(&cycle(n)), Ok(2 * n as u128));
        }
    }
}
