//! `ringheat energetics`: dH, dS, dG and K of reactions written as reaction SMILES.

use std::collections::BTreeMap;
use std::process::ExitCode;

use clap::Args;

use super::inputs::TableArgs;
use ringheat::input::Place;
use ringheat::phase::Phase;
use ringheat::reactions::energetics::species::parse_species_value;
use ringheat::reactions::energetics::{EnergeticsData, EnergeticsOptions, SpeciesValues};
use ringheat::reactions::equation::split_equation_line;
use ringheat::report::energetics::{energetics_rows, render_csv, render_table, ReactionRecord};
use ringheat::report::{failed_count, OutputFormat};

/// Options of the energetics command.
#[derive(Debug, Args)]
pub struct EnergeticsArgs {
    /// Reactions (`2 A.B>>C`; a species may end in `{l}` or `{g}` for its phase).
    pub reactions: Vec<String>,
    /// Read reactions from this file, one per line with an optional name after it.
    #[arg(short, long)]
    pub file: Option<std::path::PathBuf>,
    /// Also give the values at these temperatures in K (gas phase, up to 1500), comma-separated.
    #[arg(long, value_delimiter = ',')]
    pub at: Vec<f64>,
    /// Phase of species without a phase mark.
    #[arg(long, value_enum, default_value_t = PhaseArg::Gas)]
    pub phase: PhaseArg,
    /// Also give the heat per mole of this reactant (its SMILES).
    #[arg(long)]
    pub per: Option<String>,
    /// A species' gas-phase Hf298, kJ/mol: SMILES=VALUE or SMILES=VALUE±UNC (repeatable).
    #[arg(long = "hf298", value_name = "SMILES=VALUE")]
    pub hf298: Vec<String>,
    /// A species' liquid-phase Hf298, kJ/mol (repeatable); wins over gas Hf298 minus dHvap.
    #[arg(long = "hf298-liquid", value_name = "SMILES=VALUE")]
    pub hf298_liquid: Vec<String>,
    /// A species' vaporisation enthalpy at 298.15 K, kJ/mol (repeatable).
    #[arg(long = "dhvap", value_name = "SMILES=VALUE")]
    pub dhvap: Vec<String>,
    /// Price every species by the estimates (group additivity, estimated dHvap) even where a
    /// measured value exists; your own values still apply.
    #[arg(long)]
    pub estimates_only: bool,
    /// Leave out the strain released (saves running the strain schemes).
    #[arg(long)]
    pub no_strain: bool,
    /// Output format.
    #[arg(long, value_enum, default_value_t = OutputFormat::Table)]
    pub format: OutputFormat,
    #[command(flatten)]
    pub tables: TableArgs,
}

/// Phase choice on the command line.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub enum PhaseArg {
    /// Ideal gas at 1 bar.
    Gas,
    /// Pure liquid.
    Liquid,
}

/// User values of the three kinds, by canonical SMILES.
pub fn user_values(
    hf298: &[String],
    hf298_liquid: &[String],
    dhvap: &[String],
) -> Result<BTreeMap<String, SpeciesValues>, String> {
    let mut out: BTreeMap<String, SpeciesValues> = BTreeMap::new();
    for text in hf298 {
        let (key, q) = parse_species_value(text).map_err(|e| format!("--hf298 {e}"))?;
        out.entry(key).or_default().hf298_gas_kj = Some(q);
    }
    for text in hf298_liquid {
        let (key, q) = parse_species_value(text).map_err(|e| format!("--hf298-liquid {e}"))?;
        out.entry(key).or_default().hf298_liquid_kj = Some(q);
    }
    for text in dhvap {
        let (key, q) = parse_species_value(text).map_err(|e| format!("--dhvap {e}"))?;
        out.entry(key).or_default().dhvap_kj = Some(q);
    }
    Ok(out)
}

fn records(args: &EnergeticsArgs) -> Result<Vec<ReactionRecord>, Box<dyn std::error::Error>> {
    let mut out: Vec<ReactionRecord> = args
        .reactions
        .iter()
        .enumerate()
        .map(|(i, r)| ReactionRecord {
            place: Place {
                source: "<argument>".to_string(),
                line: i + 1,
            },
            text: r.clone(),
            name: None,
        })
        .collect();
    if let Some(path) = &args.file {
        let name = path.display().to_string();
        let text = std::fs::read_to_string(path).map_err(|e| format!("cannot read {name}: {e}"))?;
        for (i, line) in text.lines().enumerate() {
            if let Some((eq, label)) = split_equation_line(line) {
                out.push(ReactionRecord {
                    place: Place {
                        source: name.clone(),
                        line: i + 1,
                    },
                    text: eq,
                    name: label,
                });
            }
        }
    }
    if out.is_empty() {
        return Err("no reaction given: write one as an argument or give --file".into());
    }
    Ok(out)
}

/// Runs the command.
pub fn run(args: EnergeticsArgs) -> Result<ExitCode, Box<dyn std::error::Error>> {
    if let Some(t) = args.at.iter().find(|t| !(298.15..=1500.0).contains(*t)) {
        return Err(format!("--at {t}: temperatures must lie in 298.15..1500 K").into());
    }
    let mut data = EnergeticsData::bundled()?;
    data.strain.engine = args.tables.engine()?;
    let options = EnergeticsOptions {
        temperatures_k: args.at.clone(),
        default_phase: match args.phase {
            PhaseArg::Gas => Phase::Gas,
            PhaseArg::Liquid => Phase::Liquid,
        },
        per_reactant: args.per.clone(),
        user_values: user_values(&args.hf298, &args.hf298_liquid, &args.dhvap)?,
        strain: !args.no_strain,
        use_measured: !args.estimates_only,
    };
    let records = records(&args)?;
    let rows = energetics_rows(&records, &data, &options);
    let text = match args.format {
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
