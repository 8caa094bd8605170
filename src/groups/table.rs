//! Group tables: loads group-tables/*.toml (values, uncertainties, sources) and validates them.
//!
//! The format is described in group-tables/README.md; the files are read by the data layer
//! ([`crate::data::group_file`]). Values are converted to SI on load
//! (kJ/mol and J/(mol K), 1 cal = 4.184 J); every entry keeps its source text and the file it came
//! from. Files are read in name order; an entry whose key (or name) was already loaded from an
//! earlier file, or from the bundled tables when a user directory is added, replaces the earlier
//! one, and [`EntryOrigin::replaced`] records that. `same_as` conventions are resolved at load, so
//! [`GroupTables::group`] hands back the target's values.
//!
//! ```
//! use ringheat::groups::{table::GroupTables, GroupKey};
//! let tables = GroupTables::bundled().unwrap();
//! let methyl = GroupKey::parse("C-(C)(H)3").unwrap();
//! if let Some(entry) = tables.group(&methyl) {
//!     println!("{} kJ/mol ({})", entry.values.hf_kj, entry.source);
//! }
//! ```

#[cfg(test)]
mod tests;

use std::collections::{BTreeMap, BTreeSet};
use std::path::{Path, PathBuf};

use crate::data::document::{read_file, toml_files_in, Source};
use crate::data::group_file::parse_group_file;
use crate::data::{bundled, DataError, EntryPlace, Place, Problem, Property, Provenance};
use crate::groups::GroupKey;

/// Errors of the group tables: the data layer's one error type.
pub type TableError = DataError;

/// Temperatures (K) of every heat-capacity array held in memory.
pub const CP_TEMPERATURES_K: [f64; 7] = [300.0, 400.0, 500.0, 600.0, 800.0, 1000.0, 1500.0];

/// Lowest temperature (K) at which [`ThermoIncrement::cp_at`] answers (extrapolated from 300 K).
pub const CP_MIN_T_K: f64 = 298.15;

pub use crate::units::JOULES_PER_CALORIE;

/// Which of the three properties an entry actually gives; the others hold `NaN`.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
pub struct KnownValues {
    /// `hf` was given.
    pub hf: bool,
    /// `s` was given.
    pub s: bool,
    /// `cp` was given.
    pub cp: bool,
}

/// A contribution to Hf298, S298 and Cp(T), in SI units, with 1-sigma-like uncertainties.
///
/// A property the table does not give is `NaN` (never a silent zero) and `known` says so; callers
/// that sum increments must check `known` and flag the estimate.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct ThermoIncrement {
    /// Enthalpy of formation contribution at 298.15 K, kJ/mol.
    pub hf_kj: f64,
    /// Entropy contribution at 298.15 K (intrinsic, without symmetry), J/(mol K).
    pub s_j: f64,
    /// Heat-capacity contribution at [`CP_TEMPERATURES_K`], J/(mol K).
    pub cp_j: [f64; 7],
    /// Uncertainty of `hf_kj`, kJ/mol.
    pub unc_hf_kj: f64,
    /// Uncertainty of `s_j`, J/(mol K).
    pub unc_s_j: f64,
    /// Uncertainty of every value of `cp_j`, J/(mol K).
    pub unc_cp_j: f64,
    /// Which properties were given in the table.
    pub known: KnownValues,
}

impl ThermoIncrement {
    /// Heat capacity (J/(mol K)) at `t_k`, linear between the tabulated temperatures.
    ///
    /// Between 298.15 K and 300 K the 300-400 K slope is extrapolated back from 300 K. Returns
    /// `None` outside 298.15..=1500 K or when the table gives no `cp`.
    pub fn cp_at(&self, t_k: f64) -> Option<f64> {
        const EPS: f64 = 1e-9;
        let t = &CP_TEMPERATURES_K;
        let c = &self.cp_j;
        if !self.known.cp || !t_k.is_finite() || t_k < CP_MIN_T_K - EPS || t_k > t[6] + EPS {
            return None;
        }
        if t_k <= t[0] {
            let slope = (c[1] - c[0]) / (t[1] - t[0]);
            return Some(c[0] - slope * (t[0] - t_k));
        }
        for i in 0..t.len() - 1 {
            if t_k <= t[i + 1] {
                let frac = (t_k - t[i]) / (t[i + 1] - t[i]);
                return Some(c[i] + frac * (c[i + 1] - c[i]));
            }
        }
        Some(c[6])
    }

    /// Heat capacity (J/(mol K)) at 298.15 K, see [`ThermoIncrement::cp_at`].
    pub fn cp_298(&self) -> Option<f64> {
        self.cp_at(CP_MIN_T_K)
    }
}

/// Where an entry was read, and whether it replaced an entry of the same key from an earlier file.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct EntryOrigin {
    /// The file, as given to the loader (bundled files read `group-tables/NAME.toml`).
    pub file: PathBuf,
    /// 1-based line of the entry in that file, when known.
    pub line: Option<usize>,
    /// The file of the entry this one replaced, if any.
    pub replaced: Option<PathBuf>,
}

/// One Benson group with its values.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct GroupEntry {
    /// The group, in Benson's notation.
    pub key: GroupKey,
    /// Values; for a `same_as` entry, the resolved values of the group it is taken equal to.
    pub values: ThermoIncrement,
    /// Where the values come from (author, work, year, table; or `recalled from memory`).
    pub source: String,
    /// The group this one is taken equal to by convention, if it is such an entry.
    pub same_as: Option<GroupKey>,
    /// The measured compounds values were derived from, per property (`derived_from`).
    pub provenance: Provenance,
    /// Where the entry was read.
    pub origin: EntryOrigin,
}

/// A non-ring correction (gauche, cis, ortho, ...) applied per counted occurrence.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct CorrectionEntry {
    /// Name the assignment code looks up, e.g. `gauche`.
    pub name: String,
    /// Values per occurrence.
    pub values: ThermoIncrement,
    /// The counting rule, in words.
    pub counting: String,
    /// Where the values come from.
    pub source: String,
    /// The measured compounds values were derived from, per property (`derived_from`).
    pub provenance: Provenance,
    /// Where the entry was read.
    pub origin: EntryOrigin,
}

/// A ring correction, matched by the ring-system skeleton of `smiles`.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct RingEntry {
    /// Name of the ring system, e.g. `cyclopropane`.
    pub name: String,
    /// A parent molecule holding exactly this ring system.
    pub smiles: String,
    /// Values per occurrence of the ring system.
    pub values: ThermoIncrement,
    /// Where the values come from.
    pub source: String,
    /// The measured compounds values were derived from, per property (`derived_from`).
    pub provenance: Provenance,
    /// The symmetry number of the parent molecule that the entropy value assumed (Benson's
    /// tables use the real point group: cyclohexane chair 6). `None`: the value already follows
    /// the tool's flat-graph convention. The estimate converts between the two.
    pub parent_symmetry: Option<u64>,
    /// Where the entry was read.
    pub origin: EntryOrigin,
}

/// All group, correction and ring entries, validated, in SI units.
#[derive(Debug, Clone, Default)]
pub struct GroupTables {
    groups: BTreeMap<GroupKey, GroupEntry>,
    corrections: Vec<CorrectionEntry>,
    rings: Vec<RingEntry>,
    files: Vec<PathBuf>,
}

impl GroupTables {
    /// The tables shipped with ringheat (the repo's group-tables/*.toml, embedded at build time).
    pub fn bundled() -> Result<GroupTables, TableError> {
        let mut tables = GroupTables::default();
        for (label, text) in bundled::GROUP_TABLE_FILES {
            tables.merge_file(Source {
                path: Path::new(label),
                text,
            })?;
        }
        tables.resolve_same_as()?;
        Ok(tables)
    }

    /// Reads every `*.toml` file of `dir` (not recursive), in file-name order.
    pub fn load_dir(dir: &Path) -> Result<GroupTables, TableError> {
        GroupTables::default().with_extra_dir(dir)
    }

    /// Adds the `*.toml` files of a user's directory on top of these tables: entries with a new
    /// key or name are added, entries with a known one replace the earlier entry.
    pub fn with_extra_dir(mut self, dir: &Path) -> Result<GroupTables, TableError> {
        for path in toml_files_in(dir)? {
            let text = read_file(&path)?;
            self.merge_file(Source {
                path: &path,
                text: &text,
            })?;
        }
        self.resolve_same_as()?;
        Ok(self)
    }

    /// The entry of a group, with `same_as` resolved to the target's values.
    pub fn group(&self, key: &GroupKey) -> Option<&GroupEntry> {
        self.groups.get(key)
    }

    /// The correction of that name, e.g. `gauche`.
    pub fn correction(&self, name: &str) -> Option<&CorrectionEntry> {
        self.corrections.iter().find(|c| c.name == name)
    }

    /// The ring corrections, in file order.
    pub fn rings(&self) -> &[RingEntry] {
        &self.rings
    }

    /// The ring correction of that name, e.g. `cyclopropane`.
    pub fn ring(&self, name: &str) -> Option<&RingEntry> {
        self.rings.iter().find(|r| r.name == name)
    }

    /// All group entries, ordered by key.
    pub fn groups(&self) -> impl Iterator<Item = &GroupEntry> {
        self.groups.values()
    }

    /// All correction entries, in file order.
    pub fn corrections(&self) -> impl Iterator<Item = &CorrectionEntry> {
        self.corrections.iter()
    }

    /// Every entry that names measured compounds it was derived from: its label (`group
    /// C-(C)(H)3`, `correction gauche-(O)`, `ring oxirane`) and its provenance.
    pub fn provenances(&self) -> impl Iterator<Item = (String, &Provenance)> + '_ {
        let groups = self
            .groups
            .values()
            .map(|g| (format!("group {}", g.key), &g.provenance));
        let corrections = self
            .corrections
            .iter()
            .map(|c| (format!("correction {}", c.name), &c.provenance));
        let rings = self
            .rings
            .iter()
            .map(|r| (format!("ring {}", r.name), &r.provenance));
        groups
            .chain(corrections)
            .chain(rings)
            .filter(|(_, p)| !p.is_empty())
    }

    /// CAS numbers of the compounds that `property` of some entry was derived from: those
    /// compounds are no independent check of that property.
    pub fn derived_cas(&self, property: Property) -> BTreeSet<String> {
        self.provenances()
            .flat_map(|(_, p)| p.cas_for(property).map(str::to_string).collect::<Vec<_>>())
            .collect()
    }

    /// The files read, in the order they were read.
    pub fn files(&self) -> &[PathBuf] {
        &self.files
    }

    /// Parses one file and merges its entries (replacing earlier entries of the same key/name).
    fn merge_file(&mut self, source: Source<'_>) -> Result<(), TableError> {
        let parsed = parse_group_file(source)?;
        self.files.push(source.path.to_path_buf());
        for mut entry in parsed.groups {
            if let Some(old) = self.groups.get(&entry.key) {
                entry.origin.replaced = Some(old.origin.file.clone());
            }
            self.groups.insert(entry.key.clone(), entry);
        }
        for mut entry in parsed.corrections {
            match self.corrections.iter_mut().find(|c| c.name == entry.name) {
                Some(old) => {
                    entry.origin.replaced = Some(old.origin.file.clone());
                    *old = entry;
                }
                None => self.corrections.push(entry),
            }
        }
        for mut entry in parsed.rings {
            match self.rings.iter_mut().find(|r| r.name == entry.name) {
                Some(old) => {
                    entry.origin.replaced = Some(old.origin.file.clone());
                    *old = entry;
                }
                None => self.rings.push(entry),
            }
        }
        Ok(())
    }

    /// Copies into every `same_as` entry the values of the end of its chain.
    ///
    /// Entries without `same_as` keep the values they were read with, so this can run again after
    /// more files are merged.
    fn resolve_same_as(&mut self) -> Result<(), TableError> {
        let mut resolved: Vec<(GroupKey, ThermoIncrement)> = Vec::new();
        for entry in self.groups.values() {
            let Some(first) = &entry.same_as else {
                continue;
            };
            let mut chain = vec![entry.key.clone()];
            let mut target = first;
            loop {
                let fail = |problem| {
                    let place = EntryPlace::group(&entry.key.to_string(), entry.origin.line);
                    DataError::new(Place::entry(&entry.origin.file, place), problem)
                };
                if chain.contains(target) {
                    chain.push(target.clone());
                    return Err(fail(Problem::SameAsCycle {
                        cycle: chain.iter().map(|k| k.to_string()).collect(),
                    }));
                }
                let Some(next) = self.groups.get(target) else {
                    return Err(fail(Problem::SameAsMissing {
                        target: target.to_string(),
                    }));
                };
                chain.push(target.clone());
                match &next.same_as {
                    Some(further) => target = further,
                    None => {
                        resolved.push((entry.key.clone(), next.values));
                        break;
                    }
                }
            }
        }
        for (key, values) in resolved {
            if let Some(entry) = self.groups.get_mut(&key) {
                entry.values = values;
            }
        }
        Ok(())
    }
}
