//! The command line: arguments into plain settings, then the command; exit codes a script can
//! use (`check`: 0 fits and every limit holds, 1 valid but does not fit or breaks a limit, 2
//! the input is wrong).

mod args;
mod fit;
mod lists;
mod measure;
mod search;
mod sheet;

pub use args::{Cli, Command, MeasureBobbin, MeasureWhat};

use crate::engine::evaluate;
use crate::files::{LoadError, load_build};
use crate::library::demo::demo_build;
use crate::model::Build;
use crate::report;
use clap::Parser;
use std::io::Write;
use std::path::Path;
use std::process::ExitCode;

pub const EXIT_FITS: u8 = 0;
pub const EXIT_DOES_NOT_FIT: u8 = 1;
pub const EXIT_BAD_INPUT: u8 = 2;

/// Entry point of the binary.
pub fn main() -> ExitCode {
    let cli = Cli::parse();
    match cli.command {
        None => crate::cli::run_editor(None),
        Some(Command::Check { file, json }) => check(file.as_deref(), json),
        Some(Command::Sheet {
            file,
            html,
            measure_at_c,
            page_lines,
        }) => sheet::sheet(file.as_deref(), html.as_deref(), measure_at_c, page_lines),
        Some(Command::Fit {
            file,
            bobbins,
            json,
        }) => fit::fit(&file, &bobbins, json),
        Some(Command::Measure {
            what: MeasureWhat::Bobbin(m),
        }) => measure::bobbin(&m),
        Some(Command::Bobbins { json }) => lists::bobbins(json),
        Some(Command::Wires { json }) => lists::wires(json),
        Some(Command::Edit { file }) => crate::cli::run_editor(Some(&file)),
        Some(Command::Search {
            file,
            series,
            max_strands,
            j_min,
            j_max,
            isolation_wraps,
            max_leakage_uh,
            max_rise_c,
            threads,
            no_prune,
            out,
            pick,
            json,
        }) => search::run(&search::SearchArgs {
            file: file.as_deref(),
            settings: crate::engine::search::Settings {
                series: match series {
                    args::SeriesArg::Metric => crate::engine::search::Series::Metric,
                    args::SeriesArg::Awg => crate::engine::search::Series::Awg,
                },
                max_strands,
                j_min_a_mm2: j_min,
                j_max_a_mm2: j_max,
                isolation_wraps,
                max_leakage_uh,
                max_rise_c,
                prune: !no_prune,
                threads,
                ..crate::engine::search::Settings::default()
            },
            json,
            out: out.as_deref(),
            pick,
        }),
    }
}

/// Print to stdout; a closed pipe (`| head`) is not an error.
pub(crate) fn emit(text: &str) -> bool {
    let mut out = std::io::stdout().lock();
    match out.write_all(text.as_bytes()).and_then(|()| out.flush()) {
        Ok(()) => true,
        Err(e) if e.kind() == std::io::ErrorKind::BrokenPipe => true,
        Err(e) => {
            eprintln!("turnstack: cannot write the output: {e}");
            false
        }
    }
}

/// Pretty JSON with a final newline, for `--json`.
pub(crate) fn json_text<T: serde::Serialize>(v: &T) -> String {
    let mut s = serde_json::to_string_pretty(v).unwrap_or_default();
    s.push('\n');
    s
}

/// Print, and the exit code of a listing: 0, or 2 when the output could not be written.
pub(crate) fn emit_listing(text: &str) -> ExitCode {
    if emit(text) {
        ExitCode::SUCCESS
    } else {
        ExitCode::from(EXIT_BAD_INPUT)
    }
}

pub(crate) fn fail(e: &LoadError) -> ExitCode {
    eprintln!("turnstack: {}", e.with_snippet());
    ExitCode::from(EXIT_BAD_INPUT)
}

/// The build of a file, or the bundled demo when no file is given.
pub(crate) fn load_or_demo(file: Option<&Path>) -> Result<Build, LoadError> {
    match file {
        Some(p) => load_build(p),
        None => demo_build(),
    }
}

fn check(file: Option<&Path>, json: bool) -> ExitCode {
    let build = match load_or_demo(file) {
        Ok(b) => b,
        Err(e) => return fail(&e),
    };
    let eval = evaluate(&build);
    let text = if json {
        json_text(&report::json::report(&build, &eval))
    } else {
        report::text::render(&build, &eval)
    };
    if !emit(&text) {
        return ExitCode::from(EXIT_BAD_INPUT);
    }
    // The report's last line names what fails; the code says whether anything does.
    ExitCode::from(if eval.failures().is_empty() {
        EXIT_FITS
    } else {
        EXIT_DOES_NOT_FIT
    })
}

/// The interactive planner: on the demo build, on a build file, or on a new build for a file
/// that does not exist yet (its bobbin picked first).
pub fn run_editor(file: Option<&Path>) -> ExitCode {
    use std::io::IsTerminal;
    if !std::io::stdout().is_terminal() || !std::io::stdin().is_terminal() {
        eprintln!(
            "turnstack: the planner needs a terminal; for a report use `turnstack check [FILE]`"
        );
        return ExitCode::from(EXIT_BAD_INPUT);
    }
    let app = match file {
        Some(p) if !p.exists() => crate::tui::App::new_file(p.to_path_buf()),
        _ => match load_or_demo(file) {
            Ok(b) => crate::tui::App::new(b, file.map(Path::to_path_buf)),
            Err(e) => return fail(&e),
        },
    };
    match crate::tui::run::run(app) {
        Ok(()) => ExitCode::SUCCESS,
        Err(e) => {
            eprintln!("turnstack: terminal error: {e}");
            ExitCode::from(EXIT_BAD_INPUT)
        }
    }
}
