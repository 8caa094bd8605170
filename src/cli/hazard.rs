//! `ringheat hazard`: process-hazard screening of the steps of a job file.

use std::path::PathBuf;
use std::process::ExitCode;

use clap::Args;

use super::inputs::TableArgs;
use ringheat::hazard::{read_job, screen};
use ringheat::reactions::energetics::EnergeticsData;
use ringheat::report::hazard::{render_csv, render_markdown, render_table};
use ringheat::report::html::render_html;

/// Options of the hazard command.
#[derive(Debug, Args)]
pub struct HazardArgs {
    /// The job file (TOML; format in docs/hazard-job.md).
    pub job: PathBuf,
    /// Output format on standard output.
    #[arg(long, value_enum, default_value_t = HazardFormat::Table)]
    pub format: HazardFormat,
    /// Also write the report in every format into this directory (hazard-report.txt, .csv,
    /// .md, .html).
    #[arg(long, value_name = "DIR")]
    pub report_dir: Option<PathBuf>,
    #[command(flatten)]
    pub tables: TableArgs,
}

/// Formats of the hazard report.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub enum HazardFormat {
    /// Terminal tables.
    Table,
    /// Comma-separated values, one line per step.
    Csv,
    /// Markdown.
    Markdown,
    /// A self-contained HTML page with the chart.
    Html,
    /// JSON.
    Json,
}

/// Runs the command.
pub fn run(args: HazardArgs) -> Result<ExitCode, Box<dyn std::error::Error>> {
    let name = args.job.display().to_string();
    let text =
        std::fs::read_to_string(&args.job).map_err(|e| format!("cannot read {name}: {e}"))?;
    let job = read_job(&text, &name)?;
    let mut data = EnergeticsData::bundled()?;
    data.strain.engine = args.tables.engine()?;
    let screening = screen(&job, &data);
    let render = |f: HazardFormat| -> Result<String, Box<dyn std::error::Error>> {
        Ok(match f {
            HazardFormat::Table => render_table(&screening),
            HazardFormat::Csv => render_csv(&screening),
            HazardFormat::Markdown => render_markdown(&screening),
            HazardFormat::Html => render_html(&screening),
            HazardFormat::Json => serde_json::to_string_pretty(&screening)? + "\n",
        })
    };
    print!("{}", render(args.format)?);
    if let Some(dir) = &args.report_dir {
        std::fs::create_dir_all(dir)
            .map_err(|e| format!("cannot create {}: {e}", dir.display()))?;
        for (f, ext) in [
            (HazardFormat::Table, "txt"),
            (HazardFormat::Csv, "csv"),
            (HazardFormat::Markdown, "md"),
            (HazardFormat::Html, "html"),
        ] {
            let path = dir.join(format!("hazard-report.{ext}"));
            std::fs::write(&path, render(f)?)
                .map_err(|e| format!("cannot write {}: {e}", path.display()))?;
        }
        eprintln!(
            "ringheat: report written to {} (hazard-report.txt, .csv, .md, .html)",
            dir.display()
        );
    }
    let failed = screening.failed_steps();
    if failed > 0 || !screening.problems.is_empty() {
        eprintln!(
            "ringheat: {failed} of {} steps not screened, {} other problem(s) in {name} (see the report)",
            screening.steps.len(),
            screening.problems.len()
        );
    }
    Ok(ExitCode::SUCCESS)
}
