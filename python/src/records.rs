//! Records from Python sequences and files, and the estimate run over them on threads.
//!
//! The estimate goes through the library's `report::thermo::estimate_rows`, the function the
//! command line uses, so a Python row is the command line's row; only the conversion to
//! Python's field names (`rows.rs`) is ours.

use std::io::BufReader;
use std::path::Path;

use ringheat::input::{read_records, InputRecord, Place};
use ringheat::report::thermo::estimate_rows;
use ringheat::thermo::{EstimateOptions, GroupAdditivity};

use crate::rows::{self, PyEstimate, PyRow};

/// One item from Python: a SMILES and an optional name.
pub type Item = (String, Option<String>);

/// Records under `source`, numbered by `lines` when given (one per item), else from
/// `first_line` on, like command-line arguments.
pub fn from_items(
    items: Vec<Item>,
    source: &str,
    first_line: usize,
    lines: Option<Vec<usize>>,
) -> Result<Vec<InputRecord>, String> {
    if let Some(lines) = &lines {
        if lines.len() != items.len() {
            return Err(format!(
                "{} line numbers for {} items: give one per item",
                lines.len(),
                items.len()
            ));
        }
    }
    Ok(items
        .into_iter()
        .enumerate()
        .map(|(i, (smiles, name))| InputRecord {
            place: Place {
                source: source.to_string(),
                line: lines.as_ref().map_or(first_line + i, |l| l[i]),
            },
            smiles,
            name,
            symmetry: None,
            problem: None,
        })
        .collect())
}

/// The records of a file, read as `--file` reads it (names, `sigma=`, comments, places).
pub fn from_file(path: &Path) -> Result<Vec<InputRecord>, String> {
    let name = path.display().to_string();
    let file = std::fs::File::open(path).map_err(|e| format!("cannot open {name}: {e}"))?;
    read_records(BufReader::new(file), &name).map_err(|e| e.to_string())
}

/// Estimate rows of `records` in input order, on `threads` threads (0: one per core).
pub fn estimate(
    records: &[InputRecord],
    engine: &GroupAdditivity,
    options: &EstimateOptions,
    temperatures_k: &[f64],
    threads: usize,
) -> Vec<PyRow<PyEstimate>> {
    let threads = match threads {
        0 => std::thread::available_parallelism().map_or(1, |n| n.get()),
        n => n,
    };
    let chunk = records.len().div_ceil(threads.max(1)).max(1);
    let run = |part: &[InputRecord]| -> Vec<PyRow<PyEstimate>> {
        estimate_rows(part, engine, options, temperatures_k)
            .iter()
            .zip(part)
            .map(|(row, r)| {
                rows::convert(row, r.name.clone(), "estimate", |done| {
                    rows::estimate_of(done, (&r.place.source, r.place.line))
                })
            })
            .collect()
    };
    if threads <= 1 || records.len() <= 1 {
        return run(records);
    }
    std::thread::scope(|s| {
        let handles: Vec<_> = records
            .chunks(chunk)
            .map(|part| s.spawn(move || run(part)))
            .collect();
        handles
            .into_iter()
            .flat_map(|h| h.join().unwrap_or_else(|p| std::panic::resume_unwind(p)))
            .collect()
    })
}
