//! Group keys in Benson's published notation, e.g. `C-(C)2(H)2`, `Cd-(C)(H)`, `Ca`, `O-(CO)(C)`.
//!
//! A key is a centre type and a multiset of ligand types. Parsing ignores ligand order, so
//! `C-(H)2(C)2` and `C-(C)2(H)2` are the same key; display uses one fixed order (heavy ligands by
//! [`LIGAND_ORDER`], hydrogen last).

use std::fmt;

/// Display order of ligand types; unknown types sort after these, alphabetically, before `H`.
pub const LIGAND_ORDER: &[&str] = &[
    "C", "Cd", "Ct", "Cb", "Cbf", "Ca", "CO", "CN", "O", "N", "NI", "NO2", "NO", "S", "SO", "SO2",
    "F", "Cl", "Br", "I", "H",
];

/// A Benson group: centre type plus ligand types with their counts.
#[derive(Debug, Clone, PartialEq, Eq, Hash, PartialOrd, Ord, serde::Serialize)]
pub struct GroupKey {
    /// Centre type, e.g. `C`, `Cd`, `CO`, `O`.
    pub centre: String,
    /// Ligand types with counts, in display order; counts are at least 1.
    pub ligands: Vec<(String, u8)>,
}

/// Why a group key string could not be read.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("group key `{text}`: {problem}")]
pub struct GroupKeyError {
    pub text: String,
    pub problem: String,
}

fn ligand_rank(name: &str) -> (usize, String) {
    match LIGAND_ORDER.iter().position(|l| *l == name) {
        Some(_) if name == "H" => (usize::MAX, String::new()),
        Some(i) => (i, String::new()),
        None => (LIGAND_ORDER.len(), name.to_string()),
    }
}

impl GroupKey {
    /// Builds a key from a centre and a list of ligand types (repeats allowed, any order).
    pub fn new<S: AsRef<str>>(centre: &str, ligands: &[S]) -> GroupKey {
        let mut counted: Vec<(String, u8)> = Vec::new();
        for l in ligands {
            let l = l.as_ref();
            match counted.iter_mut().find(|(name, _)| name == l) {
                Some((_, n)) => *n += 1,
                None => counted.push((l.to_string(), 1)),
            }
        }
        counted.sort_by_key(|(name, _)| ligand_rank(name));
        GroupKey {
            centre: centre.to_string(),
            ligands: counted,
        }
    }

    /// Reads Benson's notation: `CENTRE` or `CENTRE-(L)n(L)n...`.
    pub fn parse(text: &str) -> Result<GroupKey, GroupKeyError> {
        let fail = |problem: &str| GroupKeyError {
            text: text.to_string(),
            problem: problem.to_string(),
        };
        let text_trimmed = text.trim();
        let (centre, rest) = match text_trimmed.split_once('-') {
            Some((c, r)) => (c, r),
            None => (text_trimmed, ""),
        };
        if centre.is_empty() || !centre.chars().all(|c| c.is_ascii_alphanumeric()) {
            return Err(fail(
                "the centre type must be letters and digits, e.g. `C` or `CO`",
            ));
        }
        let mut ligands: Vec<String> = Vec::new();
        let mut chars = rest.chars().peekable();
        if !rest.is_empty() && !rest.starts_with('(') {
            return Err(fail("ligands must follow the centre as `-(L)`"));
        }
        while let Some(c) = chars.next() {
            if c != '(' {
                return Err(fail("expected `(` to open a ligand"));
            }
            let mut name = String::new();
            loop {
                match chars.next() {
                    Some(')') => break,
                    Some(ch) if ch.is_ascii_alphanumeric() => name.push(ch),
                    _ => return Err(fail("a ligand is letters and digits closed by `)`")),
                }
            }
            if name.is_empty() {
                return Err(fail("empty ligand `()`"));
            }
            let mut digits = String::new();
            while let Some(d) = chars.peek().filter(|d| d.is_ascii_digit()) {
                digits.push(*d);
                chars.next();
            }
            let count: usize = if digits.is_empty() {
                1
            } else {
                digits.parse().map_err(|_| fail("bad ligand count"))?
            };
            if count == 0 || count > 8 {
                return Err(fail("a ligand count must be 1 to 8"));
            }
            ligands.extend(std::iter::repeat_n(name, count));
        }
        if text_trimmed.contains('-') && ligands.is_empty() {
            return Err(fail("a `-` must be followed by ligands"));
        }
        Ok(GroupKey::new(centre, &ligands))
    }

    /// Total number of ligands.
    pub fn ligand_count(&self) -> usize {
        self.ligands.iter().map(|(_, n)| *n as usize).sum()
    }
}

impl fmt::Display for GroupKey {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.centre)?;
        if !self.ligands.is_empty() {
            f.write_str("-")?;
        }
        for (name, n) in &self.ligands {
            write!(f, "({name})")?;
            if *n > 1 {
                write!(f, "{n}")?;
            }
        }
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn parses_and_prints_in_fixed_order() {
        let k = GroupKey::parse("C-(H)2(C)2").unwrap();
        assert_eq!(k.to_string(), "C-(C)2(H)2");
        assert_eq!(k, GroupKey::new("C", &["H", "C", "C", "H"]));
        assert_eq!(GroupKey::parse("Ca").unwrap().to_string(), "Ca");
        assert_eq!(
            GroupKey::parse("C-(Cl)(C)(H)2").unwrap().to_string(),
            "C-(C)(Cl)(H)2"
        );
        assert_eq!(
            GroupKey::parse("O-(CO)(C)").unwrap().to_string(),
            "O-(C)(CO)"
        );
    }

    #[test]
    fn rejects_malformed() {
        for bad in ["", "C-", "C-(C", "C-()", "C-(C)0", "C(C)", "C-(C)9"] {
            assert!(GroupKey::parse(bad).is_err(), "{bad}");
        }
    }
}
