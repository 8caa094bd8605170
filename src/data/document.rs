//! TOML text to a typed document, with the line of every entry: the one reader under every data
//! file. Syntax errors, wrong types and unknown fields come back as a [`DataError`] with file,
//! line and column.

use std::path::{Path, PathBuf};

use serde::de::DeserializeOwned;

use super::error::{DataError, Place, Problem};

/// A data file's text with its label (bundled files: `group-tables/NAME.toml`; user files: the
/// path given).
#[derive(Debug, Clone, Copy)]
pub struct Source<'a> {
    /// Label used in errors and origins.
    pub path: &'a Path,
    /// The file's text.
    pub text: &'a str,
}

impl Source<'_> {
    /// Parses the whole text as `T` (whose entries may be `toml::Spanned` to keep their place).
    pub fn parse<T: DeserializeOwned>(&self) -> Result<T, DataError> {
        toml::from_str(self.text).map_err(|e| {
            let (line, column) = match e.span() {
                Some(span) => {
                    let (l, c) = line_and_column(self.text, span.start);
                    (Some(l), Some(c))
                }
                None => (None, None),
            };
            DataError::new(
                Place {
                    file: self.path.to_path_buf(),
                    line,
                    column,
                    entry: None,
                },
                Problem::Syntax(e.message().trim().to_string()),
            )
        })
    }

    /// 1-based line of a byte offset of the text (for `toml::Spanned` entries).
    pub fn line_of(&self, offset: usize) -> usize {
        line_and_column(self.text, offset).0
    }
}

/// Reads a file from disk.
pub fn read_file(path: &Path) -> Result<String, DataError> {
    std::fs::read_to_string(path).map_err(|e| DataError::io(path, &e))
}

/// The `*.toml` files directly inside `dir` (not sub-directories), sorted by file name.
pub fn toml_files_in(dir: &Path) -> Result<Vec<PathBuf>, DataError> {
    let io_error = |e: std::io::Error| DataError::io(dir, &e);
    let mut files = Vec::new();
    for item in std::fs::read_dir(dir).map_err(io_error)? {
        let path = item.map_err(io_error)?.path();
        if path.is_file() && path.extension().is_some_and(|x| x == "toml") {
            files.push(path);
        }
    }
    files.sort();
    Ok(files)
}

/// 1-based line and column (in characters) of a byte offset.
pub fn line_and_column(text: &str, offset: usize) -> (usize, usize) {
    let offset = offset.min(text.len());
    let before = text.get(..offset).unwrap_or(text);
    let line = before.matches('\n').count() + 1;
    let line_start = before.rfind('\n').map_or(0, |i| i + 1);
    let column = before.get(line_start..).map_or(0, |s| s.chars().count()) + 1;
    (line, column)
}
