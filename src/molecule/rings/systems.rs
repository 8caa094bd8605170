//! Ring systems: rings joined through shared atoms, split into blocks at spiro atoms and
//! classified as isolated, fused, bridged or spiro.
//!
//! Rules (ours, stated so that group assignment can rely on them):
//! - A ring system is a connected group of rings of the smallest set of smallest rings, two
//!   rings being joined when they share at least one atom.
//! - A block is a group of rings joined through shared bonds; it is a biconnected piece of the
//!   system, and atoms shared by two blocks are spiro junctions.
//! - A block of one ring is isolated. A block of several rings is bridged when two of its rings
//!   share more than one bond or share two atoms not bonded to each other, or when it is a closed
//!   cage: the sum over GF(2) of its rings (the one face a basis leaves out of a polyhedral
//!   surface, or the perimeter of a flat fused drawing) has no more bonds than its largest ring.
//!   Cubane, prismane, dodecahedrane and C60 are bridged by the cage rule, adamantane,
//!   norbornane and bicyclo\[1.1.1\]pentane by the sharing rule. Otherwise it is fused; this
//!   includes bicyclo\[1.1.0\]butane (two three-rings on one bond) and fenestranes, whose
//!   opposite rings meet at a single atom inside one block.
//! - A system of one block takes the block's kind. A system of several blocks has a spiro
//!   junction; it is spiro when every block is isolated, and otherwise takes the most complex
//!   kind among its blocks (bridged over fused).

use petgraph::graph::{EdgeIndex, NodeIndex};

use super::{Ring, RingSystem, RingSystemKind};

/// Disjoint sets over ring indices.
struct UnionFind(Vec<usize>);

impl UnionFind {
    fn new(n: usize) -> UnionFind {
        UnionFind((0..n).collect())
    }

    fn find(&mut self, mut x: usize) -> usize {
        while self.0[x] != x {
            self.0[x] = self.0[self.0[x]];
            x = self.0[x];
        }
        x
    }

    fn union(&mut self, a: usize, b: usize) {
        let (ra, rb) = (self.find(a), self.find(b));
        if ra != rb {
            self.0[ra.max(rb)] = ra.min(rb);
        }
    }

    /// Groups of members, each sorted, groups ordered by their smallest member.
    fn groups(&mut self) -> Vec<Vec<usize>> {
        let n = self.0.len();
        let mut slot = vec![usize::MAX; n];
        let mut out: Vec<Vec<usize>> = Vec::new();
        for x in 0..n {
            let r = self.find(x);
            if slot[r] == usize::MAX {
                slot[r] = out.len();
                out.push(Vec::new());
            }
            out[slot[r]].push(x);
        }
        out
    }
}

/// For each index (atom or bond), the rings that contain it.
fn membership(n: usize, rings: &[Ring], items: impl Fn(&Ring) -> Vec<usize>) -> Vec<Vec<usize>> {
    let mut out = vec![Vec::new(); n];
    for (i, ring) in rings.iter().enumerate() {
        for x in items(ring) {
            if let Some(list) = out.get_mut(x) {
                list.push(i);
            }
        }
    }
    out
}

fn joined_groups(ring_count: usize, membership: &[Vec<usize>]) -> Vec<Vec<usize>> {
    let mut sets = UnionFind::new(ring_count);
    for rings in membership {
        for pair in rings.windows(2) {
            sets.union(pair[0], pair[1]);
        }
    }
    sets.groups()
}

/// Kind of one block (rings joined through shared bonds).
fn block_kind(block: &[usize], rings: &[Ring], edge_count: usize) -> RingSystemKind {
    if block.len() == 1 {
        return RingSystemKind::Isolated;
    }
    for (i, &a) in block.iter().enumerate() {
        for &b in &block[i + 1..] {
            let shared_atoms = rings[a]
                .atoms
                .iter()
                .filter(|x| rings[b].atoms.contains(x))
                .count();
            let shared_bonds = rings[a]
                .bonds
                .iter()
                .filter(|x| rings[b].bonds.contains(x))
                .count();
            let fused_or_apart = shared_atoms <= 1 || (shared_atoms == 2 && shared_bonds == 1);
            if !fused_or_apart {
                return RingSystemKind::Bridged;
            }
        }
    }
    let mut sum = vec![false; edge_count];
    for &r in block {
        for b in &rings[r].bonds {
            if let Some(x) = sum.get_mut(b.index()) {
                *x = !*x;
            }
        }
    }
    let closing = sum.iter().filter(|&&x| x).count();
    let largest = block
        .iter()
        .map(|&r| rings[r].bonds.len())
        .max()
        .unwrap_or(0);
    if closing <= largest {
        RingSystemKind::Bridged
    } else {
        RingSystemKind::Fused
    }
}

fn rank(kind: RingSystemKind) -> u8 {
    match kind {
        RingSystemKind::Isolated | RingSystemKind::Spiro => 0,
        RingSystemKind::Fused => 1,
        RingSystemKind::Bridged => 2,
    }
}

/// Groups `rings` into classified ring systems.
pub(super) fn ring_systems(
    rings: &[Ring],
    atom_count: usize,
    edge_count: usize,
) -> Vec<RingSystem> {
    let by_atom = membership(atom_count, rings, |r| {
        r.atoms.iter().map(|a| a.index()).collect()
    });
    let by_bond = membership(edge_count, rings, |r| {
        r.bonds.iter().map(|b| b.index()).collect()
    });
    let blocks = joined_groups(rings.len(), &by_bond);
    let mut block_of_ring = vec![0; rings.len()];
    for (i, block) in blocks.iter().enumerate() {
        for &r in block {
            block_of_ring[r] = i;
        }
    }
    let block_kinds: Vec<RingSystemKind> = blocks
        .iter()
        .map(|b| block_kind(b, rings, edge_count))
        .collect();

    joined_groups(rings.len(), &by_atom)
        .into_iter()
        .map(|members| {
            let mut atoms: Vec<NodeIndex> = members
                .iter()
                .flat_map(|&r| rings[r].atoms.iter().copied())
                .collect();
            atoms.sort();
            atoms.dedup();
            let mut bonds: Vec<EdgeIndex> = members
                .iter()
                .flat_map(|&r| rings[r].bonds.iter().copied())
                .collect();
            bonds.sort();
            bonds.dedup();
            let mut own_blocks: Vec<usize> = members.iter().map(|&r| block_of_ring[r]).collect();
            own_blocks.sort();
            own_blocks.dedup();
            let spiro_atoms: Vec<NodeIndex> = atoms
                .iter()
                .copied()
                .filter(|a| {
                    let rs = by_atom.get(a.index()).map_or(&[][..], Vec::as_slice);
                    rs.iter().any(|&r| block_of_ring[r] != block_of_ring[rs[0]])
                })
                .collect();
            let kind = if own_blocks.len() == 1 {
                block_kinds[own_blocks[0]]
            } else {
                own_blocks
                    .iter()
                    .map(|&b| block_kinds[b])
                    .filter(|&k| k != RingSystemKind::Isolated)
                    .max_by_key(|&k| rank(k))
                    .unwrap_or(RingSystemKind::Spiro)
            };
            RingSystem {
                rings: members,
                atoms,
                bonds,
                kind,
                has_spiro_junction: !spiro_atoms.is_empty(),
                spiro_atoms,
            }
        })
        .collect()
}
