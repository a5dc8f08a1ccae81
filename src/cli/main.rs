//! The `transit-parallax` command: parses arguments, calls the library, prints.
//!
//! `args.rs` holds the grammar (clap), `commands.rs` one function per command (check the
//! values, call the library, render); this file maps the outcome to the exit status.

mod args;
mod commands;
mod measure;

use clap::Parser;
use std::process::ExitCode;

fn main() -> ExitCode {
    let cli = match args::Cli::try_parse() {
        Ok(c) => c,
        Err(e) => {
            let code = if e.use_stderr() { 2 } else { 0 };
            let _ = e.print();
            return ExitCode::from(code);
        }
    };
    match commands::run(cli.command) {
        Ok(text) => {
            use std::io::Write;
            let mut out = std::io::stdout().lock();
            if let Err(e) = out.write_all(text.as_bytes()).and_then(|_| out.flush()) {
                // A closed pipe (`| head`) is the reader's choice, not a failure to report.
                if e.kind() != std::io::ErrorKind::BrokenPipe {
                    eprintln!("error: could not write the output: {e}");
                }
                return ExitCode::from(1);
            }
            ExitCode::SUCCESS
        }
        Err(e) => {
            eprintln!("error: {e}");
            ExitCode::from(if e.is_usage() { 2 } else { 1 })
        }
    }
}
