//! The one error type of the data layer: every problem of every data file, with its place (file,
//! line, column where known, and the entry it is about).

use std::fmt;
use std::path::{Path, PathBuf};

use crate::groups::key::GroupKeyError;

/// The kind of an entry, as the file writes it (`[[group]]`, `[[species]]`, ...).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum EntryKind {
    /// A `[[group]]` entry of a group table.
    Group,
    /// A `[[correction]]` entry of a group table.
    Correction,
    /// A `[[ring]]` entry of a group table.
    Ring,
    /// A `[[species]]` entry of a reference-species table.
    Species,
    /// A `[[set]]` of strain-free increments.
    IncrementSet,
    /// A `[[unreliable]]` entry of the list of unreliable species.
    Unreliable,
}

impl fmt::Display for EntryKind {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            EntryKind::Group => "group",
            EntryKind::Correction => "correction",
            EntryKind::Ring => "ring",
            EntryKind::Species => "species",
            EntryKind::IncrementSet => "set",
            EntryKind::Unreliable => "unreliable",
        })
    }
}

/// Which entry of a file an error is about: kind, key or name as written, and line.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct EntryPlace {
    /// Entry kind.
    pub kind: EntryKind,
    /// The key (groups), name (corrections, rings, sets) or SMILES (species) as written, or
    /// `#n` (1-based position in the file) when the entry has none.
    pub name: String,
    /// 1-based line of the entry, when known.
    pub line: Option<usize>,
}

impl EntryPlace {
    /// The place of an entry.
    pub fn new(kind: EntryKind, name: impl Into<String>, line: Option<usize>) -> EntryPlace {
        EntryPlace {
            kind,
            name: name.into(),
            line,
        }
    }

    /// The place of a group entry.
    pub fn group(key: &str, line: Option<usize>) -> EntryPlace {
        EntryPlace::new(EntryKind::Group, key, line)
    }
}

impl fmt::Display for EntryPlace {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{} \"{}\"", self.kind, self.name)
    }
}

/// Where in a data file a problem is: the file, the line and column where known, the entry.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Place {
    /// The file, as given to the loader (bundled files read `group-tables/...`).
    pub file: PathBuf,
    /// 1-based line.
    pub line: Option<usize>,
    /// 1-based column (in characters), when the TOML parser gave one.
    pub column: Option<usize>,
    /// The entry the problem is about, if any.
    pub entry: Option<EntryPlace>,
}

impl Place {
    /// The whole file.
    pub fn file(path: &Path) -> Place {
        Place {
            file: path.to_path_buf(),
            line: None,
            column: None,
            entry: None,
        }
    }

    /// One entry of the file (its line is the entry's).
    pub fn entry(path: &Path, entry: EntryPlace) -> Place {
        Place {
            file: path.to_path_buf(),
            line: entry.line,
            column: None,
            entry: Some(entry),
        }
    }
}

impl fmt::Display for Place {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}", self.file.display())?;
        if let Some(line) = self.line {
            write!(f, ":{line}")?;
            if let Some(column) = self.column {
                write!(f, ":{column}")?;
            }
        }
        if let Some(entry) = &self.entry {
            write!(f, ": {entry}")?;
        }
        Ok(())
    }
}

/// What is wrong with a data file.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum Problem {
    /// The file or directory could not be read.
    #[error("cannot read: {0}")]
    Io(String),
    /// Not valid TOML, a value of the wrong type, or a field the format does not know.
    #[error("{0}")]
    Syntax(String),
    /// `[meta]` is missing, or names an unknown unit or an unusable temperature list.
    #[error("[meta]: {0}")]
    Meta(String),
    /// An entry has no `source`.
    #[error("no source")]
    NoSource,
    /// A value is given without its uncertainty (`hf` without `unc_hf`, ...).
    #[error("`{field}` is given without `unc_{field}`")]
    NoUncertainty {
        /// `hf`, `s` or `cp`.
        field: &'static str,
    },
    /// A `cp` array whose length differs from `[meta] cp_temperatures`.
    #[error("`cp` has {found} values but cp_temperatures has {expected}")]
    CpLength {
        /// Values found.
        found: usize,
        /// Values expected.
        expected: usize,
    },
    /// A group key (or a `same_as` target) that is not Benson notation.
    #[error("{0}")]
    BadKey(GroupKeyError),
    /// `same_as` names a group that no loaded file defines.
    #[error("same_as \"{target}\" is not in the tables")]
    SameAsMissing {
        /// The missing group, in display order.
        target: String,
    },
    /// A chain of `same_as` comes back to a group already in it.
    #[error("same_as forms a cycle: {}", cycle.join(" -> "))]
    SameAsCycle {
        /// The groups of the cycle, first repeated at the end.
        cycle: Vec<String>,
    },
    /// The same key, name or structure appears twice.
    #[error("defined twice (first at {first})")]
    Duplicate {
        /// Where the first one is (`line N` in the same file, else `FILE:LINE` and its name).
        first: String,
    },
    /// A `derived_from` that is not the typed provenance form.
    #[error("derived_from: {0}")]
    Provenance(String),
    /// Any other problem of one entry (missing key, values on a `same_as` entry, a negative
    /// uncertainty, a field that does not belong to the entry kind, ...).
    #[error("{0}")]
    Entry(String),
}

/// Why a data file could not be loaded: the problem and its place.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[error("{place}: {problem}")]
pub struct DataError {
    /// Where (boxed: errors stay small on the `Ok` path).
    pub place: Box<Place>,
    /// What.
    pub problem: Problem,
}

impl DataError {
    /// A problem at a place.
    pub fn new(place: Place, problem: Problem) -> DataError {
        DataError {
            place: Box::new(place),
            problem,
        }
    }

    /// A problem of one entry of `path`.
    pub fn at_entry(path: &Path, entry: &EntryPlace, problem: Problem) -> DataError {
        DataError::new(Place::entry(path, entry.clone()), problem)
    }

    /// A file or directory that could not be read.
    pub fn io(path: &Path, error: &std::io::Error) -> DataError {
        DataError::new(Place::file(path), Problem::Io(error.to_string()))
    }

    /// The file the error is about.
    pub fn path(&self) -> &Path {
        &self.place.file
    }
}
