//! Reports: turns results into tables, JSON or CSV; every input record becomes one row.

pub mod cantera_yaml;
pub mod computed;
pub mod energetics;
pub mod hazard;
pub mod html;
pub mod polymer;
pub mod polynomials;
pub mod reactions;
pub mod strain;
pub mod structure;
pub mod thermo;

use crate::input::Place;

/// Output format of a report.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, clap::ValueEnum)]
pub enum OutputFormat {
    /// Human-readable tables.
    #[default]
    Table,
    /// One JSON document (an array with one object per input record).
    Json,
    /// Comma-separated values with a header row.
    Csv,
}

/// A failed record: where it was, what it said, and why it failed (multi-line for SMILES errors).
#[derive(Debug, Clone, serde::Serialize)]
pub struct RowError {
    /// Where the record came from.
    pub place: Place,
    /// The input as written.
    pub input: String,
    /// The error, as printed (may hold the input with a caret line).
    pub message: String,
}

impl RowError {
    /// The CSV line of a failed record: its input, empty cells, and the error (on one line)
    /// in the last of `width` columns.
    pub fn csv_cells(&self, width: usize) -> Vec<String> {
        let mut v = vec![self.input.clone()];
        v.extend(std::iter::repeat_n(String::new(), width.saturating_sub(2)));
        v.push(format!(
            "{}: {}",
            self.place,
            self.message.replace('\n', " | ")
        ));
        v
    }
}

/// The outcome for one input record.
#[derive(Debug, Clone, serde::Serialize)]
#[serde(untagged)]
pub enum Row<T> {
    /// A result.
    Done(T),
    /// An error.
    Failed {
        /// The error.
        error: RowError,
    },
}

/// Writes a CSV document from a header and rows of cells.
pub fn write_csv(header: &[&str], rows: &[Vec<String>]) -> String {
    let mut w = csv::Writer::from_writer(Vec::new());
    // Writing to a Vec cannot fail except on out-of-memory; keep the error visible anyway.
    let mut problems = Vec::new();
    if let Err(e) = w.write_record(header) {
        problems.push(e.to_string());
    }
    for r in rows {
        if let Err(e) = w.write_record(r) {
            problems.push(e.to_string());
        }
    }
    let bytes = w.into_inner().unwrap_or_default();
    let mut out = String::from_utf8_lossy(&bytes).into_owned();
    for p in problems {
        out.push_str(&format!("# csv error: {p}\n"));
    }
    out
}

/// Formats a float with a fixed number of decimals, or an empty cell for NaN/None.
pub fn cell(value: Option<f64>, decimals: usize) -> String {
    match value {
        Some(v) if v.is_finite() => format!("{v:.decimals$}"),
        _ => String::new(),
    }
}

/// The two CSV cells of a quantity, value then uncertainty, or two empty cells.
pub fn quantity_cells(
    q: Option<crate::thermo::quantity::Quantity>,
    decimals: usize,
) -> [String; 2] {
    [
        cell(q.map(|q| q.value), decimals),
        cell(q.map(|q| q.uncertainty), decimals),
    ]
}

/// `value ± uncertainty` scaled by `factor`, or `n/a`.
pub fn pm(q: Option<crate::thermo::quantity::Quantity>, factor: f64, decimals: usize) -> String {
    match q {
        Some(q) if q.value.is_finite() => format!(
            "{:.d$} ± {:.d$}",
            q.value * factor,
            q.uncertainty * factor,
            d = decimals
        ),
        _ => "n/a".to_string(),
    }
}

/// A record's title: its input, with its name in parentheses when it has one.
pub fn record_title(input: &str, name: Option<&str>) -> String {
    match name {
        Some(n) => format!("{input} ({n})"),
        None => input.to_string(),
    }
}

/// The table view's block for a failed record: `place: error: message`, continuation lines
/// indented, and a blank line.
pub fn failed_block(error: &RowError) -> String {
    format!(
        "{}: error: {}\n\n",
        error.place,
        error.message.replace('\n', "\n  ")
    )
}

/// Number of failed rows.
pub fn failed_count<T>(rows: &[Row<T>]) -> usize {
    rows.iter()
        .filter(|r| matches!(r, Row::Failed { .. }))
        .count()
}

/// The cautions printed with anything that may inform process-safety decisions.
pub const SAFETY_NOTE: &str = "Screening estimates only (gas phase, group additivity; errors of \
several kJ/mol are usual). Not a substitute for calorimetry or a qualified process-safety review; \
follow local codes and licensed practice.";
