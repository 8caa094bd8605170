//! Perfect matching on a general graph: a greedy start that takes forced pairs first, then
//! Edmonds' blossom algorithm (J. Edmonds, Canad. J. Math. 17 (1965) 449) for what is left.
//! Everything is iterative; the work arrays are allocated only when the greedy start fails.

use std::collections::VecDeque;

/// No vertex.
const NONE: usize = usize::MAX;

/// An undirected graph on vertices `0..n` in compressed adjacency form.
pub(super) struct Adjacency {
    offsets: Vec<usize>,
    targets: Vec<usize>,
}

impl Adjacency {
    /// Builds the adjacency of `n` vertices from undirected `edges`.
    pub(super) fn new(n: usize, edges: &[(usize, usize)]) -> Adjacency {
        let mut offsets = vec![0usize; n + 1];
        for &(a, b) in edges {
            offsets[a + 1] += 1;
            offsets[b + 1] += 1;
        }
        for i in 0..n {
            offsets[i + 1] += offsets[i];
        }
        let mut fill = offsets.clone();
        let mut targets = vec![0usize; offsets[n]];
        for &(a, b) in edges {
            targets[fill[a]] = b;
            fill[a] += 1;
            targets[fill[b]] = a;
            fill[b] += 1;
        }
        Adjacency { offsets, targets }
    }

    fn len(&self) -> usize {
        self.offsets.len() - 1
    }

    fn neighbours(&self, v: usize) -> &[usize] {
        &self.targets[self.offsets[v]..self.offsets[v + 1]]
    }
}

/// A perfect matching (`mate[v]` for every vertex), or a vertex that no perfect matching
/// can cover.
pub(super) fn perfect_matching(adj: &Adjacency) -> Result<Vec<usize>, usize> {
    let mut mate = greedy(adj);
    let Some(first_free) = mate.iter().position(|&m| m == NONE) else {
        return Ok(mate);
    };
    let mut search = Blossoms::new(adj, &mut mate);
    for v in first_free..adj.len() {
        if search.mate[v] == NONE {
            let leaf = search.augmenting_path(v).ok_or(v)?;
            search.augment(leaf);
        }
    }
    Ok(mate)
}

/// Greedy matching: vertices with a single free neighbour are paired first (their choice is
/// forced), then any free vertex with its least-connected free neighbour.
fn greedy(adj: &Adjacency) -> Vec<usize> {
    let n = adj.len();
    let mut mate = vec![NONE; n];
    let mut free_degree: Vec<usize> = (0..n).map(|v| adj.neighbours(v).len()).collect();
    let mut forced: Vec<usize> = (0..n).filter(|&v| free_degree[v] == 1).collect();
    let mut scan = 0;
    loop {
        let v = if let Some(v) = forced.pop() {
            v
        } else {
            while scan < n && (mate[scan] != NONE || free_degree[scan] == 0) {
                scan += 1;
            }
            if scan == n {
                break;
            }
            scan
        };
        if mate[v] != NONE {
            continue;
        }
        let partner = adj
            .neighbours(v)
            .iter()
            .copied()
            .filter(|&u| mate[u] == NONE)
            .min_by_key(|&u| free_degree[u]);
        let Some(u) = partner else {
            free_degree[v] = 0;
            continue;
        };
        mate[v] = u;
        mate[u] = v;
        for &w in adj.neighbours(v).iter().chain(adj.neighbours(u)) {
            if mate[w] == NONE {
                free_degree[w] = free_degree[w].saturating_sub(1);
                if free_degree[w] == 1 {
                    forced.push(w);
                }
            }
        }
    }
    mate
}

/// Work arrays of the blossom search.
struct Blossoms<'a> {
    adj: &'a Adjacency,
    mate: &'a mut [usize],
    parent: Vec<usize>,
    base: Vec<usize>,
    used: Vec<bool>,
    in_blossom: Vec<bool>,
    on_path: Vec<bool>,
    queue: VecDeque<usize>,
}

impl<'a> Blossoms<'a> {
    fn new(adj: &'a Adjacency, mate: &'a mut [usize]) -> Blossoms<'a> {
        let n = adj.len();
        Blossoms {
            adj,
            mate,
            parent: vec![NONE; n],
            base: (0..n).collect(),
            used: vec![false; n],
            in_blossom: vec![false; n],
            on_path: vec![false; n],
            queue: VecDeque::new(),
        }
    }

    /// Breadth-first search for an augmenting path from the free vertex `root`, shrinking
    /// odd cycles (blossoms) into their base as they appear. Returns the free vertex that
    /// ends the path.
    fn augmenting_path(&mut self, root: usize) -> Option<usize> {
        self.used.fill(false);
        self.parent.fill(NONE);
        for (i, b) in self.base.iter_mut().enumerate() {
            *b = i;
        }
        self.used[root] = true;
        self.queue.clear();
        self.queue.push_back(root);
        let adj = self.adj;
        while let Some(v) = self.queue.pop_front() {
            for &to in adj.neighbours(v) {
                if self.base[v] == self.base[to] || self.mate[v] == to {
                    continue;
                }
                let to_is_outer =
                    to == root || (self.mate[to] != NONE && self.parent[self.mate[to]] != NONE);
                if to_is_outer {
                    self.shrink(v, to);
                } else if self.parent[to] == NONE {
                    self.parent[to] = v;
                    if self.mate[to] == NONE {
                        return Some(to);
                    }
                    let next = self.mate[to];
                    self.used[next] = true;
                    self.queue.push_back(next);
                }
            }
        }
        None
    }

    /// Shrinks the blossom closed by the edge `v`-`to` into its base.
    fn shrink(&mut self, v: usize, to: usize) {
        let common = self.common_base(v, to);
        self.in_blossom.fill(false);
        self.mark_path(v, common, to);
        self.mark_path(to, common, v);
        for i in 0..self.base.len() {
            if self.in_blossom[self.base[i]] {
                self.base[i] = common;
                if !self.used[i] {
                    self.used[i] = true;
                    self.queue.push_back(i);
                }
            }
        }
    }

    /// The base where the alternating paths from `a` and `b` to the root first meet.
    fn common_base(&mut self, mut a: usize, mut b: usize) -> usize {
        self.on_path.fill(false);
        loop {
            a = self.base[a];
            self.on_path[a] = true;
            if self.mate[a] == NONE {
                break;
            }
            a = self.parent[self.mate[a]];
        }
        loop {
            b = self.base[b];
            if self.on_path[b] {
                return b;
            }
            b = self.parent[self.mate[b]];
        }
    }

    /// Marks the blossom vertices on the path from `v` down to base `b`, pointing parents
    /// across the closing edge so the path can be walked either way round the cycle.
    fn mark_path(&mut self, mut v: usize, b: usize, mut child: usize) {
        while self.base[v] != b {
            let m = self.mate[v];
            self.in_blossom[self.base[v]] = true;
            self.in_blossom[self.base[m]] = true;
            self.parent[v] = child;
            child = m;
            v = self.parent[m];
        }
    }

    /// Flips matched and unmatched edges along the path ending at the free vertex `leaf`.
    fn augment(&mut self, leaf: usize) {
        let mut v = leaf;
        while v != NONE {
            let pv = self.parent[v];
            let next = self.mate[pv];
            self.mate[v] = pv;
            self.mate[pv] = v;
            v = next;
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn check(n: usize, edges: &[(usize, usize)]) -> Result<Vec<usize>, usize> {
        let adj = Adjacency::new(n, edges);
        let result = perfect_matching(&adj);
        if let Ok(mate) = &result {
            for v in 0..n {
                assert_ne!(mate[v], NONE);
                assert_eq!(mate[mate[v]], v);
                assert!(adj.neighbours(v).contains(&mate[v]));
            }
        }
        result
    }

    #[test]
    fn even_cycle_and_odd_cycle() {
        let ring = |n: usize| (0..n).map(|i| (i, (i + 1) % n)).collect::<Vec<_>>();
        assert!(check(6, &ring(6)).is_ok());
        assert!(check(5, &ring(5)).is_err());
    }

    #[test]
    fn needs_a_blossom() {
        // A triangle 0-1-2 with tails 2-3 and 0-4-5; a greedy start of 0-1 and 2-3 leaves
        // 4 and 5 free only if it pairs badly. The matching must still be found.
        let edges = [
            (0, 1),
            (1, 2),
            (2, 0),
            (2, 3),
            (0, 4),
            (4, 5),
            (1, 6),
            (6, 7),
        ];
        assert!(check(8, &edges).is_ok());
        // Petersen-like odd structure: two triangles joined by one edge plus a pendant pair.
        let edges = [(0, 1), (1, 2), (2, 0), (3, 4), (4, 5), (5, 3), (2, 3)];
        assert!(check(6, &edges).is_ok());
    }

    /// `count` small random graphs (2 to 12 vertices) drawn by a fixed linear congruential
    /// sequence (common practice for reproducible test inputs).
    fn random_graphs(mut seed: u64, count: usize) -> Vec<(usize, Vec<(usize, usize)>)> {
        let mut next = || {
            seed = seed
                .wrapping_mul(6364136223846793005)
                .wrapping_add(1442695040888963407);
            (seed >> 33) as usize
        };
        (0..count)
            .map(|_| {
                let n = 2 + next() % 11;
                let density = 2 + next() % 4;
                let mut edges = Vec::new();
                for a in 0..n {
                    for b in a + 1..n {
                        if next() % density == 0 {
                            edges.push((a, b));
                        }
                    }
                }
                (n, edges)
            })
            .collect()
    }

    #[test]
    fn augmenting_through_blossoms_on_random_graphs() {
        // Compare with brute force on small random graphs.
        for (n, edges) in random_graphs(12345, 3000) {
            let found = check(n, &edges).is_ok();
            assert_eq!(found, brute_force_perfect(n, &edges), "{n} {edges:?}");
        }
    }

    #[test]
    fn blossom_search_alone_finds_maximum_matchings() {
        // Edmonds' search from an empty matching (no greedy start), against brute force.
        for (n, edges) in random_graphs(987654321, 3000) {
            let adj = Adjacency::new(n, &edges);
            let mut mate = vec![NONE; n];
            let mut search = Blossoms::new(&adj, &mut mate);
            for v in 0..n {
                if search.mate[v] == NONE {
                    if let Some(leaf) = search.augmenting_path(v) {
                        search.augment(leaf);
                    }
                }
            }
            for v in 0..n {
                if mate[v] != NONE {
                    assert_eq!(mate[mate[v]], v);
                    assert!(adj.neighbours(v).contains(&mate[v]));
                }
            }
            let size = mate.iter().filter(|&&m| m != NONE).count() / 2;
            assert_eq!(size, brute_force_maximum(0, &edges), "{n} {edges:?}");
        }
    }

    fn brute_force_maximum(covered: u32, edges: &[(usize, usize)]) -> usize {
        let Some((&(a, b), rest)) = edges.split_first() else {
            return 0;
        };
        let skip = brute_force_maximum(covered, rest);
        if covered & (1 << a | 1 << b) == 0 {
            skip.max(1 + brute_force_maximum(covered | 1 << a | 1 << b, rest))
        } else {
            skip
        }
    }

    fn brute_force_perfect(n: usize, edges: &[(usize, usize)]) -> bool {
        fn go(covered: u32, n: usize, edges: &[(usize, usize)]) -> bool {
            let Some(v) = (0..n).find(|&v| covered & (1 << v) == 0) else {
                return true;
            };
            edges.iter().any(|&(a, b)| {
                let u = if a == v {
                    b
                } else if b == v {
                    a
                } else {
                    return false;
                };
                covered & (1 << u) == 0 && go(covered | 1 << v | 1 << u, n, edges)
            })
        }
        go(0, n, edges)
    }
}
