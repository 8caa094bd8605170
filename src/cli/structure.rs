//! `ringheat structure`: the structure facts of each molecule.

use std::process::ExitCode;

use clap::Args;

use super::inputs::InputArgs;
use ringheat::report::structure::{render_csv, render_table, structure_rows};
use ringheat::report::{failed_count, OutputFormat};

/// Options of the structure command.
#[derive(Debug, Args)]
pub struct StructureArgs {
    #[command(flatten)]
    pub input: InputArgs,
}

/// Runs the command.
pub fn run(args: StructureArgs) -> Result<ExitCode, Box<dyn std::error::Error>> {
    let records = args.input.records()?;
    let rows = structure_rows(&records);
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
