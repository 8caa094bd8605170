//! The one place where library rows become the rows Python sees: flat fields with units in
//! their names, sources and flag texts beside the numbers, errors with their place and column.
//!
//! Everything here is plain data serialised to JSON; the Python package turns each object into
//! a dataclass of the same fields (`ringheat/_types.py`). Numbers are not rounded: they are the
//! engine's values, the same that `ringheat ... --format json` prints.

use ringheat::molecule::parse_smiles;
use ringheat::report::reactions::ReactionRow;
use ringheat::report::strain::StrainRow;
use ringheat::report::thermo::EstimateRow;
use ringheat::report::{Row, RowError};
use ringheat::thermo::estimate::CP_TEMPERATURES;
use ringheat::thermo::terms::Term;
use ringheat::thermo::Quantity;
use serde::Serialize;

/// A failed record as Python sees it (raised as an exception by the single-molecule calls).
#[derive(Debug, Serialize)]
pub struct PyError {
    /// `smiles` when the SMILES does not parse, else `estimate`, `strain` or `reaction`.
    pub kind: &'static str,
    /// File name, `<argument>`, or the source name given by the caller.
    pub source: String,
    /// 1-based line (or position in the caller's sequence).
    pub line: usize,
    /// The input as written.
    pub input: String,
    /// The name given with the input, if any.
    pub name: Option<String>,
    /// The message, as the command line prints it (may hold the input and a caret line).
    pub message: String,
    /// 1-based column of a SMILES error, as the message says it.
    pub column: Option<usize>,
}

/// A row: a result (`ok`) or an error (`error`).
#[derive(Debug, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum PyRow<T> {
    /// A result.
    Ok(T),
    /// An error.
    Error(PyError),
}

fn error_of(error: &RowError, name: Option<String>, kind: &'static str) -> PyError {
    // A record whose SMILES does not parse failed for exactly that reason (the parse comes
    // first in every command), so the parse error gives the column the message names.
    let parse = parse_smiles(&error.input).err();
    let column = parse
        .as_ref()
        .filter(|e| e.to_string() == error.message)
        .map(|e| e.column + 1);
    PyError {
        kind: if column.is_some() { "smiles" } else { kind },
        source: error.place.source.clone(),
        line: error.place.line,
        input: error.input.clone(),
        name,
        message: error.message.clone(),
        column,
    }
}

/// Converts a library row, or its error, with `done` and the error kind `kind`.
pub fn convert<T, U>(
    row: &Row<T>,
    name: Option<String>,
    kind: &'static str,
    done: impl Fn(&T) -> U,
) -> PyRow<U> {
    match row {
        Row::Done(r) => PyRow::Ok(done(r)),
        Row::Failed { error } => PyRow::Error(error_of(error, name, kind)),
    }
}

fn value(q: Option<Quantity>) -> Option<f64> {
    q.map(|q| q.value)
}

fn unc(q: Option<Quantity>) -> Option<f64> {
    q.map(|q| q.uncertainty)
}

/// A flag with its category.
#[derive(Debug, Serialize)]
pub struct PyFlag {
    /// `stand-in`, `not applied`, `assumption` or `missing property`.
    pub category: &'static str,
    /// The flag as the command line prints it.
    pub text: String,
}

/// One group, correction or ring term of an estimate.
#[derive(Debug, Serialize)]
pub struct PyTerm {
    /// `group`, `correction` or `ring`.
    pub kind: String,
    /// Group key, correction name or ring name.
    pub label: String,
    /// Occurrences.
    pub count: u32,
    /// Hf298 per occurrence.
    pub hf_kj_per_mol: Option<f64>,
    /// Its uncertainty.
    pub hf_unc_kj_per_mol: Option<f64>,
    /// S298 per occurrence (intrinsic), when the table gives one.
    pub s_j_per_mol_k: Option<f64>,
    /// Its uncertainty.
    pub s_unc_j_per_mol_k: Option<f64>,
    /// Cp per occurrence at `cp_temperatures_k`, when the table gives it.
    pub cp_j_per_mol_k: Option<Vec<f64>>,
    /// Its uncertainty (one for every temperature).
    pub cp_unc_j_per_mol_k: Option<f64>,
    /// Source of the values.
    pub source: String,
    /// Stand-in and other remarks, as the explain view prints them.
    pub notes: Vec<String>,
}

fn term_of(t: &Term) -> PyTerm {
    let v = &t.per_unit;
    PyTerm {
        kind: t.kind.to_string(),
        label: t.label.clone(),
        count: t.count,
        hf_kj_per_mol: v.known.hf.then_some(v.hf_kj),
        hf_unc_kj_per_mol: v.known.hf.then_some(v.unc_hf_kj),
        s_j_per_mol_k: v.known.s.then_some(v.s_j),
        s_unc_j_per_mol_k: v.known.s.then_some(v.unc_s_j),
        cp_j_per_mol_k: v.known.cp.then(|| v.cp_j.to_vec()),
        cp_unc_j_per_mol_k: v.known.cp.then_some(v.unc_cp_j),
        source: t.source.clone(),
        notes: t.notes.iter().map(ToString::to_string).collect(),
    }
}

/// Cp, H, S and G at one temperature.
#[derive(Debug, Serialize)]
pub struct PyState {
    /// Temperature.
    pub t_k: f64,
    /// Heat capacity.
    pub cp_j_per_mol_k: f64,
    /// Its uncertainty.
    pub cp_unc_j_per_mol_k: f64,
    /// H(T) - H(298.15 K).
    pub h_minus_h298_kj_per_mol: f64,
    /// Hf298 + [H(T) - H298].
    pub h_kj_per_mol: f64,
    /// Its uncertainty.
    pub h_unc_kj_per_mol: f64,
    /// S(T).
    pub s_j_per_mol_k: f64,
    /// Its uncertainty.
    pub s_unc_j_per_mol_k: f64,
    /// G(T) = H(T) - T S(T), formation-enthalpy scale.
    pub g_kj_per_mol: f64,
    /// Its uncertainty.
    pub g_unc_kj_per_mol: f64,
}

/// One estimated molecule.
#[derive(Debug, Serialize)]
pub struct PyEstimate {
    pub input: String,
    pub name: Option<String>,
    pub source: String,
    pub line: usize,
    pub canonical_smiles: String,
    pub formula: String,
    pub hf298_kj_per_mol: Option<f64>,
    pub hf298_unc_kj_per_mol: Option<f64>,
    pub strain_free_hf298_kj_per_mol: Option<f64>,
    pub strain_free_hf298_unc_kj_per_mol: Option<f64>,
    pub s298_j_per_mol_k: Option<f64>,
    pub s298_unc_j_per_mol_k: Option<f64>,
    pub cp298_j_per_mol_k: Option<f64>,
    pub cp298_unc_j_per_mol_k: Option<f64>,
    pub cp_temperatures_k: Vec<f64>,
    pub cp_j_per_mol_k: Option<Vec<f64>>,
    pub cp_unc_j_per_mol_k: Option<Vec<f64>>,
    pub symmetry_number: u64,
    pub external_symmetry_number: u64,
    pub internal_symmetry_number: u64,
    pub optical_isomers: u8,
    pub symmetry_overridden: bool,
    pub symmetry_notes: Vec<String>,
    pub flags: Vec<PyFlag>,
    pub terms: Vec<PyTerm>,
    pub states: Vec<PyState>,
}

/// The Python row of an estimate row from `place` (source, line).
pub fn estimate_of(r: &EstimateRow, place: (&str, usize)) -> PyEstimate {
    let e = &r.estimate;
    PyEstimate {
        input: r.input.clone(),
        name: r.name.clone(),
        source: place.0.to_string(),
        line: place.1,
        canonical_smiles: r.canonical_smiles.clone(),
        formula: r.formula.clone(),
        hf298_kj_per_mol: value(e.hf298_kj),
        hf298_unc_kj_per_mol: unc(e.hf298_kj),
        strain_free_hf298_kj_per_mol: value(e.strain_free_hf298_kj),
        strain_free_hf298_unc_kj_per_mol: unc(e.strain_free_hf298_kj),
        s298_j_per_mol_k: value(e.s298_j),
        s298_unc_j_per_mol_k: unc(e.s298_j),
        cp298_j_per_mol_k: value(r.cp298_j),
        cp298_unc_j_per_mol_k: unc(r.cp298_j),
        cp_temperatures_k: CP_TEMPERATURES.to_vec(),
        cp_j_per_mol_k: e.cp_j.map(|c| c.iter().map(|q| q.value).collect()),
        cp_unc_j_per_mol_k: e.cp_j.map(|c| c.iter().map(|q| q.uncertainty).collect()),
        symmetry_number: e.symmetry.total,
        external_symmetry_number: e.symmetry.external,
        internal_symmetry_number: e.symmetry.internal,
        optical_isomers: e.symmetry.optical_isomers,
        symmetry_overridden: e.symmetry_overridden,
        symmetry_notes: e.symmetry.notes.clone(),
        flags: e
            .flags
            .iter()
            .map(|f| PyFlag {
                category: f.category().word(),
                text: f.to_string(),
            })
            .collect(),
        terms: e.terms.iter().map(term_of).collect(),
        states: r
            .states
            .iter()
            .map(|s| PyState {
                t_k: s.t_k,
                cp_j_per_mol_k: s.cp_j,
                cp_unc_j_per_mol_k: s.cp_unc_j,
                h_minus_h298_kj_per_mol: s.dh_kj,
                h_kj_per_mol: s.h_kj,
                h_unc_kj_per_mol: s.h_unc_kj,
                s_j_per_mol_k: s.s_j,
                s_unc_j_per_mol_k: s.s_unc_j,
                g_kj_per_mol: s.g_kj,
                g_unc_kj_per_mol: s.g_unc_kj,
            })
            .collect(),
    }
}

/// One strain scheme.
#[derive(Debug, Serialize)]
pub struct PyScheme {
    pub scheme: String,
    pub strain_kj_per_mol: Option<f64>,
    pub strain_unc_kj_per_mol: Option<f64>,
    pub strain_free_hf298_kj_per_mol: Option<f64>,
    pub strain_free_hf298_unc_kj_per_mol: Option<f64>,
    pub reaction: Option<String>,
    pub fallback_species: Vec<String>,
    pub unavailable: Option<String>,
    pub source: String,
}

/// Strain of one ring system from its ring corrections.
#[derive(Debug, Serialize)]
pub struct PyRingSystem {
    pub number: usize,
    pub atoms: Vec<usize>,
    pub ring_sizes: Vec<usize>,
    pub corrections: Vec<String>,
    pub strain_kj_per_mol: f64,
    pub strain_unc_kj_per_mol: f64,
    pub stand_in: Option<String>,
}

/// One molecule's strain by every scheme.
#[derive(Debug, Serialize)]
pub struct PyStrain {
    pub input: String,
    pub name: Option<String>,
    pub canonical_smiles: String,
    pub formula: String,
    pub hf298_kj_per_mol: f64,
    pub hf298_unc_kj_per_mol: f64,
    pub hf298_source: String,
    pub group_additivity_hf298_kj_per_mol: Option<f64>,
    pub group_additivity_hf298_unc_kj_per_mol: Option<f64>,
    pub schemes: Vec<PyScheme>,
    pub spread_kj_per_mol: Option<f64>,
    pub ring_systems: Vec<PyRingSystem>,
    pub unassigned_kj_per_mol: Option<f64>,
    pub unassigned_unc_kj_per_mol: Option<f64>,
    pub flags: Vec<String>,
}

/// The Python row of a strain row.
pub fn strain_of(r: &StrainRow) -> PyStrain {
    let a = &r.analysis;
    PyStrain {
        input: r.input.clone(),
        name: r.name.clone(),
        canonical_smiles: a.canonical_smiles.clone(),
        formula: a.formula.clone(),
        hf298_kj_per_mol: a.target_hf.hf298_kj.value,
        hf298_unc_kj_per_mol: a.target_hf.hf298_kj.uncertainty,
        hf298_source: a.target_hf.describe(),
        group_additivity_hf298_kj_per_mol: value(a.group_additivity_hf_kj),
        group_additivity_hf298_unc_kj_per_mol: unc(a.group_additivity_hf_kj),
        schemes: a
            .schemes
            .iter()
            .map(|s| PyScheme {
                scheme: s.scheme.clone(),
                strain_kj_per_mol: value(s.strain_kj),
                strain_unc_kj_per_mol: unc(s.strain_kj),
                strain_free_hf298_kj_per_mol: value(s.strain_free_hf_kj),
                strain_free_hf298_unc_kj_per_mol: unc(s.strain_free_hf_kj),
                reaction: s.reaction.clone(),
                fallback_species: s.fallback_species.clone(),
                unavailable: s.unavailable.clone(),
                source: s.source.clone(),
            })
            .collect(),
        spread_kj_per_mol: a.spread_kj,
        ring_systems: a
            .ring_systems
            .iter()
            .map(|s| PyRingSystem {
                number: s.number,
                atoms: s.atoms.clone(),
                ring_sizes: s.ring_sizes.clone(),
                corrections: s.corrections.clone(),
                strain_kj_per_mol: s.strain_kj.value,
                strain_unc_kj_per_mol: s.strain_kj.uncertainty,
                stand_in: s.stand_in.clone(),
            })
            .collect(),
        unassigned_kj_per_mol: value(a.unassigned_kj),
        unassigned_unc_kj_per_mol: unc(a.unassigned_kj),
        flags: a.flags.iter().map(ToString::to_string).collect(),
    }
}

/// One species of a CBH reaction.
#[derive(Debug, Serialize)]
pub struct PySpecies {
    pub smiles: String,
    pub coefficient: i64,
    pub role: &'static str,
    pub hf298_kj_per_mol: Option<f64>,
    pub hf298_unc_kj_per_mol: Option<f64>,
    /// Where the Hf298 comes from (`stand-in: ...` for a group-additivity stand-in).
    pub hf298_source: Option<String>,
}

/// One CBH reaction of one molecule.
#[derive(Debug, Serialize)]
pub struct PyCbh {
    pub input: String,
    pub name: Option<String>,
    pub rung: u8,
    pub reaction_class: &'static str,
    pub reaction: String,
    pub reaction_smiles: String,
    pub target_cancelled: bool,
    pub species: Vec<PySpecies>,
    pub template: Option<String>,
}

/// The Python row of a reaction row.
pub fn cbh_of(r: &ReactionRow) -> PyCbh {
    use ringheat::reactions::SourceTag;
    PyCbh {
        input: r.input.clone(),
        name: r.name.clone(),
        rung: r.rung.level(),
        reaction_class: r.reaction_class,
        reaction: r.reaction.clone(),
        reaction_smiles: r.reaction_smiles.clone(),
        target_cancelled: r.target_cancelled,
        species: r
            .species
            .iter()
            .map(|s| PySpecies {
                smiles: s.smiles.clone(),
                coefficient: s.coefficient,
                role: s.role,
                hf298_kj_per_mol: value(s.hf298_kj),
                hf298_unc_kj_per_mol: unc(s.hf298_kj),
                hf298_source: s.source.as_ref().map(|t| match t {
                    SourceTag::Reference { source } => source.clone(),
                    SourceTag::Fallback { method } => format!("stand-in: {method}"),
                    SourceTag::Target { note } => note.clone(),
                }),
            })
            .collect(),
        template: r.template.clone(),
    }
}
