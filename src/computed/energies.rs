//! The computed-enthalpies file: one species per line, keyed by SMILES.
//!
//! ```text
//! # Lines starting with '#' are comments; blank lines are skipped.
//! # SMILES        enthalpy          unit       optional note after '#'
//! C1CC1          -117.805372        hartree    # target
//! CC              -79.756843        hartree
//! ```
//!
//! Each line holds three fields separated by white space: the SMILES, the enthalpy (298.15 K,
//! electronic energy plus thermal enthalpy correction, as the user's program gives it) and its
//! unit, `hartree` (or `Eh`), `kJ/mol` or `kcal/mol`; anything after the third field must start
//! with `#`. One file uses one unit. Species are matched by canonical SMILES, so any spelling of
//! a structure will do, but each structure may appear only once. A value `?` (as the template
//! writes it) means "not filled in yet" and is an error naming the species.
//! Conversions to kJ/mol: [`crate::units`] (1 hartree = 2625.4996 kJ/mol, CODATA 2018; 1 kcal = 4.184 kJ).

use std::fmt;

use crate::molecule::canon::canonical_smiles;
use crate::molecule::parse_smiles;
use crate::units::{JOULES_PER_CALORIE, KJ_PER_HARTREE};

/// The unit of the enthalpies in a file.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
pub enum InputUnit {
    /// Hartree per molecule (atomic units).
    Hartree,
    /// kJ/mol.
    KjPerMol,
    /// kcal/mol (thermochemical calorie).
    KcalPerMol,
}

impl InputUnit {
    /// Reads a unit word (`hartree`, `Eh`, `kJ/mol`, `kcal/mol`; case does not matter).
    pub fn parse(word: &str) -> Option<InputUnit> {
        match word.to_ascii_lowercase().as_str() {
            "hartree" | "eh" => Some(InputUnit::Hartree),
            "kj/mol" => Some(InputUnit::KjPerMol),
            "kcal/mol" => Some(InputUnit::KcalPerMol),
            _ => None,
        }
    }

    /// Factor to kJ/mol.
    pub fn to_kj(self) -> f64 {
        match self {
            InputUnit::Hartree => KJ_PER_HARTREE,
            InputUnit::KjPerMol => 1.0,
            InputUnit::KcalPerMol => JOULES_PER_CALORIE,
        }
    }

    /// The word the template writes.
    pub fn word(self) -> &'static str {
        match self {
            InputUnit::Hartree => "hartree",
            InputUnit::KjPerMol => "kJ/mol",
            InputUnit::KcalPerMol => "kcal/mol",
        }
    }
}

/// One species of the file.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct EnergyLine {
    /// 1-based line.
    pub line: usize,
    /// SMILES as written.
    pub smiles: String,
    /// Canonical SMILES (the matching key).
    pub key: String,
    /// Enthalpy in the file's unit.
    pub value: f64,
}

/// A read file: its unit and its species.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct EnergiesFile {
    /// File name, for messages.
    pub file: String,
    /// The one unit of the file.
    pub unit: InputUnit,
    /// Species in file order.
    pub entries: Vec<EnergyLine>,
}

impl EnergiesFile {
    /// The entry for a canonical SMILES.
    pub fn get(&self, key: &str) -> Option<&EnergyLine> {
        self.entries.iter().find(|e| e.key == key)
    }
}

/// One problem of a computed-enthalpies file, with its file, line and species.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum EnergiesError {
    /// The file could not be read.
    #[error("{file}: cannot read: {message}")]
    Io {
        /// The file.
        file: String,
        /// The system's message.
        message: String,
    },
    /// A line that does not hold `SMILES value unit`, or holds a bad value or unit.
    #[error("{file}:{line}: {smiles}: {problem}")]
    Line {
        /// The file.
        file: String,
        /// 1-based line.
        line: usize,
        /// The first field of the line (the SMILES as written).
        smiles: String,
        /// What is wrong.
        problem: String,
    },
    /// The SMILES does not parse.
    #[error("{file}:{line}: {smiles}: SMILES does not parse: {message}")]
    Smiles {
        /// The file.
        file: String,
        /// 1-based line.
        line: usize,
        /// The SMILES as written.
        smiles: String,
        /// The parser's message.
        message: String,
    },
    /// A unit other than the file's first.
    #[error("{file}:{line}: {smiles}: unit {unit} differs from {first_unit} on line {first_line}; one file uses one unit")]
    MixedUnits {
        /// The file.
        file: String,
        /// 1-based line.
        line: usize,
        /// The SMILES as written.
        smiles: String,
        /// The line's unit.
        unit: String,
        /// The first unit of the file.
        first_unit: String,
        /// Where the first unit was given.
        first_line: usize,
    },
    /// A structure given twice (perhaps spelled two ways).
    #[error("{file}:{line}: {smiles}: same species ({key}) as line {first_line}")]
    Duplicate {
        /// The file.
        file: String,
        /// 1-based line of the second occurrence.
        line: usize,
        /// The SMILES as written.
        smiles: String,
        /// Canonical SMILES.
        key: String,
        /// Line of the first occurrence.
        first_line: usize,
    },
    /// A species of the reaction that the file lacks.
    #[error("{file}: no enthalpy for {key} ({role}) of the reaction")]
    Missing {
        /// The file.
        file: String,
        /// Canonical SMILES.
        key: String,
        /// `target`, `co-reactant x n` or `product x n`.
        role: String,
    },
    /// A species of the file that the reaction does not hold.
    #[error("{file}:{line}: {smiles}: not a species of the reaction {reaction}")]
    NotInReaction {
        /// The file.
        file: String,
        /// 1-based line.
        line: usize,
        /// The SMILES as written.
        smiles: String,
        /// The reaction.
        reaction: String,
    },
    /// No species line at all.
    #[error("{file}: no species lines")]
    Empty {
        /// The file.
        file: String,
    },
}

/// Every problem found in a file (all are reported, not just the first).
#[derive(Debug, Clone, PartialEq)]
pub struct EnergiesErrors(pub Vec<EnergiesError>);

impl fmt::Display for EnergiesErrors {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let lines: Vec<String> = self.0.iter().map(ToString::to_string).collect();
        write!(f, "{}", lines.join("\n"))
    }
}

impl std::error::Error for EnergiesErrors {}

/// Reads a computed-enthalpies file from its text; `file` labels messages. All problems of the
/// file are collected; any problem means no file.
pub fn parse_energies(text: &str, file: &str) -> Result<EnergiesFile, EnergiesErrors> {
    let mut errors = Vec::new();
    let mut entries: Vec<EnergyLine> = Vec::new();
    let mut unit: Option<(InputUnit, String, usize)> = None;
    for (i, raw) in text.lines().enumerate() {
        let line = i + 1;
        let trimmed = raw.trim();
        if trimmed.is_empty() || trimmed.starts_with('#') {
            continue;
        }
        let fields: Vec<&str> = trimmed.split_whitespace().collect();
        let smiles = fields[0].to_string();
        let bad = |problem: String| EnergiesError::Line {
            file: file.to_string(),
            line,
            smiles: smiles.clone(),
            problem,
        };
        if fields.len() < 3 {
            errors.push(bad(
                "expected three fields: SMILES, enthalpy and unit (hartree, kJ/mol or kcal/mol)"
                    .to_string(),
            ));
            continue;
        }
        if fields.len() > 3 && !fields[3].starts_with('#') {
            errors.push(bad(format!(
                "unexpected text after the unit: {:?} (a note must start with #)",
                fields[3..].join(" ")
            )));
            continue;
        }
        let value = match fields[1] {
            "?" => {
                errors.push(bad("no enthalpy filled in (the template's ?)".to_string()));
                continue;
            }
            v => match v.parse::<f64>() {
                Ok(x) if x.is_finite() => x,
                _ => {
                    errors.push(bad(format!("enthalpy {v:?} is not a finite number")));
                    continue;
                }
            },
        };
        let Some(this_unit) = InputUnit::parse(fields[2]) else {
            errors.push(bad(format!(
                "unknown unit {:?} (hartree, Eh, kJ/mol or kcal/mol)",
                fields[2]
            )));
            continue;
        };
        match &unit {
            None => unit = Some((this_unit, fields[2].to_string(), line)),
            Some((first, word, first_line)) if *first != this_unit => {
                errors.push(EnergiesError::MixedUnits {
                    file: file.to_string(),
                    line,
                    smiles: smiles.clone(),
                    unit: fields[2].to_string(),
                    first_unit: word.clone(),
                    first_line: *first_line,
                });
                continue;
            }
            Some(_) => {}
        }
        let key = match parse_smiles(&smiles) {
            Ok(mol) => canonical_smiles(&mol),
            Err(e) => {
                errors.push(EnergiesError::Smiles {
                    file: file.to_string(),
                    line,
                    smiles: smiles.clone(),
                    message: e.to_string().replace('\n', " | "),
                });
                continue;
            }
        };
        if let Some(first) = entries.iter().find(|e| e.key == key) {
            errors.push(EnergiesError::Duplicate {
                file: file.to_string(),
                line,
                smiles: smiles.clone(),
                key,
                first_line: first.line,
            });
            continue;
        }
        entries.push(EnergyLine {
            line,
            smiles,
            key,
            value,
        });
    }
    if !errors.is_empty() {
        return Err(EnergiesErrors(errors));
    }
    match unit {
        Some((unit, _, _)) => Ok(EnergiesFile {
            file: file.to_string(),
            unit,
            entries,
        }),
        None => Err(EnergiesErrors(vec![EnergiesError::Empty {
            file: file.to_string(),
        }])),
    }
}

/// Reads a computed-enthalpies file from disk.
pub fn read_energies(path: &std::path::Path) -> Result<EnergiesFile, EnergiesErrors> {
    let file = path.display().to_string();
    let text = std::fs::read_to_string(path).map_err(|e| {
        EnergiesErrors(vec![EnergiesError::Io {
            file: file.clone(),
            message: e.to_string(),
        }])
    })?;
    parse_energies(&text, &file)
}

/// A fill-in file for `reaction`: one line per species with `?` for the value, the given unit,
/// and the species' role as a note. Filled in, it reads back with [`parse_energies`].
pub fn template(reaction: &crate::reactions::Reaction, unit: InputUnit) -> String {
    let width = reaction
        .signed_terms()
        .map(|(s, _)| s.smiles.len())
        .max()
        .unwrap_or(0);
    let mut out = format!(
        "# ringheat computed enthalpies for {} ({}): {}\n\
         # Replace each ? by the species' enthalpy at 298.15 K (electronic energy plus thermal\n\
         # enthalpy correction), all from one method. One unit for the file: hartree, kJ/mol\n\
         # or kcal/mol. Any SMILES spelling of a species will do.\n",
        reaction.target.smiles, reaction.rung, reaction
    );
    for (species, coefficient) in reaction.signed_terms() {
        let role = if species.smiles == reaction.target.smiles {
            "target".to_string()
        } else if coefficient < 0 {
            format!("co-reactant x {}", -coefficient)
        } else {
            format!("product x {coefficient}")
        };
        out.push_str(&format!(
            "{:<width$}  ?  {}  # {role}\n",
            species.smiles,
            unit.word()
        ));
    }
    out
}
