//! The command-line grammar (clap). Plain settings only; the engine never sees these types.

use clap::{Parser, Subcommand};
use std::path::PathBuf;

/// Plan the hand winding of a small switch-mode transformer, layer by layer, in a real
/// bobbin window. With no command, opens the interactive planner on the bundled demo build.
#[derive(Debug, Parser)]
#[command(name = "turnstack", version, about, long_about = None)]
#[command(
    after_help = "Exit codes: 0 the build fits, 1 it is valid but does not fit, 2 the input is wrong.\n\
User bobbins: $TURNSTACK_BOBBINS, else the data directory's turnstack/bobbins (~/.local/share/turnstack/bobbins on Linux)."
)]
pub struct Cli {
    #[command(subcommand)]
    pub command: Option<Command>,
}

#[derive(Debug, Subcommand)]
pub enum Command {
    /// Lay out a build file and print its plan: sections, layers, windings, leakage, fit, warnings.
    Check {
        /// The build file; the bundled demo build when left out.
        file: Option<PathBuf>,
        /// Print the JSON report instead of the text one.
        #[arg(long)]
        json: bool,
    },
    /// Open a build file in the interactive planner.
    Edit {
        /// The build file to open (created from a chosen bobbin when it does not exist).
        file: PathBuf,
    },
    /// List the bobbins: bundled and your own.
    Bobbins {
        /// Print JSON.
        #[arg(long)]
        json: bool,
    },
    /// List the wire table: bare and overall diameters per grade, resistance per metre.
    Wires {
        /// Print JSON.
        #[arg(long)]
        json: bool,
    },
}

#[cfg(test)]
mod tests {
    use super::*;
    use clap::CommandFactory;

    #[test]
    fn cli_definition_is_consistent() {
        Cli::command().debug_assert();
    }
}
