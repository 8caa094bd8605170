//! The data layer: one reader for every bundled and user data file (group tables with their
//! corrections and ring corrections, reference species, strain-free increments), one error type
//! that names the file, line and entry of every problem, and typed provenance.
//!
//! The domain modules keep their tables ([`crate::groups::table::GroupTables`],
//! [`crate::reactions::ReferenceTable`], [`crate::strain::IncrementSet`]) and get the checked
//! entries of each file from here. The formats are in group-tables/README.md.
//!
//! ```
//! use ringheat::data::{bundled, document::Source, reference_file::parse_species_file};
//! let (path, text) = bundled::REFERENCE_FILES[0];
//! let species = parse_species_file(Source { path: path.as_ref(), text }).unwrap();
//! assert!(species.iter().any(|s| s.name == "Ethane"));
//! ```

pub mod bundled;
pub mod document;
pub mod error;
pub mod group_file;
pub mod increments_file;
pub mod provenance;
pub mod reference_file;
pub mod unreliable_file;

pub use error::{DataError, EntryKind, EntryPlace, Place, Problem};
pub use provenance::{Cas, DerivedFrom, Property, Provenance};
pub use unreliable_file::{UnreliableList, UnreliableSpecies};
