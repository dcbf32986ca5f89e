//! `turnstack verify FILE`: the bench readings of the build's `[measured]` table against the
//! plan. Exit 0 every reading within tolerance, 1 one or more out, 2 bad input or no readings.

use super::{Error, emit, json_text};
use crate::engine::{evaluate, verify::verify};
use crate::files::load_build;
use crate::report;
use std::path::Path;
use std::process::ExitCode;

/// Exit code when a reading is out of tolerance.
pub const EXIT_READING_OFF: u8 = 1;

pub(super) fn run(file: &Path, json: bool) -> Result<ExitCode, Error> {
    let build = load_build(file)?;
    let Some(measured) = &build.measured else {
        return Err(Error::input(format!(
            "{}: the build has no [measured] table; add the bench readings, for \
             example\n\n[measured]\nreading_c = 22.0\ndcr_ohm = {{ P = 0.058, S = 0.020 }}\n\
             magnetising_uh = 1450.0\nleakage_uh = 6.5\nratio = {{ S = 0.667 }}\n\n(see \
             FORMAT.md, `[measured]`)",
            file.display()
        )));
    };
    if measured.has_no_reading() {
        return Err(Error::input(format!(
            "{}: the [measured] table holds no reading to check (dcr_ohm, \
             magnetising_uh, leakage_uh or ratio)",
            file.display()
        )));
    }
    let eval = evaluate(&build);
    let Some(v) = verify(&build, &eval) else {
        return Err(Error::input(format!(
            "{}: the plan cannot predict any of these readings",
            file.display()
        )));
    };
    let text = if json {
        let mut out = serde_json::json!({});
        report::verify::add_json(&build, &eval, &mut out);
        json_text(&out)
    } else {
        report::verify::render(&build, &v)
    };
    emit(&text)?;
    Ok(ExitCode::from(if v.all_within() {
        0
    } else {
        EXIT_READING_OFF
    }))
}
