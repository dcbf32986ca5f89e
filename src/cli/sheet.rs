//! `turnstack sheet FILE [--html OUT.html]`: the technician's winding sheet.

use super::{Error, emit, fit_code, load_or_demo, notice};
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
) -> Result<ExitCode, Error> {
    // Before any work: the page never replaces the build, nor another file without --force.
    if let Some((out, force)) = html_out {
        check_output(out, file, force)
            .map_err(|why| Error::input(format!("sheet --html: {why}")))?;
    }
    if !(measure_at_c.is_finite() && (-40.0..=60.0).contains(&measure_at_c)) {
        return Err(Error::input(format!(
            "--measure-at-c {measure_at_c}: expected a bench temperature between -40 and 60 C"
        )));
    }
    let build = load_or_demo(file)?;
    let eval = evaluate(&build);
    let s = sheet::sheet(&build, &eval, measure_at_c);
    match html_out {
        Some((out, _)) => {
            let (scale, svg) = svg::cross_section(&build, &eval);
            let page = html::render(&s, &svg, scale);
            write_atomic(out, &page).map_err(|source| Error::Write {
                path: out.to_path_buf(),
                source,
            })?;
            notice(&format!(
                "wrote the winding sheet of build {} to {}",
                s.build_id,
                out.display()
            ));
        }
        None => emit(&text::render(&s, page_lines))?,
    }
    if !eval.fits {
        notice("the build does not fit its bobbin: the sheet says DO NOT WIND");
    }
    Ok(fit_code(eval.fits))
}
