//! Batch input: SMILES records from arguments, files or standard input, each with its place.
//!
//! A line holds a SMILES, then optionally white space and a free-text name (or a `#` comment).
//! Words `sigma=N` and `optical=N` in the name give that molecule's symmetry number and number
//! of optical isomers, in place of the ones computed from the graph.
//! Blank lines and lines starting with `#` are skipped. Every other line becomes a record, so every such line
//! yields one output row (a result or an error).

use crate::molecule::symmetry::SymmetryOverride;
use std::io::BufRead;

/// Where a record came from, for error messages.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct Place {
    /// File name, `<stdin>` or `<argument>`.
    pub source: String,
    /// 1-based line (or argument position).
    pub line: usize,
}

impl std::fmt::Display for Place {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "{}:{}", self.source, self.line)
    }
}

/// One input molecule.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct InputRecord {
    /// Where it came from.
    pub place: Place,
    /// The SMILES as written.
    pub smiles: String,
    /// The free-text name after the SMILES, if any.
    pub name: Option<String>,
    /// A symmetry number given on the line as `sigma=N`, with `optical=N` (default 1): it
    /// replaces the one computed from the graph for this molecule only.
    pub symmetry: Option<SymmetryOverride>,
    /// A problem with the line's `sigma=` / `optical=` words, reported as the record's error.
    pub problem: Option<String>,
}

/// Takes `sigma=N` and `optical=N` words out of a name; returns the rest, the override and any
/// problem with those words.
fn take_symmetry(name: &str) -> (String, Option<SymmetryOverride>, Option<String>) {
    let mut rest = Vec::new();
    let (mut sigma, mut optical, mut problem) = (None, None, None);
    for word in name.split_whitespace() {
        if let Some(v) = word.strip_prefix("sigma=") {
            match v.parse::<u64>() {
                Ok(n) if n >= 1 => sigma = Some(n),
                _ => problem = Some(format!("`{word}`: sigma must be a whole number >= 1")),
            }
        } else if let Some(v) = word.strip_prefix("optical=") {
            match v.parse::<u8>() {
                Ok(n) if n >= 1 => optical = Some(n),
                _ => problem = Some(format!("`{word}`: optical must be a whole number >= 1")),
            }
        } else {
            rest.push(word);
        }
    }
    if optical.is_some() && sigma.is_none() && problem.is_none() {
        problem = Some("`optical=` needs `sigma=` on the same line".to_string());
    }
    let user = match sigma.map(|s| SymmetryOverride::new(s, optical.unwrap_or(1))) {
        Some(Ok(u)) => Some(u),
        Some(Err(e)) => {
            problem.get_or_insert(e.to_string());
            None
        }
        None => None,
    };
    (rest.join(" "), user, problem)
}

/// Reading the input failed (the file could not be read at all).
#[derive(Debug, thiserror::Error)]
#[error("{source_name}: {error}")]
pub struct InputError {
    /// File name.
    pub source_name: String,
    /// The I/O error.
    #[source]
    pub error: std::io::Error,
}

/// Splits one line into SMILES and name; `None` for blank and comment lines.
pub fn parse_line(line: &str) -> Option<(String, Option<String>)> {
    let trimmed = line.trim();
    if trimmed.is_empty() || trimmed.starts_with('#') {
        return None;
    }
    match trimmed.split_once(char::is_whitespace) {
        Some((smiles, name)) => {
            // A name that starts with `#` is a comment after the SMILES, not a name.
            let name = name.trim();
            let name = if name.starts_with('#') { "" } else { name };
            Some((
                smiles.to_string(),
                (!name.is_empty()).then(|| name.to_string()),
            ))
        }
        None => Some((trimmed.to_string(), None)),
    }
}

/// Reads records from a buffered reader; lines that are not valid UTF-8 still become records
/// (with the bad bytes replaced), so nothing is dropped.
pub fn read_records<R: BufRead>(
    mut reader: R,
    source_name: &str,
) -> Result<Vec<InputRecord>, InputError> {
    let mut records = Vec::new();
    let mut buf = Vec::new();
    let mut line_no = 0;
    loop {
        buf.clear();
        let n = reader
            .read_until(b'\n', &mut buf)
            .map_err(|error| InputError {
                source_name: source_name.to_string(),
                error,
            })?;
        if n == 0 {
            break;
        }
        line_no += 1;
        let text = String::from_utf8_lossy(&buf);
        if let Some((smiles, name)) = parse_line(&text) {
            let (name, symmetry, problem) = match name {
                Some(n) => {
                    let (rest, symmetry, problem) = take_symmetry(&n);
                    ((!rest.is_empty()).then_some(rest), symmetry, problem)
                }
                None => (None, None, None),
            };
            records.push(InputRecord {
                place: Place {
                    source: source_name.to_string(),
                    line: line_no,
                },
                smiles,
                name,
                symmetry,
                problem,
            });
        }
    }
    Ok(records)
}

/// Records from command-line arguments (each argument one SMILES, numbered from 1).
pub fn records_from_arguments(args: &[String]) -> Vec<InputRecord> {
    args.iter()
        .enumerate()
        .map(|(i, s)| InputRecord {
            place: Place {
                source: "<argument>".to_string(),
                line: i + 1,
            },
            smiles: s.clone(),
            name: None,
            symmetry: None,
            problem: None,
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_non_comment_line_is_a_record() {
        let text = "# header\nC1CC1 cyclopropane\n\n  CCO   ethanol, dry \nC1CC\n";
        let recs = read_records(text.as_bytes(), "t.smi").unwrap();
        assert_eq!(recs.len(), 3);
        assert_eq!(recs[0].place.line, 2);
        assert_eq!(recs[1].name.as_deref(), Some("ethanol, dry"));
        assert_eq!(recs[2].smiles, "C1CC");
        assert_eq!(recs[2].place.to_string(), "t.smi:5");
    }

    #[test]
    fn symmetry_words_leave_the_name() {
        let text = "C1CCCCC1 cyclohexane chair sigma=6\nCC x optical=2\nCC sigma=0\n";
        let recs = read_records(text.as_bytes(), "t.smi").unwrap();
        assert_eq!(recs[0].name.as_deref(), Some("cyclohexane chair"));
        assert_eq!(recs[0].symmetry, SymmetryOverride::new(6, 1).ok());
        assert!(recs[1].problem.is_some() && recs[2].problem.is_some());
    }
}
