//! The command-line grammar (clap). Plain settings only; the engine never sees these types.

use clap::{Parser, Subcommand, ValueEnum};
use std::path::PathBuf;

/// Plan the hand winding of a small switch-mode transformer, layer by layer, in a real
/// bobbin window. With no command, opens the interactive planner on the bundled demo build.
#[derive(Debug, Parser)]
#[command(name = "turnstack", version, about, long_about = None, max_term_width = 80)]
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
    /// Try wire sizes, strands and section orders for the build's windings on its bobbin and
    /// list the best trade-offs of copper loss, leakage and spare height.
    Search {
        /// The build file; the bundled demo build when left out.
        file: Option<PathBuf>,
        /// Wire series to draw sizes from.
        #[arg(long, value_enum, default_value = "metric")]
        series: SeriesArg,
        /// Most strands in parallel to try per winding.
        #[arg(long, default_value_t = 4)]
        max_strands: u32,
        /// Lowest current density allowed (A/mm2 RMS).
        #[arg(long, default_value_t = 2.0)]
        j_min: f64,
        /// Highest current density allowed (A/mm2 RMS).
        #[arg(long, default_value_t = 6.0)]
        j_max: f64,
        /// Tape wraps between the primary side and the secondary side (default: as the build has).
        #[arg(long)]
        isolation_wraps: Option<u32>,
        /// Highest leakage inductance allowed (uH, any primary pair).
        #[arg(long)]
        max_leakage_uh: Option<f64>,
        /// Threads to use.
        #[arg(long, default_value_t = 2)]
        threads: usize,
        /// Evaluate every combination (no pruning); slower, same answer.
        #[arg(long)]
        no_prune: bool,
        /// Write the chosen candidate (see --pick) as a build file.
        #[arg(long)]
        out: Option<PathBuf>,
        /// Which candidate --out writes, 1 = the first listed.
        #[arg(long, default_value_t = 1)]
        pick: usize,
        /// Print JSON.
        #[arg(long)]
        json: bool,
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

#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum SeriesArg {
    Metric,
    Awg,
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
