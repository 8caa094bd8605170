//! `ringheat strain`: strain energy of each molecule by every scheme, side by side.

use std::process::ExitCode;

use clap::Args;

use super::inputs::{InputArgs, TableArgs};
use ringheat::report::strain::{render_csv, render_table, strain_rows};
use ringheat::report::{failed_count, OutputFormat};
use ringheat::strain::StrainData;
use ringheat::thermo::Quantity;
use ringheat::units::{EnergyUnit, JOULES_PER_CALORIE};

/// Options of the strain command.
#[derive(Debug, Args)]
pub struct StrainArgs {
    #[command(flatten)]
    pub input: InputArgs,
    /// Your own Hf298 of the molecule (one input molecule only), in kJ/mol (kcal/mol with
    /// --kcal); it takes the place of the reference table's value.
    #[arg(long, allow_hyphen_values = true)]
    pub hf298: Option<f64>,
    /// Uncertainty of --hf298, same unit (default 0).
    #[arg(long, requires = "hf298")]
    pub hf298_unc: Option<f64>,
    /// Print (and read --hf298 in) kcal/mol instead of kJ/mol.
    #[arg(long)]
    pub kcal: bool,
    #[command(flatten)]
    pub tables: TableArgs,
}

/// Runs the command.
pub fn run(args: StrainArgs) -> Result<ExitCode, Box<dyn std::error::Error>> {
    let mut data = StrainData::bundled()?;
    data.engine = args.tables.engine()?;
    let unit = if args.kcal {
        EnergyUnit::KiloCalorie
    } else {
        EnergyUnit::KiloJoule
    };
    let records = args.input.records()?;
    let to_kj = if args.kcal { JOULES_PER_CALORIE } else { 1.0 };
    let user = match args.hf298 {
        Some(v) => {
            if records.len() != 1 {
                return Err(format!(
                    "--hf298 gives the Hf298 of one molecule, but {} molecules were given",
                    records.len()
                )
                .into());
            }
            let unc = args.hf298_unc.unwrap_or(0.0);
            if !v.is_finite() || !unc.is_finite() || unc < 0.0 {
                return Err(
                    "--hf298 and --hf298-unc must be finite, the uncertainty not negative".into(),
                );
            }
            Some(Quantity::new(v * to_kj, unc * to_kj))
        }
        None => None,
    };
    let rows = strain_rows(&records, &data, user);
    let text = match args.input.format {
        OutputFormat::Table => render_table(&rows, unit),
        OutputFormat::Json => serde_json::to_string_pretty(&rows)? + "\n",
        OutputFormat::Csv => render_csv(&rows, unit),
    };
    print!("{text}");
    Ok(super::inputs::report_failures(
        failed_count(&rows),
        rows.len(),
    ))
}
