//! ringheat command line: reads arguments, calls the library, prints.

mod cli;

use std::process::ExitCode;

fn main() -> ExitCode {
    match cli::run() {
        Ok(code) => code,
        Err(e) => {
            eprintln!("ringheat: {e}");
            ExitCode::from(2)
        }
    }
}
