//! Strain energies of ring molecules, side by side with their uncertainties: group strain with
//! Benson's strain-free increments and with a second published increment set, and reaction
//! strain from the CBH-2 and CBH-3 reactions; per ring system from the ring corrections.
//!
//! The target's own Hf298 comes from a user value, else a measured value of the reference table,
//! else the group-additivity estimate (flagged: the group strain is then just the ring
//! correction). See [`analyse_strain`].
//!
//! ```
//! use ringheat::molecule::parse_smiles;
//! use ringheat::strain::{analyse_strain, StrainData};
//! let data = StrainData::bundled().unwrap();
//! let a = analyse_strain(&parse_smiles("C1CC1").unwrap(), &data, None).unwrap();
//! let benson = a.scheme("Benson").unwrap().strain_kj.unwrap();
//! assert!((benson.value / 4.184 - 27.5).abs() < 1.0); // common practice: 27.5 kcal/mol
//! ```

pub mod analysis;
pub mod flags;
pub mod increments;
pub mod systems;
pub mod target;

pub use analysis::{analyse_strain, SchemeStrain, StrainAnalysis, StrainData, StrainError};
pub use flags::StrainFlag;
pub use increments::IncrementSet;
pub use systems::RingSystemStrain;
pub use target::{resolve_target_hf, TargetHf, TargetHfOrigin};
