//! Where the SMILES come from: arguments, a file, or standard input.

use std::io::BufReader;
use std::path::PathBuf;

use clap::Args;

use ringheat::groups::table::GroupTables;
use ringheat::input::{read_records, records_from_arguments, InputRecord};
use ringheat::report::OutputFormat;
use ringheat::thermo::GroupAdditivity;

/// Input and output options shared by the commands.
#[derive(Debug, Args)]
pub struct InputArgs {
    /// SMILES to read (each argument one molecule).
    pub smiles: Vec<String>,
    /// Read molecules from this file, one per line: SMILES, then an optional name
    /// (`-` for standard input; `#` starts a comment line).
    #[arg(short, long)]
    pub file: Option<PathBuf>,
    /// Output format.
    #[arg(long, value_enum, default_value_t = OutputFormat::Table)]
    pub format: OutputFormat,
}

impl InputArgs {
    /// All records: arguments first, then the file; standard input when neither is given.
    pub fn records(&self) -> Result<Vec<InputRecord>, Box<dyn std::error::Error>> {
        let mut records = records_from_arguments(&self.smiles);
        match &self.file {
            Some(path) if path.as_os_str() == "-" => {
                records.extend(read_records(std::io::stdin().lock(), "<stdin>")?);
            }
            Some(path) => {
                let name = path.display().to_string();
                let file =
                    std::fs::File::open(path).map_err(|e| format!("cannot open {name}: {e}"))?;
                records.extend(read_records(BufReader::new(file), &name)?);
            }
            None if self.smiles.is_empty() => {
                records.extend(read_records(std::io::stdin().lock(), "<stdin>")?);
            }
            None => {}
        }
        if records.is_empty() {
            return Err(
                "no SMILES to read: give them as arguments, with --file, or on standard input"
                    .into(),
            );
        }
        Ok(records)
    }
}

/// Says on standard error how many records failed; bad records are rows of the output, not a
/// failure of the run, so the exit code stays 0.
pub fn report_failures(failed: usize, total: usize) -> std::process::ExitCode {
    if failed > 0 {
        eprintln!("ringheat: {failed} of {total} records gave an error (see their rows)");
    }
    std::process::ExitCode::SUCCESS
}

/// Which group tables to use: the bundled ones, plus a user's directory, or only the user's.
#[derive(Debug, Args)]
pub struct TableArgs {
    /// A directory of extra table files whose entries add to or replace the bundled ones.
    #[arg(long)]
    pub extra_tables: Option<PathBuf>,
    /// Use only the table files of this directory instead of the bundled ones.
    #[arg(long, conflicts_with = "extra_tables")]
    pub tables: Option<PathBuf>,
}

impl TableArgs {
    /// The estimator over the chosen tables; refuses tables without any group.
    pub fn engine(&self) -> Result<GroupAdditivity, Box<dyn std::error::Error>> {
        let tables = match (&self.tables, &self.extra_tables) {
            (Some(dir), _) => GroupTables::load_dir(dir)?,
            (None, Some(dir)) => GroupTables::bundled()?.with_extra_dir(dir)?,
            (None, None) => GroupTables::bundled()?,
        };
        if tables.groups().next().is_none() {
            return Err("the tables hold no groups: check the --tables directory".into());
        }
        Ok(GroupAdditivity::new(tables)?)
    }
}
