//! The strain-free increment file (group-tables/reference/strain-free-increments.toml): sets of
//! increments for the four saturated carbon centres, checked and located.

use serde::Deserialize;
use toml::Spanned;

use super::document::Source;
use super::error::{DataError, EntryKind, EntryPlace, Place, Problem};
use crate::thermo::Quantity;
use crate::units::JOULES_PER_CALORIE;

/// The four saturated carbon centres, by number of carbon neighbours (1 to 4).
pub const CENTRES: [&str; 4] = ["C-(C)(H)3", "C-(C)2(H)2", "C-(C)3(H)", "C-(C)4"];

/// One `[[set]]`, checked: all four centres once each, finite values, uncertainties not negative.
#[derive(Debug, Clone, PartialEq)]
pub struct IncrementRecord {
    /// Short name of the set.
    pub name: String,
    /// Publication (or `recalled from memory`).
    pub source: String,
    /// What the set applies to, as the file says.
    pub applies_to: String,
    /// Remarks of the file.
    pub note: String,
    /// Increments for [`CENTRES`], in that order, kJ/mol.
    pub increments_kj: [Quantity; 4],
    /// The set's place in its file.
    pub place: EntryPlace,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawFile {
    meta: Option<RawMeta>,
    #[serde(default)]
    set: Vec<Spanned<RawSet>>,
}

/// `[meta]`: the energy unit of the file; other keys (title, ...) are allowed and ignored.
#[derive(Deserialize)]
struct RawMeta {
    energy_unit: Option<String>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawSet {
    name: String,
    source: String,
    applies_to: String,
    note: String,
    increment: Vec<RawIncrement>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawIncrement {
    group: String,
    hf: f64,
    unc_hf: f64,
}

/// Reads every set of the file. `[meta] energy_unit` is `kcal/mol` or `kJ/mol`.
pub fn parse_increments_file(source: Source<'_>) -> Result<Vec<IncrementRecord>, DataError> {
    let raw: RawFile = source.parse()?;
    let meta_fail = |p: String| DataError::new(Place::file(source.path), Problem::Meta(p));
    let unit = raw
        .meta
        .ok_or_else(|| meta_fail("missing; the file starts with a [meta] table".into()))?
        .energy_unit;
    let kj_per_unit = match unit.as_deref() {
        Some("kcal/mol") => JOULES_PER_CALORIE,
        Some("kJ/mol") => 1.0,
        Some(other) => {
            return Err(meta_fail(format!(
                "unknown energy_unit \"{other}\" (use \"kcal/mol\" or \"kJ/mol\")"
            )))
        }
        None => return Err(meta_fail("no energy_unit".into())),
    };
    let mut sets = Vec::new();
    for spanned in raw.set {
        let line = source.line_of(spanned.span().start);
        let s = spanned.into_inner();
        let place = EntryPlace::new(EntryKind::IncrementSet, s.name.clone(), Some(line));
        let fail = |p: String| DataError::at_entry(source.path, &place, Problem::Entry(p));
        let mut values: [Option<Quantity>; 4] = [None; 4];
        for inc in &s.increment {
            let Some(i) = CENTRES.iter().position(|c| *c == inc.group) else {
                return Err(fail(format!(
                    "group {} is not a saturated carbon centre ({})",
                    inc.group,
                    CENTRES.join(", ")
                )));
            };
            if !inc.hf.is_finite() || !inc.unc_hf.is_finite() || inc.unc_hf < 0.0 {
                return Err(fail(format!(
                    "{}: hf and unc_hf must be finite, unc_hf not negative",
                    inc.group
                )));
            }
            if values[i].is_some() {
                return Err(fail(format!("{} twice", inc.group)));
            }
            values[i] = Some(Quantity::new(inc.hf, inc.unc_hf).scaled(kj_per_unit));
        }
        let mut increments_kj = [Quantity::new(0.0, 0.0); 4];
        for (i, v) in values.iter().enumerate() {
            increments_kj[i] = v.ok_or_else(|| fail(format!("no increment for {}", CENTRES[i])))?;
        }
        sets.push(IncrementRecord {
            name: s.name,
            source: s.source,
            applies_to: s.applies_to,
            note: s.note,
            increments_kj,
            place,
        });
    }
    Ok(sets)
}
