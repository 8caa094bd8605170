//! `ringheat._ringheat`: the native half of the Python package. It holds the engine (group
//! tables, reference species, increment sets), runs the library on records with the GIL
//! released, and hands back rows as JSON text that `ringheat/_types.py` turns into dataclasses.

mod records;
mod rows;

use std::path::PathBuf;

use pyo3::exceptions::{PyOSError, PyValueError};
use pyo3::prelude::*;

use ringheat::groups::table::GroupTables;
use ringheat::molecule::symmetry::SymmetryOverride;
use ringheat::reactions::{group_additivity_fallback, lookup_with_fallback, Rung};
use ringheat::report::reactions::reaction_rows;
use ringheat::report::strain::strain_rows;
use ringheat::strain::analysis::FALLBACK_METHOD;
use ringheat::strain::StrainData;
use ringheat::thermo::{EstimateOptions, GroupAdditivity, Quantity};

use records::Item;

/// The bundled tables, or a user's directory added to them (`extra_tables`) or used alone
/// (`tables`), as `--extra-tables` and `--tables` choose them on the command line.
fn load_engine(
    tables: Option<PathBuf>,
    extra_tables: Option<PathBuf>,
) -> Result<GroupAdditivity, String> {
    let loaded = match (&tables, &extra_tables) {
        (Some(_), Some(_)) => {
            return Err(
                "give tables or extra_tables, not both (as --tables and --extra-tables)".into(),
            )
        }
        (Some(dir), None) => GroupTables::load_dir(dir),
        (None, Some(dir)) => GroupTables::bundled().and_then(|t| t.with_extra_dir(dir)),
        (None, None) => GroupTables::bundled(),
    }
    .map_err(|e| e.to_string())?;
    if loaded.groups().next().is_none() {
        return Err("the tables hold no groups: check the tables directory".into());
    }
    GroupAdditivity::new(loaded).map_err(|e| e.to_string())
}

/// Group tables, reference species and strain-free increments, loaded once.
#[pyclass(frozen, module = "ringheat._ringheat")]
struct Engine {
    strain: StrainData,
}

fn to_json<T: serde::Serialize>(value: &T) -> PyResult<String> {
    serde_json::to_string(value).map_err(|e| PyValueError::new_err(e.to_string()))
}

#[pymethods]
impl Engine {
    #[new]
    #[pyo3(signature = (tables=None, extra_tables=None))]
    fn new(
        py: Python<'_>,
        tables: Option<PathBuf>,
        extra_tables: Option<PathBuf>,
    ) -> PyResult<Engine> {
        py.detach(|| -> Result<Engine, String> {
            let engine = load_engine(tables, extra_tables)?;
            let mut strain = StrainData::bundled().map_err(|e| e.to_string())?;
            strain.engine = engine;
            Ok(Engine { strain })
        })
        .map_err(PyValueError::new_err)
    }

    /// Estimate rows (JSON array) of `items`, each a (SMILES, name) pair, named `source:line`
    /// with the given `lines` or lines from `first_line` on, on `threads` threads (0: one per
    /// core).
    #[pyo3(signature = (items, source, first_line, temperatures_k, sigma, optical_isomers, threads, lines=None))]
    #[allow(clippy::too_many_arguments)]
    fn estimate_json(
        &self,
        py: Python<'_>,
        items: Vec<Item>,
        source: String,
        first_line: usize,
        temperatures_k: Vec<f64>,
        sigma: Option<u64>,
        optical_isomers: Option<u8>,
        threads: usize,
        lines: Option<Vec<usize>>,
    ) -> PyResult<String> {
        let records = records::from_items(items, &source, first_line, lines)
            .map_err(PyValueError::new_err)?;
        let options = estimate_options(sigma, optical_isomers, &temperatures_k)?;
        py.detach(|| {
            to_json(&records::estimate(
                &records,
                &self.strain.engine,
                &options,
                &temperatures_k,
                threads,
            ))
        })
    }

    /// Estimate rows (JSON array) of a file read as `ringheat estimate --file` reads it.
    #[pyo3(signature = (path, temperatures_k, sigma, optical_isomers, threads))]
    fn estimate_file_json(
        &self,
        py: Python<'_>,
        path: PathBuf,
        temperatures_k: Vec<f64>,
        sigma: Option<u64>,
        optical_isomers: Option<u8>,
        threads: usize,
    ) -> PyResult<String> {
        let options = estimate_options(sigma, optical_isomers, &temperatures_k)?;
        py.detach(|| {
            let records = records::from_file(&path).map_err(PyOSError::new_err)?;
            to_json(&records::estimate(
                &records,
                &self.strain.engine,
                &options,
                &temperatures_k,
                threads,
            ))
        })
    }

    /// Strain rows (JSON array); `hf298_kj` (value, uncertainty) replaces the reference value.
    #[pyo3(signature = (items, source, first_line, hf298_kj))]
    fn strain_json(
        &self,
        py: Python<'_>,
        items: Vec<Item>,
        source: String,
        first_line: usize,
        hf298_kj: Option<(f64, f64)>,
    ) -> PyResult<String> {
        let records =
            records::from_items(items, &source, first_line, None).map_err(PyValueError::new_err)?;
        if let Some((v, u)) = hf298_kj {
            if !v.is_finite() || !u.is_finite() || u < 0.0 {
                return Err(PyValueError::new_err(
                    "hf298 and its uncertainty must be finite, the uncertainty not negative",
                ));
            }
        }
        let user = hf298_kj.map(|(v, u)| Quantity::new(v, u));
        py.detach(|| {
            let rows = strain_rows(&records, &self.strain, user);
            let out: Vec<_> = rows
                .iter()
                .zip(&records)
                .map(|(row, r)| rows::convert(row, r.name.clone(), "strain", rows::strain_of))
                .collect();
            to_json(&out)
        })
    }

    /// CBH reaction rows (JSON array) at `rungs` (0 to 3), with a template of computed
    /// enthalpies in `template_unit` when one is given.
    #[pyo3(signature = (items, source, first_line, rungs, template_unit))]
    fn cbh_json(
        &self,
        py: Python<'_>,
        items: Vec<Item>,
        source: String,
        first_line: usize,
        rungs: Vec<u8>,
        template_unit: Option<String>,
    ) -> PyResult<String> {
        let records =
            records::from_items(items, &source, first_line, None).map_err(PyValueError::new_err)?;
        let rungs = rungs
            .iter()
            .map(|&n| {
                Rung::from_level(n)
                    .ok_or_else(|| PyValueError::new_err(format!("rung {n}: use 0 to 3 (CBH-n)")))
            })
            .collect::<PyResult<Vec<_>>>()?;
        let unit = match template_unit {
            Some(word) => Some(ringheat::computed::InputUnit::parse(&word).ok_or_else(|| {
                PyValueError::new_err(format!(
                    "template unit {word}: use hartree, kJ/mol or kcal/mol"
                ))
            })?),
            None => None,
        };
        py.detach(|| {
            let fallback = group_additivity_fallback(&self.strain.engine);
            let lookup = lookup_with_fallback(&self.strain.references, &fallback, FALLBACK_METHOD);
            let rows = reaction_rows(&records, &rungs, &lookup, unit);
            let out: Vec<_> = rows
                .iter()
                .map(|row| {
                    let name = match row {
                        ringheat::report::Row::Done(r) => r.name.clone(),
                        ringheat::report::Row::Failed { error } => records
                            .iter()
                            .find(|r| r.place == error.place)
                            .and_then(|r| r.name.clone()),
                    };
                    rows::convert(row, name, "reaction", rows::cbh_of)
                })
                .collect();
            to_json(&out)
        })
    }
}

fn estimate_options(
    sigma: Option<u64>,
    optical_isomers: Option<u8>,
    temperatures_k: &[f64],
) -> PyResult<EstimateOptions> {
    if optical_isomers.is_some() && sigma.is_none() {
        return Err(PyValueError::new_err("optical_isomers needs sigma"));
    }
    // Checked as `--sigma` / `--optical-isomers` are checked.
    let symmetry_override = sigma
        .map(|s| SymmetryOverride::new(s, optical_isomers.unwrap_or(1)))
        .transpose()
        .map_err(|e| PyValueError::new_err(format!("sigma/optical_isomers: {e}")))?;
    if let Some(t) = temperatures_k
        .iter()
        .find(|t| !(298.15..=1500.0).contains(*t))
    {
        return Err(PyValueError::new_err(format!(
            "temperature {t} K: temperatures must lie in 298.15..1500 K"
        )));
    }
    Ok(EstimateOptions {
        symmetry_override,
        ..EstimateOptions::default()
    })
}

/// The native module.
#[pymodule]
fn _ringheat(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_class::<Engine>()?;
    m.add("__version__", env!("CARGO_PKG_VERSION"))?;
    m.add("SAFETY_NOTE", ringheat::report::SAFETY_NOTE)?;
    m.add(
        "CP_TEMPERATURES_K",
        ringheat::thermo::estimate::CP_TEMPERATURES.to_vec(),
    )?;
    Ok(())
}
