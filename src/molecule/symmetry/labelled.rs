//! The coloured, hydrogen-explicit graph the symmetry search works on, with its stereo units.
//!
//! A stereo unit is an ordered tuple of reference vertices around an anchor (an atom or a
//! double bond). A permutation of the vertices is a proper rotation at a unit when it carries
//! the unit's references onto the references of the image unit by an even permutation; it is
//! a reflection there when the permutation is odd. Tetrahedral centres (four references),
//! polyhedral cage atoms (three references in their cyclic order) and double bonds or
//! cumulenes (two references on each end, the first of each end on the same side) all follow
//! this one rule: the even permutations of the references are exactly the rotations.

/// Where a stereo unit sits.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Anchor {
    /// A tetrahedral (or pyramidal) centre, or a polyhedral cage atom.
    Atom(u32),
    /// The two ends of a double bond or of a cumulene chain.
    Bond(u32, u32),
}

/// What kind of stereo element a unit stands for.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum UnitKind {
    /// Four-connected atom (sp3 carbon, silicon, ammonium, sulfone sulfur, ...).
    Tetrahedral,
    /// Three-connected nitrogen or similar with a lone pair as fourth reference; it inverts
    /// quickly at room temperature, so it never makes a molecule chiral on its own.
    InvertingPyramid,
    /// Three-connected atom with a lone pair that does not invert quickly (sulfoxide S, P).
    StablePyramid,
    /// Double bond or cumulene with an odd number of double bonds (cis/trans). The molecule is
    /// flat there, so a reflection keeps the arrangement: the mirror image leaves it alone.
    DoubleBond,
    /// Cumulene with an even number of double bonds (allene): axial, handed like a centre.
    Axial,
    /// Atom of a closed polyhedral cage (fullerene): cyclic order of its three neighbours.
    Cage,
}

/// One stereo unit: anchor, ordered references, and whether the input wrote its configuration.
#[derive(Debug, Clone, PartialEq, Eq)]
pub(crate) struct StereoUnit {
    pub anchor: Anchor,
    pub refs: Vec<u32>,
    pub kind: UnitKind,
    pub specified: bool,
}

/// A vertex- and edge-coloured graph with stereo units.
#[derive(Debug, Clone, Default)]
pub(crate) struct LabelledGraph {
    /// Vertex colour; equal colours mean interchangeable vertex labels.
    pub colour: Vec<u32>,
    /// Neighbours with the bond colour, sorted by neighbour.
    pub adj: Vec<Vec<(u32, u8)>>,
    pub units: Vec<StereoUnit>,
    /// The unit anchored at (or with an end at) each vertex.
    pub unit_at: Vec<Option<u32>>,
}

impl LabelledGraph {
    /// Number of vertices.
    pub fn len(&self) -> usize {
        self.colour.len()
    }

    /// Degree of `v`.
    pub fn degree(&self, v: u32) -> usize {
        self.adj[v as usize].len()
    }

    /// Bond colour between `a` and `b`, if bonded.
    pub fn bond(&self, a: u32, b: u32) -> Option<u8> {
        let list = &self.adj[a as usize];
        list.binary_search_by_key(&b, |&(n, _)| n)
            .ok()
            .map(|i| list[i].1)
    }

    /// Adds an edge both ways (lists are sorted later by [`LabelledGraph::finish`]).
    pub fn add_edge(&mut self, a: u32, b: u32, colour: u8) {
        self.adj[a as usize].push((b, colour));
        self.adj[b as usize].push((a, colour));
    }

    /// Adds a vertex and returns its index.
    pub fn add_vertex(&mut self, colour: u32) -> u32 {
        self.colour.push(colour);
        self.adj.push(Vec::new());
        self.unit_at.push(None);
        (self.colour.len() - 1) as u32
    }

    /// Sorts adjacency lists and rebuilds `unit_at` from `units`.
    pub fn finish(&mut self) {
        for list in &mut self.adj {
            list.sort_unstable();
            list.dedup_by_key(|e| e.0);
        }
        self.unit_at = vec![None; self.len()];
        for (i, u) in self.units.iter().enumerate() {
            match u.anchor {
                Anchor::Atom(a) => self.unit_at[a as usize] = Some(i as u32),
                Anchor::Bond(a, b) => {
                    self.unit_at[a as usize] = Some(i as u32);
                    self.unit_at[b as usize] = Some(i as u32);
                }
            }
        }
    }

    /// The unit at the image of `unit`'s anchor under `map`, if it is the same kind of anchor.
    fn image_unit(&self, unit: &StereoUnit, map: &[u32]) -> Option<&StereoUnit> {
        match unit.anchor {
            Anchor::Atom(a) => {
                let image = self.unit_at[map[a as usize] as usize]?;
                let u = &self.units[image as usize];
                matches!(u.anchor, Anchor::Atom(x) if x == map[a as usize]).then_some(u)
            }
            Anchor::Bond(a, b) => {
                let (ia, ib) = (map[a as usize], map[b as usize]);
                let image = self.unit_at[ia as usize]?;
                let u = &self.units[image as usize];
                let same = matches!(u.anchor, Anchor::Bond(x, y)
                    if (x == ia && y == ib) || (x == ib && y == ia));
                same.then_some(u)
            }
        }
    }

    /// Whether the vertex map `map` (an automorphism of the coloured graph) is a proper
    /// rotation at every stereo unit.
    pub fn is_proper(&self, map: &[u32]) -> bool {
        self.units.iter().all(|u| {
            self.image_unit(u, map).is_some_and(|image| {
                let mapped: Vec<u32> = u.refs.iter().map(|&r| map[r as usize]).collect();
                relative_parity(&mapped, &image.refs) == Some(true)
            })
        })
    }

    /// Whether `map` is an automorphism of the coloured graph (colours and bonds kept).
    pub fn is_automorphism(&self, map: &[u32]) -> bool {
        (0..self.len()).all(|v| {
            let w = map[v] as usize;
            self.colour[v] == self.colour[w]
                && self.adj[v].len() == self.adj[w].len()
                && self.adj[v]
                    .iter()
                    .all(|&(n, c)| self.bond(w as u32, map[n as usize]) == Some(c))
        })
    }

    /// The mirror image: every handed unit's first two references swapped (cis/trans units
    /// are their own mirror image).
    pub fn mirrored(&self) -> LabelledGraph {
        let mut m = self.clone();
        for u in &mut m.units {
            if u.kind != UnitKind::DoubleBond {
                u.refs.swap(0, 1);
            }
        }
        m
    }

    /// The disjoint union of `self` and `other` (vertices of `other` shifted up).
    pub fn disjoint_union(&self, other: &LabelledGraph) -> LabelledGraph {
        let shift = self.len() as u32;
        let mut g = self.clone();
        g.colour.extend_from_slice(&other.colour);
        g.adj.extend(other.adj.iter().map(|list| {
            list.iter()
                .map(|&(n, c)| (n + shift, c))
                .collect::<Vec<_>>()
        }));
        g.units.extend(other.units.iter().map(|u| StereoUnit {
            anchor: match u.anchor {
                Anchor::Atom(a) => Anchor::Atom(a + shift),
                Anchor::Bond(a, b) => Anchor::Bond(a + shift, b + shift),
            },
            refs: u.refs.iter().map(|r| r + shift).collect(),
            kind: u.kind,
            specified: u.specified,
        }));
        g.finish();
        g
    }

    /// The subgraph on `keep` (in that order), with the units whose anchor and references all
    /// lie inside it.
    pub fn induced(&self, keep: &[u32]) -> LabelledGraph {
        let mut index = vec![u32::MAX; self.len()];
        for (i, &v) in keep.iter().enumerate() {
            index[v as usize] = i as u32;
        }
        let inside = |v: u32| index[v as usize] != u32::MAX;
        let mut g = LabelledGraph::default();
        for &v in keep {
            g.add_vertex(self.colour[v as usize]);
        }
        for (i, &v) in keep.iter().enumerate() {
            for &(n, c) in &self.adj[v as usize] {
                if inside(n) {
                    g.adj[i].push((index[n as usize], c));
                }
            }
        }
        for u in &self.units {
            let anchor_inside = match u.anchor {
                Anchor::Atom(a) => inside(a),
                Anchor::Bond(a, b) => inside(a) && inside(b),
            };
            if anchor_inside && u.refs.iter().all(|&r| inside(r)) {
                g.units.push(StereoUnit {
                    anchor: match u.anchor {
                        Anchor::Atom(a) => Anchor::Atom(index[a as usize]),
                        Anchor::Bond(a, b) => Anchor::Bond(index[a as usize], index[b as usize]),
                    },
                    refs: u.refs.iter().map(|&r| index[r as usize]).collect(),
                    kind: u.kind,
                    specified: u.specified,
                });
            }
        }
        g.finish();
        g
    }
}

/// `Some(true)` if `b` is an even permutation of `a`, `Some(false)` if odd, `None` if the two
/// are not permutations of each other.
pub(crate) fn relative_parity(a: &[u32], b: &[u32]) -> Option<bool> {
    if a.len() != b.len() {
        return None;
    }
    let mut positions = Vec::with_capacity(a.len());
    for x in a {
        positions.push(b.iter().position(|y| y == x)?);
    }
    Some(inversions(&positions) % 2 == 0)
}

/// Number of inversions of a short sequence (strict comparison; ties count as none).
pub(crate) fn inversions<T: PartialOrd>(seq: &[T]) -> usize {
    let mut count = 0;
    for i in 0..seq.len() {
        for j in i + 1..seq.len() {
            if seq[i] > seq[j] {
                count += 1;
            }
        }
    }
    count
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn parity_of_short_permutations() {
        assert_eq!(relative_parity(&[1, 2, 3, 4], &[1, 2, 3, 4]), Some(true));
        assert_eq!(relative_parity(&[1, 2, 3, 4], &[2, 1, 3, 4]), Some(false));
        assert_eq!(relative_parity(&[1, 2, 3], &[2, 3, 1]), Some(true));
        assert_eq!(relative_parity(&[1, 2, 3], &[1, 2, 5]), None);
    }
}
