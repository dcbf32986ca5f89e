//! The command line: arguments into plain settings, then the command; exit codes a script can
//! use (`check`: 0 fits and every limit holds, 1 valid but does not fit or breaks a limit, 2
//! the input is wrong).

mod args;
mod design;
mod error;
mod fit;
mod lists;
mod measure;
pub mod progress;
mod search;
mod sheet;
mod verify;

pub use args::{Cli, Command, MeasureBobbin, MeasureWhat};
pub use error::Error;
pub(crate) use error::{notice, say};

use crate::engine::evaluate;
use crate::files::demo_build;
use crate::files::{LoadError, load_build};
use crate::model::Build;
use crate::report;
use clap::Parser;
use std::io::Write;
use std::path::Path;
use std::process::ExitCode;

pub const EXIT_FITS: u8 = 0;
pub const EXIT_DOES_NOT_FIT: u8 = 1;
pub const EXIT_BAD_INPUT: u8 = 2;
/// Exit code after Ctrl-C, as a shell reports a program ended by SIGINT (128 + 2).
pub const EXIT_INTERRUPTED: u8 = 130;

/// Entry point of the binary: parse the arguments, run the command, print its error if any.
pub fn main() -> ExitCode {
    match run(Cli::parse()) {
        Ok(code) => code,
        Err(e) => {
            error::print_error(&e);
            ExitCode::from(EXIT_BAD_INPUT)
        }
    }
}

/// Run one command line: the exit code of a run that worked (0 fits, 1 does not fit), or the
/// error that stopped it (exit code 2).
pub fn run(cli: Cli) -> Result<ExitCode, Error> {
    match cli.command {
        None => crate::cli::run_editor(None),
        Some(Command::Check { file, json }) => check(file.as_deref(), json),
        Some(Command::Sheet {
            file,
            html,
            force,
            measure_at_c,
            page_lines,
        }) => sheet::sheet(
            file.as_deref(),
            html.as_deref().map(|h| (h, force)),
            measure_at_c,
            page_lines,
        ),
        Some(Command::Verify { file, json }) => verify::run(&file, json),
        Some(Command::Fit {
            file,
            bobbins,
            json,
        }) => fit::fit(&file, &bobbins, json),
        Some(Command::Design {
            file,
            bobbins,
            json,
            out,
            pick,
            force,
        }) => design::run(&design::DesignArgs {
            file: &file,
            folders: &bobbins,
            json,
            out: out.as_deref(),
            pick,
            force,
        }),
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
            force,
            json,
        }) => search::run(&search::SearchArgs {
            file: file.as_deref(),
            settings: crate::engine::search::Settings {
                series: series.into(),
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
            force,
        }),
    }
}

/// Print to stdout; a closed pipe (`| head`) is not an error.
pub(crate) fn emit(text: &str) -> Result<(), Error> {
    let mut out = std::io::stdout().lock();
    match out.write_all(text.as_bytes()).and_then(|()| out.flush()) {
        Ok(()) => Ok(()),
        Err(e) if e.kind() == std::io::ErrorKind::BrokenPipe => Ok(()),
        Err(e) => Err(Error::Output(e)),
    }
}

/// Pretty JSON with a final newline, for `--json`. It goes through a `serde_json::Value`,
/// whose map sorts the keys: every object prints its keys in alphabetical order, as the
/// output always has, whatever the order of the fields of the typed struct.
pub(crate) fn json_text<T: serde::Serialize>(v: &T) -> String {
    let value = serde_json::to_value(v).unwrap_or_default();
    let mut s = serde_json::to_string_pretty(&value).unwrap_or_default();
    s.push('\n');
    s
}

/// Print, and the exit code of a listing: 0, or the error when the output could not be
/// written.
pub(crate) fn emit_listing(text: &str) -> Result<ExitCode, Error> {
    emit(text)?;
    Ok(ExitCode::SUCCESS)
}

/// The exit code of a build that fits (0) or does not (1).
pub(crate) fn fit_code(fits: bool) -> ExitCode {
    ExitCode::from(if fits { EXIT_FITS } else { EXIT_DOES_NOT_FIT })
}

/// The build of a file, or the bundled demo when no file is given.
pub(crate) fn load_or_demo(file: Option<&Path>) -> Result<Build, LoadError> {
    match file {
        Some(p) => load_build(p),
        None => demo_build(),
    }
}

fn check(file: Option<&Path>, json: bool) -> Result<ExitCode, Error> {
    let build = load_or_demo(file)?;
    let eval = evaluate(&build);
    let text = if json {
        json_text(&report::json::report(&build, &eval))
    } else {
        report::text::render(&build, &eval)
    };
    emit(&text)?;
    // The report's last line names what fails; the code says whether anything does.
    Ok(fit_code(eval.failures().is_empty()))
}

/// The interactive planner: on the demo build, on a build file, or on a new build for a file
/// that does not exist yet (its bobbin picked first).
pub fn run_editor(file: Option<&Path>) -> Result<ExitCode, Error> {
    use std::io::IsTerminal;
    if !std::io::stdout().is_terminal() || !std::io::stdin().is_terminal() {
        if let (Some(p), Some(dir)) = (file, crate::files::recovery_dir())
            && crate::files::read_recovery(&dir, p).is_some()
        {
            notice(&format!(
                "{} has unsaved edits from an earlier session; run `turnstack edit` in a terminal to restore or discard them",
                p.display()
            ));
        }
        return Err(Error::NoTerminal);
    }
    let mut app = match file {
        Some(p) if !p.exists() => {
            crate::tui::App::new_file(p.to_path_buf(), crate::tui::run::read_library(Some(p)))
        }
        _ => crate::tui::App::new(load_or_demo(file)?, file.map(Path::to_path_buf)),
    };
    // Unsaved edits an earlier session left (a crash, a closed terminal): offered back.
    if let Some(dir) = crate::files::recovery_dir() {
        crate::tui::run::offer_recovery(
            &mut app,
            &dir,
            &mut std::io::stdin().lock(),
            &mut std::io::stderr(),
        );
    }
    crate::tui::run::run(app).map_err(Error::Terminal)?;
    Ok(ExitCode::SUCCESS)
}
