//! `ringheat estimate`: group-additivity thermochemistry of each molecule.

use ringheat::molecule::symmetry::SymmetryOverride;
use std::process::ExitCode;

use clap::Args;

use super::inputs::{InputArgs, TableArgs};
use ringheat::report::thermo::{estimate_rows, render_csv, render_explain, render_table};
use ringheat::report::{failed_count, OutputFormat};
use ringheat::thermo::estimate::EstimateOptions;
use ringheat::units::EnergyUnit;

/// Options of the estimate command.
#[derive(Debug, Args)]
pub struct EstimateArgs {
    #[command(flatten)]
    pub input: InputArgs,
    /// List every group, correction and ring term with its count, value and source.
    #[arg(long)]
    pub explain: bool,
    /// Print kcal/mol and cal/(mol K) instead of kJ/mol and J/(mol K).
    #[arg(long)]
    pub kcal: bool,
    /// Also give Cp, H-H298, S and G at these temperatures in K (298.15 to 1500), comma-separated.
    #[arg(long, value_delimiter = ',')]
    pub at: Vec<f64>,
    #[command(flatten)]
    pub tables: TableArgs,
    /// Symmetry number to use instead of the graph's (applies to every input molecule).
    #[arg(long)]
    pub sigma: Option<u64>,
    /// Number of optical isomers to use instead of the graph's (with --sigma).
    #[arg(long, requires = "sigma")]
    pub optical_isomers: Option<u8>,
}

/// Runs the command.
pub fn run(args: EstimateArgs) -> Result<ExitCode, Box<dyn std::error::Error>> {
    let symmetry_override = match args.sigma {
        Some(s) => Some(
            SymmetryOverride::new(s, args.optical_isomers.unwrap_or(1))
                .map_err(|e| format!("--sigma/--optical-isomers: {e}"))?,
        ),
        None => None,
    };
    let engine = args.tables.engine()?;
    if let Some(t) = args.at.iter().find(|t| !(298.15..=1500.0).contains(*t)) {
        return Err(format!("--at {t}: temperatures must lie in 298.15..1500 K").into());
    }
    let options = EstimateOptions {
        symmetry_override,
        ..EstimateOptions::default()
    };
    let unit = if args.kcal {
        EnergyUnit::KiloCalorie
    } else {
        EnergyUnit::KiloJoule
    };
    let records = args.input.records()?;
    let rows = estimate_rows(&records, &engine, &options, &args.at);
    let text = match (args.input.format, args.explain) {
        (OutputFormat::Table, true) => render_explain(&rows, unit),
        (OutputFormat::Table, false) => render_table(&rows, unit),
        (OutputFormat::Json, _) => serde_json::to_string_pretty(&rows)? + "\n",
        (OutputFormat::Csv, _) => render_csv(&rows, unit, &args.at),
    };
    print!("{text}");
    Ok(super::inputs::report_failures(
        failed_count(&rows),
        rows.len(),
    ))
}
