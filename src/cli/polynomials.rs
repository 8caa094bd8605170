//! `ringheat polynomials`: NASA-7 polynomials of each molecule's group-additivity estimate,
//! written as Cantera YAML species entries (or their fit quality as a table, JSON or CSV).

use std::io::Write;
use std::path::PathBuf;
use std::process::ExitCode;

use clap::{Args, ValueEnum};

use super::inputs::{InputArgs, TableArgs};
use ringheat::report::cantera_yaml::{CanteraYamlWriter, NameBook};
use ringheat::report::polynomials::{
    json_row, render_fit_csv, render_fit_table, Outcome, PolynomialJob,
};
use ringheat::report::OutputFormat;
use ringheat::thermo::estimate::EstimateOptions;
use ringheat::thermo::nasa::NasaRanges;
use ringheat::thermo::polynomials::{PolynomialOptions, PoorFit, DEFAULT_MAX_CP_DEVIATION_PCT};

/// What the command writes.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum PolynomialFormat {
    /// Cantera YAML species entries (NASA7 thermo).
    Yaml,
    /// Fit quality as a table.
    Table,
    /// Everything as JSON (with --at, Cp, H, S at those temperatures).
    Json,
    /// Fit quality as CSV.
    Csv,
}

/// Options of the polynomials command.
#[derive(Debug, Args)]
pub struct PolynomialsArgs {
    /// SMILES to read (each argument one molecule).
    pub smiles: Vec<String>,
    /// Read molecules from this file, one per line: SMILES, then an optional name (the
    /// species name in the YAML) and `sigma=N optical=N` words (`-` for standard input; `#`
    /// starts a comment line).
    #[arg(short, long)]
    pub file: Option<PathBuf>,
    /// Output format.
    #[arg(long, value_enum, default_value_t = PolynomialFormat::Yaml)]
    pub format: PolynomialFormat,
    /// Write to this file instead of standard output.
    #[arg(short, long)]
    pub output: Option<PathBuf>,
    /// Temperature ranges of the two polynomials, K: low,common,high.
    #[arg(long, value_delimiter = ',', default_values_t = [200.0, 1000.0, 3000.0])]
    pub ranges: Vec<f64>,
    /// Largest Cp deviation from the tabulated group values a fit may have, percent.
    #[arg(long, default_value_t = DEFAULT_MAX_CP_DEVIATION_PCT)]
    pub max_cp_deviation: f64,
    /// Export fits past --max-cp-deviation with a flag instead of refusing them.
    #[arg(long)]
    pub keep_poor_fits: bool,
    /// Also write an ideal-gas phase of this name holding every exported species (YAML).
    #[arg(long)]
    pub phase: Option<String>,
    /// With --format json: Cp, H, S from the polynomials and from ringheat's curve at these
    /// temperatures, K (comma-separated, within the ranges).
    #[arg(long, value_delimiter = ',')]
    pub at: Vec<f64>,
    #[command(flatten)]
    pub tables: TableArgs,
}

/// Runs the command.
pub fn run(args: PolynomialsArgs) -> Result<ExitCode, Box<dyn std::error::Error>> {
    if args.ranges.len() != 3 {
        return Err("--ranges takes three temperatures: LOW,MID,HIGH".into());
    }
    let ranges = NasaRanges {
        t_low_k: args.ranges[0],
        t_mid_k: args.ranges[1],
        t_high_k: args.ranges[2],
    };
    ranges.check().map_err(|e| format!("--ranges: {e}"))?;
    if !(args.max_cp_deviation.is_finite() && args.max_cp_deviation > 0.0) {
        return Err("--max-cp-deviation must be a positive percentage".into());
    }
    if let Some(t) = args
        .at
        .iter()
        .find(|t| !(ranges.t_low_k..=ranges.t_high_k).contains(*t))
    {
        return Err(format!(
            "--at {t}: temperatures must lie in the ranges, {}..{} K",
            ranges.t_low_k, ranges.t_high_k
        )
        .into());
    }
    let engine = args.tables.engine()?;
    let input = InputArgs {
        smiles: args.smiles.clone(),
        file: args.file.clone(),
        format: OutputFormat::Table,
    };
    let records = input.records()?;
    let job = PolynomialJob {
        engine: &engine,
        estimate: EstimateOptions::default(),
        fit: PolynomialOptions {
            ranges,
            max_cp_deviation_pct: args.max_cp_deviation,
            poor_fit: if args.keep_poor_fits {
                PoorFit::Flag
            } else {
                PoorFit::Refuse
            },
        },
    };
    let results: Vec<Result<_, String>> = records.iter().map(|r| job.run(r)).collect();
    let outcomes: Vec<Outcome<'_>> = records
        .iter()
        .zip(results.iter())
        .map(|(r, o)| {
            (
                &r.place,
                r.smiles.as_str(),
                o.as_ref().map_err(String::as_str),
            )
        })
        .collect();
    let mut out: Box<dyn Write> = match &args.output {
        Some(path) => Box::new(std::io::BufWriter::new(
            std::fs::File::create(path)
                .map_err(|e| format!("cannot create {}: {e}", path.display()))?,
        )),
        None => Box::new(std::io::stdout().lock()),
    };
    match args.format {
        PolynomialFormat::Yaml => {
            let mut writer = CanteraYamlWriter::new(&mut out, args.phase.clone());
            for (place, input, outcome) in &outcomes {
                writer.write_record(place, input, *outcome)?;
            }
            writer.finish()?;
        }
        PolynomialFormat::Table => out.write_all(render_fit_table(&outcomes).as_bytes())?,
        PolynomialFormat::Csv => out.write_all(render_fit_csv(&outcomes).as_bytes())?,
        PolynomialFormat::Json => {
            let mut names = NameBook::default();
            let rows: Vec<serde_json::Value> = outcomes
                .iter()
                .map(|o| {
                    let name =
                        o.2.ok()
                            .map(|s| names.assign(s.requested_name.as_deref(), &s.formula).0);
                    json_row(o, name.as_deref(), &args.at)
                })
                .collect();
            out.write_all((serde_json::to_string_pretty(&rows)? + "\n").as_bytes())?;
        }
    }
    out.flush()?;
    let failed = outcomes.iter().filter(|o| o.2.is_err()).count();
    Ok(super::inputs::report_failures(failed, outcomes.len()))
}
