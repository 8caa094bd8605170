//! Throughput of the whole estimate pipeline (parse, perceive rings and aromaticity, assign
//! groups, corrections, ring corrections, symmetry, sums) on the parser benchmark's typical
//! structures (`benches/parse_smiles.txt`), the per-molecule cost that batch screening pays.
//!
//! Run with `cargo bench --bench estimate`; it also prints molecules per second from one timed
//! pass. Molecules the tables cannot treat still count: they cost the work up to their error.

use std::hint::black_box;
use std::time::{Duration, Instant};

use criterion::{criterion_group, criterion_main, Criterion, Throughput};
use ringheat::molecule::PerceivedMolecule;
use ringheat::thermo::{EstimateOptions, GroupAdditivity};

fn structures() -> Vec<&'static str> {
    include_str!("parse_smiles.txt")
        .lines()
        .map(str::trim)
        .filter(|l| !l.is_empty() && !l.starts_with('#'))
        .collect()
}

fn estimate_all(engine: &GroupAdditivity, set: &[&str]) -> usize {
    let options = EstimateOptions::default();
    set.iter()
        .filter_map(|s| PerceivedMolecule::from_smiles(black_box(s)).ok())
        .filter(|p| engine.estimate(p, &options).is_ok())
        .count()
}

fn bench(c: &mut Criterion) {
    let engine = match GroupAdditivity::bundled() {
        Ok(e) => e,
        Err(e) => {
            eprintln!("bundled tables do not load: {e}");
            return;
        }
    };
    let set = structures();
    let start = Instant::now();
    let mut done = 0usize;
    let mut estimated = 0usize;
    while start.elapsed() < Duration::from_secs(2) {
        estimated = estimate_all(&engine, &set);
        done += set.len();
    }
    println!(
        "estimate: {} structures ({} estimable), {:.0} molecules/second",
        set.len(),
        estimated,
        done as f64 / start.elapsed().as_secs_f64()
    );
    let mut group = c.benchmark_group("estimate");
    group.throughput(Throughput::Elements(set.len() as u64));
    group.bench_function("typical structures", |b| {
        b.iter(|| estimate_all(&engine, &set))
    });
    group.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
