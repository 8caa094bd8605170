//! Reaction equations written as reaction SMILES with coefficients: `2 C1CO1.O>>OCCO`.
//!
//! Each side is a `.`-separated list of species. A species may start with a coefficient (a
//! whole number, a decimal or a fraction such as `1/2`; SMILES never starts with a digit, so
//! the prefix is unambiguous) and may end with a phase mark `{g}`, `{gas}`, `{l}` or `{liquid}`.
//! A species written several times counts with the sum of its coefficients. Agents
//! (`reactants>agents>products`) are refused: write what takes part on one of the sides. The
//! equation must balance every element and the charge ([`ReactionEquation::check_balance`]).
//!
//! ```
//! use ringheat::reactions::equation::ReactionEquation;
//! let eq = ReactionEquation::parse("C1CO1{l}.O{l}>>OCCO{l}").unwrap();
//! assert_eq!(eq.reactants.len(), 2);
//! assert!(eq.check_balance().is_ok());
//! assert!(ReactionEquation::parse("C1CC1>>CCC").unwrap().check_balance().is_err());
//! ```

use std::collections::BTreeMap;
use std::fmt;

use crate::molecule::canon::canonical_smiles;
use crate::molecule::formula::Formula;
use crate::molecule::smiles::SmilesError;
use crate::molecule::{parse_smiles, Element, Molecule};
use crate::phase::Phase;

/// One species of an equation.
#[derive(Debug, Clone)]
pub struct EquationTerm {
    /// The SMILES as written (coefficient and phase mark removed).
    pub smiles: String,
    /// Canonical SMILES.
    pub key: String,
    /// The molecule.
    pub molecule: Molecule,
    /// Positive coefficient.
    pub coefficient: f64,
    /// The phase mark, if written.
    pub phase: Option<Phase>,
    /// 0-based byte column of the species in the equation text.
    pub column: usize,
}

/// A parsed equation.
#[derive(Debug, Clone)]
pub struct ReactionEquation {
    /// The text as given.
    pub text: String,
    /// Left side, in written order (a repeated species merged into its first place).
    pub reactants: Vec<EquationTerm>,
    /// Right side.
    pub products: Vec<EquationTerm>,
}

/// Why an equation could not be read or does not balance.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum EquationError {
    /// No `>>` between the sides.
    #[error("no `>>` between reactants and products")]
    NoArrow,
    /// `a>b>c` with agents.
    #[error("agents between `>` marks are not read; put each species on the side it is on")]
    Agents,
    /// A side without species.
    #[error("the {0} side is empty")]
    EmptySide(&'static str),
    /// Nothing between two `.`.
    #[error("empty species at column {}", .0 + 1)]
    EmptySpecies(usize),
    /// A coefficient that is not a positive number.
    #[error("coefficient `{text}` at column {} is not a positive number", .column + 1)]
    BadCoefficient {
        /// As written.
        text: String,
        /// 0-based column.
        column: usize,
    },
    /// A phase mark that is not g, gas, l or liquid.
    #[error("phase mark `{{{text}}}` at column {} is not g, gas, l or liquid", .column + 1)]
    BadPhase {
        /// As written.
        text: String,
        /// 0-based column.
        column: usize,
    },
    /// A species whose SMILES does not parse; the error's column counts within the species.
    #[error("species `{smiles}` at column {}: {error}", .column + 1)]
    Smiles {
        /// The species as written.
        smiles: String,
        /// 0-based column of the species in the equation.
        column: usize,
        /// The SMILES error.
        error: SmilesError,
    },
    /// Elements or charge differ between the sides.
    #[error("unbalanced: reactants {reactants}, products {products} ({difference})")]
    Unbalanced {
        /// Summed formula of the left side.
        reactants: String,
        /// Summed formula of the right side.
        products: String,
        /// What differs.
        difference: String,
    },
}

/// Parses a coefficient: whole number, decimal or fraction.
fn parse_coefficient(text: &str) -> Option<f64> {
    let value = match text.split_once('/') {
        Some((a, b)) => a.parse::<f64>().ok()? / b.parse::<f64>().ok()?,
        None => text.parse::<f64>().ok()?,
    };
    (value.is_finite() && value > 0.0).then_some(value)
}

fn parse_species(raw: &str, column: usize) -> Result<EquationTerm, EquationError> {
    let lead = raw.len() - raw.trim_start().len();
    let text = raw.trim();
    let start = column + lead;
    if text.is_empty() {
        return Err(EquationError::EmptySpecies(column));
    }
    let digits = text
        .find(|c: char| !(c.is_ascii_digit() || c == '.' || c == '/'))
        .unwrap_or(text.len());
    let (coefficient, rest, rest_col) = if digits > 0 {
        let c = &text[..digits];
        let value = parse_coefficient(c).ok_or_else(|| EquationError::BadCoefficient {
            text: c.to_string(),
            column: start,
        })?;
        let after = &text[digits..];
        let skip = after.len() - after.trim_start().len();
        let after = after.trim_start().trim_start_matches('*');
        (value, after, start + digits + skip)
    } else {
        (1.0, text, start)
    };
    let (smiles, phase) = match rest.strip_suffix('}').and_then(|r| r.rsplit_once('{')) {
        Some((s, mark)) => {
            let phase = Phase::parse(mark).ok_or_else(|| EquationError::BadPhase {
                text: mark.to_string(),
                column: rest_col + s.len(),
            })?;
            (s.trim_end(), Some(phase))
        }
        None => (rest, None),
    };
    if smiles.is_empty() {
        return Err(EquationError::EmptySpecies(rest_col));
    }
    let molecule = parse_smiles(smiles).map_err(|error| EquationError::Smiles {
        smiles: smiles.to_string(),
        column: rest_col,
        error,
    })?;
    let molecule = dihydrogen_as_one_atom(molecule);
    Ok(EquationTerm {
        smiles: smiles.to_string(),
        key: canonical_smiles(&molecule),
        molecule,
        coefficient,
        phase,
        column: rest_col,
    })
}

/// `[H][H]` (two hydrogen nodes) and `[HH]` (one atom with a hydrogen) are the same molecule
/// but give different canonical keys; the reference table holds the second spelling, so the
/// first is turned into it.
fn dihydrogen_as_one_atom(mol: Molecule) -> Molecule {
    let plain_h = |i| {
        let a = mol.atom(i);
        a.element == Element::H && a.charge == 0 && a.isotope.is_none() && a.hydrogens == 0
    };
    if mol.atom_count() == 2 && mol.bond_count() == 1 && mol.atoms().all(plain_h) {
        if let Ok(one) = parse_smiles("[HH]") {
            return one;
        }
    }
    mol
}

/// Splits one side at the `.` that separate species: a `.` inside a phase mark or right after
/// a coefficient digit (`0.5`) is not a separator.
fn split_side(side: &str, offset: usize) -> Vec<(&str, usize)> {
    let bytes = side.as_bytes();
    let mut parts = Vec::new();
    let mut start = 0;
    let mut in_mark = false;
    for (i, &b) in bytes.iter().enumerate() {
        match b {
            b'{' => in_mark = true,
            b'}' => in_mark = false,
            b'.' if !in_mark => {
                let prefix = side[start..i].trim_start();
                let only_digits = !prefix.is_empty() && prefix.bytes().all(|c| c.is_ascii_digit());
                let next_digit = bytes.get(i + 1).is_some_and(|c| c.is_ascii_digit());
                if only_digits && next_digit {
                    continue;
                }
                parts.push((&side[start..i], offset + start));
                start = i + 1;
            }
            _ => {}
        }
    }
    parts.push((&side[start..], offset + start));
    parts
}

fn parse_side(
    side: &str,
    offset: usize,
    name: &'static str,
) -> Result<Vec<EquationTerm>, EquationError> {
    if side.trim().is_empty() {
        return Err(EquationError::EmptySide(name));
    }
    let mut terms: Vec<EquationTerm> = Vec::new();
    for (raw, column) in split_side(side, offset) {
        let term = parse_species(raw, column)?;
        match terms
            .iter_mut()
            .find(|t| t.key == term.key && t.phase == term.phase)
        {
            Some(t) => t.coefficient += term.coefficient,
            None => terms.push(term),
        }
    }
    Ok(terms)
}

/// Atom counts of a side, summed with coefficients, and its charge.
fn side_counts(terms: &[EquationTerm]) -> (BTreeMap<Element, f64>, f64) {
    let mut counts = BTreeMap::new();
    let mut charge = 0.0;
    for t in terms {
        let f = Formula::of(&t.molecule);
        for i in t.molecule.atoms() {
            let e = t.molecule.atom(i).element;
            counts.entry(e).or_insert(0.0);
        }
        counts.entry(Element::H).or_insert(0.0);
        for (e, n) in counts.iter_mut() {
            *n += t.coefficient * f64::from(f.count(*e));
        }
        charge += t.coefficient * f64::from(f.charge());
    }
    counts.retain(|_, n| n.abs() > 1e-9);
    (counts, charge)
}

fn number(x: f64) -> String {
    if (x - x.round()).abs() < 1e-9 {
        format!("{}", x.round() as i64)
    } else {
        format!("{x:.3}")
            .trim_end_matches('0')
            .trim_end_matches('.')
            .to_string()
    }
}

/// A summed formula in Hill order (C, H, then alphabetical), coefficients may be fractional.
fn formula_text(counts: &BTreeMap<Element, f64>, charge: f64) -> String {
    let mut items: Vec<(&str, f64)> = counts.iter().map(|(e, n)| (e.symbol(), *n)).collect();
    let rank = |s: &str| match s {
        "C" => 0,
        "H" => 1,
        _ => 2,
    };
    items.sort_by(|a, b| rank(a.0).cmp(&rank(b.0)).then(a.0.cmp(b.0)));
    let mut out = String::new();
    for (s, n) in items {
        out.push_str(s);
        if (n - 1.0).abs() > 1e-9 {
            out.push_str(&number(n));
        }
    }
    if charge.abs() > 1e-9 {
        out.push_str(&format!(" (charge {})", number(charge)));
    }
    if out.is_empty() {
        out.push('0');
    }
    out
}

impl ReactionEquation {
    /// Reads an equation (it is not yet checked for balance).
    pub fn parse(text: &str) -> Result<ReactionEquation, EquationError> {
        let Some(arrow) = text.find(">>") else {
            return Err(if text.contains('>') {
                EquationError::Agents
            } else {
                EquationError::NoArrow
            });
        };
        let (left, right) = (&text[..arrow], &text[arrow + 2..]);
        if left.contains('>') || right.contains('>') {
            return Err(EquationError::Agents);
        }
        Ok(ReactionEquation {
            text: text.to_string(),
            reactants: parse_side(left, 0, "reactant")?,
            products: parse_side(right, arrow + 2, "product")?,
        })
    }

    /// Checks that every element and the charge balance; the error shows both sides' formulas.
    pub fn check_balance(&self) -> Result<(), EquationError> {
        let (left, lq) = side_counts(&self.reactants);
        let (right, rq) = side_counts(&self.products);
        let mut elements: Vec<Element> = left.keys().chain(right.keys()).copied().collect();
        elements.sort();
        elements.dedup();
        let mut diffs = Vec::new();
        for e in elements {
            let d = right.get(&e).copied().unwrap_or(0.0) - left.get(&e).copied().unwrap_or(0.0);
            if d.abs() > 1e-6 {
                diffs.push(format!(
                    "{} {} {}",
                    e.symbol(),
                    if d > 0.0 { "+" } else { "-" },
                    number(d.abs())
                ));
            }
        }
        if (rq - lq).abs() > 1e-6 {
            diffs.push(format!("charge {:+}", rq - lq));
        }
        if diffs.is_empty() {
            return Ok(());
        }
        Err(EquationError::Unbalanced {
            reactants: formula_text(&left, lq),
            products: formula_text(&right, rq),
            difference: format!("products minus reactants: {}", diffs.join(", ")),
        })
    }

    /// Every term with a signed coefficient: reactants negative.
    pub fn signed_terms(&self) -> impl Iterator<Item = (&EquationTerm, f64)> + '_ {
        let left = self.reactants.iter().map(|t| (t, -t.coefficient));
        let right = self.products.iter().map(|t| (t, t.coefficient));
        left.chain(right)
    }
}

/// Splits a line of a reaction file into the equation and an optional name.
///
/// Words are taken into the equation until it holds `>>` and its last species is complete: a
/// word that is only a coefficient, or that ends in `.` or `>`, needs the next word too. So
/// `2 C1CO1.O>>2 OCCO glycol route` gives the equation `2 C1CO1.O>>2 OCCO` and the name
/// `glycol route`. `None` for a blank line or a `#` comment.
pub fn split_equation_line(line: &str) -> Option<(String, Option<String>)> {
    let text = line.trim();
    if text.is_empty() || text.starts_with('#') {
        return None;
    }
    let words: Vec<&str> = text.split_whitespace().collect();
    let mut taken = 0;
    for (i, w) in words.iter().enumerate() {
        taken = i + 1;
        let joined = words[..=i].join(" ");
        let Some(arrow) = joined.find(">>") else {
            continue;
        };
        let tail = &joined[arrow + 2..];
        let last = tail.rsplit('.').next().unwrap_or("").trim();
        let wants_more = w.ends_with('.')
            || w.ends_with('>')
            || last.is_empty()
            || last.parse::<f64>().is_ok()
            || parse_coefficient(last).is_some();
        if !wants_more {
            break;
        }
    }
    let equation = words[..taken].join(" ");
    let rest = words[taken..].join(" ");
    let name = rest
        .split('#')
        .next()
        .map(str::trim)
        .filter(|s| !s.is_empty());
    Some((equation, name.map(str::to_string)))
}

/// `C1CO1 + O -> OCCO` with coefficients and phase marks.
impl fmt::Display for ReactionEquation {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let side = |terms: &[EquationTerm]| {
            terms
                .iter()
                .map(|t| {
                    let c = if (t.coefficient - 1.0).abs() < 1e-12 {
                        String::new()
                    } else {
                        format!("{} ", number(t.coefficient))
                    };
                    let p = t
                        .phase
                        .map(|p| format!("({})", &p.name()[..1]))
                        .unwrap_or_default();
                    format!("{c}{}{p}", t.smiles)
                })
                .collect::<Vec<_>>()
                .join(" + ")
        };
        write!(f, "{} -> {}", side(&self.reactants), side(&self.products))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn coefficients_and_marks() {
        let eq = ReactionEquation::parse("2 C=C.O=O>>2 C1CO1").expect("parses");
        assert_eq!(eq.reactants[0].coefficient, 2.0);
        assert!(eq.check_balance().is_ok());
        let eq = ReactionEquation::parse("C=C.0.5 O=O>>C1CO1").expect("parses");
        assert_eq!(eq.reactants[1].coefficient, 0.5);
        assert!(eq.check_balance().is_ok());
        let eq = ReactionEquation::parse("1/2 O=O.[H][H]>>O{l}").expect("parses");
        assert_eq!(eq.reactants[0].coefficient, 0.5);
        assert_eq!(eq.products[0].phase, Some(Phase::Liquid));
        assert!(eq.check_balance().is_ok());
        // Repeated species merge.
        let eq = ReactionEquation::parse("C=C.C=C>>C1CCC1").expect("parses");
        assert_eq!(eq.reactants.len(), 1);
        assert_eq!(eq.reactants[0].coefficient, 2.0);
    }

    #[test]
    fn file_lines_split_into_equation_and_name() {
        let (eq, name) = split_equation_line("2 C1CO1.O>>2 OCCO glycol route").expect("a line");
        assert_eq!(eq, "2 C1CO1.O>>2 OCCO");
        assert_eq!(name.as_deref(), Some("glycol route"));
        let (eq, name) = split_equation_line("C1CC1.[H][H]>>CCC").expect("a line");
        assert_eq!(eq, "C1CC1.[H][H]>>CCC");
        assert_eq!(name, None);
        assert!(split_equation_line("  # comment").is_none());
    }

    #[test]
    fn errors_name_the_place() {
        assert_eq!(
            ReactionEquation::parse("CC").unwrap_err(),
            EquationError::NoArrow
        );
        assert_eq!(
            ReactionEquation::parse("C>O>C").unwrap_err(),
            EquationError::Agents
        );
        match ReactionEquation::parse("CC.C1CC>>CCC") {
            Err(EquationError::Smiles { column, .. }) => assert_eq!(column, 3),
            other => panic!("{other:?}"),
        }
        match ReactionEquation::parse("C{s}>>C") {
            Err(EquationError::BadPhase { text, .. }) => assert_eq!(text, "s"),
            other => panic!("{other:?}"),
        }
        let e = ReactionEquation::parse("C1CC1>>CCC")
            .expect("parses")
            .check_balance()
            .unwrap_err();
        let text = e.to_string();
        assert!(text.contains("reactants C3H6"), "{text}");
        assert!(text.contains("products C3H8"), "{text}");
        assert!(text.contains("H + 2"), "{text}");
    }
}
