//! The hazard-screening job file: a TOML file of our own format (docs/hazard-job.md) listing the
//! compounds and the ring-opening steps of a process with their process data.
//!
//! Reading never stops at the first bad entry: a compound or step with a missing field, a wrong
//! unit, an unknown compound, an unbalanced reaction or an unknown key gets its errors (each with
//! file, line and key), and every other entry is still read. Only a file that is not TOML at all
//! fails as a whole.

use std::collections::BTreeMap;

use toml::de::{DeTable, DeValue};
use toml::Spanned;

use super::quantity::{self, Amount, Kind};
use crate::input::Place;
use crate::molecule::canon::canonical_smiles;
use crate::molecule::{parse_smiles, Molecule};
use crate::phase::Phase;
use crate::polymer::PolymerState;
use crate::reactions::energetics::SpeciesValues;
use crate::reactions::equation::ReactionEquation;
use crate::thermo::Quantity;

/// A problem with one key of the file.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct JobError {
    /// File and line.
    pub place: Place,
    /// The key (`step[2].batch_mass`), or the table for a missing key.
    pub key: String,
    /// What is wrong.
    pub message: String,
}

impl std::fmt::Display for JobError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "{}: {}: {}", self.place, self.key, self.message)
    }
}

/// A compound of the job.
#[derive(Debug, Clone)]
pub struct CompoundSpec {
    /// The id steps refer to.
    pub id: String,
    /// Display name.
    pub name: String,
    /// SMILES as written.
    pub smiles: String,
    /// Canonical SMILES.
    pub key: String,
    /// The molecule.
    pub molecule: Molecule,
    /// User values.
    pub values: SpeciesValues,
    /// Line of its table.
    pub line: usize,
}

/// What a step does.
#[derive(Debug, Clone)]
pub enum StepKind {
    /// A reaction written as reaction SMILES.
    Reaction {
        /// The equation (balanced).
        equation: ReactionEquation,
        /// Canonical SMILES of the reactant whose amount is given.
        key_reactant: String,
        /// Phase of species without a mark.
        phase: Phase,
    },
    /// Ring-opening polymerisation of a compound.
    Polymerisation {
        /// Index into the job's compounds.
        monomer: usize,
        /// The bond to open, if given.
        open_bond: Option<(usize, usize)>,
        /// States.
        state: PolymerState,
        /// Monomer concentration, mol/L, if given.
        concentration_mol_l: Option<f64>,
    },
}

/// A step with its process data.
#[derive(Debug, Clone)]
pub struct StepSpec {
    /// The step's name.
    pub name: String,
    /// What it does.
    pub kind: StepKind,
    /// Amount of the key reactant (or monomer) charged.
    pub amount: Amount,
    /// Mass of the whole batch, g.
    pub batch_mass_g: Quantity,
    /// Mixture heat capacity, J/(g K).
    pub cp_j_per_g_k: Quantity,
    /// Process temperature, K.
    pub process_t_k: Quantity,
    /// Fraction of the charge that reacts (1 unless given).
    pub conversion: f64,
    /// Line of its table.
    pub line: usize,
}

/// One step entry: read, or its errors.
#[derive(Debug, Clone)]
pub struct StepEntry {
    /// Its name (or `step N`).
    pub name: String,
    /// Line of its table.
    pub line: usize,
    /// The step, or everything wrong with it.
    pub spec: Result<StepSpec, Vec<JobError>>,
}

/// A read job.
#[derive(Debug, Clone)]
pub struct Job {
    /// The file name.
    pub file: String,
    /// Title.
    pub title: String,
    /// True when the file says its scenario is invented.
    pub invented: bool,
    /// Free text.
    pub note: Option<String>,
    /// Compounds that were read.
    pub compounds: Vec<CompoundSpec>,
    /// Steps in file order.
    pub steps: Vec<StepEntry>,
    /// Problems outside any step (the [job] table, bad compounds).
    pub problems: Vec<JobError>,
}

/// A file that cannot be read at all.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[error("{place}: {message}")]
pub struct JobFileError {
    /// Where.
    pub place: Place,
    /// What.
    pub message: String,
}

struct Reader<'a> {
    file: &'a str,
    text: &'a str,
}

impl Reader<'_> {
    fn line(&self, offset: usize) -> usize {
        self.text[..offset.min(self.text.len())]
            .bytes()
            .filter(|&b| b == b'\n')
            .count()
            + 1
    }
    fn error(&self, offset: usize, key: &str, message: impl Into<String>) -> JobError {
        JobError {
            place: Place {
                source: self.file.to_string(),
                line: self.line(offset),
            },
            key: key.to_string(),
            message: message.into(),
        }
    }
}

/// One table's entries by key, with spans.
struct Entries<'t, 'i> {
    map: BTreeMap<String, &'t Spanned<DeValue<'i>>>,
    start: usize,
    label: String,
}

impl<'t, 'i> Entries<'t, 'i> {
    fn new(table: &'t DeTable<'i>, start: usize, label: String) -> Entries<'t, 'i> {
        let map = table
            .iter()
            .map(|(k, v)| (k.get_ref().to_string(), v))
            .collect();
        Entries { map, start, label }
    }
    fn key(&self, k: &str) -> String {
        format!("{}.{k}", self.label)
    }
    /// Unknown keys of the table.
    fn unknown(&self, r: &Reader, allowed: &[&str]) -> Vec<JobError> {
        self.map
            .iter()
            .filter(|(k, _)| !allowed.contains(&k.as_str()))
            .map(|(k, v)| {
                r.error(
                    v.span().start,
                    &self.key(k),
                    format!("unknown key (allowed: {})", allowed.join(", ")),
                )
            })
            .collect()
    }
    fn string(&self, r: &Reader, k: &str) -> Result<Option<(String, usize)>, JobError> {
        match self.map.get(k) {
            None => Ok(None),
            Some(v) => match v.get_ref().as_str() {
                Some(s) => Ok(Some((s.to_string(), v.span().start))),
                None => Err(r.error(
                    v.span().start,
                    &self.key(k),
                    format!("must be a string, not a {}", v.get_ref().type_str()),
                )),
            },
        }
    }
    fn required(&self, r: &Reader, k: &str) -> Result<(String, usize), JobError> {
        self.string(r, k)?
            .ok_or_else(|| r.error(self.start, &self.key(k), "missing (required)"))
    }
    fn number(&self, r: &Reader, k: &str) -> Result<Option<(f64, usize)>, JobError> {
        match self.map.get(k) {
            None => Ok(None),
            Some(v) => {
                let x = match v.get_ref() {
                    DeValue::Float(f) => f.as_str().replace('_', "").parse::<f64>().ok(),
                    DeValue::Integer(i) => i.as_str().replace('_', "").parse::<f64>().ok(),
                    _ => None,
                };
                x.map(|x| Some((x, v.span().start)))
                    .ok_or_else(|| r.error(v.span().start, &self.key(k), "must be a number"))
            }
        }
    }
    fn quantity(&self, r: &Reader, k: &str, kind: Kind) -> Result<Quantity, JobError> {
        let (text, at) = self.required(r, k)?;
        quantity::parse(&text, kind).map_err(|e| r.error(at, &self.key(k), e))
    }
}

const JOB_KEYS: [&str; 3] = ["title", "invented", "note"];
const COMPOUND_KEYS: [&str; 6] = ["id", "smiles", "name", "hf298", "hf298_liquid", "dhvap"];
const STEP_KEYS: [&str; 15] = [
    "name",
    "kind",
    "reaction",
    "key_reactant",
    "phase",
    "monomer",
    "open_bond",
    "state",
    "monomer_concentration",
    "amount",
    "batch_mass",
    "cp_mixture",
    "process_temperature",
    "conversion",
    "note",
];

/// Collects the result of one field into `errors`.
fn take<T>(errors: &mut Vec<JobError>, r: Result<T, JobError>) -> Option<T> {
    match r {
        Ok(v) => Some(v),
        Err(e) => {
            errors.push(e);
            None
        }
    }
}

fn tables<'t, 'i>(
    root: &'t DeTable<'i>,
    name: &str,
    r: &Reader,
    problems: &mut Vec<JobError>,
) -> Vec<(&'t DeTable<'i>, usize)> {
    let Some((_, v)) = root.iter().find(|(k, _)| k.get_ref() == name) else {
        return Vec::new();
    };
    match v.get_ref() {
        DeValue::Array(items) => items
            .iter()
            .filter_map(|item| match item.get_ref() {
                DeValue::Table(t) => Some((t, item.span().start)),
                _ => {
                    problems.push(r.error(item.span().start, name, "must be a table ([[...]])"));
                    None
                }
            })
            .collect(),
        _ => {
            problems.push(r.error(v.span().start, name, format!("write each as [[{name}]]")));
            Vec::new()
        }
    }
}

fn energy(e: &Entries, r: &Reader, k: &str) -> Result<Option<Quantity>, JobError> {
    match e.string(r, k)? {
        None => Ok(None),
        Some((text, at)) => quantity::parse(&text, Kind::MolarEnergy)
            .map(Some)
            .map_err(|m| r.error(at, &e.key(k), m)),
    }
}

fn read_compound(e: &Entries, r: &Reader, line: usize) -> Result<CompoundSpec, Vec<JobError>> {
    let mut errors = e.unknown(r, &COMPOUND_KEYS);
    let id = take(&mut errors, e.required(r, "id"));
    let smiles = take(&mut errors, e.required(r, "smiles"));
    let name = take(&mut errors, e.string(r, "name")).flatten();
    let molecule = smiles.as_ref().and_then(|(s, at)| {
        take(
            &mut errors,
            parse_smiles(s).map_err(|err| {
                r.error(
                    *at,
                    &e.key("smiles"),
                    format!("does not parse: {}", err.to_string().replace('\n', " | ")),
                )
            }),
        )
    });
    let values = SpeciesValues {
        hf298_gas_kj: take(&mut errors, energy(e, r, "hf298")).flatten(),
        hf298_liquid_kj: take(&mut errors, energy(e, r, "hf298_liquid")).flatten(),
        dhvap_kj: take(&mut errors, energy(e, r, "dhvap")).flatten(),
    };
    match (id, smiles, molecule) {
        (Some((id, _)), Some((smiles, _)), Some(molecule)) if errors.is_empty() => {
            Ok(CompoundSpec {
                name: name.map(|n| n.0).unwrap_or_else(|| id.clone()),
                id,
                key: canonical_smiles(&molecule),
                smiles,
                molecule,
                values,
                line,
            })
        }
        _ => Err(errors),
    }
}

fn read_step(
    e: &Entries,
    r: &Reader,
    line: usize,
    compounds: &[CompoundSpec],
    bad_compounds: &[String],
) -> Result<StepSpec, Vec<JobError>> {
    let mut errors = e.unknown(r, &STEP_KEYS);
    let name = take(&mut errors, e.string(r, "name")).flatten();
    let kind_text = take(&mut errors, e.required(r, "kind"));
    let find_compound = |text: &str| compounds.iter().position(|c| c.id == text);
    let kind = match kind_text.as_ref().map(|(k, at)| (k.as_str(), *at)) {
        Some(("reaction", _)) => read_reaction(e, r, compounds, &mut errors),
        Some(("polymerisation", _)) => {
            let monomer = take(&mut errors, e.required(r, "monomer")).and_then(|(m, at)| {
                let found = find_compound(&m);
                if found.is_none() {
                    let why = if bad_compounds.contains(&m) {
                        format!("compound `{m}` has errors of its own (see above)")
                    } else {
                        format!("unknown compound `{m}`: no [[compound]] has this id")
                    };
                    errors.push(r.error(at, &e.key("monomer"), why));
                }
                found
            });
            let open_bond = take(&mut errors, e.string(r, "open_bond"))
                .flatten()
                .and_then(|(text, at)| {
                    let parsed = text.split_once('-').and_then(|(a, b)| {
                        Some((
                            a.trim().parse::<usize>().ok()?,
                            b.trim().parse::<usize>().ok()?,
                        ))
                    });
                    if parsed.is_none() {
                        errors.push(r.error(
                            at,
                            &e.key("open_bond"),
                            "write two atom numbers as \"I-J\"",
                        ));
                    }
                    parsed
                });
            let state = match take(&mut errors, e.string(r, "state")).flatten() {
                None => Some(PolymerState::LiquidCondensed),
                Some((s, at)) => match s.as_str() {
                    "lc" => Some(PolymerState::LiquidCondensed),
                    "gg" => Some(PolymerState::GasGas),
                    _ => {
                        errors.push(r.error(at, &e.key("state"), "must be \"lc\" or \"gg\""));
                        None
                    }
                },
            };
            let concentration =
                match take(&mut errors, e.string(r, "monomer_concentration")).flatten() {
                    None => Some(None),
                    Some((text, at)) => take(
                        &mut errors,
                        quantity::parse(&text, Kind::Concentration)
                            .map_err(|m| r.error(at, &e.key("monomer_concentration"), m))
                            .map(|q| Some(q.value)),
                    ),
                };
            match (monomer, state, concentration) {
                (Some(monomer), Some(state), Some(concentration_mol_l)) => {
                    Some(StepKind::Polymerisation {
                        monomer,
                        open_bond,
                        state,
                        concentration_mol_l,
                    })
                }
                _ => None,
            }
        }
        Some((other, at)) => {
            errors.push(r.error(
                at,
                &e.key("kind"),
                format!("`{other}` is not a kind of step (reaction, polymerisation)"),
            ));
            None
        }
        None => None,
    };
    let amount = take(&mut errors, e.required(r, "amount")).and_then(|(text, at)| {
        take(
            &mut errors,
            quantity::parse_amount(&text).map_err(|m| r.error(at, &e.key("amount"), m)),
        )
    });
    let batch = take(&mut errors, e.quantity(r, "batch_mass", Kind::Mass));
    let cp = take(&mut errors, e.quantity(r, "cp_mixture", Kind::SpecificHeat));
    let t = take(
        &mut errors,
        e.quantity(r, "process_temperature", Kind::Temperature),
    );
    let conversion = match take(&mut errors, e.number(r, "conversion")).flatten() {
        None => Some(1.0),
        Some((x, _)) if (0.0..=1.0).contains(&x) && x > 0.0 => Some(x),
        Some((_, at)) => {
            errors.push(r.error(at, &e.key("conversion"), "must be a fraction in (0, 1]"));
            None
        }
    };
    for (q, k) in [(&batch, "batch_mass"), (&cp, "cp_mixture")] {
        if let Some(q) = q {
            if q.value <= 0.0 {
                let at = e.map.get(k).map_or(e.start, |v| v.span().start);
                errors.push(r.error(at, &e.key(k), "must be positive"));
            }
        }
    }
    match (kind, amount, batch, cp, t, conversion) {
        (Some(kind), Some(amount), Some(batch), Some(cp), Some(t), Some(conversion))
            if errors.is_empty() =>
        {
            Ok(StepSpec {
                name: name
                    .map(|n| n.0)
                    .unwrap_or_else(|| format!("step at line {line}")),
                kind,
                amount,
                batch_mass_g: batch,
                cp_j_per_g_k: cp,
                process_t_k: t,
                conversion,
                line,
            })
        }
        _ => Err(errors),
    }
}

fn read_reaction(
    e: &Entries,
    r: &Reader,
    compounds: &[CompoundSpec],
    errors: &mut Vec<JobError>,
) -> Option<StepKind> {
    let (text, at) = take(errors, e.required(r, "reaction"))?;
    let equation =
        match ReactionEquation::parse(&text).and_then(|eq| eq.check_balance().map(|_| eq)) {
            Ok(eq) => eq,
            Err(err) => {
                errors.push(r.error(at, &e.key("reaction"), err.to_string().replace('\n', " | ")));
                return None;
            }
        };
    let phase = match take(errors, e.string(r, "phase")).flatten() {
        None => Phase::Liquid,
        Some((p, at)) => match Phase::parse(&p) {
            Some(p) => p,
            None => {
                errors.push(r.error(at, &e.key("phase"), "must be \"gas\" or \"liquid\""));
                return None;
            }
        },
    };
    let key_reactant = match take(errors, e.string(r, "key_reactant")).flatten() {
        None => equation.reactants.first()?.key.clone(),
        Some((k, at)) => {
            let key = compounds
                .iter()
                .find(|c| c.id == k)
                .map(|c| c.key.clone())
                .or_else(|| parse_smiles(&k).ok().map(|m| canonical_smiles(&m)));
            match key {
                Some(key) if equation.reactants.iter().any(|t| t.key == key) => key,
                Some(_) => {
                    errors.push(r.error(
                        at,
                        &e.key("key_reactant"),
                        format!("`{k}` is not a reactant of the reaction"),
                    ));
                    return None;
                }
                None => {
                    errors.push(r.error(
                        at,
                        &e.key("key_reactant"),
                        format!("unknown compound `{k}` (not an id, not a SMILES)"),
                    ));
                    return None;
                }
            }
        }
    };
    Some(StepKind::Reaction {
        equation,
        key_reactant,
        phase,
    })
}

/// Reads a job from its text; `file` labels the places.
pub fn read_job(text: &str, file: &str) -> Result<Job, JobFileError> {
    let r = Reader { file, text };
    let root = DeTable::parse(text).map_err(|e| JobFileError {
        place: Place {
            source: file.to_string(),
            line: e.span().map_or(1, |s| r.line(s.start)),
        },
        message: format!("not a TOML file: {}", e.message()),
    })?;
    let root = root.get_ref();
    let mut problems = Vec::new();
    for (k, v) in root.iter() {
        if !["job", "compound", "step"].contains(&k.get_ref().as_ref()) {
            problems.push(r.error(
                v.span().start,
                k.get_ref(),
                "unknown table (allowed: job, compound, step)",
            ));
        }
    }
    let (mut title, mut invented, mut note) = (String::from("(untitled job)"), false, None);
    match root.iter().find(|(k, _)| k.get_ref() == "job") {
        Some((_, v)) => match v.get_ref() {
            DeValue::Table(t) => {
                let e = Entries::new(t, v.span().start, "job".to_string());
                problems.extend(e.unknown(&r, &JOB_KEYS));
                match e.required(&r, "title") {
                    Ok((t, _)) => title = t,
                    Err(err) => problems.push(err),
                }
                if let Some(v) = e.map.get("invented") {
                    match v.get_ref().as_bool() {
                        Some(b) => invented = b,
                        None => problems.push(r.error(
                            v.span().start,
                            "job.invented",
                            "must be true or false",
                        )),
                    }
                }
                note = take(&mut problems, e.string(&r, "note"))
                    .flatten()
                    .map(|n| n.0);
            }
            _ => problems.push(r.error(v.span().start, "job", "must be a table")),
        },
        None => problems.push(r.error(0, "job", "missing [job] table with a title")),
    }
    let mut compounds: Vec<CompoundSpec> = Vec::new();
    let mut bad_compounds = Vec::new();
    for (i, (t, start)) in tables(root, "compound", &r, &mut problems)
        .into_iter()
        .enumerate()
    {
        let e = Entries::new(t, start, format!("compound[{}]", i + 1));
        match read_compound(&e, &r, r.line(start)) {
            Ok(c) => {
                if compounds.iter().any(|o| o.id == c.id) {
                    problems.push(r.error(
                        start,
                        &e.key("id"),
                        format!("id `{}` given twice", c.id),
                    ));
                } else {
                    compounds.push(c);
                }
            }
            Err(errs) => {
                if let Ok(Some((id, _))) = e.string(&r, "id") {
                    bad_compounds.push(id);
                }
                problems.extend(errs);
            }
        }
    }
    let mut steps = Vec::new();
    for (i, (t, start)) in tables(root, "step", &r, &mut problems)
        .into_iter()
        .enumerate()
    {
        let e = Entries::new(t, start, format!("step[{}]", i + 1));
        let line = r.line(start);
        let name = match e.string(&r, "name") {
            Ok(Some((n, _))) => n,
            _ => format!("step {} (line {line})", i + 1),
        };
        steps.push(StepEntry {
            name,
            line,
            spec: read_step(&e, &r, line, &compounds, &bad_compounds),
        });
    }
    if steps.is_empty() {
        problems.push(r.error(text.len(), "step", "the job has no [[step]]"));
    }
    Ok(Job {
        file: file.to_string(),
        title,
        invented,
        note,
        compounds,
        steps,
        problems,
    })
}
