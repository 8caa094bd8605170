//! Shared helpers for the reference tests: reading the TSV files under `tests/reference/`
//! (a `#` comment block, one header row, tab-separated rows) and running a call that may panic.

#![allow(dead_code)]

use std::cell::Cell;
use std::panic::{self, AssertUnwindSafe};
use std::path::PathBuf;
use std::sync::Once;

/// One data row of a reference file with the 1-based line it came from.
pub struct Row {
    /// Line number in the file (1-based), for messages.
    pub line: usize,
    cells: Vec<String>,
}

/// A reference table: column names from the header row, then the rows.
pub struct Table {
    /// File name, for messages.
    pub name: String,
    /// Column names in file order.
    pub columns: Vec<String>,
    /// Data rows.
    pub rows: Vec<Row>,
}

/// Path of a file in `tests/reference/`.
pub fn reference_path(file: &str) -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("tests")
        .join("reference")
        .join(file)
}

impl Table {
    /// Reads `tests/reference/<file>`; panics with the path if it is missing or malformed
    /// (a test helper: the reference files are part of the repository).
    pub fn read(file: &str) -> Table {
        let path = reference_path(file);
        let text = std::fs::read_to_string(&path)
            .unwrap_or_else(|e| panic!("cannot read {}: {e}", path.display()));
        let mut columns: Option<Vec<String>> = None;
        let mut rows = Vec::new();
        for (i, raw) in text.lines().enumerate() {
            if raw.starts_with('#') || raw.trim().is_empty() {
                continue;
            }
            let cells: Vec<String> = raw.split('\t').map(str::to_string).collect();
            match &columns {
                None => columns = Some(cells),
                Some(cols) => {
                    assert_eq!(
                        cells.len(),
                        cols.len(),
                        "{file} line {}: {} cells, header has {}",
                        i + 1,
                        cells.len(),
                        cols.len()
                    );
                    rows.push(Row { line: i + 1, cells });
                }
            }
        }
        let columns = columns.unwrap_or_else(|| panic!("{file}: no header row"));
        Table {
            name: file.to_string(),
            columns,
            rows,
        }
    }

    /// Index of a column; panics naming the file if it is absent.
    pub fn column(&self, name: &str) -> usize {
        self.columns
            .iter()
            .position(|c| c == name)
            .unwrap_or_else(|| panic!("{}: no column {name:?}", self.name))
    }
}

impl Row {
    /// The cell at column index `i`.
    pub fn get(&self, i: usize) -> &str {
        &self.cells[i]
    }
}

thread_local! {
    static QUIET: Cell<bool> = const { Cell::new(false) };
}

/// Runs `f`, turning a panic into `Err(message)` so that one bad row is reported with the
/// others instead of ending the test. Panic messages are not printed for panics caught here;
/// other panics (failed assertions, other threads) print as usual.
pub fn catch<T>(f: impl FnOnce() -> T) -> Result<T, String> {
    static INSTALL: Once = Once::new();
    INSTALL.call_once(|| {
        let previous = panic::take_hook();
        panic::set_hook(Box::new(move |info| {
            if !QUIET.with(Cell::get) {
                previous(info);
            }
        }));
    });
    QUIET.with(|q| q.set(true));
    let out = panic::catch_unwind(AssertUnwindSafe(f));
    QUIET.with(|q| q.set(false));
    out.map_err(|payload| {
        if let Some(s) = payload.downcast_ref::<&str>() {
            format!("panic: {s}")
        } else if let Some(s) = payload.downcast_ref::<String>() {
            format!("panic: {s}")
        } else {
            "panic with a non-text payload".to_string()
        }
    })
}

/// Text of an error or value on one line (tabs and newlines replaced), for TSV-friendly output.
pub fn one_line(text: &str) -> String {
    text.replace(['\n', '\t'], " ")
}

/// Element counts (all elements) and charge, reactants minus products, computed from the
/// species' formulas independently of the reaction builder; `None` when the reaction balances.
pub fn reaction_imbalance(r: &ringheat::reactions::Reaction) -> Option<String> {
    use ringheat::molecule::formula::Formula;
    use ringheat::molecule::Element;
    let mut net = [0i64; 119];
    let mut charge = 0i64;
    for (species, coefficient) in r.signed_terms() {
        let formula = Formula::of(&species.molecule);
        for (z, slot) in net.iter_mut().enumerate().skip(1) {
            if let Some(e) = Element::from_atomic_number(z as u8) {
                *slot += coefficient * i64::from(formula.count(e));
            }
        }
        charge += coefficient * i64::from(formula.charge());
    }
    if let Some(z) = (1..net.len()).find(|&z| net[z] != 0) {
        let symbol = Element::from_atomic_number(z as u8).map_or("?", |e| e.symbol());
        return Some(format!("{symbol} off by {}", net[z]));
    }
    (charge != 0).then(|| format!("charge off by {charge}"))
}
