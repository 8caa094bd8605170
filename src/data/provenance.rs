//! Typed provenance: which measured compound a table value was derived from, and for which
//! properties, read from one TOML form.
//!
//! An entry whose value (or part of it) was derived from one measured compound says so:
//!
//! ```toml
//! derived_from = { cas = "109-99-9", name = "tetrahydrofuran", properties = ["s", "cp"] }
//! ```
//!
//! or, when several compounds gave different properties, an array of such tables. The compound
//! is then no independent check of the properties listed: the validation tests leave it out of
//! those properties' statistics (of every property when `hf` is listed), and no test may compare
//! a listed property with that compound's measurement.
//!
//! ```
//! use ringheat::data::provenance::{Property, Provenance};
//! let value: toml::Value = toml::from_str::<toml::Table>(
//!     r#"derived_from = { cas = "109-99-9", name = "tetrahydrofuran", properties = ["s", "cp"] }"#,
//! ).unwrap()["derived_from"].clone();
//! let p = Provenance::from_toml(&value).unwrap();
//! assert!(p.is_derived(Property::S298) && !p.is_derived(Property::Hf298));
//! assert_eq!(p.cas_for(Property::Cp).collect::<Vec<_>>(), ["109-99-9"]);
//! ```

use std::fmt;

pub use crate::thermo::Property;

/// Every property, in file order (`hf`, `s`, `cp`).
pub const PROPERTIES: [Property; 3] = [Property::Hf298, Property::S298, Property::Cp];

/// The field name the data files use for a property (`hf`, `s`, `cp`).
pub fn field(property: Property) -> &'static str {
    match property {
        Property::Hf298 => "hf",
        Property::S298 => "s",
        Property::Cp => "cp",
    }
}

/// The property of a field name (`hf`, `s`, `cp`).
pub fn from_field(name: &str) -> Option<Property> {
    PROPERTIES.into_iter().find(|p| field(*p) == name)
}

/// Position of a property in file order (for sorting).
fn rank(property: Property) -> usize {
    PROPERTIES.iter().position(|p| *p == property).unwrap_or(0)
}

/// A CAS registry number, checked for its form (`N-NN-N`, 2 to 7 digits first) and check digit.
#[derive(Debug, Clone, PartialEq, Eq, PartialOrd, Ord, Hash, serde::Serialize)]
#[serde(transparent)]
pub struct Cas(String);

impl Cas {
    /// Reads a CAS number; the error says what is wrong.
    pub fn parse(text: &str) -> Result<Cas, String> {
        let parts: Vec<&str> = text.split('-').collect();
        let digits = |s: &str| !s.is_empty() && s.chars().all(|c| c.is_ascii_digit());
        let form = parts.len() == 3
            && parts.iter().all(|p| digits(p))
            && (2..=7).contains(&parts[0].len())
            && parts[1].len() == 2
            && parts[2].len() == 1;
        if !form {
            return Err(format!("CAS number \"{text}\" is not of the form N-NN-N"));
        }
        // Check digit: the other digits, right to left, weighted 1, 2, 3, ..., summed, mod 10.
        let body: Vec<u32> = parts[0]
            .chars()
            .chain(parts[1].chars())
            .filter_map(|c| c.to_digit(10))
            .collect();
        let sum: u32 = body
            .iter()
            .rev()
            .zip(1u32..)
            .map(|(digit, weight)| digit * weight)
            .sum();
        let check = parts[2].chars().next().and_then(|c| c.to_digit(10));
        if check != Some(sum % 10) {
            return Err(format!(
                "CAS number \"{text}\" fails its check digit (expected {})",
                sum % 10
            ));
        }
        Ok(Cas(text.to_string()))
    }

    /// The number as written.
    pub fn as_str(&self) -> &str {
        &self.0
    }
}

impl fmt::Display for Cas {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.0)
    }
}

/// One measured compound and the properties of the entry that were derived from it.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct DerivedFrom {
    /// CAS number of the compound.
    pub cas: Cas,
    /// Its name, as the source gives it.
    pub name: String,
    /// The entry's properties that were derived from it (in file order, no repeats, at least one).
    pub properties: Vec<Property>,
}

/// Where an entry's values came from, beyond its `source` text: the measured compounds its
/// values were derived from, if any.
#[derive(Debug, Clone, PartialEq, Eq, Default, serde::Serialize)]
pub struct Provenance {
    /// The compounds; empty when no value was derived from a measured compound.
    pub derived_from: Vec<DerivedFrom>,
}

impl Provenance {
    /// Reads the value of a `derived_from` field: one inline table or an array of them, each
    /// with `cas`, `name` and `properties` (and nothing else).
    pub fn from_toml(value: &toml::Value) -> Result<Provenance, String> {
        let items: Vec<&toml::Value> =
            match value {
                toml::Value::Table(_) => vec![value],
                toml::Value::Array(list) if !list.is_empty() => list.iter().collect(),
                toml::Value::String(text) => {
                    return Err(format!(
                        "\"{text}\" is the old prose form; write derived_from = {{ cas = \"...\", \
                     name = \"...\", properties = [\"hf\", \"s\", \"cp\"] }}"
                    ))
                }
                _ => return Err(
                    "must be { cas = \"...\", name = \"...\", properties = [...] } or an array \
                     of such tables"
                        .to_string(),
                ),
            };
        let mut derived_from: Vec<DerivedFrom> = Vec::new();
        for item in items {
            let compound = read_compound(item)?;
            if derived_from.iter().any(|d| d.cas == compound.cas) {
                return Err(format!(
                    "compound {} is named twice; list all its properties once",
                    compound.cas
                ));
            }
            derived_from.push(compound);
        }
        Ok(Provenance { derived_from })
    }

    /// True when no value was derived from a measured compound.
    pub fn is_empty(&self) -> bool {
        self.derived_from.is_empty()
    }

    /// The compounds `property` was derived from.
    pub fn compounds_for(&self, property: Property) -> impl Iterator<Item = &DerivedFrom> + '_ {
        self.derived_from
            .iter()
            .filter(move |d| d.properties.contains(&property))
    }

    /// The CAS numbers of the compounds `property` was derived from.
    pub fn cas_for(&self, property: Property) -> impl Iterator<Item = &str> + '_ {
        self.compounds_for(property).map(|d| d.cas.as_str())
    }

    /// True when `property` was derived from a measured compound.
    pub fn is_derived(&self, property: Property) -> bool {
        self.compounds_for(property).next().is_some()
    }

    /// Every property derived from any compound (in file order, no repeats).
    pub fn properties(&self) -> Vec<Property> {
        PROPERTIES
            .into_iter()
            .filter(|p| self.is_derived(*p))
            .collect()
    }

    /// The TOML text of the `derived_from` value (an inline table, or an array of them), as the
    /// generators write it; empty provenance gives `None`.
    pub fn to_toml(&self) -> Option<String> {
        let tables: Vec<String> = self
            .derived_from
            .iter()
            .map(|d| {
                let props: Vec<String> = d
                    .properties
                    .iter()
                    .map(|p| format!("\"{}\"", field(*p)))
                    .collect();
                format!(
                    "{{ cas = {}, name = {}, properties = [{}] }}",
                    toml_basic_string(d.cas.as_str()),
                    toml_basic_string(&d.name),
                    props.join(", ")
                )
            })
            .collect();
        match tables.len() {
            0 => None,
            1 => tables.into_iter().next(),
            _ => Some(format!("[{}]", tables.join(", "))),
        }
    }
}

/// A TOML basic string holding `text`.
fn toml_basic_string(text: &str) -> String {
    let mut out = String::with_capacity(text.len() + 2);
    out.push('"');
    for c in text.chars() {
        match c {
            '"' => out.push_str("\\\""),
            '\\' => out.push_str("\\\\"),
            '\n' => out.push_str("\\n"),
            '\t' => out.push_str("\\t"),
            c if c.is_control() => out.push_str(&format!("\\u{:04X}", u32::from(c))),
            c => out.push(c),
        }
    }
    out.push('"');
    out
}

fn read_compound(item: &toml::Value) -> Result<DerivedFrom, String> {
    let Some(table) = item.as_table() else {
        return Err("each compound is a table { cas, name, properties }".to_string());
    };
    if let Some(other) = table
        .keys()
        .find(|k| !matches!(k.as_str(), "cas" | "name" | "properties"))
    {
        return Err(format!(
            "unknown field `{other}` (a compound has cas, name, properties)"
        ));
    }
    let text = |field: &str| -> Result<String, String> {
        match table.get(field) {
            Some(toml::Value::String(s)) if !s.trim().is_empty() => Ok(s.trim().to_string()),
            Some(_) => Err(format!("`{field}` must be a non-empty string")),
            None => Err(format!("no `{field}`")),
        }
    };
    let cas = Cas::parse(&text("cas")?)?;
    let name = text("name")?;
    let Some(toml::Value::Array(list)) = table.get("properties") else {
        return Err(format!(
            "{cas}: `properties` must be a list of \"hf\", \"s\", \"cp\""
        ));
    };
    let mut properties = Vec::new();
    for p in list {
        let property = p
            .as_str()
            .and_then(from_field)
            .ok_or_else(|| format!("{cas}: property {p} is not one of \"hf\", \"s\", \"cp\""))?;
        if properties.contains(&property) {
            return Err(format!(
                "{cas}: property \"{}\" listed twice",
                field(property)
            ));
        }
        properties.push(property);
    }
    if properties.is_empty() {
        return Err(format!("{cas}: `properties` is empty"));
    }
    properties.sort_by_key(|p| rank(*p));
    Ok(DerivedFrom {
        cas,
        name,
        properties,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn read(text: &str) -> Result<Provenance, String> {
        let table: toml::Table = toml::from_str(text).expect("test TOML");
        Provenance::from_toml(&table["derived_from"])
    }

    #[test]
    fn one_or_several_compounds_are_read_and_written_back() {
        let one = r#"derived_from = { cas = "109-99-9", name = "tetrahydrofuran", properties = ["cp", "s"] }"#;
        let p = read(one).unwrap();
        assert_eq!(p.properties(), [Property::S298, Property::Cp]);
        assert_eq!(
            format!("derived_from = {}", p.to_toml().unwrap()),
            one.replace("[\"cp\", \"s\"]", "[\"s\", \"cp\"]")
        );
        let two = r#"derived_from = [{ cas = "71-43-2", name = "benzene", properties = ["hf"] }, { cas = "7732-18-5", name = "water", properties = ["s"] }]"#;
        let p = read(two).unwrap();
        assert_eq!(p.cas_for(Property::Hf298).collect::<Vec<_>>(), ["71-43-2"]);
        assert_eq!(p.cas_for(Property::S298).collect::<Vec<_>>(), ["7732-18-5"]);
        assert_eq!(format!("derived_from = {}", p.to_toml().unwrap()), two);
    }

    #[test]
    fn bad_forms_are_refused_with_the_reason() {
        let cases = [
            (r#"derived_from = "benzene, 71-43-2""#, "old prose form"),
            (
                r#"derived_from = { cas = "71-43-3", name = "b", properties = ["hf"] }"#,
                "check digit",
            ),
            (
                r#"derived_from = { cas = "71432", name = "b", properties = ["hf"] }"#,
                "form N-NN-N",
            ),
            (
                r#"derived_from = { cas = "71-43-2", name = "b", properties = ["h"] }"#,
                "not one of",
            ),
            (
                r#"derived_from = { cas = "71-43-2", name = "b", properties = [] }"#,
                "empty",
            ),
            (
                r#"derived_from = { cas = "71-43-2", properties = ["hf"] }"#,
                "no `name`",
            ),
            (
                r#"derived_from = { cas = "71-43-2", name = "b", properties = ["hf"], year = 1 }"#,
                "unknown field `year`",
            ),
            (
                r#"derived_from = [{ cas = "71-43-2", name = "b", properties = ["hf"] }, { cas = "71-43-2", name = "b", properties = ["s"] }]"#,
                "named twice",
            ),
        ];
        for (text, expected) in cases {
            let err = read(text).unwrap_err();
            assert!(err.contains(expected), "{text}: {err}");
        }
    }
}
