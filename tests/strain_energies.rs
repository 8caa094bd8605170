//! Strain energies against published values: every scheme's number for small rings,
//! heterocycles, bicyclics, spiro and cage compounds, with the target's measured Hf298 from the
//! bundled reference table (group-tables/reference/).

use ringheat::molecule::parse_smiles;
use ringheat::strain::{analyse_strain, StrainAnalysis, StrainData, StrainFlag, TargetHfOrigin};
use ringheat::thermo::Quantity;

/// kJ per kcal (thermochemical calorie, exact by definition).
const KJ_PER_KCAL: f64 = 4.184;

fn analyse(smiles: &str, data: &StrainData, user: Option<Quantity>) -> StrainAnalysis {
    let mol = parse_smiles(smiles).expect("test SMILES parses");
    analyse_strain(&mol, data, user).unwrap_or_else(|e| panic!("{smiles}: {e}"))
}

fn kcal(a: &StrainAnalysis, scheme: &str) -> f64 {
    let s = a
        .scheme(scheme)
        .unwrap_or_else(|| panic!("{}: no scheme {scheme}", a.canonical_smiles));
    let q = s
        .strain_kj
        .unwrap_or_else(|| panic!("{}: {scheme}: {:?}", a.canonical_smiles, s.unavailable));
    q.value / KJ_PER_KCAL
}

/// Checks Benson group strain and CBH-2 strain against `published` (kcal/mol) within `tol`,
/// with the target's Hf298 measured (from the reference table).
fn check(data: &StrainData, smiles: &str, published: f64, tol: f64) -> Result<(), String> {
    let a = analyse(smiles, data, None);
    if !matches!(a.target_hf.origin, TargetHfOrigin::Measured { .. }) {
        return Err(format!(
            "{smiles}: no measured Hf298 in the reference table"
        ));
    }
    let (benson, cbh2) = (kcal(&a, "Benson"), kcal(&a, "CBH-2"));
    eprintln!(
        "{smiles:<22} published {published:6.1}  Benson {benson:6.2}  CBH-2 {cbh2:6.2}  \
         CBH-3 {:6.2}  (tolerance {tol})",
        kcal(&a, "CBH-3")
    );
    for (name, v) in [("Benson", benson), ("CBH-2", cbh2)] {
        if (v - published).abs() > tol {
            return Err(format!(
                "{smiles}: {name} {v:.2} kcal/mol, published {published} +- {tol}"
            ));
        }
    }
    Ok(())
}

#[test]
fn cyclopropane_and_cyclobutane_textbook_values() {
    let data = StrainData::bundled().expect("bundled data loads");
    // Common practice (textbook values): cyclopropane 27.5, cyclobutane 26.5 kcal/mol, +-1.0.
    check(&data, "C1CC1", 27.5, 1.0).unwrap();
    check(&data, "C1CCC1", 26.5, 1.0).unwrap();
}

#[test]
fn published_strain_energies_of_other_ring_systems() {
    let data = StrainData::bundled().expect("bundled data loads");
    // (SMILES, published strain kcal/mol, tolerance kcal/mol). Values recalled from memory, as
    // commonly tabulated (for the hydrocarbons K. B. Wiberg, Angew. Chem. Int. Ed. Engl. 25
    // (1986) 312, recalled from memory). Tolerances: 1.5 kcal/mol for the cycloalkanes, whose
    // values every convention agrees on to about 1 kcal/mol; 2.0 elsewhere, since published
    // tables that use different strain-free references differ by 1 to 2 kcal/mol (compare the
    // Benson and Schleyer columns of `ringheat strain`); cubane 5.0, whose published values
    // range from about 155 to 166 kcal/mol with the increment set and the Hf298 used.
    // (Thietane, 19.6 recalled from memory, is left out: thermo_reference.tsv now drops its CRC
    // value, whose WebBook cross-check disagrees, so no measured Hf298 is bundled for it.)
    let cases: [(&str, f64, f64); 18] = [
        ("C1CCCC1", 6.2, 1.5),              // cyclopentane, recalled from memory
        ("C1CCCCC1", 0.0, 1.5),             // cyclohexane, recalled from memory
        ("C1CCCCCC1", 6.2, 1.5),            // cycloheptane, recalled from memory
        ("C1CCCCCCC1", 9.7, 1.5),           // cyclooctane, recalled from memory
        ("C1=CC1", 54.5, 2.0),              // cyclopropene, recalled from memory
        ("C1CC=C1", 30.6, 2.0),             // cyclobutene, recalled from memory
        ("C1CC=CC1", 6.8, 2.0),             // cyclopentene, recalled from memory
        ("C1CO1", 27.3, 2.0),               // oxirane, recalled from memory
        ("C1COC1", 25.5, 2.0),              // oxetane, recalled from memory
        ("C1CCOC1", 5.6, 2.0),              // tetrahydrofuran, recalled from memory
        ("C1CN1", 27.7, 2.0),               // aziridine, recalled from memory
        ("C1CS1", 19.8, 2.0),               // thiirane, recalled from memory
        ("C1CCSC1", 2.0, 2.0),              // tetrahydrothiophene, recalled from memory
        ("C1C2CC12", 66.5, 2.0),            // bicyclo[1.1.0]butane, recalled from memory
        ("C1CC2CCC1C2", 17.0, 2.0),         // norbornane, recalled from memory
        ("C1CC12CC2", 62.9, 2.0),           // spiropentane, recalled from memory
        ("C1C2CC3CC1CC(C2)C3", 6.5, 2.0),   // adamantane (Schleyer et al. 1970), recalled
        ("C12C3C4C1C5C2C3C45", 166.0, 5.0), // cubane, recalled from memory
    ];
    let failures: Vec<String> = cases
        .iter()
        .filter_map(|(s, v, tol)| check(&data, s, *v, *tol).err())
        .collect();
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}

#[test]
fn schemes_side_by_side_with_spread() {
    let data = StrainData::bundled().expect("bundled data loads");
    let a = analyse("C1CC1", &data, None);
    assert_eq!(a.schemes.len(), 4, "{:?}", a.schemes);
    for s in &a.schemes {
        let q = s.strain_kj.expect("every scheme applies to cyclopropane");
        assert!(q.uncertainty > 0.0 && q.uncertainty < 4.0, "{s:?}");
    }
    // Schleyer's CH2 increment, -5.13 kcal/mol (recalled from memory, as in the data file):
    // SE = 12.82 + 3 x 5.13 = 28.2 kcal/mol with ATcT's 53.64 kJ/mol.
    assert!((kcal(&a, "Schleyer") - 28.2).abs() < 0.1);
    let spread = a.spread_kj.expect("several schemes") / KJ_PER_KCAL;
    assert!(spread > 0.0 && spread < 1.5, "{spread}");
    // Not a saturated hydrocarbon: the Schleyer set says so instead of giving a number.
    let oxirane = analyse("C1CO1", &data, None);
    let s = oxirane.scheme("Schleyer").expect("listed");
    assert!(s.strain_kj.is_none());
    assert!(s
        .unavailable
        .as_deref()
        .is_some_and(|w| w.starts_with("not applicable")));
}

#[test]
fn target_value_order_and_circular_flag() {
    let data = StrainData::bundled().expect("bundled data loads");
    // A user value wins over the table: 12.0 kcal/mol (invented) for cyclopropane.
    let user = Quantity::new(12.0 * KJ_PER_KCAL, 0.0);
    let a = analyse("C1CC1", &data, Some(user));
    assert_eq!(a.target_hf.origin, TargetHfOrigin::User);
    assert!((kcal(&a, "CBH-2") - (27.6 - 0.82)).abs() < 0.1);
    // Not in the table: the estimate stands in, flagged, and Benson strain = ring corrections.
    let b = analyse("CC1CC1C1CC1", &data, None);
    assert!(b.target_hf.is_circular());
    assert!(b.flags.contains(&StrainFlag::CircularTarget));
    let rings: f64 = b.ring_systems.iter().map(|s| s.strain_kj.value).sum();
    let benson = b.scheme("Benson").and_then(|s| s.strain_kj).expect("value");
    assert!((benson.value - rings).abs() < 1e-9);
}

#[test]
fn strain_per_ring_system() {
    let data = StrainData::bundled().expect("bundled data loads");
    // Cyclopropylcyclobutane: two separate systems, each carrying its own ring correction.
    let a = analyse("C1CC1C1CCC1", &data, None);
    assert_eq!(a.ring_systems.len(), 2, "{:?}", a.ring_systems);
    let mut sizes: Vec<Vec<usize>> = a
        .ring_systems
        .iter()
        .map(|s| s.ring_sizes.clone())
        .collect();
    sizes.sort();
    assert_eq!(sizes, vec![vec![3], vec![4]]);
    for s in &a.ring_systems {
        let kcal = s.strain_kj.value / KJ_PER_KCAL;
        let want = if s.ring_sizes == [3] { 27.5 } else { 26.5 };
        // Common practice: each ring keeps about its parent's strain (+-1.5 kcal/mol).
        assert!((kcal - want).abs() < 1.5, "{s:?}");
    }
    // A spiro compound is one system.
    let b = analyse("C1CC12CC2", &data, None);
    assert_eq!(b.ring_systems.len(), 1);
}
