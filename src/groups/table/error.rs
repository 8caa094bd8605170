//! Errors of the group-table loader: each names the file and, where known, the entry and its line.

use std::fmt;
use std::path::PathBuf;

use crate::groups::key::GroupKeyError;

/// The kind of a table entry, as written in the file (`[[group]]`, `[[correction]]`, `[[ring]]`).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum EntryKind {
    /// A `[[group]]` entry.
    Group,
    /// A `[[correction]]` entry.
    Correction,
    /// A `[[ring]]` entry.
    Ring,
}

impl fmt::Display for EntryKind {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            EntryKind::Group => "group",
            EntryKind::Correction => "correction",
            EntryKind::Ring => "ring",
        })
    }
}

/// Which entry of a file an error is about: kind, key or name as written, and line.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct EntryPlace {
    /// Entry kind.
    pub kind: EntryKind,
    /// The key (groups) or name (corrections, rings), or `#n` (1-based) when the entry has none.
    pub name: String,
    /// 1-based line of the entry, when known.
    pub line: Option<usize>,
}

impl EntryPlace {
    /// The place of a group entry.
    pub fn group(key: &str, line: Option<usize>) -> EntryPlace {
        EntryPlace {
            kind: EntryKind::Group,
            name: key.to_string(),
            line,
        }
    }
}

impl fmt::Display for EntryPlace {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{} \"{}\"", self.kind, self.name)?;
        if let Some(line) = self.line {
            write!(f, " (line {line})")?;
        }
        Ok(())
    }
}

/// Why a group table could not be loaded. Every variant names the file.
#[derive(Debug, thiserror::Error)]
pub enum TableError {
    /// The file or directory could not be read.
    #[error("{}: cannot read: {error}", path.display())]
    Io {
        /// File or directory.
        path: PathBuf,
        /// The I/O error.
        #[source]
        error: std::io::Error,
    },
    /// The file is not valid TOML, or a value has the wrong type or an unknown field.
    #[error("{}{}: {message}", path.display(), line_col(*line, *column))]
    Syntax {
        /// File.
        path: PathBuf,
        /// 1-based line, when the TOML parser gave a position.
        line: Option<usize>,
        /// 1-based column, when the TOML parser gave a position.
        column: Option<usize>,
        /// The parser's message.
        message: String,
    },
    /// `[meta]` is missing, or names an unknown unit or an unusable temperature list.
    #[error("{}: [meta]: {problem}", path.display())]
    Meta {
        /// File.
        path: PathBuf,
        /// What is wrong.
        problem: String,
    },
    /// An entry has no `source`.
    #[error("{}: {place}: no source", path.display())]
    NoSource {
        /// File.
        path: PathBuf,
        /// The entry.
        place: EntryPlace,
    },
    /// A value is given without its uncertainty (`hf` without `unc_hf`, ...).
    #[error("{}: {place}: `{field}` is given without `unc_{field}`", path.display())]
    NoUncertainty {
        /// File.
        path: PathBuf,
        /// The entry.
        place: EntryPlace,
        /// `hf`, `s` or `cp`.
        field: &'static str,
    },
    /// A `cp` array whose length differs from `[meta] cp_temperatures`.
    #[error(
        "{}: {place}: `cp` has {found} values but cp_temperatures has {expected}",
        path.display()
    )]
    CpLength {
        /// File.
        path: PathBuf,
        /// The entry.
        place: EntryPlace,
        /// Values found.
        found: usize,
        /// Values expected.
        expected: usize,
    },
    /// A group key (or a `same_as` target) that is not Benson notation.
    #[error("{}: {place}: {error}", path.display())]
    BadKey {
        /// File.
        path: PathBuf,
        /// The entry.
        place: EntryPlace,
        /// The key parser's complaint.
        #[source]
        error: GroupKeyError,
    },
    /// `same_as` names a group that no loaded file defines.
    #[error("{}: {place}: same_as \"{target}\" is not in the tables", path.display())]
    SameAsMissing {
        /// File of the entry holding the `same_as`.
        path: PathBuf,
        /// The entry.
        place: EntryPlace,
        /// The missing group, in display order.
        target: String,
    },
    /// A chain of `same_as` comes back to a group already in it.
    #[error("{}: {place}: same_as forms a cycle: {}", path.display(), cycle.join(" -> "))]
    SameAsCycle {
        /// File of the entry where the cycle was found.
        path: PathBuf,
        /// The entry.
        place: EntryPlace,
        /// The groups of the cycle, first repeated at the end.
        cycle: Vec<String>,
    },
    /// The same key or name appears twice in one file.
    #[error("{}: {place}: defined twice in this file (first at line {first_line})", path.display())]
    Duplicate {
        /// File.
        path: PathBuf,
        /// The second entry.
        place: EntryPlace,
        /// Line of the first entry (0 when unknown).
        first_line: usize,
    },
    /// Any other problem of one entry (missing key, values on a `same_as` entry, a negative
    /// uncertainty, a field that does not belong to the entry kind, ...).
    #[error("{}: {place}: {problem}", path.display())]
    Entry {
        /// File.
        path: PathBuf,
        /// The entry.
        place: EntryPlace,
        /// What is wrong.
        problem: String,
    },
}

impl TableError {
    /// The file the error is about.
    pub fn path(&self) -> &std::path::Path {
        match self {
            TableError::Io { path, .. }
            | TableError::Syntax { path, .. }
            | TableError::Meta { path, .. }
            | TableError::NoSource { path, .. }
            | TableError::NoUncertainty { path, .. }
            | TableError::CpLength { path, .. }
            | TableError::BadKey { path, .. }
            | TableError::SameAsMissing { path, .. }
            | TableError::SameAsCycle { path, .. }
            | TableError::Duplicate { path, .. }
            | TableError::Entry { path, .. } => path,
        }
    }
}

fn line_col(line: Option<usize>, column: Option<usize>) -> String {
    match (line, column) {
        (Some(l), Some(c)) => format!(":{l}:{c}"),
        (Some(l), None) => format!(":{l}"),
        _ => String::new(),
    }
}
