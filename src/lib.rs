//! ringheat: ring-strain thermochemistry from SMILES.
//!
//! The pipeline is plain functions over plain data: parse a SMILES into a [`molecule::Molecule`],
//! perceive its rings and aromaticity ([`molecule::PerceivedMolecule`]), assign Benson groups and
//! sum them with corrections ([`thermo::GroupAdditivity`]), and report the results
//! ([`report`]). The command-line program is a thin layer over these.
//!
//! ```
//! use ringheat::molecule::PerceivedMolecule;
//! use ringheat::thermo::{EstimateOptions, GroupAdditivity};
//!
//! let engine = GroupAdditivity::bundled().unwrap();
//! let cyclopropane = PerceivedMolecule::from_smiles("C1CC1").unwrap();
//! let estimate = engine.estimate(&cyclopropane, &EstimateOptions::default()).unwrap();
//! // Measured: 53.3 kJ/mol (CRC Handbook); group additivity with the ring correction is close.
//! let hf298 = estimate.hf298_kj.expect("every term gives an Hf298");
//! assert!((hf298.value - 53.3).abs() < 5.0);
//! ```

pub mod computed;
pub mod data;
pub mod groups;
pub mod hazard;
pub mod input;
pub mod molecule;
pub mod phase;
pub mod polymer;
pub mod reactions;
pub mod report;
pub mod strain;
pub mod thermo;
pub mod units;
