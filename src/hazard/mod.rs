//! Process-hazard screening of ring-opening steps from a job file: heat per mole and per gram,
//! adiabatic temperature rise, maximum temperature, severity class, the 500 J/g screening line
//! and oxygen balance, with sources and uncertainties. Screening estimates only: not a
//! substitute for calorimetry (DSC, ARC, RC) or a qualified process-safety review.
//!
//! ```
//! use ringheat::hazard::{read_job, screen};
//! use ringheat::reactions::energetics::EnergeticsData;
//! let text = r#"
//! [job]
//! title = "example (invented)"
//! [[compound]]
//! id = "EO"
//! smiles = "C1CO1"
//! [[step]]
//! name = "hydrolysis"
//! kind = "reaction"
//! reaction = "C1CO1.O>>OCCO"
//! amount = "100 mol"
//! batch_mass = "20 kg"
//! cp_mixture = "3.5 J/(g K)"
//! process_temperature = "60 degC"
//! "#;
//! let job = read_job(text, "example.toml").unwrap();
//! let s = screen(&job, &EnergeticsData::bundled().unwrap());
//! let step = s.steps[0].result.as_ref().unwrap();
//! assert!(step.adiabatic_rise_k.value > 100.0); // about 95 kJ/mol x 100 mol / 70 kJ/K
//! ```

pub mod job;
pub mod oxygen;
pub mod quantity;
pub mod screen;
pub mod severity;

pub use job::{read_job, Job, JobError, JobFileError};
pub use screen::{screen, Screening, StepOutcome, StepResult};

/// The cautions printed with every hazard report.
pub const CAUTIONS: [&str; 3] = [
    "Screening estimates only: group additivity and group-contribution values carry errors of several kJ/mol, and the numbers are no better than the process data given.",
    "Confirm with calorimetry (DSC, ARC or reaction calorimetry) and a qualified process-safety review before any decision.",
    "Follow local codes and licensed practice.",
];
