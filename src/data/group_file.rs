//! One group-table file (group-tables/*.toml or a user's): TOML text to validated entries in SI
//! units, each with its provenance and place.

use std::collections::HashMap;
use std::path::Path;

use serde::Deserialize;
use toml::Spanned;

use super::document::Source;
use super::error::{DataError, EntryKind, EntryPlace, Place, Problem};
use super::provenance::{Property, Provenance};
use crate::groups::table::{
    CorrectionEntry, EntryOrigin, GroupEntry, KnownValues, RingEntry, ThermoIncrement,
    CP_TEMPERATURES_K,
};
use crate::groups::GroupKey;
use crate::units::JOULES_PER_CALORIE;

/// The entries of one file, in file order.
#[derive(Debug, Default)]
pub struct GroupFile {
    /// `[[group]]` entries (`same_as` not yet resolved).
    pub groups: Vec<GroupEntry>,
    /// `[[correction]]` entries.
    pub corrections: Vec<CorrectionEntry>,
    /// `[[ring]]` entries.
    pub rings: Vec<RingEntry>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawFile {
    meta: Option<RawMeta>,
    #[serde(default)]
    group: Vec<Spanned<RawEntry>>,
    #[serde(default)]
    correction: Vec<Spanned<RawEntry>>,
    #[serde(default)]
    ring: Vec<Spanned<RawEntry>>,
}

/// `[meta]`; keys beyond these (authors, notes, ...) are allowed and ignored.
#[derive(Deserialize)]
struct RawMeta {
    enthalpy_unit: Option<String>,
    entropy_unit: Option<String>,
    cp_temperatures: Option<Vec<f64>>,
}

/// Any entry; which fields a kind may carry is checked after reading.
#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawEntry {
    key: Option<String>,
    name: Option<String>,
    smiles: Option<String>,
    counting: Option<String>,
    hf: Option<f64>,
    s: Option<f64>,
    cp: Option<Vec<f64>>,
    unc_hf: Option<f64>,
    unc_s: Option<f64>,
    unc_cp: Option<f64>,
    source: Option<String>,
    same_as: Option<String>,
    /// Typed provenance (see [`Provenance`]).
    derived_from: Option<toml::Value>,
    /// The old per-property fields, read only to say what replaces them.
    s_derived_from: Option<toml::Value>,
    cp_derived_from: Option<toml::Value>,
    /// Ring entries: the symmetry number of the parent that the entropy value assumed.
    parent_symmetry: Option<u64>,
    /// Free text for the reader of the file; not used by the code.
    #[allow(dead_code)]
    note: Option<String>,
}

/// Unit factors and the Cp grid of one file.
struct Units {
    kj_per_enthalpy_unit: f64,
    j_per_entropy_unit: f64,
    cp_temperatures: Vec<f64>,
}

/// Parses and validates one file; `source.path` is only used in errors and origins.
pub fn parse_group_file(source: Source<'_>) -> Result<GroupFile, DataError> {
    let path = source.path;
    let raw: RawFile = source.parse()?;
    let units = read_meta(path, raw.meta)?;
    let mut out = GroupFile::default();
    let mut seen: HashMap<String, usize> = HashMap::new();
    let lists = [
        (EntryKind::Group, raw.group),
        (EntryKind::Correction, raw.correction),
        (EntryKind::Ring, raw.ring),
    ];
    for (kind, list) in lists {
        for (index, spanned) in list.into_iter().enumerate() {
            let line = source.line_of(spanned.span().start);
            let entry = spanned.into_inner();
            let ctx = Ctx {
                path,
                units: &units,
                place: place_of(kind, &entry, index, line),
            };
            // Group keys compare in canonical form, so `C-(H)3(C)` duplicates `C-(C)(H)3`.
            let identity = match kind {
                EntryKind::Group => {
                    let key = ctx.group_key(entry.key.as_deref())?;
                    let item = ctx.group(entry, key)?;
                    let id = format!("group {}", item.key);
                    out.groups.push(item);
                    id
                }
                EntryKind::Correction => {
                    let item = ctx.correction(entry)?;
                    let id = format!("correction {}", item.name);
                    out.corrections.push(item);
                    id
                }
                _ => {
                    let item = ctx.ring(entry)?;
                    let id = format!("ring {}", item.name);
                    out.rings.push(item);
                    id
                }
            };
            if let Some(first_line) = seen.insert(identity, line) {
                return Err(ctx.fail(Problem::Duplicate {
                    first: format!("line {first_line}"),
                }));
            }
        }
    }
    Ok(out)
}

fn place_of(kind: EntryKind, entry: &RawEntry, index: usize, line: usize) -> EntryPlace {
    let name = match kind {
        EntryKind::Group => entry.key.clone(),
        _ => entry.name.clone(),
    };
    EntryPlace {
        kind,
        name: name.unwrap_or_else(|| format!("#{}", index + 1)),
        line: Some(line),
    }
}

fn read_meta(path: &Path, meta: Option<RawMeta>) -> Result<Units, DataError> {
    let fail = |problem: String| DataError::new(Place::file(path), Problem::Meta(problem));
    let meta = meta.ok_or_else(|| fail("missing; every file starts with a [meta] table".into()))?;
    let kj_per_enthalpy_unit = match meta.enthalpy_unit.as_deref() {
        Some("kcal/mol") => JOULES_PER_CALORIE,
        Some("kJ/mol") => 1.0,
        Some(other) => {
            return Err(fail(format!(
                "unknown enthalpy_unit \"{other}\" (use \"kcal/mol\" or \"kJ/mol\")"
            )))
        }
        None => return Err(fail("no enthalpy_unit".into())),
    };
    let j_per_entropy_unit = match meta.entropy_unit.as_deref() {
        Some("cal/(mol K)") => JOULES_PER_CALORIE,
        Some("J/(mol K)") => 1.0,
        Some(other) => {
            return Err(fail(format!(
                "unknown entropy_unit \"{other}\" (use \"cal/(mol K)\" or \"J/(mol K)\")"
            )))
        }
        None => return Err(fail("no entropy_unit".into())),
    };
    let cp_temperatures = meta
        .cp_temperatures
        .unwrap_or_else(|| CP_TEMPERATURES_K.to_vec());
    let ascending = cp_temperatures.windows(2).all(|w| w[0] < w[1]);
    let covers = match (cp_temperatures.first(), cp_temperatures.last()) {
        (Some(&lo), Some(&hi)) => lo <= CP_TEMPERATURES_K[0] && hi >= CP_TEMPERATURES_K[6],
        _ => false,
    };
    if cp_temperatures.len() < 2 || !ascending || !covers {
        return Err(fail(format!(
            "cp_temperatures {cp_temperatures:?} must rise strictly and span 300 to 1500 K"
        )));
    }
    Ok(Units {
        kj_per_enthalpy_unit,
        j_per_entropy_unit,
        cp_temperatures,
    })
}

/// What every entry of one file shares while it is checked.
struct Ctx<'a> {
    path: &'a Path,
    units: &'a Units,
    place: EntryPlace,
}

impl Ctx<'_> {
    fn fail(&self, problem: Problem) -> DataError {
        DataError::at_entry(self.path, &self.place, problem)
    }

    fn problem(&self, problem: impl Into<String>) -> DataError {
        self.fail(Problem::Entry(problem.into()))
    }

    fn origin(&self) -> EntryOrigin {
        EntryOrigin {
            file: self.path.to_path_buf(),
            line: self.place.line,
            replaced: None,
        }
    }

    fn group_key(&self, text: Option<&str>) -> Result<GroupKey, DataError> {
        let text = text.ok_or_else(|| self.problem("no `key`"))?;
        GroupKey::parse(text).map_err(|error| self.fail(Problem::BadKey(error)))
    }

    fn source(&self, entry: &RawEntry) -> Result<String, DataError> {
        match entry.source.as_deref().map(str::trim) {
            Some(s) if !s.is_empty() => Ok(s.to_string()),
            _ => Err(self.fail(Problem::NoSource)),
        }
    }

    /// Rejects fields that do not belong to this kind of entry.
    fn forbid(&self, field: &str, present: bool) -> Result<(), DataError> {
        if present {
            return Err(self.problem(format!(
                "`{field}` does not belong to a {} entry",
                self.place.kind
            )));
        }
        Ok(())
    }

    fn group(&self, entry: RawEntry, key: GroupKey) -> Result<GroupEntry, DataError> {
        self.forbid("name", entry.name.is_some())?;
        self.forbid("smiles", entry.smiles.is_some())?;
        self.forbid("counting", entry.counting.is_some())?;
        self.forbid("parent_symmetry", entry.parent_symmetry.is_some())?;
        let source = self.source(&entry)?;
        let (values, same_as) = match &entry.same_as {
            Some(target) => {
                let given = [
                    ("hf", entry.hf.is_some()),
                    ("s", entry.s.is_some()),
                    ("cp", entry.cp.is_some()),
                    ("unc_hf", entry.unc_hf.is_some()),
                    ("unc_s", entry.unc_s.is_some()),
                    ("unc_cp", entry.unc_cp.is_some()),
                ];
                if let Some((field, _)) = given.iter().find(|(_, present)| *present) {
                    return Err(self.problem(format!(
                        "a `same_as` entry carries no values, but `{field}` is given"
                    )));
                }
                let target = self.group_key(Some(target))?;
                if target == key {
                    return Err(self.problem("`same_as` names the group itself"));
                }
                // Filled in when the tables resolve `same_as` after all files are read.
                (unknown_values(), Some(target))
            }
            None => (self.values(&entry)?, None),
        };
        let provenance = self.provenance(&entry, &values)?;
        Ok(GroupEntry {
            key,
            values,
            source,
            same_as,
            provenance,
            origin: self.origin(),
        })
    }

    fn correction(&self, entry: RawEntry) -> Result<CorrectionEntry, DataError> {
        self.forbid("key", entry.key.is_some())?;
        self.forbid("smiles", entry.smiles.is_some())?;
        self.forbid("same_as", entry.same_as.is_some())?;
        self.forbid("parent_symmetry", entry.parent_symmetry.is_some())?;
        let name = self.name(&entry)?;
        let source = self.source(&entry)?;
        let counting = match entry.counting.as_deref().map(str::trim) {
            Some(c) if !c.is_empty() => c.to_string(),
            _ => return Err(self.problem("no `counting` rule")),
        };
        let values = self.values(&entry)?;
        let provenance = self.provenance(&entry, &values)?;
        Ok(CorrectionEntry {
            name,
            values,
            counting,
            source,
            provenance,
            origin: self.origin(),
        })
    }

    fn ring(&self, entry: RawEntry) -> Result<RingEntry, DataError> {
        self.forbid("key", entry.key.is_some())?;
        self.forbid("counting", entry.counting.is_some())?;
        self.forbid("same_as", entry.same_as.is_some())?;
        let name = self.name(&entry)?;
        let source = self.source(&entry)?;
        let smiles = match entry.smiles.as_deref().map(str::trim) {
            Some(s) if !s.is_empty() => s.to_string(),
            _ => return Err(self.problem("no `smiles`")),
        };
        if entry.parent_symmetry == Some(0) {
            return Err(self.problem("`parent_symmetry` must be at least 1"));
        }
        let values = self.values(&entry)?;
        let provenance = self.provenance(&entry, &values)?;
        Ok(RingEntry {
            name,
            smiles,
            values,
            source,
            provenance,
            parent_symmetry: entry.parent_symmetry,
            origin: self.origin(),
        })
    }

    /// The typed `derived_from`; every property it lists must be one the entry gives.
    fn provenance(
        &self,
        entry: &RawEntry,
        values: &ThermoIncrement,
    ) -> Result<Provenance, DataError> {
        let old_fields = [
            ("s_derived_from", entry.s_derived_from.is_some(), "s"),
            ("cp_derived_from", entry.cp_derived_from.is_some(), "cp"),
        ];
        for (old, given, property) in old_fields {
            if given {
                return Err(self.fail(Problem::Provenance(format!(
                    "`{old}` is replaced by derived_from = {{ cas = \"...\", name = \"...\", \
                     properties = [\"{property}\"] }}"
                ))));
            }
        }
        let Some(value) = &entry.derived_from else {
            return Ok(Provenance::default());
        };
        let provenance = Provenance::from_toml(value)
            .map_err(|problem| self.fail(Problem::Provenance(problem)))?;
        for property in provenance.properties() {
            let given = match property {
                Property::Hf298 => values.known.hf,
                Property::S298 => values.known.s,
                Property::Cp => values.known.cp,
            };
            if !given {
                return Err(self.fail(Problem::Provenance(format!(
                    "lists `{}`, which this entry does not give",
                    super::provenance::field(property)
                ))));
            }
        }
        Ok(provenance)
    }

    fn name(&self, entry: &RawEntry) -> Result<String, DataError> {
        match entry.name.as_deref().map(str::trim) {
            Some(n) if !n.is_empty() => Ok(n.to_string()),
            _ => Err(self.problem("no `name`")),
        }
    }

    /// Checks values against their uncertainties and converts them to SI.
    fn values(&self, entry: &RawEntry) -> Result<ThermoIncrement, DataError> {
        if entry.hf.is_none() && entry.s.is_none() && entry.cp.is_none() {
            return Err(self.problem("no values: give `hf`, `s` and `cp`, or `same_as`"));
        }
        let kj = self.units.kj_per_enthalpy_unit;
        let j = self.units.j_per_entropy_unit;
        let mut v = unknown_values();
        if let Some(hf) = entry.hf {
            let unc = self.paired("hf", hf, entry.unc_hf)?;
            v.hf_kj = hf * kj;
            v.unc_hf_kj = unc * kj;
            v.known.hf = true;
        } else {
            self.forbid_lone_uncertainty("hf", entry.unc_hf)?;
        }
        if let Some(s) = entry.s {
            let unc = self.paired("s", s, entry.unc_s)?;
            v.s_j = s * j;
            v.unc_s_j = unc * j;
            v.known.s = true;
        } else {
            self.forbid_lone_uncertainty("s", entry.unc_s)?;
        }
        if let Some(cp) = &entry.cp {
            let expected = self.units.cp_temperatures.len();
            if cp.len() != expected {
                return Err(self.fail(Problem::CpLength {
                    found: cp.len(),
                    expected,
                }));
            }
            if cp.iter().any(|c| !c.is_finite()) {
                return Err(self.problem("`cp` holds a value that is not a finite number"));
            }
            let unc = self.paired("cp", 0.0, entry.unc_cp)?;
            let on_grid = regrid(&self.units.cp_temperatures, cp);
            for (out, c) in v.cp_j.iter_mut().zip(on_grid) {
                *out = c * j;
            }
            v.unc_cp_j = unc * j;
            v.known.cp = true;
        } else {
            self.forbid_lone_uncertainty("cp", entry.unc_cp)?;
        }
        Ok(v)
    }

    /// The uncertainty that must accompany a given value.
    fn paired(&self, field: &'static str, value: f64, unc: Option<f64>) -> Result<f64, DataError> {
        if !value.is_finite() {
            return Err(self.problem(format!("`{field}` is not a finite number")));
        }
        match unc {
            None => Err(self.fail(Problem::NoUncertainty { field })),
            Some(u) if !u.is_finite() || u < 0.0 => Err(self.problem(format!(
                "`unc_{field}` must be a finite number >= 0, not {u}"
            ))),
            Some(u) => Ok(u),
        }
    }

    fn forbid_lone_uncertainty(&self, field: &str, unc: Option<f64>) -> Result<(), DataError> {
        if unc.is_some() {
            return Err(self.problem(format!("`unc_{field}` is given without `{field}`")));
        }
        Ok(())
    }
}

/// Values not (yet) known: `NaN` everywhere, all `known` flags false.
fn unknown_values() -> ThermoIncrement {
    ThermoIncrement {
        hf_kj: f64::NAN,
        s_j: f64::NAN,
        cp_j: [f64::NAN; 7],
        unc_hf_kj: f64::NAN,
        unc_s_j: f64::NAN,
        unc_cp_j: f64::NAN,
        known: KnownValues {
            hf: false,
            s: false,
            cp: false,
        },
    }
}

/// Linear interpolation of `(temps, values)` onto [`CP_TEMPERATURES_K`]; `temps` rises strictly
/// and spans 300..1500 K (checked with `[meta]`).
fn regrid(temps: &[f64], values: &[f64]) -> [f64; 7] {
    let mut out = [f64::NAN; 7];
    for (slot, &t) in out.iter_mut().zip(CP_TEMPERATURES_K.iter()) {
        if let Some(exact) = temps.iter().position(|&x| x == t) {
            *slot = values[exact];
            continue;
        }
        let i = temps
            .windows(2)
            .position(|w| t <= w[1])
            .unwrap_or(temps.len().saturating_sub(2));
        let (t0, t1) = (temps[i], temps[i + 1]);
        let (c0, c1) = (values[i], values[i + 1]);
        *slot = c0 + (t - t0) / (t1 - t0) * (c1 - c0);
    }
    out
}
