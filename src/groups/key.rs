//! Group keys in Benson's published notation, e.g. `C-(C)2(H)2`, `Cd-(C)(H)`, `Ca`, `O-(CO)(C)`.
//!
//! A key is a centre type and a multiset of ligand types, both [`AtomType`]s (Benson's atom
//! types; `Display` writes Benson's symbol). Parsing ignores ligand order, so `C-(H)2(C)2` and
//! `C-(C)2(H)2` are the same key; display uses one fixed order ([`AtomType::DISPLAY_ORDER`]:
//! heavy ligands first, hydrogen last). A type the vocabulary lacks is a parse error.

use std::cmp::Ordering;
use std::fmt;

/// Benson's atom types: every group centre and every ligand the tables use (group-tables/FORMAT.md
/// gives the vocabulary). `F`, `Cl`, `Br`, `I` and `H` are ligands only.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize)]
pub enum AtomType {
    /// sp3 carbon.
    C,
    /// Carbon of a non-aromatic C=C.
    Cd,
    /// Carbon of a C#C.
    Ct,
    /// Aromatic carbon of a benzene-type ring, not shared between two aromatic rings.
    Cb,
    /// Aromatic carbon shared by fused aromatic rings.
    Cbf,
    /// Allene centre `=C=`.
    Ca,
    /// Carbonyl carbon (the =O is part of the group).
    CO,
    /// Cyano group `-C#N` as one unit.
    CN,
    /// Thiocarbonyl carbon C=S.
    CS,
    /// Imine carbon C=N (the =N not listed).
    CI,
    /// Divalent oxygen.
    O,
    /// Trivalent amine or amide nitrogen.
    N,
    /// Imine nitrogen `=N-`.
    NI,
    /// Aromatic pyridine-type nitrogen.
    NA,
    /// Nitro group `-NO2` as one unit.
    NO2,
    /// Nitroso or nitrite `-N=O` as one unit.
    NO,
    /// Divalent sulfur.
    S,
    /// Sulfoxide sulfur S=O.
    SO,
    /// Sulfone sulfur O=S=O.
    SO2,
    /// Fluorine (ligand only).
    F,
    /// Chlorine (ligand only).
    Cl,
    /// Bromine (ligand only).
    Br,
    /// Iodine (ligand only).
    I,
    /// Hydrogen (ligand only).
    H,
}

impl AtomType {
    /// Every type, in the order keys list ligands: heavy ligands, then halogens, then the
    /// rarer types, hydrogen last.
    pub const DISPLAY_ORDER: [AtomType; 24] = [
        AtomType::C,
        AtomType::Cd,
        AtomType::Ct,
        AtomType::Cb,
        AtomType::Cbf,
        AtomType::Ca,
        AtomType::CO,
        AtomType::CN,
        AtomType::O,
        AtomType::N,
        AtomType::NI,
        AtomType::NO2,
        AtomType::NO,
        AtomType::S,
        AtomType::SO,
        AtomType::SO2,
        AtomType::F,
        AtomType::Cl,
        AtomType::Br,
        AtomType::I,
        AtomType::CI,
        AtomType::CS,
        AtomType::NA,
        AtomType::H,
    ];

    /// Benson's symbol (`C`, `Cd`, `CO`, `NO2`, `Cl`, ...).
    pub fn symbol(self) -> &'static str {
        match self {
            AtomType::C => "C",
            AtomType::Cd => "Cd",
            AtomType::Ct => "Ct",
            AtomType::Cb => "Cb",
            AtomType::Cbf => "Cbf",
            AtomType::Ca => "Ca",
            AtomType::CO => "CO",
            AtomType::CN => "CN",
            AtomType::CS => "CS",
            AtomType::CI => "CI",
            AtomType::O => "O",
            AtomType::N => "N",
            AtomType::NI => "NI",
            AtomType::NA => "NA",
            AtomType::NO2 => "NO2",
            AtomType::NO => "NO",
            AtomType::S => "S",
            AtomType::SO => "SO",
            AtomType::SO2 => "SO2",
            AtomType::F => "F",
            AtomType::Cl => "Cl",
            AtomType::Br => "Br",
            AtomType::I => "I",
            AtomType::H => "H",
        }
    }

    /// The type of a symbol, if the vocabulary has it.
    pub fn from_symbol(symbol: &str) -> Option<AtomType> {
        AtomType::DISPLAY_ORDER
            .into_iter()
            .find(|t| t.symbol() == symbol)
    }

    /// True for the types that are ligands only and centre no group (halogens, hydrogen).
    pub fn is_ligand_only(self) -> bool {
        matches!(
            self,
            AtomType::F | AtomType::Cl | AtomType::Br | AtomType::I | AtomType::H
        )
    }

    /// Centres whose multiple-bond partner is implied by the type and not listed as a ligand.
    pub fn implies_partner(self) -> bool {
        matches!(
            self,
            AtomType::Cd | AtomType::Ct | AtomType::Ca | AtomType::CI | AtomType::NI
        )
    }

    /// Centres whose aromatic ring neighbours are implied and not listed.
    pub fn implies_ring_neighbours(self) -> bool {
        matches!(self, AtomType::Cb | AtomType::NA)
    }

    /// The generic type of a ligand for stand-ins: carbon types as `C`, nitrogen types as `N`,
    /// sulfur types as `S`; others unchanged.
    pub fn generic(self) -> AtomType {
        match self {
            AtomType::Cd
            | AtomType::Ct
            | AtomType::Cb
            | AtomType::Cbf
            | AtomType::Ca
            | AtomType::CO
            | AtomType::CN
            | AtomType::CI
            | AtomType::CS => AtomType::C,
            AtomType::NI | AtomType::NA | AtomType::NO2 => AtomType::N,
            AtomType::SO | AtomType::SO2 => AtomType::S,
            other => other,
        }
    }

    fn display_rank(self) -> usize {
        AtomType::DISPLAY_ORDER
            .iter()
            .position(|t| *t == self)
            .unwrap_or(usize::MAX)
    }
}

impl fmt::Display for AtomType {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.symbol())
    }
}

/// Types order by their symbols as text (`Br` < `C` < `CI` < ...), so maps keyed by group keys
/// keep the order they had when keys were strings.
impl Ord for AtomType {
    fn cmp(&self, other: &AtomType) -> Ordering {
        self.symbol().cmp(other.symbol())
    }
}

impl PartialOrd for AtomType {
    fn partial_cmp(&self, other: &AtomType) -> Option<Ordering> {
        Some(self.cmp(other))
    }
}

/// A Benson group: centre type plus ligand types with their counts.
#[derive(Debug, Clone, PartialEq, Eq, Hash, PartialOrd, Ord, serde::Serialize)]
pub struct GroupKey {
    /// Centre type, e.g. `C`, `Cd`, `CO`, `O`.
    pub centre: AtomType,
    /// Ligand types with counts, in display order; counts are at least 1.
    pub ligands: Vec<(AtomType, u8)>,
}

/// Why a group key string could not be read.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("group key `{text}`: {problem}")]
pub struct GroupKeyError {
    /// The key as written.
    pub text: String,
    /// What is wrong.
    pub problem: String,
}

/// Ligands with counts in display order, from a list with repeats in any order.
fn counted(ligands: &[AtomType]) -> Vec<(AtomType, u8)> {
    let mut out: Vec<(AtomType, u8)> = Vec::new();
    for l in ligands {
        match out.iter_mut().find(|(t, _)| t == l) {
            Some((_, n)) => *n += 1,
            None => out.push((*l, 1)),
        }
    }
    out.sort_by_key(|(t, _)| t.display_rank());
    out
}

/// Benson's ligand notation of a list of types, in display order: `(C)(Cl)`, `(Cl)2`. Names of
/// pair corrections are built from it (`ortho-(C)(Cl)`, `cis-(F)2`, `vicinal-(Br)2`).
pub fn ligand_notation(ligands: &[AtomType]) -> String {
    let mut out = String::new();
    for (t, n) in counted(ligands) {
        out.push('(');
        out.push_str(t.symbol());
        out.push(')');
        if n > 1 {
            out.push_str(&n.to_string());
        }
    }
    out
}

impl GroupKey {
    /// Builds a key from a centre and a list of ligand types (repeats allowed, any order).
    pub fn new(centre: AtomType, ligands: &[AtomType]) -> GroupKey {
        GroupKey {
            centre,
            ligands: counted(ligands),
        }
    }

    /// Reads Benson's notation: `CENTRE` or `CENTRE-(L)n(L)n...`; every type must be one of
    /// [`AtomType`], and the centre not a ligand-only type.
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
        let centre = match AtomType::from_symbol(centre) {
            Some(t) if t.is_ligand_only() => {
                return Err(fail(&format!("{t} is a ligand only; it centres no group")))
            }
            Some(t) => t,
            None => return Err(fail(&unknown_type("centre", centre))),
        };
        let mut ligands: Vec<AtomType> = Vec::new();
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
            let Some(ligand) = AtomType::from_symbol(&name) else {
                return Err(fail(&unknown_type("ligand", &name)));
            };
            ligands.extend(std::iter::repeat_n(ligand, count));
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

/// The complaint about a symbol the vocabulary lacks, listing the known ones.
fn unknown_type(role: &str, symbol: &str) -> String {
    let known: Vec<&str> = AtomType::DISPLAY_ORDER.iter().map(|t| t.symbol()).collect();
    format!(
        "unknown {role} type `{symbol}` (Benson's types here: {})",
        known.join(", ")
    )
}

impl fmt::Display for GroupKey {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.centre.symbol())?;
        if !self.ligands.is_empty() {
            f.write_str("-")?;
        }
        for (t, n) in &self.ligands {
            write!(f, "({t})")?;
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
        use AtomType::{C, H};
        assert_eq!(k, GroupKey::new(C, &[H, C, C, H]));
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
        let err = GroupKey::parse("Si-(C)4").unwrap_err();
        assert!(err.problem.contains("unknown centre type `Si`"), "{err}");
        let err = GroupKey::parse("C-(C)(Xx)(H)2").unwrap_err();
        assert!(err.problem.contains("unknown ligand type `Xx`"), "{err}");
        assert!(GroupKey::parse("Cl-(C)")
            .unwrap_err()
            .problem
            .contains("ligand only"));
    }

    #[test]
    fn every_type_round_trips_and_orders_as_its_symbol() {
        for t in AtomType::DISPLAY_ORDER {
            assert_eq!(AtomType::from_symbol(&t.to_string()), Some(t));
        }
        assert!(AtomType::Br < AtomType::C && AtomType::CI < AtomType::CN);
        assert_eq!(ligand_notation(&[AtomType::Cl, AtomType::C]), "(C)(Cl)");
        assert_eq!(ligand_notation(&[AtomType::F, AtomType::F]), "(F)2");
    }
}
