//! The SMILES parser never panics and never overflows the stack, whatever it is given:
//! random strings over the SMILES alphabet, mutations of valid SMILES, very deep branch
//! nesting and very long chains. Every failure must be an error value with a column that
//! lies inside the input.

use proptest::prelude::*;
use ringheat::molecule::parse_smiles;

/// Characters a SMILES can hold, plus a few that it cannot (space, `?`, `é`).
const ALPHABET: &[&str] = &[
    "C", "c", "N", "n", "O", "o", "S", "s", "P", "p", "B", "b", "F", "I", "Cl", "Br", "H", "[",
    "]", "(", ")", "1", "2", "3", "9", "0", "%", "%1", "%12", "=", "#", "$", ":", "-", "/", "\\",
    ".", "@", "@@", "+", "-", "++", "13", "se", "te", "as", "Na", "*", " ", "?", "é", "[nH]",
    "[C@@H]", "[O-]", "[N+]", ":2", "H2", "@TB5", "@OH31",
];

/// Valid SMILES to mutate: rings, aromatics, stereo, charges, ring numbers above nine
/// (typical structures, chosen by hand).
const SEEDS: &[&str] = &[
    "C1CC1",
    "c1ccccc1",
    "Cn1cnc2c1c(=O)n(C)c(=O)n2C",
    "N[C@@H](C)C(=O)O",
    "C[C@H]1CCCCO1",
    "F/C=C/F",
    "[13CH4:2]",
    "C%10CCCCC%10",
    "c1ccc2c(c1)[nH]c1ccccc12",
    "[cH-]1cccc1",
    "[O-][n+]1ccccc1.[Na+]",
    "C1CC2CCC1C2",
    "OC(=O)C1=CC=CC=C1O",
];

/// Checks that a parse result is either a molecule or a well-formed error.
fn check(input: &str) {
    match parse_smiles(input) {
        Ok(m) => {
            for i in m.atoms() {
                assert!(m.atom(i).column < input.len().max(1));
            }
        }
        Err(e) => {
            assert!(e.column <= input.len(), "{input:?}: column {}", e.column);
            assert_eq!(e.input, input);
            let text = e.to_string();
            assert!(text.contains("at column"));
            assert!(text.lines().count() >= 3);
        }
    }
}

/// One edit of a string: insert, delete or replace at a (char-aligned) position.
#[derive(Debug, Clone)]
enum Edit {
    Insert(usize, String),
    Delete(usize),
    Replace(usize, String),
}

fn apply(s: &str, edits: &[Edit]) -> String {
    let mut chars: Vec<String> = s.chars().map(String::from).collect();
    for edit in edits {
        let len = chars.len();
        match edit {
            Edit::Insert(at, t) => chars.insert(at % (len + 1), t.clone()),
            Edit::Delete(at) if len > 0 => {
                chars.remove(at % len);
            }
            Edit::Replace(at, t) if len > 0 => chars[at % len] = t.clone(),
            _ => {}
        }
    }
    chars.concat()
}

fn token() -> impl Strategy<Value = String> {
    proptest::sample::select(ALPHABET).prop_map(str::to_string)
}

fn edit() -> impl Strategy<Value = Edit> {
    prop_oneof![
        (any::<usize>(), token()).prop_map(|(a, t)| Edit::Insert(a, t)),
        any::<usize>().prop_map(Edit::Delete),
        (any::<usize>(), token()).prop_map(|(a, t)| Edit::Replace(a, t)),
    ]
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(2000))]

    #[test]
    fn random_strings_never_panic(tokens in proptest::collection::vec(token(), 0..40)) {
        check(&tokens.concat());
    }

    #[test]
    fn arbitrary_text_never_panics(s in ".{0,40}") {
        check(&s);
    }

    #[test]
    fn mutated_smiles_never_panic(
        seed in proptest::sample::select(SEEDS),
        edits in proptest::collection::vec(edit(), 1..5),
    ) {
        check(&apply(seed, &edits));
    }
}

#[test]
fn ten_thousand_nested_branches() {
    let depth = 10_000;
    let s = format!("{}C{}", "C(".repeat(depth), ")".repeat(depth));
    let m = parse_smiles(&s).map_err(|e| e.to_string());
    assert_eq!(m.map(|m| m.atom_count()), Ok(depth + 1));
    // Unclosed: the error names the innermost open branch.
    let s = format!("{}C", "C(".repeat(depth));
    let e = parse_smiles(&s).err().map(|e| e.column);
    assert_eq!(e, Some(2 * depth - 1));
}

#[test]
fn hundred_thousand_atom_chain() {
    let n = 100_000;
    let s = "C".repeat(n);
    let m = parse_smiles(&s).map_err(|e| e.to_string());
    assert_eq!(m.map(|m| m.bond_count()), Ok(n - 1));
    // A long aromatic ribbon of para-linked rings also kekulizes without deep recursion.
    let rings = 20_000;
    let s = format!("{}c1ccccc1", "c1ccc(cc1)".repeat(rings - 1));
    let m = parse_smiles(&s).map_err(|e| e.to_string());
    assert_eq!(m.map(|m| m.atom_count()), Ok(6 * rings));
}
