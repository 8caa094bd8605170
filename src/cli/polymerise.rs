//! `ringheat polymerise`: ring-opening polymerisation thermodynamics and ceiling temperature.

use std::process::ExitCode;

use clap::Args;

use super::inputs::{InputArgs, TableArgs};
use ringheat::polymer::{PolymerState, PolymerisationOptions};
use ringheat::reactions::energetics::species::parse_value_with_uncertainty;
use ringheat::reactions::energetics::{EnergeticsData, SpeciesValues};
use ringheat::report::polymer::{polymer_rows, render_csv, render_table};
use ringheat::report::{failed_count, OutputFormat};

/// Options of the polymerise command.
#[derive(Debug, Args)]
pub struct PolymeriseArgs {
    #[command(flatten)]
    pub input: InputArgs,
    /// The ring bond to open, as two atom numbers (`2-8`; atoms counted from 1 in the order
    /// written, written hydrogens not counted). Default: the usual bond of the ring's group.
    #[arg(long, value_name = "I-J")]
    pub open_bond: Option<String>,
    /// Monomer concentration for the ceiling temperature, mol/L (default 1 mol/L).
    #[arg(long, value_name = "MOL_PER_L")]
    pub concentration: Option<f64>,
    /// Temperature at which to judge whether polymerisation is favoured, K (default 298.15).
    #[arg(long, value_name = "K")]
    pub temperature: Option<f64>,
    /// States: `lc` liquid monomer to condensed polymer (default), `gg` gas to gas.
    #[arg(long, value_enum, default_value_t = StateArg::Lc)]
    pub state: StateArg,
    /// The monomer's gas Hf298, kJ/mol (VALUE or VALUE±UNC; one monomer only).
    #[arg(long, allow_hyphen_values = true)]
    pub hf298: Option<String>,
    /// The monomer's liquid Hf298, kJ/mol (one monomer only); wins over gas Hf298 minus dHvap.
    #[arg(long, allow_hyphen_values = true)]
    pub hf298_liquid: Option<String>,
    /// The monomer's dHvap at 298.15 K, kJ/mol (one monomer only).
    #[arg(long)]
    pub dhvap: Option<String>,
    /// The repeat unit's vaporisation share, kJ/mol (replaces the group-contribution value).
    #[arg(long)]
    pub unit_dhvap: Option<String>,
    #[command(flatten)]
    pub tables: TableArgs,
}

/// States on the command line.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub enum StateArg {
    /// Liquid monomer to condensed polymer.
    Lc,
    /// Gaseous monomer to gaseous polymer.
    Gg,
}

/// Reads `I-J` into two atom numbers.
pub fn parse_bond(text: &str) -> Result<(usize, usize), String> {
    let (a, b) = text
        .split_once('-')
        .ok_or_else(|| format!("--open-bond {text}: write two atom numbers as I-J"))?;
    let n = |s: &str| {
        s.trim()
            .parse::<usize>()
            .map_err(|_| format!("--open-bond {text}: `{s}` is not an atom number"))
    };
    Ok((n(a)?, n(b)?))
}

/// Runs the command.
pub fn run(args: PolymeriseArgs) -> Result<ExitCode, Box<dyn std::error::Error>> {
    let mut data = EnergeticsData::bundled()?;
    data.strain.engine = args.tables.engine()?;
    let records = args.input.records()?;
    let per_monomer = [&args.hf298, &args.hf298_liquid, &args.dhvap];
    if per_monomer.iter().any(|o| o.is_some()) && records.len() != 1 {
        return Err(format!(
            "--hf298, --hf298-liquid and --dhvap give one monomer's values, but {} molecules were given",
            records.len()
        )
        .into());
    }
    let value = |o: &Option<String>, flag: &str| -> Result<_, String> {
        o.as_deref()
            .map(|t| parse_value_with_uncertainty(t).map_err(|e| format!("{flag} {e}")))
            .transpose()
    };
    let options = PolymerisationOptions {
        bond: args.open_bond.as_deref().map(parse_bond).transpose()?,
        concentration_mol_l: args.concentration,
        temperature_k: args.temperature,
        state: match args.state {
            StateArg::Lc => PolymerState::LiquidCondensed,
            StateArg::Gg => PolymerState::GasGas,
        },
        monomer_values: SpeciesValues {
            hf298_gas_kj: value(&args.hf298, "--hf298")?,
            hf298_liquid_kj: value(&args.hf298_liquid, "--hf298-liquid")?,
            dhvap_kj: value(&args.dhvap, "--dhvap")?,
        },
        unit_dhvap_kj: value(&args.unit_dhvap, "--unit-dhvap")?,
    };
    let rows = polymer_rows(&records, &data, &options);
    let text = match args.input.format {
        OutputFormat::Table => render_table(&rows),
        OutputFormat::Json => serde_json::to_string_pretty(&rows)? + "\n",
        OutputFormat::Csv => render_csv(&rows),
    };
    print!("{text}");
    Ok(super::inputs::report_failures(
        failed_count(&rows),
        rows.len(),
    ))
}
