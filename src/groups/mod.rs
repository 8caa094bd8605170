//! Benson groups: keys, tables loaded from group-tables/, atom typing, assignment, interaction
//! counts and ring corrections.

pub mod assign;
pub mod interactions;
pub mod key;
pub mod ring_corrections;
pub mod ring_match;
pub mod table;
pub mod typing;

pub use key::{AtomType, GroupKey};
