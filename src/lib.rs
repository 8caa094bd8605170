//! ringheat: ring-strain thermochemistry from SMILES.
//!
//! The pipeline is plain functions over plain data: parse a SMILES into a [`molecule::Molecule`],
//! perceive its rings, assign Benson groups, sum properties, build isodesmic reactions, report.
//!
//! ```
//! let mol = ringheat::molecule::parse_smiles("C1CC1").unwrap();
//! assert_eq!(mol.atom_count(), 3);
//! ```

pub mod groups;
pub mod molecule;
