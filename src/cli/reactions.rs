//! `ringheat reactions`: the CBH reactions of each molecule, and a fill-in template of the
//! species whose enthalpies to compute.

use std::process::ExitCode;

use clap::Args;

use super::inputs::InputArgs;
use ringheat::computed::InputUnit;
use ringheat::reactions::{group_additivity_fallback, lookup_with_fallback, ReferenceTable, Rung};
use ringheat::report::reactions::{reaction_rows, render_csv, render_table};
use ringheat::report::{OutputFormat, Row};
use ringheat::strain::analysis::FALLBACK_METHOD;
use ringheat::thermo::GroupAdditivity;
use ringheat::units::EnergyUnit;

/// Options of the reactions command.
#[derive(Debug, Args)]
pub struct ReactionsArgs {
    #[command(flatten)]
    pub input: InputArgs,
    /// Only this rung, CBH-n with n = 0 to 3; with one rung a fill-in template is printed.
    #[arg(long, value_parser = clap::value_parser!(u8).range(0..=3))]
    pub rung: Option<u8>,
    /// Unit the template asks for: hartree, kJ/mol or kcal/mol.
    #[arg(long, default_value = "hartree")]
    pub template_unit: String,
    /// Print kcal/mol instead of kJ/mol.
    #[arg(long)]
    pub kcal: bool,
}

/// Runs the command.
pub fn run(args: ReactionsArgs) -> Result<ExitCode, Box<dyn std::error::Error>> {
    let engine = GroupAdditivity::bundled()?;
    let table = ReferenceTable::bundled()?;
    let fallback = group_additivity_fallback(&engine);
    let lookup = lookup_with_fallback(&table, &fallback, FALLBACK_METHOD);
    let unit_word = InputUnit::parse(&args.template_unit).ok_or_else(|| {
        format!(
            "--template-unit {}: use hartree, kJ/mol or kcal/mol",
            args.template_unit
        )
    })?;
    let (rungs, template) = match args.rung.and_then(Rung::from_level) {
        Some(r) => (vec![r], Some(unit_word)),
        None => (Rung::ALL.to_vec(), None),
    };
    let unit = if args.kcal {
        EnergyUnit::KiloCalorie
    } else {
        EnergyUnit::KiloJoule
    };
    let records = args.input.records()?;
    let rows = reaction_rows(&records, &rungs, &lookup, template);
    let text = match args.input.format {
        OutputFormat::Table => render_table(&rows, unit),
        OutputFormat::Json => serde_json::to_string_pretty(&rows)? + "\n",
        OutputFormat::Csv => render_csv(&rows, unit),
    };
    print!("{text}");
    let failed = rows
        .iter()
        .filter(|r| matches!(r, Row::Failed { .. }))
        .count();
    if failed > 0 {
        eprintln!(
            "ringheat: {failed} of {} rows gave an error (see their rows)",
            rows.len()
        );
    }
    Ok(ExitCode::SUCCESS)
}
