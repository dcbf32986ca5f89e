//! The command-line grammar (clap). Plain settings only; the engine never sees these types.

use clap::{Parser, Subcommand, ValueEnum};
use std::path::PathBuf;

/// Plan the hand winding of a small switch-mode transformer, layer by layer, in a real
/// bobbin window. With no command, opens the interactive planner on the bundled demo build.
#[derive(Debug, Parser)]
#[command(name = "turnstack", version, about, long_about = None, max_term_width = 80)]
#[command(
    after_help = "Exit codes of check: 0 the build fits and every limit holds, 1 it is valid but does not fit or breaks a limit (temperature rise, hot spot, saturation, reset duty, current density, switch rating), 2 the input is wrong.\n\
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
        /// Highest temperature rise allowed (C); the build's own rise_limit_c by default.
        #[arg(long)]
        max_rise_c: Option<f64>,
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
        /// With --out: replace an existing file (never the input build).
        #[arg(long, requires = "out")]
        force: bool,
        /// Print JSON.
        #[arg(long)]
        json: bool,
    },
    /// Print the technician's winding sheet of a build (text), or write it as one HTML page.
    Sheet {
        /// The build file; the bundled demo build when left out.
        file: Option<PathBuf>,
        /// Write a self-contained, printable HTML page (with the cross-section) to this file.
        #[arg(long, value_name = "OUT.html")]
        html: Option<PathBuf>,
        /// With --html: replace an existing file (never the input build).
        #[arg(long, requires = "html")]
        force: bool,
        /// Temperature (C) at which the DC resistance will be measured.
        #[arg(long, value_name = "C", default_value_t = 20.0)]
        measure_at_c: f64,
        /// Lines per printed page of the text sheet; 0 for no page breaks.
        #[arg(long, value_name = "N", default_value_t = 60)]
        page_lines: usize,
    },
    /// Set the bench readings of a wound part (the build's [measured] table) against the plan
    /// and say which are off and what that most likely means (exit 0 all within tolerance,
    /// 1 one or more out, 2 bad input or no readings).
    Verify {
        /// The build file with a [measured] table.
        file: PathBuf,
        /// Print JSON (the `measured` and `verify` keys).
        #[arg(long)]
        json: bool,
    },
    /// Lay a build's windings and stack onto every bobbin in the library and rank them.
    Fit {
        /// The build file.
        file: PathBuf,
        /// Another folder of bobbin files to try as well.
        #[arg(long, value_name = "DIR")]
        bobbins: Vec<PathBuf>,
        /// Print a JSON array, best first.
        #[arg(long)]
        json: bool,
    },
    /// Design the transformer from a requirements file: turns, reset ratio, wires, ranked.
    Design {
        /// The requirements file (FORMAT.md, "Requirements file").
        file: PathBuf,
        /// Another folder of bobbin files to try as well.
        #[arg(long, value_name = "DIR")]
        bobbins: Vec<PathBuf>,
        /// Print a JSON object: the designs best first and what binds.
        #[arg(long)]
        json: bool,
        /// Write the chosen design (see --pick) as a build file.
        #[arg(long, value_name = "BUILD")]
        out: Option<PathBuf>,
        /// Which design --out writes, 1 = the first listed.
        #[arg(long, default_value_t = 1, requires = "out")]
        pick: usize,
        /// With --out: replace an existing file (never the requirements file).
        #[arg(long, requires = "out")]
        force: bool,
    },
    /// Turn calliper readings and a test winding into a bobbin file with core data.
    Measure {
        #[command(subcommand)]
        what: MeasureWhat,
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

impl From<SeriesArg> for crate::engine::search::Series {
    /// `--series` as the search's wire series.
    fn from(s: SeriesArg) -> Self {
        match s {
            SeriesArg::Metric => Self::Metric,
            SeriesArg::Awg => Self::Awg,
        }
    }
}

#[derive(Debug, Subcommand)]
pub enum MeasureWhat {
    /// A salvaged bobbin (and its core): window, tube, centre leg, and optionally a test winding.
    Bobbin(MeasureBobbin),
}

/// `WxH` in millimetres, e.g. `10.8x3.0`.
fn pair_mm(s: &str) -> Result<(f64, f64), String> {
    let (a, b) = s
        .split_once(['x', 'X', '*'])
        .ok_or_else(|| format!("expected two lengths in mm like 10.8x3.0, got \"{s}\""))?;
    let num = |t: &str| {
        t.trim()
            .parse::<f64>()
            .ok()
            .filter(|v| v.is_finite() && *v > 0.0)
            .ok_or_else(|| format!("\"{t}\" is not a positive length in mm"))
    };
    Ok((num(a)?, num(b)?))
}

fn positive(s: &str) -> Result<f64, String> {
    s.trim()
        .parse::<f64>()
        .ok()
        .filter(|v| v.is_finite() && *v > 0.0)
        .ok_or_else(|| format!("\"{s}\" is not a positive number"))
}

#[derive(Debug, clap::Args)]
#[command(group(clap::ArgGroup::new("tube").required(true).args(["tube_rect", "tube_round"])))]
#[command(group(clap::ArgGroup::new("leg").args(["leg_rect", "leg_round"])))]
#[command(group(clap::ArgGroup::new("path").args(["le", "le_path"])))]
pub struct MeasureBobbin {
    /// The bobbin id: the file name in your bobbin folder (letters, digits, - _ .).
    #[arg(long)]
    pub id: String,
    /// Free-text name shown in lists.
    #[arg(long)]
    pub name: Option<String>,
    /// Window: width between the flanges x height from the tube surface to the usable limit (mm).
    #[arg(long, value_name = "WxH", value_parser = pair_mm)]
    pub window: (f64, f64),
    /// Rectangular tube, outer width x depth (mm).
    #[arg(long, value_name = "WxD", value_parser = pair_mm)]
    pub tube_rect: Option<(f64, f64)>,
    /// Corner radius of a rectangular tube (mm).
    #[arg(long, value_name = "MM", requires = "tube_rect", value_parser = positive)]
    pub corner: Option<f64>,
    /// Round tube, outer diameter (mm).
    #[arg(long, value_name = "D", value_parser = positive)]
    pub tube_round: Option<f64>,
    /// Rectangular centre leg of the core, width x depth (mm): gives Ae = w x d.
    #[arg(long, value_name = "WxD", value_parser = pair_mm)]
    pub leg_rect: Option<(f64, f64)>,
    /// Round centre leg, diameter (mm): gives Ae = pi d^2 / 4.
    #[arg(long, value_name = "D", value_parser = positive)]
    pub leg_round: Option<f64>,
    /// Effective path length le (mm), from the size family's table.
    #[arg(long, value_name = "MM", value_parser = positive)]
    pub le: Option<f64>,
    /// Estimate le from the mean path round one window, centreline to centreline:
    /// along the legs x across the window (mm); le = 2 (along + across).
    #[arg(long, value_name = "ALONGxACROSS", value_parser = pair_mm)]
    pub le_path: Option<(f64, f64)>,
    /// Turns of the test winding.
    #[arg(long, value_name = "N", requires = "inductance_uh")]
    pub turns: Option<u32>,
    /// Inductance measured on the test winding, core assembled and clamped (uH).
    #[arg(long, value_name = "UH", requires = "turns", value_parser = positive)]
    pub inductance_uh: Option<f64>,
    /// The material's initial permeability, as you believe it (for the equivalent gap).
    #[arg(long, value_name = "MU", value_parser = positive)]
    pub mu_i: Option<f64>,
    /// Pin count.
    #[arg(long, value_name = "N")]
    pub pins: Option<u32>,
    /// Save to your bobbin folder.
    #[arg(long)]
    pub save: bool,
    /// With --save: replace a bobbin file of the same id.
    #[arg(long, requires = "save")]
    pub force: bool,
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
