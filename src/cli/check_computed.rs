//! `ringheat check-computed`: the Hf298 of one molecule from a CBH reaction and a file of
//! quantum-chemical enthalpies, with the strain energy and a group-additivity cross-check.

use std::path::PathBuf;
use std::process::ExitCode;

use clap::Args;

use ringheat::computed::{check_computed, read_energies, CheckOptions};
use ringheat::molecule::canon::canonical_smiles;
use ringheat::molecule::{parse_smiles, PerceivedMolecule};
use ringheat::reactions::{
    build_reaction, group_additivity_fallback, lookup_with_fallback, ReferenceTable, Rung,
};
use ringheat::report::computed::{render_csv, render_table, CheckReport};
use ringheat::report::OutputFormat;
use ringheat::strain::analysis::FALLBACK_METHOD;
use ringheat::thermo::{EstimateOptions, GroupAdditivity};
use ringheat::units::{EnergyUnit, JOULES_PER_CALORIE};

/// Options of the check-computed command.
#[derive(Debug, Args)]
pub struct CheckComputedArgs {
    /// SMILES of the molecule whose Hf298 the computed enthalpies should give.
    pub smiles: String,
    /// File of computed enthalpies: `SMILES value unit` per line (see `ringheat reactions
    /// --rung N` for a template).
    #[arg(long)]
    pub energies: PathBuf,
    /// The CBH rung whose reaction the file covers (0 to 3).
    #[arg(long, default_value_t = 2, value_parser = clap::value_parser!(u8).range(0..=3))]
    pub rung: u8,
    /// Flag a derived Hf298 further than this from group additivity (kJ/mol; kcal/mol with
    /// --kcal). Default 10 kJ/mol.
    #[arg(long)]
    pub tolerance: Option<f64>,
    /// Uncertainty of the computed reaction enthalpy (method error), same unit as --tolerance.
    #[arg(long, default_value_t = 0.0)]
    pub method_unc: f64,
    /// Print kcal/mol instead of kJ/mol.
    #[arg(long)]
    pub kcal: bool,
    /// Output format.
    #[arg(long, value_enum, default_value_t = OutputFormat::Table)]
    pub format: OutputFormat,
}

/// Runs the command. A bad energies file is an error naming every problem with its line.
pub fn run(args: CheckComputedArgs) -> Result<ExitCode, Box<dyn std::error::Error>> {
    let engine = GroupAdditivity::bundled()?;
    let table = ReferenceTable::bundled()?;
    let mol = parse_smiles(&args.smiles).map_err(|e| format!("{}: {e}", args.smiles))?;
    let rung = Rung::from_level(args.rung).ok_or("--rung must be 0 to 3")?;
    let reaction = build_reaction(&mol, rung).map_err(|e| format!("{}: {e}", args.smiles))?;
    let energies = read_energies(&args.energies)?;
    let to_kj = if args.kcal { JOULES_PER_CALORIE } else { 1.0 };
    let mut options = CheckOptions::default();
    if let Some(t) = args.tolerance {
        options.tolerance_kj = t * to_kj;
    }
    options.method_uncertainty_kj = args.method_unc * to_kj;
    if !(options.tolerance_kj >= 0.0 && options.method_uncertainty_kj >= 0.0) {
        return Err("--tolerance and --method-unc must not be negative".into());
    }
    let estimate = engine
        .estimate(&PerceivedMolecule::new(&mol), &EstimateOptions::default())
        .ok()
        .and_then(|e| e.hf298_kj);
    let fallback = group_additivity_fallback(&engine);
    let lookup = lookup_with_fallback(&table, &fallback, FALLBACK_METHOD);
    let check = check_computed(&reaction, &energies, &lookup, estimate, &options)?;
    let measured = table
        .get(&canonical_smiles(&mol))
        .map(|e| (e.hf298_kj, format!("{}, {}", e.name, e.source)));
    let report = CheckReport {
        input: args.smiles.clone(),
        energies_file: energies.file.clone(),
        energies_unit: energies.unit.word().to_string(),
        measured_hf_kj: measured,
        check,
    };
    let unit = if args.kcal {
        EnergyUnit::KiloCalorie
    } else {
        EnergyUnit::KiloJoule
    };
    let text = match args.format {
        OutputFormat::Table => render_table(&report, unit),
        OutputFormat::Json => serde_json::to_string_pretty(&report)? + "\n",
        OutputFormat::Csv => render_csv(&report, unit),
    };
    print!("{text}");
    Ok(ExitCode::SUCCESS)
}
