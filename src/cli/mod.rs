//! Argument parsing and the subcommands; each command reads input, calls the library, prints.

mod check_computed;
mod energetics;
mod estimate;
mod hazard;
mod inputs;
mod polymerise;
mod polynomials;
mod reactions;
mod strain;
mod structure;

use std::process::ExitCode;

use clap::{Parser, Subcommand};

/// Ring-strain thermochemistry from SMILES.
#[derive(Debug, Parser)]
#[command(name = "ringheat", version, about, long_about = None)]
struct Cli {
    #[command(subcommand)]
    command: Command,
}

#[derive(Debug, Subcommand)]
enum Command {
    /// Canonical SMILES, formula, molar mass, rings and ring systems of each input molecule.
    Structure(structure::StructureArgs),
    /// Group-additivity Hf298, S298 and Cp(T) of each input molecule, with uncertainties.
    Estimate(estimate::EstimateArgs),
    /// Strain energy by every scheme (group increments, CBH-2, CBH-3), side by side.
    Strain(strain::StrainArgs),
    /// CBH-0 to CBH-3 reactions of each molecule; with --rung, a template of enthalpies to compute.
    Reactions(reactions::ReactionsArgs),
    /// Hf298 and strain of one molecule from a file of computed enthalpies for one CBH reaction.
    CheckComputed(check_computed::CheckComputedArgs),
    /// NASA-7 polynomials of each molecule's estimate, as Cantera YAML species entries.
    Polynomials(polynomials::PolynomialsArgs),
    /// dH, dS, dG and K of reactions (reaction SMILES with coefficients), per mole and per gram.
    Energetics(energetics::EnergeticsArgs),
    /// Ring-opening polymerisation: repeat unit, dH_p, dS_p, ceiling temperature, verdict.
    Polymerise(polymerise::PolymeriseArgs),
    /// Process-hazard screening of the steps of a job file; report as table, CSV, Markdown, HTML.
    Hazard(hazard::HazardArgs),
}

/// Runs the command line. Bad records become error rows; only unusable options or tables fail.
pub fn run() -> Result<ExitCode, Box<dyn std::error::Error>> {
    let cli = Cli::parse();
    match cli.command {
        Command::Structure(args) => structure::run(args),
        Command::Estimate(args) => estimate::run(args),
        Command::Strain(args) => strain::run(args),
        Command::Reactions(args) => reactions::run(args),
        Command::CheckComputed(args) => check_computed::run(args),
        Command::Polynomials(args) => polynomials::run(args),
        Command::Energetics(args) => energetics::run(args),
        Command::Polymerise(args) => polymerise::run(args),
        Command::Hazard(args) => hazard::run(args),
    }
}
