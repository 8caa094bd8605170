//! Tests of the SMILES parser on whole structures: hydrogens, kekulization, stereo, errors.
//!
//! Expected hydrogen counts and formulas are those of the named compounds' structural
//! formulas (common practice); they agree with the counts RDKit reports for these SMILES
//! (recalled from memory).

use petgraph::graph::NodeIndex;

use super::*;
use crate::molecule::graph::{BondDirection, BondOrder, ChiralTag, StereoNeighbour};
use crate::molecule::Element;

fn parse(s: &str) -> Molecule {
    match parse_smiles(s) {
        Ok(m) => m,
        Err(e) => panic!("{s} failed:\n{e}"),
    }
}

/// Hydrogen count of every atom in input order.
fn hydrogens(s: &str) -> Vec<u8> {
    let m = parse(s);
    m.atoms().map(|i| m.atom(i).hydrogens).collect()
}

fn total_hydrogens(s: &str) -> u32 {
    let m = parse(s);
    m.atoms().map(|i| u32::from(m.atom(i).hydrogens)).sum()
}

fn double_bonds(m: &Molecule) -> usize {
    m.graph
        .edge_weights()
        .filter(|b| b.order == BondOrder::Double)
        .count()
}

/// Every atom's valence after kekulization equals a value its element allows.
fn assert_valences_whole(s: &str) {
    let m = parse(s);
    for i in m.atoms() {
        let a = m.atom(i);
        let used = m.bond_valence(i) + u32::from(a.hydrogens) + u32::from(a.radical_electrons);
        if let Some(vals) = allowed_valences(a.element, a.charge) {
            assert!(
                vals.iter().any(|&v| u32::from(v) == used),
                "{s}: atom {} {} has valence {used}",
                i.index(),
                a.element
            );
        }
    }
}

fn kind(s: &str) -> (SmilesErrorKind, usize) {
    match parse_smiles(s) {
        Ok(_) => panic!("{s} parsed but should fail"),
        Err(e) => (e.kind, e.column),
    }
}

#[test]
fn aliphatic_hydrogens() {
    // Ethanol CH3CH2OH, acetic acid, acetonitrile (structural formulas, common practice).
    assert_eq!(hydrogens("CCO"), vec![3, 2, 1]);
    assert_eq!(hydrogens("CC(=O)O"), vec![3, 0, 0, 1]);
    assert_eq!(hydrogens("CC#N"), vec![3, 0, 0]);
    assert_eq!(hydrogens("C1CC1"), vec![2, 2, 2]);
    // Dimethyl sulfoxide and sulfuric acid use S valences 4 and 6 (OpenSMILES defaults).
    assert_eq!(hydrogens("CS(=O)C"), vec![3, 0, 0, 3]);
    assert_eq!(hydrogens("OS(=O)(=O)O"), vec![1, 0, 0, 0, 1]);
    assert_eq!(hydrogens("ClCBr"), vec![0, 2, 0]);
    assert_eq!(hydrogens("B"), vec![3]);
    assert_eq!(hydrogens("P"), vec![3]);
    // Perchlorate and iodine trichloride: hypervalent halogens without hydrogens.
    assert_eq!(hydrogens("[O-]Cl(=O)(=O)=O"), vec![0; 5]);
    assert_eq!(hydrogens("ClI(Cl)Cl"), vec![0; 4]);
}

#[test]
fn aromatic_hydrogens() {
    // Benzene C6H6, pyridine C5H5N, pyrrole C4H5N, furan C4H4O, thiophene C4H4S.
    assert_eq!(hydrogens("c1ccccc1"), vec![1; 6]);
    assert_eq!(hydrogens("c1ccncc1"), vec![1, 1, 1, 0, 1, 1]);
    assert_eq!(hydrogens("c1cc[nH]c1"), vec![1, 1, 1, 1, 1]);
    assert_eq!(hydrogens("c1ccoc1"), vec![1, 1, 1, 0, 1]);
    assert_eq!(hydrogens("c1ccsc1"), vec![1, 1, 1, 0, 1]);
    // Azulene C10H8, indole C8H7N, quinoline C9H7N, carbazole C12H9N, biphenyl C12H10.
    assert_eq!(total_hydrogens("c1ccc2cccc2cc1"), 8);
    assert_eq!(total_hydrogens("c1ccc2[nH]ccc2c1"), 7);
    assert_eq!(total_hydrogens("c1ccc2ncccc2c1"), 7);
    assert_eq!(total_hydrogens("c1ccc2c(c1)[nH]c1ccccc12"), 9);
    assert_eq!(total_hydrogens("c1ccccc1c1ccccc1"), 10);
    // Caffeine C8H10N4O2.
    assert_eq!(total_hydrogens("Cn1cnc2c1c(=O)n(C)c(=O)n2C"), 10);
    // Cyclopentadienyl anion C5H5-, tropylium C7H7+.
    assert_eq!(hydrogens("[cH-]1cccc1"), vec![1; 5]);
    assert_eq!(hydrogens("[cH+]1cccccc1"), vec![1; 7]);
}

#[test]
fn kekule_structures_are_whole() {
    let cases = [
        ("c1ccccc1", 3),
        ("c1ccncc1", 3),
        ("c1cc[nH]c1", 2),
        ("c1ccoc1", 2),
        ("c1ccsc1", 2),
        ("c1ccc2cccc2cc1", 5),
        ("Cn1cnc2c1c(=O)n(C)c(=O)n2C", 4),
        ("c1ccc2c(c1)[nH]c1ccccc12", 6),
        ("[cH-]1cccc1", 2),
        ("[cH+]1cccccc1", 3),
        ("c1ccc2[nH]ccc2c1", 4),
        ("c1ccc2ncccc2c1", 5),
        ("c1ccccc1c1ccccc1", 6),
        ("c1ccc2cc3ccccc3cc2c1", 7),
        ("C[n+]1ccccc1", 3),
        ("[O-][n+]1ccccc1", 3),
        ("O=c1cccc[nH]1", 3),
        ("c1cc[se]c1", 2),
        ("c1ccc2c(c1)sc1ccccc12", 6),
    ];
    for (s, doubles) in cases {
        let m = parse(s);
        assert_eq!(double_bonds(&m), doubles, "{s}");
        assert_valences_whole(s);
    }
}

#[test]
fn biphenyl_link_stays_single_and_flags_survive() {
    let m = parse("c1ccccc1c1ccccc1");
    let link = m.graph.find_edge(NodeIndex::new(5), NodeIndex::new(6));
    let bond = link.map(|e| &m.graph[e]);
    assert_eq!(bond.map(|b| b.order), Some(BondOrder::Single));
    assert_eq!(bond.map(|b| b.aromatic), Some(true));
    assert!(m.atoms().all(|i| m.atom(i).aromatic));
}

#[test]
fn explicit_single_between_aromatic_atoms_is_not_aromatic() {
    let m = parse("c1ccccc1-c1ccccc1");
    let link = m.graph.find_edge(NodeIndex::new(5), NodeIndex::new(6));
    assert_eq!(link.map(|e| m.graph[e].aromatic), Some(false));
}

#[test]
fn unkekulizable_systems_fail() {
    // Pyrrole without its H and cyclopentadiene written aromatic fail in RDKit too
    // (recalled from memory).
    assert_eq!(kind("c1cccc1").0, SmilesErrorKind::CannotKekulize);
    assert_eq!(kind("c1ccnc1").0, SmilesErrorKind::CannotKekulize);
    assert_eq!(kind("Cc"), (SmilesErrorKind::CannotKekulize, 1));
    assert!(kind("CCc1cccc1").1 >= 2);
}

#[test]
fn chirality_neighbour_order() {
    let atom = |i: usize| StereoNeighbour::Atom(NodeIndex::new(i));
    let m = parse("N[C@@H](C)C(=O)O");
    assert_eq!(m.chiral_centres.len(), 1);
    let c = &m.chiral_centres[0];
    assert_eq!(c.atom, NodeIndex::new(1));
    assert_eq!(c.tag, ChiralTag::Clockwise);
    assert_eq!(
        c.neighbours,
        vec![atom(0), StereoNeighbour::ImplicitHydrogen, atom(2), atom(3)]
    );

    // Ring-closure partner comes before the following chain atom.
    let m = parse("C[C@H]1CCCCO1");
    let c = &m.chiral_centres[0];
    assert_eq!(c.tag, ChiralTag::Anticlockwise);
    assert_eq!(
        c.neighbours,
        vec![atom(0), StereoNeighbour::ImplicitHydrogen, atom(6), atom(2)]
    );

    // A closing ring bond at the centre, and a centre written first.
    let m = parse("[C@]1(F)(Cl)Br.C1");
    let c = &m.chiral_centres[0];
    assert_eq!(c.neighbours, vec![atom(4), atom(1), atom(2), atom(3)]);
    let m = parse("[C@@H](F)(Cl)Br");
    let c = &m.chiral_centres[0];
    assert_eq!(
        c.neighbours,
        vec![StereoNeighbour::ImplicitHydrogen, atom(1), atom(2), atom(3)]
    );
    // Ring digits in the order written, the first of them closing an earlier opening.
    let m = parse("C1CC[C@]12CCC2");
    let c = &m.chiral_centres[0];
    assert_eq!(c.neighbours, vec![atom(2), atom(0), atom(6), atom(4)]);
}

#[test]
fn bond_directions_read_from_the_first_atom() {
    let m = parse("F/C=C/F");
    let dirs: Vec<_> = m.graph.edge_weights().filter_map(|b| b.direction).collect();
    assert_eq!(
        dirs,
        vec![
            (NodeIndex::new(0), BondDirection::Up),
            (NodeIndex::new(2), BondDirection::Up)
        ]
    );
    let m = parse("C(\\F)=C/F");
    let first = m.graph.edge_weights().next().and_then(|b| b.direction);
    assert_eq!(first, Some((NodeIndex::new(0), BondDirection::Down)));
    // Written at the closing end, the symbol reads from the later atom; stored reversed.
    let m = parse("C1CCCCCCC/C=C/1");
    let e = m.graph.find_edge(NodeIndex::new(0), NodeIndex::new(9));
    let dir = e.and_then(|e| m.graph[e].direction);
    assert_eq!(dir, Some((NodeIndex::new(0), BondDirection::Down)));
}

#[test]
fn ring_numbers_and_reuse() {
    let m = parse("C%10CC%10");
    assert_eq!(m.bond_count(), 3);
    let m = parse("C1CC1C1CC1");
    assert_eq!((m.atom_count(), m.bond_count()), (6, 7));
    let m = parse("C=1CC1");
    let e = m.graph.find_edge(NodeIndex::new(0), NodeIndex::new(2));
    assert_eq!(e.map(|e| m.graph[e].order), Some(BondOrder::Double));
    let m = parse("C1CC=1");
    let e = m.graph.find_edge(NodeIndex::new(0), NodeIndex::new(2));
    assert_eq!(e.map(|e| m.graph[e].order), Some(BondOrder::Double));
    assert!(parse_smiles("C=1CC=1").is_ok());
}

#[test]
fn bracket_atoms_and_radicals() {
    let m = parse("[13CH4:2]");
    let a = m.atom(NodeIndex::new(0));
    assert_eq!(
        (a.isotope, a.hydrogens, a.atom_class, a.radical_electrons),
        (Some(13), 4, Some(2), 0)
    );
    let radicals = |s: &str| {
        let m = parse(s);
        m.atoms()
            .map(|i| m.atom(i).radical_electrons)
            .collect::<Vec<_>>()
    };
    // Methyl radical, methylene, hydroxyl radical, phenyl radical (common practice).
    assert_eq!(radicals("[CH3]"), vec![1]);
    assert_eq!(radicals("[CH2]"), vec![2]);
    assert_eq!(radicals("[OH]"), vec![1]);
    assert_eq!(radicals("[c]1ccccc1"), vec![1, 0, 0, 0, 0, 0]);
    assert_eq!(radicals("C[CH2]"), vec![0, 1]);
    // Closed-shell ions get none.
    assert_eq!(radicals("[NH4+]"), vec![0]);
    assert_eq!(radicals("C[O-]"), vec![0, 0]);
    assert_eq!(radicals("[CH3+]"), vec![0]);
    assert_eq!(radicals("[CH3-]"), vec![0]);
    assert_eq!(radicals("C[N+](=O)[O-]"), vec![0, 0, 0, 0]);
    assert_eq!(radicals("[Na+].[Cl-]"), vec![0, 0]);
    assert_eq!(radicals("[Fe]"), vec![0]);
}

#[test]
fn columns_are_recorded() {
    let m = parse("C[13CH3].Cl");
    let cols: Vec<_> = m.atoms().map(|i| m.atom(i).column).collect();
    assert_eq!(cols, vec![0, 1, 9]);
    assert_eq!(m.component_count(), 2);
}

#[test]
fn malformed_inputs_give_kind_and_column() {
    use SmilesErrorKind as K;
    assert_eq!(kind(""), (K::Empty, 0));
    assert_eq!(kind("CC C"), (K::UnexpectedCharacter(' '), 2));
    assert_eq!(kind(" C"), (K::UnexpectedCharacter(' '), 0));
    assert_eq!(kind("CC?"), (K::UnexpectedCharacter('?'), 2));
    assert_eq!(kind("CXC"), (K::UnknownElement("X".into()), 1));
    assert_eq!(kind("C*"), (K::UnknownElement("*".into()), 1));
    assert_eq!(kind("CNa"), (K::NeedsBrackets("Na".into()), 1));
    assert_eq!(kind("CCu"), (K::NeedsBrackets("Cu".into()), 1));
    assert_eq!(kind("H"), (K::NeedsBrackets("H".into()), 0));
    assert_eq!(kind("C1CC"), (K::UnclosedRingBond { ring: 1 }, 1));
    assert_eq!(kind("CC%12CC"), (K::UnclosedRingBond { ring: 12 }, 2));
    assert_eq!(kind("C%1C"), (K::BadRingNumber, 1));
    assert_eq!(kind("CC(C"), (K::UnclosedBranch, 2));
    assert_eq!(kind("CC)C"), (K::StrayCloseParen, 2));
    assert_eq!(kind("C()C"), (K::EmptyBranch, 1));
    assert_eq!(kind("(C)C"), (K::UnexpectedCharacter('('), 0));
    assert_eq!(kind("C(C=)C"), (K::BondToNothing, 3));
    assert_eq!(kind("CC=.C"), (K::BondToNothing, 2));
    assert_eq!(kind("CC="), (K::BondToNothing, 2));
    assert_eq!(kind("=CC"), (K::BondToNothing, 0));
    assert_eq!(kind("C.=C"), (K::BondToNothing, 2));
    assert_eq!(kind("C=(C)C"), (K::BondToNothing, 1));
    assert_eq!(kind("C==C"), (K::UnexpectedCharacter('='), 2));
    assert_eq!(kind(".C"), (K::UnexpectedCharacter('.'), 0));
    assert_eq!(kind("C..C"), (K::UnexpectedCharacter('.'), 2));
    assert_eq!(kind("CC."), (K::UnexpectedCharacter('.'), 2));
    assert_eq!(kind("C(C.)C"), (K::UnexpectedCharacter('.'), 3));
    assert_eq!(kind("1CC"), (K::UnexpectedCharacter('1'), 0));
    assert_eq!(kind("C=1CC#1"), (K::RingBondConflict { ring: 1 }, 6));
    assert_eq!(kind("C11"), (K::RingBondToSelf { ring: 1 }, 2));
    assert_eq!(kind("C12C12"), (K::DuplicateBond { ring: 1 }, 4));
    assert_eq!(
        kind("C[CH4"),
        (K::BadBracketAtom(BracketProblem::Unterminated), 1)
    );
    assert_eq!(
        kind("C[C+-]"),
        (K::BadBracketAtom(BracketProblem::Charge), 3)
    );
    assert_eq!(
        kind("C[C@XY]"),
        (K::BadBracketAtom(BracketProblem::Chirality), 3)
    );
    assert_eq!(
        kind("C(C)(C)(C)(C)C"),
        (
            K::ImpossibleValence {
                element: Element::C,
                valence: 5
            },
            0
        )
    );
    assert_eq!(
        kind("FC=F"),
        (
            K::ImpossibleValence {
                element: Element::F,
                valence: 2
            },
            3
        )
    );
    assert_eq!(
        kind("[CH5]"),
        (
            K::ImpossibleValence {
                element: Element::C,
                valence: 5
            },
            0
        )
    );
    assert_eq!(kind("CCc1cccc1").0, K::CannotKekulize);
}

#[test]
fn error_display_names_the_place() {
    let e = parse_smiles("FC=F").err().map(|e| e.to_string());
    let text = e.unwrap_or_default();
    assert!(text.starts_with("atom F has valence 2"), "{text}");
    assert!(text.contains("at column 4\nFC=F\n   ^"), "{text}");
}

#[test]
fn deep_nesting_and_long_chains_do_not_overflow() {
    let depth = 10_000;
    let s = format!("{}C{}", "C(".repeat(depth), ")".repeat(depth));
    let m = parse(&s);
    assert_eq!(m.atom_count(), depth + 1);
    let chain = "C".repeat(100_000);
    assert_eq!(parse(&chain).atom_count(), 100_000);
    // 10,000 para-linked benzene rings: 60,000 aromatic atoms in one component.
    let rings = 10_000;
    let chain = format!("{}c1ccccc1", "c1ccc(cc1)".repeat(rings - 1));
    let m = parse(&chain);
    assert_eq!(double_bonds(&m), 3 * rings);
}
