//! Tests of ring perception and ring systems.

use super::*;
use crate::molecule::parse_smiles;
use crate::molecule::{Atom, Bond, BondOrder, Element};

fn rings_of(smiles: &str) -> RingInfo {
    match parse_smiles(smiles) {
        Ok(mol) => RingInfo::perceive(&mol),
        Err(e) => panic!("test SMILES {smiles} did not parse: {e}"),
    }
}

/// Carbon skeleton from an edge list, for graphs easier to state as edges.
fn skeleton(n: usize, edges: &[(usize, usize)]) -> Molecule {
    let mut mol = Molecule::new();
    let nodes: Vec<NodeIndex> = (0..n)
        .map(|_| mol.add_atom(Atom::new(Element::C)))
        .collect();
    for &(a, b) in edges {
        mol.add_bond(nodes[a], nodes[b], Bond::new(BondOrder::Single));
    }
    mol
}

/// Buckminsterfullerene, C60, in a Kekulé form (written by RDKit from an aromatic SMILES).
const C60: &str =
    "C12=C3C4=C5C6=C7C3=C3C8=C1C1=C9C%10=C%11C%12=C%13C%14=C%15C%16=C%12C%10=C%10C1=C1C2=C4C2=C4C1=C%10C%16=C1C4=C4C2=C5C2=C6C5=C6C7=C3C3=C7C(=C%11C3=C89)C%13=C3C(=C67)C5=C5C2=C4C(=C1%15)C5=C%143";

/// Ring sizes (smallest set of smallest rings) and the kind of the single ring system.
/// Expected sizes are the textbook ring counts of these hydrocarbons and agree with RDKit's
/// `GetSSSR` (run while writing the test); kinds follow the rules in `systems.rs`.
#[test]
fn sizes_and_kinds() {
    use RingSystemKind::*;
    let cases: [(&str, &str, &[usize], RingSystemKind); 22] = [
        ("cyclopropane", "C1CC1", &[3], Isolated),
        ("cyclohexane", "C1CCCCC1", &[6], Isolated),
        ("benzene", "c1ccccc1", &[6], Isolated),
        ("cyclododecane", "C1CCCCCCCCCCC1", &[12], Isolated),
        ("cubane", "C12C3C4C1C5C2C3C45", &[4, 4, 4, 4, 4], Bridged),
        ("prismane", "C12C3C1C4C2C34", &[3, 3, 4, 4], Bridged),
        ("tetrahedrane", "C12C3C1C23", &[3, 3, 3], Bridged),
        ("adamantane", "C1C2CC3CC1CC(C2)C3", &[6, 6, 6], Bridged),
        ("norbornane", "C1CC2CCC1C2", &[5, 5], Bridged),
        ("bicyclo[2.2.2]octane", "C1CC2CCC1CC2", &[6, 6], Bridged),
        ("bicyclo[1.1.1]pentane", "C1C2CC1C2", &[4, 4], Bridged),
        (
            "[2.2]paracyclophane",
            "c1cc2ccc1CCc1ccc(cc1)CC2",
            &[6, 6, 12],
            Bridged,
        ),
        ("bicyclo[1.1.0]butane", "C1C2C1C2", &[3, 3], Fused),
        ("decalin", "C1CCC2CCCCC2C1", &[6, 6], Fused),
        ("naphthalene", "c1ccc2ccccc2c1", &[6, 6], Fused),
        ("indane", "C1Cc2ccccc2C1", &[5, 6], Fused),
        ("pyrene", "c1cc2ccc3cccc4ccc(c1)c2c34", &[6, 6, 6, 6], Fused),
        (
            "coronene",
            "c1cc2ccc3ccc4ccc5ccc6ccc1c7c2c3c4c5c67",
            &[6; 7],
            Fused,
        ),
        (
            "steroid skeleton",
            "CC12CCC3C(CCC4CC(O)CCC34C)C1CCC2",
            &[5, 6, 6, 6],
            Fused,
        ),
        ("spiropentane", "C1CC11CC1", &[3, 3], Spiro),
        ("spiro[3.3]heptane", "C1CC2(C1)CCC2", &[4, 4], Spiro),
        ("dispiro chain", "C1CC12CC21CC1", &[3, 3, 3], Spiro),
    ];
    for (name, smiles, sizes, kind) in cases {
        let info = rings_of(smiles);
        assert_eq!(info.ring_sizes(), sizes.to_vec(), "{name}");
        assert_eq!(info.systems.len(), 1, "{name}");
        assert_eq!(info.systems[0].kind, kind, "{name}");
        assert_eq!(info.systems[0].rings.len(), sizes.len(), "{name}");
    }
}

/// C60: 31 rings (cyclomatic number 90 - 60 + 1), 12 pentagons and 19 hexagons; 32 relevant
/// cycles (all faces of the truncated icosahedron); one bridged (cage) system.
#[test]
fn fullerene_and_dodecahedrane() {
    let info = rings_of(C60);
    let sizes = info.ring_sizes();
    assert_eq!(sizes.len(), 31);
    assert_eq!(sizes.iter().filter(|&&s| s == 5).count(), 12);
    assert_eq!(sizes.iter().filter(|&&s| s == 6).count(), 19);
    assert_eq!(info.relevant_cycle_count(), 32);
    assert!(!info.sssr_is_unique());
    assert_eq!(info.systems.len(), 1);
    assert_eq!(info.systems[0].kind, RingSystemKind::Bridged);
    assert_eq!(info.systems[0].atoms.len(), 60);

    // Dodecahedrane C20H20: 11 of its 12 pentagonal faces.
    let info = rings_of("C12C3C4C5C1C6C7C2C8C3C9C4C%10C5C6C%11C7C8C9C%10%11");
    assert_eq!(info.ring_sizes(), vec![5; 11]);
    assert_eq!(info.relevant_cycle_count(), 12);
    assert_eq!(info.systems[0].kind, RingSystemKind::Bridged);
}

/// Relevant cycles: unique smallest sets for ordinary fused rings, several choices for
/// cages and for bicyclo[2.2.2]octane (3 six-rings for 2 places) and [2.2]paracyclophane
/// (4 equally short twelve-rings for 1 place).
#[test]
fn uniqueness_of_the_smallest_set() {
    for (smiles, relevant, unique) in [
        ("c1ccc2ccccc2c1", 2, true),
        ("C1CC2CCC1C2", 2, true),
        ("C12C3C4C1C5C2C3C45", 6, false),
        ("C1C2CC3CC1CC(C2)C3", 4, false),
        ("C1CC2CCC1CC2", 3, false),
        ("c1cc2ccc1CCc1ccc(cc1)CC2", 6, false),
        ("CCCC", 0, true),
    ] {
        let info = rings_of(smiles);
        assert_eq!(info.relevant_cycle_count(), relevant, "{smiles}");
        assert_eq!(info.sssr_is_unique(), unique, "{smiles}");
    }
}

/// A spiro atom joining a fused part and a ring: the system is fused with a spiro junction.
#[test]
fn spiro_junction_on_a_fused_system() {
    let mol = parse_smiles("C1CCC2(CC1)CCc1ccccc12").unwrap_or_default();
    let info = RingInfo::perceive(&mol);
    assert_eq!(info.ring_sizes(), vec![5, 6, 6]);
    assert_eq!(info.systems.len(), 1);
    let system = &info.systems[0];
    assert_eq!(system.kind, RingSystemKind::Fused);
    assert!(system.has_spiro_junction);
    assert_eq!(system.spiro_atoms, vec![NodeIndex::new(3)]);

    let spiro = rings_of("C1CC11CC1");
    assert!(spiro.systems[0].has_spiro_junction);
    assert!(!rings_of("c1ccc2ccccc2c1").systems[0].has_spiro_junction);
}

/// [4.4.4.4]Fenestrane: four four-rings around one carbon; opposite rings meet at one atom
/// but the centre is no spiro junction, so the system is fused.
#[test]
fn fenestrane_is_fused_not_spiro() {
    let mol = skeleton(
        9,
        &[
            (0, 1),
            (0, 2),
            (0, 3),
            (0, 4),
            (5, 1),
            (5, 2),
            (6, 2),
            (6, 3),
            (7, 3),
            (7, 4),
            (8, 4),
            (8, 1),
        ],
    );
    let info = RingInfo::perceive(&mol);
    assert_eq!(info.ring_sizes(), vec![4, 4, 4, 4]);
    assert_eq!(info.systems[0].kind, RingSystemKind::Fused);
    assert!(!info.systems[0].has_spiro_junction);
}

/// Separate ring systems, ring atoms and bonds, and the lookups.
#[test]
fn biphenyl_lookups() {
    let mol = parse_smiles("c1ccccc1-c1ccccc1").unwrap_or_default();
    let info = RingInfo::perceive(&mol);
    assert_eq!(info.ring_sizes(), vec![6, 6]);
    assert_eq!(info.systems.len(), 2);
    assert!(info
        .systems
        .iter()
        .all(|s| s.kind == RingSystemKind::Isolated));
    let link = mol
        .graph
        .find_edge(NodeIndex::new(5), NodeIndex::new(6))
        .unwrap_or_default();
    assert!(!info.is_ring_bond(link));
    assert!(info.is_ring_atom(NodeIndex::new(5)));
    assert_eq!(info.system_of_atom(NodeIndex::new(0)), Some(0));
    assert_eq!(info.system_of_atom(NodeIndex::new(11)), Some(1));
    assert_eq!(info.system_of_atom(NodeIndex::new(99)), None);
    assert!(!info.is_ring_atom(NodeIndex::new(99)));
    assert_eq!(info.smallest_ring_of_atom(NodeIndex::new(0)), Some(6));
}

/// Rings come in cyclic order with each bond joining consecutive atoms.
#[test]
fn ring_atoms_are_in_cyclic_order() {
    let mol = parse_smiles(C60).unwrap_or_default();
    let info = RingInfo::perceive(&mol);
    for ring in &info.rings {
        assert_eq!(ring.atoms.len(), ring.bonds.len());
        for (i, &b) in ring.bonds.iter().enumerate() {
            let (x, y) = (ring.atoms[i], ring.atoms[(i + 1) % ring.size()]);
            assert_eq!(mol.graph.find_edge(x, y), Some(b));
        }
    }
}

/// Hydrogen nodes and acyclic molecules give no rings; empty molecules are fine.
#[test]
fn no_rings() {
    for smiles in ["[H]C([H])([H])[H]", "CC(C)(C)C", "[H][H]", "[Na+].[Cl-]"] {
        let info = rings_of(smiles);
        assert!(info.rings.is_empty(), "{smiles}");
        assert!(info.systems.is_empty(), "{smiles}");
        assert!(info.sssr_is_unique(), "{smiles}");
    }
    let empty = RingInfo::perceive(&Molecule::new());
    assert!(empty.rings.is_empty());
}

/// Rings count equals the cyclomatic number, also with two components and hydrogen nodes.
#[test]
fn ring_count_is_cyclomatic_number() {
    for smiles in ["C1CC1.C1CCC1", "[H]C12C3C4C1C5C2C3C45", "C1CC2CC1C1CCC21"] {
        let mol = parse_smiles(smiles).unwrap_or_default();
        assert_eq!(
            RingInfo::perceive(&mol).rings.len(),
            mol.cyclomatic_number(),
            "{smiles}"
        );
    }
}

/// All simple cycles of a small graph as bond bit masks, by depth-first search from each
/// cycle's lowest atom.
fn all_cycles(n: usize, edges: &[(usize, usize)]) -> Vec<u64> {
    let mut adjacency = vec![Vec::new(); n];
    for (i, &(a, b)) in edges.iter().enumerate() {
        adjacency[a].push((b, i));
        adjacency[b].push((a, i));
    }
    fn walk(
        start: usize,
        v: usize,
        visited: u64,
        used: u64,
        adjacency: &[Vec<(usize, usize)>],
        out: &mut Vec<u64>,
    ) {
        for &(u, e) in &adjacency[v] {
            if used >> e & 1 == 1 {
                continue;
            }
            if u == start && used.count_ones() >= 2 {
                out.push(used | 1 << e);
            } else if u > start && visited >> u & 1 == 0 {
                walk(start, u, visited | 1 << u, used | 1 << e, adjacency, out);
            }
        }
    }
    let mut out = Vec::new();
    for s in 0..n {
        walk(s, s, 1 << s, 0, &adjacency, &mut out);
    }
    out.sort_unstable();
    out.dedup();
    out
}

/// Reduces `v` against an echelon basis of (pivot, row) pairs.
fn reduce(basis: &[(u32, u64)], mut v: u64) -> u64 {
    for &(pivot, row) in basis {
        if v >> pivot & 1 == 1 {
            v ^= row;
        }
    }
    v
}

/// Random small graphs: the basis has the cyclomatic number of rings, the smallest possible
/// total size, and the relevant-cycle count matches a brute-force count (cycles independent
/// of all strictly shorter cycles).
#[test]
fn matches_brute_force_on_random_graphs() {
    let mut seed = 0x2545_f491_4f6c_dd1d_u64;
    let mut next = move || {
        seed ^= seed << 13;
        seed ^= seed >> 7;
        seed ^= seed << 17;
        seed
    };
    let mut with_choices = 0;
    for _ in 0..300 {
        let n = 4 + (next() % 7) as usize;
        let mut edges = Vec::new();
        for a in 0..n {
            for b in a + 1..n {
                if next() % 100 < 38 && edges.len() < 20 {
                    edges.push((a, b));
                }
            }
        }
        let mol = skeleton(n, &edges);
        let info = RingInfo::perceive(&mol);
        assert_eq!(info.rings.len(), mol.cyclomatic_number(), "{edges:?}");

        let mut cycles = all_cycles(n, &edges);
        cycles.sort_by_key(|c| c.count_ones());
        let mut basis: Vec<(u32, u64)> = Vec::new();
        let (mut total, mut relevant, mut shorter, mut length) = (0, 0u64, 0, 0);
        for c in cycles {
            if c.count_ones() != length {
                length = c.count_ones();
                shorter = basis.len();
            }
            if reduce(&basis[..shorter], c) == 0 {
                continue;
            }
            relevant += 1;
            let r = reduce(&basis, c);
            if r != 0 {
                basis.push((r.trailing_zeros(), r));
                total += length as usize;
            }
        }
        let ours: usize = info.ring_sizes().iter().sum();
        assert_eq!(ours, total, "{edges:?}");
        assert_eq!(info.relevant_cycle_count(), relevant, "{edges:?}");
        with_choices += usize::from(!info.sssr_is_unique());
    }
    // The sample must exercise graphs with several equally small choices.
    assert!(with_choices > 30, "{with_choices}");
}
