//! SMILES errors: what went wrong, the byte column where it happened, and a caret display.

use std::fmt;

use crate::molecule::element::Element;

/// A SMILES that could not be read, with the place where reading stopped.
///
/// `Display` prints the problem, `at column N` (1-based, as editors count; the field
/// [`SmilesError::column`] is the 0-based byte offset), then the input on the next line and a
/// caret under the column.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("{kind} at column {}\n{}", .column + 1, caret_lines(.input, *.column))]
pub struct SmilesError {
    /// What went wrong.
    pub kind: SmilesErrorKind,
    /// Byte column (0-based) of the character the problem belongs to.
    pub column: usize,
    /// The SMILES as given.
    pub input: String,
}

/// The kinds of problem a SMILES can have.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum SmilesErrorKind {
    /// The input holds no characters at all.
    Empty,
    /// A character that has no meaning at this place (whitespace included).
    UnexpectedCharacter(char),
    /// A letter sequence that names no element (or the wildcard `*`, which is not supported).
    UnknownElement(String),
    /// A real element outside the organic subset written without brackets (`Na`, `H`).
    NeedsBrackets(String),
    /// A ring-bond number opened and never closed; the column is that of its opening.
    UnclosedRingBond {
        /// The ring-bond number as written (`1`, or `10` for `%10`).
        ring: u8,
    },
    /// `%` not followed by two digits.
    BadRingNumber,
    /// A `(` that is never closed; the column is that of the `(`.
    UnclosedBranch,
    /// A `)` without a matching `(`.
    StrayCloseParen,
    /// `()` with no atom inside.
    EmptyBranch,
    /// A bond symbol with no atom after it (before `)`, `.`, `(`, the end, or at the start).
    BondToNothing,
    /// The two ends of a ring bond carry different bond symbols.
    RingBondConflict {
        /// The ring-bond number.
        ring: u8,
    },
    /// A ring bond that would join an atom to itself (`C11`).
    RingBondToSelf {
        /// The ring-bond number.
        ring: u8,
    },
    /// A ring bond between two atoms that are already bonded.
    DuplicateBond {
        /// The ring-bond number.
        ring: u8,
    },
    /// A bracket atom that could not be read.
    BadBracketAtom(BracketProblem),
    /// An atom whose bonds (and hydrogens) exceed every valence its element allows.
    ImpossibleValence {
        /// The element of the atom.
        element: Element,
        /// Its valence as written: bond orders plus hydrogens.
        valence: u32,
    },
    /// Aromatic atoms for which no alternating single/double bond pattern exists; the column
    /// is that of an atom of the failing aromatic system.
    CannotKekulize,
}

/// What is wrong inside a bracket atom.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum BracketProblem {
    /// No closing `]`; the column is that of the `[`.
    Unterminated,
    /// No element symbol after the isotope.
    MissingElement,
    /// An isotope number too large to be one.
    Isotope,
    /// A chirality tag that is not one of `@`, `@@`, `@TH1-2`, `@AL1-2`, `@SP1-3`,
    /// `@TB1-20`, `@OH1-30`.
    Chirality,
    /// A charge that is malformed or beyond +/-15.
    Charge,
    /// An atom class that is missing its number or too large.
    AtomClass,
    /// A character that does not belong at this place inside the brackets.
    Unexpected(char),
}

impl fmt::Display for BracketProblem {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            BracketProblem::Unterminated => f.write_str("bracket atom has no closing ']'"),
            BracketProblem::MissingElement => f.write_str("bracket atom has no element symbol"),
            BracketProblem::Isotope => f.write_str("isotope number is too large"),
            BracketProblem::Chirality => f.write_str("chirality tag is not recognised"),
            BracketProblem::Charge => f.write_str("charge is malformed or out of range"),
            BracketProblem::AtomClass => f.write_str("atom class is missing or too large"),
            BracketProblem::Unexpected(c) => {
                write!(f, "character {c:?} does not belong inside a bracket atom")
            }
        }
    }
}

impl fmt::Display for SmilesErrorKind {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            SmilesErrorKind::Empty => f.write_str("empty SMILES"),
            SmilesErrorKind::UnexpectedCharacter(c) => write!(f, "unexpected character {c:?}"),
            SmilesErrorKind::UnknownElement(s) => write!(f, "unknown element {s:?}"),
            SmilesErrorKind::NeedsBrackets(s) => {
                write!(f, "element {s} must be written in brackets, as [{s}]")
            }
            SmilesErrorKind::UnclosedRingBond { ring } => {
                write!(
                    f,
                    "ring bond {} is opened but never closed",
                    ring_label(*ring)
                )
            }
            SmilesErrorKind::BadRingNumber => f.write_str("'%' must be followed by two digits"),
            SmilesErrorKind::UnclosedBranch => f.write_str("branch '(' is never closed"),
            SmilesErrorKind::StrayCloseParen => f.write_str("')' has no matching '('"),
            SmilesErrorKind::EmptyBranch => f.write_str("branch '()' holds no atom"),
            SmilesErrorKind::BondToNothing => f.write_str("bond symbol has no atom to bond to"),
            SmilesErrorKind::RingBondConflict { ring } => write!(
                f,
                "the two ends of ring bond {} carry different bond symbols",
                ring_label(*ring)
            ),
            SmilesErrorKind::RingBondToSelf { ring } => {
                write!(f, "ring bond {} joins an atom to itself", ring_label(*ring))
            }
            SmilesErrorKind::DuplicateBond { ring } => write!(
                f,
                "ring bond {} joins two atoms that are already bonded",
                ring_label(*ring)
            ),
            SmilesErrorKind::BadBracketAtom(p) => write!(f, "bad bracket atom: {p}"),
            SmilesErrorKind::ImpossibleValence { element, valence } => write!(
                f,
                "atom {element} has valence {valence}, more than {element} allows"
            ),
            SmilesErrorKind::CannotKekulize => {
                f.write_str("aromatic atoms cannot be given alternating single and double bonds")
            }
        }
    }
}

/// A ring-bond number as it would be written: `1` or `%10`.
fn ring_label(ring: u8) -> String {
    if ring < 10 {
        ring.to_string()
    } else {
        format!("%{ring:02}")
    }
}

/// Widest input shown in full; longer inputs show a window around the column.
const MAX_SHOWN: usize = 80;

/// The input (or a window of it) and a caret line under `column`.
fn caret_lines(input: &str, column: usize) -> String {
    let (shown, caret) = window(input, column);
    format!("{shown}\n{}^", " ".repeat(caret))
}

/// The part of `input` to print and the caret offset (in characters) within it.
fn window(input: &str, column: usize) -> (String, usize) {
    let column = floor_boundary(input, column.min(input.len()));
    if input.len() <= MAX_SHOWN {
        return (input.to_string(), input[..column].chars().count());
    }
    let start = floor_boundary(input, column.saturating_sub(MAX_SHOWN / 2));
    let end = floor_boundary(input, (start + MAX_SHOWN).min(input.len()));
    let mut shown = String::with_capacity(MAX_SHOWN + 6);
    let mut caret = input[start..column].chars().count();
    if start > 0 {
        shown.push_str("...");
        caret += 3;
    }
    shown.push_str(&input[start..end]);
    if end < input.len() {
        shown.push_str("...");
    }
    (shown, caret)
}

/// The largest char boundary of `s` at or below `i`.
fn floor_boundary(s: &str, mut i: usize) -> usize {
    while i > 0 && !s.is_char_boundary(i) {
        i -= 1;
    }
    i
}

#[cfg(test)]
mod tests {
    use super::*;

    fn error(kind: SmilesErrorKind, column: usize, input: &str) -> SmilesError {
        SmilesError {
            kind,
            column,
            input: input.to_string(),
        }
    }

    #[test]
    fn caret_sits_under_the_column() {
        let e = error(SmilesErrorKind::UnexpectedCharacter('x'), 3, "CCCxC");
        let text = e.to_string();
        let lines: Vec<&str> = text.lines().collect();
        assert_eq!(lines[0], "unexpected character 'x' at column 4");
        assert_eq!(lines[1], "CCCxC");
        assert_eq!(lines[2], "   ^");
    }

    #[test]
    fn long_input_shows_a_window() {
        let input = format!("{}x{}", "C".repeat(200), "C".repeat(200));
        let e = error(SmilesErrorKind::UnexpectedCharacter('x'), 200, &input);
        let text = e.to_string();
        let lines: Vec<&str> = text.lines().collect();
        assert!(lines[1].starts_with("...") && lines[1].ends_with("..."));
        assert!(lines[1].len() <= MAX_SHOWN + 6);
        let caret = lines[2].len() - 1;
        assert_eq!(&lines[1][caret..caret + 1], "x");
    }

    #[test]
    fn column_past_the_end_and_multibyte_input_do_not_panic() {
        let e = error(SmilesErrorKind::Empty, 10, "");
        assert!(e.to_string().contains("at column 11"));
        let e = error(SmilesErrorKind::UnexpectedCharacter('é'), 2, "CCé");
        assert!(e.to_string().ends_with("  ^"));
        let long = format!("{}é{}", "C".repeat(100), "C".repeat(100));
        let e = error(SmilesErrorKind::UnexpectedCharacter('é'), 100, &long);
        assert!(e.to_string().contains('é'));
    }

    #[test]
    fn ring_labels_use_percent_above_nine() {
        assert_eq!(ring_label(7), "7");
        assert_eq!(ring_label(10), "%10");
        assert_eq!(ring_label(99), "%99");
    }
}
