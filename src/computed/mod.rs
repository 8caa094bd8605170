//! Checks of quantum-chemical enthalpies: a file of computed enthalpies for the species of one
//! CBH reaction turns into the target's Hf298, with the reference uncertainties propagated, the
//! strain energy, and a flag when the result strays from group additivity.
//!
//! `Hf298(target) = sum n Hf298(products) - sum n Hf298(co-reactants) - dH(computed)`, where
//! `dH(computed)` is the reaction enthalpy from the user's enthalpies. The file format is
//! described in [`energies`].
//!
//! ```
//! use ringheat::computed::{check_computed, parse_energies, CheckOptions};
//! use ringheat::molecule::parse_smiles;
//! use ringheat::reactions::{build_reaction, ReferenceTable, Rung};
//! let table = ReferenceTable::bundled().unwrap();
//! let reaction = build_reaction(&parse_smiles("C1CC1").unwrap(), Rung::Cbh2).unwrap();
//! // Invented enthalpies, for illustration only.
//! let text = "C1CC1 -117.8000 hartree\nCC -79.7500 hartree\nCCC -118.9800 hartree\n";
//! let energies = parse_energies(text, "example").unwrap();
//! let check = check_computed(&reaction, &energies, &|s| table.lookup(s), None, &CheckOptions::default()).unwrap();
//! assert!(check.hf298_kj.value.is_finite());
//! ```

pub mod check;
pub mod energies;

pub use check::{check_computed, CheckError, CheckOptions, ComputedCheck, SpeciesEnergy};
pub use energies::{
    parse_energies, read_energies, EnergiesError, EnergiesErrors, EnergiesFile, EnergyLine,
    InputUnit,
};
