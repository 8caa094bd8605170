//! The project's one list of unreliable measured values
//! (group-tables/reference/unreliable-species.toml): species whose measured Hf298, S298 or Cp
//! the reference data judges suspect, with the reason. The reference table refuses them, the
//! generators in tools/ leave them out, and the tests compare nothing with them.

use std::collections::BTreeMap;
use std::path::Path;

use serde::Deserialize;
use toml::Spanned;

use super::bundled;
use super::document::Source;
use super::error::{DataError, EntryKind, EntryPlace, Problem};
use super::provenance::{from_field, Cas, Property};

/// One species of the list.
#[derive(Debug, Clone, PartialEq)]
pub struct UnreliableSpecies {
    /// CAS number.
    pub cas: Cas,
    /// Name as the list gives it.
    pub name: String,
    /// The measured properties judged unreliable.
    pub properties: Vec<Property>,
    /// Why (which sources disagree, by how much).
    pub reason: String,
    /// Where the entry is.
    pub place: EntryPlace,
}

/// The list, by CAS number.
#[derive(Debug, Clone, Default)]
pub struct UnreliableList {
    entries: BTreeMap<Cas, UnreliableSpecies>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawFile {
    #[allow(dead_code)]
    meta: Option<toml::Table>,
    #[serde(default)]
    unreliable: Vec<Spanned<RawEntry>>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawEntry {
    cas: String,
    name: String,
    properties: Vec<String>,
    reason: String,
}

impl UnreliableList {
    /// The bundled list.
    pub fn bundled() -> Result<UnreliableList, DataError> {
        let (path, text) = bundled::UNRELIABLE_FILE;
        UnreliableList::from_toml(text, Path::new(path))
    }

    /// Reads a list; every entry needs a valid CAS number (once), a name, at least one of
    /// `hf`, `s`, `cp`, and a reason.
    pub fn from_toml(text: &str, path: &Path) -> Result<UnreliableList, DataError> {
        let source = Source { path, text };
        let raw: RawFile = source.parse()?;
        let mut entries = BTreeMap::new();
        for spanned in raw.unreliable {
            let line = source.line_of(spanned.span().start);
            let r = spanned.into_inner();
            let place = EntryPlace::new(EntryKind::Unreliable, r.cas.clone(), Some(line));
            let fail = |p: String| DataError::at_entry(path, &place, Problem::Entry(p));
            let cas = Cas::parse(&r.cas).map_err(fail)?;
            let mut properties = Vec::new();
            for p in &r.properties {
                let property = from_field(p)
                    .ok_or_else(|| fail(format!("property \"{p}\" is not hf, s or cp")))?;
                properties.push(property);
            }
            if properties.is_empty() || r.reason.trim().is_empty() || r.name.trim().is_empty() {
                return Err(fail("needs a name, properties and a reason".into()));
            }
            let entry = UnreliableSpecies {
                cas: cas.clone(),
                name: r.name,
                properties,
                reason: r.reason,
                place: place.clone(),
            };
            if let Some(first) = entries.insert(cas, entry) {
                return Err(DataError::at_entry(
                    path,
                    &place,
                    Problem::Duplicate {
                        first: format!("line {}", first.place.line.unwrap_or(0)),
                    },
                ));
            }
        }
        Ok(UnreliableList { entries })
    }

    /// The entry of a CAS number, if listed.
    pub fn get(&self, cas: &str) -> Option<&UnreliableSpecies> {
        Cas::parse(cas).ok().and_then(|c| self.entries.get(&c))
    }

    /// True when the list judges `property` of the species `cas` unreliable.
    pub fn is_unreliable(&self, cas: &str, property: Property) -> bool {
        self.get(cas)
            .is_some_and(|e| e.properties.contains(&property))
    }

    /// All entries, by CAS number.
    pub fn iter(&self) -> impl Iterator<Item = &UnreliableSpecies> + '_ {
        self.entries.values()
    }

    /// Number of species listed.
    pub fn len(&self) -> usize {
        self.entries.len()
    }

    /// True when nothing is listed.
    pub fn is_empty(&self) -> bool {
        self.entries.is_empty()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn bundled_list_loads_and_bad_entries_are_located() {
        let list = UnreliableList::bundled().expect("bundled list");
        assert!(list.is_unreliable("75-47-8", Property::Hf298));
        assert!(!list.is_unreliable("75-47-8", Property::S298));
        let text = "[[unreliable]]\ncas = \"75-47-9\"\nname = \"x\"\nproperties = [\"hf\"]\nreason = \"r\"\n";
        let err = UnreliableList::from_toml(text, Path::new("u.toml")).unwrap_err();
        assert!(
            err.to_string()
                .starts_with("u.toml:1: unreliable \"75-47-9\": CAS number"),
            "{err}"
        );
        let text = text
            .replace("75-47-9", "75-47-8")
            .replace("\"hf\"", "\"h\"");
        let err = UnreliableList::from_toml(&text, Path::new("u.toml")).unwrap_err();
        assert!(
            err.to_string().contains("\"h\" is not hf, s or cp"),
            "{err}"
        );
    }
}
