//! `turnstack sheet FILE [--html OUT.html]`: the technician's winding sheet.

use super::{EXIT_BAD_INPUT, EXIT_DOES_NOT_FIT, EXIT_FITS, emit, fail, load_or_demo};
use crate::engine::evaluate;
use crate::files::{check_output, write_atomic};
use crate::report::sheet::{self, html, svg, text};
use std::path::Path;
use std::process::ExitCode;

pub fn sheet(
    file: Option<&Path>,
    html_out: Option<(&Path, bool)>,
    measure_at_c: f64,
    page_lines: usize,
) -> ExitCode {
    // Before any work: the page never replaces the build, nor another file without --force.
    if let Some((out, force)) = html_out
        && let Err(why) = check_output(out, file, force)
    {
        eprintln!("turnstack: sheet --html: {why}");
        return ExitCode::from(EXIT_BAD_INPUT);
    }
    if !(measure_at_c.is_finite() && (-40.0..=60.0).contains(&measure_at_c)) {
        eprintln!(
            "turnstack: --measure-at-c {measure_at_c}: expected a bench temperature between -40 and 60 C"
        );
        return ExitCode::from(EXIT_BAD_INPUT);
    }
    let build = match load_or_demo(file) {
        Ok(b) => b,
        Err(e) => return fail(&e),
    };
    let eval = evaluate(&build);
    let s = sheet::sheet(&build, &eval, measure_at_c);
    match html_out {
        Some((out, _)) => {
            let (scale, svg) = svg::cross_section(&build, &eval);
            let page = html::render(&s, &svg, scale);
            if let Err(e) = write_atomic(out, &page) {
                eprintln!("turnstack: cannot write {}: {e}", out.display());
                return ExitCode::from(EXIT_BAD_INPUT);
            }
            eprintln!(
                "turnstack: wrote the winding sheet of build {} to {}",
                s.build_id,
                out.display()
            );
        }
        None => {
            if !emit(&text::render(&s, page_lines)) {
                return ExitCode::from(EXIT_BAD_INPUT);
            }
        }
    }
    if !eval.fits {
        eprintln!("turnstack: the build does not fit its bobbin: the sheet says DO NOT WIND");
    }
    ExitCode::from(if eval.fits {
        EXIT_FITS
    } else {
        EXIT_DOES_NOT_FIT
    })
}
