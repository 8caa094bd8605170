//! Timing of symmetry numbers for the large symmetric cases (C60, tetra-tert-butylmethane).

use criterion::{criterion_group, criterion_main, Criterion};
use ringheat::molecule::parse_smiles;
use ringheat::molecule::symmetry::symmetry_number;
use std::hint::black_box;

const CASES: &[(&str, &str)] = &[
    ("C60", "c12c3c4c5c1c1c6c7c2c2c8c3c3c9c4c4c%10c5c5c1c1c6c6c%11c7c2c2c7c8c3c3c8c9c4c4c9c%10c5c5c1c1c6c6c%11c2c2c7c3c3c8c4c4c9c5c1c1c6c2c3c41"),
    ("tetra-tert-butylmethane", "CC(C)(C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C"),
    ("dodecahedrane", "C12C3C4C5C1C6C7C2C8C3C9C4C%10C5C6C%11C7C8C9C%10%11"),
    ("hexamethylbenzene", "Cc1c(C)c(C)c(C)c(C)c1C"),
];

/// PubChem-like input: the molecules of the spelling-invariance sample as PubChem gives them
/// (`tests/reference/six_spellings.tsv`, column `as_given`), perceived as the estimate does.
fn pubchem_like() -> Vec<ringheat::molecule::PerceivedMolecule> {
    include_str!("../tests/reference/six_spellings.tsv")
        .lines()
        .filter(|l| !l.starts_with('#'))
        .skip(1)
        .filter_map(|l| l.split('\t').nth(1))
        .take(1000)
        .filter_map(|s| ringheat::molecule::PerceivedMolecule::from_smiles(s).ok())
        .collect()
}

fn symmetry(c: &mut Criterion) {
    let set = pubchem_like();
    let mut group = c.benchmark_group("symmetry_number PubChem-like");
    group.throughput(criterion::Throughput::Elements(set.len() as u64));
    group.bench_function("per batch of the first 1000 sample molecules", |b| {
        b.iter(|| {
            set.iter()
                .map(|p| symmetry_number(black_box(&p.mol)).total)
                .fold(0u64, u64::wrapping_add)
        })
    });
    group.finish();
    for &(name, smiles) in CASES {
        let Ok(mol) = parse_smiles(smiles) else {
            continue;
        };
        c.bench_function(&format!("symmetry_number {name}"), |b| {
            b.iter(|| symmetry_number(black_box(&mol)))
        });
    }
}

criterion_group!(benches, symmetry);
criterion_main!(benches);
