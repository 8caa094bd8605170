//! Ordered vertex partitions and their refinement to an equitable, stereo-split partition.
//!
//! Refinement alternates two steps until nothing changes: split every cell by the multiset of
//! (neighbour cell, bond colour) of its vertices (colour refinement), then split every cell by
//! the handedness of the stereo unit at its vertices, where that handedness is already fixed
//! by the partition (all references in different cells). Pieces of a split are ordered by
//! their key, so the result depends only on the partition and the graph: a proper
//! automorphism that maps one ordered partition onto another maps their refinements too.
//! Each split is folded into a trace hash; two search paths with different traces cannot be
//! related by a proper automorphism.

use super::labelled::{inversions, LabelledGraph};

/// An ordered partition of the vertices into contiguous cells of `order`.
#[derive(Debug, Clone)]
pub(crate) struct Partition {
    /// Vertices in cell order.
    pub order: Vec<u32>,
    /// Position of each vertex in `order`.
    pos: Vec<u32>,
    /// Start position of the cell of each vertex.
    pub cell_of: Vec<u32>,
    /// Cell length, valid at cell start positions.
    cell_len: Vec<u32>,
    /// Number of cells.
    pub cells: usize,
}

/// A 64-bit mixing function (the finaliser of SplitMix64; common practice for hashing).
pub(crate) fn mix(mut x: u64) -> u64 {
    x = x.wrapping_add(0x9E37_79B9_7F4A_7C15);
    x = (x ^ (x >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
    x = (x ^ (x >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
    x ^ (x >> 31)
}

impl Partition {
    /// The partition of `g`'s vertices by colour, cells in increasing colour order.
    pub fn by_colour(g: &LabelledGraph) -> Partition {
        let keys: Vec<u64> = g.colour.iter().map(|&c| c as u64).collect();
        let mut p = Partition {
            order: (0..g.len() as u32).collect(),
            pos: (0..g.len() as u32).collect(),
            cell_of: vec![0; g.len()],
            cell_len: vec![0; g.len()],
            cells: usize::from(!g.colour.is_empty()),
        };
        if let Some(first) = p.cell_len.first_mut() {
            *first = g.len() as u32;
        }
        let mut trace = 0;
        p.split_all(&keys, &mut trace);
        p
    }

    /// Whether every cell is a single vertex.
    pub fn is_discrete(&self) -> bool {
        self.cells == self.order.len()
    }

    /// Vertices of the cell starting at `start`.
    pub fn cell(&self, start: usize) -> &[u32] {
        &self.order[start..start + self.cell_len[start] as usize]
    }

    /// Start of the first cell with more than one vertex.
    pub fn first_nonsingleton(&self) -> Option<usize> {
        let mut s = 0;
        while s < self.order.len() {
            let len = self.cell_len[s] as usize;
            if len > 1 {
                return Some(s);
            }
            s += len.max(1);
        }
        None
    }

    /// Makes `v` a singleton cell at the front of its cell.
    pub fn individualize(&mut self, v: u32) {
        let start = self.cell_of[v as usize] as usize;
        let len = self.cell_len[start] as usize;
        if len < 2 {
            return;
        }
        let at = self.pos[v as usize] as usize;
        let other = self.order[start];
        self.order.swap(start, at);
        self.pos[other as usize] = at as u32;
        self.pos[v as usize] = start as u32;
        self.cell_len[start] = 1;
        self.cell_len[start + 1] = (len - 1) as u32;
        for &w in &self.order[start + 1..start + len] {
            self.cell_of[w as usize] = (start + 1) as u32;
        }
        self.cells += 1;
    }

    /// Splits every cell by `key` (pieces in increasing key order); returns whether any split.
    fn split_all(&mut self, key: &[u64], trace: &mut u64) -> bool {
        let mut changed = false;
        let mut start = 0;
        let n = self.order.len();
        let mut buf: Vec<(u64, u32)> = Vec::new();
        while start < n {
            let len = self.cell_len[start] as usize;
            if len > 1 {
                let cell = &self.order[start..start + len];
                let k0 = key[cell[0] as usize];
                if cell.iter().any(|&v| key[v as usize] != k0) {
                    buf.clear();
                    buf.extend(cell.iter().map(|&v| (key[v as usize], v)));
                    buf.sort_unstable();
                    let mut piece = start;
                    for (i, &(k, v)) in buf.iter().enumerate() {
                        let at = start + i;
                        self.order[at] = v;
                        self.pos[v as usize] = at as u32;
                        if i > 0 && k != buf[i - 1].0 {
                            self.cell_len[piece] = (at - piece) as u32;
                            *trace = mix(*trace ^ mix(piece as u64 ^ (buf[i - 1].0 << 20)));
                            piece = at;
                            self.cells += 1;
                        }
                        self.cell_of[v as usize] = piece as u32;
                    }
                    self.cell_len[piece] = (start + len - piece) as u32;
                    *trace = mix(*trace ^ mix(piece as u64 ^ (buf[len - 1].0 << 20)));
                    changed = true;
                }
            }
            start += len.max(1);
        }
        changed
    }

    /// Handedness of the unit at `v` under this partition: 1 or 2 when all its references are
    /// in different cells (by the parity of their cell order), 0 otherwise.
    fn handedness(&self, g: &LabelledGraph, v: u32) -> u64 {
        let Some(u) = g.unit_at[v as usize] else {
            return 0;
        };
        let cells: Vec<u32> = g.units[u as usize]
            .refs
            .iter()
            .map(|&r| self.cell_of[r as usize])
            .collect();
        for i in 0..cells.len() {
            if cells[i + 1..].contains(&cells[i]) {
                return 0;
            }
        }
        1 + (inversions(&cells) % 2) as u64
    }

    /// Refines to the coarsest equitable partition that is also split by fixed handedness,
    /// and returns the trace hash of the refinement.
    pub fn refine(&mut self, g: &LabelledGraph) -> u64 {
        let mut trace = self.cells as u64;
        let n = self.order.len();
        let mut key = vec![0u64; n];
        loop {
            loop {
                for (k, list) in key.iter_mut().zip(&g.adj) {
                    *k = list.iter().fold(0u64, |acc, &(w, c)| {
                        acc.wrapping_add(mix(((self.cell_of[w as usize] as u64) << 8) | c as u64))
                    });
                }
                if !self.split_all(&key, &mut trace) {
                    break;
                }
            }
            if g.units.is_empty() {
                break;
            }
            for (v, k) in key.iter_mut().enumerate() {
                *k = self.handedness(g, v as u32);
            }
            if !self.split_all(&key, &mut trace) {
                break;
            }
        }
        for (v, &u) in g.unit_at.iter().enumerate() {
            if u.is_some() {
                let h = self.handedness(g, v as u32);
                trace = trace.wrapping_add(mix(((self.cell_of[v] as u64) << 2) | h));
            }
        }
        mix(trace ^ self.cells as u64)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A path a-b-c of one colour: refinement separates the middle vertex.
    #[test]
    fn path_of_three_splits_the_middle() {
        let mut g = LabelledGraph::default();
        for _ in 0..3 {
            g.add_vertex(0);
        }
        g.add_edge(0, 1, 1);
        g.add_edge(1, 2, 1);
        g.finish();
        let mut p = Partition::by_colour(&g);
        p.refine(&g);
        assert_eq!(p.cells, 2);
        assert_ne!(p.cell_of[0], p.cell_of[1]);
        assert_eq!(p.cell_of[0], p.cell_of[2]);
    }
}
