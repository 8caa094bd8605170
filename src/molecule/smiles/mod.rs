//! SMILES parsing (OpenSMILES) into a molecular graph, with located errors.
//!
//! [`parse_smiles`] reads the organic subset with implicit hydrogens, bracket atoms
//! (isotope, element, chirality, hydrogen count, charge, atom class), ring bonds (`1`, `%12`),
//! branches, bond symbols `- = # $ : / \` and `.`-separated components, then kekulizes
//! aromatic input. Errors carry the byte column and print the input with a caret.
//!
//! ```
//! use ringheat::molecule::{parse_smiles, SmilesErrorKind};
//!
//! let pyridine = parse_smiles("c1ccncc1").unwrap();
//! assert_eq!(pyridine.atom_count(), 6);
//!
//! let err = parse_smiles("C1CC").unwrap_err();
//! assert_eq!(err.kind, SmilesErrorKind::UnclosedRingBond { ring: 1 });
//! assert_eq!(err.column, 1);
//! ```

mod bracket;
mod error;
mod reader;
#[cfg(test)]
mod tests;
mod valence;

pub use error::{BracketProblem, SmilesError, SmilesErrorKind};
pub use valence::allowed_valences;

use crate::molecule::graph::Molecule;
use crate::molecule::kekulize::kekulize;

/// Parses one SMILES string into a [`Molecule`].
///
/// Hydrogens of organic-subset atoms become implicit counts (`Atom::hydrogens`); bracket
/// atoms keep the count written. Bracket atoms of organic-subset elements below their
/// lowest valence get radical electrons (`[CH3]` has one). Aromatic bonds are kekulized;
/// `Atom::aromatic` and `Bond::aromatic` keep what was written. Whitespace anywhere is an
/// error: split names or other fields off before calling.
pub fn parse_smiles(input: &str) -> Result<Molecule, SmilesError> {
    let fail = |kind, column| SmilesError {
        kind,
        column,
        input: input.to_string(),
    };
    if input.is_empty() {
        return Err(fail(SmilesErrorKind::Empty, 0));
    }
    let (mut mol, bracket) = reader::read(input).map_err(|(kind, column)| fail(kind, column))?;
    valence::assign_hydrogens(&mut mol, &bracket)
        .map_err(|(kind, atom)| fail(kind, mol.atom(atom).column))?;
    kekulize(&mut mol)
        .map_err(|e| fail(SmilesErrorKind::CannotKekulize, mol.atom(e.atom).column))?;
    Ok(mol)
}
